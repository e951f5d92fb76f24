// The studies part of the trail: each `study` line of the worksheet run
// through engine/study (runSweep, runSolve), and its table, plot or answer
// put in words once, for every renderer.
#include <cmath>

#include "engine/report/trail.h"
#include "engine/review/sheet_format.h"
#include "engine/study/sheet_study.h"
#include "engine/study/study_render.h"

namespace calctrail {

namespace {

std::string head(const std::string& name, const Unit& u) {
  return u.text == "1" ? name : name + " [" + u.text + "]";
}

std::string joinedNames(const std::vector<std::string>& names) {
  std::string s;
  for (const std::string& n : names) s += (s.empty() ? "`" : ", `") + n + "`";
  return s;
}

void sweepPart(const SweepTable& t, int digits, TrailStudy* out) {
  for (const SweepColumn& c : t.vary) out->header.push_back(head(c.name, c.unit));
  for (const SweepColumn& c : t.show) out->header.push_back(head(c.name, c.unit));
  out->value_columns = out->header.size();
  for (const std::string& c : t.checks) out->header.push_back(c);
  std::vector<int> fails(t.checks.size(), 0);
  int failing_points = 0;
  for (size_t p = 0; p < t.size(); ++p) {
    std::vector<std::string> row;
    for (size_t j = 0; j < t.vary.size(); ++j) row.push_back(formatNumber(t.vary[j].unit.fromSI(t.input(p, j)), digits));
    for (size_t j = 0; j < t.show.size(); ++j) {
      const double v = t.result(p, j);
      row.push_back(std::isfinite(v) ? formatNumber(t.show[j].unit.fromSI(v), digits) : "-");
    }
    bool any = false;
    for (size_t k = 0; k < t.checks.size(); ++k) {
      const signed char s = t.check(p, k);
      row.push_back(s < 0 ? "-" : s ? "pass" : "FAIL");
      if (s == 0) ++fails[k], any = true;
    }
    failing_points += any;
    out->rows.push_back(std::move(row));
    out->row_fails.push_back(any);
    if (t.failed(p))
      out->errors.push_back("At " + t.vary[0].name + " = " + formatQuantity(t.input(p, 0), t.vary[0].unit, digits) +
                            ": error: " + t.faults[p].message);
  }
  std::string failed;
  for (size_t k = 0; k < t.checks.size(); ++k)
    if (fails[k]) failed += fmt::format("{}{} ({})", failed.empty() ? "" : ", ", t.checks[k], fails[k]);
  out->summary = failed.empty() ? std::string("Every check passes at every point calculated.")
                                : fmt::format("A check fails at {} of {} points: {}.", failing_points, t.size(), failed);
  LinePlot plot = sweepPlot(t);
  plot.title = "Study " + out->name;  // the statement is above the plot; a long title would run into the legend
  out->svg = renderSvg(plot);
}

void capacityPart(const Model& m, const SolveSpec& spec, const SolveOutcome& o, int digits, TrailStudy* out) {
  const Unit& u = spec.input.unit;
  const std::string sense = spec.mode == SolveMode::CapacityMax ? "largest" : "smallest";
  const std::string bracket = formatQuantity(spec.lo, u, digits) + " and " + formatQuantity(spec.hi, u, digits);
  if (o.status == SolveStatus::Solved) {
    out->solved = true;
    out->value = {u.fromSI(o.value), o.value, roundNumber(u.fromSI(o.value), digits), u.pretty()};
    out->limiting_check = o.limiting_check;
    out->summary = spec.input.name + " = " + formatQuantity(o.value, u, digits) + ": the " + sense + " value between " +
                   bracket + " for which every check passes; " +
                   (o.limiting_check.empty() ? "every check passes up to that end of the bracket."
                                             : "limited by the check `" + o.limiting_check + "` (it fails just " +
                                                   (spec.mode == SolveMode::CapacityMax ? "above" : "below") + ").");
  } else if (o.status == SolveStatus::NotReached) {
    out->summary = "No value of " + spec.input.name + " between " + bracket + " passes every check (failing at " +
                   formatQuantity(spec.lo, u, digits) + ": " + joinedNames(o.failing_lo) + "; at " +
                   formatQuantity(spec.hi, u, digits) + ": " + joinedNames(o.failing_hi) + ").";
  } else {
    out->summary = "Not found: at " + spec.input.name + " = " + formatQuantity(o.fault_at, u, digits) +
                   " the sheet cannot be calculated: " + o.fault.message;
  }
  for (const std::string& w : o.warnings) out->errors.push_back("warning: " + w);
  (void)m;
}

// The candidates tried, each with the checks that rejected it, and the one chosen.
void pickPart(const SheetStudyRun& run, int digits, TrailStudy* out) {
  const Unit& u = run.pick_input.unit;
  out->header = {head(run.pick_input.name, u), "result"};
  out->value_columns = 1;
  out->tried = run.pick.tried;
  out->chosen = run.pick.chosen;
  out->pick_unit = u;
  for (size_t k = 0; k < run.pick.tried.size(); ++k) {
    const PickCandidate& c = run.pick.tried[k];
    std::string result;
    if (!c.error.empty()) result = "error: " + c.error;
    else if (c.passed) result = static_cast<int>(k) == run.pick.chosen ? "passes, chosen" : "passes";
    else {
      result = "fails:";
      for (size_t f = 0; f < c.failed.size(); ++f) result += (f ? ", " : " ") + c.failed[f];
    }
    out->rows.push_back({formatNumber(u.fromSI(c.value), digits), result});
    out->row_fails.push_back(!c.passed);
  }
  if (run.pick.chosen >= 0) {
    const double v = run.pick.tried[static_cast<size_t>(run.pick.chosen)].value;
    out->solved = true;
    out->value = {u.fromSI(v), v, roundNumber(u.fromSI(v), digits), u.pretty()};
    out->summary = run.pick_input.name + " = " + formatQuantity(v, u, digits) + ": the smallest of " + run.pick_from +
                   " for which every check passes.";
  } else {
    out->summary = "None of " + run.pick_from + " passes every check.";
  }
}

}  // namespace

void addStudies(const Calculation& calc, int digits, Trail* trail) {
  if (calc.sheet.studies.empty() || !calc.model || !calc.inputs || calc.hasErrors()) return;
  Diagnostics diags;  // Calculation::run reported any problem of the lines already
  std::vector<ResolvedStudy> resolved;
  if (!resolveSheetStudies(*calc.model, *calc.inputs, calc.sheet, &diags, &resolved)) return;
  for (const ResolvedStudy& r : resolved) {
    const SheetStudy& st = *r.def;
    TrailStudy out;
    out.name = st.name;
    out.description = st.description;
    out.line = st.line;
    out.kind = st.kind == SheetStudy::Sweep ? "sweep" : st.kind == SheetStudy::Pick ? "pick" : "capacity";
    const std::string line = canonicalStudyLine(st);
    out.statement = line.substr(line.find(':') + 2);
    SheetStudyRun run = runSheetStudy(*calc.model, *calc.inputs, calc.results, r);
    if (st.kind == SheetStudy::Sweep) {
      run.table.sheet_path = calc.path;
      run.table.sheet_sha256 = calc.sha256;
      sweepPart(run.table, digits, &out);
      out.table = std::move(run.table);
    } else if (st.kind == SheetStudy::Pick) {
      pickPart(run, digits, &out);
    } else {
      capacityPart(*calc.model, run.capacity_spec, run.capacity, digits, &out);
    }
    trail->studies.push_back(std::move(out));
  }
}

}  // namespace calctrail
