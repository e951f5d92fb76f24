// Each library function declares its formula once, in worksheet syntax, for
// the trail to show. This test holds the declaration to the implementation:
// the declared formula, parsed and evaluated by the engine's own interpreter,
// gives the same value as the function's eval() for sample inputs.
#include <catch2/catch.hpp>

#include <cmath>
#include <map>

#include "engine/eval/tree_eval.h"
#include "engine/sheet/expr_parser.h"
#include "functions/function_decl.h"

using namespace calctrail;

namespace {
// A plausible value for an argument of this dimension, varied by `set`.
double sample(const FunctionArg& a, int set) {
  const Dimension& d = a.dim;
  const double k = std::pow(1.6, set % 10 - 3) * (1.0 + 0.1 * (set / 10));
  if (d == Dimension::exponents(1, 1, -2)) return 8000 * k;                       // force
  if (d == Dimension::exponents(1, 0, 0)) return (a.per_revolution ? 0.006 : 0.03) * k;  // length, lead
  if (d == Dimension::of(Base::Angle)) return 0.12 * k;                            // angle
  if (d == Dimension::exponents(0, 0, -1, 0, 0, 0, 0, 1)) return 150.0 * k;        // rotational speed
  if (d == Dimension::exponents(2, 1, -2)) return 20.0 * k;                        // torque
  if (d == Dimension::exponents(2, 1, -3)) return 500.0 * k;                       // power
  if (d == Dimension::exponents(-1, 1, -2)) return 200e6 * k;                      // stress, modulus
  if (d == Dimension::exponents(0, 0, 1)) return 30.0 * k;                         // time
  if (d == Dimension::exponents(1, 0, -1)) return 0.01 * k;                        // speed
  if (d.dimensionless()) return 0.1 * k;                                            // friction, ratios...
  return 1.0 * k;
}
}  // namespace

TEST_CASE("every declared formula agrees with its implementation", "[functions][formulas]") {
  int compared = 0;
  for (const FunctionDecl& f : functionLibrary()) {
    if (!f.formula_is_expression) continue;
    SourceFile file("function " + f.name, f.formula);
    Diagnostics diags;
    ExprPtr expr = ExprParser(file, 0, static_cast<uint32_t>(f.formula.size()), &diags).parseWhole();
    INFO(f.name << ": " << f.formula);
    REQUIRE(expr);
    bool any = false;
    for (int set = f.example.empty() ? 0 : -1; set < 40 && !any; ++set) {
      std::vector<double> args;
      std::map<std::string, double> by_name;
      if (set < 0) {
        REQUIRE(f.example.size() == f.args.size());
        args = f.example;
        for (size_t i = 0; i < f.args.size(); ++i) by_name[f.args[i].name] = args[i];
      }
      for (size_t i = 0; set >= 0 && i < f.args.size(); ++i) {
        // Counts (starts, screws, stages) are whole numbers; ratios above 1.
        // Arguments alike in kind differ (an outer diameter above the inner one).
        double v = sample(f.args[i], set) * (1.0 + 0.45 * static_cast<double>(i % 4) * (set % 2 ? 1 : -0.5));
        if (f.args[i].dim.dimensionless() && set % 3 == 2) v = 2 + set / 3;
        if (f.args[i].dim.dimensionless() && set % 3 == 1) v = 0.6 + 0.05 * set;
        args.push_back(v);
        by_name[f.args[i].name] = v;
      }
      double expected;
      try {
        expected = f.eval(args.data());
      } catch (const DomainError&) {
        continue;  // outside this function's limits: try the next set
      }
      EvalFault fault;
      const double got = evalTree(*expr, [&](const Expr& n) { return by_name.count(n.text) ? by_name[n.text] : NAN; }, &fault);
      INFO("sample set " << set << ": " << fault.message);
      REQUIRE_FALSE(fault.node);
      CHECK(got == Approx(expected).epsilon(1e-12).margin(1e-300));
      any = true;
    }
    INFO("no sample set lies inside the function's limits");
    CHECK(any);
    compared += any;
  }
  CHECK(compared > 20);
}
