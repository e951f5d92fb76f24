#include "engine/study/sheet_study.h"

#include <algorithm>
#include <cmath>
#include <thread>

#include "engine/report/number_format.h"
#include "engine/study/series.h"
#include "engine/study/study_range.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

namespace {

std::string valueText(double si, const Unit& unit) { return formatQuantity(si, unit, 4); }

// The values of the line for `input`: both ends of a range stepped into
// `points` values (as `--vary FROM..TO --steps N`), or the list as written.
bool studyValues(const Model& m, const SourceFile& file, const SheetStudy& st, const StudyInput& input,
                 Diagnostics* diags, std::vector<double>* out) {
  std::vector<double> written;
  bool ok = true;
  for (const ExprPtr& v : st.values) {
    double si = 0;
    if (parseStudyValue(m, input, file, v->begin, v->end, diags, &si))
      written.push_back(si);
    else
      ok = false;
  }
  if (!ok) return false;
  if (!st.range) {
    *out = std::move(written);
    return true;
  }
  const double from = written[0], to = written[1];
  const uint32_t b = st.values[0]->begin, e = st.values[1]->end;
  if (from == to) {
    diags->error(file, b, e,
                 "the range starts and ends at " + valueText(from, input.unit) +
                     ": it has no points between its ends (write one value to study one point)");
    return false;
  }
  if (st.kind == SheetStudy::Capacity) {
    if (!(from < to)) {
      diags->error(file, b, e,
                   "the bracket is empty: LO (" + valueText(from, input.unit) + ") must be below HI (" +
                       valueText(to, input.unit) + ")");
      return false;
    }
    *out = {from, to};
    return true;
  }
  if (st.log && !(from * to > 0)) {
    diags->error(file, st.points_begin, st.points_end,
                 "log-spaced points need both ends of one sign and not zero; this range goes from " +
                     valueText(from, input.unit) + " to " + valueText(to, input.unit));
    return false;
  }
  // The same steps as `calctrail sweep --steps N [--log]` (parseVary), the ends exactly as written.
  const int steps = st.points ? st.points : kDefaultStudyPoints;
  const double n = static_cast<double>(steps - 1);
  out->clear();
  for (int i = 0; i < steps; ++i) {
    const double t = static_cast<double>(i) / n;
    double v = st.log ? from * std::exp(std::log(to / from) * t) : from + (to - from) * t;
    if (i == 0) v = from;
    if (i == steps - 1) v = to;
    out->push_back(v);
  }
  return true;
}

bool resolveShown(const Model& m, const SourceFile& file, const StudyName& name, Diagnostics* diags,
                  Slot* out) {
  const Slot slot = m.find(name.name);
  if (slot.valid()) {
    *out = slot;
    return true;
  }
  std::vector<std::string> names;
  for (const Quantity& q : m.sheet().quantities) names.push_back(q.name);
  std::string msg = "the worksheet defines no quantity `" + name.name + "` to show";
  for (const Check& c : m.sheet().checks)
    if (c.name == name.name) msg += " (`" + name.name + "` is a check: a sweep shows every check at every point)";
  const auto near = nearestWords(name.name, names);
  if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
  diags->error(file, name.begin, name.end, msg);
  return false;
}

// `pick X from SERIES`: a series of the input's dimension; `pick X from V1, V2`: values of it.
bool resolvePick(const Model& m, const SourceFile& file, const SheetStudy& st, const StudyInput& input,
                 Diagnostics* diags, ResolvedStudy* out) {
  out->pick_input = input;
  if (st.series.empty()) {
    out->pick_from = "the values given";
    return studyValues(m, file, st, input, diags, &out->pick_values);
  }
  const StudySeries* series = findSeries(st.series);
  if (!series) {
    std::string names;
    for (const StudySeries& x : studySeries()) names += (names.empty() ? "`" : ", `") + x.name + "`";
    diags->error(file, st.series_begin, st.series_end,
                 "there is no series `" + st.series + "` to pick from; the series are " + names +
                     ", or give the values: `pick " + st.vary.name + " from V1, V2, V3`");
    return false;
  }
  const SlotInfo& info = m.slot(input.slot);
  if (info.has_dim && info.dim != series->unit.dim) {
    diags->error(file, st.series_begin, st.series_end,
                 "`" + input.name + "` is " + info.dim.describe() + " in the worksheet, but the series `" +
                     series->name + "` holds " + series->unit.dim.describe());
    return false;
  }
  out->pick_values = *series->values;
  out->pick_from = "the series `" + series->name + "` (" + series->description + ")";
  return true;
}

bool resolveOne(const Model& m, const Inputs& inputs, const SourceFile& file, const SheetStudy& st,
                Diagnostics* diags, ResolvedStudy* out) {
  out->def = &st;
  StudyInput input;
  if (!resolveStudyInput(m, inputs, file, st.vary.begin, st.vary.end, diags, &input)) return false;
  if (st.kind == SheetStudy::Pick) return resolvePick(m, file, st, input, diags, out);
  std::vector<double> values;
  bool ok = studyValues(m, file, st, input, diags, &values);
  if (st.kind == SheetStudy::Capacity) {
    if (!ok) return false;
    out->capacity.input = input;
    out->capacity.lo = values[0];
    out->capacity.hi = values[1];
    out->capacity.mode = st.largest ? SolveMode::CapacityMax : SolveMode::CapacityMin;
    return true;
  }
  for (const StudyName& name : st.show) {
    Slot slot;
    if (resolveShown(m, file, name, diags, &slot))
      out->sweep.show.push_back(slot);
    else
      ok = false;
  }
  if (!ok) return false;
  out->sweep.vary.push_back({input, std::move(values)});
  out->sweep.log = st.log;
  out->sweep.jobs = std::max(1u, std::thread::hardware_concurrency());
  return true;
}

}  // namespace

bool resolveSheetStudies(const Model& m, const Inputs& inputs, const Sheet& sheet, Diagnostics* diags,
                         std::vector<ResolvedStudy>* out) {
  bool ok = true;
  out->clear();
  for (const SheetStudy& st : sheet.studies) {
    ResolvedStudy r;
    if (resolveOne(m, inputs, *sheet.file, st, diags, &r))
      out->push_back(std::move(r));
    else
      ok = false;
  }
  return ok;
}

SheetStudyRun runSheetStudy(const Model& m, const Inputs& base, const Results& base_results,
                            const ResolvedStudy& study) {
  SheetStudyRun run;
  run.def = study.def;
  if (study.def->kind == SheetStudy::Sweep) {
    run.table = runSweep(m, base, base_results, study.sweep);
  } else if (study.def->kind == SheetStudy::Pick) {
    run.pick_input = study.pick_input;
    run.pick_from = study.pick_from;
    run.pick = runPick(m, base, base_results, study.pick_input, study.pick_values, nullptr);
  } else {
    run.capacity_spec = study.capacity;
    run.capacity = runSolve(m, base, base_results, study.capacity);
  }
  return run;
}

}  // namespace calctrail
