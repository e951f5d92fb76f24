// `calctrail check` and `textconv` show a check's sides as the report does: a
// literal as the worksheet writes it, in its own unit; a calculated value
// rounded in the check's unit (issue 11, "values as written stay as written").
#include <catch2/catch.hpp>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {
// A US sheet whose checks fail, so `check` prints every one of them. The
// stress check compares psi with a limit written in ksi: 5000 lbf / 0.2 in^2
// = 25000 psi (independent arithmetic); 20 ksi = 20000 psi by definition.
const char* kUsSheet =
    "units: US\n"
    "F = 5000 lbf\n"
    "A = 0.2 [in^2]\n"
    "sig [psi] = F / A\n"
    "check s: sig <= 20 ksi\n"
    "n_buck = 2.5\n"
    "check n: n_buck >= 3\n"
    "tpi = 5 [1/in]\n"
    "p = 1 / tpi\n"
    "check pitch: p >= 0.5 in\n"
    "check rate: tpi <= 4 [1/in]\n";

std::string sheetFile(const std::string& text) {
  const std::string path = tempDir() + "/us.calc";
  writeFile(path, text);
  return path;
}
}  // namespace

TEST_CASE("check prints a literal side as written and a calculated side rounded", "[cli][check]") {
  const std::string path = sheetFile(kUsSheet);
  Run r = runCli("check '" + path + "'");
  CHECK(r.status == 1);
  // A dimensionless literal: 3, never 3.000.
  CHECK(r.out.find("check `n` fails: 2.500 >= 3 is false") != std::string::npos);
  // A literal with a unit keeps its unit: 20 ksi, never 20000 psi.
  CHECK(r.out.find("check `s` fails: 25000 psi <= 20 ksi is false") != std::string::npos);
  CHECK(r.out.find("20000") == std::string::npos);
  // A compound unit in brackets: 4 1/in; the quantity tpi is shown by its value.
  CHECK(r.out.find("check `rate` fails: 5.000 1/in <= 4 1/in is false") != std::string::npos);
  CHECK(r.out.find("check `pitch` fails: 0.2000 in >= 0.5 in is false") != std::string::npos);
}

TEST_CASE("check and report show the same sides", "[cli][check]") {
  const std::string path = sheetFile(kUsSheet);
  Run check = runCli("check '" + path + "'");
  Run report = runCli("report '" + path + "'");
  CHECK(report.status == 0);
  for (const char* sides : {"25000 psi <= 20 ksi", "2.500 >= 3", "0.2000 in >= 0.5 in", "5.000 1/in <= 4 1/in"}) {
    INFO(sides);
    CHECK(check.out.find(sides) != std::string::npos);
    CHECK(report.out.find(sides) != std::string::npos);
  }
}

TEST_CASE("textconv shows a literal side of a check as written", "[cli][check][review]") {
  const std::string path = sheetFile(kUsSheet);
  Run r = runCli("textconv '" + path + "'");
  CHECK(r.status == 0);
  CHECK(r.out.find("#= check s: FAIL  25000 psi <= 20 ksi\n") != std::string::npos);
  CHECK(r.out.find("#= check n: FAIL  2.5 >= 3\n") != std::string::npos);
}
