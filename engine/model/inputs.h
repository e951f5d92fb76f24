// Replacements for a model's quantities, bound to slots: from --set today,
// from load cases and template bindings later. Each is parsed and checked
// against the model when it is bound (the name exists, with "did you mean";
// the dimension matches; not given twice in one layer), never by changing
// the model. Inputs have a parent, as scopes do: a --set over a case over a
// template binding; a binding here hides the parent's for the same slot.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "engine/eval/node_dims.h"
#include "engine/eval/program.h"
#include "engine/eval/slot.h"
#include "engine/model/model.h"
#include "engine/sheet/diagnostics.h"

namespace calctrail {

struct Binding {
  /// The slot whose formula is replaced.
  Slot slot;
  /// The replacement as written ("10 mm"); empty for a value bound with Inputs::bind.
  std::string text;
  /// The text the expression points into ("--set"); null for a bound value.
  std::shared_ptr<const SourceFile> file;
  /// The replacement, dimension-checked; null for a bound value.
  std::shared_ptr<const Expr> expr;
  /// The dimension check's result for `expr` (its nodes' dimensions).
  TreeDims dims;
  /// It reads other quantities: evaluated with them, through `program`.
  bool reads_slots = false;
  /// The compiled replacement, when it reads other quantities.
  Program program;
  /// The SI value, when it reads none: calculated once, when bound.
  double value = 0.0;
};

class Inputs {
 public:
  // No bindings: the model's own formulas. `parent`, when given, must
  // outlive these Inputs, as `model` must.
  explicit Inputs(const Model& model, const Inputs* parent = nullptr);

  // Binds "NAME=VALUE" (the --set form; VALUE a literal or an expression in
  // worksheet syntax). Every problem goes to *diags, positioned in a file
  // named `origin` that holds the text; returns false then, and binds nothing.
  bool set(const std::string& assignment, Diagnostics* diags, const std::string& origin = "--set");

  // Binds a replacement written in a worksheet, as a load case writes it:
  // the quantity `name`, written at bytes [name_begin, name_end) of `file`,
  // replaced by `expr` (parsed from `file`; copied). The checks are set()'s;
  // every message begins with `who` ("case `overload`") and points into `file`,
  // a wrong dimension at the replacement itself.
  bool replace(const std::string& name, uint32_t name_begin, uint32_t name_end, const Expr& expr,
               std::shared_ptr<const SourceFile> file, Diagnostics* diags, const std::string& who);

  // Binds an SI value (a sweep point, a solver's trial) with no text: the
  // slot must be valid. Binding the same slot again replaces the value.
  void bind(Slot slot, double si);

  // The binding in force for `slot` (this layer first, then the parents), or nullptr.
  const Binding* find(Slot slot) const;
  // This layer's bindings, in the order given.
  const std::vector<Binding>& own() const { return own_; }
  const Inputs* parent() const { return parent_; }
  const Model& model() const { return *model_; }

  // Some binding in force reads other quantities: the evaluation order then
  // differs from the model's, and is order().
  bool readsSlots() const { return !order_.empty(); }
  const std::vector<Slot>& order() const { return order_; }

 private:
  Binding* ownBinding(Slot slot);
  bool bindExpr(const std::string& name, uint32_t nb, uint32_t ne, ExprPtr expr,
                std::shared_ptr<const SourceFile> file, Diagnostics* diags, const std::string& who);
  bool computeOrder(std::vector<Slot>* order) const;

  const Model* model_;
  const Inputs* parent_;
  std::vector<Binding> own_;
  std::vector<Slot> order_;  // empty unless readsSlots()
};

}  // namespace calctrail
