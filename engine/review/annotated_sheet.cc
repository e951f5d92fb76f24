#include "engine/review/annotated_sheet.h"

#include <algorithm>
#include <map>
#include <vector>

#include "engine/report/number_format.h"
#include "engine/report/trail.h"
#include "engine/sheet/control_chars.h"

namespace calctrail {

namespace {

const char* severityWord(Severity s) { return s == Severity::Error ? "error" : "warning"; }

std::string checkSummary(const Calculation& calc) {
  if (calc.hasErrors()) {
    const int n = calc.diags.errorCount();
    return std::to_string(n) + (n == 1 ? " error" : " errors") + ", nothing calculated";
  }
  const size_t total = calc.checkCount();
  if (total == 0) return "no checks";
  std::string failed;
  for (size_t k = 0; k < total; ++k)
    if (!calc.checkResult(k).passed) failed += (failed.empty() ? "" : ", ") + calc.sheet.checks[k].name;
  const int n_failed = calc.failedChecks();
  std::string out = std::to_string(total) + (total == 1 ? " check, " : " checks, ");
  if (n_failed == 0) return out + "all PASS";
  return out + std::to_string(static_cast<int>(total) - n_failed) + " PASS, " + std::to_string(n_failed) +
         " FAIL (" + failed + ")";
}

// The lines of `instance` and of the instances inside it, as the template's
// own text would show them beside its lines (every quantity, given values
// too: the template's lines are not in this text), under dotted names.
void appendInstanceLines(const Calculation& calc, int instance, int digits, std::vector<std::string>* lines) {
  enum Kind { QuantityLine, CheckLine, UseLine };
  struct Item {
    int line;
    Kind kind;
    int index;
  };
  const Instance& inst = calc.sheet.instances[static_cast<size_t>(instance)];
  std::vector<Item> items;
  for (int q : inst.quantities)
    items.push_back({calc.sheet.quantities[static_cast<size_t>(q)].line, QuantityLine, q});
  for (int k : inst.checks) items.push_back({calc.sheet.checks[static_cast<size_t>(k)].line, CheckLine, k});
  for (size_t i = 0; i < calc.sheet.instances.size(); ++i)
    if (calc.sheet.instances[i].parent == instance)
      items.push_back({calc.sheet.instances[i].line, UseLine, static_cast<int>(i)});
  // One statement per line: the template's line order is its document order.
  std::stable_sort(items.begin(), items.end(), [](const Item& a, const Item& b) { return a.line < b.line; });
  for (const Item& item : items) {
    const size_t i = static_cast<size_t>(item.index);
    if (item.kind == QuantityLine && calc.ok(i))
      lines->push_back(calc.sheet.quantities[i].name + " = " +
                       annotatedValue(calc.si(i), calc.display(i), digits));
    if (item.kind == CheckLine)
      lines->push_back(annotatedCheck(calc.sheet.checks[i], calc.check(i), digits));
    if (item.kind == UseLine) appendInstanceLines(calc, item.index, digits, lines);
  }
}

// The marked lines after the `use` line `use_index` of the sheet, bounded.
std::string useLines(const Calculation& calc, int use_index, int digits) {
  const std::string mark = std::string(kAnnotationMark) + " ";
  std::string out;
  for (size_t i = 0; i < calc.sheet.instances.size(); ++i) {
    const Instance& inst = calc.sheet.instances[i];
    if (inst.parent >= 0 || inst.use_index != use_index) continue;
    std::vector<std::string> lines;
    appendInstanceLines(calc, static_cast<int>(i), digits, &lines);
    for (size_t k = 0; k < lines.size() && k < kMaxInstanceResults; ++k) out += mark + lines[k] + "\n";
    if (lines.size() > kMaxInstanceResults)
      out += mark + "and " + std::to_string(lines.size() - kMaxInstanceResults) +
             " more results of the instance " + inst.name + "\n";
  }
  return out;
}

}  // namespace

// "1.10000 kW" -> "1.1 kW": trailing zeros would only add noise to the diff.
std::string annotatedValue(double si, const Unit& unit, int digits) {
  std::string number = formatNumber(unit.fromSI(si), digits);
  const size_t exp = number.find('e');
  std::string mantissa = number.substr(0, exp), tail = exp == std::string::npos ? "" : number.substr(exp);
  if (mantissa.find('.') != std::string::npos) {
    while (mantissa.back() == '0') mantissa.pop_back();
    if (mantissa.back() == '.') mantissa.pop_back();
  }
  return joinNumberUnit(mantissa + tail, unit.pretty());
}

// A side of a check: a literal as written ("20 ksi"), as the report shows it.
static std::string checkSide(const Expr& side, double si, const Unit& unit, int digits) {
  if (std::optional<TrailValue> literal = writtenLiteral(side, si, unit)) return valueText(*literal);
  return annotatedValue(si, unit, digits);
}

std::string annotatedCheck(const Check& check, const CheckView& state, int digits) {
  return "check " + check.name + ": " + (state.passed ? "PASS  " : "FAIL  ") +
         checkSide(*check.lhs, state.lhs, state.display, digits) + " " + comparisonText(check.op) + " " +
         checkSide(*check.rhs, state.rhs, state.display, digits);
}

std::string annotatedSheet(const Calculation& calc, int digits) {
  const std::string mark = std::string(kAnnotationMark) + " ";
  // Diagnostics of the worksheet itself, by line; the rest go to the top.
  std::multimap<int, const Diagnostic*> by_line;
  std::string out = mark + "calctrail: " + checkSummary(calc) + "\n";
  for (const Diagnostic& d : calc.diags.list()) {
    if (d.line > 0 && d.path == calc.path) by_line.emplace(d.line, &d);
    else out += mark + severityWord(d.severity) + ": " + d.message + "\n";
  }
  if (!calc.sheet.file) return out;
  const SourceFile& file = *calc.sheet.file;
  const bool calculated = !calc.hasErrors();
  for (const Statement& st : calc.sheet.statements) {
    std::string_view text = file.lineText(st.line);
    if (st.line == 1 && text.rfind("\xEF\xBB\xBF", 0) == 0) text.remove_prefix(3);
    // A line with a control character is an error (shown below it); the
    // character itself must not reach the terminal that `git diff` prints to.
    out += withoutControlChars(text);
    out += "\n";
    if (calculated && st.kind == Statement::Define) {
      const QuantityView s = calc.quantity(st.index);
      if (!s.input && s.ok)
        out += mark + calc.sheet.quantities[st.index].name + " = " + annotatedValue(s.si, s.display, digits) + "\n";
    }
    if (calculated && st.kind == Statement::UseStmt) out += useLines(calc, st.index, digits);
    if (calculated && st.kind == Statement::CheckStmt) {
      out += mark + annotatedCheck(calc.sheet.checks[st.index], calc.check(st.index), digits) + "\n";
    }
    auto [b, e] = by_line.equal_range(st.line);
    for (auto it = b; it != e; ++it)
      out += mark + severityWord(it->second->severity) + ": " + it->second->message + "\n";
  }
  return out;
}

}  // namespace calctrail
