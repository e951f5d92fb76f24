// The template library (worksheets/templates/): each template runs on its
// own and gives values derived here independently of the drive library's
// formulas: the frictionless limit T = F*l/(2*pi), the friction-angle form
// of the raise and lower torques, published thread dimensions, Euler's
// column. And the demo that uses one template twice.
#include <catch2/catch.hpp>

#include <cmath>

#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::unique_ptr<Calculation> library(const std::string& name, const std::vector<std::string>& sets) {
  CalcOptions options;
  options.sets = sets;
  auto c = Calculation::fromFile(repoPath("worksheets/templates/" + name), options);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  return c;
}

}  // namespace

TEST_CASE("trapezoidal screw stage: thread of the series, frictionless limit, friction-angle form",
          "[template][library]") {
  // Tr 40x7 (ISO 2904 / DIN 103 tables): pitch 7, d2 = 36.5 mm, d3 = 32 mm.
  auto c = library("trapezoidal-screw-stage.calc", {"F=20 kN"});
  CHECK(si(*c, "p") == Approx(0.007));
  CHECK(si(*c, "d_m") == Approx(0.0365));
  CHECK(si(*c, "d_r") == Approx(0.032));
  // The friction-angle form (Shigley, Sec. 8-2, rewritten with tan(phi) = f/cos(alpha)):
  // T_raise = F*dm/2 * tan(lambda + phi), T_lower = F*dm/2 * tan(phi - lambda).
  const double F = 20000, dm = 0.0365, l = 0.007, alpha = 15 * M_PI / 180;
  const double lambda = std::atan(l / (M_PI * dm));
  const double phi = std::atan(0.12 / std::cos(alpha)), phi_low = std::atan(0.08 / std::cos(alpha));
  CHECK(si(*c, "T_thread") == Approx(F * dm / 2 * std::tan(lambda + phi)).epsilon(1e-12));
  CHECK(si(*c, "T_lower") == Approx(F * dm / 2 * std::tan(phi_low - lambda)).epsilon(1e-12));
  CHECK(si(*c, "T_collar") == Approx(F * 0.10 * 0.060 / 2));
  CHECK(si(*c, "T_raise") == Approx(F * dm / 2 * std::tan(lambda + phi) + F * 0.10 * 0.030).epsilon(1e-12));
  CHECK(si(*c, "sigma_a") == Approx(F / (M_PI * 0.032 * 0.032 / 4)));
  CHECK(si(*c, "P") == Approx(si(*c, "T_raise") * 2 * M_PI));  // 60 rpm is 2*pi rad/s

  // Raise minus lower at one friction: F*dm/2 * (tan(lambda + phi) - tan(phi - lambda)).
  auto same = library("trapezoidal-screw-stage.calc", {"F=20 kN", "f_low=0.12"});
  CHECK(si(*same, "T_thread") - si(*same, "T_lower") ==
        Approx(F * dm / 2 * (std::tan(lambda + phi) - std::tan(phi - lambda))).epsilon(1e-12));

  // Without friction the screw is a perfect wedge: T = F*l/(2*pi) both ways, efficiency 1.
  auto ideal = library("trapezoidal-screw-stage.calc", {"F=20 kN", "f=0", "f_low=0", "f_c=0"});
  CHECK(si(*ideal, "T_raise") == Approx(F * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "T_lower") == Approx(-F * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "eta") == Approx(1.0));
  CHECK(ideal->checks[0].passed == false);  // without friction nothing holds the load
}

TEST_CASE("Acme screw stage: the 1 in size, and the frictionless limit", "[template][library]") {
  // 1 in Acme, general purpose (ASME B1.5): 5 threads per inch, dm = d - p/2, dr = d - p.
  auto c = library("acme-screw-stage.calc", {"F=3000 lbf"});
  const double in = 0.0254;
  CHECK(si(*c, "p") == Approx(0.2 * in));
  CHECK(si(*c, "d_m") == Approx(0.9 * in));
  CHECK(si(*c, "d_r") == Approx(0.8 * in));
  const double F = 3000 * 4.4482216152605, l = 0.2 * in;
  auto ideal = library("acme-screw-stage.calc", {"F=3000 lbf", "f=0", "f_c=0", "f_low=0"});
  CHECK(si(*ideal, "T_raise") == Approx(F * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "eta") == Approx(1.0));
}

TEST_CASE("worm reducer, motor choice and column check templates", "[template][library]") {
  auto w = library("worm-reducer.calc", {"T_out=100 [N*m]", "f=0"});
  CHECK(si(*w, "eta") == Approx(1.0));  // no friction, no loss
  CHECK(si(*w, "T_in") == Approx(100.0 / 20));
  CHECK(si(*w, "n_out") == Approx(1450.0 / 20 * 2 * M_PI / 60));

  auto m = library("motor-choice.calc", {"T_screw=40 [N*m]", "screws=2", "i=10", "eta_drive=0.8"});
  CHECK(si(*m, "T_motor") == Approx(40.0 * 2 / (10 * 0.8)));
  CHECK(si(*m, "P_motor") == Approx(40.0 * 2 / (10 * 0.8) * 1450 * 2 * M_PI / 60));
  CHECK(si(*m, "P_rated") >= si(*m, "P_needed"));

  // A long column is Euler's: F_crit = C*pi^2*E*I/L^2, I = pi*dr^4/64.
  auto col = library("column-check.calc", {"F=5 kN", "d_r=20 mm", "L=2000 mm", "C_end=1"});
  const double I = M_PI * std::pow(0.020, 4) / 64;
  CHECK(si(*col, "s_ratio") > si(*col, "s_transition"));
  CHECK(si(*col, "F_crit") == Approx(1 * M_PI * M_PI * 210e9 * I / (2.0 * 2.0)).epsilon(1e-9));
  CHECK(si(*col, "n_buckle") == Approx(si(*col, "F_crit") / 5000));
}

TEST_CASE("templates of templates: the twin-screw drive uses the screw stage twice", "[template][library]") {
  auto c = library("twin-screw-drive.calc", {"F_total=50 kN", "share=0.6"});
  auto first = library("trapezoidal-screw-stage.calc", {"F=30 kN"});
  auto second = library("trapezoidal-screw-stage.calc", {"F=20 kN"});
  CHECK(si(*c, "first.T_raise") == Approx(si(*first, "T_raise")).epsilon(1e-15));
  CHECK(si(*c, "second.T_raise") == Approx(si(*second, "T_raise")).epsilon(1e-15));
  CHECK(si(*c, "T_out") == Approx(si(*first, "T_raise") + si(*second, "T_raise")));
  CHECK(si(*c, "reducer.n_in") == Approx(60.0 * 20 * 2 * M_PI / 60));
  CHECK(si(*c, "motor.T_screw") == Approx(si(*c, "reducer.T_in")));
}

TEST_CASE("the platform-lift demo uses one template twice with different bindings", "[template][library]") {
  auto c = Calculation::fromFile(repoPath("worksheets/platform-lift.calc"));
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->allChecksPass());
  const double F_total = (1800 + 1500) * 9.80665;
  CHECK(si(*c, "heavy.F") == Approx(F_total * 0.62));
  CHECK(si(*c, "light.F") == Approx(F_total * 0.38));
  CHECK(si(*c, "heavy.d") == Approx(0.044));
  CHECK(si(*c, "light.d") == Approx(0.040));
  // The same template with the same inputs gives the same numbers on its own.
  auto alone = library("trapezoidal-screw-stage.calc",
                       {"F=" + std::to_string(F_total * 0.62) + " N", "d=44 mm", "L_col=800 mm"});
  CHECK(si(*c, "heavy.n_buckle") == Approx(si(*alone, "n_buckle")).epsilon(1e-12));
  REQUIRE(c->sheet.files.size() == 3);
  CHECK(c->sheet.files[1].path == "templates/trapezoidal-screw-stage.calc");
  CHECK(c->sheet.files[2].path == "templates/motor-choice.calc");
}
