// The value of a number as a formula writes it ("0.25", "1e-3", "4200").
#pragma once

#include <string_view>

namespace calctrail {

// The double nearest to `literal`, digits with an optional fraction and
// exponent as the expression parser scans them: what strtod gives, rounded
// the same way. *in_range is false where strtod says ERANGE: too large for a
// double, or too small to be a normal one.
double decimalValue(std::string_view literal, bool* in_range);

}  // namespace calctrail
