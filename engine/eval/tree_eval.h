// A plain interpreter over the expression tree. The hot path is muparser;
// this one runs only to explain a failure (which operation divided by zero,
// which argument left its domain) and to fold constant exponents.
#pragma once

#include <functional>
#include <string>

#include "engine/sheet/expr.h"

namespace calctrail {

struct EvalFault {
  const Expr* node = nullptr;  // the operation that failed
  std::string message;         // "division by zero", "asin of 1.5, outside [-1, 1]"
};

using NameValue = std::function<double(const Expr& name_node)>;

// The SI value of `e`; on the first problem returns NaN and fills *fault.
double evalTree(const Expr& e, const NameValue& value_of, EvalFault* fault);

// Library calls: a lead given per angle ([mm/rev]) is passed in metres per
// revolution, and a lead returned is stored per radian.
double argumentToLibrary(double si, bool per_revolution, const Dimension& given);
double resultFromLibrary(double value, bool per_revolution);

}  // namespace calctrail
