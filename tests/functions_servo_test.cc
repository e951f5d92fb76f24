// Servo sizing: inertia of a screw shaft against the solid-cylinder formula of
// Machinery's Handbook (from memory), inertia through a screw and a reduction
// by the balance of kinetic energy, the acceleration torque, a trapezoidal
// move and the RMS torque of a duty cycle by brute-force integration.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>
#include <vector>

#include "tests/function_calls.h"

namespace {

constexpr double kPi = 3.14159265358979323846;
constexpr double mm = 1e-3;
constexpr double rpm = 2 * kPi / 60;

using calctrail::test::call;
using calctrail::test::doubtsOf;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE(
    "screw_inertia: a solid cylinder, J = m*d^2/8 (Machinery's Handbook, from memory): 32 mm x 1.2 m steel "
    "is 9.70 kg*cm^2",
    "[functions][servo]") {
  const double d = 32 * mm, L = 1.2, rho = 7850;
  const double m = rho * kPi * d * d / 4 * L;
  CHECK(call("screw_inertia", {d, L, rho}) == Approx(m * d * d / 8));
  CHECK(call("screw_inertia", {d, L, rho}) * 1e4 == Approx(9.70).margin(0.005));
  // Independent: the integral of r^2 dm over thin rings, summed numerically.
  double J = 0;
  const int rings = 20000;
  for (int k = 0; k < rings; ++k) {
    const double r = (k + 0.5) * (d / 2) / rings, dr = (d / 2) / rings;
    J += r * r * rho * 2 * kPi * r * dr * L;
  }
  CHECK(call("screw_inertia", {d, L, rho}) == Approx(J).epsilon(1e-6));
  CHECK_THAT(doubtsOf("screw_inertia", {d, L, 78.5}),
             Catch::Contains("rho = 78.5 kg/m^3 is outside the usual range"));
}

TEST_CASE("load_inertia_screw: m*(l/(2*pi))^2, the servo makers' formula (from memory), by kinetic energy",
          "[functions][servo]") {
  const double m = 120, l = 10 * mm;
  CHECK(call("load_inertia_screw", {m, l}) == Approx(m * std::pow(l / (2 * kPi), 2)));
  // Independent: at any screw speed the mass's kinetic energy equals the referred inertia's.
  const double omega = 3000 * rpm, v = omega / (2 * kPi) * l;
  CHECK(0.5 * call("load_inertia_screw", {m, l}) * omega * omega == Approx(0.5 * m * v * v));
}

TEST_CASE("reflected_inertia: J/i^2 through a reduction, by kinetic energy", "[functions][servo]") {
  const double J = 4e-3, i = 3, omega_in = 3000 * rpm;
  CHECK(call("reflected_inertia", {J, i}) == Approx(J / 9));
  CHECK(0.5 * call("reflected_inertia", {J, i}) * omega_in * omega_in ==
        Approx(0.5 * J * std::pow(omega_in / i, 2)));
}

TEST_CASE("accel_torque: T = J*n/t for a linear ramp, by stepping Newton's law", "[functions][servo]") {
  const double J = 2e-3, n = 3000 * rpm, t = 0.1;
  const double T = call("accel_torque", {J, n, t});
  CHECK(T == Approx(6.283).margin(5e-4));  // 2e-3 kg*m^2 * 314.16 rad/s / 0.1 s
  // Independent: integrate d(omega)/dt = T/J over the ramp in small steps.
  double omega = 0;
  const int steps = 1000;
  for (int k = 0; k < steps; ++k) omega += T / J * (t / steps);
  CHECK(omega == Approx(n));
}

TEST_CASE("trapezoid_peak_speed: the area under the speed is the move, by brute-force integration",
          "[functions][servo]") {
  const double s = 0.3, t_move = 0.8, t_acc = 0.15;
  const double v = call("trapezoid_peak_speed", {s, t_move, t_acc});
  CHECK(v == Approx(0.3 / 0.65));
  double x = 0;
  const int steps = 800000;
  for (int k = 0; k < steps; ++k) {
    const double t = (k + 0.5) * t_move / steps;
    const double speed = t < t_acc ? v * t / t_acc : t > t_move - t_acc ? v * (t_move - t) / t_acc : v;
    x += speed * t_move / steps;
  }
  CHECK(x == Approx(s).epsilon(1e-6));
  // A triangular move is the limit; longer ramps do not fit.
  CHECK(call("trapezoid_peak_speed", {s, t_move, t_move / 2}) == Approx(2 * s / t_move));
  CHECK_THAT(errorOf("trapezoid_peak_speed", {s, t_move, 0.5}),
             Catch::Contains("at most half the move time"));
}

TEST_CASE("rms_torque: sqrt(sum(T^2*t)/sum(t)) of a move with a dwell, by sampling the profile",
          "[functions][servo]") {
  // Accelerate 3.2 N*m for 0.15 s, run 0.4 N*m for 0.5 s, decelerate -2.4 N*m for 0.15 s, dwell 0 for 0.7 s.
  const std::vector<double> cycle = {3.2, 0.15, 0.4, 0.5, -2.4, 0.15, 0, 0.7};
  const double rms = call("rms_torque", cycle);
  CHECK(rms == Approx(std::sqrt((3.2 * 3.2 * 0.15 + 0.16 * 0.5 + 2.4 * 2.4 * 0.15) / 1.5)));
  double sum = 0;
  const int samples = 150000;
  for (int k = 0; k < samples; ++k) {
    const double t = (k + 0.5) * 1.5 / samples;
    const double T = t < 0.15 ? 3.2 : t < 0.65 ? 0.4 : t < 0.8 ? -2.4 : 0.0;
    sum += T * T;
  }
  CHECK(rms == Approx(std::sqrt(sum / samples)).epsilon(1e-4));
  // Independent: a constant torque is its own RMS, and a dwell lowers it.
  CHECK(call("rms_torque", {2.0, 1.0, 2.0, 3.0}) == Approx(2.0));
  CHECK(call("rms_torque", {2.0, 1.0, 0.0, 3.0}) == Approx(1.0));
  CHECK_THAT(errorOf("rms_torque", {1, 0, 2, 0}), Catch::Contains("no duration"));
  CHECK_THAT(errorOf("rms_torque", {1, 1, 2, 1, 3, -1}), Catch::Contains("duration t3 = -1 s must be >= 0"));
}
