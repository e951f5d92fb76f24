// Sensitivity of a result to every given value it depends on: the
// elasticity d ln(result) / d ln(input) by central differences (each
// difference re-runs only the input's downstream cone), ranked by
// magnitude, with the direction that raises the result and the checks that
// change state when the input moves by up to +-10 %.
#pragma once

#include <string>
#include <vector>

#include "engine/eval/slot.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"

namespace calctrail {

struct SensitivityOptions {
  /// Relative step of the central difference: the input at x*(1 -+ step).
  double step = 1e-5;
  /// The checks are sampled at +-1 %, +-2 %, ... up to +-flip_range.
  double flip_range = 0.10;
  int flip_steps = 10;
};

struct SensitivityFlip {
  /// The check's name.
  std::string check;
  /// The relative change of the input at the first sample where its state differs from the nominal one
  /// (+0.04: 4 % more).
  double change = 0;
  /// It passes there (and failed at the nominal point).
  bool passes = false;
};

struct InputSensitivity {
  /// The input and its nominal SI value.
  Slot slot;
  std::string name;
  double value = 0;
  /// The elasticity could be calculated (else `error` says why).
  bool ok = false;
  double elasticity = 0;
  std::string error;
  /// The checks that change state within +-flip_range, nearest first per side.
  std::vector<SensitivityFlip> flips;
  /// A relative change within +-flip_range at which the sheet cannot be calculated (0: none); its message.
  double fails_at = 0;
  std::string fails_message;
};

struct SensitivityOutcome {
  /// The result studied and its nominal SI value.
  Slot of;
  double value = 0;
  /// Every input it depends on: elasticities largest magnitude first, then those without one, in sheet order.
  std::vector<InputSensitivity> inputs;
};

// `of` must have a nonzero value in `base_results` (the caller reports that).
SensitivityOutcome runSensitivity(const Model& model, const Inputs& base, const Results& base_results,
                                  Slot of, const SensitivityOptions& options = {});

}  // namespace calctrail
