// Thrust collars and bearings: Shigley's Example 8-1 collar torque, the
// classical flat-pivot results, and the limits between the models.
#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "tests/function_calls.h"
#include "functions/function_decl.h"

namespace {

using calctrail::DomainError;
using calctrail::FunctionDecl;
using calctrail::findFunction;

constexpr double mm = 1e-3;

using calctrail::test::call;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE("collar_torque: Shigley Example 8-1, 10.24 N*m (from memory)", "[functions][collars]") {
  CHECK(call("collar_torque", {6400, 0.08, 40 * mm}) == Approx(10.24).margin(0.005));
  CHECK(call("collar_torque", {6400, 0, 40 * mm}) == 0.0);  // independent: no friction, no torque
}

TEST_CASE("collar_torque_uniform_pressure: flat pivot, T = 2/3*f*F*R (theory of machines, from memory)",
          "[functions][collars]") {
  // Solid pivot of radius 30 mm, F = 10 kN, f = 0.1: 2/3 * 0.1 * 10000 * 0.03 = 20 N*m.
  CHECK(call("collar_torque_uniform_pressure", {10000, 0.1, 60 * mm, 0}) == Approx(20.0));
}

TEST_CASE("collar_torque_uniform_pressure: tends to the mean-diameter collar as the annulus narrows",
          "[functions][collars]") {
  const double narrow = call("collar_torque_uniform_pressure", {10000, 0.1, 40.001 * mm, 39.999 * mm});
  CHECK(narrow == Approx(call("collar_torque", {10000, 0.1, 40 * mm})).epsilon(1e-6));
  // Uniform wear (run in) never exceeds uniform pressure (new).
  for (double di : {0.0, 10.0, 20.0, 35.0})
    CHECK(call("collar_torque_uniform_wear", {10000, 0.1, 40 * mm, di * mm}) <=
          call("collar_torque_uniform_pressure", {10000, 0.1, 40 * mm, di * mm}));
}

TEST_CASE("collar_torque_uniform_wear: flat pivot, T = 1/2*f*F*R (theory of machines, from memory)",
          "[functions][collars]") {
  CHECK(call("collar_torque_uniform_wear", {10000, 0.1, 60 * mm, 0}) == Approx(15.0));
  // Independent: uniform wear is exactly the plain collar at the mean of the two diameters.
  CHECK(call("collar_torque_uniform_wear", {10000, 0.1, 50 * mm, 30 * mm}) ==
        Approx(call("collar_torque", {10000, 0.1, 40 * mm})));
}

TEST_CASE("collars: inner diameter not below the outer one is an error", "[functions][collars][limits]") {
  CHECK_THAT(errorOf("collar_torque_uniform_pressure", {10000, 0.1, 40 * mm, 40 * mm}),
             Catch::Contains("must be smaller than the outer diameter Do = 40 mm"));
  CHECK_THAT(errorOf("collar_torque_uniform_wear", {10000, 0.1, 40 * mm, -1 * mm}), Catch::Contains("must be >= 0"));
  CHECK_THAT(errorOf("collar_torque", {10000, -0.1, 40 * mm}), Catch::Contains("collar friction fc = -0.1 must be >= 0"));
}

TEST_CASE("thrust_bearing_torque: bearing makers' constant-coefficient estimate, thrust ball bearing mu = 0.0013 "
          "(common practice, from memory)",
          "[functions][collars]") {
  // 0.5 * 0.0013 * 10 kN * 40 mm = 0.26 N*m.
  CHECK(call("thrust_bearing_torque", {10000, 0.0013, 40 * mm}) == Approx(0.26));
  // Independent: the same lever as a plain collar at the bore.
  CHECK(call("thrust_bearing_torque", {10000, 0.0013, 40 * mm}) ==
        Approx(call("collar_torque", {10000, 0.0013, 40 * mm})));
}

TEST_CASE("thrust_bearing_torque: a sliding friction value is an error", "[functions][collars][limits]") {
  CHECK_THAT(errorOf("thrust_bearing_torque", {10000, 0.1, 40 * mm}), Catch::Contains("must be <= 0.05"));
}
