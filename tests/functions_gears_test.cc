// Gear reductions and worm gear efficiency: train values, power balance, and
// the worm formula against the power-screw relation it restates.
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
constexpr double deg = kPi / 180;
constexpr double rpm = 2 * kPi / 60;
constexpr double hp = 550 * 0.3048 * 0.45359237 * 9.80665;  // 550 ft*lbf/s, exact definition (NIST SP 811)

using calctrail::test::call;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE("overall_ratio: two 16/88 stages make 30.25 for a 30:1 target, Shigley's gear-train example "
          "(from memory)",
          "[functions][gears]") {
  CHECK(call("overall_ratio", {88.0 / 16, 88.0 / 16}) == Approx(30.25));
  // Independent: speeds through the stages one by one.
  const double n = call("output_speed", {call("output_speed", {1450 * rpm, 88.0 / 16}), 88.0 / 16});
  CHECK(1450 * rpm / n == Approx(call("overall_ratio", {88.0 / 16, 88.0 / 16})));
}

TEST_CASE("overall_ratio: an idler stage (ratio 1) leaves the train value unchanged (Shigley, from memory)",
          "[functions][gears]") {
  CHECK(call("overall_ratio", {88.0 / 16, 1, 88.0 / 16}) == Approx(30.25));
  CHECK(call("overall_ratio", {2, 3, 4}) == Approx(call("overall_ratio", {6, 4})));  // independent: associativity
}

TEST_CASE("overall_efficiency: power balance through the chain", "[functions][gears]") {
  // Independent energy balance: power through each stage in turn equals power through the chain.
  const double P_in = 1000;
  const double stagewise = P_in * 0.97 * 0.95;
  CHECK(call("overall_efficiency", {0.97, 0.95}) * P_in == Approx(stagewise));
  CHECK(call("overall_efficiency", {0.97, 0.95, 0.9}) == Approx(call("overall_efficiency", {0.97 * 0.95, 0.9})));
  CHECK(call("overall_efficiency", {1, 1, 1}) == 1.0);
}

TEST_CASE("output_torque and output_speed: energy balance through a reduction", "[functions][gears]") {
  const double T_in = 20, n_in = 1450 * rpm, i = 25, eta = 0.8;
  const double P_in = T_in * n_in;
  const double P_out = call("output_torque", {T_in, i, eta}) * call("output_speed", {n_in, i});
  CHECK(P_out == Approx(eta * P_in));
  CHECK(call("input_power", {P_out, eta}) == Approx(P_in));
  CHECK(call("output_speed", {1450 * rpm, 30.25}) / rpm == Approx(47.93).margin(0.005));
}

TEST_CASE("input_power: 1 hp out at 50 % efficiency takes 2 hp in (hp = 550 ft*lbf/s, NIST SP 811)",
          "[functions][gears]") {
  CHECK(call("input_power", {hp, 0.5}) == Approx(2 * hp));
  CHECK(hp == Approx(745.7).margin(0.05));
}

TEST_CASE("worm_efficiency: Shigley Example 8-1's thread as a worm, 0.511 from its 15.94 N*m (from memory)",
          "[functions][gears]") {
  // A worm is a screw: lambda = atan(8/(30*pi)), phi_n = 0, f = 0.08; e = F*l/(2*pi*T_R) = 51.2/(2*pi*15.94).
  const double lam = std::atan(8 * mm / (kPi * 30 * mm));
  CHECK(call("worm_efficiency", {lam, 0, 0.08}) == Approx(6400 * 8 * mm / (2 * kPi * 15.94)).epsilon(5e-4));
  CHECK(call("worm_efficiency", {10 * deg, 20 * deg, 0}) == Approx(1.0));  // independent: no friction
}

TEST_CASE("worm_backdrive_efficiency: self-locks when f exceeds cos(phi_n)*tan(lambda)", "[functions][gears]") {
  const double limit = std::cos(20 * deg) * std::tan(5 * deg);  // 0.0822
  CHECK(call("worm_backdrive_efficiency", {5 * deg, 20 * deg, limit}) == Approx(0).margin(1e-12));
  // Beyond the limit the formula's value (negative) is no efficiency: an error that says why.
  CHECK_THAT(errorOf("worm_backdrive_efficiency", {5 * deg, 20 * deg, 0.1}),
             Catch::Contains("self-locking, back-driving efficiency not defined"));
  CHECK(call("worm_backdrive_efficiency", {5 * deg, 20 * deg, 0.05}) > 0);
  // Shigley Example 8-1's thread driven by its load: the back-driving torque 0.466 N*m (from memory).
  const double lam = std::atan(8 * mm / (kPi * 30 * mm));
  CHECK(6400 * 8 * mm * call("worm_backdrive_efficiency", {lam, 0, 0.08}) / (2 * kPi) == Approx(0.466).margin(5e-4));
}

TEST_CASE("worm_efficiency: a lead angle beyond the friction limit cannot drive", "[functions][gears][limits]") {
  CHECK_THAT(errorOf("worm_efficiency", {80 * deg, 20 * deg, 0.2}), Catch::Contains("cannot drive"));
  CHECK_THAT(errorOf("worm_efficiency", {90 * deg, 20 * deg, 0.05}), Catch::Contains("must be < 90 deg"));
  CHECK_THAT(errorOf("worm_efficiency", {10 * deg, 20 * deg, -0.05}), Catch::Contains("friction f = -0.05 must be >= 0"));
}

TEST_CASE("gears: ratios and efficiencies out of range", "[functions][gears][limits]") {
  CHECK_THAT(errorOf("overall_ratio", {0, 3}), Catch::Contains("ratio i1 = 0 must be > 0"));
  CHECK_THAT(errorOf("overall_efficiency", {0.9, 95}), Catch::Contains("efficiency eta2 = 95 must be <= 1"));
  CHECK_THAT(errorOf("output_torque", {-1, 3, 0.9}), Catch::Contains("input torque T_in = -1 N*m must be >= 0"));
}

TEST_CASE("worm_self_locking_margin: locks at standstill with static friction, runs on with running friction "
          "(Shigley's worm condition f > cos(phi_n)*tan(lambda), from memory)",
          "[functions][gears]") {
  // lambda = 5 deg, phi_n = 20 deg: the limit is 0.0822. Static friction 0.10 locks; running 0.05 does not.
  CHECK(call("worm_self_locking_margin", {5 * deg, 20 * deg, 0.10}) == Approx(0.10 - 0.082213).margin(1e-6));
  CHECK(call("worm_self_locking_margin", {5 * deg, 20 * deg, 0.10}) > 0);
  CHECK(call("worm_self_locking_margin", {5 * deg, 20 * deg, 0.05}) < 0);
  // Independent: where it does not lock, the back-driving efficiency exists and is positive; where it locks,
  // the efficiency is refused.
  for (double fx : {0.01, 0.03, 0.05, 0.08, 0.09, 0.12}) {
    INFO("f = " << fx);
    const double margin = call("worm_self_locking_margin", {5 * deg, 20 * deg, fx});
    if (margin < 0)
      CHECK(call("worm_backdrive_efficiency", {5 * deg, 20 * deg, fx}) > 0);
    else
      CHECK_THAT(errorOf("worm_backdrive_efficiency", {5 * deg, 20 * deg, fx}), Catch::Contains("self-locking"));
  }
}

TEST_CASE("brake_holding_torque: the back-driving torque of a ball screw referred to the motor shaft, energy "
          "balance (from memory)",
          "[functions][gears]") {
  // 10 kN on a 10 mm lead, back-driving efficiency 0.85: 13.53 N*m at the screw; a 2:1 belt back-driven at 0.95,
  // safety factor 2: 2 * 13.53 * 0.95 / 2 = 12.85 N*m at the motor.
  const double T_back = call("ball_screw_backdrive_torque", {10000, 10 * mm, 0.85});
  CHECK(T_back == Approx(13.53).margin(0.005));
  CHECK(call("brake_holding_torque", {T_back, 2, 0.95, 2}) == Approx(12.85).margin(0.005));
  // Independent: power balance, the power the load feeds back times the reduction's efficiency reaches the brake.
  const double omega_screw = 100 * rpm, i = 3;
  CHECK(call("brake_holding_torque", {T_back, i, 0.9, 1}) * omega_screw * i == Approx(T_back * omega_screw * 0.9));
  CHECK_THAT(errorOf("brake_holding_torque", {T_back, 2, 0.95, 0.8}), Catch::Contains("safety factor S = 0.8 must be >= 1"));
}
