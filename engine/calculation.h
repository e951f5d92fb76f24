// A worksheet calculated end to end, as one CLI command does it: read, parse,
// build the Model, bind --set as Inputs, evaluate; what the renderers, review
// and CLI show of each quantity and check is read from those stages through
// small accessors. Every problem lands in `diags`; a calculation with errors
// has no values to show.
//
// This is the convenience wrapper of the stages {Model, Inputs, Results}
// (engine/model/, docs/engine.md); code that evaluates a sheet more than
// once uses those directly.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "engine/model/evaluate.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"
#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/template/file_source.h"
#include "engine/template/template_cache.h"
#include "engine/units/unit.h"

namespace calctrail {

struct CalcOptions {
  std::vector<std::string> sets;  // "NAME=VALUE" from --set, in order
  // --case: evaluate this load case alone, as if the worksheet were written
  // with its replacements ("" or "nominal": the worksheet as written).
  std::string case_name;
  /// Templates read so far in this run, shared by every sheet it calculates; null: a cache of its own.
  TemplateCache* templates = nullptr;
  /// Where the sheet's templates are read (a git revision for `diff REV:PATH`); null: the disk.
  const FileSource* source = nullptr;
  /// The sheet's path in `source`, which its templates are relative to; "": the display path.
  std::string source_path;
};

// Quantity i as a trail, the review or the editor shows it, read on demand
// from the stages (Calculation::quantity): the model's slot, with what a
// --set (or the shown case) changes, and the nominal results. A view, not a
// copy: `display` points into the Calculation, which must outlive it.
struct QuantityView {
  /// The quantity's dimension; valid when has_dim.
  Dimension dim;
  /// The formula passed the dimension check and fits its declared unit.
  bool has_dim = false;
  /// The declared unit, or the one the engine chose for the formula shown.
  const Unit& display;
  /// The sheet declares the unit in [ ].
  bool declared = false;
  /// A given value: the formula shown reads no other quantity and calls no function.
  bool input = false;
  /// Evaluated to a finite value.
  bool ok = false;
  /// The SI value; 0 unless ok.
  double si = 0.0;
};

// Check k as it is shown (Calculation::check): the model's check with the
// nominal result. A view: `display` points into the model.
struct CheckView {
  /// Both sides evaluated; false when the check was not evaluated at all.
  bool ok = false;
  /// The SI values of the two sides; 0 when not evaluated.
  double lhs = 0.0, rhs = 0.0;
  /// The condition holds (false when not ok).
  bool passed = false;
  /// The dimension of both sides.
  Dimension dim;
  /// The unit both sides are shown in.
  const Unit& display;
};

// One load case of the worksheet, evaluated beside the nominal in the same run.
struct CaseRun {
  /// The case as the worksheet writes it; points into Calculation::sheet.cases.
  const LoadCase* def = nullptr;
  /// Its replacements, over the --set layer: a --set of the same name hides the case's.
  std::unique_ptr<Inputs> inputs;
  /// The nominal's results with the cone of the replacements re-run; empty when not evaluated.
  Results results;
  /// What could not be calculated in this case ("case `overload`: `y` cannot be
  /// calculated: ..."). Kept apart from Calculation::diags, so that the other
  /// cases can still be shown; any of them makes the run a worksheet error.
  Diagnostics errors;

  bool evaluated() const { return !results.values.empty(); }
  bool ok() const { return evaluated() && !errors.hasErrors(); }
};

class Calculation {
 public:
  // `display_path` is how diagnostics and the trail name the file.
  static std::unique_ptr<Calculation> fromFile(const std::string& path, const CalcOptions& options = {});
  static std::unique_ptr<Calculation> fromText(const std::string& display_path, std::string bytes,
                                               const CalcOptions& options = {});

  // The sheet as the trail shows it, its templates expanded into it
  // (Sheet::instances, Sheet::files): a --set quantity carries its --set
  // formula, with Quantity::overridden and overrideText().
  Sheet sheet;
  Diagnostics diags;
  std::string sha256;      // of the worksheet bytes as read (each template's: sheet.files)
  std::string path;

  // The stages (null when the file could not be read). The model borrows `sheet`.
  std::unique_ptr<const Model> model;
  std::unique_ptr<Inputs> inputs;
  Results results;

  // Every load case of the worksheet in document order, each evaluated over
  // the nominal (empty with --case, which shows one case as the nominal).
  std::vector<CaseRun> cases;
  // The --case shown in place of the worksheet as written; "" for the nominal.
  std::string shown_case;

  bool hasErrors() const { return diags.hasErrors(); }

  // What each quantity and check shows, read from the stages rather than
  // kept in copies of them (a state per quantity and a copy of the graph
  // cost about 95 bytes a line at a `check`'s peak, docs/performance.md):
  // the model's slot, the nominal `results`, and for the few slots a --set
  // (or the shown case) replaced, what the replacement changes. Indices are
  // sheet indices, which are the model's slot indices.

  // The sheet's quantities (the model's slots); 0 when the file could not be read.
  size_t quantityCount() const { return model ? model->slotCount() : 0; }
  // The unit quantity i is shown in: a replaced quantity without a declared
  // unit is shown in the one its replacement's formula suggests (a --set
  // `20 kN` in kN), which the model, built before --set, cannot know.
  const Unit& display(size_t i) const;
  // A given value as the trail tells it: the formula shown (a --set one where
  // it stands) reads no other quantity and calls no function.
  bool isInput(size_t i) const;
  // Quantity i evaluated to a finite value: false when the sheet was not
  // evaluated at all (an error found before evaluation), so that nothing
  // shows a value then, and for a quantity that faulted or reads one that did.
  bool ok(size_t i) const { return !results.values.empty() && results.ok(slotOf(i)); }
  // Its SI value; 0 unless ok(i), as the JSON has always given it.
  double si(size_t i) const { return ok(i) ? results.value(slotOf(i)) : 0.0; }
  // All of the above at once, for code that reads several.
  QuantityView quantity(size_t i) const;

  size_t checkCount() const { return model ? model->checks().size() : 0; }
  // The unit both sides of check k are shown in.
  const Unit& checkDisplay(size_t k) const { return model->checks()[k].display; }
  // Check k in the nominal run. A check that was not evaluated (the sheet
  // has errors, or its sides have no common dimension) reads as all false
  // and zero, never as whatever an evaluation left in its slot.
  const CheckResult& checkResult(size_t k) const;
  CheckView check(size_t k) const;

  // The order the quantities were evaluated in: the model's, or when a --set
  // formula reads other quantities (and so may move them), the one its
  // Inputs worked out. Empty when the file could not be read.
  const std::vector<Slot>& order() const;
  // The dimensions of the nodes of quantity i's formula as `sheet` shows it:
  // the --set (or shown case's) replacement's where one stands, else the model's.
  NodeDims exprDims(size_t i) const;
  bool allChecksPass() const;
  int failedChecks() const;
  // Some load case could not be calculated (its errors are in CaseRun::errors).
  bool caseErrors() const;

 private:
  // Per quantity that `sheet` shows with a --set (or the shown case's)
  // formula: what that formula changes, and the model's own tree, kept alive
  // while the sheet shows the other (Model::borrow).
  struct ShownReplacement {
    Slot slot;
    /// The replacement reads no other quantity and calls no function.
    bool input = false;
    /// The unit it is shown in: undeclaredDisplayUnit of the replacement, or the model's (declared).
    Unit display;
    /// The model's tree, which `sheet` no longer holds.
    ExprPtr model_expr;
  };

  void run(std::shared_ptr<SourceFile> file, const CalcOptions& options);
  // Puts each replacement's formula into `sheet` and fills replaced_.
  void showReplacements();
  static Slot slotOf(size_t i) { return Slot(static_cast<uint32_t>(i)); }
  // The replacement shown for quantity i, or nullptr: most slots have none.
  const ShownReplacement* shownReplacement(size_t i) const;
  void bindShownCase(const std::string& shown);
  void bindCases(bool alone);
  void evaluateCases(Evaluation* evaluation);
  std::string instanceNote(const Fault& f) const;
  static DiagnosticSite siteOf(const Fault& f);
  // Sorted by slot; a few entries (one per --set or shown case's replacement).
  std::vector<ShownReplacement> replaced_;
  // With --case, the shown case's replacements: the layer under --set.
  std::unique_ptr<Inputs> shown_layer_;
};

}  // namespace calctrail
