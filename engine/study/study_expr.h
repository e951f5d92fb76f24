// An expression over a model's quantities written on a study's command line
// (a side of --target, --by): parsed, resolved, dimension-checked and
// compiled once, then evaluated over any number of Results by a per-thread
// StudyExprEvaluator that keeps its muparser program set.
#pragma once

#include <cstdint>
#include <memory>
#include <string>
#include <vector>

#include "engine/eval/arithmetic.h"
#include "engine/eval/program.h"
#include "engine/model/model.h"
#include "engine/model/results.h"
#include "engine/sheet/diagnostics.h"

namespace calctrail {

struct StudyExpr {
  /// The option text the expression points into (named after the option, "--target").
  std::shared_ptr<const SourceFile> file;
  /// The parsed expression, Expr::dim filled in.
  std::shared_ptr<const Expr> expr;
  /// Its dimension as a quantity keeps it (torque and power without a stray angle).
  Dimension dim;
  /// The unit it is shown in: the one written with a lone literal, else the preferred one.
  Unit display;
  /// Compiled over the model's slots.
  Program program;
  /// The text as written, for messages and output ("T_motor", "12 [N*m]").
  std::string text;
};

// Parses bytes [begin, end) of `file` as an expression over `model`'s
// quantities. Every problem (syntax, unknown name with "did you mean",
// dimensions) goes to *diags; returns false then.
bool compileStudyExpr(const Model& model, std::shared_ptr<const SourceFile> file, uint32_t begin,
                      uint32_t end, Diagnostics* diags, StudyExpr* out);

// Evaluates one StudyExpr over Results: set into a parser once, run from its
// bytecode at every point. One per thread.
class StudyExprEvaluator {
 public:
  explicit StudyExprEvaluator(const StudyExpr& e);
  StudyExprEvaluator(const StudyExprEvaluator&) = delete;
  StudyExprEvaluator& operator=(const StudyExprEvaluator&) = delete;

  // The SI value over `r`; NaN when a quantity it reads has no value or the
  // arithmetic fails (a library function outside its limits included).
  double eval(const Results& r);

 private:
  const StudyExpr& expr_;
  std::vector<double> args_;  // the values the program reads; never reallocated after set
  std::vector<double*> addresses_;
  LibraryCallStore calls_;
  ArithmeticParser parser_;
};

}  // namespace calctrail
