#include "engine/report/markdown_renderer.h"

#include <algorithm>

#include "engine/report/power_of_ten.h"

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

// Human numbers: "1.5e9 W" as "1.5 × 10⁹ W".
std::string human(const std::string& s) { return timesTenPowers(s); }

std::string relation(const std::string& op) {
  if (op == "<=") return "\u2264";
  if (op == ">=") return "\u2265";
  return op;
}

std::string verdict(const Trail& t) {
  if (t.checks.empty()) return "**Checks: none in this worksheet**";
  if (t.failed == 0) return "**Checks: all " + std::to_string(t.passed) + " pass**";
  std::string out = "**Checks: " + std::to_string(t.failed) + " of " + std::to_string(t.checks.size()) + " FAIL:**";
  for (const TrailCheck& c : t.checks)
    if (!c.passed) out += " " + code(c.name);
  return out;
}

}  // namespace

std::string renderMarkdown(const Trail& t) {
  std::string out;
  out += "# " + text(t.title.empty() ? "Calculation trail" : t.title) + "\n\n";
  for (const auto& [key, value] : t.meta) out += "- **" + key + ":** " + text(value) + "\n";
  out += "- **file:** " + code(t.path) + "\n";
  out += "- **sha256:** " + code(t.sha256) + "\n\n";

  // The verdict first: a failed check must be impossible to miss.
  out += verdict(t) + "\n\n";

  out += "## Inputs\n\n";
  out += "| Quantity | Value | Notes |\n|---|---|---|\n";
  std::string section = "\x01";
  for (const TrailStep& s : t.steps) {
    if (!s.input) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty()) out += "| **" + text(section) + "** | | |\n";
    }
    std::string notes = text(s.description);
    if (s.given.empty() && s.formula != s.result) notes = "= " + code(s.formula) + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("*(set on the command line)*");
    out += "| " + code(s.name) + " | " + human(s.given.empty() ? s.result : s.given) + " | " + notes + " |\n";
  }
  out += "\n";

  out += "## Calculation\n";
  for (const TrailBlock& b : t.blocks) {
    if (b.kind == TrailBlock::Section) {
      out += "\n### " + text(b.text) + "\n";
    } else if (b.kind == TrailBlock::Note) {
      out += "\n" + text(b.text) + "\n";
    } else if (b.kind == TrailBlock::Step) {
      const TrailStep& s = t.steps[b.index];
      if (s.input) continue;
      // One paragraph a step, its lines joined by hard breaks ("\" at the end).
      out += "\n**" + code(s.name) + "**";
      if (!s.description.empty()) out += " " + text(s.description);
      if (s.overridden) out += " *(set on the command line)*";
      out += "\\\n" + code(s.name + " = " + s.pretty) + "\\\n";
      if (s.substituted != s.pretty && s.substituted != s.result) out += code("= " + human(s.substituted)) + "\\\n";
      out += "= **" + human(s.result) + "**\n";
      for (const TrailCall& c : s.calls) {
        // The library function audited like a formula, with its source.
        out += "\n> where " + code(c.signature) + "\\\n";
        if (c.formula_is_expression) {
          out += "> " + code("= " + c.pretty) + "\\\n";
          if (!c.substituted.empty() && c.substituted != c.pretty) out += "> " + code("= " + human(c.substituted)) + "\\\n";
        } else {
          out += "> " + text(c.formula) + "\\\n";
          if (!c.arguments.empty()) out += "> with " + code(human(c.arguments)) + "\\\n";
        }
        if (!c.result.empty()) out += "> = " + human(c.result) + "\\\n";
        out += "> source: " + text(c.source) + "\n";
      }
    }
  }
  out += "\n";

  // Every computed value at a glance, for the reviewer of a change.
  bool any_result = false;
  for (const TrailStep& s : t.steps) any_result = any_result || !s.input;
  if (any_result) {
    out += "## Results\n\n| Quantity | Result | Description |\n|---|---|---|\n";
    for (const TrailStep& s : t.steps)
      if (!s.input) out += "| " + code(s.name) + " | " + human(s.result) + " | " + text(s.description) + " |\n";
    out += "\n";
  }

  if (!t.checks.empty()) {
    out += "## Checks\n\n| State | Check | Condition | Values | Note |\n|---|---|---|---|---|\n";
    for (const TrailCheck& c : t.checks) {
      const std::string values = human(c.lhs) + " " + relation(c.op) + " " + human(c.rhs);
      if (c.passed) {
        out += "| pass | " + code(c.name) + " | " + code(c.condition) + " | " + values + " | " + text(c.description) + " |\n";
      } else {
        out += "| **FAIL** | **" + code(c.name) + "** | " + code(c.condition) + " | **" + values + "** | " +
               text(c.description) + " |\n";
      }
    }
    out += "\n";
  }

  if (!t.warnings.empty()) {
    out += "## Warnings\n\n";
    for (const std::string& w : t.warnings) out += "- " + code(w) + "\n";
    out += "\n";
  }

  out += "## Cautions\n\n";
  for (const std::string& c : t.cautions) out += "- " + text(c) + "\n";
  return out;
}

}  // namespace calctrail
