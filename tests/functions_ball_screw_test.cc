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

TEST_CASE("cubic_mean_load_2: ISO 3408-5 equivalent load of a two-step cycle (from memory)",
          "[functions][ball_screw]") {
  // Fm = ((F1^3*n1*q1 + F2^3*n2*q2)/(n1*q1 + n2*q2))^(1/3): 4 kN at 100 rpm for 25 %, 1 kN at 300 rpm for 75 %.
  const double expected = std::cbrt((64.0 * 100 * 0.25 + 1.0 * 300 * 0.75) / (100 * 0.25 + 300 * 0.75)) * kN;
  CHECK(call("cubic_mean_load_2", {4 * kN, 100 * rpm, 0.25, 1 * kN, 300 * rpm, 0.75}) == Approx(expected));
  // Independent: equal loads give that load; a step that does not turn does not count.
  CHECK(call("cubic_mean_load_2", {3 * kN, 100 * rpm, 0.3, 3 * kN, 500 * rpm, 0.7}) == Approx(3 * kN));
  CHECK(call("cubic_mean_load_2", {3 * kN, 100 * rpm, 0.3, 9 * kN, 0, 0.7}) == Approx(3 * kN));
  // Speeds in any unit: only their ratios count.
  CHECK(call("cubic_mean_load_2", {4 * kN, 100, 0.25, 1 * kN, 300, 0.75}) == Approx(expected));
}

TEST_CASE("cubic_mean_load_3: ISO 3408-5 equivalent load of a three-step cycle (from memory)",
          "[functions][ball_screw]") {
  const double expected =
      std::cbrt((8.0 * 50 * 0.2 + 27.0 * 100 * 0.5 + 1.0 * 1000 * 0.3) / (50 * 0.2 + 100 * 0.5 + 1000 * 0.3)) * kN;
  CHECK(call("cubic_mean_load_3", {2 * kN, 50 * rpm, 0.2, 3 * kN, 100 * rpm, 0.5, 1 * kN, 1000 * rpm, 0.3}) ==
        Approx(expected));
  // Independent: a third step with no time reduces to the two-step cycle.
  CHECK(call("cubic_mean_load_3", {2 * kN, 50 * rpm, 0.2, 3 * kN, 100 * rpm, 0.5, 7 * kN, 1000 * rpm, 0}) ==
        Approx(call("cubic_mean_load_2", {2 * kN, 50 * rpm, 0.2, 3 * kN, 100 * rpm, 0.5})));
}

TEST_CASE("cubic_mean_load: a cycle that never turns is an error", "[functions][ball_screw][limits]") {
  CHECK_THAT(errorOf("cubic_mean_load_2", {1 * kN, 0, 0.5, 2 * kN, 100 * rpm, 0}), Catch::Contains("no revolutions"));
  CHECK_THAT(errorOf("cubic_mean_load_2", {-1 * kN, 10, 0.5, 2 * kN, 100 * rpm, 0.5}),
             Catch::Contains("load F1 = -1000 N must be >= 0"));
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
