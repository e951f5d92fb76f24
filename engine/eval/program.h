// A formula compiled for muparser: the expression text over SI doubles, with
// units folded into the constants at compile time and every quantity it
// reads bound to a slot v0, v1, ... Nothing about units is left to run time.
#pragma once

#include <string>
#include <vector>

#include "engine/sheet/expr.h"
#include "engine/sheet/sheet.h"

namespace calctrail {

struct Program {
  std::string text;         // "((v0*v1)/2)"
  std::vector<int> inputs;  // quantity index of v0, v1, ...
};

// `e` must have passed the dimension check (Expr::dim filled in).
Program compileProgram(const Expr& e, const Sheet& sheet);

}  // namespace calctrail
