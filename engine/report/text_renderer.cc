#include "engine/report/text_renderer.h"

#include <algorithm>
#include <initializer_list>
#include <string_view>
#include <utility>

#include "engine/util/text_width.h"

namespace calctrail {

namespace {

int width(const std::string& s) { return displayWidth(s); }
std::string pad(const std::string& s, int w) { return padRight(s, w); }

void put(fmt::memory_buffer& out, std::string_view s) { out.append(s.data(), s.data() + s.size()); }

// A line of `pieces` one after another: print("{}{}..\n") without parsing a format.
void putLine(fmt::memory_buffer& out, std::initializer_list<std::string_view> pieces) {
  for (std::string_view piece : pieces) put(out, piece);
  out.push_back('\n');
}

// fmt::format_to into the buffer itself: through fmt::appender, not a
// back_insert_iterator, which fmt fills through a buffer of its own.
template <typename... T>
void print(fmt::memory_buffer& out, fmt::format_string<T...> format, T&&... args) {
  fmt::format_to(fmt::appender(out), format, std::forward<T>(args)...);
}

// Appends `text` wrapped at `cols`, each line starting with `indent`: its
// words (runs of non-spaces) in order, one space between two on a line.
// Written through a pointer into room made once: the text, and for each
// word (at most one per two bytes, and one) an indent and a newline.
void wrap(fmt::memory_buffer& out, std::string_view text, std::string_view indent, int cols = 78) {
  const size_t at = out.size();
  out.resize(at + text.size() + (text.size() / 2 + 1) * (indent.size() + 1) + 1);
  char* p = out.data() + at;
  // Words one space apart in `text` stay so on a line, and go in with one
  // copy: text[run, run_end) is on the line and not yet written.
  size_t run = 0, run_end = 0;
  const auto flush = [&] { p = std::copy(text.data() + run, text.data() + run_end, p); };
  const int indent_width = displayWidth(indent);
  int line_width = -1;  // of the line so far, without the indent; -1: no word on it yet
  for (size_t i = 0; i < text.size();) {
    if (text[i] == ' ') {
      ++i;
      continue;
    }
    const size_t start = i;
    unsigned char bits = 0;  // every byte of the word or-ed: below 0x80 all are ASCII, a column each
    for (; i < text.size() && text[i] != ' '; ++i) bits |= static_cast<unsigned char>(text[i]);
    const int word_width =
        bits < 0x80 ? static_cast<int>(i - start) : displayWidth(text.substr(start, i - start));
    if (line_width >= 0 && indent_width + line_width + 1 + word_width > cols) {
      flush();
      *p++ = '\n';
      line_width = -1;
    }
    if (line_width < 0) {
      p = std::copy(indent.begin(), indent.end(), p);
      line_width = word_width;
      run = start;
    } else {
      line_width += 1 + word_width;
      if (start != run_end + 1) {  // more than one space before it
        flush();
        *p++ = ' ';
        run = start;
      }
    }
    run_end = i;
  }
  if (line_width >= 0) {
    flush();
    *p++ = '\n';
  }
  out.resize(static_cast<size_t>(p - out.data()));
}

std::string underline(const std::string& title, char c) {
  return fmt::format("{}\n{}\n", title, std::string(static_cast<size_t>(width(title)), c));
}

std::string heading(const std::string& title) { return underline(title, '-'); }

// "value" or "value  (row found)": a table lookup names its row.
std::string resultText(const TrailStep& s) {
  std::string out = valueText(s.result);
  if (!s.calls.empty() && s.calls[0].whole && !s.calls[0].row.empty()) out += "  (" + s.calls[0].row + ")";
  return out;
}

// A library call that is not the whole step: "where CALL = SUBSTITUTED =
// RESULT", on one line when it fits, else one part a line.
void whereLine(fmt::memory_buffer& out, const TrailCall& c) {
  std::vector<std::string> parts = {lineText(c.with_values)};
  if (c.formula_is_expression && c.show_substituted) parts.push_back(lineText(c.substituted));
  if (c.result) parts.push_back(valueText(*c.result) + (c.row.empty() ? "" : "  (" + c.row + ")"));
  std::string one = "      where " + parts[0];
  for (size_t k = 1; k < parts.size(); ++k) one += " = " + parts[k];
  if (width(one) <= 78) {
    putLine(out, {one});
    return;
  }
  putLine(out, {"      where ", parts[0]});
  for (size_t k = 1; k < parts.size(); ++k) putLine(out, {"          = ", parts[k]});
}

// The load cases: each with what it replaces; a case that could not be
// calculated says why.
void caseList(fmt::memory_buffer& out, const Trail& t) {
  put(out, heading("LOAD CASES"));
  int w = 0;
  for (const TrailCase& c : t.cases) w = std::max(w, width(c.name));
  for (const TrailCase& c : t.cases) {
    std::string line = "  " + pad(c.name, w) + "  " +
                       (c.replacements.empty() ? std::string("the worksheet as written") : c.replacements);
    if (!c.description.empty()) line += "  (" + c.description + ")";
    putLine(out, {line});
    for (const std::string& e : c.errors) wrap(out, "NOT CALCULATED: " + e, "    ");
  }
  out.push_back('\n');
}

// A value that some case changes: one line per case, nominal first, so that
// a diff shows which case moved.
void caseValues(fmt::memory_buffer& out, const Trail& t, const TrailStep& s,
                const std::string& indent) {
  int w = 0;
  for (const TrailCase& c : t.cases) w = std::max(w, width(c.name));
  for (size_t k = 0; k < s.cases.size() && k < t.cases.size(); ++k) {
    const TrailCaseValue& v = s.cases[k];
    std::string line = indent + pad(t.cases[k].name, w) + "  " + (v.ok ? valueText(v.value) : "not calculated");
    if (v.replaced) line += "  (replaced: " + v.formula + ")";
    putLine(out, {line});
  }
}

// The checks in every case: a row per check, a column per case with
// pass/FAIL and the margin; `*` marks the governing case (least margin).
void caseChecks(fmt::memory_buffer& out, const Trail& t) {
  put(out, heading("CHECKS BY LOAD CASE  (* governing: least margin)"));
  int name_w = 0;
  for (const TrailCheck& c : t.checks) name_w = std::max(name_w, width(c.name));
  std::vector<std::vector<std::string>> cells(t.checks.size());
  std::vector<int> col_w(t.cases.size());
  for (size_t k = 0; k < t.cases.size(); ++k) col_w[k] = width(t.cases[k].name);
  for (size_t i = 0; i < t.checks.size(); ++i) {
    const TrailCheck& c = t.checks[i];
    for (size_t k = 0; k < t.cases.size(); ++k) {
      std::string cell = "-";
      if (k < c.cases.size() && c.cases[k].ok)
        cell = std::string(c.cases[k].passed ? "pass " : "FAIL ") + valueText(c.cases[k].margin);
      if (static_cast<int>(k) == c.governing) cell += " *";
      col_w[k] = std::max(col_w[k], width(cell));
      cells[i].push_back(cell);
    }
  }
  // Columns wrap onto further blocks, each repeating the check names, so
  // that no line runs past 78 columns (one case a block at the least); the
  // blocks as even as the widths allow (4 cases as 2 and 2, not 3 and 1).
  auto fits = [&](size_t first, size_t last) {
    int w = 2 + name_w;
    for (size_t k = first; k < last; ++k) w += 2 + col_w[k];
    return last == first + 1 || w <= 78;
  };
  std::vector<std::pair<size_t, size_t>> groups;
  for (size_t first = 0; first < t.cases.size();) {
    size_t last = first + 1;
    while (last < t.cases.size() && fits(first, last + 1)) ++last;
    groups.emplace_back(first, last);
    first = last;
  }
  const auto even = caseGroups(t.cases.size(), (t.cases.size() + groups.size() - 1) / groups.size());
  if (std::all_of(even.begin(), even.end(), [&](const auto& g) { return fits(g.first, g.second); }))
    groups = even;
  for (const auto& [first, last] : groups) {
    if (first > 0) out.push_back('\n');
    std::string head = "  " + pad("", name_w);
    for (size_t k = first; k < last; ++k) head += "  " + pad(t.cases[k].name, col_w[k]);
    while (!head.empty() && head.back() == ' ') head.pop_back();
    putLine(out, {head});
    for (size_t i = 0; i < t.checks.size(); ++i) {
      std::string row = "  " + pad(t.checks[i].name, name_w);
      for (size_t k = first; k < last; ++k) row += "  " + pad(cells[i][k], col_w[k]);
      while (!row.empty() && row.back() == ' ') row.pop_back();
      putLine(out, {row});
    }
  }
  out.push_back('\n');
}

// An instance's part: its heading, then its parameters a line each: the
// value each is bound to and where it came from.
void instanceHead(fmt::memory_buffer& out, const TrailInstance& in) {
  putLine(out, {"\n", in.heading, "\n"});
  if (in.params.empty()) return;
  std::vector<std::string> values;
  int name_w = width("parameter"), value_w = width("value");
  for (const TrailInstanceParam& p : in.params) {
    values.push_back(valueText(p.shown));
    name_w = std::max(name_w, width(p.name));
    value_w = std::max(value_w, width(values.back()));
  }
  putLine(out, {"  ", pad("parameter", name_w), "  ", pad("value", value_w), "  bound by"});
  for (size_t k = 0; k < in.params.size(); ++k) {
    const TrailInstanceParam& p = in.params[k];
    std::string from = p.overridden        ? std::string("[set on the command line]")
                       : p.binding.empty() ? std::string("(default)")
                                           : p.binding;
    // Left out of the Inputs list: its note is given here.
    if (p.in_part_table && !p.description.empty()) from += "  " + p.description;
    putLine(out, {"  ", pad(p.name, name_w), "  ", pad(values[k], value_w), "  ", from});
  }
}

// The worksheet's studies: a sweep as a table (values and every check per
// point), a capacity as its answer.
void studies(fmt::memory_buffer& out, const Trail& t) {
  put(out, heading("STUDIES"));
  for (const TrailStudy& st : t.studies) {
    putLine(out, {"  ", st.name, "  ", st.statement});
    if (!st.description.empty()) wrap(out, st.description, "    ");
    if (!st.header.empty()) {
      std::vector<int> w(st.header.size());
      for (size_t c = 0; c < st.header.size(); ++c) {
        w[c] = width(st.header[c]);
        for (const auto& r : st.rows) w[c] = std::max(w[c], width(r[c]));
      }
      auto row = [&](const std::vector<std::string>& cells) {
        std::string line = "   ";
        for (size_t c = 0; c < cells.size(); ++c) {
          const std::string gap(static_cast<size_t>(w[c] - width(cells[c])), ' ');
          line += "  " + (c < st.value_columns ? gap + cells[c] : cells[c] + gap);
        }
        while (!line.empty() && line.back() == ' ') line.pop_back();
        putLine(out, {line});
      };
      out.push_back('\n');
      row(st.header);
      for (const auto& r : st.rows) row(r);
      out.push_back('\n');
    }
    wrap(out, st.summary, "    ");
    for (const std::string& e : st.errors) wrap(out, e, "    ");
    out.push_back('\n');
  }
}

void signOff(fmt::memory_buffer& out, const Trail& t) {
  auto meta = [&](const std::string& key) {
    for (const auto& [k, v] : t.meta)
      if (k == key) return v;
    return std::string();
  };
  auto given = [](const std::string& v, const char* blank) { return v.empty() ? std::string(blank) : v; };
  out.push_back('\n');
  put(out, heading("SIGN-OFF"));
  putLine(out, {"  ", pad("calc", 11), given(meta("calc"), "-")});
  putLine(out, {"  ", pad("revision", 11), given(meta("revision"), "-")});
  putLine(out, {"  ", pad("worksheet", 11), t.path});
  putLine(out, {"  ", pad("sha256", 11), t.sha256});
  if (!t.modified_by.empty()) putLine(out, {"  ", pad("MODIFIED", 11), "by ", replacementList(t)});
  wrap(out, signOffStatement(t), "  ");
  out.push_back('\n');
  const std::string line = "______________";
  print(out, "  Prepared  {}  signature {}  date {}\n",
                 pad(given(meta("prepared"), line.c_str()), 16), line, given(meta("date"), line.c_str()));
  print(out, "  Checked   {}  signature {}  date {}\n",
                 pad(given(meta("checked"), line.c_str()), 16), line, line);
}

}  // namespace

void renderText(const Trail& t, ReportSink& sink) {
  fmt::memory_buffer& out = sink.buffer();
  put(out, underline(t.title.empty() ? "Calculation trail" : t.title, '='));
  for (const auto& [key, value] : t.meta) putLine(out, {pad(key, 10), value});
  putLine(out, {pad("file", 10), t.path});
  putLine(out, {pad("sha256", 10), t.sha256});
  for (size_t k = 1; k < t.files.size(); ++k)  // the templates, each with its hash
    print(out, "{}{}\n{}{}\n", pad("template", 10), t.files[k].path, pad("sha256", 10),
                   t.files[k].sha256);
  // Next to the hash: the hash alone no longer identifies these numbers.
  if (!t.modified_by.empty()) putLine(out, {pad("MODIFIED", 10), "by ", replacementList(t)});
  putLine(out, {pad("generator", 10), t.generator});
  if (!t.modified_by.empty()) {
    out.push_back('\n');
    wrap(out, modifiedNotice(t), "");
  }
  out.push_back('\n');

  // The verdict first: a failed check must be impossible to miss.
  putLine(out, {verdictSentence(t)});
  if (!t.warnings.empty()) wrap(out, warningSummary(t), "");
  out.push_back('\n');

  if (!t.cases.empty()) caseList(out, t);

  // Inputs, grouped under their sections.
  put(out, heading("INPUTS"));
  auto shown = [](const TrailStep& s) { return valueText(s.given ? *s.given : s.result); };
  int name_w = 0, value_w = 0;
  for (const TrailStep& s : t.steps.heads(TrailSteps::Filter::Inputs)) {
    sink.checkpoint();
    if (s.in_part_table) continue;
    name_w = std::max(name_w, width(s.name));
    value_w = std::max(value_w, width(shown(s)));
  }
  std::string section = "\x01";
  for (const TrailStep& s : t.steps.heads(TrailSteps::Filter::Inputs)) {
    sink.checkpoint();
    if (s.in_part_table) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty()) putLine(out, {section});
    }
    std::string row = "  " + pad(s.name, name_w) + "  " + pad(shown(s), value_w);
    std::string notes = s.description;
    if (s.formula_in_notes) notes = "= " + s.formula + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("[set on the command line]");
    if (!notes.empty()) row += "  " + notes;
    while (!row.empty() && row.back() == ' ') row.pop_back();
    putLine(out, {row});
    if (s.varies) caseValues(out, t, s, "      ");
    for (const std::string& w : s.warnings) wrap(out, "WARNING: " + w, "    ");
  }
  if (!instanceInputsPointer(t).empty()) wrap(out, instanceInputsPointer(t), "  ");
  out.push_back('\n');

  put(out, heading("CALCULATION"));
  for (const TrailBlock& b : t.blocks) {
    sink.checkpoint();
    if (b.kind == TrailBlock::Section && b.instance >= 0) {
      instanceHead(out, t.instances[static_cast<size_t>(b.instance)]);
    } else if (b.kind == TrailBlock::Section) {
      putLine(out, {"\n", t.blockText(b)});
    } else if (b.kind == TrailBlock::Note && b.instance >= 0) {
      continue;  // the parameters, set as a table under the instance's heading
    } else if (b.kind == TrailBlock::Note) {
      out.push_back('\n');
      wrap(out, t.blockText(b), "  ");
    } else if (b.kind == TrailBlock::CheckRef && b.instance >= 0) {
      // The part names its checks once, after its last step; their rows are in the summary.
      const TrailInstance& in = t.instances[static_cast<size_t>(b.instance)];
      if (b.index == in.checks.front()) {
        out.push_back('\n');
        wrap(out, instanceChecksLine(t, in), "  ");
      }
    } else if (b.kind == TrailBlock::Step) {
      if (t.steps.isInput(static_cast<size_t>(b.index))) continue;
      const TrailSteps::Held held = t.steps.get(static_cast<size_t>(b.index));
      const TrailStep& s = *held;
      putLine(out, {"\n  ", s.name, s.description.empty() ? "" : "  ", s.description,
                 s.overridden ? "  [set on the command line]" : ""});
      const std::string indent = "    " + std::string(static_cast<size_t>(width(s.name)), ' ') + " ";
      putLine(out, {"    ", s.name, " = ", s.pretty});
      if (s.show_substituted) putLine(out, {indent, "= ", lineText(s.substituted)});
      // One call that is the whole formula continues the chain with its own
      // formula's values; its formula, limits and source are listed once,
      // under LIBRARY FUNCTIONS USED.
      if (s.single_call) putLine(out, {indent, "= ", lineText(s.calls[0].substituted)});
      putLine(out, {indent, "= ", resultText(s)});
      if (s.varies) caseValues(out, t, s, indent + "  ");
      for (const TrailCall& c : s.calls)
        if (!c.whole) whereLine(out, c);
      for (const std::string& w : s.warnings) wrap(out, "WARNING: " + w, "    ");
    }
  }
  out.push_back('\n');

  if (!t.checks.empty()) {
    put(out, heading("CHECKS"));
    int w = 0;
    for (const TrailCheck& c : t.checks) w = std::max(w, width(c.name));
    for (const TrailCheck& c : t.checks) {
      putLine(out, {"  ", c.passed ? "pass" : "FAIL", "  ", pad(c.name, w), "  ", c.condition});
      print(out, "        {:{}}  {} {} {}", "", w, valueText(c.lhs), c.op, valueText(c.rhs));
      if (!c.measure.empty()) print(out, ": {}", c.measure);
      if (!c.description.empty()) print(out, "  ({})", c.description);
      out.push_back('\n');
      for (const std::string& m : c.warnings)
        wrap(out, "WARNING: " + m, std::string(static_cast<size_t>(w) + 10, ' '));
    }
    out.push_back('\n');
    if (!t.cases.empty()) caseChecks(out, t);
  }

  if (!t.studies.empty()) studies(out, t);

  if (!t.functions.empty()) {
    // Each library function once: what it computes, how, within which
    // limits, from which source, and where its tests are listed.
    put(out, heading("LIBRARY FUNCTIONS USED"));
    std::vector<std::string> definitions;
    for (const TrailFunction& f : t.functions) {
      if (f.trivial) {
        definitions.push_back(f.signature + " = " + f.value);
        continue;
      }
      print(out, "  {}  used by {}\n", f.signature, fmt::join(f.used_by, ", "));
      if (f.formula_is_expression) putLine(out, {"    = ", f.pretty});
      else wrap(out, "method: " + f.method, "    ");
      if (!f.limits.empty()) wrap(out, "limits: " + f.limits, "    ");
      wrap(out, "source: " + f.source, "    ");
      putLine(out, {"    verified: ", f.verification});
    }
    if (!definitions.empty())
      wrap(out, "Definitions: " + fmt::format("{}", fmt::join(definitions, ", ")), "  ");
    out.push_back('\n');
  }

  if (!t.warnings.empty()) {
    put(out, heading("WARNINGS"));
    for (const std::string& w : t.warnings) putLine(out, {"  ", w});
    out.push_back('\n');
  }

  put(out, heading("CAUTIONS"));
  for (const std::string& c : t.cautions) {
    // Wrapped under a four-space indent, whose first line's is the bullet.
    const size_t at = out.size();
    wrap(out, c, "    ");
    if (out.size() == at) put(out, "  - ");
    else std::copy_n("  - ", 4, out.data() + at);
  }
  signOff(out, t);
}

std::string renderText(const Trail& t) {
  ReportSink sink;
  renderText(t, sink);
  return sink.text();
}

}  // namespace calctrail
