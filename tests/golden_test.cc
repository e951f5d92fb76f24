// Golden trails: the report of every demo worksheet, compared byte for byte
// with the committed file that a person has read. After a deliberate change,
// regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read the diff before committing.
// Text and JSON come from the CLI; Markdown and HTML from report_formats_test.cc.
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
  INFO(
      "golden file tests/golden/" << golden
                                  << " differs; regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read the diff");
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

// The JSON holds every number at full precision: these goldens pin the
// machine format byte for byte, as the others pin the human ones.
TEST_CASE("golden: bearing press (load cases), text trail", "[golden][cases]") {
  compareGolden("report worksheets/bearing-press.calc", "bearing-press.txt");
}

TEST_CASE("golden: platform lift (one template used twice), text and JSON trails", "[golden][json]") {
  compareGolden("report worksheets/platform-lift.calc", "platform-lift.txt");
  compareGolden("report worksheets/platform-lift.calc --format json", "platform-lift.json");
}

TEST_CASE("golden: canal gate hoist, JSON trail", "[golden][json]") {
  compareGolden("report worksheets/canal-gate-hoist.calc --format json", "canal-gate-hoist.json");
}

TEST_CASE("golden: leveling jack, JSON trail", "[golden][json]") {
  compareGolden("report worksheets/leveling-jack.calc --format json", "leveling-jack.json");
}

TEST_CASE("golden: twin-screw lift table, JSON trail", "[golden][json]") {
  compareGolden("report worksheets/twin-screw-lift.calc --format json", "twin-screw-lift.json");
}
