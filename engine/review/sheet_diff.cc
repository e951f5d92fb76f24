#include "engine/review/sheet_diff.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>

#include "engine/report/trail.h"
#include "engine/review/sheet_format.h"

namespace calctrail {

namespace {

void canonicalizeSheet(Sheet* sheet) {
  for (Quantity& q : sheet->quantities) canonicalizeUnits(q.expr.get());
  for (Check& c : sheet->checks) {
    canonicalizeUnits(c.lhs.get());
    canonicalizeUnits(c.rhs.get());
  }
  for (LoadCase& c : sheet->cases)
    for (CaseReplacement& r : c.replacements) canonicalizeUnits(r.expr.get());
  for (SheetStudy& st : sheet->studies)
    for (ExprPtr& v : st.values) canonicalizeUnits(v.get());
}

std::string caseLine(const LoadCase& c) {
  std::string out = "case " + c.name + ":";
  for (size_t i = 0; i < c.replacements.size(); ++i)
    out += (i ? ", " : " ") + c.replacements[i].name + " = " + renderExpr(*c.replacements[i].expr);
  return out;
}

const CaseRun* findRun(const Calculation& calc, const std::string& name) {
  for (const CaseRun& r : calc.cases)
    if (r.def->name == name) return &r;
  return nullptr;
}

QuantityEntry entryOf(const Calculation& calc, int i) {
  const Quantity& q = calc.sheet.quantities[i];
  const QuantityView s = calc.quantity(i);
  QuantityEntry e;
  e.name = q.name;
  e.formula = canonicalDefinition(q);
  e.description = q.description;
  e.si = s.si;
  e.unit = s.display;
  e.input = s.input;
  return e;
}

CheckEntry checkEntryOf(const Calculation& calc, int k) {
  const Check& c = calc.sheet.checks[k];
  const CheckView s = calc.check(k);
  CheckEntry e;
  e.name = c.name;
  e.condition = conditionText(c);
  e.description = c.description;
  e.op = comparisonText(c.op);
  e.passed = s.passed;
  e.lhs = s.lhs;
  e.rhs = s.rhs;
  e.unit = s.display;
  e.lhs_expr = c.lhs.get();
  e.rhs_expr = c.rhs.get();
  return e;
}

int findCheck(const Sheet& sheet, const std::string& name) {
  for (size_t k = 0; k < sheet.checks.size(); ++k)
    if (sheet.checks[k].name == name) return static_cast<int>(k);
  return -1;
}

// Largest change first; a change of dimension or from zero counts as the largest.
double sortKey(const ValueChange& v) {
  return std::isnan(v.relative) ? std::numeric_limits<double>::infinity() : std::fabs(v.relative);
}

}  // namespace

double relativeChange(double was, double now) {
  if (was == now) return 0.0;
  if (was == 0.0) return now > 0 ? std::numeric_limits<double>::infinity() : -std::numeric_limits<double>::infinity();
  return (now - was) / std::fabs(was);
}

bool movedBeyond(double was, double now, double rtol) {
  if (was == now) return false;
  // Relative to the larger magnitude, so the test reads the same both ways.
  return std::fabs(now - was) > rtol * std::max(std::fabs(was), std::fabs(now));
}

bool SheetDiff::somethingMoved() const {
  const bool input_moved = std::any_of(inputs.begin(), inputs.end(), [](const ValueChange& v) { return v.moved; });
  const bool case_moved = std::any_of(cases.begin(), cases.end(), [](const CaseDiff& c) {
    return !c.flipped.empty() || !c.moved.empty() || c.not_compared;
  });
  return !flipped.empty() || input_moved || !moved.empty() || !added.empty() || !removed.empty() ||
         !checks_added.empty() || !checks_removed.empty() || !cases_added.empty() || !cases_removed.empty() ||
         case_moved;
}

bool SheetDiff::checksFail() const {
  const auto fails = [](const CheckFlip& f) { return !f.now.passed; };
  return !still_failing.empty() || std::any_of(flipped.begin(), flipped.end(), fails) ||
         std::any_of(checks_added.begin(), checks_added.end(), [](const CheckEntry& c) { return !c.passed; });
}

bool SheetDiff::empty() const {
  return flipped.empty() && still_failing.empty() && inputs.empty() && formulas.empty() && moved.empty() && added.empty() &&
         removed.empty() && checks_added.empty() && checks_removed.empty() && new_warnings.empty() &&
         meta.empty() && cases_added.empty() && cases_removed.empty() && cases.empty();
}

namespace {

// A study line added, removed or rewritten, shown with the formulas changed
// ("study NAME", was and now); a study moves no value of the sheet.
void diffStudies(const Calculation& o, const Calculation& n, SheetDiff* d) {
  for (const SheetStudy& st : n.sheet.studies) {
    const int j = o.sheet.findStudy(st.name);
    const std::string now = canonicalStudyLine(st);
    const std::string was = j < 0 ? "(no study " + st.name + ")" : canonicalStudyLine(o.sheet.studies[j]);
    if (was != now) d->formulas.push_back({"study " + st.name, false, was, now});
  }
  for (const SheetStudy& st : o.sheet.studies)
    if (n.sheet.findStudy(st.name) < 0)
      d->formulas.push_back({"study " + st.name, false, canonicalStudyLine(st), "(removed)"});
}

// Each case both sides define, value by value and check by check, against
// itself on the old side; cases added and removed; case lines rewritten.
void diffCases(const Calculation& o, const Calculation& n, double rtol, SheetDiff* d) {
  d->has_cases = !o.sheet.cases.empty() || !n.sheet.cases.empty();
  for (const LoadCase& c : n.sheet.cases) {
    const int j = o.sheet.findCase(c.name);
    if (j < 0) {
      d->cases_added.push_back(caseLine(c));
      continue;
    }
    const std::string was = caseLine(o.sheet.cases[j]), now = caseLine(c);
    if (was != now) d->formulas.push_back({"case " + c.name, false, was, now});
    const CaseRun* ro = findRun(o, c.name);
    const CaseRun* rn = findRun(n, c.name);
    if (!ro || !rn) continue;
    CaseDiff cd;
    cd.name = c.name;
    if (!ro->ok() || !rn->ok()) {
      cd.not_compared = ro->ok() != rn->ok();
      if (cd.not_compared) d->cases.push_back(std::move(cd));
      continue;
    }
    for (size_t i = 0; i < n.sheet.quantities.size(); ++i) {
      const Quantity& q = n.sheet.quantities[i];
      const int oi = o.sheet.find(q.name);
      if (oi < 0) continue;
      const QuantityView s = n.quantity(i);
      const QuantityView os = o.quantity(oi);
      ValueChange v;
      v.name = q.name;
      v.description = q.description;
      v.old_si = ro->results.values[oi];
      v.new_si = rn->results.values[i];
      v.unit = s.display;
      v.old_unit = os.display;
      v.same_dimension = os.dim == s.dim;
      v.relative =
          v.same_dimension ? relativeChange(v.old_si, v.new_si) : std::numeric_limits<double>::quiet_NaN();
      v.moved = !v.same_dimension || movedBeyond(v.old_si, v.new_si, rtol);
      v.old_formula = canonicalDefinition(o.sheet.quantities[oi]);
      v.new_formula = canonicalDefinition(q);
      if (v.moved) cd.moved.push_back(v);
    }
    for (size_t k = 0; k < n.sheet.checks.size(); ++k) {
      const int ok = findCheck(o.sheet, n.sheet.checks[k].name);
      if (ok < 0) continue;
      const CheckResult& rnow = rn->results.checks[k];
      const CheckResult& rwas = ro->results.checks[ok];
      // A check failing in this case on both sides is no change, but never "all good".
      if (rnow.passed == rwas.passed && rnow.passed) continue;
      CheckFlip f;
      f.now = checkEntryOf(n, static_cast<int>(k));
      f.now.passed = rnow.passed;
      f.now.lhs = rnow.lhs;
      f.now.rhs = rnow.rhs;
      f.old_lhs = rwas.lhs;
      f.old_rhs = rwas.rhs;
      f.old_unit = o.checkDisplay(ok);
      f.old_lhs_expr = o.sheet.checks[ok].lhs.get();
      f.old_rhs_expr = o.sheet.checks[ok].rhs.get();
      f.in_case = c.name;
      if (rnow.passed == rwas.passed) d->still_failing.push_back(f);
      else cd.flipped.push_back(f);
    }
    std::stable_sort(cd.moved.begin(), cd.moved.end(), [](const ValueChange& a, const ValueChange& b) {
      const double ka = sortKey(a), kb = sortKey(b);
      if (ka != kb) return ka > kb;
      return a.name < b.name;
    });
    if (!cd.moved.empty() || !cd.flipped.empty()) d->cases.push_back(std::move(cd));
  }
  for (const LoadCase& c : o.sheet.cases)
    if (n.sheet.findCase(c.name) < 0) d->cases_removed.push_back(caseLine(c));
}

}  // namespace

SheetDiff diffCalculations(Calculation* old_calc, Calculation* new_calc, double rtol) {
  canonicalizeSheet(&old_calc->sheet);
  canonicalizeSheet(&new_calc->sheet);
  const Calculation& o = *old_calc;
  const Calculation& n = *new_calc;
  SheetDiff d;
  d.old_name = o.path;
  d.new_name = n.path;
  d.rtol = rtol;

  for (const std::string& key : Metadata::keys()) {
    const std::string was = o.sheet.meta.get(key), now = n.sheet.meta.get(key);
    if (was != now) d.meta.push_back({key, was, now});
  }

  for (size_t i = 0; i < n.sheet.quantities.size(); ++i) {
    const Quantity& q = n.sheet.quantities[i];
    const QuantityView s = n.quantity(i);
    const int j = o.sheet.find(q.name);
    if (j < 0) {
      d.added.push_back(entryOf(n, static_cast<int>(i)));
      continue;
    }
    const Quantity& oq = o.sheet.quantities[j];
    const QuantityView os = o.quantity(j);
    ValueChange v;
    v.name = q.name;
    v.description = q.description;
    v.old_si = os.si;
    v.new_si = s.si;
    v.unit = s.display;
    v.old_unit = os.display;
    v.same_dimension = os.dim == s.dim;
    v.relative = v.same_dimension ? relativeChange(os.si, s.si) : std::numeric_limits<double>::quiet_NaN();
    v.moved = !v.same_dimension || movedBeyond(os.si, s.si, rtol);
    v.old_formula = canonicalDefinition(oq);
    v.new_formula = canonicalDefinition(q);
    if (auto literal = writtenLiteral(*oq.expr, os.si, os.display)) v.old_written = valueText(*literal);
    if (auto literal = writtenLiteral(*q.expr, s.si, s.display)) v.new_written = valueText(*literal);
    // A given value that stays given is an input change; any other new text
    // (a step rewritten, a step become a given value or the reverse) is a
    // formula change.
    if (v.old_formula != v.new_formula && !(s.input && os.input))
      d.formulas.push_back({q.name, false, v.old_formula, v.new_formula});
    if (s.input) {
      // A respelling that gives the same value in the same unit is no change.
      const bool value_changed = !v.same_dimension || os.si != s.si || os.display.text != s.display.text;
      if (value_changed || !os.input) d.inputs.push_back(v);
      continue;
    }
    if (v.moved) d.moved.push_back(v);
  }
  for (size_t j = 0; j < o.sheet.quantities.size(); ++j)
    if (n.sheet.find(o.sheet.quantities[j].name) < 0) d.removed.push_back(entryOf(o, static_cast<int>(j)));

  for (size_t k = 0; k < n.sheet.checks.size(); ++k) {
    const Check& c = n.sheet.checks[k];
    const int ok = findCheck(o.sheet, c.name);
    if (ok < 0) {
      d.checks_added.push_back(checkEntryOf(n, static_cast<int>(k)));
      continue;
    }
    const std::string was = canonicalCondition(o.sheet.checks[ok]);
    const std::string now = canonicalCondition(c);
    if (was != now) d.formulas.push_back({c.name, true, was, now});
    const bool flipped = o.checkResult(ok).passed != n.checkResult(k).passed;
    if (flipped || !n.checkResult(k).passed) {
      CheckFlip f;
      f.now = checkEntryOf(n, static_cast<int>(k));
      f.old_lhs = o.checkResult(ok).lhs;
      f.old_rhs = o.checkResult(ok).rhs;
      f.old_unit = o.checkDisplay(ok);
      f.old_lhs_expr = o.sheet.checks[ok].lhs.get();
      f.old_rhs_expr = o.sheet.checks[ok].rhs.get();
      // A check failing on both sides is no change, but never "all good".
      (flipped ? d.flipped : d.still_failing).push_back(f);
    }
  }
  for (size_t k = 0; k < o.sheet.checks.size(); ++k)
    if (findCheck(n.sheet, o.sheet.checks[k].name) < 0) d.checks_removed.push_back(checkEntryOf(o, static_cast<int>(k)));

  // Warnings are matched by message: their line numbers shift with any edit above them.
  std::map<std::string, int> old_warnings;
  for (const Diagnostic& w : o.diags.list())
    if (w.severity == Severity::Warning) ++old_warnings[w.message];
  for (const Diagnostic& w : n.diags.list()) {
    if (w.severity != Severity::Warning) continue;
    auto it = old_warnings.find(w.message);
    if (it != old_warnings.end() && it->second > 0) {
      --it->second;
      continue;
    }
    d.new_warnings.push_back(w.headline());
  }

  std::stable_sort(d.moved.begin(), d.moved.end(), [](const ValueChange& a, const ValueChange& b) {
    const double ka = sortKey(a), kb = sortKey(b);
    if (ka != kb) return ka > kb;
    return a.name < b.name;
  });
  diffCases(o, n, rtol, &d);
  diffStudies(o, n, &d);
  return d;
}

}  // namespace calctrail
