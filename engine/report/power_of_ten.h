// Engineering exponents for people: the trail writes very large and very
// small values as "1.234e6" (compact, diff-friendly); the typeset formats
// show them the SI Brochure's way, "1.234 × 10⁶".
#pragma once

#include <string>
#include <string_view>

namespace calctrail {

// An exponent as written after the "e" ("-9", "+03", "12") in superscript
// digits: "⁻⁹", "³", "¹²". A "+" and leading zeros are dropped.
std::string superscriptExponent(std::string_view exponent);

// Rewrites every number in e-notation inside `text` ("250.0e-9 m",
// "1.5e9 W") as "250.0 × 10⁻⁹ m", "1.5 × 10⁹ W". Names that merely contain
// an "e" between digits (x1e3) are left alone. For text the worksheet
// writes (a literal inside a formula); numbers the engine computed are
// written by appendNumber and never re-read.
std::string timesTenPowers(const std::string& text);

}  // namespace calctrail
