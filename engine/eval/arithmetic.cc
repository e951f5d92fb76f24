#include "engine/eval/arithmetic.h"

#include <muParser.h>

#include <algorithm>
#include <stdexcept>

#include "engine/eval/math_functions.h"

namespace calctrail {

namespace {
double callLibrary(void* call, const double* args, int n) {
  return (*static_cast<const LibraryCall*>(call))(args, n);
}

[[noreturn]] void rejected(const Program& program, const mu::Parser::exception_type& e) {
  // Generated text is always valid; say so briefly rather than print it whole.
  throw std::runtime_error("internal error: muparser rejected the compiled formula (" +
                           std::to_string(program.text.size()) + " characters): " + e.GetMsg());
}
}  // namespace

const LibraryCall* LibraryCallStore::intern(const LibraryCall& call) {
  for (const LibraryCall& c : calls_)
    if (c == call) return &c;
  calls_.push_back(call);
  calls_.back().doubts = &doubts_;
  return &calls_.back();
}

ArithmeticParser::ArithmeticParser() : parser_(std::make_unique<mu::Parser>()) {
  // Only our functions: muparser's own sin, ln, min... differ from ours
  // (exact right angles) and cost memory in every parser.
  parser_->ClearFun();
  parser_->ClearConst();
}

ArithmeticParser::~ArithmeticParser() = default;

void ArithmeticParser::define(const Program& program, LibraryCallStore* store) {
  const std::vector<MathFunction>& math = mathFunctions();
  for (size_t i = 0; i < math.size(); ++i) {
    const uint32_t bit = 1u << i;
    if (!(program.math & bit) || (math_defined_ & bit)) continue;
    // Pure functions: muparser may fold them over constants at compile time.
    if (math[i].eval1)
      parser_->DefineFun(math[i].name, math[i].eval1, true);
    else
      parser_->DefineFun(math[i].name, math[i].evalN, true);
    math_defined_ |= bit;
  }
  for (const LibraryCall& c : program.calls) {
    const std::string name = c.compiledName();
    if (std::find(defined_.begin(), defined_.end(), name) != defined_.end()) continue;
    // Not optimisable: a library function must run (and may refuse) at
    // evaluation time, never while muparser folds constants.
    parser_->DefineFunUserData(name, callLibrary, const_cast<LibraryCall*>(store->intern(c)), false);
    defined_.push_back(name);
  }
}

void ArithmeticParser::set(const Program& program, double* const* addresses, LibraryCallStore* store) {
  try {
    define(program, store);
    parser_->ClearVar();
    for (size_t k = 0; k < program.inputs.size(); ++k)
      parser_->DefineVar("v" + std::to_string(k), addresses[k]);
    parser_->SetExpr(program.text);
  } catch (const mu::Parser::exception_type& e) {
    rejected(program, e);
  }
}

double ArithmeticParser::eval() const {
  try {
    return parser_->Eval();
  } catch (const mu::Parser::exception_type& e) {
    throw std::runtime_error("internal error: muparser could not evaluate a compiled formula: " + e.GetMsg());
  }
}

}  // namespace calctrail
