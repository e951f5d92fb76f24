// A worksheet compiled once, for evaluating many times: names resolved to
// slots, the dependency graph and evaluation order, each slot's dimension
// and display unit, and each formula and check side compiled to a program
// that evaluates over slot values with no text left to read. Built from a
// parsed Sheet, which the Model owns (or borrows, for the Calculation
// wrapper); immutable once built, so any number of threads may evaluate one
// Model at once (engine/model/evaluate.h), each with its own Inputs.
#pragma once

#include <cstdint>
#include <deque>
#include <memory>
#include <string>
#include <unordered_map>
#include <vector>

#include "engine/eval/node_dims.h"
#include "engine/eval/program.h"
#include "engine/eval/slot.h"
#include "engine/graph/dependency_graph.h"
#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/units/unit.h"
#include "functions/function_decl.h"

namespace calctrail {

// The unit of a slot without one (a formula that failed its check): "1".
const Unit& noUnit();

struct SlotInfo {
  /// The quantity's dimension (torque and power without a stray angle); valid when has_dim.
  Dimension dim;
  /// The formula passed the dimension check and fits its declared unit.
  bool has_dim = false;
  /// The sheet declares the unit in [ ].
  bool declared = false;
  /// A given value: its formula reads no other quantity and calls no function.
  bool input = false;
  /// The declared unit, or the one the engine chose (the unit of a lone literal, else the preferred one).
  /// One Unit per distinct unit, held by the model (or the sheet's quantity): a large sheet has
  /// a few dozen units and a slot a line, and a Unit is 56 bytes.
  const Unit* display = &noUnit();
  /// The compiled formula; empty text when there is none (has_dim false, or too long to compile).
  Program formula;
};

struct CheckInfo {
  /// Both sides passed the dimension check and compare alike dimensions.
  bool has_dim = false;
  /// The dimension of both sides.
  Dimension dim;
  /// The unit both sides are shown in.
  Unit display;
  /// The compiled sides; meaningful when has_dim and compiled.
  Program lhs, rhs;
  /// Both sides compiled (neither is too long).
  bool compiled = false;
  /// Every slot either side reads, once each: the check is re-run when one changes.
  std::vector<Slot> reads;
};

class Model {
 public:
  // Resolves, orders, checks dimensions and compiles `sheet`, reporting every
  // problem to *diags (parse errors already there stay). A model with errors
  // can be inspected; evaluate it only when there are none. `library` is the
  // set of drive functions formulas may call; it must outlive the model.
  static std::unique_ptr<const Model> build(Sheet sheet, Diagnostics* diags,
                                            const std::vector<FunctionDecl>& library = functionLibrary());
  // The same over a sheet the caller keeps alive. Building never writes into
  // the sheet (the dimensions go to the model's own table, formulaDims); the
  // model reads each formula through the tree it captured (formulaExpr), so a
  // caller may swap a quantity's tree in its sheet for display (Calculation
  // does, for --set) as long as it keeps the captured one alive.
  static std::unique_ptr<const Model> borrow(const Sheet* sheet, Diagnostics* diags,
                                             const std::vector<FunctionDecl>& library = functionLibrary());

  const Sheet& sheet() const { return *sheet_; }
  const std::vector<FunctionDecl>& library() const { return *library_; }

  size_t slotCount() const { return slots_.size(); }
  // The slot of a quantity; an invalid Slot when the sheet defines no such name.
  Slot find(const std::string& name) const;
  const SlotInfo& slot(Slot s) const { return slots_[s.index()]; }
  const Quantity& quantity(Slot s) const { return sheet_->quantities[s.index()]; }
  // The formula of a slot as the model compiled it.
  const Expr& formulaExpr(Slot s) const { return *exprs_[s.index()]; }
  // The dimension of every node of that formula (by Expr::id), as the
  // dimension check found it; empty for a slot without one (no formula, or
  // one that failed the check before it was reached).
  NodeDims formulaDims(Slot s) const { return dimsOf(s.index()); }
  // The same for the left (side 0) or right (side 1) side of check k.
  NodeDims checkDims(size_t k, int side) const {
    return dimsOf(slots_.size() + 2 * k + static_cast<size_t>(side));
  }
  // The main worksheet's file.
  const SourceFile& file() const { return *sheet_->file; }
  // The file a slot's formula points into (a template's, for an instance's
  // quantity; the using file's, for a bound parameter), and a check's.
  const SourceFile& exprFile(Slot s) const { return sheet_->exprFile(s.index()); }
  const SourceFile& checkFile(size_t k) const { return sheet_->checkFile(k); }

  // Every slot that can be evaluated, dependencies first (stable: ties in sheet order).
  const std::vector<Slot>& order() const { return order_; }
  // Position of a slot in order(); slots left out of it (on a cycle) rank last.
  uint32_t rank(Slot s) const { return rank_[s.index()]; }
  // The graph's edges. Its cone queries build a cache on first use
  // (DependencyGraph::rank_), so they are not safe on shared models: use
  // downstream() below.
  const DependencyGraph& graph() const { return *graph_; }

  // The downstream cone of `slots`: each of them and every slot that depends
  // on one, once, in evaluation order. Const and safe from any thread.
  std::vector<Slot> downstream(const std::vector<Slot>& slots) const;

  const std::vector<CheckInfo>& checks() const { return checks_; }

  // Per slot, for a DimensionChecker of a formula that reads the model's
  // quantities (an Inputs binding): each slot's dimension and whether it has one.
  const std::vector<Dimension>& dims() const { return dims_; }
  const std::vector<char>& known() const { return known_; }
  // Per slot, the temperature kind of its formula (absolute, a difference, or
  // neither), for the same checker.
  const std::vector<TemperatureKind>& temperatures() const { return temperatures_; }

  // Heap bytes the model keeps beyond its Sheet (slots, programs, graph): a
  // figure for the benchmark.
  size_t compiledBytes() const;

 private:
  Model() = default;
  void run(Diagnostics* diags);
  void resolveNames(Diagnostics* diags);
  void orderAndFindCycles(Diagnostics* diags);
  void checkDimensions(Diagnostics* diags);
  void checkChecks(Diagnostics* diags);
  // A bound parameter's binding has the parameter's dimension; else reports it at the binding.
  bool bindingFits(uint32_t i, const Dimension& dim, Diagnostics* diags) const;
  void compile(Diagnostics* diags);
  // Formula f: slot f, or for f >= slotCount() a side of a check (checkDims).
  NodeDims dimsOf(size_t f) const {
    return NodeDims(node_dims_.data() + dims_at_[f], dims_at_[f + 1] - dims_at_[f]);
  }
  Dimension* dimsSlice(size_t f) { return node_dims_.data() + dims_at_[f]; }

  std::unique_ptr<const Sheet> owned_;  // the sheet, when the model owns it
  const Sheet* sheet_ = nullptr;        // never written
  const std::vector<FunctionDecl>* library_ = nullptr;
  std::vector<const Expr*> exprs_;  // per slot: the formula tree, captured when built
  std::vector<SlotInfo> slots_;
  std::vector<CheckInfo> checks_;
  std::unique_ptr<DependencyGraph> graph_;
  std::vector<Slot> order_;
  std::vector<uint32_t> rank_;
  std::vector<Dimension> dims_;
  std::vector<char> known_;
  std::vector<TemperatureKind> temperatures_;
  // The dimension of every node of every formula and check side, by Expr::id:
  // formula f's nodes are node_dims_[dims_at_[f], dims_at_[f + 1]).
  std::vector<Dimension> node_dims_;
  std::vector<uint32_t> dims_at_;
  // The distinct display units the slots chose (a declared one is the sheet's), each once.
  std::deque<Unit> units_;
  std::unordered_map<std::string, const Unit*> unit_by_text_;
  const Unit* intern(Unit unit);
  std::vector<char> unresolved_;  // per slot: the formula names something undefined (reported)
};

// An expression written over the model's quantities (a --set, a load case, a
// study's target): every name it reads is a quantity (each unknown one is
// reported, with suggestions) and it passes the dimension check, whose
// result goes to *dims. False when a problem went to *diags.
bool checkOverModel(const Model& m, const SourceFile& file, const Expr& expr, Diagnostics* diags,
                    TreeDims* dims);

// A lone literal with a unit (`20 kN`, `-3 degC`): the unit it was written in; else nullptr.
const Unit* unitAsWritten(const Expr& e);

// The unit a quantity of dimension `dim` with formula `formula` and no
// declared unit is shown in: the literal's unit as written; else the sheet's
// `units:` preference, which weighs the unit a library call's result declares
// (rev, %, 1/in, kN) against the sheet's system (UnitPreferences::choose).
Unit undeclaredDisplayUnit(const Expr& formula, const Dimension& dim, const UnitPreferences& prefs,
                           const std::vector<FunctionDecl>& library);

// A formula of dimension `dim` for quantity `q`, which declares a display
// unit: reports the error and returns false when the unit does not fit (a
// different dimension, or one that would put a number off by 2*pi on the page).
// `formula` (dimension-checked, in `sheet`, its nodes' dimensions in
// `formula_dims`) is what gives the value: the quantity's own or a
// replacement; the 2*pi hint names a computed lead in it.
bool fitsDeclaredUnit(const Quantity& q, const Expr& formula, const NodeDims& formula_dims, const Sheet& sheet,
                      const SourceFile& sheet_file, const Dimension& dim, Diagnostics* diags);

// A formula's dimension as a quantity keeps it: torque and power lose a stray
// angle (N*m*rad/s is W).
Dimension quantityDimension(const Dimension& formula_dim);

// "`a` is too long to compile (N characters ...); split it into named steps".
std::string tooLongMessage(const std::string& what, size_t length);

}  // namespace calctrail

namespace calctrail {
// "unknown name `x`; did you mean `y`?" with a hint when the name is a unit
// or a function; `names` are the quantities to suggest from.
std::string unknownNameMessage(const std::string& name, const std::vector<std::string>& names,
                               const std::vector<FunctionDecl>& library);
}  // namespace calctrail
