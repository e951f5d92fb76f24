// Runs compiled programs with muparser. One parser instance holds the math
// and library functions; each formula is set and evaluated once per run, with
// its inputs bound to slots (see docs/performance.md for why one instance).
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "engine/eval/program.h"

namespace mu {
class Parser;
}

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

  // muparser refuses expressions longer than 20000 characters.
  static constexpr size_t kMaxProgramLength = 19000;

 private:
  std::unique_ptr<mu::Parser> parser_;
  std::vector<double> slots_;
};

}  // namespace calctrail
