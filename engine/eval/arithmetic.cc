#include "engine/eval/arithmetic.h"

#include <muParser.h>

#include <algorithm>
#include <charconv>
#include <stdexcept>

#include "engine/eval/math_functions.h"

namespace calctrail {

namespace {
double callLibrary(void* call, const double* args, int n) {
  return (*static_cast<const LibraryCall*>(call))(args, n);
}

// A number in the compiled text, read as muparser's own reader reads it (a
// std::istringstream >> double, correctly rounded like std::from_chars):
// [sign] digits [. digits] [e|E [sign] digits]. Its own builds a string
// stream for every token it is asked about, names included, which was a
// quarter of a one-shot parse (docs/performance.md, startup_perftest).
int readNumber(const char* text, int* pos, double* value) {
  const char* p = text;
  if (*p == '+' || *p == '-') ++p;
  const char* digits = p;
  while (*p >= '0' && *p <= '9') ++p;
  size_t count = static_cast<size_t>(p - digits);
  if (*p == '.') {
    const char* fraction = ++p;
    while (*p >= '0' && *p <= '9') ++p;
    count += static_cast<size_t>(p - fraction);
  }
  if (count == 0) return 0;
  if (*p == 'e' || *p == 'E') {
    const char* q = p + 1;
    if (*q == '+' || *q == '-') ++q;
    const char* exponent = q;
    while (*q >= '0' && *q <= '9') ++q;
    if (q == exponent) return 0;  // "1e": the stream fails on it too
    p = q;
  }
  // from_chars takes no leading '+'; the stream does.
  const char* first = *text == '+' ? text + 1 : text;
  double v = 0;
  const auto [end, error] = std::from_chars(first, p, v);
  if (error != std::errc() || end != p) return 0;  // out of range: the stream fails too
  *pos += static_cast<int>(p - text);
  *value = v;
  return 1;
}

double unaryMinus(double v) { return -v; }
double unaryPlus(double v) { return v; }

// mu::Parser without its functions and constants (none of ours: see the
// constructor below) and with readNumber for its number reader; the same
// name and operator characters and the same unary + and -.
class LeanParser final : public mu::ParserBase {
 public:
  LeanParser() {
    AddValIdent(readNumber);
    InitCharSets();
    InitFun();
    InitConst();
    InitOprt();
  }

 protected:
  void InitCharSets() override {
    DefineNameChars("0123456789_abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ");
    DefineOprtChars("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ+-*^/?<>=#!$%&|~'_{}");
    DefineInfixOprtChars("/+-*^?<>=#!$%&|~'_");
  }
  void InitFun() override {}
  void InitConst() override {}
  void InitOprt() override {
    DefineInfixOprt("-", unaryMinus);
    DefineInfixOprt("+", unaryPlus);
  }
};

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

// Only our functions: muparser's own sin, ln, min... differ from ours
// (exact right angles) and cost memory in every parser.
ArithmeticParser::ArithmeticParser() : parser_(std::make_unique<LeanParser>()) {}

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
    // v0, v1, ... are re-pointed, not cleared and defined anew: a name the
    // last program had and this one lacks keeps its old address, unread (a
    // parser binds only the names its text holds), and the parser's map of
    // names allocates nothing for the next formula (the one-shot parse of a
    // report sets a dozen programs in one parser; docs/performance.md).
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
