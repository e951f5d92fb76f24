#include "functions/validity.h"

#include <charconv>
#include <cmath>

namespace calctrail::fn {

namespace {

struct Shown {
  double factor;
  const char* unit;
};

Shown unitOf(Show how) {
  switch (how) {
    case Show::Plain: return {1.0, ""};
    case Show::Force: return {1.0, " N"};
    case Show::Length: return {1e-3, " mm"};
    case Show::Lead: return {1e-3, " mm/rev"};
    case Show::Torque: return {1.0, " N*m"};
    case Show::Stress: return {1e6, " MPa"};
    case Show::Modulus: return {1e9, " GPa"};
    case Show::Angle: return {kPi / 180.0, " deg"};
    case Show::Speed: return {2.0 * kPi / 60.0, " rpm"};
    case Show::Power: return {1e3, " kW"};
    case Show::Density: return {1.0, " kg/m^3"};
    case Show::Mass: return {1.0, " kg"};
    case Show::Inertia: return {1.0, " kg*m^2"};
    case Show::Time: return {1.0, " s"};
  }
  return {1.0, ""};
}
}  // namespace

std::string num(double v) {
  if (std::isnan(v)) return "NaN";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  // std::to_chars with a precision is printf's %.4g by definition (C++17
  // [charconv.to.chars]), without snprintf's stream set-up: the library's
  // texts call this some 250 times at first use (docs/performance.md).
  // A whole number below 10^4 is printed whole by %.4g.
  if (v == std::trunc(v) && std::fabs(v) < 1e4 && !(v == 0 && std::signbit(v)))
    return std::to_string(static_cast<int>(v));
  char buf[32];
  const std::to_chars_result r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::general, 4);
  return std::string(buf, r.ptr);
}

std::string show(double si, Show how) {
  const Shown s = unitOf(how);
  return num(si / s.factor) + s.unit;
}

FunctionArg usually(FunctionArg a, double lo, double hi, Show how, const char* why) {
  const Shown s = unitOf(how);
  const std::string_view unit = s.unit[0] == ' ' ? s.unit + 1 : s.unit;
  return usual(a, lo, hi, unit, s.factor, why);
}

void fail(int arg, const std::string& message) { throw DomainError(arg, message); }

void failLimit(Limit limit, int arg, const char* what, double v, Show how, double bound) {
  const std::string head = std::string(what) + " = ";
  switch (limit) {
    case Limit::Finite: fail(arg, head + show(v, how) + " must be a finite number");
    case Limit::Positive: fail(arg, head + show(v, how) + " must be > 0");
    case Limit::NonNegative: fail(arg, head + show(v, how) + " must be >= 0");
    case Limit::AtMost: fail(arg, head + show(v, how) + " must be <= " + show(bound, how));
    case Limit::Fraction: fail(arg, head + num(v) + " must be <= 1 (write 95 % or 0.95)");
    case Limit::Friction:
      fail(arg, head + num(v) + " must be <= 1: no metal pair of the trade has a higher coefficient");
    case Limit::Whole: fail(arg, head + num(v) + " must be a whole number >= 1");
    case Limit::Result:
      fail(arg, "the result is not a finite number (" + num(v) +
                    "): the inputs are outside any useful range");
  }
  fail(arg, head + show(v, how) + " is outside its limits");
}

}  // namespace calctrail::fn
