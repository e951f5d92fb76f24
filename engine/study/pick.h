// Picking a value from a series or a list: the smallest candidate (or the
// one with the least --by result) for which every check passes; every
// candidate tried is kept, with the checks that rejected it.
#pragma once

#include <string>
#include <vector>

#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"
#include "engine/study/study_expr.h"
#include "engine/study/study_range.h"

namespace calctrail {

struct PickCandidate {
  /// The candidate's SI value.
  double value = 0;
  /// Every check passes with it.
  bool passed = false;
  /// The checks that fail with it, in sheet order.
  std::vector<std::string> failed;
  /// The sheet cannot be calculated with it: the first fault's message ("" when it can).
  std::string error;
  /// The --by result with it (SI); NaN without --by or when it has no value.
  double by = 0;
};

struct PickOutcome {
  /// The candidates tried, in the order tried (ascending value; --smallest stops at the first that passes).
  std::vector<PickCandidate> tried;
  /// Index into `tried` of the one chosen; -1 when none passes.
  int chosen = -1;
};

// `by` null: the smallest passing value; else the passing value with the least `by` (ties: the smaller
// value).
PickOutcome runPick(const Model& model, const Inputs& base, const Results& base_results,
                    const StudyInput& input, std::vector<double> candidates, const StudyExpr* by);

}  // namespace calctrail
