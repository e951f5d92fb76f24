// engine/study/solve and the solve command: a target met to the solver's
// tolerance and equal to the closed-form inverse where one exists, the
// capacity and the check that limits it, no root (exit 1), a failure inside
// the bracket, a result not monotone in it, and bad targets (exit 2).
#include "engine/study/solve.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::Json;

namespace {

Json parsed(const std::string& text) {
  Json j;
  std::string error;
  INFO(text);
  REQUIRE(test::parseJson(text, &j, &error));
  return j;
}

std::string sheetFile(const std::string& text) {
  const std::string path = test::tempDir() + "/s.calc";
  test::writeFile(path, text);
  return "'" + path + "'";
}

// A raise torque that is linear in the load: T = F * (d_m/2 * (l + pi f d_m sec a) / (pi d_m - f l sec a)).
const char* const kScrew =
    "F = 10 kN\n"
    "d_m = 36 mm\n"
    "l = 6 [mm/rev]\n"
    "f = 0.12\n"
    "alpha = trap_flank_angle()\n"
    "T [N*m] = torque_raise(F, d_m, l, f, alpha)\n"
    "A = 700 [mm^2]\n"
    "sigma [MPa] = F / A\n"
    "check strength: sigma <= 120 MPa\n"
    "check torque: T <= 300 [N*m]\n";

}  // namespace

TEST_CASE("solve: the load whose raise torque is given equals the closed-form inverse", "[study][solve]") {
  const std::string file = sheetFile(kScrew);
  auto c = test::calc(kScrew);
  REQUIRE_FALSE(c->hasErrors());
  const double per_newton = test::si(*c, "T") / test::si(*c, "F");  // T is linear in F
  const test::Run r =
      test::runCli("solve " + file + " --vary F --between '1 kN..100 kN' --target 'T = 75 [N*m]' -f json");
  INFO(r.err);
  REQUIRE(r.status == 0);
  const Json j = parsed(r.out);
  CHECK(j["vary"].string == "F");
  CHECK(j["unit"].string == "kN");
  CHECK(j["solved"].boolean);
  const double F = j["si"].number;
  CHECK(F == Approx(75 / per_newton).epsilon(1e-13));
  CHECK(j["value"].number == Approx(F / 1000).epsilon(1e-15));
  // The target is met to the tolerance of the solver: a few units in the last place.
  CHECK(std::fabs(j["lhs"]["si"].number - 75) <= 75 * 1e-14);
  const double lo = j["root_bracket_si"][0].number, hi = j["root_bracket_si"][1].number;
  CHECK(lo <= F);
  CHECK(F <= hi);
  CHECK((hi - lo) <= 8 * std::numeric_limits<double>::epsilon() * F);
  CHECK(j["checks"]["strength"].boolean);
  // The text says the same.
  const test::Run t =
      test::runCli("solve " + file + " --vary F --between '1 kN..100 kN' --target 'T = 75 [N*m]'");
  CHECK(t.out.find("such that T = 75 [N*m]:") != std::string::npos);
  CHECK(t.out.find("every check passes") != std::string::npos);
}

TEST_CASE("solve: a check failing at the solved value exits 1", "[study][solve]") {
  const std::string file = sheetFile(kScrew);
  const test::Run r =
      test::runCli("solve " + file + " --vary F --between '1 kN..200 kN' --target 'T = 290 [N*m]' -f json");
  CHECK(r.status == 1);
  CHECK_FALSE(parsed(r.out)["checks"]["strength"].boolean);
}

TEST_CASE("solve: the capacity is the closed-form limit, named by its check", "[study][solve]") {
  const std::string file = sheetFile(kScrew);
  const test::Run r =
      test::runCli("solve " + file + " --vary F --between '1 kN..200 kN' --capacity max -f json");
  INFO(r.err);
  REQUIRE(r.status == 0);
  const Json j = parsed(r.out);
  CHECK(j["limiting_check"].string == "strength");
  CHECK(j["si"].number == Approx(120e6 * 700e-6).epsilon(1e-13));  // sigma = F / A = 120 MPa
  CHECK(j["si"].number <= 84000.0 * (1 + 1e-15));                  // on the passing side
  CHECK(j["checks"]["strength"].boolean);
  // The torque limits first with a smaller area allowance: A = 2000 mm^2.
  const test::Run t = test::runCli("solve " + file +
                                   " --set 'A=2000 [mm^2]' --vary F --between '1 kN..400 kN' "
                                   "--capacity max -f json");
  REQUIRE(t.status == 0);
  const Json tj = parsed(t.out);
  CHECK(tj["limiting_check"].string == "torque");
  auto c = test::calc(kScrew);
  CHECK(tj["si"].number == Approx(300 / (test::si(*c, "T") / test::si(*c, "F"))).epsilon(1e-12));
  CHECK(tj["set"][0].string == "A=2000 [mm^2]");
  // The smallest area for which every check passes, at the nominal load: A = F / 120 MPa.
  const test::Run a =
      test::runCli("solve " + file + " --vary A --between '10 [mm^2]..5000 [mm^2]' --capacity min -f json");
  REQUIRE(a.status == 0);
  const Json aj = parsed(a.out);
  CHECK(aj["limiting_check"].string == "strength");
  CHECK(aj["si"].number == Approx(10e3 / 120e6).epsilon(1e-12));
  // Every check passing up to the bracket's end: that end, and no check named.
  const test::Run end =
      test::runCli("solve " + file + " --vary F --between '1 kN..50 kN' --capacity max -f json");
  REQUIRE(end.status == 0);
  CHECK(parsed(end.out)["si"].number == 50000);
  CHECK(parsed(end.out)["limiting_check"].type == Json::Null);
}

TEST_CASE("solve: no root or nothing passing exits 1 with the values at both ends", "[study][solve]") {
  const std::string file = sheetFile(kScrew);
  const test::Run r =
      test::runCli("solve " + file + " --vary F --between '1 kN..2 kN' --target 'T = 75 [N*m]' -f json");
  CHECK(r.status == 1);
  const Json j = parsed(r.out);
  CHECK_FALSE(j["solved"].boolean);
  CHECK(j["si"].type == Json::Null);
  auto c = test::calc(kScrew);
  const double per_newton = test::si(*c, "T") / test::si(*c, "F");
  CHECK(j["at_lo"]["lhs"]["si"].number == Approx(1000 * per_newton).epsilon(1e-13));
  CHECK(j["at_hi"]["lhs"]["si"].number == Approx(2000 * per_newton).epsilon(1e-13));
  const test::Run t =
      test::runCli("solve " + file + " --vary F --between '1 kN..2 kN' --target 'T = 75 [N*m]'");
  CHECK(t.out.find("not reached in the bracket") != std::string::npos);
  const test::Run none =
      test::runCli("solve " + file + " --vary F --between '90 kN..100 kN' --capacity max -f json");
  CHECK(none.status == 1);
  CHECK(parsed(none.out)["failing_at_lo"][0].string == "strength");
}

TEST_CASE("solve: a target met twice warns that the result is not monotone", "[study][solve]") {
  const std::string file = sheetFile("x = 1 m\ny [m^2] = (x - 5 m)^2\n");
  const test::Run r =
      test::runCli("solve " + file + " --vary x --between '0 m..10 m' --target 'y = 4 [m^2]' -f json");
  INFO(r.err);
  REQUIRE(r.status == 0);
  const Json j = parsed(r.out);
  CHECK(j["si"].number == Approx(3.0).epsilon(1e-14));  // the root nearest LO
  REQUIRE(j["warnings"].array.size() == 1);
  CHECK(j["warnings"][0].string.find("is not monotone") != std::string::npos);
  CHECK(r.err.find("warning: `y` is not monotone in `x`") != std::string::npos);
}

TEST_CASE("solve: a value in the bracket where the sheet cannot be calculated is an error",
          "[study][solve]") {
  const std::string file = sheetFile("x = 5 m\ny [m] = sqrt((x - 3 m) * 1 m)\n");
  const test::Run r = test::runCli("solve " + file + " --vary x --between '1 m..10 m' --target 'y = 2 m'");
  CHECK(r.status == 2);
  CHECK(
      r.err.find("s.calc:2:9: error: at x = 1.00000 m: `y` cannot be calculated: sqrt of a negative value") !=
      std::string::npos);
  CHECK(r.out.empty());
}

TEST_CASE("solve: bad studies are errors, exit 2", "[study][solve][diagnostics]") {
  const std::string file = sheetFile(kScrew);
  struct Case {
    std::string args, message;
  };
  const Case cases[] = {
      {" --vary T --between '1 N*m..2 N*m' --capacity max", "`T` is calculated from other quantities"},
      {" --vary F --between '1 kN..2 kN' --target 'T = 75 kN'",
       "the target compares `T`, torque or energy (N*m), "
       "with `75 kN`, force (N)"},
      {" --vary F --between '1 kN..2 m' --capacity max",
       "`F` is force (N) in the worksheet, but `2 m` is length (mm)"},
      {" --vary F --between '2 kN..1 kN' --capacity max", "the bracket is empty"},
      {" --vary F --between '1 kN' --capacity max", "--between takes LO..HI"},
      {" --vary F --between '1 kN..2 kN'", "either --target"},
      {" --vary F --between '1 kN..2 kN' --target 'T = 7 [N*m]' --capacity max", "either --target"},
      {" --vary F --between '1 kN..2 kN' --target 'T 75'", "--target takes one equation"},
      {" --vary F --between '1 kN..2 kN' --target 'Tt = 75 [N*m]'", "did you mean `T`"},
      {" --vary d_m --between '1 mm..2 mm' --target 'sigma = 75 MPa'", "the target does not depend on `d_m`"},
      {" --vary F --between '1 kN..2 kN' --capacity most", "--capacity"},
  };
  for (const Case& c : cases) {
    const test::Run r = test::runCli("solve " + file + c.args);
    INFO(c.args << "\n" << r.err);
    CHECK(r.status == 2);
    CHECK(r.err.find(c.message) != std::string::npos);
  }
}
