// Engineering exponents for people: the trail writes very large and very
// small values as "1.234e6" (compact, diff-friendly); the typeset formats
// show them the SI Brochure's way, "1.234 × 10⁶".
#pragma once

#include <string>

namespace calctrail {

// Rewrites every number in e-notation inside `text` ("250.0e-9 m",
// "1.5e9 W") as "250.0 × 10⁻⁹ m", "1.5 × 10⁹ W". Names that merely contain
// an "e" between digits (x1e3) are left alone.
std::string timesTenPowers(const std::string& text);

}  // namespace calctrail
