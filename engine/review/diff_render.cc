#include "engine/review/diff_render.h"

#include <algorithm>
#include <cmath>
#include <iterator>
#include <optional>
#include <utility>
#include <vector>

#include "engine/report/number_format.h"
#include "engine/report/trail.h"
#include "engine/util/json_writer.h"
#include "engine/util/text_width.h"

namespace calctrail {

namespace {

std::string plural(size_t n, const char* one, const char* many) {
  return fmt::format("{} {}", n, n == 1 ? one : many);
}

// Two values in one unit, rounded; widened until they differ when they do.
std::pair<std::string, std::string> valuePair(double was, double now, const Unit& unit, int digits) {
  std::string a = formatQuantity(was, unit, digits), b = formatQuantity(now, unit, digits);
  for (int k = digits + 1; a == b && was != now && k <= 17; ++k) {
    a = formatQuantity(was, unit, k);
    b = formatQuantity(now, unit, k);
  }
  return {a, b};
}

std::pair<std::string, std::string> valuePair(const ValueChange& v, int digits) {
  // A literal stays as written (0.15 -> 0.18), each side on its own.
  if (!v.old_written.empty() || !v.new_written.empty()) {
    auto [a, b] = v.same_dimension ? valuePair(v.old_si, v.new_si, v.unit, digits)
                                   : std::pair{formatQuantity(v.old_si, v.old_unit, digits),
                                               formatQuantity(v.new_si, v.unit, digits)};
    return {v.old_written.empty() ? a : v.old_written, v.new_written.empty() ? b : v.new_written};
  }
  if (!v.same_dimension)
    return {formatQuantity(v.old_si, v.old_unit, digits), formatQuantity(v.new_si, v.unit, digits)};
  return valuePair(v.old_si, v.new_si, v.unit, digits);
}

// A side of a check: a literal as written ("2 N·m", "3"), as report and check show it.
std::string checkSide(const Expr* side, double si, const Unit& unit, int digits) {
  if (side)
    if (std::optional<TrailValue> literal = writtenLiteral(*side, si, unit)) return valueText(*literal);
  return formatQuantity(si, unit, digits);
}

std::string checkValues(const std::string& op, double lhs, double rhs, const Unit& unit, int digits,
                        const Expr* lhs_expr, const Expr* rhs_expr) {
  return fmt::format("{} {} {}", checkSide(lhs_expr, lhs, unit, digits), op, checkSide(rhs_expr, rhs, unit, digits));
}
std::string checkValues(const CheckEntry& c, int digits) {
  return checkValues(c.op, c.lhs, c.rhs, c.unit, digits, c.lhs_expr, c.rhs_expr);
}
std::string oldCheckValues(const CheckFlip& f, int digits) {
  return checkValues(f.now.op, f.old_lhs, f.old_rhs, f.old_unit, digits, f.old_lhs_expr, f.old_rhs_expr);
}

std::string summaryLine(const SheetDiff& d) {
  std::vector<std::string> parts;
  auto add = [&](size_t n, const char* one, const char* many) {
    if (n) parts.push_back(plural(n, one, many));
  };
  add(d.flipped.size(), "check flipped", "checks flipped");
  add(d.still_failing.size(), "check still failing", "checks still failing");
  add(d.inputs.size(), "input changed", "inputs changed");
  add(d.formulas.size(), "formula changed", "formulas changed");
  add(d.moved.size(), "result moved", "results moved");
  add(d.added.size(), "quantity added", "quantities added");
  add(d.removed.size(), "quantity removed", "quantities removed");
  add(d.checks_added.size(), "check added", "checks added");
  add(d.checks_removed.size(), "check removed", "checks removed");
  add(d.new_warnings.size(), "new warning", "new warnings");
  add(d.meta.size(), "metadata change", "metadata changes");
  add(d.cases_added.size(), "case added", "cases added");
  add(d.cases_removed.size(), "case removed", "cases removed");
  add(d.cases.size(), "case with changes", "cases with changes");
  return fmt::format("{}", fmt::join(parts, ", "));
}

std::string rtolText(double rtol) { return formatExact(rtol); }

const char* state(bool passed) { return passed ? "PASS" : "FAIL"; }

// Rows of cells, each column padded to its widest cell.
std::string table(const std::vector<std::vector<std::string>>& rows, const std::string& indent) {
  std::vector<int> widths;
  for (const auto& r : rows)
    for (size_t c = 0; c < r.size(); ++c) {
      if (widths.size() <= c) widths.push_back(0);
      widths[c] = std::max(widths[c], displayWidth(r[c]));
    }
  fmt::memory_buffer out;
  for (const auto& r : rows) {
    std::string line = indent;
    for (size_t c = 0; c < r.size(); ++c) line += c + 1 < r.size() ? padRight(r[c], widths[c]) + "  " : r[c];
    while (!line.empty() && line.back() == ' ') line.pop_back();
    fmt::format_to(std::back_inserter(out), "{}\n", line);
  }
  return fmt::to_string(out);
}

std::string mdCell(const std::string& s) {
  std::string out;
  for (char c : s) {
    if (c == '|') out += "\\|";
    else if (c == '\n') out += ' ';
    else out += c;
  }
  return out;
}

std::string mdCode(const std::string& s) { return fmt::format("`{}`", mdCell(s)); }

}  // namespace

std::string diffModifiedNotice(const SheetDiff& d) {
  std::string list;
  for (const std::string& s : d.modified_by) list += (list.empty() ? "--set " : ", --set ") + s;
  return "MODIFIED: both sides are calculated AS MODIFIED by " + list +
         "; the numbers are not those of either file alone.";
}

std::string formatRelativeChange(double relative) {
  if (std::isnan(relative)) return "dimension changed";
  if (std::isinf(relative)) return "from zero";
  if (relative == 0) return "same value";
  return fmt::format("{}{} %", relative > 0 ? "+" : "-", formatNumber(std::fabs(relative) * 100, 3));
}

std::string renderDiffText(const SheetDiff& d, int digits) {
  fmt::memory_buffer buffer;
  auto out = std::back_inserter(buffer);
  fmt::format_to(out, "calctrail diff: {} -> {}\n", d.old_name, d.new_name);
  if (!d.modified_by.empty()) fmt::format_to(out, "{}\n", diffModifiedNotice(d));
  const std::string summary = summaryLine(d);
  if (summary.empty()) {
    fmt::format_to(out, "No change in inputs, formulas, results or checks (rtol {}).\n", rtolText(d.rtol));
    return fmt::to_string(buffer);
  }
  fmt::format_to(out, "{}.\n", summary);

  for (const CheckFlip& f : d.flipped) {
    const CheckEntry& c = f.now;
    fmt::format_to(out, "\n!! CHECK FLIPPED  {}: {} -> {}\n", c.name, state(!c.passed), state(c.passed));
    fmt::format_to(out, "   {}: {}{} (was {})\n", c.condition,
                   checkValues(c, digits), c.passed ? " holds" : " is false",
                   oldCheckValues(f, digits));
    if (!c.description.empty()) fmt::format_to(out, "   {}\n", c.description);
  }
  for (const CheckFlip& f : d.still_failing) {
    const CheckEntry& c = f.now;
    fmt::format_to(out, "\n!! STILL FAILING  {}{}: FAIL -> FAIL\n", c.name,
                   f.in_case.empty() ? "" : " in case " + f.in_case);
    fmt::format_to(out, "   {}: {} is false (was {})\n", c.condition, checkValues(c, digits),
                   oldCheckValues(f, digits));
    if (!c.description.empty()) fmt::format_to(out, "   {}\n", c.description);
  }

  auto valueRows = [&](const std::vector<ValueChange>& list) {
    std::vector<std::vector<std::string>> rows;
    for (const ValueChange& v : list) {
      auto [a, b] = valuePair(v, digits);
      rows.push_back({v.name, a, "->", b, formatRelativeChange(v.relative)});
    }
    return table(rows, "  ");
  };
  if (!d.inputs.empty()) fmt::format_to(out, "\nInputs changed:\n{}", valueRows(d.inputs));

  if (!d.formulas.empty()) {
    fmt::format_to(out, "\nFormulas changed:\n");
    for (const FormulaChange& f : d.formulas) {
      fmt::format_to(out, "  {}{}\n", f.is_check ? "check " : "", f.name);
      fmt::format_to(out, "    was  {}\n    now  {}\n", f.old_text, f.new_text);
    }
  }

  if (!d.moved.empty())
    fmt::format_to(out, "\nResults moved beyond rtol {}, largest change first:\n{}", rtolText(d.rtol),
                   valueRows(d.moved));

  if (!d.added.empty() || !d.removed.empty()) {
    std::vector<std::vector<std::string>> rows;
    for (const QuantityEntry& q : d.added)
      rows.push_back({"added", q.formula, "= " + formatQuantity(q.si, q.unit, digits)});
    for (const QuantityEntry& q : d.removed)
      rows.push_back({"removed", q.formula, "was " + formatQuantity(q.si, q.unit, digits)});
    fmt::format_to(out, "\nQuantities added and removed:\n{}", table(rows, "  "));
  }

  if (!d.checks_added.empty() || !d.checks_removed.empty()) {
    std::vector<std::vector<std::string>> rows;
    for (const CheckEntry& c : d.checks_added)
      rows.push_back({"added", state(c.passed), c.name + ": " + c.condition,
                      checkValues(c, digits)});
    for (const CheckEntry& c : d.checks_removed)
      rows.push_back({"removed", std::string("was ") + state(c.passed), c.name + ": " + c.condition,
                      checkValues(c, digits)});
    fmt::format_to(out, "\nChecks added and removed:\n{}", table(rows, "  "));
  }

  if (!d.new_warnings.empty()) {
    fmt::format_to(out, "\nNew warnings:\n");
    for (const std::string& w : d.new_warnings) fmt::format_to(out, "  {}\n", w);
  }

  if (!d.meta.empty()) {
    std::vector<std::vector<std::string>> rows;
    for (const MetaChange& m : d.meta)
      rows.push_back({m.key + ":", m.old_value.empty() ? "(none)" : m.old_value, "->",
                      m.new_value.empty() ? "(none)" : m.new_value});
    fmt::format_to(out, "\nMetadata changed:\n{}", table(rows, "  "));
  }

  if (!d.cases_added.empty() || !d.cases_removed.empty()) {
    std::vector<std::vector<std::string>> rows;
    for (const std::string& c : d.cases_added) rows.push_back({"added", c});
    for (const std::string& c : d.cases_removed) rows.push_back({"removed", c});
    fmt::format_to(out, "\nLoad cases added and removed:\n{}", table(rows, "  "));
  }
  for (const CaseDiff& c : d.cases) {
    fmt::format_to(out, "\nIn case {}:\n", c.name);
    if (c.not_compared) fmt::format_to(out, "  not compared: the case cannot be calculated on one side\n");
    for (const CheckFlip& f : c.flipped)
      fmt::format_to(out, "  !! CHECK FLIPPED  {}: {} -> {}  {}: {}\n", f.now.name, state(!f.now.passed),
                     state(f.now.passed), f.now.condition,
                     checkValues(f.now, digits));
    if (!c.moved.empty()) fmt::format_to(out, "  Results moved:\n{}", valueRows(c.moved));
  }
  return fmt::to_string(buffer);
}

std::string renderDiffMarkdown(const SheetDiff& d, int digits) {
  fmt::memory_buffer buffer;
  auto out = std::back_inserter(buffer);
  fmt::format_to(out, "### calctrail diff: {} \u2192 {}\n\n", mdCode(d.old_name), mdCode(d.new_name));
  if (!d.modified_by.empty()) fmt::format_to(out, "> **{}**\n\n", mdCell(diffModifiedNotice(d)));
  const std::string summary = summaryLine(d);
  if (summary.empty()) {
    fmt::format_to(out, "No change in inputs, formulas, results or checks (rtol {}).\n", rtolText(d.rtol));
    return fmt::to_string(buffer);
  }
  for (const CheckFlip& f : d.flipped) {
    fmt::format_to(out, "> **Check flipped: {} {} \u2192 {}**", mdCode(f.now.name), state(!f.now.passed),
                   state(f.now.passed));
    if (!f.now.description.empty()) fmt::format_to(out, " ({})", mdCell(f.now.description));
    fmt::format_to(out, "\n");
  }
  for (const CheckFlip& f : d.still_failing)
    fmt::format_to(out, "> **Still failing: {}{} FAIL \u2192 FAIL** ({})\n", mdCode(f.now.name),
                   f.in_case.empty() ? "" : " in case " + mdCode(f.in_case), mdCell(checkValues(f.now, digits)));
  if (!d.flipped.empty() || !d.still_failing.empty()) fmt::format_to(out, "\n");
  fmt::format_to(out, "{} (rtol {}).\n", summary, rtolText(d.rtol));

  if (!d.flipped.empty()) {
    fmt::format_to(out, "\n#### Checks flipped\n\n| Check | Condition | Was | Now |\n|---|---|---|---|\n");
    for (const CheckFlip& f : d.flipped) {
      const CheckEntry& c = f.now;
      fmt::format_to(out, "| {} | {} | {}: {} | **{}**: {} |\n", mdCode(c.name), mdCode(c.condition),
                     state(!c.passed), mdCell(oldCheckValues(f, digits)),
                     state(c.passed), mdCell(checkValues(c, digits)));
    }
  }

  auto valueTable = [&](const std::string& title, const char* what, const std::vector<ValueChange>& list) {
    if (list.empty()) return;
    fmt::format_to(out, "\n#### {}\n\n| {} | Old | New | Change |\n|---|--:|--:|--:|\n", title, what);
    for (const ValueChange& v : list) {
      auto [a, b] = valuePair(v, digits);
      fmt::format_to(out, "| {} | {} | {} | {} |\n", mdCode(v.name), mdCell(a), mdCell(b),
                     formatRelativeChange(v.relative));
    }
  };
  valueTable("Inputs changed", "Input", d.inputs);

  if (!d.formulas.empty()) {
    fmt::format_to(out, "\n#### Formulas changed\n\n| Name | Old | New |\n|---|---|---|\n");
    for (const FormulaChange& f : d.formulas)
      fmt::format_to(out, "| {} | {} | {} |\n", mdCode(std::string(f.is_check ? "check " : "") + f.name),
                     mdCode(f.old_text), mdCode(f.new_text));
  }

  valueTable(fmt::format("Results moved (beyond rtol {}, largest change first)", rtolText(d.rtol)), "Result",
             d.moved);

  if (!d.added.empty() || !d.removed.empty()) {
    fmt::format_to(out, "\n#### Quantities added and removed\n\n| | Definition | Value |\n|---|---|--:|\n");
    for (const QuantityEntry& q : d.added)
      fmt::format_to(out, "| added | {} | {} |\n", mdCode(q.formula),
                     mdCell(formatQuantity(q.si, q.unit, digits)));
    for (const QuantityEntry& q : d.removed)
      fmt::format_to(out, "| removed | {} | was {} |\n", mdCode(q.formula),
                     mdCell(formatQuantity(q.si, q.unit, digits)));
  }

  if (!d.checks_added.empty() || !d.checks_removed.empty()) {
    fmt::format_to(out,
                   "\n#### Checks added and removed\n\n| | Check | Condition | State |\n|---|---|---|---|\n");
    for (const CheckEntry& c : d.checks_added)
      fmt::format_to(out, "| added | {} | {} | {}: {} |\n", mdCode(c.name), mdCode(c.condition),
                     state(c.passed), mdCell(checkValues(c, digits)));
    for (const CheckEntry& c : d.checks_removed)
      fmt::format_to(out, "| removed | {} | {} | was {} |\n", mdCode(c.name), mdCode(c.condition),
                     state(c.passed));
  }

  if (!d.new_warnings.empty()) {
    fmt::format_to(out, "\n#### New warnings\n\n");
    for (const std::string& w : d.new_warnings) fmt::format_to(out, "- {}\n", mdCode(w));
  }

  if (!d.meta.empty()) {
    fmt::format_to(out, "\n#### Metadata changed\n\n| Key | Old | New |\n|---|---|---|\n");
    for (const MetaChange& m : d.meta)
      fmt::format_to(out, "| {} | {} | {} |\n", m.key, mdCell(m.old_value), mdCell(m.new_value));
  }

  if (!d.cases_added.empty() || !d.cases_removed.empty()) {
    fmt::format_to(out, "\n#### Load cases added and removed\n\n| | Case |\n|---|---|\n");
    for (const std::string& c : d.cases_added) fmt::format_to(out, "| added | {} |\n", mdCode(c));
    for (const std::string& c : d.cases_removed) fmt::format_to(out, "| removed | {} |\n", mdCode(c));
  }
  for (const CaseDiff& c : d.cases) {
    fmt::format_to(out, "\n#### In case {}\n\n", mdCode(c.name));
    if (c.not_compared) fmt::format_to(out, "Not compared: the case cannot be calculated on one side.\n");
    for (const CheckFlip& f : c.flipped)
      fmt::format_to(out, "> **Check flipped: {} {} \u2192 {}** ({})\n", mdCode(f.now.name),
                     state(!f.now.passed), state(f.now.passed),
                     mdCell(checkValues(f.now, digits)));
    valueTable("Results moved in case " + c.name, "Result", c.moved);
  }
  return fmt::to_string(buffer);
}

namespace {

void writeValueChange(JsonWriter& w, const ValueChange& v) {
  w.beginObject();
  w.key("name").value(v.name);
  w.key("old_formula").value(v.old_formula);
  w.key("old_text").value(v.old_written);  // a literal as written, "" otherwise
  w.key("new_text").value(v.new_written);
  w.key("new_formula").value(v.new_formula);
  w.key("unit").value(v.unit.text);
  w.key("old_value").value(v.same_dimension ? v.unit.fromSI(v.old_si) : v.old_unit.fromSI(v.old_si));
  w.key("new_value").value(v.unit.fromSI(v.new_si));
  if (!v.same_dimension) w.key("old_unit").value(v.old_unit.text);
  w.key("old_si").value(v.old_si);
  w.key("new_si").value(v.new_si);
  w.key("relative_change").value(v.relative);  // null from zero or across dimensions
  w.key("change").value(formatRelativeChange(v.relative));
  w.key("moved").value(v.moved);
  w.key("description").value(v.description);
  w.endObject();
}

void writeCheck(JsonWriter& w, const CheckEntry& c) {
  w.key("name").value(c.name);
  w.key("condition").value(c.condition);
  w.key("description").value(c.description);
  w.key("passed").value(c.passed);
  w.key("unit").value(c.unit.text);
  w.key("lhs").value(c.unit.fromSI(c.lhs));
  w.key("rhs").value(c.unit.fromSI(c.rhs));
}

void writeQuantity(JsonWriter& w, const QuantityEntry& q) {
  w.beginObject();
  w.key("name").value(q.name);
  w.key("formula").value(q.formula);
  w.key("value").value(q.unit.fromSI(q.si));
  w.key("unit").value(q.unit.text);
  w.key("si").value(q.si);
  w.key("input").value(q.input);
  w.key("description").value(q.description);
  w.endObject();
}

}  // namespace

std::string renderDiffJson(const SheetDiff& d) {
  JsonWriter w;
  w.beginObject();
  w.key("schema").value(kDiffJsonSchema);
  w.key("old").value(d.old_name);
  w.key("new").value(d.new_name);
  w.key("rtol").value(d.rtol);
  w.key("moved").value(d.somethingMoved());
  w.key("checks_fail").value(d.checksFail());
  w.key("modified_by").beginArray();
  for (const std::string& s : d.modified_by) w.value(s);
  w.endArray();
  w.key("checks_still_failing").beginArray();
  for (const CheckFlip& f : d.still_failing) {
    w.beginObject();
    writeCheck(w, f.now);
    w.key("case").value(f.in_case.empty() ? std::string("nominal") : f.in_case);
    w.key("old_unit").value(f.old_unit.text);
    w.key("old_lhs").value(f.old_unit.fromSI(f.old_lhs));
    w.key("old_rhs").value(f.old_unit.fromSI(f.old_rhs));
    w.endObject();
  }
  w.endArray();
  w.key("checks_flipped").beginArray();
  for (const CheckFlip& f : d.flipped) {
    w.beginObject();
    writeCheck(w, f.now);
    w.key("was_passed").value(!f.now.passed);
    w.key("old_unit").value(f.old_unit.text);
    w.key("old_lhs").value(f.old_unit.fromSI(f.old_lhs));
    w.key("old_rhs").value(f.old_unit.fromSI(f.old_rhs));
    w.endObject();
  }
  w.endArray();
  w.key("inputs_changed").beginArray();
  for (const ValueChange& v : d.inputs) writeValueChange(w, v);
  w.endArray();
  w.key("formulas_changed").beginArray();
  for (const FormulaChange& f : d.formulas) {
    w.beginObject();
    w.key("name").value(f.name);
    w.key("check").value(f.is_check);
    w.key("old").value(f.old_text);
    w.key("new").value(f.new_text);
    w.endObject();
  }
  w.endArray();
  w.key("results_moved").beginArray();
  for (const ValueChange& v : d.moved) writeValueChange(w, v);
  w.endArray();
  w.key("quantities_added").beginArray();
  for (const QuantityEntry& q : d.added) writeQuantity(w, q);
  w.endArray();
  w.key("quantities_removed").beginArray();
  for (const QuantityEntry& q : d.removed) writeQuantity(w, q);
  w.endArray();
  w.key("checks_added").beginArray();
  for (const CheckEntry& c : d.checks_added) {
    w.beginObject();
    writeCheck(w, c);
    w.endObject();
  }
  w.endArray();
  w.key("checks_removed").beginArray();
  for (const CheckEntry& c : d.checks_removed) {
    w.beginObject();
    writeCheck(w, c);
    w.endObject();
  }
  w.endArray();
  w.key("new_warnings").beginArray();
  for (const std::string& s : d.new_warnings) w.value(s);
  w.endArray();
  w.key("metadata_changed").beginArray();
  for (const MetaChange& m : d.meta) {
    w.beginObject();
    w.key("key").value(m.key);
    w.key("old").value(m.old_value);
    w.key("new").value(m.new_value);
    w.endObject();
  }
  w.endArray();
  if (d.has_cases) {  // only where a side has load cases: the diff of others is as it was
    w.key("cases_added").beginArray();
    for (const std::string& c : d.cases_added) w.value(c);
    w.endArray();
    w.key("cases_removed").beginArray();
    for (const std::string& c : d.cases_removed) w.value(c);
    w.endArray();
    w.key("cases").beginArray();
    for (const CaseDiff& c : d.cases) {
      w.beginObject();
      w.key("name").value(c.name);
      w.key("compared").value(!c.not_compared);
      w.key("checks_flipped").beginArray();
      for (const CheckFlip& f : c.flipped) {
        w.beginObject();
        writeCheck(w, f.now);
        w.key("was_passed").value(!f.now.passed);
        w.key("old_lhs").value(f.old_unit.fromSI(f.old_lhs));
        w.key("old_rhs").value(f.old_unit.fromSI(f.old_rhs));
        w.endObject();
      }
      w.endArray();
      w.key("results_moved").beginArray();
      for (const ValueChange& v : c.moved) writeValueChange(w, v);
      w.endArray();
      w.endObject();
    }
    w.endArray();
  }
  w.endObject();
  return w.str();
}

}  // namespace calctrail
