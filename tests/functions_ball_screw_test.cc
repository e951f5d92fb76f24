// Ball screws: torque from efficiency against Shigley's Example 8-1 figures,
// life per the ISO 3408-5 definition of the dynamic rating, the cubic mean of
// a duty cycle, and the critical-speed factors printed by ball screw makers.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>
#include <vector>

#include "tests/function_calls.h"
#include "functions/function_decl.h"

namespace {

using calctrail::DomainError;
using calctrail::FunctionDecl;
using calctrail::findFunction;

constexpr double kPi = 3.14159265358979323846;
constexpr double mm = 1e-3;
constexpr double kN = 1e3;
constexpr double rpm = 2 * kPi / 60;
constexpr double rev = 2 * kPi;

using calctrail::test::call;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE("ball_screw_drive_torque: Shigley Example 8-1, efficiency 0.311 means 26.18 N*m (from memory)",
          "[functions][ball_screw]") {
  // The relation T = F*l/(2*pi*e) holds for any screw; the example's overall figures satisfy it.
  CHECK(call("ball_screw_drive_torque", {6400, 8 * mm, 0.311}) == Approx(26.18).margin(0.03));
  // Independent: efficiency 1 is the frictionless screw.
  CHECK(call("ball_screw_drive_torque", {6400, 8 * mm, 1}) == Approx(call("torque_raise", {6400, 30 * mm, 8 * mm, 0, 0})));
}

TEST_CASE("ball_screw_backdrive_torque: Shigley Example 8-1, back-driving torque 0.466 N*m (from memory)",
          "[functions][ball_screw]") {
  const double eta_b = call("screw_backdrive_efficiency", {30 * mm, 8 * mm, 0.08, 0});
  CHECK(call("ball_screw_backdrive_torque", {6400, 8 * mm, eta_b}) == Approx(0.466).margin(0.0005));
  // Independent: energy balance, the torque times one revolution is eta_b times the load's work over one lead.
  CHECK(call("ball_screw_backdrive_torque", {10 * kN, 10 * mm, 0.85}) * 2 * kPi == Approx(0.85 * 10 * kN * 10 * mm));
}

TEST_CASE("ball_screw_life: ISO 3408-5, the dynamic rating gives 10^6 revolutions by definition",
          "[functions][ball_screw]") {
  CHECK(call("ball_screw_life", {20 * kN, 20 * kN}) == Approx(1e6 * rev));
  // Independent: the cube law, half the load gives eight times the life.
  CHECK(call("ball_screw_life", {20 * kN, 5 * kN}) == Approx(8 * call("ball_screw_life", {20 * kN, 10 * kN})));
  CHECK(call("ball_screw_life", {30 * kN, 3 * kN}) / rev == Approx(1e9));
}

TEST_CASE("cubic_mean_load: ISO 3408-5 equivalent load of a two-step cycle (from memory)",
          "[functions][ball_screw]") {
  // Fm = ((F1^3*n1*q1 + F2^3*n2*q2)/(n1*q1 + n2*q2))^(1/3): 4 kN at 100 rpm for 25 %, 1 kN at 300 rpm for 75 %.
  const double expected = std::cbrt((64.0 * 100 * 0.25 + 1.0 * 300 * 0.75) / (100 * 0.25 + 300 * 0.75)) * kN;
  CHECK(call("cubic_mean_load", {4 * kN, 100 * rpm, 0.25, 1 * kN, 300 * rpm, 0.75}) == Approx(expected));
  // Independent: equal loads give that load; a step that does not turn does not count.
  CHECK(call("cubic_mean_load", {3 * kN, 100 * rpm, 0.3, 3 * kN, 500 * rpm, 0.7}) == Approx(3 * kN));
  CHECK(call("cubic_mean_load", {3 * kN, 100 * rpm, 0.3, 9 * kN, 0, 0.7}) == Approx(3 * kN));
  // Speeds in any unit: only their ratios count.
  CHECK(call("cubic_mean_load", {4 * kN, 100, 0.25, 1 * kN, 300, 0.75}) == Approx(expected));
}

TEST_CASE("cubic_mean_load: ISO 3408-5 equivalent load of a three-step cycle (from memory)",
          "[functions][ball_screw]") {
  const double expected =
      std::cbrt((8.0 * 50 * 0.2 + 27.0 * 100 * 0.5 + 1.0 * 1000 * 0.3) / (50 * 0.2 + 100 * 0.5 + 1000 * 0.3)) * kN;
  CHECK(call("cubic_mean_load", {2 * kN, 50 * rpm, 0.2, 3 * kN, 100 * rpm, 0.5, 1 * kN, 1000 * rpm, 0.3}) ==
        Approx(expected));
  // Independent: a third step with no time reduces to the two-step cycle.
  CHECK(call("cubic_mean_load", {2 * kN, 50 * rpm, 0.2, 3 * kN, 100 * rpm, 0.5, 7 * kN, 1000 * rpm, 0}) ==
        Approx(call("cubic_mean_load", {2 * kN, 50 * rpm, 0.2, 3 * kN, 100 * rpm, 0.5})));
}

TEST_CASE("cubic_mean_load: a cycle that never turns is an error", "[functions][ball_screw][limits]") {
  CHECK_THAT(errorOf("cubic_mean_load", {1 * kN, 0, 0.5, 2 * kN, 100 * rpm, 0}), Catch::Contains("no revolutions"));
  CHECK_THAT(errorOf("cubic_mean_load", {-1 * kN, 10, 0.5, 2 * kN, 100 * rpm, 0.5}),
             Catch::Contains("load F1 = -1000 N must be >= 0"));
  // A step past the declared ones is named by its number.
  CHECK_THAT(errorOf("cubic_mean_load", {1 * kN, 10, 0.5, 2 * kN, 100 * rpm, 0.5, 1 * kN, -5 * rpm, 0.1}),
             Catch::Contains("speed n3 = -5 rpm must be >= 0"));
}

TEST_CASE("critical_speed: ball screw makers' factors 21.9, 15.1, 9.7, 3.4 (x 10^7 dr/L^2 rpm, mm, with 0.8, "
          "common practice, from memory)",
          "[functions][ball_screw]") {
  // Steel as the catalogues take it: E = 206 GPa, density 7850 kg/m^3.
  const double E = 206e9, rho = 7850, dr = 30 * mm, L = 2.0;
  const struct {
    double fixity, factor;
  } cases[] = {{4.730, 21.9}, {3.927, 15.1}, {kPi, 9.7}, {1.875, 3.4}};
  for (const auto& c : cases) {
    const double n_rpm = call("critical_speed", {dr, L, c.fixity, E, rho}) / rpm;
    const double factor = 0.8 * n_rpm * (L / mm) * (L / mm) / (dr / mm) / 1e7;
    INFO("fixity " << c.fixity);
    CHECK(std::round(factor * 10) / 10 == Approx(c.factor));
  }
}

TEST_CASE("critical_speed: proportional to dr/L^2", "[functions][ball_screw]") {
  const double n = call("critical_speed", {30 * mm, 2.0, kPi, 206e9, 7850});
  CHECK(call("critical_speed", {30 * mm, 4.0, kPi, 206e9, 7850}) == Approx(n / 4));
  CHECK(call("critical_speed", {60 * mm, 2.0, kPi, 206e9, 7850}) == Approx(n * 2));
}

TEST_CASE("ball screws: inputs out of range", "[functions][ball_screw][limits]") {
  CHECK_THAT(errorOf("ball_screw_drive_torque", {1000, 5 * mm, 1.2}),
             Catch::Contains("efficiency eta = 1.2 must be <= 1"));
  CHECK_THAT(errorOf("ball_screw_drive_torque", {1000, 5 * mm, 0}), Catch::Contains("efficiency eta = 0 must be > 0"));
  CHECK_THAT(errorOf("ball_screw_life", {20 * kN, 0}), Catch::Contains("mean load Fm = 0 N must be > 0"));
  CHECK_THAT(errorOf("critical_speed", {30 * mm, 2.0, 5, 206e9, 7850}),
             Catch::Contains("end-fixity factor = 5 must be <= 4.730"));
}

TEST_CASE("cubic_mean_load: any number of steps, four steps of a cycle (ISO 3408-5, from memory)",
          "[functions][ball_screw]") {
  const std::vector<double> four = {5 * kN, 50 * rpm, 0.1, 3 * kN, 400 * rpm, 0.4, 1 * kN, 1000 * rpm, 0.3,
                                    0.5 * kN, 1500 * rpm, 0.2};
  const double expected = std::cbrt((125.0 * 50 * 0.1 + 27.0 * 400 * 0.4 + 1.0 * 1000 * 0.3 + 0.125 * 1500 * 0.2) /
                                    (50 * 0.1 + 400 * 0.4 + 1000 * 0.3 + 1500 * 0.2)) *
                          kN;
  CHECK(call("cubic_mean_load", four) == Approx(expected));
  // Independent: a step repeated with its time split in two is the same cycle.
  std::vector<double> split = four;
  split[11] = 0.1;
  for (double v : {0.5 * kN, 1500 * rpm, 0.1}) split.push_back(v);
  CHECK(call("cubic_mean_load", split) == Approx(expected));
}

TEST_CASE("ball_screw_static_safety: C0a over the peak load, the makers' definition", "[functions][ball_screw]") {
  CHECK(call("ball_screw_static_safety", {60 * kN, 12 * kN}) == Approx(5));
  CHECK(call("ball_screw_static_safety", {60 * kN, 60 * kN}) == Approx(1));  // independent: at the rating, 1
}

TEST_CASE("ball_screw_reliability_factor: ISO 3408-5 a1 = 1, 0.62, 0.53, 0.44, 0.33, 0.21 for 90 ... 99 % "
          "(from memory)",
          "[functions][ball_screw]") {
  const struct {
    double R, a1;
  } rows[] = {{90, 1}, {95, 0.62}, {96, 0.53}, {97, 0.44}, {98, 0.33}, {99, 0.21}};
  for (const auto& r : rows) {
    INFO("R = " << r.R << " %");
    CHECK(call("ball_screw_reliability_factor", {r.R / 100}) == Approx(r.a1));
    // Independent: the Weibull distribution of rolling-contact life with slope 3/2 (ball bearings and screws),
    // L_R/L_10 = (ln(1/R)/ln(1/0.9))^(2/3), rounded to two decimals as the table prints it.
    const double weibull = std::pow(std::log(100 / r.R) / std::log(1 / 0.9), 2.0 / 3.0);
    CHECK(std::round(weibull * 100) / 100 == Approx(r.a1));
  }
  CHECK_THAT(errorOf("ball_screw_reliability_factor", {0.93}), Catch::Contains("R = 93 % is not a row"));
}

TEST_CASE("ball_screw_life_adjusted, _hours, _travel: (Ca/(fw*Fm))^3 million revolutions, times a1 (ISO 3408-5, "
          "from memory)",
          "[functions][ball_screw]") {
  // Ca = 30 kN, Fm = 3 kN, fw = 1.2: (30/3.6)^3 = 578.7 million revolutions; at 500 rpm 19 290 h; lead 10 mm 5787 km.
  CHECK(call("ball_screw_life_adjusted", {30 * kN, 3 * kN, 1, 1.2}) / rev == Approx(578.7e6).epsilon(1e-4));
  CHECK(call("ball_screw_life_hours", {30 * kN, 3 * kN, 1, 1.2, 500 * rpm}) / 3600 == Approx(19290).epsilon(1e-4));
  CHECK(call("ball_screw_life_travel", {30 * kN, 3 * kN, 1, 1.2, 10 * mm}) / 1000 == Approx(5787).epsilon(1e-4));
  // Independent: a1 = fw = 1 is the basic life; fw enters cubed; hours times speed is revolutions.
  CHECK(call("ball_screw_life_adjusted", {30 * kN, 3 * kN, 1, 1}) == Approx(call("ball_screw_life", {30 * kN, 3 * kN})));
  CHECK(call("ball_screw_life_adjusted", {30 * kN, 3 * kN, 0.62, 2}) ==
        Approx(0.62 / 8 * call("ball_screw_life", {30 * kN, 3 * kN})));
  CHECK(call("ball_screw_life_hours", {30 * kN, 3 * kN, 0.62, 1.3, 700 * rpm}) * 700 * rpm ==
        Approx(call("ball_screw_life_adjusted", {30 * kN, 3 * kN, 0.62, 1.3})));
  CHECK_THAT(errorOf("ball_screw_life_adjusted", {30 * kN, 3 * kN, 1, 0.8}), Catch::Contains("load factor fw = 0.8 must be >= 1"));
  CHECK_THAT(calctrail::test::doubtsOf("ball_screw_life_adjusted", {30 * kN, 3 * kN, 1, 5}),
             Catch::Contains("fw = 5 is outside the usual range 1 to 3"));
}

TEST_CASE("ball_screw_dn_speed: d*n 70 000 on a 40 mm ball circle allows 1750 rpm (makers' rule, from memory)",
          "[functions][ball_screw]") {
  CHECK(call("ball_screw_dn_speed", {40 * mm, 70000}) / rpm == Approx(1750));
  // Independent: the product in mm*rpm is what the rule fixes, whatever the diameter.
  for (double d0 : {16.0, 25.0, 63.0})
    CHECK(call("ball_screw_dn_speed", {d0 * mm, 70000}) / rpm * d0 == Approx(70000));
}

TEST_CASE("ball_screw_preload_torque: the catalogue coefficient 0.05/sqrt(tan(beta)), 0.177 at a 10 mm lead on a "
          "40 mm ball circle (from memory)",
          "[functions][ball_screw]") {
  const double tan_beta = 10 * mm / (kPi * 40 * mm);
  const double K = 0.05 / std::sqrt(tan_beta);
  CHECK(K == Approx(0.1772).margin(5e-5));
  CHECK(call("ball_screw_preload_torque", {1500, 10 * mm, 40 * mm}) == Approx(K * 1500 * 10 * mm / (2 * kPi)));
  CHECK(call("ball_screw_preload_torque", {1500, 10 * mm, 40 * mm}) == Approx(0.423).margin(5e-4));
  // Independent: the torque goes with Fpr*sqrt(l*d0): twice the ball circle, sqrt(2) times the torque.
  CHECK(call("ball_screw_preload_torque", {1500, 10 * mm, 80 * mm}) ==
        Approx(std::sqrt(2.0) * call("ball_screw_preload_torque", {1500, 10 * mm, 40 * mm})));
}

TEST_CASE("plausibility: critical_speed with a fixity of no end condition, E = 207 MPa or rho = 78.5 kg/m^3 warns",
          "[functions][ball_screw][plausibility]") {
  const double dr = 30 * mm, L = 2.0;
  CHECK(calctrail::test::doubtsOf("critical_speed", {dr, L, kPi, 206e9, 7850}).empty());
  CHECK_THAT(calctrail::test::doubtsOf("critical_speed", {dr, L, 2.5, 206e9, 7850}),
             Catch::Contains("end-fixity factor = 2.5 matches no end condition"));
  CHECK_THAT(calctrail::test::doubtsOf("critical_speed", {dr, L, kPi, 207e6, 7850}),
             Catch::Contains("E = 0.207 GPa is outside the usual range 40 to 250 GPa") &&
                 Catch::Contains("off by a factor of about 1000"));
  CHECK_THAT(calctrail::test::doubtsOf("critical_speed", {dr, L, kPi, 206e9, 78.5}),
             Catch::Contains("rho = 78.5 kg/m^3 is outside the usual range 1500 to 9500 kg/m^3"));
  CHECK_THAT(errorOf("critical_speed", {dr, L, kPi, 206e9, 78500}), Catch::Contains("above that of any solid"));
}
