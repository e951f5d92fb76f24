// The math functions every worksheet has (contract): their arity, how each
// treats dimensions, and their arithmetic. The same functions serve the
// compiled formulas (muparser calls them) and the interpreter that explains
// a failure, so the two agree on every value. Trigonometric functions take
// angles (or plain radians); inverse ones return angles.
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
  /// The name in a worksheet, and in the compiled text.
  const char* name;
  /// How the function treats dimensions.
  MathRule rule;
  /// How many arguments it takes; max_args -1: no limit.
  int min_args, max_args;
  /// Kept for the callers of the old table: the name muparser knows it by.
  const char* muparser_name;
  /// One line for listings.
  const char* summary;
  /// The arithmetic of a one-argument function (nullptr for the others).
  double (*eval1)(double);
  /// The arithmetic of a function of two or more arguments (nullptr for the others).
  double (*evalN)(const double* args, int n);
};

const std::vector<MathFunction>& mathFunctions();
const MathFunction* findMathFunction(std::string_view name);
double applyMath(const MathFunction& f, const double* args, int n);

// sin, cos and tan exact at every nonzero multiple of 90 deg: cos(90 deg) is
// 0, not 6.1e-17, so 1/cos(90 deg) is a division by zero and tan(90 deg) has
// no value (NaN), where the plain functions give 1.6e16 and a silent number.
double exactSin(double x);
double exactCos(double x);
double exactTan(double x);
// True when x is a nonzero whole multiple of 90 deg (within rounding), and
// that multiple in *quarter_turns.
bool multipleOfRightAngle(double x, long* quarter_turns);

}  // namespace calctrail
