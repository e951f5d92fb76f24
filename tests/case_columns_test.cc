// Load cases in the human trail: a value line per case under every step a
// case changes, a check table with a column per case and the governing case
// marked, and a verdict that fails when any case fails.
#include <catch2/catch.hpp>

#include "engine/report/formats.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "engine/util/text_width.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {
bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

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
  CHECK(html.find("<td class=\"case\"><span class=\"fail-mark\">FAIL</span> <span class=\"value\">") !=
        std::string::npos);
  CHECK(html.find("<h3>Values by load case</h3>") != std::string::npos);
  // A sheet without cases has none of it.
  auto plain = calc("F = 10 kN\ncheck load: F <= 20 kN\n");
  const Trail p = buildTrail(*plain, 4);
  CHECK(renderReport(p, "md").find("load case") == std::string::npos);
  CHECK(renderReport(p, "html").find("load case") == std::string::npos);
}

TEST_CASE("cases: Markdown and HTML show the case values within each changed step, one value elsewhere",
          "[cases][report]") {
  // U is changed by no case: it shows its one value and no case table.
  auto c = calc(std::string(kSheet) + "r = 20 mm\nU [mm] = r * 2\n");
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const std::string md = renderReport(t, "md");
  // T = 10 kN * 0.1 * 20 mm = 20 N*m; dry (f = 0.2) 40 N*m; over (F = 12 kN) 24 N*m.
  CHECK(contains(md, "= **20.00 N·m**\n\n| Case | `nominal` | `dry` | `over` |\n|---|---|---|---|\n"
                     "| `T` | 20.00 N·m | **40.00 N·m** | **24.00 N·m** |\n"));
  CHECK(contains(md, "= **40.00 mm**\n\n## Results"));  // U, then no case table
  const std::string html = renderReport(t, "html");
  CHECK(contains(html, "<table class=\"step-cases\">\n<thead><tr><th><code>nominal</code></th><th><code>dry</code>"
                       "</th><th><code>over</code></th></tr></thead>\n<tbody><tr><td class=\"value\">20.00&nbsp;N·m"
                       "</td><td class=\"value\"><strong>40.00&nbsp;N·m</strong></td><td class=\"value\"><strong>"
                       "24.00&nbsp;N·m</strong></td></tr></tbody>\n</table>\n"));
  // One table a changed quantity: T and the inputs f and F (under their rows of the inputs table).
  CHECK(count(html, "<table class=\"step-cases\">") == 3);
  CHECK(count(html, "<tr class=\"case-values\">") == 2);
  const size_t u = html.find("id=\"q-U\"");
  REQUIRE(u != std::string::npos);
  CHECK(html.find("step-cases", u) == std::string::npos);
}

TEST_CASE("cases: groups of case columns, nearly even, each a table of its own", "[cases][report]") {
  using Groups = std::vector<std::pair<size_t, size_t>>;
  CHECK(caseGroups(0, 5).empty());
  CHECK(caseGroups(3, 5) == Groups{{0, 3}});
  CHECK(caseGroups(5, 5) == Groups{{0, 5}});
  CHECK(caseGroups(7, 6) == Groups{{0, 4}, {4, 7}});
  CHECK(caseGroups(12, 5) == Groups{{0, 4}, {4, 8}, {8, 12}});
  CHECK(caseGroups(13, 5) == Groups{{0, 5}, {5, 9}, {9, 13}});
}

TEST_CASE("cases: many cases wrap into tables that repeat the name column, in every format", "[cases][report]") {
  std::string sheet = "F = 10 kN\nT [N*m] = F * 20 mm\ncheck torque: T <= 300 [N*m]\n";
  for (int k = 1; k <= 12; ++k) sheet += fmt::format("case overload_dry_{:02}: F = {} kN\n", k, 10 + k);
  auto c = calc(sheet);
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.cases.size() == 13);
  const std::string md = renderReport(t, "md");
  // 13 cases: checks in groups of 5, 4 and 4; values in groups of 5, 4 and 4.
  CHECK(count(md, "| Check | `nominal` |") == 1);
  CHECK(contains(md, "| Check | `overload_dry_05` | `overload_dry_06` | `overload_dry_07` | `overload_dry_08` |\n"
                     "|---|---|---|---|---|\n| `torque` | pass 0.000 N·m | **FAIL** -20.00 N·m | **FAIL** -40.00 N·m |"
                     " **FAIL** -60.00 N·m |\n"));
  CHECK(contains(md, "| Check | `overload_dry_09` |"));
  // T in case k: (10 + k) kN * 20 mm; case 5 at the limit (margin 300 - 300 = 0), case 12 the
  // governing one (440 N*m, margin 300 - 440 = -140 N*m).
  CHECK(contains(md, "| **FAIL** -140.0 N·m (governing) |\n"));
  CHECK(count(md, "| Case | `nominal` |") == 1);  // the step T (the input F's values are under Results)
  CHECK(count(md, "| Case | `overload_dry_09` |") == 1);
  CHECK(contains(md, "| `T` | **380.0 N·m** | **400.0 N·m** | **420.0 N·m** | **440.0 N·m** |\n"));
  const std::string html = renderReport(t, "html");
  CHECK(count(html, "<table class=\"checks cases\">") == 3);
  CHECK(count(html, "<table class=\"cases\">") == 3);
  CHECK(count(html, "<table class=\"step-cases\">") == 6);
  // The text trail's check table wraps within 78 columns too, each block repeating the check names.
  const std::string text = renderText(t);
  const size_t at = text.find("CHECKS BY LOAD CASE");
  REQUIRE(at != std::string::npos);
  const std::string table = text.substr(at, text.find("\n\nCAUTIONS", at) - at);
  CHECK(count(table, "\n  torque  ") >= 3);
  size_t begin = 0;
  for (size_t end = table.find('\n'); end != std::string::npos; end = table.find('\n', begin)) {
    const std::string line = table.substr(begin, end - begin);
    INFO(line);
    CHECK(displayWidth(line) <= 78);
    begin = end + 1;
  }
  for (const TrailCase& k : t.cases) CHECK(contains(table, k.name));
}

TEST_CASE("cases: a calculated quantity that a case replaces names the formula in force in its step",
          "[cases][report]") {
  // T replaced in case `measured` by a value of its own: 35 N*m instead of 10 kN * 0.1 * 20 mm = 20 N*m.
  auto c = calc("F = 10 kN\nf = 0.1\nT [N*m] = F * f * 20 mm\ncase measured: T = 35 [N*m]\n");
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  CHECK(contains(renderText(t), "measured  35.00 N·m  (replaced: 35 [N*m])\n"));
  CHECK(contains(renderReport(t, "md"), "| `T` | 20.00 N·m | **35.00 N·m** (replaced: `35 [N*m]`) |\n"));
  CHECK(contains(renderReport(t, "html"), "<td class=\"value\"><strong>35.00&nbsp;N·m</strong><br><span class=\"row\">"
                                          "replaced: <code>35 [N*m]</code></span></td>"));
}
