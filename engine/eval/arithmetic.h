// The arithmetic engine: one muparser parser holding one compiled program.
// muparser stores the ADDRESS of every variable when the text is set and
// turns the text into bytecode once; eval() then runs the bytecode over
// whatever those addresses hold. So a program set once and evaluated many
// times parses nothing per evaluation, and its per-evaluation state (the
// values at the bound addresses) belongs to one thread: each evaluation
// context owns its parsers and its slot array.
//
// The parser defines only the functions its program calls (the math
// functions of math_functions.h and the drive-library variants of
// library_call.h), none of muparser's own: a parser with the whole library
// costs 16 KB, a lean one a few KB (docs/engine.md has the figures).
#pragma once

#include <cstddef>
#include <deque>
#include <memory>
#include <string>
#include <vector>

#include "engine/eval/library_call.h"
#include "engine/eval/program.h"

namespace mu {
class ParserBase;
}

namespace calctrail {

// muparser refuses expressions of 20000 characters or more.
inline constexpr size_t kMaxProgramLength = 19000;

// Stable storage for the call-site data muparser passes back to a library
// callback (the function and its per-revolution conversions). One per
// evaluation context; never shared between threads.
// It also counts the doubtful calls made through it (library_call.h).
class LibraryCallStore {
 public:
  const LibraryCall* intern(const LibraryCall& call);
  // Doubtful calls made through the interned calls so far.
  uint64_t doubtfulCalls() const { return doubts_.count; }
  // The counter itself, for a call made without muparser (LibraryCall::call).
  DoubtCounter* doubtCounter() { return &doubts_; }

 private:
  std::deque<LibraryCall> calls_;
  DoubtCounter doubts_;
};

class ArithmeticParser {
 public:
  ArithmeticParser();
  ~ArithmeticParser();
  ArithmeticParser(const ArithmeticParser&) = delete;
  ArithmeticParser& operator=(const ArithmeticParser&) = delete;

  // Sets `program`, with variable v_k bound to addresses[k] (which must stay
  // valid while the program is set). Throws std::runtime_error if muparser
  // rejects the text (an internal error: generated text is always valid).
  void set(const Program& program, double* const* addresses, LibraryCallStore* store);

  // The value of the program set last, over the values at its addresses. May
  // be NaN or inf (the caller checks and explains); throws DomainError from a
  // library function outside its limits.
  double eval() const;

 private:
  void define(const Program& program, LibraryCallStore* store);

  std::unique_ptr<mu::ParserBase> parser_;
  std::vector<std::string> defined_;  // functions defined so far, by compiled name
  uint32_t math_defined_ = 0;         // bit i: mathFunctions()[i] is defined
};

}  // namespace calctrail
