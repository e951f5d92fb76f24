// A worksheet calculated end to end, as one CLI command does it: read, parse,
// build the Model, bind --set as Inputs, evaluate, and fill the members the
// renderers, review and CLI read. Every problem lands in `diags`; a
// calculation with errors has no values to show.
//
// This is the convenience wrapper of the stages {Model, Inputs, Results}
// (engine/model/, docs/engine.md); code that evaluates a sheet more than
// once uses those directly.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "engine/graph/dependency_graph.h"
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

struct QuantityState {
  Dimension dim;
  bool has_dim = false;
  Unit display;            // the declared unit, or the one the engine chose
  bool declared = false;
  bool input = false;      // a given value: its formula reads no other quantity
  bool ok = false;         // evaluated to a finite value
  double si = 0.0;
};

struct CheckState {
  bool ok = false;         // both sides evaluated
  double lhs = 0.0, rhs = 0.0;  // SI values
  bool passed = false;
  Dimension dim;
  Unit display;            // unit both sides are shown in
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
  std::vector<QuantityState> quantities;
  std::vector<CheckState> checks;
  std::unique_ptr<DependencyGraph> graph;
  std::vector<int> order;  // evaluation order
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
  // The dimensions of the nodes of quantity i's formula as `sheet` shows it:
  // the --set (or shown case's) replacement's where one stands, else the model's.
  NodeDims exprDims(size_t i) const;
  bool allChecksPass() const;
  int failedChecks() const;
  // Some load case could not be calculated (its errors are in CaseRun::errors).
  bool caseErrors() const;

 private:
  void run(std::shared_ptr<SourceFile> file, const CalcOptions& options);
  void fillStates();
  void bindShownCase(const std::string& shown);
  void bindCases(bool alone);
  void evaluateCases(Evaluation* evaluation);
  std::string instanceNote(const Fault& f) const;
  static DiagnosticSite siteOf(const Fault& f);
  // The model's trees of --set quantities, kept alive while `sheet` shows the --set ones.
  std::vector<ExprPtr> replaced_;
  // With --case, the shown case's replacements: the layer under --set.
  std::unique_ptr<Inputs> shown_layer_;
};

}  // namespace calctrail
