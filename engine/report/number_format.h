// Numbers for people: significant digits, no float noise, engineering
// exponents (multiples of 3) for very large and very small values. Machine
// formats (JSON) use formatExact instead: full precision, shortest text.
// Every number calctrail writes is turned into text here, with fmt.
#pragma once

#include <string>
#include <string_view>

#include <fmt/format.h>

#include "engine/units/unit.h"
#include "engine/util/exact_number.h"  // formatExact: its callers in report/ include this header

namespace calctrail {

// A number as people read it, before it is written in a format's own way:
// the digits and, for engineering notation, the power of ten kept apart.
struct ShownNumber {
  std::string digits;    // sign, digits and decimal point: "-250.0", "15184", "0.3500"
  std::string exponent;  // after the "e": "-9", "6" ("" when there is none); literals keep theirs ("+03")
  char e = 'e';          // the exponent mark, as a literal writes it ('e' or 'E')
};

// How the power of ten is written: "1.500e9" (plain text, diff-friendly) or
// "1.500 × 10⁹" (the SI Brochure's way, for Markdown and HTML).
enum class NumberStyle { ENotation, TimesTen };

// `value` rounded to `digits` significant digits (clamped to 1..17): 15184.36 -> "15184" (never rounds
// away integer digits), 0.35 -> "0.3500", 2.5e-7 -> "250.0" e "-9", 1.5e9 -> "1.500" e "9". Exact for
// every finite double, subnormals and the largest included; -0 is "0.000".
ShownNumber roundNumber(double value, int digits);

// The first step of roundNumber: the significant digits of a finite, nonzero
// `magnitude` (> 0) correctly rounded to `digits` (1..17), and the power of
// ten of the first of them after rounding (999.96 at 4 digits: "1000", 3).
struct RoundedDigits {
  char digits[17];
  int count = 0;
  int exp10 = 0;
};
// Exact for every positive double, by fmt.
RoundedDigits roundDigitsExact(double magnitude, int digits);
// The same in a few double operations, for the common case: false where it
// cannot be sure (near a tie, or 10^k not exact), and roundNumber then asks
// roundDigitsExact. The tests hold the two equal over many values.
bool roundDigitsFast(double magnitude, int digits, RoundedDigits* out);

// A numeric literal as the worksheet writes it ("2e-7", "0.35"), unrounded.
ShownNumber writtenNumber(std::string_view literal);

// Appends `n` in `style` to `out`.
void appendNumber(fmt::memory_buffer& out, const ShownNumber& n, NumberStyle style);
std::string numberText(const ShownNumber& n, NumberStyle style = NumberStyle::ENotation);

// roundNumber written in e-notation: "15184", "0.3500", "250.0e-9", "1.500e9".
std::string formatNumber(double value, int digits);

// A value given in SI, shown in `unit`: "6.400 kN", "0.3500", "15.94 N·m".
// `pretty` selects the human spelling of the unit (N·m) over ASCII (N*m).
std::string formatQuantity(double si, const Unit& unit, int digits, bool pretty = true);

// "6.4 kN", "15°", "35 %": a number and a unit spelled for people (no unit
// for plain numbers).
std::string joinNumberUnit(const std::string& number, const std::string& unit);
// How joinNumberUnit puts `unit` after a number: not at all (a plain number),
// right after it ("15°"), or after a space ("6.4 kN").
enum class UnitJoin { None, Adjoined, Spaced };
UnitJoin unitJoin(std::string_view unit);

}  // namespace calctrail
