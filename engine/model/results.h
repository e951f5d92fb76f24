// What one evaluation of a model gives: a value per slot, a result per
// check, and the faults (a formula that could not be calculated, a check
// that could not be evaluated), each explained with the values it read.
#pragma once

#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "engine/eval/slot.h"
#include "engine/sheet/source_file.h"

namespace calctrail {

struct CheckResult {
  /// Both sides evaluated to finite values.
  bool ok = false;
  /// The SI values of the two sides.
  double lhs = 0.0, rhs = 0.0;
  /// The condition holds (false when not ok).
  bool passed = false;
};

struct Fault {
  enum class Site { Quantity, Check };
  /// What could not be done: a quantity's formula, or a check.
  Site site = Site::Quantity;
  /// The slot index (Quantity) or the check index (Check).
  uint32_t index = 0;
  /// Where the operation at fault is written: the worksheet, or a --set text.
  /// Points into the Model or the Inputs, which outlive the Results.
  const SourceFile* file = nullptr;
  /// Byte range of the operation at fault in *file.
  uint32_t begin = 0, end = 0;
  /// The whole explanation: "`y` cannot be calculated: division by zero: the
  /// divisor is 0 (with x = 0.000)".
  std::string message;
};

struct Results {
  /// The SI value of every slot; NaN where there is none (it, or a quantity it reads, failed).
  std::vector<double> values;
  /// Per check of the model, in sheet order. Checks are evaluated only when no quantity faults.
  std::vector<CheckResult> checks;
  /// Every fault, quantities in evaluation order, then checks in sheet order.
  std::vector<Fault> faults;
  /// A doubtful library call (an argument outside the range met in practice,
  /// functions/plausibility.h) in a formula that was calculated: the same
  /// fields as a fault, the message a warning. Quantities by slot, then checks.
  std::vector<Fault> warnings;

  bool ok(Slot s) const { return std::isfinite(values[s.index()]); }
  double value(Slot s) const { return values[s.index()]; }
  int failedChecks() const {
    int n = 0;
    for (const CheckResult& c : checks) n += c.ok && !c.passed;
    return n;
  }
};

}  // namespace calctrail
