// Plausibility of a library call: arguments outside the range met in practice
// (FunctionArg::usual_min/max) and doubts a function states about its inputs
// taken together (FunctionDecl::advise). A doubtful call is still evaluated;
// the engine reports each doubt as a warning at the call. Kept apart from the
// limits (validity.h), which make a call an error.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "functions/function_decl.h"

namespace calctrail {

struct Doubt {
  /// The argument to point at (index into the call's arguments), or -1 for the whole call.
  int arg = -1;
  /// The warning, without the function's name: "modulus of elasticity E = 0.207 GPa is outside ...".
  std::string message;
};

// True when the call (SI values as eval() receives them, `n` arguments) has a
// doubt. A compare per argument with a usual range: cheap enough for every call.
bool isDoubtful(const FunctionDecl& decl, const double* args, int n);
// The same, comparing only the arguments k < 32 whose bit is set in
// `usual_args` (and every one from 32 on): with usualArgs(decl), the same
// answer without looking at the arguments that have no usual range.
bool isDoubtful(const FunctionDecl& decl, const double* args, int n, uint32_t usual_args);
// Bit k set: argument k (k < 32) of a call of `decl` has a usual range.
uint32_t usualArgs(const FunctionDecl& decl);

// Every doubt about the call, arguments in order, then the function's own.
std::vector<Doubt> doubtsOf(const FunctionDecl& decl, const double* args, int n);

// "E: 40 to 250 GPa (steels 190 to 215 GPa, ...)": the usual range of an
// argument in words, for the docs; "" when it has none.
std::string usualRangeText(const FunctionArg& arg);

}  // namespace calctrail
