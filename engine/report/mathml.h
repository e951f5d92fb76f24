// Formulas typeset as presentation MathML (MathML Core, which current
// browsers render with no script): fractions for `/`, superscripts for `^`,
// radicals for sqrt, the part of a name after `_` as a subscript, Greek names
// as Greek letters, numbers with their units, products with the middle dot.
// The expression tree is the source; nothing is re-parsed from text.
#pragma once

#include <functional>
#include <string>
#include <vector>

#include "engine/report/trail.h"
#include "engine/sheet/expr.h"

namespace calctrail {

// The elements for a quantity name, without the <math> wrapper:
// "d_m" -> d with subscript m, "sigma_vm" -> σ with subscript vm, "F1" -> F₁;
// two letters and no underscore are the same rule: "dm" -> d with subscript m.
std::string mathmlName(const std::string& name);

// For a substituted formula: the value shown in place of a node (a name, or
// a nested call), or nullptr to set the node itself.
using MathValueOf = std::function<const TrailBinding*(const Expr& node)>;

// The elements for a formula, without the <math> wrapper; with `value_of`,
// the formula with values in place of its names, set the same way (a value
// below zero, or with a unit under a power, in parentheses).
std::string mathmlExpr(const Expr& e, const MathValueOf& value_of = nullptr);

// A value as a number and its unit: "25.74 kN", "1.5 × 10⁹ W", "15.00°".
std::string mathmlValue(const TrailValue& v);

// A formula's top-level chain of sums, differences and products, left to
// right: the first piece with an empty operator, the others with "+", "−"
// or "·". Written one after the other they give the formula as
// mathmlExpr() does, so a renderer can break a long formula between pieces
// (preferably before a sign), as printed mathematics does. One piece when
// `e` is no such chain.
struct InfixPiece {
  std::string op;
  const Expr* expr = nullptr;
};
std::vector<InfixPiece> infixPieces(const Expr& e);

// Rough typeset width in em at full size, so that a renderer can shrink a
// long formula to the page width: MathML does not break lines.
double mathmlWidth(const Expr& e, const MathValueOf& value_of = nullptr);
double mathmlNameWidth(const std::string& name);

}  // namespace calctrail
