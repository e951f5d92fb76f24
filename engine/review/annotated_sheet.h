// The text that `git diff` compares for a worksheet (`calctrail textconv`):
// the worksheet's own lines, each calculated quantity followed by its result
// and each check by its state, all recalculated. A changed input then shows
// in the diff together with every result it moved and every check it
// flipped, each beside the line that defines it. Added lines start with "#=":
// a comment to calctrail, and read as "gives" beside the line above them.
#pragma once

#include <cstddef>
#include <string>

#include "engine/calculation.h"

namespace calctrail {

// Our own mark, not the output mark of another tool (docs/review.md).
constexpr const char* kAnnotationMark = "#=";

// Result lines after one `use` line at most (the instance's and those nested
// in it); the rest are counted.
constexpr size_t kMaxInstanceResults = 100;

// `digits` significant digits for the results. A worksheet with errors gets
// its errors beside the lines they point at, and no results. After each `use`
// line come the results of its instance: a change that moves only them would
// otherwise show in the diff in the summary line alone.
std::string annotatedSheet(const Calculation& calc, int digits);

// A result as the text shows it: `digits` significant digits in `unit`,
// without trailing zeros ("1.1 kW").
std::string annotatedValue(double si, const Unit& unit, int digits);

// A check's state as the text shows it: "check NAME: PASS  LHS OP RHS" (or FAIL).
std::string annotatedCheck(const Check& check, const CheckView& state, int digits);

}  // namespace calctrail
