// Numbers for people: significant digits, no float noise, engineering
// exponents (multiples of 3) for very large and very small values. Machine
// formats (JSON) use full precision instead and never come through here.
#pragma once

#include <string>

#include "engine/units/unit.h"

namespace calctrail {

// 15184.36 -> "15184" (never rounds away integer digits), 0.35 -> "0.3500",
// 2.5e-7 -> "250.0e-9", 1.5e9 -> "1.500e9". digits is clamped to 1..17.
std::string formatNumber(double value, int digits);

// A value given in SI, shown in `unit`: "6.400 kN", "0.3500", "15.94 N·m".
// `pretty` selects the human spelling of the unit (N·m) over ASCII (N*m).
std::string formatQuantity(double si, const Unit& unit, int digits, bool pretty = true);

// "6.4 kN", "15°", "35 %": a number and a unit spelled for people (no unit
// for plain numbers).
std::string joinNumberUnit(const std::string& number, const std::string& unit);

// Full precision, shortest text that reads back to the same double.
std::string formatExact(double value);

}  // namespace calctrail
