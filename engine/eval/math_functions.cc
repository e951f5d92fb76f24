#include "engine/eval/math_functions.h"

#include <algorithm>
#include <cmath>

namespace calctrail {

const std::vector<MathFunction>& mathFunctions() {
  static const std::vector<MathFunction> table = {
      {"sqrt", MathRule::Sqrt, 1, 1, "sqrt", "square root"},
      {"sin", MathRule::TrigOfAngle, 1, 1, "sin", "sine of an angle"},
      {"cos", MathRule::TrigOfAngle, 1, 1, "cos", "cosine of an angle"},
      {"tan", MathRule::TrigOfAngle, 1, 1, "tan", "tangent of an angle"},
      {"asin", MathRule::InverseTrig, 1, 1, "asin", "inverse sine, an angle"},
      {"acos", MathRule::InverseTrig, 1, 1, "acos", "inverse cosine, an angle"},
      {"atan", MathRule::InverseTrig, 1, 1, "atan", "inverse tangent, an angle"},
      {"atan2", MathRule::Atan2, 2, 2, "atan2", "angle of the point (x, y): atan2(y, x)"},
      {"exp", MathRule::Dimensionless, 1, 1, "exp", "e to the power x"},
      {"ln", MathRule::Dimensionless, 1, 1, "ln", "natural logarithm"},
      {"log10", MathRule::Dimensionless, 1, 1, "log10", "common logarithm"},
      {"abs", MathRule::SameAsArg, 1, 1, "abs", "absolute value"},
      {"min", MathRule::AllAlike, 2, -1, "min", "the least of two or more alike values"},
      {"max", MathRule::AllAlike, 2, -1, "max", "the greatest of two or more alike values"},
  };
  return table;
}

const MathFunction* findMathFunction(std::string_view name) {
  for (const MathFunction& f : mathFunctions())
    if (name == f.name) return &f;
  return nullptr;
}

double applyMath(const MathFunction& f, const double* a, int n) {
  const std::string_view name = f.name;
  if (name == "sqrt") return std::sqrt(a[0]);
  if (name == "sin") return std::sin(a[0]);
  if (name == "cos") return std::cos(a[0]);
  if (name == "tan") return std::tan(a[0]);
  if (name == "asin") return std::asin(a[0]);
  if (name == "acos") return std::acos(a[0]);
  if (name == "atan") return std::atan(a[0]);
  if (name == "atan2") return std::atan2(a[0], a[1]);
  if (name == "exp") return std::exp(a[0]);
  if (name == "ln") return std::log(a[0]);
  if (name == "log10") return std::log10(a[0]);
  if (name == "abs") return std::fabs(a[0]);
  if (name == "min") return *std::min_element(a, a + n);
  if (name == "max") return *std::max_element(a, a + n);
  return NAN;
}

}  // namespace calctrail
