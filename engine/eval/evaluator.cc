#include "engine/eval/evaluator.h"

#include <muParser.h>

#include <stdexcept>

#include "functions/function_decl.h"

namespace calctrail {

namespace {
double callLibrary(void* decl, const double* args, int /*n*/) {
  return static_cast<const FunctionDecl*>(decl)->eval(args);
}
}  // namespace

Evaluator::Evaluator() : parser_(std::make_unique<mu::Parser>()) {
  for (const FunctionDecl& f : functionLibrary()) {
    if (f.args.empty()) continue;  // constants are folded in by compileProgram
    // Not optimisable: a library function must run (and may refuse) at
    // evaluation time, never while muparser folds constants.
    parser_->DefineFunUserData(f.name, callLibrary, const_cast<FunctionDecl*>(&f), false);
  }
}

Evaluator::~Evaluator() = default;

double Evaluator::run(const Program& program, const std::vector<double>& values) {
  try {
    parser_->ClearVar();
    if (slots_.size() < program.inputs.size()) slots_.resize(program.inputs.size());
    for (size_t i = 0; i < program.inputs.size(); ++i) {
      slots_[i] = values[program.inputs[i]];
      parser_->DefineVar("v" + std::to_string(i), &slots_[i]);
    }
    parser_->SetExpr(program.text);
    return parser_->Eval();
  } catch (const mu::Parser::exception_type& e) {
    // Generated text is always valid; say so briefly rather than print it whole.
    throw std::runtime_error("internal error: muparser rejected the compiled formula (" +
                             std::to_string(program.text.size()) + " characters): " + e.GetMsg());
  }
}

}  // namespace calctrail
