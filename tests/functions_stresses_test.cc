// Screw and thread stresses against Shigley's Example 8-1 (from memory:
// body torsion 6.07 MPa, body axial 10.39 MPa, bearing 12.9 MPa, root bending
// 41.5 MPa, root shear 20.7 MPa, von Mises at the top of the root 48.7 MPa,
// with 0.38 of the load on the first thread), and against identities.
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
constexpr double MPa = 1e6;
constexpr double rpm = 2 * kPi / 60;

constexpr double F = 6400, dm = 30 * mm, dr = 28 * mm, p = 4 * mm, T = 26.18;

using calctrail::test::call;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE("body_torsion_stress: Shigley Example 8-1, 6.07 MPa (from memory)", "[functions][stresses]") {
  CHECK(call("body_torsion_stress", {T, dr}) == Approx(6.07 * MPa).margin(0.005 * MPa));
  // Independent: torque over the polar section modulus pi*d^3/16.
  CHECK(call("body_torsion_stress", {100, 20 * mm}) == Approx(100 / (kPi * std::pow(20 * mm, 3) / 16)));
}

TEST_CASE("body_axial_stress: Shigley Example 8-1, 10.39 MPa (from memory)", "[functions][stresses]") {
  CHECK(call("body_axial_stress", {F, dr}) == Approx(10.39 * MPa).margin(0.005 * MPa));
  CHECK(call("body_axial_stress", {1000, 20 * mm}) == Approx(1000 / (kPi * 0.01 * 0.01)));  // F over area
}

TEST_CASE("thread_bearing_pressure: Shigley Example 8-1, 12.9 MPa on the first thread (from memory)",
          "[functions][stresses]") {
  CHECK(call("thread_bearing_pressure", {0.38 * F, dm, p, 1}) == Approx(12.9 * MPa).margin(0.05 * MPa));
  // Independent: spreading over nt threads divides the pressure by nt.
  CHECK(call("thread_bearing_pressure", {F, dm, p, 5}) == Approx(call("thread_bearing_pressure", {F, dm, p, 1}) / 5));
}

TEST_CASE("thread_root_bending: Shigley Example 8-1, 41.5 MPa (from memory)", "[functions][stresses]") {
  CHECK(call("thread_root_bending", {F, dr, p, 0.38}) == Approx(41.5 * MPa).margin(0.05 * MPa));
}

TEST_CASE("thread_root_shear: Shigley Example 8-1, 20.7 MPa (from memory)", "[functions][stresses]") {
  CHECK(call("thread_root_shear", {F, dr, p, 0.38}) == Approx(20.7 * MPa).margin(0.05 * MPa));
  // Independent: a rectangular section's peak shear is 3/2 of the mean, bending over shear is 2 here.
  CHECK(call("thread_root_bending", {F, dr, p, 0.38}) == Approx(2 * call("thread_root_shear", {F, dr, p, 0.38})));
}

TEST_CASE("von_mises_thread_root: Shigley Example 8-1, 48.7 MPa (from memory)", "[functions][stresses]") {
  CHECK(call("von_mises_thread_root", {41.5 * MPa, 10.39 * MPa, 6.07 * MPa}) == Approx(48.7 * MPa).margin(0.05 * MPa));
  // Signs do not matter: the worse case is taken.
  CHECK(call("von_mises_thread_root", {41.5 * MPa, -10.39 * MPa, -6.07 * MPa}) ==
        Approx(call("von_mises_thread_root", {41.5 * MPa, 10.39 * MPa, 6.07 * MPa})));
  // Independent: bending alone is uniaxial.
  CHECK(call("von_mises_thread_root", {41.5 * MPa, 0, 0}) == Approx(41.5 * MPa));
}

TEST_CASE("von_mises: shear yield is 0.577 of tensile yield (distortion energy, Shigley Ch. 5, from memory)",
          "[functions][stresses]") {
  CHECK(call("von_mises", {0, 0.577 * 300 * MPa}) == Approx(300 * MPa).epsilon(1e-3));
  CHECK(call("von_mises", {-120 * MPa, 0}) == Approx(120 * MPa));  // independent: uniaxial
  CHECK(call("von_mises", {10.39 * MPa, 6.07 * MPa}) == Approx(std::sqrt(10.39 * 10.39 + 3 * 6.07 * 6.07) * MPa));
}

TEST_CASE("nut_threads_needed: reproduces Shigley Example 8-1's 12.9 MPa on one thread (from memory)",
          "[functions][stresses]") {
  CHECK(call("nut_threads_needed", {0.38 * F, dm, p, 12.9 * MPa}) == Approx(1.0).epsilon(2e-3));
  // Independent: the inverse of thread_bearing_pressure.
  const double pb = call("thread_bearing_pressure", {F, dm, p, 6.5});
  CHECK(call("nut_threads_needed", {F, dm, p, pb}) == Approx(6.5));
}

TEST_CASE("nut_length_needed: one 4 mm pitch for Shigley Example 8-1's first thread at 12.9 MPa (from memory)",
          "[functions][stresses]") {
  CHECK(call("nut_length_needed", {0.38 * F, dm, 12.9 * MPa}) == Approx(4 * mm).epsilon(2e-3));
  CHECK(call("nut_length_needed", {F, dm, 10 * MPa}) ==
        Approx(call("nut_threads_needed", {F, dm, p, 10 * MPa}) * p));  // independent: threads times pitch
}

TEST_CASE("sliding_speed: helix kinematics, pi*d*n/cos(lambda) as for a worm (Shigley, from memory)",
          "[functions][stresses]") {
  // dm = 30 mm, l = 8 mm, 60 rpm: pi*0.03*1 m/s / cos(4.852 deg) = 0.094585 m/s.
  const double lam = std::atan(8 * mm / (kPi * dm));
  CHECK(call("sliding_speed", {dm, 8 * mm, 60 * rpm}) == Approx(kPi * dm * 1.0 / std::cos(lam)));
  // Independent: the axial component is the nut speed, the tangential one pi*dm*n.
  const double v = call("sliding_speed", {dm, 8 * mm, 60 * rpm});
  const double axial = call("nut_speed", {60 * rpm, 1, 8 * mm});
  CHECK(v * v == Approx(axial * axial + std::pow(kPi * dm * 1.0, 2)));
}

TEST_CASE("nut_pv: bearing pressure times sliding speed (common practice)", "[functions][stresses]") {
  const double pb = call("thread_bearing_pressure", {F, dm, p, 6});
  const double v = call("sliding_speed", {dm, 8 * mm, 100 * rpm});
  CHECK(call("nut_pv", {F, dm, p, 6, 8 * mm, 100 * rpm}) == Approx(pb * v));
  CHECK(call("nut_pv", {F, dm, p, 6, 8 * mm, 0}) == 0.0);  // standing still wears nothing
}

TEST_CASE("stresses: inputs out of range", "[functions][stresses][limits]") {
  CHECK_THAT(errorOf("body_axial_stress", {F, 0}), Catch::Contains("minor diameter dr = 0 mm must be > 0"));
  CHECK_THAT(errorOf("thread_root_bending", {F, dr, p, 1.5}),
             Catch::Contains("load share of the most loaded thread = 1.5 must be <= 1"));
  CHECK_THAT(errorOf("thread_bearing_pressure", {F, dm, p, 0}), Catch::Contains("engaged threads nt = 0 must be > 0"));
  CHECK_THAT(errorOf("nut_threads_needed", {F, dm, p, -1 * MPa}),
             Catch::Contains("allowable bearing pressure p_allow = -1 MPa must be > 0"));
  CHECK_THAT(errorOf("nut_pv", {F, dm, p, 6, 8 * mm, -10 * rpm}), Catch::Contains("screw speed n = -10 rpm must be >= 0"));
}
