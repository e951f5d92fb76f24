// How a drive function is declared: once, with everything the engine, the
// trail, the CLI listing and docs/functions.md need. Nothing about a function
// is written twice: the listing and the docs are generated from these.
#pragma once

#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "engine/units/dimension.h"

namespace calctrail {

struct FunctionArg {
  std::string name;         // as in the formula: "F", "dm", "f", "alpha"
  Dimension dim;            // checked at compile time like any formula
  std::string description;  // "axial load on the screw"
  // A lead or a pitch: accepts a plain length (read as per revolution) or a
  // length per angle such as [mm/rev]. eval() always receives metres per
  // revolution.
  bool per_revolution = false;
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
  std::string name;      // short, in the words of the trade: "torque_raise"
  std::string summary;   // one line for listings
  std::vector<FunctionArg> args;
  Dimension result;
  // The result is a lead (length per revolution): eval() returns metres per
  // revolution and the engine stores it as length per angle, so that
  // rpm * lead gives a speed without a lost 2*pi.
  bool result_per_revolution = false;
  std::string result_unit;  // the unit the trail shows by default ("N*m", "mm")
  // The formula in worksheet expression syntax over the argument names
  // ("F*dm/2 * (l + pi*f*dm/cos(alpha)) / (pi*dm - f*l/cos(alpha))"), so the
  // trail can show it and substitute values; or, for a table lookup or a
  // multi-step method, a plain description with formula_is_expression false.
  std::string formula;
  bool formula_is_expression = true;
  std::string limits;   // validity limits in words, as checked by eval()
  std::string source;   // published source: standard, handbook, textbook method
  std::string caution;  // for results that feed a safety decision; "" otherwise
  // One call inside the validity limits, in the SI values eval() receives:
  // the formula test evaluates the declared formula there and compares it
  // with eval(). Empty: the test samples values by dimension.
  std::vector<double> example;
  // SI values in (per-revolution args in metres per revolution), SI value out.
  // Throws DomainError outside the validity limits. Never returns NaN or inf.
  double (*eval)(const double* args) = nullptr;
};

namespace fn {
// An argument as the declarations write it: arg("F", force(), "axial load").
inline FunctionArg arg(const char* name, Dimension dim, const char* description, bool per_rev = false) {
  FunctionArg x;
  x.name = name;
  x.dim = dim;
  x.description = description;
  x.per_revolution = per_rev;
  return x;
}
}  // namespace fn

// Every function of the library, in a stable order (listing order).
const std::vector<FunctionDecl>& functionLibrary();

// nullptr when no function has this name.
const FunctionDecl* findFunction(std::string_view name);

}  // namespace calctrail
