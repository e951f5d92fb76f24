#include "engine/report/number_format.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace calctrail {

namespace {
std::string fixed(double v, int decimals) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", std::max(0, decimals), v);
  std::string s = buf;
  if (s == "-0" || s.rfind("-0.", 0) == 0) {
    // -0.000 after rounding is 0.000: a sign on a zero says nothing true.
    if (s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  }
  return s;
}
}  // namespace

std::string formatNumber(double value, int digits) {
  digits = std::clamp(digits, 1, 17);
  if (value == 0) return digits > 1 ? "0." + std::string(static_cast<size_t>(digits - 1), '0') : "0";
  if (!std::isfinite(value)) return std::isnan(value) ? "NaN" : (value > 0 ? "inf" : "-inf");
  const double a = std::fabs(value);
  // Round to the requested digits first, so 999.96 with 4 digits is 1000.
  char probe[64];
  std::snprintf(probe, sizeof probe, "%.*e", digits - 1, value);
  const double rounded = std::strtod(probe, nullptr);
  const int exp10 = static_cast<int>(std::floor(std::log10(std::fabs(rounded))));
  if (a >= 1e-3 && std::fabs(rounded) < 1e6) {
    // Never round away integer digits: 15184.36 stays 15184.
    const int decimals = std::max(0, digits - 1 - exp10);
    return fixed(exp10 >= digits - 1 ? value : rounded, decimals);
  }
  const int eng = static_cast<int>(std::floor(exp10 / 3.0)) * 3;
  const double mantissa = rounded / std::pow(10.0, eng);
  const int mant_exp = exp10 - eng;  // 0, 1 or 2
  std::string out = fixed(mantissa, std::max(0, digits - 1 - mant_exp));
  return out + "e" + std::to_string(eng);
}

std::string joinNumberUnit(const std::string& number, const std::string& unit) {
  if (unit.empty() || unit == "1") return number;
  // SI Brochure: a space between number and unit, "%" included; none
  // before the degree, minute and second of plane angle.
  if (unit == "\u00B0" || unit == "\u2032" || unit == "\u2033") return number + unit;
  return number + " " + unit;
}

std::string formatQuantity(double si, const Unit& unit, int digits, bool pretty) {
  return joinNumberUnit(formatNumber(unit.fromSI(si), digits), pretty ? unit.pretty() : unit.text);
}

std::string formatExact(double value) {
  char buf[40];
  for (int precision = 15; precision <= 17; ++precision) {
    std::snprintf(buf, sizeof buf, "%.*g", precision, value);
    if (std::strtod(buf, nullptr) == value) break;
  }
  return buf;
}

}  // namespace calctrail
