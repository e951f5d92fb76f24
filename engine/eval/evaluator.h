// One-shot evaluation of compiled programs over a value array: a single
// arithmetic parser whose program is set per call. Kept for the stage
// benchmark (engine/calculation_perftest.cc), which times the stages one by
// one; the engine evaluates through engine/model/evaluate.h, which sets each
// program once and evaluates it many times.
#pragma once

#include <memory>
#include <vector>

#include "engine/eval/arithmetic.h"
#include "engine/eval/program.h"

namespace calctrail {

class Evaluator {
 public:
  Evaluator();
  ~Evaluator();
  Evaluator(const Evaluator&) = delete;
  Evaluator& operator=(const Evaluator&) = delete;

  // The value of `program` given the SI values of all quantities. May be NaN
  // or inf (the caller checks and explains); throws DomainError from a library
  // function outside its limits, and std::runtime_error if muparser rejects
  // the text (an internal error: generated text is always valid).
  double run(const Program& program, const std::vector<double>& values);

  static constexpr size_t kMaxProgramLength = calctrail::kMaxProgramLength;

 private:
  ArithmeticParser parser_;
  LibraryCallStore calls_;
  std::vector<double> slots_;
  std::vector<double*> addresses_;
};

}  // namespace calctrail
