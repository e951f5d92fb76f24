#include "engine/report/markdown_renderer.h"

#include <algorithm>
#include <array>
#include <string_view>

namespace calctrail {

namespace {

// Whether Markdown or GitHub (tables, math, autolinks) would interpret `c`:
// a table of the byte values, made once from the list of them.
bool interpreted(char c) {
  static constexpr std::array<bool, 256> table = [] {
    std::array<bool, 256> t{};
    for (const char special : std::string_view("\\`*_[]<>|$~#")) t[static_cast<unsigned char>(special)] = true;
    return t;
  }();
  return table[static_cast<unsigned char>(c)];
}

// `s` with a backslash before each character `escaped` picks, the runs
// between them appended at once.
template <typename Escaped>
void appendEscaped(std::string& out, const std::string& s, Escaped escaped) {
  size_t run = 0;  // the bytes before it are written
  for (size_t i = 0; i < s.size(); ++i) {
    if (!escaped(s[i])) continue;
    out.append(s, run, i - run);
    out += '\\';
    run = i;  // the character itself begins the next run
  }
  out.append(s, run, std::string::npos);
}

// Worksheet text (titles, descriptions, notes) as literal Markdown: every
// character that Markdown or GitHub would interpret is backslash-escaped.
std::string text(const std::string& s) {
  std::string out;
  out.reserve(s.size() + 8);
  appendEscaped(out, s, interpreted);
  return out;
}

// A code span that holds any text: the fence is longer than any run of
// backticks inside, and a pipe is escaped (GitHub tables split cells on it).
std::string code(const std::string& s) {
  size_t run = 0, longest = 0;
  for (char c : s) {
    run = c == '`' ? run + 1 : 0;
    longest = std::max(longest, run);
  }
  const std::string fence(longest + 1, '`');
  const bool pad = longest > 0 || (!s.empty() && (s.front() == '`' || s.back() == '`'));
  std::string out = fence;
  out.reserve(2 * fence.size() + s.size() + 4);
  if (pad) out += ' ';
  appendEscaped(out, s, [](char c) { return c == '|'; });
  if (pad) out += ' ';
  out += fence;
  return out;
}

// Values for people: "1.5e9 W" as "1.5 × 10⁹ W".
std::string human(const TrailValue& v) { return valueText(v, NumberStyle::TimesTen); }
std::string human(const TrailLine& line) { return lineText(line, NumberStyle::TimesTen); }

// Case columns per table: a wider table wraps into several, each repeating
// its first column, so that no rendered page runs out of width.
constexpr size_t kCheckColumns = 5, kValueColumns = 6;

// A case's value, bold where it differs from the nominal.
std::string caseCell(const TrailStep& s, size_t k) {
  if (k >= s.cases.size() || !s.cases[k].ok) return "not calculated";
  const bool differs = k > 0 && s.cases[k].value.si != s.cases[0].value.si;
  return differs ? "**" + human(s.cases[k].value) + "**" : human(s.cases[k].value);
}

// Under a step that some case changes: its value in every case, nominal
// first, as a small table (several for many cases).
void caseValues(fmt::appender out, const Trail& t, const TrailStep& s) {
  for (const auto& [first, last] : caseGroups(t.cases.size(), kValueColumns)) {
    fmt::format_to(out, "\n| Case |");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, " {} |", code(t.cases[k].name));
    fmt::format_to(out, "\n|---|");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, "---|");
    fmt::format_to(out, "\n| {} |", code(s.name));
    for (size_t k = first; k < last; ++k) {
      // A calculated quantity that a case replaces: the formula in force, as the text trail says.
      const bool replaced = !s.input && k < s.cases.size() && s.cases[k].replaced;
      fmt::format_to(out, " {}{} |", caseCell(s, k), replaced ? " (replaced: " + code(s.cases[k].formula) + ")" : "");
    }
    fmt::format_to(out, "\n");
  }
}

// An instance's part: its heading, then a table of its parameters: the
// value each is bound to and where it came from (the binding in the using
// sheet, the template's default, or the command line).
void instanceHead(fmt::appender out, const TrailInstance& in) {
  fmt::format_to(out, "\n### Instance {}\n\n", code(in.name));
  fmt::format_to(out, "{} ({})\n", in.title.empty() ? std::string("Template") : text(in.title), code(in.path));
  if (in.params.empty()) return;
  fmt::format_to(out, "\n| Parameter | Value | Bound by |\n|---|---|---|\n");
  for (const TrailInstanceParam& p : in.params) {
    std::string from = p.overridden        ? std::string("*set on the command line*")
                       : p.binding.empty() ? std::string("*default*")
                                           : code(p.binding);
    // Left out of the Inputs list: its note is given here.
    if (p.in_part_table && !p.description.empty()) from += ": " + text(p.description);
    fmt::format_to(out, "| {} | {} | {} |\n", code(p.name), human(p.shown), from);
  }
}

std::string relation(const std::string& op) {
  if (op == "<=") return "\u2264";
  if (op == ">=") return "\u2265";
  return op;
}

std::string meta(const Trail& t, const std::string& key) {
  for (const auto& [k, v] : t.meta)
    if (k == key) return v;
  return "";
}

void checksSummary(fmt::appender out, const Trail& t) {
  // The verdict and every check first: a failed check must be impossible to miss.
  fmt::format_to(out, "## Design checks\n\n**{}**\n\n", text(verdictSentence(t)));
  if (!t.warnings.empty()) fmt::format_to(out, "**{}**\n\n", text(warningSummary(t)));
  if (t.checks.empty()) return;
  fmt::format_to(out, "| State | Check | Condition | Values | Utilisation or margin | Note |\n"
                      "|---|---|---|---|---|---|\n");
  for (const TrailCheck& c : t.checks) {
    const std::string values = human(c.lhs) + " " + relation(c.op) + " " + human(c.rhs);
    std::string note = text(c.description);
    for (const std::string& w : c.warnings) note += (note.empty() ? "" : " ") + ("**WARNING:** " + text(w));
    if (c.passed) {
      fmt::format_to(out, "| pass | {} | {} | {} | {} | {} |\n", code(c.name), code(c.condition), values,
                     c.measure, note);
    } else {
      fmt::format_to(out, "| **FAIL** | **{}** | {} | **{}** | **{}** | {} |\n", code(c.name),
                     code(c.condition), values, c.measure, note);
    }
  }
  fmt::format_to(out, "\n");
  if (t.cases.empty()) return;
  // Every check in every load case: pass/FAIL and the margin; the governing
  // case (least margin) is marked.
  fmt::format_to(out, "### Checks by load case\n\n");
  for (const auto& [first, last] : caseGroups(t.cases.size(), kCheckColumns)) {
    fmt::format_to(out, "| Check |");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, " {} |", code(t.cases[k].name));
    fmt::format_to(out, "\n|---|");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, "---|");
    fmt::format_to(out, "\n");
    for (const TrailCheck& c : t.checks) {
      fmt::format_to(out, "| {} |", code(c.name));
      for (size_t k = first; k < last; ++k) {
        std::string cell = "not calculated";
        if (k < c.cases.size() && c.cases[k].ok)
          cell = (c.cases[k].passed ? "pass " : "**FAIL** ") + human(c.cases[k].margin);
        if (static_cast<int>(k) == c.governing) cell += " (governing)";
        fmt::format_to(out, " {} |", cell);
      }
      fmt::format_to(out, "\n");
    }
    fmt::format_to(out, "\n");
  }
  fmt::format_to(out, "Load cases: ");
  for (size_t k = 0; k < t.cases.size(); ++k) {
    const TrailCase& c = t.cases[k];
    fmt::format_to(out, "{}{} ({})", k ? "; " : "", code(c.name),
                   c.replacements.empty() ? std::string("the worksheet as written") : text(c.replacements));
    for (const std::string& e : c.errors) fmt::format_to(out, " **NOT CALCULATED:** {}", text(e));
  }
  fmt::format_to(out, ".\n\n");
}

std::string resultText(const TrailStep& s) {
  std::string out = "**" + human(s.result) + "**";
  if (!s.calls.empty() && s.calls[0].whole && !s.calls[0].row.empty())
    out += " (" + text(s.calls[0].row) + ")";
  return out;
}

void signOff(fmt::appender out, const Trail& t) {
  auto given = [](const std::string& v) { return v.empty() ? std::string("\u2014") : text(v); };
  fmt::format_to(out, "## Sign-off\n\n");
  fmt::format_to(out, "- **calc:** {}\n- **revision:** {}\n", given(meta(t, "calc")),
                 given(meta(t, "revision")));
  fmt::format_to(out, "- **worksheet:** {}\n- **sha256:** {}\n", code(t.path), code(t.sha256));
  if (!t.modified_by.empty()) fmt::format_to(out, "- **MODIFIED BY:** {}\n", code(replacementList(t)));
  fmt::format_to(out, "\n{}\n\n", t.modified_by.empty() ? text(signOffStatement(t))
                                                         : "**" + text(signOffStatement(t)) + "**");
  fmt::format_to(out, "| | Name | Signature | Date |\n|---|---|---|---|\n");
  fmt::format_to(out, "| Prepared | {} | | {} |\n", text(meta(t, "prepared")), text(meta(t, "date")));
  fmt::format_to(out, "| Checked | {} | | |\n", text(meta(t, "checked")));
}

// The worksheet's studies: a sweep's table (values and every check per point), a capacity's answer.
void studies(fmt::appender out, const Trail& t) {
  fmt::format_to(out, "## Studies\n\n");
  for (const TrailStudy& st : t.studies) {
    fmt::format_to(out, "### Study {}\n\n{}\n\n", code(st.name), code(st.statement));
    if (!st.description.empty()) fmt::format_to(out, "{}\n\n", text(st.description));
    if (!st.header.empty()) {
      fmt::format_to(out, "|");
      for (const std::string& h : st.header) fmt::format_to(out, " {} |", text(h));
      fmt::format_to(out, "\n|");
      for (size_t c = 0; c < st.header.size(); ++c) fmt::format_to(out, c < st.value_columns ? "---:|" : "---|");
      fmt::format_to(out, "\n");
      for (const auto& r : st.rows) {
        fmt::format_to(out, "|");
        for (const std::string& cell : r) fmt::format_to(out, cell == "FAIL" ? " **{}** |" : " {} |", text(cell));
        fmt::format_to(out, "\n");
      }
      fmt::format_to(out, "\n");
    }
    fmt::format_to(out, "{}\n\n", text(st.summary));
    for (const std::string& e : st.errors) fmt::format_to(out, "- {}\n", text(e));
    if (!st.errors.empty()) fmt::format_to(out, "\n");
  }
}

}  // namespace

void renderMarkdown(const Trail& t, ReportSink& sink) {
  fmt::memory_buffer& buffer = sink.buffer();
  auto out = fmt::appender(buffer);
  fmt::format_to(out, "# {}\n\n", text(t.title.empty() ? "Calculation trail" : t.title));
  for (const auto& [key, value] : t.meta) fmt::format_to(out, "- **{}:** {}\n", key, text(value));
  fmt::format_to(out, "- **file:** {}\n", code(t.path));
  fmt::format_to(out, "- **sha256:** {}\n", code(t.sha256));
  fmt::format_to(out, "- **generator:** {}\n\n", text(t.generator));
  // Next to the hash: the hash alone no longer identifies these numbers.
  if (!t.modified_by.empty()) fmt::format_to(out, "> **{}**\n\n", text(modifiedNotice(t)));

  checksSummary(out, t);

  fmt::format_to(out, "## Inputs\n\n| Quantity | Value | Notes |\n|---|---|---|\n");
  std::string section = "\x01";
  for (const TrailStep& s : t.steps.heads(TrailSteps::Filter::Inputs)) {
    sink.checkpoint();
    if (s.in_part_table) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty()) fmt::format_to(out, "| **{}** | | |\n", text(section));
    }
    std::string notes = text(s.description);
    if (s.formula_in_notes) notes = "= " + code(s.formula) + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("*(set on the command line)*");
    for (const std::string& w : s.warnings) notes += " **WARNING:** " + text(w);
    fmt::format_to(out, "| {} | {} | {} |\n", code(s.name), human(s.given ? *s.given : s.result), notes);
  }
  if (!instanceInputsPointer(t).empty()) fmt::format_to(out, "\n{}\n", text(instanceInputsPointer(t)));
  fmt::format_to(out, "\n");

  fmt::format_to(out, "## Calculation\n");
  for (const TrailBlock& b : t.blocks) {
    sink.checkpoint();
    if (b.kind == TrailBlock::Section && b.instance >= 0) {
      instanceHead(out, t.instances[static_cast<size_t>(b.instance)]);
    } else if (b.kind == TrailBlock::Section) {
      fmt::format_to(out, "\n### {}\n", text(t.blockText(b)));
    } else if (b.kind == TrailBlock::Note && b.instance >= 0) {
      continue;  // the parameters, set as a table under the instance's heading
    } else if (b.kind == TrailBlock::Note) {
      fmt::format_to(out, "\n{}\n", text(t.blockText(b)));
    } else if (b.kind == TrailBlock::CheckRef && b.instance >= 0) {
      // The part names its checks once, after its last step; their rows are in the summary.
      const TrailInstance& in = t.instances[static_cast<size_t>(b.instance)];
      if (b.index == in.checks.front()) fmt::format_to(out, "\n{}\n", text(instanceChecksLine(t, in)));
    } else if (b.kind == TrailBlock::Step) {
      if (t.steps.isInput(static_cast<size_t>(b.index))) continue;
      const TrailSteps::Held held = t.steps.get(static_cast<size_t>(b.index));
      const TrailStep& s = *held;
      // One paragraph a step, its lines joined by hard breaks ("\" at the end).
      fmt::format_to(out, "\n**{}**", code(s.name));
      if (!s.description.empty()) fmt::format_to(out, " {}", text(s.description));
      if (s.overridden) fmt::format_to(out, " *(set on the command line)*");
      fmt::format_to(out, "\\\n{}\\\n", code(s.name + " = " + s.pretty));
      if (s.show_substituted) fmt::format_to(out, "{}\\\n", code("= " + human(s.substituted)));
      if (s.single_call) fmt::format_to(out, "{}\\\n", code("= " + human(s.calls[0].substituted)));
      std::vector<std::string> lines = {"= " + resultText(s)};
      for (const TrailCall& c : s.calls) {
        if (c.whole) continue;
        // A call inside the formula: its values, its formula's values, its result.
        std::string where = "where " + code(human(c.with_values));
        if (c.formula_is_expression && c.show_substituted) where += " " + code("= " + human(c.substituted));
        if (c.result) where += " = " + human(*c.result);
        if (!c.row.empty()) where += " (" + text(c.row) + ")";
        lines.push_back(where);
      }
      for (const std::string& w : s.warnings) lines.push_back("**WARNING:** " + text(w));
      fmt::format_to(out, "{}\n", fmt::join(lines, "\\\n"));
      if (s.varies) caseValues(out, t, s);
    }
  }
  fmt::format_to(out, "\n");

  // Every computed value at a glance, for the reviewer of a change.
  if (t.steps.anyCalculated()) {
    if (t.cases.empty()) {
      fmt::format_to(out, "## Results\n\n| Quantity | Result | Description |\n|---|---|---|\n");
      for (const TrailStep& s : t.steps.heads(TrailSteps::Filter::Calculated)) {
        sink.checkpoint();
        fmt::format_to(out, "| {} | {} | {} |\n", code(s.name), human(s.result), text(s.description));
      }
    } else {
      // One value column per load case, nominal first; a bold value differs from the nominal.
      fmt::format_to(out, "## Results\n");
      for (const auto& [first, last] : caseGroups(t.cases.size(), kValueColumns)) {
        fmt::format_to(out, "\n| Quantity |");
        for (size_t k = first; k < last; ++k) fmt::format_to(out, " {} |", code(t.cases[k].name));
        fmt::format_to(out, " Description |\n|---|");
        for (size_t k = first; k <= last; ++k) fmt::format_to(out, "---|");
        fmt::format_to(out, "\n");
        for (const TrailStep& s : t.steps.heads()) {
          sink.checkpoint();
          if (s.input && !s.varies) continue;
          fmt::format_to(out, "| {} |", code(s.name));
          for (size_t k = first; k < last; ++k) fmt::format_to(out, " {} |", caseCell(s, k));
          fmt::format_to(out, " {} |\n", text(s.description));
        }
      }
    }
    fmt::format_to(out, "\n");
  }

  if (!t.studies.empty()) studies(out, t);

  if (!t.functions.empty()) {
    fmt::format_to(out, "## Library functions used\n\n");
    std::vector<std::string> definitions;
    for (const TrailFunction& f : t.functions) {
      if (f.trivial) {
        definitions.push_back(code(f.signature + " = " + f.value));
        continue;
      }
      std::vector<std::string> used;
      for (const std::string& u : f.used_by) used.push_back(code(u));
      fmt::format_to(out, "**{}** used by {}\\\n", code(f.signature), fmt::join(used, ", "));
      if (f.formula_is_expression) fmt::format_to(out, "{}\\\n", code("= " + f.pretty));
      else fmt::format_to(out, "method: {}\\\n", text(f.method));
      if (!f.limits.empty()) fmt::format_to(out, "limits: {}\\\n", text(f.limits));
      fmt::format_to(out, "source: {}\\\nverified: {}\n\n", text(f.source), f.verification);
    }
    if (!definitions.empty()) fmt::format_to(out, "Definitions: {}\n\n", fmt::join(definitions, ", "));
  }

  if (!t.warnings.empty()) {
    fmt::format_to(out, "## Warnings\n\n");
    for (const std::string& w : t.warnings) fmt::format_to(out, "- {}\n", code(w));
    fmt::format_to(out, "\n");
  }

  fmt::format_to(out, "## Cautions\n\n");
  for (const std::string& c : t.cautions) fmt::format_to(out, "- {}\n", text(c));
  fmt::format_to(out, "\n");
  signOff(out, t);
}

std::string renderMarkdown(const Trail& t) {
  ReportSink sink;
  renderMarkdown(t, sink);
  return sink.text();
}

}  // namespace calctrail
