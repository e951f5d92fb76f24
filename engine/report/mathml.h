// Formulas typeset as presentation MathML (MathML Core, which current
// browsers render with no script): fractions for `/`, superscripts for `^`,
// radicals for sqrt, the part of a name after `_` as a subscript, Greek names
// as Greek letters, numbers with their units, products with the middle dot.
// The expression tree is the source; nothing is re-parsed from text.
#pragma once

#include <string>
#include <vector>

#include "engine/sheet/expr.h"

namespace calctrail {

// The elements for a quantity name, without the <math> wrapper:
// "d_m" -> d with subscript m, "sigma_vm" -> σ with subscript vm, "F1" -> F₁.
std::string mathmlName(const std::string& name);

// The elements for a formula, without the <math> wrapper.
std::string mathmlExpr(const Expr& e);

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
double mathmlWidth(const Expr& e);
double mathmlNameWidth(const std::string& name);

}  // namespace calctrail
