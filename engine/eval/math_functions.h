// The math functions every worksheet has (contract): their arity and how
// each treats dimensions. Trigonometric functions take angles (or plain
// radians); inverse ones return angles.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

enum class MathRule {
  Sqrt,          // halves every exponent (an area gives a length)
  TrigOfAngle,   // sin cos tan: angle or dimensionless in, dimensionless out
  InverseTrig,   // asin acos atan: dimensionless in, angle out
  Atan2,         // two alike in, angle out
  Dimensionless, // exp ln log10: dimensionless in and out
  SameAsArg,     // abs
  AllAlike,      // min max: two or more alike, same out
};

struct MathFunction {
  const char* name;
  MathRule rule;
  int min_args, max_args;  // max_args -1: no limit
  const char* muparser_name;
  const char* summary;
};

const std::vector<MathFunction>& mathFunctions();
const MathFunction* findMathFunction(std::string_view name);
double applyMath(const MathFunction& f, const double* args, int n);

}  // namespace calctrail
