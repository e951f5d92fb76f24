// The ball-screw axis demo (worksheets/ball-screw-axis.calc), which exercises
// the servo-sizing, ball screw and brake functions: its check passes, it has
// no warning, and its trail in every human format and in JSON matches the
// reviewed golden files (regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read
// the diff, as for the other demos).
#include <catch2/catch.hpp>

#include <cstdlib>

#include "engine/report/html_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/trail.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {
void compareWithGolden(const std::string& actual, const std::string& golden) {
  const std::string path = repoPath("tests/golden/" + golden);
  if (std::getenv("CALCTRAIL_UPDATE_GOLDEN")) writeFile(path, actual);
  INFO("golden file tests/golden/" << golden << " differs; regenerate with CALCTRAIL_UPDATE_GOLDEN=1");
  CHECK(actual == readFile(path));
}
}  // namespace

TEST_CASE("golden: ball-screw axis, check passes without a warning", "[golden]") {
  const Run r = runCli("check worksheets/ball-screw-axis.calc");
  INFO(r.err);
  CHECK(r.status == 0);
  CHECK(r.err.find("warning") == std::string::npos);
}

TEST_CASE("golden: ball-screw axis, text and JSON trails", "[golden]") {
  const Run text = runCli("report worksheets/ball-screw-axis.calc");
  REQUIRE(text.status == 0);
  compareWithGolden(text.out, "ball-screw-axis.txt");
  const Run json = runCli("report worksheets/ball-screw-axis.calc --format json");
  REQUIRE(json.status == 0);
  compareWithGolden(json.out, "ball-screw-axis.json");
}

TEST_CASE("golden: ball-screw axis, Markdown and HTML trails", "[report][golden]") {
  const std::string display = "worksheets/ball-screw-axis.calc";
  auto c = Calculation::fromText(display, readFile(repoPath(display)));
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  compareWithGolden(renderMarkdown(t), "ball-screw-axis.md");
  compareWithGolden(renderHtml(t), "ball-screw-axis.html");
}
