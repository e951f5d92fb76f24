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
using calctrail::test::doubtsOf;
using calctrail::test::errorOf;
constexpr double deg = kPi / 180;

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

TEST_CASE("thread_shear_area_screw and _nut: Machinery's Handbook shear areas for 60 deg threads, 1/2-13 UNC "
          "class 2A/2B (from memory: Kn max 0.434 in, Es min 0.4435 in, Ds min 0.4876 in, En max 0.4565 in)",
          "[functions][stresses]") {
  const double in = 0.0254, n = 13, Le = 0.5 * in;
  const double Kn = 0.434 * in, Es = 0.4435 * in, Ds = 0.4876 * in, En = 0.4565 * in;
  // As printed: As = pi*n*Le*Kn*(1/(2n) + 0.57735*(Es - Kn)), An = pi*n*Le*Ds*(1/(2n) + 0.57735*(Ds - En)).
  const double As = kPi * n / in * Le * Kn * (in / (2 * n) + 0.57735 * (Es - Kn));
  const double An = kPi * n / in * Le * Ds * (in / (2 * n) + 0.57735 * (Ds - En));
  CHECK(call("thread_shear_area_screw", {Kn, Es, in / n, 30 * deg}) * Le == Approx(As).epsilon(1e-5));
  CHECK(call("thread_shear_area_nut", {Ds, En, in / n, 30 * deg}) * Le == Approx(An).epsilon(1e-5));
}

TEST_CASE("thread_shear_area_screw: the width of the profile measured at D1, and Shigley's square thread",
          "[functions][stresses]") {
  // Independent: a symmetrical trapezoidal profile drawn point by point (flanks at 15 deg, p/2 wide at the
  // pitch line), its width measured at the diameter D1 by stepping along the radius.
  const double pitch = 7 * mm, d2 = 36.5 * mm, D1 = 33 * mm, a = 15 * deg;  // Tr 40x7
  double width = pitch / 2;
  const int steps = 100000;
  const double dy = (d2 - D1) / 2 / steps;
  for (int k = 0; k < steps; ++k) width += 2 * std::tan(a) * dy;  // each flank moves out tan(a) per unit depth
  CHECK(call("thread_shear_area_screw", {D1, d2, pitch, a}) == Approx(kPi * D1 * width / pitch).epsilon(1e-9));
  // Square thread (Shigley Sec. 8-2): one thread is sheared over pi*dr*p/2; per unit length pi*dr/2.
  CHECK(call("thread_shear_area_screw", {dr, dm, p, 0}) == Approx(kPi * dr / 2));
  CHECK(call("thread_shear_area_nut", {32 * mm, dm, p, 0}) == Approx(kPi * 32 * mm / 2));
}

TEST_CASE("thread_strip_stress: Shigley Example 8-1's root shear 20.7 MPa is 3/2 of the mean over one thread "
          "carrying 0.38 F (from memory)",
          "[functions][stresses]") {
  const double A = call("thread_shear_area_screw", {dr, dm, p, 0});
  CHECK(1.5 * call("thread_strip_stress", {0.38 * F, A, p}) / MPa == Approx(20.7).margin(0.05));
  CHECK(1.5 * call("thread_strip_stress", {0.38 * F, A, p}) == Approx(call("thread_root_shear", {F, dr, p, 0.38})));
}

TEST_CASE("thread_engagement_needed: inverse of thread_strip_stress, and a bronze nut on a steel screw is checked on "
          "the nut side",
          "[functions][stresses]") {
  // Tr 40x7: screw sheared at D1 = 33 mm, nut at d = 40 mm (ISO 2904 basic dimensions).
  const double a = 15 * deg, Fx = 60000;
  const double A_screw = call("thread_shear_area_screw", {33 * mm, 36.5 * mm, 7 * mm, a});
  const double A_nut = call("thread_shear_area_nut", {40 * mm, 36.5 * mm, 7 * mm, a});
  CHECK(A_nut > A_screw);  // the nut's threads are wider at their root cylinder
  // Allowables (common practice, invented for the test): steel screw 120 MPa, bronze nut 40 MPa.
  const double Le_screw = call("thread_engagement_needed", {Fx, A_screw, 120 * MPa});
  const double Le_nut = call("thread_engagement_needed", {Fx, A_nut, 40 * MPa});
  CHECK(Le_nut > Le_screw);  // the softer nut governs
  CHECK(call("thread_strip_stress", {Fx, A_nut, Le_nut}) == Approx(40 * MPa));
  CHECK_THAT(errorOf("thread_shear_area_screw", {37 * mm, 36.5 * mm, 7 * mm, a}),
             Catch::Contains("must be smaller than the pitch diameter"));
}

TEST_CASE("plausibility: thread_bearing_pressure with 0.2 engaged threads warns", "[functions][plausibility]") {
  CHECK_THAT(doubtsOf("thread_bearing_pressure", {F, dm, p, 0.2}),
             Catch::Contains("nt = 0.2 is outside the usual range 1 to 40"));
  CHECK(doubtsOf("thread_bearing_pressure", {F, dm, p, 6}).empty());
}

TEST_CASE("plausibility: an allowable pressure of 5000 MPa is an error, 150 MPa a warning", "[functions][plausibility]") {
  CHECK_THAT(errorOf("nut_threads_needed", {F, dm, p, 5000 * MPa}),
             Catch::Contains("above the compressive yield strength of any screw or nut steel"));
  CHECK_THAT(errorOf("nut_length_needed", {F, dm, 5000 * MPa}), Catch::Contains("3000 MPa"));
  CHECK_THAT(doubtsOf("nut_threads_needed", {F, dm, p, 150 * MPa}),
             Catch::Contains("p_allow = 150 MPa is outside the usual range 0.5 to 30 MPa"));
  // 10 kPa for 10 MPa: off by 1000.
  CHECK_THAT(doubtsOf("nut_length_needed", {F, dm, 0.01 * MPa}), Catch::Contains("off by a factor of about 1000"));
}

TEST_CASE("plausibility: a lead smaller than the pitch is an error in nut_pv, a lead finer than any thread a "
          "warning in sliding_speed",
          "[functions][plausibility]") {
  CHECK_THAT(errorOf("nut_pv", {F, dm, 8 * mm, 6, 4 * mm, 100 * rpm}),
             Catch::Contains("lead l = 4 mm/rev is smaller than the pitch p = 8 mm/rev"));
  CHECK_THAT(doubtsOf("sliding_speed", {36.5 * mm, 0.5 * mm, 100 * rpm}),
             Catch::Contains("finer than any standard pitch for the mean diameter dm = 36.5 mm"));
  CHECK(doubtsOf("sliding_speed", {36.5 * mm, 7 * mm, 100 * rpm}).empty());
  CHECK_THAT(doubtsOf("nut_pv", {F, 295 * mm, 0.5 * mm, 6, 0.5 * mm, 100 * rpm}), Catch::Contains("finer than"));
}
