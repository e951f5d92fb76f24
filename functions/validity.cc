#include "functions/validity.h"

#include <cmath>
#include <cstdio>

namespace calctrail::fn {

namespace {
constexpr double kPi = 3.14159265358979323846;

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
  }
  return {1.0, ""};
}
}  // namespace

std::string num(double v) {
  if (std::isnan(v)) return "NaN";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.4g", v);
  return buf;
}

std::string show(double si, Show how) {
  const Shown s = unitOf(how);
  return num(si / s.factor) + s.unit;
}

void fail(int arg, const std::string& message) { throw DomainError(arg, message); }

double finite(const double* a, int i, const char* what, Show how) {
  const double v = a[i];
  if (!std::isfinite(v)) fail(i, std::string(what) + " = " + show(v, how) + " must be a finite number");
  return v;
}

double positive(const double* a, int i, const char* what, Show how) {
  const double v = finite(a, i, what, how);
  if (!(v > 0)) fail(i, std::string(what) + " = " + show(v, how) + " must be > 0");
  return v;
}

double nonNegative(const double* a, int i, const char* what, Show how) {
  const double v = finite(a, i, what, how);
  if (!(v >= 0)) fail(i, std::string(what) + " = " + show(v, how) + " must be >= 0");
  return v;
}

double atMost(const double* a, int i, double limit, const char* what, Show how) {
  const double v = a[i];
  if (!(v <= limit))
    fail(i, std::string(what) + " = " + show(v, how) + " must be <= " + show(limit, how));
  return v;
}

double fraction(const double* a, int i, const char* what) {
  const double v = positive(a, i, what, Show::Plain);
  if (!(v <= 1)) fail(i, std::string(what) + " = " + num(v) + " must be <= 1 (write 95 % or 0.95)");
  return v;
}

double friction(const double* a, int i, const char* what) {
  const double v = nonNegative(a, i, what, Show::Plain);
  if (!(v <= 1))
    fail(i, std::string(what) + " = " + num(v) +
                " must be <= 1: no metal pair of the trade has a higher coefficient");
  return v;
}

double flankAngle(const double* a, int i, const char* what) {
  nonNegative(a, i, what, Show::Angle);
  return atMost(a, i, 45.0 * kPi / 180.0, what, Show::Angle);
}

double count(const double* a, int i, const char* what) {
  const double v = positive(a, i, what, Show::Plain);
  if (!(v >= 1) || std::fabs(v - std::round(v)) > 1e-9)
    fail(i, std::string(what) + " = " + num(v) + " must be a whole number >= 1");
  return std::round(v);
}

double result(double v) {
  if (!std::isfinite(v))
    fail(-1, "the result is not a finite number (" + num(v) + "): the inputs are outside any useful range");
  return v;
}

}  // namespace calctrail::fn
