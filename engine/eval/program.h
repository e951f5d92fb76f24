// A formula compiled for muparser: the expression text over SI doubles, with
// units folded into the constants at compile time and every quantity it
// reads bound to a variable v0, v1, ... Nothing about units is left to run
// time. The text is what muparser turns into its bytecode, once per
// evaluation context (engine/model/evaluate.h), never once per evaluation.
#pragma once

#include <string>
#include <vector>

#include "engine/eval/library_call.h"
#include "engine/eval/node_dims.h"
#include "engine/sheet/expr.h"
#include "engine/sheet/sheet.h"

namespace calctrail {

struct Program {
  /// The muparser text: "v0*v1/2", in parentheses only where muparser would
  /// group otherwise (`v0/(v1*v2)`, `(v0+v1)^2`).
  std::string text;
  /// The quantity (sheet index, which is also its slot index) read as v0, v1, ...
  std::vector<int> inputs;
  /// Every drive function variant the text calls, once each, by compiledName().
  std::vector<LibraryCall> calls;
  /// Bit i set: the text calls mathFunctions()[i].
  uint32_t math = 0;
  /// The formula is one name (a check side `n_yield`): its value is v0, read without muparser.
  bool reads_one = false;
  /// The formula is one call of calls[0] with the arguments v0, v1, ... in
  /// that order (`torque_raise(F, d_m, l, f, alpha)`, each a distinct name):
  /// the evaluation calls it with the values read, without muparser. There is
  /// no arithmetic to do, so the value is the one muparser's callback gives.
  bool direct_call = false;
  /// The formula is one literal (a check side `3`, `10 MPa`): its value is `constant`.
  bool is_constant = false;
  /// The literal's SI value, when is_constant (the number muparser would read back from the text).
  double constant = 0.0;
};

// `e` must have passed the dimension check; `dims` is what it found (a
// library call's conversions depend on its arguments' dimensions). Names
// are resolved with `sheet.find`. Drive functions come from `library`.
Program compileProgram(const Expr& e, const NodeDims& dims, const Sheet& sheet,
                       const std::vector<FunctionDecl>& library = functionLibrary());

}  // namespace calctrail
