#include "functions/function_docs.h"

#include <algorithm>
#include <cctype>
#include <cstdio>
#include <string>

#include "engine/util/json_writer.h"
#include "functions/function_library.h"
#include "functions/plausibility.h"

namespace calctrail {

namespace {

std::string signature(const FunctionDecl& d) {
  std::string s = std::string(d.name) + "(";
  for (std::size_t k = 0; k < d.args.size(); ++k) {
    if (k) s += ", ";
    s += d.args[k].name;
  }
  if (d.repeat > 0) s += ", ...";  // a repeated group: any number more like the last
  return s + ")";
}

// "any number of further stages like the last (i3, ...)", or "".
std::string repeatText(const FunctionDecl& d) {
  if (d.repeat == 0) return "";
  std::string group;
  for (int k = 0; k < d.repeat; ++k) group += (k ? ", " : "") + d.argName(static_cast<int>(d.args.size()) + k);
  return d.repeat == 1 ? "any number of further arguments like the last (" + group + ", ...)"
                       : "any number of further groups of " + std::to_string(d.repeat) + " like the last (" +
                             group + ", ...)";
}

// The usual ranges of the arguments that have one, "; "-separated, or "".
std::string usualText(const FunctionDecl& d) {
  std::string s;
  for (const FunctionArg& a : d.args) {
    const std::string t = usualRangeText(a);
    if (t.empty()) continue;
    if (!s.empty()) s += "; ";
    s += t;
  }
  return s;
}

// A lead or pitch is carried as length per angle by the engine.
Dimension effective(const Dimension& dim, bool per_revolution) {
  return per_revolution ? dim / Dimension::of(Base::Angle) : dim;
}

// The coherent SI unit of what eval() sees: "m/rev" for a lead.
std::string siUnit(const Dimension& dim, bool per_revolution) {
  return per_revolution ? dim.siSymbol() + "/rev" : dim.siSymbol();
}

std::string dimName(const Dimension& dim, bool per_revolution) {
  const Dimension e = effective(dim, per_revolution);
  return e.name().empty() ? e.siSymbol() : e.name();
}

// "force (N)", "length per revolution (mm/rev)": words and the usual unit.
std::string dimText(const Dimension& dim, bool per_revolution) {
  return effective(dim, per_revolution).describe();
}

std::string pad(std::string s, std::size_t width) {
  if (s.size() < width) s.append(width - s.size(), ' ');
  return s;
}

const char* kIntro =
    "Every function is declared once, with its arguments and their dimensions, its result, its formula, its "
    "validity limits and its published source; this listing is generated from those declarations.\n"
    "\n"
    "Conventions:\n"
    "- Arguments are quantities with units; the engine converts them to SI before a function sees them.\n"
    "- A lead or a pitch argument (marked \"per revolution\") accepts a plain length, read as per revolution, "
    "or a length per angle such as [mm/rev]. A pitch is returned as a plain length (the distance between "
    "threads); a lead is returned per revolution, so that a speed in rpm times the lead gives a linear speed "
    "without a lost 2*pi.\n"
    "- Angles are in radians inside (write 14.5 deg); rotational speeds are angle per time (write 1450 rpm).\n"
    "- The formulas are written in the values the function receives: SI, with the radian as 1 (a rotational "
    "speed n in rad/s, an angle in rad) and a lead or pitch l as the length advanced in one revolution. So a "
    "power is T*n. Where a rotational speed meets a lead, the formula divides by one revolution, `1 [rev]` "
    "(2*pi rad), so that it reads right in the units of the trade: rpm times mm per revolution. The trail "
    "shows each formula with the values substituted in the units of the worksheet.\n"
    "- Every function checks its inputs: outside its validity limits it is an error that names the limit and "
    "the offending value, never a silent NaN or infinity.\n"
    "- Results are a design aid: friction values vary (take the worst case each way), self-locking is no brake, "
    "long screws buckle; the calculation is to be reviewed under the applicable codes and standards by a "
    "qualified engineer.\n";

void appendDetail(std::string& out, const FunctionDecl& d) {
  out += signature(d) + " -> " + dimText(d.result, d.result_per_revolution) + ", shown in " + std::string(d.result_unit) + "\n";
  out += "  " + std::string(d.summary) + "\n";
  if (d.args.empty()) {
    out += "  Arguments: none\n";
  } else {
    out += "  Arguments:\n";
    std::size_t name_w = 0, dim_w = 0;
    for (const FunctionArg& a : d.args) {
      name_w = std::max(name_w, a.name.size());
      dim_w = std::max(dim_w, dimText(a.dim, a.per_revolution).size());
    }
    for (const FunctionArg& a : d.args)
      out += "    " + pad(std::string(a.name), name_w) + "  " + pad(dimText(a.dim, a.per_revolution), dim_w) + "  " +
             std::string(a.description) + "\n";
    if (d.repeat > 0) out += "    then " + repeatText(d) + "\n";
  }
  out += std::string(d.formula_is_expression ? "  Formula: " : "  Method:  ") + std::string(d.formula) + "\n";
  out += "  Limits:  " + std::string(d.limits) + "\n";
  if (!usualText(d).empty()) out += "  Warns outside the usual range: " + usualText(d) + "\n";
  out += "  Source:  " + std::string(d.source) + "\n";
  if (!d.caution.empty()) out += "  Caution: " + std::string(d.caution) + "\n";
}

void jsonString(std::string& out, std::string_view s) { out += JsonWriter::escape(s); }

void jsonField(std::string& out, const char* key, std::string_view value, bool comma = true) {
  jsonString(out, key);
  out += ": ";
  jsonString(out, value);
  if (comma) out += ", ";
}

void jsonBool(std::string& out, const char* key, bool value, bool comma = true) {
  jsonString(out, key);
  out += value ? ": true" : ": false";
  if (comma) out += ", ";
}

void appendJson(std::string& out, const FunctionDecl& d) {
  const FunctionGroup* g = groupOf(d);
  out += "{";
  jsonField(out, "name", d.name);
  jsonField(out, "group", g ? g->title : "");
  jsonField(out, "signature", signature(d));
  jsonField(out, "summary", d.summary);
  out += "\"args\": [";
  for (std::size_t k = 0; k < d.args.size(); ++k) {
    const FunctionArg& a = d.args[k];
    if (k) out += ", ";
    out += "{";
    jsonField(out, "name", a.name);
    jsonField(out, "dimension", a.dim.siSymbol());
    jsonField(out, "dimension_name", dimName(a.dim, a.per_revolution));
    jsonField(out, "unit", siUnit(a.dim, a.per_revolution));
    jsonBool(out, "per_revolution", a.per_revolution);
    jsonField(out, "usual_range", usualRangeText(a));
    jsonField(out, "description", a.description, false);
    out += "}";
  }
  out += "], \"repeat\": " + std::to_string(d.repeat) + ", \"result\": {";
  jsonField(out, "dimension", d.result.siSymbol());
  jsonField(out, "dimension_name", dimName(d.result, d.result_per_revolution));
  jsonField(out, "unit", d.result_unit);
  jsonField(out, "si_unit", siUnit(d.result, d.result_per_revolution));
  jsonBool(out, "per_revolution", d.result_per_revolution, false);
  out += "}, ";
  jsonField(out, "formula", d.formula);
  jsonBool(out, "formula_is_expression", d.formula_is_expression);
  jsonField(out, "limits", d.limits);
  jsonField(out, "source", d.source);
  jsonField(out, "caution", d.caution, false);
  out += "}";
}

// GitHub-style heading anchor: lower case, spaces to '-', punctuation dropped.
std::string anchor(std::string_view title) {
  std::string a;
  for (const char c : title) {
    const unsigned char u = static_cast<unsigned char>(c);
    if (std::isalnum(u) || c == '-' || c == '_')
      a += static_cast<char>(std::tolower(u));
    else if (c == ' ')
      a += '-';
  }
  return a;
}

std::string cell(std::string_view s) {
  std::string out;
  for (const char c : s) {
    if (c == '|') out += "\\|";
    else out += c;
  }
  return out;
}

}  // namespace

std::string functionsText(std::string_view name) {
  std::string out;
  if (!name.empty()) {
    const FunctionDecl* d = findFunction(name);
    if (!d) return "";
    appendDetail(out, *d);
    return out;
  }
  const std::vector<FunctionDecl>& all = functionLibrary();
  std::size_t sig_w = 0;
  for (const FunctionDecl& d : all) sig_w = std::max(sig_w, signature(d).size());
  out += "Drive functions (" + std::to_string(all.size()) + "); `calctrail functions NAME` shows one in detail.\n";
  for (const FunctionGroup& g : functionGroups()) {
    out += "\n" + std::string(g.title) + "\n";
    for (std::size_t k = g.first; k < g.first + g.count; ++k)
      out += "  " + pad(signature(all[k]), sig_w) + "  " + std::string(all[k].summary) + "\n";
  }
  return out;
}

std::string functionsJson(std::string_view name) {
  std::string out = "[";
  if (!name.empty()) {
    const FunctionDecl* d = findFunction(name);
    if (!d) return "";
    appendJson(out, *d);
  } else {
    bool first = true;
    for (const FunctionDecl& d : functionLibrary()) {
      out += first ? "\n  " : ",\n  ";
      first = false;
      appendJson(out, d);
    }
    out += "\n";
  }
  return out + "]\n";
}

std::string functionsMarkdown() {
  const std::vector<FunctionDecl>& all = functionLibrary();
  std::string out;
  out += "# Drive functions\n\n";
  out += "<!-- Generated from the declarations in functions/: do not edit by hand.\n"
         "     Regenerate with: build/calctrail functions --format md > docs/functions.md -->\n\n";
  out += kIntro;
  out += "\nThe check of each function against a published value is listed in [verification.md](verification.md).\n";
  out += "\n## Contents\n\n";
  for (const FunctionGroup& g : functionGroups()) {
    out += "- [" + std::string(g.title) + "](#" + anchor(g.title) + "): ";
    for (std::size_t k = g.first; k < g.first + g.count; ++k) {
      if (k > g.first) out += ", ";
      out += "[`" + std::string(all[k].name) + "`](#" + anchor(all[k].name) + ")";
    }
    out += "\n";
  }
  for (const FunctionGroup& g : functionGroups()) {
    out += "\n## " + std::string(g.title) + "\n\n" + std::string(g.intro) + "\n";
    for (std::size_t k = g.first; k < g.first + g.count; ++k) {
      const FunctionDecl& d = all[k];
      out += "\n### " + std::string(d.name) + "\n\n";
      out += "`" + signature(d) + "` -> " + dimText(d.result, d.result_per_revolution) + ", shown in `" +
             std::string(d.result_unit) + "`\n\n";
      out += std::string(d.summary) + ".\n\n";
      if (d.args.empty()) {
        out += "No arguments.\n\n";
      } else {
        out += "| Argument | Dimension (usual unit) | SI value passed | Description |\n|---|---|---|---|\n";
        for (const FunctionArg& a : d.args)
          out += "| `" + std::string(a.name) + "` | " + dimText(a.dim, a.per_revolution) + " | " +
                 siUnit(a.dim, a.per_revolution) + " | " + cell(a.description) + " |\n";
        out += "\n";
        if (d.repeat > 0) out += "Then " + repeatText(d) + ".\n\n";
      }
      if (d.formula_is_expression)
        out += "Formula: `" + std::string(d.formula) + "`\n\n";
      else
        out += "Method: " + std::string(d.formula) + ".\n\n";
      out += "Limits: " + std::string(d.limits) + ".\n\n";
      if (!usualText(d).empty()) out += "Warns outside the usual range: " + usualText(d) + ".\n\n";
      out += "Source: " + std::string(d.source) + ".\n";
      if (!d.caution.empty()) out += "\n> Caution: " + std::string(d.caution) + "\n";
    }
  }
  return out;
}

}  // namespace calctrail
