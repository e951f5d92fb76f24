// Golden trails: the report of every demo worksheet, compared byte for byte
// with the committed file that a person has read. After a deliberate change,
// regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read the diff before committing.
#include <catch2/catch.hpp>

#include <cstdlib>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {
void compareGolden(const std::string& args, const std::string& golden) {
  Run r = runCli(args);
  REQUIRE(r.status == 0);
  const std::string path = repoPath("tests/golden/" + golden);
  if (std::getenv("CALCTRAIL_UPDATE_GOLDEN")) writeFile(path, r.out);
  const std::string expected = readFile(path);
  INFO("golden file tests/golden/" << golden << " differs; regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read the diff");
  CHECK(r.out == expected);
}
}  // namespace

TEST_CASE("golden: canal gate hoist, text trail", "[golden]") {
  compareGolden("report worksheets/canal-gate-hoist.calc", "canal-gate-hoist.txt");
}

TEST_CASE("golden: leveling jack, text trail", "[golden]") {
  compareGolden("report worksheets/leveling-jack.calc", "leveling-jack.txt");
}

TEST_CASE("golden: twin-screw lift table, text trail", "[golden]") {
  compareGolden("report worksheets/twin-screw-lift.calc", "twin-screw-lift.txt");
}
