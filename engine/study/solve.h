// Solving for an input: the value in a bracket that makes a result meet a
// target (an equation EXPR = EXPR over the sheet's quantities), or the
// largest (smallest) value for which every check passes, with the check
// that limits it. Roots are found with Boost.Math's TOMS 748 (Alefeld,
// Potra and Shi), a bracketing method: it never leaves the bracket, and it
// converges on steps (a standard size chosen from a table) as well as on
// smooth results. The bracket is sampled first, to find where the sign
// changes and to warn when the result is not monotone in it.
#pragma once

#include <string>
#include <vector>

#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"
#include "engine/study/study_expr.h"
#include "engine/study/study_range.h"

namespace calctrail {

enum class SolveMode { Target, CapacityMax, CapacityMin };

struct SolveSpec {
  /// The input solved for, and its bracket (SI, lo < hi).
  StudyInput input;
  double lo = 0, hi = 0;
  SolveMode mode = SolveMode::Target;
  /// The two sides of the target (Target only), of one dimension.
  StudyExpr lhs, rhs;
  /// Points the bracket is sampled at before solving (both ends included).
  int samples = 41;
};

enum class SolveStatus {
  Solved,      // value found
  NotReached,  // no root in the bracket / no value passes every check (exit 1)
  EvalFailed,  // the sheet cannot be calculated at some value tried (exit 2)
};

struct SolveOutcome {
  SolveStatus status = SolveStatus::Solved;
  /// The value found (SI): a root of lhs - rhs, or the capacity (every check passes at it).
  double value = 0;
  /// The last bracket TOMS 748 held (SI); both equal to `value` when no root was refined.
  double bracket_lo = 0, bracket_hi = 0;
  /// Objective evaluations made (samples and solver).
  int evaluations = 0;
  /// Capacity: the check that fails just beyond `value`; empty when the bracket's end is the limit.
  std::string limiting_check;
  /// Target: lhs and rhs at `value` (SI).
  double lhs = 0, rhs = 0;
  /// Target: lhs and rhs at both ends of the bracket (SI), for "not reached".
  double lhs_at_lo = 0, rhs_at_lo = 0, lhs_at_hi = 0, rhs_at_hi = 0;
  /// Capacity, nothing passes: the checks failing at LO and at HI.
  std::vector<std::string> failing_lo, failing_hi;
  /// The evaluation at `value`: the checks there.
  Results results;
  /// EvalFailed: the fault, and the input's SI value where it happened.
  Fault fault;
  double fault_at = 0;
  /// Warnings: not monotone in the bracket, several roots.
  std::vector<std::string> warnings;
};

SolveOutcome runSolve(const Model& model, const Inputs& base, const Results& base_results,
                      const SolveSpec& spec);

// The signed margin of check k in `r`: >= 0 where it passes (< strictly, for < and >).
double checkMargin(const Model& model, size_t k, const Results& r);

}  // namespace calctrail
