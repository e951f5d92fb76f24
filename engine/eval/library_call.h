// The boundary between a formula and a drive function, and the one place the
// per-revolution rule lives. A lead written per angle ([mm/rev], stored in
// metres per radian) reaches the function in metres per revolution, and a
// lead the function returns per revolution is stored per radian, so that
// rpm * lead is a speed with no 2*pi lost. Which arguments are converted is
// fixed per call site when the formula is compiled (from the argument's
// dimension), so the arithmetic, the explaining interpreter and the trail
// all call through here and agree.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "engine/units/dimension.h"
#include "functions/function_decl.h"

namespace calctrail {

// Counts the library calls of one evaluation context that had a doubt
// (functions/plausibility.h): the compiled arithmetic only counts them, and
// the evaluation explains them afterwards with the tree interpreter, which
// knows where each call is written.
struct DoubtCounter {
  /// Calls with a doubt so far.
  uint64_t count = 0;
};

struct LibraryCall {
  /// The function called.
  const FunctionDecl* decl = nullptr;
  /// Bit k set: argument k is a length per angle, passed per revolution
  /// (arguments past 32 of a repeated group are never leads: none is declared so).
  uint32_t per_angle_args = 0;
  /// Where a doubtful call is counted; nullptr: not counted. Not part of the
  /// call's identity (operator==).
  DoubtCounter* doubts = nullptr;

  // The call site's conversions, from the dimensions of its arguments.
  static LibraryCall at(const FunctionDecl& decl, const std::vector<Dimension>& arg_dims);

  // SI values in, SI value out, with the per-revolution conversions. Throws
  // DomainError like FunctionDecl::eval. `n` is the number of arguments. A
  // doubtful call is counted in *doubts.
  double operator()(const double* args, int n) const;

  // The arguments as the function receives them (leads per revolution), into
  // *out; returns out->data().
  const double* converted(const double* args, int n, std::vector<double>* out) const;

  // The name the compiled text calls it by: the function's own name, with a
  // suffix when any argument is converted ("lead_angle__r2"), so that each
  // variant is one muparser function.
  std::string compiledName() const;

  friend bool operator==(const LibraryCall& a, const LibraryCall& b) {
    return a.decl == b.decl && a.per_angle_args == b.per_angle_args;
  }
};

// Kept for the trail, which shows what a function sees: one argument's value
// as passed, and a result as stored. Both apply the rule above.
double argumentToLibrary(double si, bool per_revolution, const Dimension& given);
double resultFromLibrary(double value, bool per_revolution);

}  // namespace calctrail
