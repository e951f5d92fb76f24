// `calctrail diff`: the comparison of two revisions of a worksheet (inputs,
// formulas, moved results, added and removed names, flipped checks, new
// warnings), its three formats and its exit status.
#include <catch2/catch.hpp>

#include <cmath>

#include "engine/review/diff_render.h"
#include "engine/review/sheet_diff.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// A hand-cranked lifting screw: raising torque against a handwheel limit.
const char* kBase =
    "title: Test lift\n"
    "revision: A\n"
    "F = 10 kN                 # load\n"
    "d_m = 20 mm               # mean diameter\n"
    "l = 4 mm                  # lead\n"
    "f = 0.10                  # thread friction\n"
    "T [N*m] = F * d_m / 2 * (l + pi * f * d_m) / (pi * d_m - f * l)  # raising torque\n"
    "eta [%] = F * l / (2 * pi * T)   # efficiency\n"
    "T_max = 20 [N*m]          # handwheel limit\n"
    "check torque: T <= T_max  # operator effort\n";

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const size_t at = text.find(from);
  REQUIRE(at != std::string::npos);
  return text.replace(at, from.size(), to);
}

struct Pair {
  std::unique_ptr<Calculation> old_calc, new_calc;
  SheetDiff d;
};

Pair diffOf(const std::string& old_text, const std::string& new_text, double rtol = 1e-9) {
  Pair p;
  p.old_calc = Calculation::fromText("old.calc", old_text);
  p.new_calc = Calculation::fromText("new.calc", new_text);
  INFO(diagnostics(*p.old_calc) << diagnostics(*p.new_calc));
  REQUIRE(!p.old_calc->hasErrors());
  REQUIRE(!p.new_calc->hasErrors());
  p.d = diffCalculations(p.old_calc.get(), p.new_calc.get(), rtol);
  return p;
}

std::string sheetFile(const std::string& dir, const std::string& name, const std::string& text) {
  const std::string path = dir + "/" + name;
  writeFile(path, text);
  return path;
}

// Raising torque of the base sheet, from the closed form written out again.
double torque(double f) {
  const double F = 10000, dm = 0.020, l = 0.004;
  return F * dm / 2 * (l + M_PI * f * dm) / (M_PI * dm - f * l);
}

}  // namespace

TEST_CASE("diff: identical and merely reformatted sheets show no change", "[review][diff]") {
  Pair same = diffOf(kBase, kBase);
  CHECK(same.d.empty());
  CHECK(!same.d.somethingMoved());
  // Layout, unit spelling, comments and descriptions are no change of meaning.
  std::string respelled = replaced(kBase, "d_m = 20 mm               # mean diameter", "d_m=20 [mm]");
  respelled = replaced(respelled, "T_max = 20 [N*m]", "T_max = 20 [N\u00b7m]");
  respelled = "# a new comment\n\n" + respelled;
  Pair re = diffOf(kBase, respelled);
  CHECK(re.d.empty());
  CHECK(renderDiffText(re.d, 4) ==
        "calctrail diff: old.calc -> new.calc\nNo change in inputs, formulas, results or checks (rtol 1e-09).\n");
}

TEST_CASE("diff: a changed input, the results it moved and the check it flipped", "[review][diff]") {
  Pair p = diffOf(kBase, replaced(kBase, "f = 0.10 ", "f = 0.20 "));
  const SheetDiff& d = p.d;
  REQUIRE(d.inputs.size() == 1);
  CHECK(d.inputs[0].name == "f");
  CHECK(d.inputs[0].old_si == 0.10);
  CHECK(d.inputs[0].new_si == 0.20);
  CHECK(d.inputs[0].relative == Approx(1.0));
  CHECK(d.inputs[0].moved);
  CHECK(d.formulas.empty());
  // T and eta moved; T moved more (relatively), so it comes first.
  REQUIRE(d.moved.size() == 2);
  CHECK(d.moved[0].name == "T");
  CHECK(d.moved[0].old_si == Approx(torque(0.10)).epsilon(1e-14));
  CHECK(d.moved[0].new_si == Approx(torque(0.20)).epsilon(1e-14));
  CHECK(d.moved[0].relative == Approx(torque(0.20) / torque(0.10) - 1).epsilon(1e-12));
  CHECK(d.moved[1].name == "eta");
  CHECK(std::fabs(d.moved[0].relative) > std::fabs(d.moved[1].relative));
  REQUIRE(d.flipped.size() == 1);
  CHECK(d.flipped[0].now.name == "torque");
  CHECK(!d.flipped[0].now.passed);
  CHECK(d.somethingMoved());

  const std::string text = renderDiffText(d, 4);
  INFO(text);
  // Flipped checks come first, before anything else is listed.
  const size_t flip = text.find("!! CHECK FLIPPED  torque: PASS -> FAIL");
  REQUIRE(flip != std::string::npos);
  CHECK(flip < text.find("Inputs changed:"));
  CHECK(text.find("T <= T_max: 26.71 N\u00b7m <= 20.00 N\u00b7m is false (was 16.47 N\u00b7m <= 20.00 N\u00b7m)") !=
        std::string::npos);
  CHECK(text.find("  f  0.10  ->  0.20  +100 %\n") != std::string::npos);  // as written
  CHECK(text.find("  T    16.47 N\u00b7m  ->  26.71 N\u00b7m  +62.1 %\n") != std::string::npos);
  CHECK(text.find("  eta  38.65 %    ->  23.84 %    -38.3 %\n") != std::string::npos);
  CHECK(text.find("1 check flipped, 1 input changed, 2 results moved.") != std::string::npos);
}

TEST_CASE("diff: values are shown in the new side's display unit", "[review][diff]") {
  // The old side shows the torque in lbf*in, the new in N*m: both values in N*m.
  Pair p = diffOf(replaced(kBase, "T [N*m]", "T [lbf*in]"), replaced(kBase, "F = 10 kN", "F = 11 kN"));
  REQUIRE(!p.d.moved.empty());
  CHECK(p.d.moved[0].unit.text == "N*m");
  const std::string text = renderDiffText(p.d, 4);
  CHECK(text.find("16.47 N\u00b7m  ->  18.12 N\u00b7m") != std::string::npos);
  // The changed display unit is a formula change of T.
  REQUIRE(p.d.formulas.size() == 1);
  CHECK(p.d.formulas[0].old_text.rfind("T [lbf*in] = ", 0) == 0);
  CHECK(p.d.formulas[0].new_text.rfind("T [N*m] = ", 0) == 0);
}

TEST_CASE("diff: formulas changed, quantities added and removed", "[review][diff]") {
  std::string now = replaced(kBase, "T_max = 20 [N*m]          # handwheel limit\n",
                             "r_wheel = 0.15 m\nP_hand = 150 N\nT_max [N*m] = P_hand * r_wheel  # handwheel limit\n");
  now = replaced(now, "eta [%] = F * l / (2 * pi * T)   # efficiency\n", "");
  Pair p = diffOf(kBase, now);
  const SheetDiff& d = p.d;
  // T_max became a step: its definition changed, and its value moved.
  REQUIRE(d.formulas.size() == 1);
  CHECK(d.formulas[0].name == "T_max");
  CHECK(d.formulas[0].old_text == "T_max = 20 [N*m]");
  CHECK(d.formulas[0].new_text == "T_max [N*m] = P_hand * r_wheel");
  REQUIRE(d.moved.size() == 1);
  CHECK(d.moved[0].name == "T_max");
  CHECK(d.moved[0].new_si == Approx(22.5));
  REQUIRE(d.added.size() == 2);
  CHECK(d.added[0].name == "r_wheel");
  CHECK(d.added[1].name == "P_hand");
  CHECK(d.added[1].input);
  REQUIRE(d.removed.size() == 1);
  CHECK(d.removed[0].name == "eta");
  CHECK(d.removed[0].formula == "eta [%] = F * l / (2 * pi * T)");
  CHECK(d.flipped.empty());
  CHECK(d.somethingMoved());
  const std::string text = renderDiffText(d, 4);
  CHECK(text.find("    was  T_max = 20 [N*m]\n    now  T_max [N*m] = P_hand * r_wheel\n") != std::string::npos);
  CHECK(text.find("  added    P_hand = 150 N") != std::string::npos);
  CHECK(text.find("  removed  eta [%] = F * l / (2 * pi * T)  was 38.65 %") != std::string::npos);

  // A formula rewritten to the same value is listed, but nothing moved.
  Pair same = diffOf(kBase, replaced(kBase, "F * l / (2 * pi * T)", "l * F / (2 * pi * T)"));
  CHECK(same.d.formulas.size() == 1);
  CHECK(same.d.moved.empty());
  CHECK(!same.d.somethingMoved());
}

TEST_CASE("diff: a calculated value replaced by a given one", "[review][diff]") {
  // A motor from stock instead of the one the formula would pick.
  Pair p = diffOf(kBase, replaced(kBase, "T_max = 20 [N*m]", "T_max = 15 [N*m]"));
  CHECK(p.d.formulas.empty());  // a given value given again is an input change
  Pair q = diffOf(kBase, replaced(kBase, "T [N*m] = F * d_m / 2 * (l + pi * f * d_m) / (pi * d_m - f * l)",
                                  "T = 25 [N*m]"));
  REQUIRE(q.d.formulas.size() == 1);
  CHECK(q.d.formulas[0].name == "T");
  CHECK(q.d.formulas[0].new_text == "T = 25 [N*m]");
  REQUIRE(q.d.inputs.size() == 1);
  CHECK(q.d.inputs[0].name == "T");
  CHECK(q.d.inputs[0].new_si == 25);
  REQUIRE(q.d.flipped.size() == 1);
  CHECK(q.d.moved.size() == 1);  // eta
}

TEST_CASE("diff: checks added, removed, changed, and metadata", "[review][diff]") {
  std::string now = replaced(kBase, "check torque: T <= T_max  # operator effort\n",
                             "check torque: T < T_max\ncheck efficient: eta >= 30 %\n");
  now = replaced(now, "revision: A", "revision: B");
  Pair p = diffOf(kBase + std::string("check lead: l > 1 mm\n"), now);
  REQUIRE(p.d.checks_added.size() == 1);
  CHECK(p.d.checks_added[0].name == "efficient");
  CHECK(p.d.checks_added[0].passed);
  REQUIRE(p.d.checks_removed.size() == 1);
  CHECK(p.d.checks_removed[0].name == "lead");
  REQUIRE(p.d.formulas.size() == 1);
  CHECK(p.d.formulas[0].is_check);
  CHECK(p.d.formulas[0].old_text == "check torque: T <= T_max");
  CHECK(p.d.formulas[0].new_text == "check torque: T < T_max");
  REQUIRE(p.d.meta.size() == 1);
  CHECK(p.d.meta[0].key == "revision");
  CHECK(p.d.meta[0].new_value == "B");
  CHECK(p.d.somethingMoved());
}

TEST_CASE("diff: moved results sorted by relative change, largest first", "[review][diff]") {
  const std::string base = "x = 1\na = x * 100\nb = x * x\nc = -x * 3\nd = 5 + x / 1000\n";
  Pair p = diffOf(base, replaced(base, "x = 1", "x = 2"));
  REQUIRE(p.d.moved.size() == 4);
  CHECK(p.d.moved[0].name == "b");  // +300 %
  CHECK(p.d.moved[1].name == "a");  // +100 %, before c by name
  CHECK(p.d.moved[2].name == "c");  // -100 %
  CHECK(p.d.moved[2].relative == Approx(-1.0));
  CHECK(p.d.moved[3].name == "d");  // +0.02 %
  // From zero: the largest change of all.
  const std::string zero = "x = 0\ny = x * 2\nz = x + 1\n";
  Pair z = diffOf(zero, replaced(zero, "x = 0", "x = 1"));
  REQUIRE(z.d.moved.size() == 2);
  CHECK(z.d.moved[0].name == "y");
  CHECK(std::isinf(z.d.moved[0].relative));
  CHECK(renderDiffText(z.d, 4).find("from zero") != std::string::npos);
}

TEST_CASE("diff: the relative tolerance decides what moved", "[review][diff]") {
  const std::string base = "x = 1\ny = x * 3\n";
  const std::string tiny = replaced(base, "x = 1", "x = 1.0000000000001");
  Pair default_rtol = diffOf(base, tiny);
  CHECK(default_rtol.d.moved.empty());
  CHECK(!default_rtol.d.somethingMoved());
  REQUIRE(default_rtol.d.inputs.size() == 1);  // the input did change, within tolerance
  CHECK(!default_rtol.d.inputs[0].moved);
  Pair exact = diffOf(base, tiny, 0.0);
  REQUIRE(exact.d.moved.size() == 1);
  CHECK(exact.d.somethingMoved());
  // Rounded values that look alike get more digits until they differ.
  CHECK(renderDiffText(exact.d, 4).find("3.0000000000003") != std::string::npos);
  const std::string five = replaced(base, "x = 1", "x = 1.05");
  CHECK(diffOf(base, five, 0.1).d.moved.empty());
  CHECK(diffOf(base, five, 0.01).d.moved.size() == 1);
  CHECK(movedBeyond(100, 101, 0.0099));
  CHECK(!movedBeyond(100, 101, 0.01));
  CHECK(!movedBeyond(-2, -2, 0));
  CHECK(relativeChange(4, 3) == Approx(-0.25));
  CHECK(relativeChange(-4, -3) == Approx(0.25));
}

TEST_CASE("diff: a quantity whose dimension changed", "[review][diff]") {
  Pair p = diffOf("a = 2 m\nb = a * 2\n", "a = 2 s\nb = a * 2\n");
  REQUIRE(p.d.moved.size() == 1);
  CHECK(!p.d.moved[0].same_dimension);
  CHECK(std::isnan(p.d.moved[0].relative));
  const std::string text = renderDiffText(p.d, 4);
  CHECK(text.find("  a  2 m  ->  2 s  dimension changed\n") != std::string::npos);  // as written
  CHECK(text.find("  b  4000 mm  ->  4.000 s  dimension changed\n") != std::string::npos);
}

TEST_CASE("diff: new warnings of the new side", "[review][diff]") {
  const std::string base = "n = 100 rpm\nl = 5 [mm/rev]\nv = n * l\n";
  Pair p = diffOf(base, replaced(base, "l = 5 [mm/rev]", "l = 5 mm"));
  INFO(diagnostics(*p.new_calc));
  REQUIRE(p.d.new_warnings.size() == 1);
  CHECK(p.d.new_warnings[0].rfind("new.calc:3:", 0) == 0);
  CHECK(p.d.new_warnings[0].find(": warning: ") != std::string::npos);
  // The same warning on both sides, on another line, is not new.
  const std::string warned = replaced(base, "l = 5 [mm/rev]", "l = 5 mm");
  CHECK(diffOf(warned, "# moved down\n" + warned).d.new_warnings.empty());
}

TEST_CASE("diff: Markdown for a pull request", "[review][diff]") {
  Pair p = diffOf(kBase, replaced(kBase, "f = 0.10 ", "f = 0.20 "));
  const std::string md = renderDiffMarkdown(p.d, 4);
  INFO(md);
  CHECK(md.rfind("### calctrail diff: `old.calc` \u2192 `new.calc`\n\n> **Check flipped: `torque` PASS \u2192 FAIL**", 0) ==
        0);
  CHECK(md.find("| `torque` | `T <= T_max` | PASS: 16.47 N\u00b7m <= 20.00 N\u00b7m | **FAIL**: 26.71 N\u00b7m <= 20.00 N\u00b7m |") !=
        std::string::npos);
  CHECK(md.find("| `T` | 16.47 N\u00b7m | 26.71 N\u00b7m | +62.1 % |") != std::string::npos);
  CHECK(md.find("#### Checks flipped") < md.find("#### Inputs changed"));
  CHECK(md.find("#### Inputs changed") < md.find("#### Results moved"));
}

TEST_CASE("diff: JSON with full precision", "[review][diff][json]") {
  Pair p = diffOf(kBase, replaced(kBase, "f = 0.10 ", "f = 0.20 "));
  Json j;
  std::string error;
  const std::string text = renderDiffJson(p.d);
  INFO(text);
  REQUIRE(parseJson(text, &j, &error));
  CHECK(j["schema"].string == "calctrail-diff/1");
  CHECK(j["moved"].boolean);
  CHECK(j["rtol"].number == 1e-9);
  REQUIRE(j["checks_flipped"].array.size() == 1);
  CHECK(j["checks_flipped"][0]["name"].string == "torque");
  CHECK(j["checks_flipped"][0]["passed"].boolean == false);
  CHECK(j["checks_flipped"][0]["was_passed"].boolean == true);
  const Json& t = j["results_moved"][0];
  CHECK(t["name"].string == "T");
  CHECK(t["unit"].string == "N*m");
  CHECK(t["old_si"].number == p.d.moved[0].old_si);  // bit for bit
  CHECK(t["new_si"].number == p.d.moved[0].new_si);
  CHECK(t["new_value"].number == p.d.moved[0].new_si);
  CHECK(t["relative_change"].number == p.d.moved[0].relative);
  CHECK(j["inputs_changed"][0]["old_formula"].string == "f = 0.10");
  CHECK(j["inputs_changed"][0]["new_formula"].string == "f = 0.20");
  // From zero there is no relative change: null, and said in words.
  Pair z = diffOf("x = 0\ny = x * 2\n", "x = 1\ny = x * 2\n");
  Json zj;
  const std::string ztext = renderDiffJson(z.d);
  INFO(ztext << error);
  REQUIRE(parseJson(ztext, &zj, &error));
  CHECK(zj["results_moved"][0]["relative_change"].type == Json::Null);
  CHECK(zj["results_moved"][0]["change"].string == "from zero");
}

TEST_CASE("diff on the command line: exit 0, 1 and 2", "[review][diff][cli]") {
  const std::string dir = tempDir();
  const std::string a = sheetFile(dir, "a.calc", kBase);
  const std::string same = sheetFile(dir, "same.calc", "# reworded\n" + std::string(kBase));
  const std::string b = sheetFile(dir, "b.calc", replaced(kBase, "f = 0.10 ", "f = 0.20 "));
  const std::string broken = sheetFile(dir, "broken.calc", replaced(kBase, "l = 4 mm", "l = 4 mm +"));

  Run none = runCli("diff '" + a + "' '" + same + "'");
  CHECK(none.status == 0);
  CHECK(none.out.find("No change") != std::string::npos);
  Run moved = runCli("diff '" + a + "' '" + b + "'");
  CHECK(moved.status == 1);
  CHECK(moved.out.find("!! CHECK FLIPPED") != std::string::npos);
  CHECK(moved.err.empty());
  // A tolerance larger than every change: the numbers still differ, but
  // the flipped check alone is enough for exit 1.
  CHECK(runCli("diff '" + a + "' '" + b + "' --rtol 0.99").status == 1);
  CHECK(runCli("diff '" + a + "' '" + b + "' --format md").out.rfind("### calctrail diff", 0) == 0);
  CHECK(runCli("diff '" + a + "' '" + b + "' --format json").out.find("\"schema\": \"calctrail-diff/1\"") !=
        std::string::npos);

  Run err = runCli("diff '" + a + "' '" + broken + "'");
  CHECK(err.status == 2);
  CHECK(err.out.empty());
  CHECK(err.err.find(broken + ":5:28: error: the formula ends too early") != std::string::npos);
  Run missing = runCli("diff '" + dir + "/nope.calc' '" + a + "'");
  CHECK(missing.status == 2);
  CHECK(missing.err.find(dir + "/nope.calc:1:1: error: cannot read file") != std::string::npos);
  for (const char* args : {"diff", "diff a.calc", "diff a b --format pdf", "diff a b --rtol -1", "diff a b --digits 0"}) {
    INFO(args);
    CHECK(runCli(args).status == 2);
  }
}

// Issue 11, item 3: what a checker must not misread in a diff.
TEST_CASE("diff: a check that fails on both sides is listed as still failing", "[review][diff]") {
  const char* sheet = "f = 0.15\nF = 2 kN\nr = 0.1 m\nT [N*m] = F * r * f\ncheck t: T < 20 [N*m]\n";
  Pair same = diffOf(sheet, sheet);
  CHECK(!same.d.somethingMoved());
  CHECK(same.d.checksFail());
  REQUIRE(same.d.still_failing.size() == 1);
  const std::string text = renderDiffText(same.d, 4);
  CHECK(text.find("No change") == std::string::npos);
  CHECK(text.find("1 check still failing.") != std::string::npos);
  // 2 kN * 0.1 m * 0.15 = 30 N*m; the limit as written.
  CHECK(text.find("!! STILL FAILING  t: FAIL -> FAIL\n   T < 20 [N*m]: 30.00 N·m < 20 N·m is false") !=
        std::string::npos);
  CHECK(renderDiffMarkdown(same.d, 4).find("**Still failing: `t` FAIL \u2192 FAIL**") != std::string::npos);
  Json j;
  std::string error;
  REQUIRE(parseJson(renderDiffJson(same.d), &j, &error));
  CHECK(j["checks_fail"].boolean);
  CHECK(!j["moved"].boolean);
  REQUIRE(j["checks_still_failing"].array.size() == 1);
  CHECK(j["checks_still_failing"][0]["name"].string == "t");
  CHECK(j["checks_still_failing"][0]["lhs"].number == Approx(30));
  // A passing check on both sides is no news.
  Pair passing = diffOf("x = 1\ncheck c: x < 2\n", "x = 1\ncheck c: x < 2\n");
  CHECK(passing.d.still_failing.empty());
  CHECK(!passing.d.checksFail());
}

// The same in a load case: a check that passes as written but fails in a
// case on both sides must not read as "no change".
TEST_CASE("diff: a check that fails in a load case on both sides is listed with its case", "[review][diff][cases]") {
  const char* sheet =
      "f = 0.15\nF = 2 kN\nr = 0.1 m\nT [N*m] = F * r * f\ncheck t: T < 40 [N*m]\ncase dry: f = 0.25\n";
  Pair same = diffOf(sheet, sheet);
  CHECK(!same.d.somethingMoved());
  CHECK(same.d.checksFail());
  REQUIRE(same.d.still_failing.size() == 1);
  CHECK(same.d.still_failing[0].in_case == "dry");
  const std::string text = renderDiffText(same.d, 4);
  CHECK(text.find("No change") == std::string::npos);
  // 2 kN * 0.1 m * 0.25 = 50 N*m in case dry, over 40 N*m; 30 N*m as written passes.
  CHECK(text.find("!! STILL FAILING  t in case dry: FAIL -> FAIL\n   T < 40 [N*m]: 50.00 N·m < 40 N·m is false") !=
        std::string::npos);
  CHECK(renderDiffMarkdown(same.d, 4).find("**Still failing: `t` in case `dry` FAIL \u2192 FAIL**") !=
        std::string::npos);
  Json j;
  std::string error;
  REQUIRE(parseJson(renderDiffJson(same.d), &j, &error));
  REQUIRE(j["checks_still_failing"].array.size() == 1);
  CHECK(j["checks_still_failing"][0]["case"].string == "dry");
  CHECK(j["checks_still_failing"][0]["lhs"].number == Approx(50));
  // Through the command line: exit 1, as `check` would.
  const std::string dir = tempDir();
  writeFile(dir + "/a.calc", sheet);
  Run run = runCliIn(dir, "diff a.calc a.calc");
  CHECK(run.status == 1);
  CHECK(run.out.find("!! STILL FAILING  t in case dry: FAIL -> FAIL") != std::string::npos);
}

TEST_CASE("diff: inputs written as literals are shown as written on both sides", "[review][diff]") {
  Pair p = diffOf("f = 0.15\nd = 20 mm\nk = f * d\n", "f = 0.18\nd = 0.8 in\nk = f * d\n");
  const std::string text = renderDiffText(p.d, 4);
  CHECK(text.find("  f  0.15   ->  0.18    +20.0 %\n") != std::string::npos);
  CHECK(text.find("  d  20 mm  ->  0.8 in") != std::string::npos);
  CHECK(text.find("0.1500") == std::string::npos);
  CHECK(renderDiffMarkdown(p.d, 4).find("| `f` | 0.15 | 0.18 |") != std::string::npos);
}

TEST_CASE("diff --set applies to both sides and says the numbers are modified", "[review][diff][cli]") {
  const std::string dir = tempDir();
  writeFile(dir + "/old.calc", "f = 0.15\nF = 2 kN\nr = 0.1 m\nT [N*m] = F * r * f\ncheck t: T < 40 [N*m]\n");
  writeFile(dir + "/new.calc", "f = 0.18\nF = 2 kN\nr = 0.1 m\nT [N*m] = F * r * f\ncheck t: T < 40 [N*m]\n");
  Run plain = runCliIn(dir, "diff old.calc new.calc");
  CHECK(plain.status == 1);  // f moved
  CHECK(plain.out.find("MODIFIED") == std::string::npos);
  CHECK(plain.out.find("  T  30.00 N·m  ->  36.00 N·m") != std::string::npos);
  // F = 3 kN on both sides: 3 kN * 0.1 m * 0.15 = 45 N*m and * 0.18 = 54 N*m, both over 40 N*m.
  Run set = runCliIn(dir, "diff old.calc new.calc --set 'F=3 kN'");
  INFO(set.out << set.err);
  CHECK(set.status == 1);
  CHECK(set.out.find("MODIFIED: both sides are calculated AS MODIFIED by --set F=3 kN") != std::string::npos);
  CHECK(set.out.find("  T  45.00 N·m  ->  54.00 N·m") != std::string::npos);
  CHECK(set.out.find("!! STILL FAILING  t: FAIL -> FAIL") != std::string::npos);
  Run json = runCliIn(dir, "diff old.calc new.calc --set 'F=3 kN' --format json");
  Json j;
  std::string error;
  REQUIRE(parseJson(json.out, &j, &error));
  REQUIRE(j["modified_by"].array.size() == 1);
  CHECK(j["modified_by"][0].string == "F=3 kN");
  CHECK(j["inputs_changed"][0]["old_text"].string == "0.15");
  CHECK(j["inputs_changed"][0]["new_text"].string == "0.18");
  // A --set naming what a side lacks is an error of that side: no comparison.
  Run bad = runCliIn(dir, "diff old.calc new.calc --set 'nope=3'");
  CHECK(bad.status == 2);
  CHECK(bad.err.find("no comparison made") != std::string::npos);
}
