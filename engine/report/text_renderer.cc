#include "engine/report/text_renderer.h"

#include <algorithm>
#include <iterator>

#include "engine/util/text_width.h"

namespace calctrail {

namespace {

int width(const std::string& s) { return displayWidth(s); }
std::string pad(const std::string& s, int w) { return padRight(s, w); }

// Wraps words at `cols`, each line starting with `indent`.
std::string wrap(const std::string& text, const std::string& indent, int cols = 78) {
  fmt::memory_buffer out;
  std::string line;
  size_t i = 0;
  while (i < text.size()) {
    while (i < text.size() && text[i] == ' ') ++i;
    size_t j = text.find(' ', i);
    if (j == std::string::npos) j = text.size();
    const std::string word = text.substr(i, j - i);
    i = j;
    if (word.empty()) continue;
    if (!line.empty() && width(indent) + width(line) + 1 + width(word) > cols) {
      fmt::format_to(std::back_inserter(out), "{}{}\n", indent, line);
      line.clear();
    }
    line += (line.empty() ? "" : " ") + word;
  }
  if (!line.empty()) fmt::format_to(std::back_inserter(out), "{}{}\n", indent, line);
  return fmt::to_string(out);
}

std::string underline(const std::string& title, char c) {
  return fmt::format("{}\n{}\n", title, std::string(static_cast<size_t>(width(title)), c));
}

std::string heading(const std::string& title) { return underline(title, '-'); }

}  // namespace

void renderText(const Trail& t, fmt::memory_buffer& buffer) {
  auto out = std::back_inserter(buffer);
  fmt::format_to(out, "{}", underline(t.title.empty() ? "Calculation trail" : t.title, '='));
  for (const auto& [key, value] : t.meta) fmt::format_to(out, "{}{}\n", pad(key, 10), value);
  fmt::format_to(out, "{}{}\n", pad("file", 10), t.path);
  fmt::format_to(out, "{}{}\n", pad("sha256", 10), t.sha256);
  for (size_t k = 1; k < t.files.size(); ++k)  // the templates, each with its hash
    fmt::format_to(out, "{}{}\n{}{}\n", pad("template", 10), t.files[k].path, pad("sha256", 10),
                   t.files[k].sha256);
  fmt::format_to(out, "\n");

  // The verdict first: a failed check must be impossible to miss.
  fmt::format_to(out, "{}", verdictWords(t, VerdictForm::Headline));
  for (const TrailCheck& c : t.checks)
    if (!c.passed) fmt::format_to(out, " {}", c.name);
  fmt::format_to(out, "\n\n");

  // Inputs, grouped under their sections.
  fmt::format_to(out, "{}", heading("INPUTS"));
  auto shown = [](const TrailStep& s) { return valueText(s.given ? *s.given : s.result); };
  int name_w = 0, value_w = 0;
  for (const TrailStep& s : t.steps) {
    if (!s.input) continue;
    name_w = std::max(name_w, width(s.name));
    value_w = std::max(value_w, width(shown(s)));
  }
  std::string section = "\x01";
  for (const TrailStep& s : t.steps) {
    if (!s.input) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty()) fmt::format_to(out, "{}\n", section);
    }
    std::string line = fmt::format("  {}  {}", pad(s.name, name_w), pad(shown(s), value_w));
    std::string notes = s.description;
    if (s.formula_in_notes) notes = "= " + s.formula + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("[set on the command line]");
    if (!notes.empty()) line += "  " + notes;
    while (!line.empty() && line.back() == ' ') line.pop_back();
    fmt::format_to(out, "{}\n", line);
  }
  fmt::format_to(out, "\n");

  fmt::format_to(out, "{}", heading("CALCULATION"));
  for (const TrailBlock& b : t.blocks) {
    if (b.kind == TrailBlock::Section) {
      fmt::format_to(out, "\n{}\n", b.text);
    } else if (b.kind == TrailBlock::Note) {
      fmt::format_to(out, "\n{}", wrap(b.text, "  "));
    } else if (b.kind == TrailBlock::Step) {
      const TrailStep& s = t.steps[b.index];
      if (s.input) continue;
      fmt::format_to(out, "\n  {}", s.name);
      if (!s.description.empty()) fmt::format_to(out, "  {}", s.description);
      if (s.overridden) fmt::format_to(out, "  [set on the command line]");
      fmt::format_to(out, "\n");
      const std::string indent = "    " + std::string(static_cast<size_t>(width(s.name)), ' ') + " ";
      fmt::format_to(out, "    {} = {}\n", s.name, s.pretty);
      if (s.show_substituted) fmt::format_to(out, "{}= {}\n", indent, lineText(s.substituted));
      fmt::format_to(out, "{}= {}\n", indent, valueText(s.result));
      for (const TrailCall& c : s.calls) {
        // The function is audited like a formula: its own formula, the
        // values of this call substituted, the result, and its source.
        fmt::format_to(out, "      where {}\n", c.signature);
        const std::string eq = "          = ";
        if (c.formula_is_expression) fmt::format_to(out, "{}{}\n", eq, c.pretty);
        else fmt::format_to(out, "{}", wrap(c.formula, "          "));
        if (c.formula_is_expression && c.show_substituted) {
          fmt::format_to(out, "{}{}\n", eq, lineText(c.substituted));
        } else if (!c.formula_is_expression && !c.arguments.empty()) {
          fmt::format_to(out, "          with {}\n", lineText(c.arguments));
        }
        if (c.result) fmt::format_to(out, "{}{}\n", eq, valueText(*c.result));
        fmt::format_to(out, "{}", wrap("source: " + c.source, "        "));
      }
    }
  }
  fmt::format_to(out, "\n");

  if (!t.checks.empty()) {
    fmt::format_to(out, "{}", heading("CHECKS"));
    int w = 0;
    for (const TrailCheck& c : t.checks) w = std::max(w, width(c.name));
    for (const TrailCheck& c : t.checks) {
      fmt::format_to(out, "  {}  {}  {}\n", c.passed ? "pass" : "FAIL", pad(c.name, w), c.condition);
      fmt::format_to(out, "        {:{}}  {} {} {}", "", w, valueText(c.lhs), c.op, valueText(c.rhs));
      if (!c.description.empty()) fmt::format_to(out, "  ({})", c.description);
      fmt::format_to(out, "\n");
    }
    fmt::format_to(out, "\n");
  }

  if (!t.warnings.empty()) {
    fmt::format_to(out, "{}", heading("WARNINGS"));
    for (const std::string& w : t.warnings) fmt::format_to(out, "  {}\n", w);
    fmt::format_to(out, "\n");
  }

  fmt::format_to(out, "{}", heading("CAUTIONS"));
  for (const std::string& c : t.cautions) {
    std::string w = wrap(c, "    ");
    w.replace(0, 4, "  - ");
    fmt::format_to(out, "{}", w);
  }
}

std::string renderText(const Trail& t) {
  fmt::memory_buffer out;
  renderText(t, out);
  return fmt::to_string(out);
}

}  // namespace calctrail
