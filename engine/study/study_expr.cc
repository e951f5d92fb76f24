#include "engine/study/study_expr.h"

#include <cmath>

#include "engine/eval/dimension_check.h"
#include "engine/sheet/expr_parser.h"

namespace calctrail {

bool compileStudyExpr(const Model& m, std::shared_ptr<const SourceFile> file, uint32_t begin, uint32_t end,
                      Diagnostics* diags, StudyExpr* out) {
  ExprParser parser(*file, begin, end, diags);
  ExprPtr expr = parser.parseWhole();
  if (!expr) return false;
  TreeDims dims;
  if (!checkOverModel(m, *file, *expr, diags, &dims)) return false;
  out->program = compileProgram(*expr, dims.view(), m.sheet(), m.library());
  if (out->program.text.size() > kMaxProgramLength) {
    diags->error(*file, expr->begin, expr->end, tooLongMessage("the expression", out->program.text.size()));
    return false;
  }
  out->dim = quantityDimension(dims.of(*expr));
  // A lone name is shown as the sheet shows it; a lone literal in the unit written.
  const Unit* written = unitAsWritten(*expr);
  const Slot named = expr->kind == ExprKind::Name ? m.find(expr->text) : Slot();
  out->display = named.valid() ? *m.slot(named).display : written ? *written : preferredUnit(out->dim);
  out->text = file->bytes().substr(expr->begin, expr->end - expr->begin);
  out->file = std::move(file);
  out->expr = std::shared_ptr<const Expr>(std::move(expr));
  return true;
}

StudyExprEvaluator::StudyExprEvaluator(const StudyExpr& e)
    : expr_(e), args_(e.program.inputs.size(), NAN), addresses_(args_.size()) {
  if (e.program.reads_one || e.program.is_constant) return;
  for (size_t k = 0; k < args_.size(); ++k) addresses_[k] = &args_[k];
  parser_.set(e.program, addresses_.data(), &calls_);
}

double StudyExprEvaluator::eval(const Results& r) {
  const Program& p = expr_.program;
  if (p.is_constant) return p.constant;
  for (size_t k = 0; k < args_.size(); ++k) {
    args_[k] = r.values[p.inputs[k]];
    if (!std::isfinite(args_[k])) return NAN;
  }
  if (p.reads_one) return args_[0];
  try {
    const double v = parser_.eval();
    return std::isfinite(v) ? v : NAN;
  } catch (const std::exception&) {
    return NAN;
  }
}

}  // namespace calctrail
