// A failed definition is reported once, on its own line, and every other
// independent problem of the file is reported in the same run (issue 11).
#include <catch2/catch.hpp>

#include "tests/test_support.h"

using calctrail::test::calc;
using calctrail::test::count;
using calctrail::test::diagnostics;

TEST_CASE("a name whose definition failed to parse raises nothing downstream", "[diagnostics][cascade]") {
  // The failing input of the issue: an unknown unit, then lines that read F.
  auto c = calc("f = 0.1\nF = 3000 lbs\nd = 20 mm\nT = F * d\ncheck small: F < 5 kN\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(count(d, "error:") == 1);
  CHECK(d.find(":2:10: error: unknown unit `lbs`") != std::string::npos);
  CHECK(d.find("unknown name") == std::string::npos);
  CHECK(d.find("did you mean `f`") == std::string::npos);
}

TEST_CASE("failed display units, parameters and syntax errors raise nothing downstream", "[diagnostics][cascade]") {
  for (const std::string line : {"F [lbs] = 3000", "F = 3000 *", "param F [lbs]", "F = (3 kN"}) {
    auto c = calc(std::string(line) + "\nd = 20 mm\nT = F * d\n");
    const std::string d = diagnostics(*c);
    INFO(line << "\n" << d);
    CHECK(count(d, "error:") == 1);
    CHECK(d.find(":1:") != std::string::npos);
    CHECK(d.find("unknown name") == std::string::npos);
  }
}

TEST_CASE("a name never defined is still reported", "[diagnostics][cascade]") {
  auto c = calc("d = 20 mm\nT = G * d\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find(":2:5: error: unknown name `G`") != std::string::npos);
}

TEST_CASE("a misspelt function is reported with the unit error of a quantity it reads", "[diagnostics][cascade]") {
  // The failing input of the issue: today torqe is reported only once lbs is fixed.
  auto c = calc("F = 3000 lbs\nd = 20 mm\nT = torqe(F, d)\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(count(d, "error:") == 2);
  CHECK(d.find(":1:10: error: unknown unit `lbs`") != std::string::npos);
  CHECK(d.find(":3:5: error: unknown function `torqe`") != std::string::npos);
}

TEST_CASE("a misspelt function beside a dimension error and an unknown name", "[diagnostics][cascade]") {
  auto c = calc("a = 1 m + 1 s\nb = sqrtt(a)\nc = sqrtt(G)\nd = max(1 m, 2 s) + sinn(1)\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find(":1:5: error: cannot add") != std::string::npos);
  CHECK(d.find(":2:5: error: unknown function `sqrtt`") != std::string::npos);
  CHECK(d.find(":3:11: error: unknown name `G`") != std::string::npos);
  CHECK(d.find(":3:5: error: unknown function `sqrtt`") != std::string::npos);
  // Both independent problems of one formula.
  CHECK(d.find(":4:14: error: `max` compares alike values") != std::string::npos);
  CHECK(d.find(":4:21: error: unknown function `sinn`") != std::string::npos);
  CHECK(count(d, "error:") == 6);
}

// Issue 11, item 5: the same inside templates and for --set.
TEST_CASE("a template whose definition fails raises nothing in the sheet that reads it",
          "[diagnostics][cascade][template]") {
  const std::string dir = calctrail::test::tempDir();
  calctrail::test::writeFile(dir + "/screw.calc", "param d [mm] = 20 mm\nF [N] = d * 3 lbs\nT = F * 2\n");
  calctrail::test::writeFile(dir + "/use.calc",
                             "use screw.calc as inst\nG = inst.F * 2\nH = inst.T\ncheck c: inst.F < 5 kN\nk = q * 2\n");
  calctrail::test::Run r = calctrail::test::runCli("check '" + dir + "/use.calc'");
  INFO(r.err);
  CHECK(r.status == 2);
  // One error at the template's line, with the use line that brought it in.
  CHECK(count(r.err, "unknown unit `lbs`") == 1);
  CHECK(r.err.find("screw.calc:2:") != std::string::npos);
  CHECK(r.err.find("in the instance `inst` used at") != std::string::npos);
  CHECK(r.err.find("`inst.F`") == std::string::npos);
  CHECK(r.err.find("`inst.T`") == std::string::npos);
  // An independent problem of the using sheet is still reported.
  CHECK(r.err.find("unknown name `q`") != std::string::npos);
  CHECK(count(r.err, "error:") == 2);
  // A template without errors: a name it does not define is still an error.
  calctrail::test::writeFile(dir + "/good.calc", "param d [mm] = 20 mm\nF [N] = d * 3 [N/mm]\n");
  calctrail::test::writeFile(dir + "/use2.calc", "use good.calc as inst\nG = inst.Fx * 2\n");
  calctrail::test::Run good = calctrail::test::runCli("check '" + dir + "/use2.calc'");
  CHECK(good.status == 2);
  CHECK(good.err.find("unknown name `inst.Fx`") != std::string::npos);
}

TEST_CASE("a --set with an unknown unit is one error, nothing downstream", "[diagnostics][cascade][set]") {
  auto c = calc("F = 2000 N\nA = 2 [mm^2]\ns = F / A\ncheck c: s < 2000 MPa\nT = F * 3 mm\n", {"F=3000 lbs"});
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(count(d, "error:") == 1);
  CHECK(d.find("--set:1:") != std::string::npos);
  CHECK(d.find("unknown unit `lbs`") != std::string::npos);
  CHECK(d.find("unknown name") == std::string::npos);
  CHECK(d.find("`F`") == std::string::npos);
}
