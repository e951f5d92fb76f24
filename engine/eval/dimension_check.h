// The dimension check of a formula, before anything is evaluated: sums,
// differences and comparisons of unlike dimensions, function arguments,
// powers and roots. What it finds (each node's dimension, the root's
// temperature kind) goes to a side table (engine/eval/node_dims.h); the tree
// is never written.
#pragma once

#include <vector>

#include "engine/eval/node_dims.h"
#include "engine/sheet/diagnostics.h"
#include "engine/sheet/expr.h"
#include "engine/sheet/sheet.h"
#include "functions/function_decl.h"

namespace calctrail {

class DimensionChecker {
 public:
  // dims[i]/known[i]: the dimension of quantity i, and whether it has one
  // (a quantity whose own formula failed has none; its users stay quiet).
  // temperatures[i], when given: the temperature kind of quantity i's
  // formula (Model::temperatures), which a quantity without a declared unit
  // has; without it such a quantity reads as no temperature kind.
  DimensionChecker(const SourceFile& file, Diagnostics* diags, const Sheet& sheet,
                   const std::vector<Dimension>& dims, const std::vector<char>& known,
                   const std::vector<FunctionDecl>& library = functionLibrary(),
                   const std::vector<TemperatureKind>* temperatures = nullptr);

  // True when the formula is consistent. False after reporting the first
  // problem, or quietly when a quantity it uses has no dimension. Fills
  // *out with the dimension of every node (by Expr::id) and the root's
  // temperature kind; after a failure, the nodes it did not reach read as plain.
  bool check(const Expr& e, TreeDims* out);
  // The same into dims[0, count), count = nodeCount(e) (a slice of the Model's table).
  bool check(const Expr& e, Dimension* dims, uint32_t count, TemperatureKind* root_temperature);

 private:
  bool visit(const Expr& e);
  bool visitNode(const Expr& e);
  bool checkCall(const Expr& e);
  bool checkTemperatureOwner(const Expr& root);
  // The rule for absolute temperatures (degC, degF), whose zero is arbitrary:
  // products, quotients, powers, roots and negation of one, and sums of two,
  // have no physical meaning and are errors; an absolute plus or minus a
  // difference is absolute, absolute minus absolute is a difference, and
  // comparisons of two absolutes are fine. Sets the temperature kind of `e`
  // from its operands (visited already) and returns "" or the error for `e`.
  std::string absoluteTemperatureRule(const Expr& e);
  Dimension& dim(const Expr& e) { return dims_out_[e.id]; }
  TemperatureKind& temperature(const Expr& e) { return temperatures_out_[e.id]; }
  bool fail(const Expr& at, const std::string& message);
  // The warning for a plain number given to the trigonometric function `fn`; "" when none.
  std::string plainTrigArgumentWarning(const std::string& fn, const Expr& arg) const;

  const SourceFile& file_;
  Diagnostics* diags_;
  const Sheet& sheet_;
  const std::vector<Dimension>& dims_;
  const std::vector<char>& known_;
  const std::vector<FunctionDecl>& library_;  // the drive functions a call may name
  const std::vector<TemperatureKind>* temperatures_;  // per quantity, or null
  // The tree being checked: its nodes' dimensions (the caller's) and temperature kinds.
  Dimension* dims_out_ = nullptr;
  std::vector<TemperatureKind> temperatures_out_;
  // The tree checked before, and its kind: a check's right side is compared with its left.
  const Expr* previous_root_ = nullptr;
  TemperatureKind previous_temperature_ = TemperatureKind::Unknown;
};

// Adding an angle to a plain number (or rad/s to 1/s) is allowed, with a
// warning: the radian is 1, but a 2*pi may be missing. Returns "" when the
// two dimensions are alike, the warning text when they differ only in angle,
// and sets *incompatible otherwise.
std::string compareForSum(const Dimension& a, const Dimension& b, bool* incompatible);

// A warning for a result whose dimension carries a stray angle (rpm times a
// plain lead, a plain 2*pi where 1 rev is meant), with the fix; "" when none.
std::string strayAngleWarning(const std::string& name, const Dimension& dim);
// The same for the quantity `name` of formula `formula` (dimension-checked,
// its nodes' dimensions in `formula_dims`): where the plain length is a
// computed quantity, the fix fits one (divide it by `1 [rev]`, or compute a
// lead per revolution).
std::string strayAngleWarning(const std::string& name, const Dimension& dim, const Expr& formula,
                              const NodeDims& formula_dims, const Sheet& sheet);

// Torque or energy, or power, with any angle exponent: T*theta is work and
// T*omega is power, so there the radian is 1 and the angle is dropped.
bool workOrPower(const Dimension& d);

// The temperature kind of a quantity: its declared unit decides ([degC] is
// absolute, [ddegC] a difference, [K] either), else its formula's, `formula`.
TemperatureKind temperatureKind(const Quantity& q, TemperatureKind formula);

// The value of an expression made of numbers, pi and arithmetic only
// (no names, no calls); false when it has none or it is not finite.
bool constantValue(const Expr& e, double* value);

}  // namespace calctrail
