// Power screw torque, efficiency, self-locking and back-driving against the
// square-thread worked example of Shigley's Mechanical Engineering Design
// (Example 8-1, from memory: major 32 mm, pitch 4 mm, double thread,
// f = fc = 0.08, dc = 40 mm, F = 6.4 kN; dm = 30 mm, l = 8 mm; raise 15.94 N*m
// thread + 10.24 N*m collar = 26.18 N*m; lower -0.466 + 10.24 = 9.77 N*m;
// overall efficiency 0.311), and against limit cases that need no book.
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
constexpr double in = 0.0254;
constexpr double deg = kPi / 180;

// Shigley's Example 8-1.
constexpr double F = 6400, dm = 30 * mm, l = 8 * mm, f = 0.08, fc = 0.08, dc = 40 * mm;

using calctrail::test::call;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE("lead_angle: ASME B1.5 lead angle of 1-5 Acme, 4 deg 3 min (from memory)", "[functions][power_screw]") {
  const double lam = call("lead_angle", {0.9 * in, 0.2 * in});
  CHECK(std::fabs(lam - (4 * deg + 3.0 / 60 * deg)) < 0.5 / 60 * deg);
  // Independent: tan(lambda) is the lead over the circumference, whatever the unit system.
  CHECK(std::tan(call("lead_angle", {dm, l})) == Approx(l / (kPi * dm)));
  CHECK(call("lead_angle", {dm / in, l / in}) == Approx(call("lead_angle", {dm, l})));
}

TEST_CASE("torque_raise: Shigley Example 8-1, 15.94 N*m (from memory)", "[functions][power_screw]") {
  CHECK(call("torque_raise", {F, dm, l, f, 0}) == Approx(15.94).margin(0.005));
}

TEST_CASE("torque_raise: zero friction gives F*l/(2*pi)", "[functions][power_screw]") {
  CHECK(call("torque_raise", {F, dm, l, 0, 0}) == Approx(F * l / (2 * kPi)));
  CHECK(call("torque_raise", {F, dm, l, 0, 14.5 * deg}) == Approx(F * l / (2 * kPi)));
}

TEST_CASE("torque_raise: unit-system swap, lengths in inches scale the torque alike", "[functions][power_screw]") {
  // The formula is homogeneous of degree one in the lengths: a consistent unit system gives the same torque.
  const double si = call("torque_raise", {F, dm, l, f, 14.5 * deg});
  const double inch_based = call("torque_raise", {F, dm / in, l / in, f, 14.5 * deg}) * in;
  CHECK(inch_based == Approx(si));
}

TEST_CASE("torque_raise: a flank angle raises the torque by the wedge effect", "[functions][power_screw]") {
  CHECK(call("torque_raise", {F, dm, l, f, 15 * deg}) > call("torque_raise", {F, dm, l, f, 0}));
}

TEST_CASE("torque_lower: Shigley Example 8-1, -0.466 N*m (from memory)", "[functions][power_screw]") {
  // Negative: the thread alone does not hold the load.
  CHECK(call("torque_lower", {F, dm, l, f, 0}) == Approx(-0.466).margin(0.0005));
}

TEST_CASE("torque_lower: raise minus lower against its closed form", "[functions][power_screw]") {
  // T_R - T_L = F*dm*(l*pi*dm + pi*f*dm*s*f*l*s) / ((pi*dm)^2 - (f*l*s)^2), s = 1/cos(alpha).
  for (double alpha : {0.0, 14.5 * deg, 15 * deg}) {
    for (double ff : {0.0, 0.08, 0.15, 0.25}) {
      const double s = 1 / std::cos(alpha);
      const double closed = F * dm * (l * kPi * dm + kPi * ff * dm * s * ff * l * s) /
                            (kPi * dm * kPi * dm - ff * l * s * ff * l * s);
      CHECK(call("torque_raise", {F, dm, l, ff, alpha}) - call("torque_lower", {F, dm, l, ff, alpha}) ==
            Approx(closed));
    }
  }
  CHECK(call("torque_lower", {F, dm, l, 0, 0}) == Approx(-F * l / (2 * kPi)));  // f = 0: the load drives
}

TEST_CASE("torque_raise_with_collar: Shigley Example 8-1, 26.18 N*m (from memory)", "[functions][power_screw]") {
  CHECK(call("torque_raise_with_collar", {F, dm, l, f, 0, fc, dc}) == Approx(26.18).margin(0.005));
  // Independent: the collar adds collar_torque, nothing else.
  CHECK(call("torque_raise_with_collar", {F, dm, l, f, 0, fc, dc}) ==
        Approx(call("torque_raise", {F, dm, l, f, 0}) + call("collar_torque", {F, fc, dc})));
}

TEST_CASE("torque_lower_with_collar: Shigley Example 8-1, 9.77 N*m (from memory)", "[functions][power_screw]") {
  CHECK(call("torque_lower_with_collar", {F, dm, l, f, 0, fc, dc}) == Approx(9.77).margin(0.005));
  CHECK(call("torque_lower_with_collar", {F, dm, l, f, 0, fc, dc}) ==
        Approx(call("torque_lower", {F, dm, l, f, 0}) + call("collar_torque", {F, fc, dc})));
}

TEST_CASE("screw_efficiency: Shigley Example 8-1, thread only, from its 15.94 N*m (from memory)",
          "[functions][power_screw]") {
  // e = F*l / (2*pi*T_R) with the published T_R = 15.94 N*m: 0.5113.
  CHECK(call("screw_efficiency", {dm, l, f, 0}) == Approx(F * l / (2 * kPi * 15.94)).epsilon(5e-4));
}

TEST_CASE("screw_efficiency: zero friction gives 1, and it matches the worm formula", "[functions][power_screw]") {
  CHECK(call("screw_efficiency", {dm, l, 0, 14.5 * deg}) == Approx(1.0));
  // Independent: the worm gear formula with lambda = atan(l/(pi*dm)) and phi_n = alpha is the same relation.
  for (double alpha : {0.0, 14.5 * deg, 20 * deg}) {
    const double lam = std::atan(l / (kPi * dm));
    CHECK(call("screw_efficiency", {dm, l, 0.12, alpha}) == Approx(call("worm_efficiency", {lam, alpha, 0.12})));
  }
}

TEST_CASE("screw_efficiency_with_collar: Shigley Example 8-1, 0.311 (from memory)", "[functions][power_screw]") {
  CHECK(call("screw_efficiency_with_collar", {dm, l, f, 0, fc, dc}) == Approx(0.311).margin(0.0005));
  // Independent: the definition F*l/(2*pi*T) with the library's own torque.
  CHECK(call("screw_efficiency_with_collar", {dm, l, f, 0, fc, dc}) ==
        Approx(F * l / (2 * kPi * call("torque_raise_with_collar", {F, dm, l, f, 0, fc, dc}))));
}

TEST_CASE("self_locking_margin: Shigley Example 8-1, the thread alone is not self-locking (from memory)",
          "[functions][power_screw]") {
  // The worked example notes that the screw would turn under the load but for the collar: margin < 0.
  CHECK(call("self_locking_margin", {dm, l, f, 0}) == Approx(0.08 - 8 / (30 * kPi)));
  CHECK(call("self_locking_margin", {dm, l, f, 0}) < 0);
}

TEST_CASE("self_locking_margin: same sign as torque_lower, zero where torque_lower is zero",
          "[functions][power_screw]") {
  for (double alpha : {0.0, 14.5 * deg, 15 * deg})
    for (double ff : {0.02, 0.05, 0.08, 0.1, 0.2}) {
      const double margin = call("self_locking_margin", {dm, l, ff, alpha});
      const double lower = call("torque_lower", {F, dm, l, ff, alpha});
      CHECK((margin > 0) == (lower > 0));
    }
  const double f0 = l * std::cos(15 * deg) / (kPi * dm);
  CHECK(call("torque_lower", {F, dm, l, f0, 15 * deg}) == Approx(0).margin(1e-12));
}

TEST_CASE("screw_backdrive_efficiency: reproduces Shigley Example 8-1's -0.466 N*m (from memory)",
          "[functions][power_screw]") {
  // The load back-drives the thread with the torque F*l*eta_b/(2*pi) = 0.466 N*m.
  const double eta_b = call("screw_backdrive_efficiency", {dm, l, f, 0});
  CHECK(F * l * eta_b / (2 * kPi) == Approx(0.466).margin(0.0005));
  // Independent: the worm formula driven from the wheel is the same relation.
  const double lam = std::atan(l / (kPi * dm));
  CHECK(call("screw_backdrive_efficiency", {dm, l, 0.05, 15 * deg}) ==
        Approx(call("worm_backdrive_efficiency", {lam, 15 * deg, 0.05})));
  CHECK(call("screw_backdrive_efficiency", {dm, l, 0, 0}) == Approx(1.0));
  // Self-locking: the formula's negative value is no efficiency, and the error says so.
  CHECK_THAT(errorOf("screw_backdrive_efficiency", {dm, l, 0.2, 0}),
             Catch::Contains("self-locking, back-driving efficiency not defined"));
}

TEST_CASE("backdrive_force: inverse of Shigley Example 8-1's lowering torque (from memory)",
          "[functions][power_screw]") {
  // 6.4 kN back-drives the thread against 0.46557 N*m (the published -0.466 N*m, unrounded).
  CHECK(call("backdrive_force", {0.465572, dm, l, f, 0}) == Approx(F).epsilon(1e-5));
  CHECK(call("backdrive_force", {1.0, dm, l, 0, 0}) == Approx(2 * kPi / l));  // f = 0: T = F*l/(2*pi)
}

TEST_CASE("backdrive_force: a self-locking thread is an error naming the friction limit",
          "[functions][power_screw][limits]") {
  const std::string msg = errorOf("backdrive_force", {1.0, dm, l, 0.1, 0});
  CHECK_THAT(msg, Catch::Contains("self-locking"));
  CHECK_THAT(msg, Catch::Contains("f = 0.1 >= tan(lambda)*cos(alpha) = 0.08488"));
}

TEST_CASE("starting_friction: 4/3 of running, Shigley's collar friction table, hardened steel on bronze "
          "0.06 running / 0.08 starting (from memory)",
          "[functions][power_screw]") {
  CHECK(call("starting_friction", {0.06}) == Approx(0.08));
  CHECK(call("starting_friction", {0}) == 0.0);  // independent: no friction stays none
}

TEST_CASE("power screws: negative friction is an error naming the limit", "[functions][power_screw][limits]") {
  CHECK_THAT(errorOf("torque_raise", {F, dm, l, -0.1, 0}), Catch::Contains("thread friction f = -0.1 must be >= 0"));
  CHECK_THAT(errorOf("torque_lower_with_collar", {F, dm, l, 0.1, 0, -0.05, dc}),
             Catch::Contains("collar friction fc = -0.05 must be >= 0"));
  CHECK_THAT(errorOf("starting_friction", {-0.01}), Catch::Contains("must be >= 0"));
  CHECK_THAT(errorOf("torque_raise", {F, dm, l, 8, 0}), Catch::Contains("must be <= 1"));
  try {
    call("torque_raise", {F, dm, l, -0.1, 0});
  } catch (const DomainError& e) {
    CHECK(e.arg() == 3);
  }
}

TEST_CASE("power screws: a lead angle beyond the friction limit cannot raise the load",
          "[functions][power_screw][limits]") {
  // dm = 10 mm, l = 40 mm (lead angle 51.9 deg), f = 0.9: pi*dm - f*l < 0.
  const std::string msg = errorOf("torque_raise", {F, 10 * mm, 40 * mm, 0.9, 0});
  CHECK_THAT(msg, Catch::Contains("cannot raise the load"));
  CHECK_THAT(msg, Catch::Contains("beyond the friction limit"));
  CHECK_THAT(errorOf("screw_efficiency", {10 * mm, 40 * mm, 0.9, 0}), Catch::Contains("cannot raise"));
  CHECK_THAT(errorOf("torque_raise_with_collar", {F, 10 * mm, 40 * mm, 0.9, 0, fc, dc}),
             Catch::Contains("cannot raise"));
}

TEST_CASE("power screws: loads, diameters, leads and flank angles out of range", "[functions][power_screw][limits]") {
  CHECK_THAT(errorOf("torque_raise", {-F, dm, l, f, 0}), Catch::Contains("axial load F = -6400 N must be > 0"));
  CHECK_THAT(errorOf("torque_raise", {F, 0, l, f, 0}), Catch::Contains("mean diameter dm = 0 mm must be > 0"));
  CHECK_THAT(errorOf("lead_angle", {dm, -l}), Catch::Contains("lead l = -8 mm/rev must be > 0"));
  CHECK_THAT(errorOf("torque_raise", {F, dm, l, f, 60 * deg}),
             Catch::Contains("flank angle alpha = 60 deg must be <= 45 deg"));
  CHECK_THAT(errorOf("backdrive_force", {-1, dm, l, 0, 0}), Catch::Contains("must be >= 0"));
}

TEST_CASE("plausibility: starting_friction(0.9) is an error, not 1.2", "[functions][power_screw][plausibility]") {
  CHECK_THAT(errorOf("starting_friction", {0.9}),
             Catch::Contains("running friction f = 0.9 must be <= 0.75: its starting value 4/3*f = 1.2 would exceed 1"));
  // Independent: at the limit the starting value is the library's own bound f = 1, which torque_raise accepts.
  const double f_start = call("starting_friction", {0.75});
  CHECK(f_start == Approx(1.0));
  CHECK_NOTHROW(call("torque_raise", {F, dm, l, f_start, 0}));
}

TEST_CASE("friction arguments have a usual range from the materials they describe (issue 15)",
          "[functions][power_screw][plausibility]") {
  using calctrail::test::doubtsOf;
  const double N = 1, mm = 1e-3, deg = M_PI / 180;
  // Within Shigley's Tables 8-5 and 8-6 (from memory) and the demos' values
  // (0.08 well lubricated, 0.15 dry steel on bronze): no doubt.
  for (double f : {0.08, 0.12, 0.15, 0.25}) {
    INFO(f);
    CHECK(doubtsOf("torque_raise", {6400 * N, 30 * mm, 8 * mm, f, 0 * deg}).empty());
    CHECK(doubtsOf("collar_torque", {6400 * N, f, 40 * mm}).empty());
    CHECK(doubtsOf("starting_friction", {f}).empty());
  }
  // A percent typed as a coefficient, or a slip by ten: a warning that says the range.
  CHECK_THAT(doubtsOf("torque_raise", {6400 * N, 30 * mm, 8 * mm, 0.015, 0 * deg}),
             Catch::Contains("f = 0.015 is outside the usual range 0.05 to 0.3"));
  CHECK_THAT(doubtsOf("torque_raise_with_collar", {6400 * N, 30 * mm, 8 * mm, 0.08, 0 * deg, 0.6, 40 * mm}),
             Catch::Contains("fc = 0.6 is outside the usual range 0.05 to 0.3"));
  CHECK_THAT(doubtsOf("collar_torque", {6400 * N, 0.5, 40 * mm}),
             Catch::Contains("fc = 0.5 is outside the usual range"));
  CHECK_THAT(doubtsOf("starting_friction", {0.5}), Catch::Contains("f = 0.5 is outside the usual range"));
}
