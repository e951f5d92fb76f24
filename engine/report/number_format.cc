#include "engine/report/number_format.h"

#include <algorithm>
#include <cmath>
#include <cstdlib>

#include "engine/report/power_of_ten.h"

namespace calctrail {

ShownNumber roundNumber(double value, int digits) {
  digits = std::clamp(digits, 1, 17);
  if (value == 0) {
    return {digits > 1 ? "0." + std::string(static_cast<size_t>(digits - 1), '0') : "0", "", 'e'};
  }
  if (!std::isfinite(value)) return {std::isnan(value) ? "NaN" : (value > 0 ? "inf" : "-inf"), "", 'e'};
  // Round once, in decimal: fmt gives exactly `digits` correctly rounded
  // digits and the exponent after rounding (999.96 -> "1.000e+03"). All that
  // follows moves the decimal point in text, so no power of ten is ever
  // computed in floating point (1e-324 underflows to 0, 1e309 overflows).
  fmt::memory_buffer sci;
  fmt::format_to(std::back_inserter(sci), "{:.{}e}", value, digits - 1);
  sci.push_back('\0');  // for atoi; `text` is without it
  const std::string_view text(sci.data(), sci.size() - 1);
  const size_t at = text.find('e');
  const int exp10 = std::atoi(sci.data() + at + 1);
  std::string mantissa;  // the significant digits, no sign, no point
  mantissa.reserve(at);
  for (size_t i = 0; i < at; ++i)
    if (text[i] >= '0' && text[i] <= '9') mantissa += text[i];
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
    out.append(mantissa, 0, std::min(head, m));
    if (head > m) out.append(head - m, '0');
    if (head < m) {
      out += '.';
      out.append(mantissa, head, std::string::npos);
    }
    return out;
  };
  if (std::fabs(value) >= 1e-3 && exp10 < 6) {
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

std::string joinNumberUnit(const std::string& number, const std::string& unit) {
  const std::string_view u = unit;  // compared by length first, inline
  if (u.empty() || u == "1") return number;
  // SI Brochure: a space between number and unit, "%" included; none
  // before the degree, minute and second of plane angle.
  if (u == "\u00B0" || u == "\u2032" || u == "\u2033") return number + unit;
  std::string out;
  out.reserve(number.size() + 1 + unit.size());
  out += number;
  out += ' ';
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
