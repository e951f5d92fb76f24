// A worksheet calculated end to end: read, parse, apply --set overrides,
// resolve names, order by dependencies, check dimensions, compile, evaluate,
// and evaluate the design checks. Every problem lands in `diags`; a
// calculation with errors has no values to show.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "engine/graph/dependency_graph.h"
#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/units/unit.h"

namespace calctrail {

struct CalcOptions {
  std::vector<std::string> sets;  // "NAME=VALUE" from --set, in order
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

class Calculation {
 public:
  // `display_path` is how diagnostics and the trail name the file.
  static std::unique_ptr<Calculation> fromFile(const std::string& path, const CalcOptions& options = {});
  static std::unique_ptr<Calculation> fromText(const std::string& display_path, std::string bytes,
                                               const CalcOptions& options = {});

  Sheet sheet;
  std::vector<QuantityState> quantities;
  std::vector<CheckState> checks;
  std::unique_ptr<DependencyGraph> graph;
  std::vector<int> order;  // evaluation order
  Diagnostics diags;
  std::string sha256;      // of the worksheet bytes as read
  std::string path;

  bool hasErrors() const { return diags.hasErrors(); }
  bool allChecksPass() const;
  int failedChecks() const;

 private:
  void run(std::shared_ptr<SourceFile> file, const CalcOptions& options);
  void applyOverrides(const CalcOptions& options);
  void resolveNames();
  void orderAndFindCycles();
  void checkDimensions();
  void checkChecks();
  void evaluate();
  void evaluateChecks();
  void explainFailure(const Expr& expr, const SourceFile& file, const std::vector<double>& values,
                      const std::string& prefix, const std::string& internal);
  const SourceFile& fileOf(const Quantity& q) const;
};

}  // namespace calctrail
