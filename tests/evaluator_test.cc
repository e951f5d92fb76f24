// engine/eval: the arithmetic path (compiled programs in muparser), the
// interpreter that explains failures, the math functions both share, and
// the library-call boundary with its per-revolution rule.
#include "engine/eval/evaluator.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <cstring>
#include <memory>
#include <string>

#include "engine/eval/arithmetic.h"
#include "engine/eval/library_call.h"
#include "engine/eval/math_functions.h"
#include "engine/eval/tree_eval.h"
#include "engine/model/model.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/util/math_constants.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::calc;
using calctrail::test::diagnostics;
using calctrail::test::si;

namespace {
constexpr double kDeg = kPi / 180;
}

TEST_CASE("evaluator: sin, cos and tan are exact at multiples of 90 deg", "[evaluator][trig]") {
  CHECK(exactCos(90 * kDeg) == 0.0);  // std::cos gives 6.1e-17
  CHECK(exactSin(180 * kDeg) == 0.0);
  CHECK(exactCos(180 * kDeg) == -1.0);
  CHECK(exactSin(270 * kDeg) == -1.0);
  CHECK(exactCos(-90 * kDeg) == 0.0);
  CHECK(exactSin(kPi / 2) == 1.0);
  CHECK(exactTan(180 * kDeg) == 0.0);
  CHECK(std::isnan(exactTan(90 * kDeg)));
  CHECK(std::isnan(exactTan(-270 * kDeg)));
  // Elsewhere they are the library's functions, bit for bit, small angles included.
  for (double x : {1e-300, 1e-13, 0.5, 30 * kDeg, 89.9 * kDeg, 1e6}) {
    CHECK(exactSin(x) == std::sin(x));
    CHECK(exactCos(x) == std::cos(x));
    CHECK(exactTan(x) == std::tan(x));
  }
  long k = 0;
  CHECK(multipleOfRightAngle(450 * kDeg, &k));
  CHECK(k == 5);
  CHECK_FALSE(multipleOfRightAngle(0.0, &k));
  CHECK_FALSE(multipleOfRightAngle(89.999 * kDeg, &k));
}

TEST_CASE("evaluator: tan(90 deg) and 1/cos(90 deg) are errors, not 1.6e16", "[evaluator][trig][calc]") {
  CHECK(diagnostics(*calc("a = 90 deg\nt = tan(a)\n")) ==
        "sheet.calc:2:5: error: `t` cannot be calculated: tan of an odd multiple of 90 deg is infinite "
        "(with a = 90.00\u00B0)\n");
  CHECK(diagnostics(*calc("a = 90 deg\ns = 1 / cos(a)\n")) ==
        "sheet.calc:2:5: error: `s` cannot be calculated: division by zero: the divisor is 0 "
        "(with a = 90.00\u00B0)\n");
  CHECK(diagnostics(*calc("t = tan(270 deg)\n")).find("tan of an odd multiple of 90 deg is infinite") !=
        std::string::npos);
  auto c = calc("a = 90 deg\nc0 = cos(a)\ns1 = sin(a)\nt2 = tan(2 * a)\nc3 = cos(pi / 2)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "c0") == 0.0);
  CHECK(si(*c, "s1") == 1.0);
  CHECK(si(*c, "t2") == 0.0);
  CHECK(si(*c, "c3") == 0.0);
}

TEST_CASE("evaluator: a program is set once and evaluated over changing values", "[evaluator]") {
  Diagnostics diags;
  auto model = Model::build(
      parseSheet(std::make_shared<SourceFile>("p.calc", "a = 2\nb = 3\nc = a * b + sqrt(a)\n"), &diags),
      &diags);
  REQUIRE_FALSE(diags.hasErrors());
  const Program& p = model->slot(model->find("c")).formula;
  REQUIRE(p.inputs.size() == 2);
  double values[2] = {2, 3};
  double* addresses[2] = {&values[0], &values[1]};
  LibraryCallStore store;
  ArithmeticParser parser;
  parser.set(p, addresses, &store);
  CHECK(parser.eval() == 2 * 3 + std::sqrt(2.0));
  values[0] = 5;  // the same program, new values at the bound addresses
  CHECK(parser.eval() == 5 * 3 + std::sqrt(5.0));
  // The one-shot Evaluator gives the same numbers.
  Evaluator once;
  CHECK(once.run(p, {5, 3, 0}) == 5 * 3 + std::sqrt(5.0));
}

TEST_CASE("evaluator: the compiled path and the interpreter agree", "[evaluator]") {
  const std::string text =
      "F = 6.4 kN\ndm = 30 mm\nl = 8 [mm/rev]\nf = 0.08\nalpha = 14.5 deg\n"
      "T = torque_raise(F, dm, l, f, alpha)\n"
      "x = (F / 1 kN)^3 - 2 * (dm / 1 mm) + max(f, 0.1, 0.05) * exp(-f) + atan2(1, 2) + log10(F / 1 N)\n"
      "lam = lead_angle(dm, l)\n";
  Diagnostics diags;
  auto model = Model::build(parseSheet(std::make_shared<SourceFile>("a.calc", text), &diags), &diags);
  REQUIRE_FALSE(diags.hasErrors());
  std::vector<double> values(model->slotCount(), NAN);
  Evaluator evaluator;
  for (Slot s : model->order()) {
    values[s.index()] = evaluator.run(model->slot(s).formula, values);
    EvalFault fault;
    const double tree = evalTree(
        model->formulaExpr(s), model->formulaDims(s), [&](const Expr& e) { return values[model->find(e.text).index()]; }, &fault);
    INFO(model->quantity(s).name);
    REQUIRE(fault.node == nullptr);
    CHECK(tree == Approx(values[s.index()]).epsilon(1e-14));
  }
}

TEST_CASE("evaluator: the per-revolution rule applies at the library boundary, once", "[evaluator][angles]") {
  const FunctionDecl* f = findFunction("lead_angle");
  REQUIRE(f);
  REQUIRE(f->args[1].per_revolution);
  const Dimension length = Dimension::of(Base::Length);
  const Dimension per_angle = length / Dimension::of(Base::Angle);
  const LibraryCall plain = LibraryCall::at(*f, {length, length});
  const LibraryCall per_rev = LibraryCall::at(*f, {length, per_angle});
  CHECK(plain.per_angle_args == 0);
  CHECK(per_rev.per_angle_args == 2u);
  CHECK(plain.compiledName() == "lead_angle");
  CHECK(per_rev.compiledName() == "lead_angle__r2");
  // 8 mm/rev is stored as 8 mm / (2*pi rad); the function sees 8 mm per revolution.
  const double dm = 0.030, lead = 0.008;
  const double stored[2] = {dm, lead / kTwoPi};
  const double given[2] = {dm, lead};
  CHECK(per_rev(stored, 2) == plain(given, 2));
  CHECK(argumentToLibrary(lead / kTwoPi, true, per_angle) == lead);
  CHECK(resultFromLibrary(lead, true) == lead / kTwoPi);
  // The same through a worksheet: a lead per rev and a plain lead give the same angle.
  auto c = calc("dm = 30 mm\na = lead_angle(dm, 8 [mm/rev])\nb = lead_angle(dm, 8 mm)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "a") == si(*c, "b"));
}

TEST_CASE("evaluator: a library function outside its limits is explained at the argument", "[evaluator]") {
  CHECK(diagnostics(*calc("dm = 30 mm\nl = -8 mm\nx = lead_angle(dm, l)\n")) ==
        "sheet.calc:3:20: error: `x` cannot be calculated: `lead_angle`: lead l = -8 mm/rev must be > 0 "
        "(with l = -8.000 mm)\n");
}

TEST_CASE("evaluator: a formula that is one library call of distinct names is called without muparser",
          "[evaluator][direct]") {
  const std::string text =
      "F = 6.4 kN\ndm = 30 mm\nl = 8 [mm/rev]\nf = 0.08\nalpha = 14.5 deg\n"
      "direct = torque_raise(F, dm, l, f, alpha)\n"
      "lam = lead_angle(dm, l)\n"
      "repeated = lead_angle(dm, dm)\n"    // one name twice: v0, v0
      "literal = lead_angle(dm, 8 mm)\n"   // a literal argument
      "grouped = lead_angle((dm), l)\n"    // an argument in parentheses
      "sum = lead_angle(dm, l) + 1 deg\n"  // arithmetic around the call
      "math = sqrt(dm * dm)\n"             // a math function
      "nested = lead_angle(dm, thread_lead(l, 2))\n";
  Diagnostics diags;
  auto model = Model::build(parseSheet(std::make_shared<SourceFile>("d.calc", text), &diags), &diags);
  std::string problems;
  for (const Diagnostic& d : diags.list()) problems += d.headline() + "\n";
  INFO(problems);
  REQUIRE_FALSE(diags.hasErrors());
  auto direct = [&](const char* name) { return model->slot(model->find(name)).formula.direct_call; };
  CHECK(direct("direct"));
  CHECK(direct("lam"));
  CHECK_FALSE(direct("repeated"));
  CHECK_FALSE(direct("literal"));
  CHECK_FALSE(direct("grouped"));
  CHECK_FALSE(direct("sum"));
  CHECK_FALSE(direct("math"));
  CHECK_FALSE(direct("nested"));
  CHECK_FALSE(direct("F"));
  // Called directly (LibraryCall::call) or through muparser's callback: the same bits.
  std::vector<double> values(model->slotCount(), NAN);
  Evaluator evaluator;
  for (Slot s : model->order()) values[s.index()] = evaluator.run(model->slot(s).formula, values);
  for (const char* name : {"direct", "lam"}) {
    INFO(name);
    const Program& p = model->slot(model->find(name)).formula;
    std::vector<double> args;
    for (int j : p.inputs) args.push_back(values[static_cast<size_t>(j)]);
    DoubtCounter doubts;
    const double v = p.calls[0].call(args.data(), static_cast<int>(args.size()), &doubts);
    CHECK(std::memcmp(&v, &values[model->find(name).index()], sizeof v) == 0);
    CHECK(doubts.count == 0);
  }
}
