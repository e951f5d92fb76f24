// The studies a worksheet holds (`study NAME: sweep ...`, `study NAME:
// capacity ...`, parsed into Sheet::studies): resolved against the Model (the
// input varied must be a given value, the values of its dimension, the
// results shown quantities of the sheet), each problem an error at its place
// on the line; then run through the same code as `calctrail sweep` and
// `calctrail solve --capacity` and `calctrail pick`, for the report.
#pragma once

#include <vector>

#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"
#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/study/pick.h"
#include "engine/study/solve.h"
#include "engine/study/sweep.h"

namespace calctrail {

// A study line bound to the Model: what runSweep or runSolve takes.
struct ResolvedStudy {
  /// The line as parsed; points into the Sheet.
  const SheetStudy* def = nullptr;
  /// Sweep: the input with its values, and the results shown.
  SweepSpec sweep;
  /// Capacity: the input, its bracket and the sense.
  SolveSpec capacity;
  /// Pick: the input and its candidates (SI), and what they are ("the ISO 2904 ...", "the values given").
  StudyInput pick_input;
  std::vector<double> pick_values;
  std::string pick_from;
};

// Every study of `sheet` bound under `inputs`; false (with every problem in `diags`) when one is wrong.
bool resolveSheetStudies(const Model& model, const Inputs& inputs, const Sheet& sheet, Diagnostics* diags,
                         std::vector<ResolvedStudy>* out);

// What a study line gives: the table of a sweep, or the outcome of a capacity.
struct SheetStudyRun {
  const SheetStudy* def = nullptr;
  SweepTable table;
  SolveSpec capacity_spec;
  SolveOutcome capacity;
  StudyInput pick_input;
  std::string pick_from;
  PickOutcome pick;
};

// Runs one resolved study over `base` (whose evaluation is `base_results`), on every core.
SheetStudyRun runSheetStudy(const Model& model, const Inputs& base, const Results& base_results,
                            const ResolvedStudy& study);

}  // namespace calctrail
