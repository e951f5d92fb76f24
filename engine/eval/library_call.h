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
#include "engine/util/math_constants.h"
#include "functions/function_decl.h"
#include "functions/plausibility.h"

namespace calctrail {

// Counts the library calls of one evaluation context that had a doubt
// (functions/plausibility.h): the compiled arithmetic only counts them, and
// the evaluation explains them afterwards with the tree interpreter, which
// knows where each call is written.
struct DoubtCounter {
  /// Calls with a doubt so far.
  uint64_t count = 0;
};

inline double resultFromLibrary(double value, bool per_revolution);

struct LibraryCall {
  /// The function called.
  const FunctionDecl* decl = nullptr;
  /// Bit k set: argument k is a length per angle, passed per revolution
  /// (arguments past 32 of a repeated group are never leads: none is declared so).
  uint32_t per_angle_args = 0;
  /// Bit k set: argument k (of any call of the function) may have a usual
  /// range, so the plausibility check compares it; past 32 every argument is
  /// compared. All set unless at() found out. Follows from `decl` alone.
  uint32_t usual_args = ~0u;
  /// Where a doubtful call is counted; nullptr: not counted. Not part of the
  /// call's identity (operator==).
  DoubtCounter* doubts = nullptr;

  // The call site's conversions, from the dimensions of its arguments.
  static LibraryCall at(const FunctionDecl& decl, const std::vector<Dimension>& arg_dims);

  // SI values in, SI value out, with the per-revolution conversions. Throws
  // DomainError like FunctionDecl::eval. `n` is the number of arguments. A
  // doubtful call is counted in *doubts.
  double operator()(const double* args, int n) const { return call(args, n, doubts); }
  // The same, counting a doubtful call in *counter (nullptr: not counted):
  // for a call site evaluated without muparser (Program::direct_call), which
  // uses the model's LibraryCall rather than one interned in a context.
  double call(const double* args, int n, DoubtCounter* counter) const;
  // The same with the arguments converted already (leads per revolution, as
  // the function receives them): the function, the plausibility check and
  // the result's conversion, no copy.
  double callConverted(const double* in, int n, DoubtCounter* counter) const {
    const double r = decl->eval_n ? decl->eval_n(in, n) : decl->eval(in);
    // Most functions have no usual range and no advice: no call, a test of two words.
    if (counter && (usual_args != 0 || decl->advise) && isDoubtful(*decl, in, n, usual_args))
      ++counter->count;
    return resultFromLibrary(r, decl->result_per_revolution);
  }

  // Argument k as the function receives it: a lead per revolution (the one
  // place the 2*pi of a lead is applied to an argument; k < 32).
  double argumentIn(int k, double si) const { return per_angle_args & (1u << k) ? si * kTwoPi : si; }

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
inline double resultFromLibrary(double value, bool per_revolution) {
  return per_revolution ? value / kTwoPi : value;
}

}  // namespace calctrail
