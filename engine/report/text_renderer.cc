#include "engine/report/text_renderer.h"

#include <algorithm>

#include "engine/util/text_width.h"

namespace calctrail {

namespace {

int width(const std::string& s) { return displayWidth(s); }
std::string pad(const std::string& s, int w) { return padRight(s, w); }

// Wraps words at `cols`, each line starting with `indent`.
std::string wrap(const std::string& text, const std::string& indent, int cols = 78) {
  std::string out, line;
  size_t i = 0;
  while (i < text.size()) {
    while (i < text.size() && text[i] == ' ') ++i;
    size_t j = text.find(' ', i);
    if (j == std::string::npos) j = text.size();
    const std::string word = text.substr(i, j - i);
    i = j;
    if (word.empty()) continue;
    if (!line.empty() && width(indent) + width(line) + 1 + width(word) > cols) {
      out += indent + line + "\n";
      line.clear();
    }
    line += (line.empty() ? "" : " ") + word;
  }
  if (!line.empty()) out += indent + line + "\n";
  return out;
}

std::string heading(const std::string& title) {
  return title + "\n" + std::string(static_cast<size_t>(width(title)), '-') + "\n";
}

}  // namespace

std::string renderText(const Trail& t) {
  std::string out;
  const std::string title = t.title.empty() ? "Calculation trail" : t.title;
  out += title + "\n" + std::string(static_cast<size_t>(width(title)), '=') + "\n";
  for (const auto& [key, value] : t.meta) out += pad(key, 10) + value + "\n";
  out += pad("file", 10) + t.path + "\n";
  out += pad("sha256", 10) + t.sha256 + "\n\n";

  // The verdict first: a failed check must be impossible to miss.
  if (t.checks.empty()) {
    out += "Checks: none in this worksheet\n\n";
  } else if (t.failed == 0) {
    out += "Checks: all " + std::to_string(t.passed) + " pass\n\n";
  } else {
    out += "Checks: " + std::to_string(t.failed) + " of " + std::to_string(t.checks.size()) + " FAIL:";
    for (const TrailCheck& c : t.checks)
      if (!c.passed) out += " " + c.name;
    out += "\n\n";
  }

  // Inputs, grouped under their sections.
  out += heading("INPUTS");
  int name_w = 0, value_w = 0;
  for (const TrailStep& s : t.steps) {
    if (!s.input) continue;
    name_w = std::max(name_w, width(s.name));
    value_w = std::max(value_w, width(s.given.empty() ? s.result : s.given));
  }
  std::string section = "\x01";
  for (const TrailStep& s : t.steps) {
    if (!s.input) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty()) out += section + "\n";
    }
    std::string line = "  " + pad(s.name, name_w) + "  " + pad(s.given.empty() ? s.result : s.given, value_w);
    std::string notes = s.description;
    if (s.given.empty() && s.formula != s.result) notes = "= " + s.formula + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("[set on the command line]");
    if (!notes.empty()) line += "  " + notes;
    while (!line.empty() && line.back() == ' ') line.pop_back();
    out += line + "\n";
  }
  out += "\n";

  out += heading("CALCULATION");
  for (const TrailBlock& b : t.blocks) {
    if (b.kind == TrailBlock::Section) {
      out += "\n" + b.text + "\n";
    } else if (b.kind == TrailBlock::Note) {
      out += "\n" + wrap(b.text, "  ");
    } else if (b.kind == TrailBlock::Step) {
      const TrailStep& s = t.steps[b.index];
      if (s.input) continue;
      out += "\n  " + s.name;
      if (!s.description.empty()) out += "  " + s.description;
      if (s.overridden) out += "  [set on the command line]";
      out += "\n";
      const std::string indent = "    " + std::string(static_cast<size_t>(width(s.name)), ' ') + " ";
      out += "    " + s.name + " = " + s.pretty + "\n";
      if (s.substituted != s.pretty && s.substituted != s.result) out += indent + "= " + s.substituted + "\n";
      out += indent + "= " + s.result + "\n";
      for (const TrailCall& c : s.calls) {
        // The function is audited like a formula: its own formula, the
        // values of this call substituted, the result, and its source.
        out += "      where " + c.signature + "\n";
        const std::string eq = "          = ";
        out += c.formula_is_expression ? eq + c.pretty + "\n" : wrap(c.formula, "          ");
        if (c.formula_is_expression && !c.substituted.empty() && c.substituted != c.pretty) {
          out += eq + c.substituted + "\n";
        } else if (!c.formula_is_expression && !c.arguments.empty()) {
          out += "          with " + c.arguments + "\n";
        }
        if (!c.result.empty()) out += eq + c.result + "\n";
        out += wrap("source: " + c.source, "        ");
      }
    }
  }
  out += "\n";

  if (!t.checks.empty()) {
    out += heading("CHECKS");
    int w = 0;
    for (const TrailCheck& c : t.checks) w = std::max(w, width(c.name));
    for (const TrailCheck& c : t.checks) {
      out += std::string(c.passed ? "  pass  " : "  FAIL  ") + pad(c.name, w) + "  " + c.condition + "\n";
      out += "        " + std::string(static_cast<size_t>(w), ' ') + "  " + c.lhs + " " + c.op + " " + c.rhs;
      if (!c.description.empty()) out += "  (" + c.description + ")";
      out += "\n";
    }
    out += "\n";
  }

  if (!t.warnings.empty()) {
    out += heading("WARNINGS");
    for (const std::string& w : t.warnings) out += "  " + w + "\n";
    out += "\n";
  }

  out += heading("CAUTIONS");
  for (const std::string& c : t.cautions) {
    std::string w = wrap(c, "    ");
    w.replace(0, 4, "  - ");
    out += w;
  }
  return out;
}

}  // namespace calctrail
