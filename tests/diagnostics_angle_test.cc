// A plain number where an angle is wanted names the fix, its unit (issue 11).
#include <catch2/catch.hpp>

#include <cmath>

#include "tests/test_support.h"

using calctrail::test::calc;
using calctrail::test::diagnostics;

TEST_CASE("a plain number given to a library angle argument: write it in deg", "[diagnostics][angle]") {
  // The failing input of the issue: `alpha = 15` passed as the flank angle.
  auto c = calc("alpha = 15\nT = torque_raise(1 kN, 20 mm, 4 [mm/rev], 0.1, alpha)\n"
                "T2 = torque_raise(1 kN, 20 mm, 4 [mm/rev], 0.1, 15)\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find(":2:48: error: argument 5 of `torque_raise`") != std::string::npos);
  CHECK(d.find("write the angle with its unit: `alpha = 15 deg`") != std::string::npos);
  CHECK(d.find(":3:49: error: argument 5 of `torque_raise`") != std::string::npos);
  CHECK(d.find("`15 deg`") != std::string::npos);
  CHECK(d.find("turns") == std::string::npos);
  CHECK(d.find("lead") == std::string::npos);
}

TEST_CASE("a plain literal given to a trigonometric function warns with the fix", "[diagnostics][angle]") {
  auto c = calc("a = sin(30)\nbeta = 45\ny = cos(beta)\nz = tan(3 * 4)\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find(":1:9: warning: `sin(30)` reads the plain number 30 as radians; for degrees write `sin(30 deg)`") !=
        std::string::npos);
  CHECK(d.find(":3:9: warning: `cos(beta)` reads `beta = 45` as radians; for degrees write `beta = 45 deg`") !=
        std::string::npos);
  CHECK(d.find(":4:9: warning: `tan(3 * 4)` reads 3 * 4 as radians") != std::string::npos);
  // Still radians, as the contract says: sin(30 rad), from memory -0.98803.
  CHECK(calctrail::test::si(*c, "a") == Approx(-0.988031624).margin(1e-9));
}

TEST_CASE("radians written as such, and angles with units, raise no warning", "[diagnostics][angle]") {
  auto c = calc("a = sin(pi / 6)\nb = cos(30 deg)\nw = 2 rad\nc = sin(w)\nr = 0.5\nd = sin(2 * pi * r)\n"
                "e = atan2(1 m, 2 m)\nf = sin(e)\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find("warning") == std::string::npos);
  CHECK(calctrail::test::si(*c, "a") == Approx(0.5));
  CHECK(calctrail::test::si(*c, "b") == Approx(std::sqrt(3.0) / 2));
}
