#include "engine/review/annotated_sheet.h"

#include <map>

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
  const size_t total = calc.checks.size();
  if (total == 0) return "no checks";
  std::string failed;
  for (size_t k = 0; k < total; ++k)
    if (!calc.checks[k].passed) failed += (failed.empty() ? "" : ", ") + calc.sheet.checks[k].name;
  const int n_failed = calc.failedChecks();
  std::string out = std::to_string(total) + (total == 1 ? " check, " : " checks, ");
  if (n_failed == 0) return out + "all PASS";
  return out + std::to_string(static_cast<int>(total) - n_failed) + " PASS, " + std::to_string(n_failed) +
         " FAIL (" + failed + ")";
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

std::string annotatedCheck(const Check& check, const CheckState& state, int digits) {
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
      const QuantityState& s = calc.quantities[st.index];
      if (!s.input && s.ok)
        out += mark + calc.sheet.quantities[st.index].name + " = " + annotatedValue(s.si, s.display, digits) + "\n";
    }
    if (calculated && st.kind == Statement::CheckStmt) {
      out += mark + annotatedCheck(calc.sheet.checks[st.index], calc.checks[st.index], digits) + "\n";
    }
    auto [b, e] = by_line.equal_range(st.line);
    for (auto it = b; it != e; ++it)
      out += mark + severityWord(it->second->severity) + ": " + it->second->message + "\n";
  }
  return out;
}

}  // namespace calctrail
