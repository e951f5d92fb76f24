#include "engine/eval/evaluator.h"

namespace calctrail {

Evaluator::Evaluator() = default;
Evaluator::~Evaluator() = default;

double Evaluator::run(const Program& program, const std::vector<double>& values) {
  const size_t n = program.inputs.size();
  if (slots_.size() < n) slots_.resize(n);  // grows before any address is taken
  addresses_.resize(n);
  for (size_t k = 0; k < n; ++k) {
    slots_[k] = values[program.inputs[k]];
    addresses_[k] = &slots_[k];
  }
  parser_.set(program, addresses_.data(), &calls_);
  return parser_.eval();
}

}  // namespace calctrail
