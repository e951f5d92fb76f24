#include "engine/report/markdown_renderer.h"

#include <algorithm>
#include <iterator>


namespace calctrail {

namespace {

// Worksheet text (titles, descriptions, notes) as literal Markdown: every
// character that Markdown or GitHub (tables, math, autolinks) would
// interpret is backslash-escaped.
std::string text(const std::string& s) {
  std::string out;
  for (char c : s) {
    if (std::string_view("\\`*_[]<>|$~#").find(c) != std::string_view::npos) out += '\\';
    out += c;
  }
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
  std::string body;
  for (char c : s) body += c == '|' ? std::string("\\|") : std::string(1, c);
  const bool pad = longest > 0 || (!s.empty() && (s.front() == '`' || s.back() == '`'));
  return fence + (pad ? " " : "") + body + (pad ? " " : "") + fence;
}

// Values for people: "1.5e9 W" as "1.5 × 10⁹ W".
std::string human(const TrailValue& v) { return valueText(v, NumberStyle::TimesTen); }
std::string human(const TrailLine& line) { return lineText(line, NumberStyle::TimesTen); }

std::string relation(const std::string& op) {
  if (op == "<=") return "\u2264";
  if (op == ">=") return "\u2265";
  return op;
}

std::string verdict(const Trail& t) {
  std::string out = "**" + verdictWords(t, VerdictForm::Headline) + "**";
  for (const TrailCheck& c : t.checks)
    if (!c.passed) out += " " + code(c.name);
  return out;
}

}  // namespace

void renderMarkdown(const Trail& t, fmt::memory_buffer& buffer) {
  auto out = std::back_inserter(buffer);
  fmt::format_to(out, "# {}\n\n", text(t.title.empty() ? "Calculation trail" : t.title));
  for (const auto& [key, value] : t.meta) fmt::format_to(out, "- **{}:** {}\n", key, text(value));
  fmt::format_to(out, "- **file:** {}\n", code(t.path));
  fmt::format_to(out, "- **sha256:** {}\n\n", code(t.sha256));

  // The verdict first: a failed check must be impossible to miss.
  fmt::format_to(out, "{}\n\n", verdict(t));

  fmt::format_to(out, "## Inputs\n\n| Quantity | Value | Notes |\n|---|---|---|\n");
  std::string section = "\x01";
  for (const TrailStep& s : t.steps) {
    if (!s.input) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty()) fmt::format_to(out, "| **{}** | | |\n", text(section));
    }
    std::string notes = text(s.description);
    if (s.formula_in_notes) notes = "= " + code(s.formula) + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("*(set on the command line)*");
    fmt::format_to(out, "| {} | {} | {} |\n", code(s.name), human(s.given ? *s.given : s.result), notes);
  }
  fmt::format_to(out, "\n");

  fmt::format_to(out, "## Calculation\n");
  for (const TrailBlock& b : t.blocks) {
    if (b.kind == TrailBlock::Section) {
      fmt::format_to(out, "\n### {}\n", text(b.text));
    } else if (b.kind == TrailBlock::Note) {
      fmt::format_to(out, "\n{}\n", text(b.text));
    } else if (b.kind == TrailBlock::Step) {
      const TrailStep& s = t.steps[b.index];
      if (s.input) continue;
      // One paragraph a step, its lines joined by hard breaks ("\" at the end).
      fmt::format_to(out, "\n**{}**", code(s.name));
      if (!s.description.empty()) fmt::format_to(out, " {}", text(s.description));
      if (s.overridden) fmt::format_to(out, " *(set on the command line)*");
      fmt::format_to(out, "\\\n{}\\\n", code(s.name + " = " + s.pretty));
      if (s.show_substituted) fmt::format_to(out, "{}\\\n", code("= " + human(s.substituted)));
      fmt::format_to(out, "= **{}**\n", human(s.result));
      for (const TrailCall& c : s.calls) {
        // The library function audited like a formula, with its source.
        fmt::format_to(out, "\n> where {}\\\n", code(c.signature));
        if (c.formula_is_expression) {
          fmt::format_to(out, "> {}\\\n", code("= " + c.pretty));
          if (c.show_substituted) fmt::format_to(out, "> {}\\\n", code("= " + human(c.substituted)));
        } else {
          fmt::format_to(out, "> {}\\\n", text(c.formula));
          if (!c.arguments.empty()) fmt::format_to(out, "> with {}\\\n", code(human(c.arguments)));
        }
        if (c.result) fmt::format_to(out, "> = {}\\\n", human(*c.result));
        fmt::format_to(out, "> source: {}\n", text(c.source));
      }
    }
  }
  fmt::format_to(out, "\n");

  // Every computed value at a glance, for the reviewer of a change.
  bool any_result = false;
  for (const TrailStep& s : t.steps) any_result = any_result || !s.input;
  if (any_result) {
    fmt::format_to(out, "## Results\n\n| Quantity | Result | Description |\n|---|---|---|\n");
    for (const TrailStep& s : t.steps)
      if (!s.input)
        fmt::format_to(out, "| {} | {} | {} |\n", code(s.name), human(s.result), text(s.description));
    fmt::format_to(out, "\n");
  }

  if (!t.checks.empty()) {
    fmt::format_to(out,
                   "## Checks\n\n| State | Check | Condition | Values | Note |\n|---|---|---|---|---|\n");
    for (const TrailCheck& c : t.checks) {
      const std::string values = human(c.lhs) + " " + relation(c.op) + " " + human(c.rhs);
      if (c.passed) {
        fmt::format_to(out, "| pass | {} | {} | {} | {} |\n", code(c.name), code(c.condition), values,
                       text(c.description));
      } else {
        fmt::format_to(out, "| **FAIL** | **{}** | {} | **{}** | {} |\n", code(c.name), code(c.condition),
                       values, text(c.description));
      }
    }
    fmt::format_to(out, "\n");
  }

  if (!t.warnings.empty()) {
    fmt::format_to(out, "## Warnings\n\n");
    for (const std::string& w : t.warnings) fmt::format_to(out, "- {}\n", code(w));
    fmt::format_to(out, "\n");
  }

  fmt::format_to(out, "## Cautions\n\n");
  for (const std::string& c : t.cautions) fmt::format_to(out, "- {}\n", text(c));
}

std::string renderMarkdown(const Trail& t) {
  fmt::memory_buffer out;
  renderMarkdown(t, out);
  return fmt::to_string(out);
}

}  // namespace calctrail
