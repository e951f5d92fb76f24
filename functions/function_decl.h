// How a drive function is declared: once, with everything the engine, the
// trail, the CLI listing and docs/functions.md need. Nothing about a function
// is written twice: the listing and the docs are generated from these.
// Every text is a std::string_view into constant data (string literals, or
// texts joined at compile time: const_text.h), so that building the library
// at start-up makes no string. Never assign one a std::string: the view of a
// temporary dangles.
#pragma once

#include <cmath>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "engine/units/dimension.h"

namespace calctrail {

struct FunctionArg {
  std::string_view name;    // as in the formula: "F", "dm", "f", "alpha"
  Dimension dim;            // checked at compile time like any formula
  std::string_view description;  // "axial load on the screw"
  // A lead or a pitch: accepts a plain length (read as per revolution) or a
  // length per angle such as [mm/rev]. eval() always receives metres per
  // revolution.
  bool per_revolution = false;
  // The range met in practice, in SI values, from the materials or the practice
  // the argument stands for: a call outside it is evaluated, with a warning at
  // the call (a value off by 1000 is a slip of units). Infinite: no bound.
  double usual_min = -HUGE_VAL, usual_max = HUGE_VAL;
  // The unit the warning and the docs show the range in ("GPa"), and its SI value.
  std::string_view usual_unit;
  double usual_factor = 1.0;
  // What the range stands for, with its source ("steels 190 to 215 GPa ...").
  std::string_view usual_why;
  bool hasUsualRange() const { return usual_min > -HUGE_VAL || usual_max < HUGE_VAL; }
};

// Thrown by FunctionDecl::eval when an input is outside the validity limits.
// The message names the limit in words ("friction f = -0.1 must be >= 0").
class DomainError : public std::runtime_error {
 public:
  DomainError(int arg_index, const std::string& message)
      : std::runtime_error(message), arg_(arg_index) {}
  int arg() const { return arg_; }  // -1 when no single argument is to blame
 private:
  int arg_;
};

struct FunctionDecl {
  std::string_view name;     // short, in the words of the trade: "torque_raise"
  std::string_view summary;  // one line for listings
  std::vector<FunctionArg> args;
  // The last `repeat` arguments form a group that may be given again any number
  // of times (stages of a train, steps of a duty cycle): `overall_ratio(i1, i2,
  // ...)`. The declared args are the shortest call; a repeated argument is
  // named after its declared one with the group's number ("F3", "n3"). 0: a
  // fixed number of arguments.
  int repeat = 0;
  Dimension result;
  // The result is a lead (length per revolution): eval() returns metres per
  // revolution and the engine stores it as length per angle, so that
  // rpm * lead gives a speed without a lost 2*pi.
  bool result_per_revolution = false;
  std::string_view result_unit;  // the unit the trail shows by default ("N*m", "mm")
  // The formula in worksheet expression syntax over the argument names
  // ("F*dm/2 * (l + pi*f*dm/cos(alpha)) / (pi*dm - f*l/cos(alpha))"), so the
  // trail can show it and substitute values; or, for a table lookup or a
  // multi-step method, a plain description with formula_is_expression false.
  std::string_view formula;
  bool formula_is_expression = true;
  std::string_view limits;   // validity limits in words, as checked by eval()
  std::string_view source;   // published source: standard, handbook, textbook method
  std::string_view caution;  // for results that feed a safety decision; "" otherwise
  // One call inside the validity limits, in the SI values eval() receives:
  // the formula test evaluates the declared formula there and compares it
  // with eval(). Empty: the test samples values by dimension.
  std::vector<double> example;
  // SI values in (per-revolution args in metres per revolution), SI value out.
  // Throws DomainError outside the validity limits. Never returns NaN or inf.
  double (*eval)(const double* args) = nullptr;
  // With repeat > 0: the same, for any number n of arguments (the declared ones,
  // then whole groups); eval() is this with n = args.size().
  double (*eval_n)(const double* args, int n) = nullptr;
  // A doubt about a call that is within every argument's limits and usual
  // range, taken together (a column shorter than Euler's formula holds for):
  // "" when none, else the warning; *arg the argument to point at, or -1. Runs
  // on every call, so it builds no text unless there is a doubt.
  std::string (*advise)(const double* args, int n, int* arg) = nullptr;

  // The number of arguments a call with `n` arguments has valid: the declared
  // count, or with repeat > 0 that plus whole groups.
  bool takes(int n) const {
    const int fixed = static_cast<int>(args.size());
    if (repeat == 0) return n == fixed;
    return n >= fixed && (n - fixed) % repeat == 0;
  }
  // The declaration of argument k of a call (k may be past args.size() in a
  // repeated group).
  const FunctionArg& argAt(int k) const {
    const int fixed = static_cast<int>(args.size());
    if (k < fixed || repeat == 0) return args[static_cast<size_t>(k)];
    return args[static_cast<size_t>(fixed - repeat + (k - fixed) % repeat)];
  }
  // The name of argument k of a call: "F3" for the third step of a group whose
  // declared names end in 1 and 2 ("F1", "n1", "q1", "F2", ...).
  std::string argName(int k) const;
};

namespace fn {
// An argument as the declarations write it: arg("F", force(), "axial load").
inline FunctionArg arg(std::string_view name, Dimension dim, std::string_view description,
                       bool per_rev = false) {
  FunctionArg x;
  x.name = name;
  x.dim = dim;
  x.description = description;
  x.per_revolution = per_rev;
  return x;
}
// The same argument with a usual range (SI values), shown in `unit` (SI value
// `factor`), and what the range stands for.
inline FunctionArg usual(FunctionArg a, double lo, double hi, std::string_view unit, double factor,
                         std::string_view why) {
  a.usual_min = lo;
  a.usual_max = hi;
  a.usual_unit = unit;
  a.usual_factor = factor;
  a.usual_why = why;
  return a;
}
}  // namespace fn

// Every function of the library, in a stable order (listing order).
const std::vector<FunctionDecl>& functionLibrary();

// nullptr when no function has this name.
const FunctionDecl* findFunction(std::string_view name);

}  // namespace calctrail
