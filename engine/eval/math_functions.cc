#include "engine/eval/math_functions.h"

#include <algorithm>
#include <cmath>

#include "engine/util/math_constants.h"

namespace calctrail {

bool multipleOfRightAngle(double x, long* quarter_turns) {
  if (x == 0 || !std::isfinite(x)) return false;  // sin(0) and tan(0) are exact already
  const double q = x / (kPi / 2);
  const double k = std::round(q);
  // A few ulps of the argument: 90 deg, pi/2 and 3*90 deg, however reached.
  if (k == 0 || std::fabs(q - k) > 4e-16 * std::fabs(k) + 1e-15 || std::fabs(k) > 1e15) return false;
  *quarter_turns = static_cast<long>(k);
  return true;
}

namespace {
int quadrant(long k) { return static_cast<int>(((k % 4) + 4) % 4); }

double sqrt1(double x) { return std::sqrt(x); }
double asin1(double x) { return std::asin(x); }
double acos1(double x) { return std::acos(x); }
double atan1(double x) { return std::atan(x); }
double exp1(double x) { return std::exp(x); }
double ln1(double x) { return std::log(x); }
double log101(double x) { return std::log10(x); }
double abs1(double x) { return std::fabs(x); }
double atan2N(const double* a, int) { return std::atan2(a[0], a[1]); }
double minN(const double* a, int n) { return *std::min_element(a, a + n); }
double maxN(const double* a, int n) { return *std::max_element(a, a + n); }
}  // namespace

double exactSin(double x) {
  long k;
  if (!multipleOfRightAngle(x, &k)) return std::sin(x);
  static constexpr double kSin[4] = {0.0, 1.0, 0.0, -1.0};
  return kSin[quadrant(k)];
}

double exactCos(double x) {
  long k;
  if (!multipleOfRightAngle(x, &k)) return std::cos(x);
  static constexpr double kCos[4] = {1.0, 0.0, -1.0, 0.0};
  return kCos[quadrant(k)];
}

double exactTan(double x) {
  long k;
  if (!multipleOfRightAngle(x, &k)) return std::tan(x);
  return k % 2 == 0 ? 0.0 : NAN;  // an odd multiple of 90 deg: infinite, explained as such
}

const std::vector<MathFunction>& mathFunctions() {
  static const std::vector<MathFunction> table = {
      {"sqrt", MathRule::Sqrt, 1, 1, "sqrt", "square root", sqrt1, nullptr},
      {"sin", MathRule::TrigOfAngle, 1, 1, "sin", "sine of an angle", exactSin, nullptr},
      {"cos", MathRule::TrigOfAngle, 1, 1, "cos", "cosine of an angle", exactCos, nullptr},
      {"tan", MathRule::TrigOfAngle, 1, 1, "tan", "tangent of an angle", exactTan, nullptr},
      {"asin", MathRule::InverseTrig, 1, 1, "asin", "inverse sine, an angle", asin1, nullptr},
      {"acos", MathRule::InverseTrig, 1, 1, "acos", "inverse cosine, an angle", acos1, nullptr},
      {"atan", MathRule::InverseTrig, 1, 1, "atan", "inverse tangent, an angle", atan1, nullptr},
      {"atan2", MathRule::Atan2, 2, 2, "atan2", "angle of the point (x, y): atan2(y, x)", nullptr, atan2N},
      {"exp", MathRule::Dimensionless, 1, 1, "exp", "e to the power x", exp1, nullptr},
      {"ln", MathRule::Dimensionless, 1, 1, "ln", "natural logarithm", ln1, nullptr},
      {"log10", MathRule::Dimensionless, 1, 1, "log10", "common logarithm", log101, nullptr},
      {"abs", MathRule::SameAsArg, 1, 1, "abs", "absolute value", abs1, nullptr},
      {"min", MathRule::AllAlike, 2, -1, "min", "the least of two or more alike values", nullptr, minN},
      {"max", MathRule::AllAlike, 2, -1, "max", "the greatest of two or more alike values", nullptr, maxN},
  };
  return table;
}

const MathFunction* findMathFunction(std::string_view name) {
  // The first letter rejects most names (a drive function's, asked first by
  // some callers) without measuring the table's C string.
  if (name.empty()) return nullptr;
  for (const MathFunction& f : mathFunctions())
    if (f.name[0] == name[0] && name == f.name) return &f;
  return nullptr;
}

double applyMath(const MathFunction& f, const double* a, int n) {
  return f.eval1 ? f.eval1(a[0]) : f.evalN(a, n);
}

}  // namespace calctrail
