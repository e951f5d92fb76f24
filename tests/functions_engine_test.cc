// The drive library through the engine: repeated argument groups in a
// worksheet (dimension check, compiled arithmetic, interpreter, trail), and
// plausibility warnings as FILE:LINE:COL: warning diagnostics at the call,
// with the quoted inputs of the issue.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "engine/model/evaluate.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

TEST_CASE("engine: overall_ratio and overall_efficiency take any number of stages", "[functions][engine]") {
  auto c = calc(
      "i = overall_ratio(5.5, 1, 5.5, 2)\n"
      "eta = overall_efficiency(0.97, 0.95, 0.9)\n"
      "two = overall_ratio(3, 4)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "i") == Approx(60.5));
  CHECK(si(*c, "eta") == Approx(0.97 * 0.95 * 0.9));
  CHECK(si(*c, "two") == Approx(12));
}

TEST_CASE("engine: cubic_mean_load and rms_torque take any number of steps, each checked for its dimension",
          "[functions][engine]") {
  auto c = calc(
      "Fm = cubic_mean_load(4 kN, 100 rpm, 0.25, 1 kN, 300 rpm, 0.5, 2 kN, 200 rpm, 0.25)\n"
      "T = rms_torque(3 [N*m], 0.2 s, 1 [N*m], 0.5 s, 0 [N*m], 1 s)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const double expected = std::cbrt((64.0 * 100 * 0.25 + 1.0 * 300 * 0.5 + 8.0 * 200 * 0.25) /
                                    (100 * 0.25 + 300 * 0.5 + 200 * 0.25));
  CHECK(si(*c, "Fm") == Approx(expected * 1000));
  CHECK(si(*c, "T") == Approx(std::sqrt((9 * 0.2 + 0.5) / 1.7)));
  // The third step's speed is checked like the first's, and named by its number.
  auto bad = calc("Fm = cubic_mean_load(4 kN, 100 rpm, 0.25, 1 kN, 300 rpm, 0.5, 2 kN, 200 mm, 0.25)\n");
  CHECK_THAT(diagnostics(*bad),
             Catch::Contains("argument 8 of `cubic_mean_load` (n3, screw speed of step 2 or of a "
                             "further step) must be rotational speed (rpm), not length"));
  // An incomplete group is an error that says what the function takes.
  auto partial = calc("Fm = cubic_mean_load(4 kN, 100 rpm, 0.25, 1 kN, 300 rpm, 0.5, 2 kN)\n");
  CHECK_THAT(
      diagnostics(*partial),
      Catch::Contains("`cubic_mean_load` takes F1, n1, q1, F2, n2, q2, then any number of further groups "
                      "of 3 like the last (F3, n3, q3, ...); here 7 arguments"));
  auto one = calc("i = overall_ratio(3)\n");
  CHECK_THAT(diagnostics(*one), Catch::Contains("`overall_ratio` takes i1, i2, then any number of further "
                                                "arguments like the last (i3, ...); here 1 arguments"));
}

TEST_CASE("engine: a call outside the usual range is a warning at the argument, and still a value",
          "[functions][engine][plausibility]") {
  // The inputs: E = 207 MPa and rho = 78.5 kg/m^3 for a steel screw, 0.2 engaged threads.
  auto c = calc(
      "dr = 28 mm\n"
      "n_c = critical_speed(dr, 1.5 m, 3.927, 207 MPa, 78.5 [kg/m^3])\n"
      "p_b = thread_bearing_pressure(6.4 kN, 30 mm, 4 mm, 0.2)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const std::string d = diagnostics(*c);
  CHECK_THAT(d,
             Catch::Contains("sheet.calc:2:40: warning: `critical_speed`: E = 0.207 GPa is outside the usual "
                             "range 40 to 250 GPa"));
  CHECK_THAT(d, Catch::Contains("sheet.calc:2:49: warning: `critical_speed`: rho = 78.5 kg/m^3 is outside"));
  CHECK_THAT(d, Catch::Contains("sheet.calc:3:52: warning: `thread_bearing_pressure`: nt = 0.2 is outside"));
  CHECK(c->diags.warningCount() == 3);
  CHECK(std::isfinite(si(*c, "n_c")));
  // A plausible sheet has no warning.
  auto fine = calc("n_c = critical_speed(28 mm, 1.5 m, 3.927, 207 GPa, 7850 [kg/m^3])\n");
  CHECK(fine->diags.warningCount() == 0);
}

TEST_CASE("engine: euler_load below the transition warns, and a fixity of no end condition warns",
          "[functions][engine][plausibility]") {
  auto c = calc(
      "P = euler_load(37.5 mm, 0.76 m, 1, 207 GPa)\n"
      "n = critical_speed(28 mm, 1.5 m, 2.5, 207 GPa, 7850 [kg/m^3])\n");
  const std::string d = diagnostics(*c);
  CHECK_THAT(d, Catch::Contains("sheet.calc:1:25: warning: `euler_load`: the Euler stress"));
  CHECK_THAT(d, Catch::Contains("use buckling_load(dr, L, C, E, Sy)"));
  CHECK_THAT(d,
             Catch::Contains("sheet.calc:2:34: warning: `critical_speed`: end-fixity factor = 2.5 matches no "
                             "end condition"));
}

TEST_CASE("engine: warnings of a --set and of a re-run cone are those of a full evaluation",
          "[functions][engine][plausibility]") {
  auto c = calc("rho = 7850 [kg/m^3]\nn = critical_speed(28 mm, 1.5 m, 3.927, 207 GPa, rho)\n",
                {"rho=78.5 [kg/m^3]"});
  CHECK(c->diags.warningCount() == 1);
  const Model& m = *c->model;
  Inputs base(m);
  const Results plain = evaluate(m, base);
  CHECK(plain.warnings.empty());
  Inputs changed(m, &base);
  Diagnostics diags;
  changed.set("rho=78.5 [kg/m^3]", &diags);
  const Results full = evaluate(m, changed);
  const Results cone = evaluateCone(m, changed, plain);
  REQUIRE(full.warnings.size() == 1);
  REQUIRE(cone.warnings.size() == 1);
  CHECK(cone.warnings[0].message == full.warnings[0].message);
  CHECK(cone.warnings[0].begin == full.warnings[0].begin);
  // Back to the plain value: the cone drops the warning again.
  Inputs back(m, &changed);
  back.set("rho=7850 [kg/m^3]", &diags);
  CHECK(evaluateCone(m, back, full).warnings.empty());
}

TEST_CASE("engine: swapped thread arguments name both quantities once", "[functions][engine][threads]") {
  auto c = calc("d = 40 mm\np = 7 mm\nd2 = trap_pitch_dia(p, d)\n");
  const std::string d = diagnostics(*c);
  CHECK_THAT(
      d, Catch::Contains("argument 2 (pitch p) = 40 mm must be smaller than argument 1 (major diameter d) = "
                         "7 mm of a trapezoidal thread; the two look swapped"));
  CHECK_THAT(d, Catch::Contains("(with p = 7.000 mm, d = 40.00 mm)"));
}

TEST_CASE("engine: a self-locking thread has no back-driving efficiency", "[functions][engine]") {
  auto c = calc("eta_b = screw_backdrive_efficiency(36.5 mm, 7 [mm/rev], 0.15, 15 deg)\n");
  CHECK_THAT(diagnostics(*c),
             Catch::Contains("error: `eta_b` cannot be calculated: `screw_backdrive_efficiency`: "
                             "self-locking, back-driving efficiency not defined"));
}
