// Load cases in the human trail: a value line per case under every step a
// case changes, a check table with a column per case and the governing case
// marked, and a verdict that fails when any case fails.
#include <catch2/catch.hpp>

#include "engine/report/formats.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {
const char* kSheet =
    "F = 10 kN\n"
    "f = 0.1\n"
    "T [N*m] = F * f * 20 mm\n"
    "check torque: T <= 30 [N*m]\n"
    "check load: F <= 20 kN\n"
    "case dry: f = 0.2\n"
    "case over: F = 12 kN\n";
}

TEST_CASE("cases: the text trail shows a value per case where a case changes it", "[cases][report]") {
  auto c = calc(kSheet);
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const std::string text = renderText(t);
  CHECK(text.find("LOAD CASES\n----------\n  nominal  the worksheet as written\n  dry      f = 0.2\n"
                  "  over     F = 12 kN\n") != std::string::npos);
  // T: 10 kN * 0.1 * 20 mm = 20 N*m; dry 40 N*m; over 24 N*m.
  CHECK(text.find("      = 20.00 N·m\n        nominal  20.00 N·m\n        dry      40.00 N·m\n"
                  "        over     24.00 N·m\n") !=
        std::string::npos);
}

TEST_CASE("cases: the check table marks the governing case, and a case failure fails the verdict",
          "[cases][report]") {
  auto c = calc(kSheet);
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.failed == 0);  // the nominal passes
  CHECK(verdictState(t) == "FAIL");
  CHECK(verdictSentence(t) == "FAIL: 1 of 2 checks fails: torque (in case dry)");
  const std::string text = renderText(t);
  CHECK(text.find("  torque  pass 10.00 N·m  FAIL -10.00 N·m *  pass 6.000 N·m\n") != std::string::npos);
  CHECK(text.find("  load    pass 10.00 kN   pass 10.00 kN      pass 8.000 kN *\n") != std::string::npos);
  for (const char* format : {"md", "html"}) {
    INFO(format);
    CHECK(renderReport(t, format).find("1 of 2 checks fails: torque (in case dry)") != std::string::npos);
  }
}

TEST_CASE("cases: all cases passing says so in the verdict", "[cases][report]") {
  auto c = calc("F = 10 kN\ncheck load: F <= 20 kN\ncase over: F = 12 kN\n");
  const Trail t = buildTrail(*c, 4);
  CHECK(verdictSentence(t) == "PASS: the 1 check passes in 2 load cases");
}

TEST_CASE("cases: Markdown and HTML show a column per case for checks and changed values", "[cases][report]") {
  auto c = calc(kSheet);
  const Trail t = buildTrail(*c, 4);
  const std::string md = renderReport(t, "md");
  CHECK(md.find("| Check | `nominal` | `dry` | `over` |\n|---|---|---|---|\n"
                "| `torque` | pass 10.00 N·m | **FAIL** -10.00 N·m (governing) | pass 6.000 N·m |\n") !=
        std::string::npos);
  CHECK(md.find("| `T` | 20.00 N·m | **40.00 N·m** | **24.00 N·m** |  |\n") != std::string::npos);
  CHECK(md.find("### Checks by load case") < md.find("## Inputs"));
  const std::string html = renderReport(t, "html");
  CHECK(html.find("<h3>Checks by load case</h3>") < html.find("<h2>Inputs</h2>"));
  CHECK(html.find("<td class=\"value\"><span class=\"fail-mark\">FAIL</span> ") != std::string::npos);
  CHECK(html.find("<h3>Values by load case</h3>") != std::string::npos);
  // A sheet without cases has none of it.
  auto plain = calc("F = 10 kN\ncheck load: F <= 20 kN\n");
  const Trail p = buildTrail(*plain, 4);
  CHECK(renderReport(p, "md").find("load case") == std::string::npos);
  CHECK(renderReport(p, "html").find("load case") == std::string::npos);
}
