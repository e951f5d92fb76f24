// A plain interpreter over the expression tree, run only to EXPLAIN a
// failure: which operation divided by zero, which argument left its domain,
// with the values it had. The numbers themselves come from the compiled
// programs (arithmetic.h); both call the same math functions and the same
// library boundary, so they agree. Also folds constant exponents.
#pragma once

#include <functional>
#include <string>
#include <vector>

#include "engine/eval/library_call.h"
#include "engine/eval/node_dims.h"
#include "engine/sheet/expr.h"

namespace calctrail {

struct EvalFault {
  /// The operation that failed; nullptr when none did.
  const Expr* node = nullptr;
  /// What went wrong there: "division by zero", "asin of 1.5, outside [-1, 1]".
  std::string message;
};

using NameValue = std::function<double(const Expr& name_node)>;

// The SI value of `e`; on the first problem returns NaN and fills *fault.
// Drive functions are looked up in `library`.
// `dims`: the dimension check's result for `e` (a library call's conversions
// depend on its arguments' dimensions; a tree without calls reads none).
double evalTree(const Expr& e, const NodeDims& dims, const NameValue& value_of, EvalFault* fault,
                const std::vector<FunctionDecl>& library = functionLibrary());

struct CallDoubt {
  /// Where to point: the argument to blame, or the call.
  const Expr* at = nullptr;
  /// The warning: "`critical_speed`: density rho = 78.5 kg/m^3 is outside ...".
  std::string message;
};

// Every doubtful library call in `e` (functions/plausibility.h), in the order
// they are evaluated, found by evaluating `e` with the interpreter.
std::vector<CallDoubt> doubtsInTree(const Expr& e, const NodeDims& dims, const NameValue& value_of,
                                    const std::vector<FunctionDecl>& library = functionLibrary());

}  // namespace calctrail
