#include "engine/report/number_format.h"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstdlib>

#include "engine/report/power_of_ten.h"

namespace calctrail {

namespace {
// 10^k for k = 0..22, each exact in a double: a product or a quotient by one
// is correctly rounded, so it is within half an ulp of the exact result.
constexpr double kPowersOfTen[] = {1e0,  1e1,  1e2,  1e3,  1e4,  1e5,  1e6,  1e7,  1e8,  1e9,  1e10, 1e11,
                                   1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};
constexpr int kMostExactPower = 22;
// roundDigitsFast keeps the scaled value below 10^15 < 2^50: an integer part and
// a fraction that a double holds exactly.
constexpr int kMostFastDigits = 15;

void writeDigits(uint64_t n, int count, RoundedDigits* out) {
  out->count = count;
  for (int i = count - 1; i >= 0; --i, n /= 10) out->digits[i] = static_cast<char>('0' + n % 10);
}
}  // namespace

RoundedDigits roundDigitsExact(double magnitude, int digits) {
  // fmt gives exactly `digits` correctly rounded digits and the exponent
  // after rounding (999.96 -> "1.000e+03").
  fmt::memory_buffer sci;
  fmt::format_to(std::back_inserter(sci), "{:.{}e}", magnitude, digits - 1);
  sci.push_back('\0');  // for atoi; `text` is without it
  const std::string_view text(sci.data(), sci.size() - 1);
  const size_t at = text.find('e');
  RoundedDigits out;
  out.exp10 = std::atoi(sci.data() + at + 1);
  for (size_t i = 0; i < at; ++i)
    if (text[i] >= '0' && text[i] <= '9') out.digits[out.count++] = text[i];
  return out;
}

bool roundDigitsFast(double magnitude, int digits, RoundedDigits* out) {
  if (digits > kMostFastDigits) return false;
  // log10(2) times the binary exponent: the decimal exponent or one below it.
  int exp10 = static_cast<int>(std::floor(std::ilogb(magnitude) * 0.30102999566398120));
  for (int tries = 0; tries < 3; ++tries) {
    const int k = digits - 1 - exp10;  // scaled by 10^k, the digits are the integer part
    if (k > kMostExactPower || k < -kMostExactPower) return false;
    const double scaled = k >= 0 ? magnitude * kPowersOfTen[k] : magnitude / kPowersOfTen[-k];
    if (scaled >= kPowersOfTen[digits]) {
      ++exp10;
      continue;
    }
    if (scaled < kPowersOfTen[digits - 1]) {
      --exp10;
      continue;
    }
    const double whole = std::floor(scaled);
    const double fraction = scaled - whole;
    // The exact product may lie up to half an ulp from `scaled`: within two
    // ulps of a tie it may round the other way (or be a tie), and fmt decides.
    if (std::fabs(fraction - 0.5) <= scaled * 0x1p-51) return false;
    uint64_t n = static_cast<uint64_t>(whole) + (fraction > 0.5 ? 1 : 0);
    if (static_cast<double>(n) == kPowersOfTen[digits]) {  // 999.96 -> 1000: one digit up
      n /= 10;
      ++exp10;
    }
    writeDigits(n, digits, out);
    out->exp10 = exp10;
    return true;
  }
  return false;
}

ShownNumber roundNumber(double value, int digits) {
  digits = std::clamp(digits, 1, 17);
  if (value == 0) {
    return {digits > 1 ? "0." + std::string(static_cast<size_t>(digits - 1), '0') : "0", "", 'e'};
  }
  if (!std::isfinite(value)) return {std::isnan(value) ? "NaN" : (value > 0 ? "inf" : "-inf"), "", 'e'};
  // Round once, in decimal (rounding is the same either side of zero). All
  // that follows moves the decimal point in text, so no power of ten is ever
  // computed in floating point (1e-324 underflows to 0, 1e309 overflows).
  const double magnitude = std::fabs(value);
  RoundedDigits rounded;
  if (!roundDigitsFast(magnitude, digits, &rounded)) rounded = roundDigitsExact(magnitude, digits);
  const int exp10 = rounded.exp10;
  const std::string_view mantissa(rounded.digits, static_cast<size_t>(rounded.count));  // no sign, no point
  // Digits before the point at `point`, the rest after it.
  auto place = [&](int point) {
    std::string out;
    out.reserve(mantissa.size() + static_cast<size_t>(std::abs(point)) + 3);
    if (value < 0) out += '-';
    const size_t m = mantissa.size();
    if (point <= 0) {
      out += "0.";
      out.append(static_cast<size_t>(-point), '0');
      out += mantissa;
      return out;
    }
    const size_t head = static_cast<size_t>(point);
    out += mantissa.substr(0, std::min(head, m));
    if (head > m) out.append(head - m, '0');
    if (head < m) {
      out += '.';
      out += mantissa.substr(head);
    }
    return out;
  };
  if (magnitude >= 1e-3 && exp10 < 6) {
    // Never round away integer digits: 15184.36 stays 15184.
    if (exp10 >= digits - 1) return {fmt::format("{:.0f}", value), "", 'e'};
    return {place(exp10 + 1), "", 'e'};
  }
  const int eng = (exp10 >= 0 ? exp10 / 3 : -((-exp10 + 2) / 3)) * 3;
  return {place(exp10 - eng + 1), std::to_string(eng), 'e'};
}

ShownNumber writtenNumber(std::string_view literal) {
  const size_t at = literal.find_first_of("eE");
  if (at == std::string_view::npos) return {std::string(literal), "", 'e'};
  return {std::string(literal.substr(0, at)), std::string(literal.substr(at + 1)), literal[at]};
}

void appendNumber(fmt::memory_buffer& out, const ShownNumber& n, NumberStyle style) {
  out.append(n.digits.data(), n.digits.data() + n.digits.size());
  if (n.exponent.empty()) return;
  if (style == NumberStyle::ENotation) {
    out.push_back(n.e);
    out.append(n.exponent.data(), n.exponent.data() + n.exponent.size());
    return;
  }
  const std::string_view times = " \u00D7 10";
  out.append(times.data(), times.data() + times.size());
  const std::string power = superscriptExponent(n.exponent);
  out.append(power.data(), power.data() + power.size());
}

std::string numberText(const ShownNumber& n, NumberStyle style) {
  fmt::memory_buffer out;
  appendNumber(out, n, style);
  return fmt::to_string(out);
}

std::string formatNumber(double value, int digits) { return numberText(roundNumber(value, digits)); }

UnitJoin unitJoin(std::string_view unit) {
  if (unit.empty() || unit == "1") return UnitJoin::None;  // compared by length first, inline
  // SI Brochure: a space between number and unit, "%" included; none
  // before the degree, minute and second of plane angle.
  if (unit == "\u00B0" || unit == "\u2032" || unit == "\u2033") return UnitJoin::Adjoined;
  return UnitJoin::Spaced;
}

std::string joinNumberUnit(const std::string& number, const std::string& unit) {
  const UnitJoin join = unitJoin(unit);
  if (join == UnitJoin::None) return number;
  std::string out;
  out.reserve(number.size() + 1 + unit.size());
  out += number;
  if (join == UnitJoin::Spaced) out += ' ';
  out += unit;
  return out;
}

std::string formatQuantity(double si, const Unit& unit, int digits, bool pretty) {
  return joinNumberUnit(formatNumber(unit.fromSI(si), digits), pretty ? unit.pretty() : unit.text);
}

// fmt's "{}" is the shortest text that reads back to the same double
// (Dragonbox). It writes integers without a point ("12000"), keeps the sign
// of -0, and switches to e-notation below 1e-4 and from 1e16 up.
}  // namespace calctrail
