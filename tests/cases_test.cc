// Load cases (docs/cases.md): `case NAME: Q = EXPR, ...` parsed, checked at
// the case line, every case evaluated in one run over the nominal, --case and
// --set, the check lines, the governing case, diff and fmt case by case.
#include <catch2/catch.hpp>

#include <cstring>

#include "engine/report/trail.h"
#include "engine/review/sheet_diff.h"
#include "engine/review/sheet_format.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

const char* kSheet =
    "F = 10 kN        # load\n"
    "f = 0.10         # friction\n"
    "d = 20 mm\n"
    "T [N*m] = F * f * d / 2\n"
    "A [mm^2] = pi * d^2 / 4\n"
    "sigma [MPa] = F / A\n"
    "check torque: T <= 15 [N*m]\n"
    "check stress: sigma < 50 MPa\n"
    "case high: f = 0.15               # dry\n"
    "case overload: F = 14 kN, f = max(0.08, 0.12)\n";

CalcOptions options(const std::string& case_name = "", const std::vector<std::string>& sets = {}) {
  CalcOptions o;
  o.case_name = case_name;
  o.sets = sets;
  return o;
}

bool sameBits(double a, double b) {
  return std::memcmp(&a, &b, sizeof a) == 0;
}

const CaseRun& run(const Calculation& c, const std::string& name) {
  for (const CaseRun& r : c.cases)
    if (r.def->name == name) return r;
  FAIL("no case " << name);
  return c.cases.front();
}

double caseValue(const Calculation& c, const std::string& case_name, const std::string& q) {
  return run(c, case_name).results.values[static_cast<size_t>(c.sheet.find(q))];
}

std::string sheetFile(const std::string& text) {
  const std::string path = tempDir() + "/cases.calc";
  writeFile(path, text);
  return path;
}

}  // namespace

TEST_CASE("case lines: names, replacements in order, commas inside calls, descriptions", "[cases][parser]") {
  auto c = calc(kSheet);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  REQUIRE(c->sheet.cases.size() == 2);
  const LoadCase& high = c->sheet.cases[0];
  CHECK(high.name == "high");
  CHECK(high.line == 9);
  CHECK(high.description == "dry");
  REQUIRE(high.replacements.size() == 1);
  CHECK(high.replacements[0].name == "f");
  const LoadCase& over = c->sheet.cases[1];
  REQUIRE(over.replacements.size() == 2);
  CHECK(over.replacements[0].name == "F");
  CHECK(over.replacements[1].name == "f");
  CHECK(renderExpr(*over.replacements[1].expr) == "max(0.08, 0.12)");
  CHECK(c->sheet.statements[8].kind == Statement::CaseStmt);
  CHECK(c->sheet.statements[9].index == 1);
  // `case` stays usable as a quantity name.
  auto q = calc("case = 3\nx = case * 2\n");
  CHECK_FALSE(q->hasErrors());
  CHECK(si(*q, "x") == 6);
}

TEST_CASE("case lines: every problem at its place in the case line", "[cases][parser]") {
  auto c = calc(
      "a = 2 m\n"
      "b [m] = 1 m\n"
      "c = a / b\n"
      "case nominal: a = 1 m\n"
      "case x: aa = 1 m, b = 2 s, a = 1 s\n"
      "case x: a = 1 m, a = 2 m\n"
      "case y: a = 1 m,\n"
      "case: a = 1 m\n"
      "case z a = 1 m\n"
      "case w:\n"
      "case v: a 1 m\n");
  CHECK(diagnostics(*c) ==
        "sheet.calc:4:6: error: `nominal` is the worksheet as written, without replacements; give the case "
        "another name\n"
        "sheet.calc:5:9: error: case `x`: the worksheet defines no quantity `aa`; did you mean `a`?\n"
        "sheet.calc:5:23: error: case `x`: `b` is declared in [m], length (mm), but the value given is time "
        "(s)\n"
        "sheet.calc:5:32: error: case `x`: `a` is length (mm) in the worksheet, but the value given is time "
        "(s)\n"
        "sheet.calc:6:6: error: the case `x` is defined twice; the first is on line 5\n"
        "sheet.calc:6:18: error: the case `x` replaces `a` twice\n"
        "sheet.calc:7:16: error: an empty replacement in the case `y`: write `NAME = VALUE` between commas\n"
        "sheet.calc:8:5: error: a load case needs a name: `case overload: F = 1.25 * F_rated`\n"
        "sheet.calc:9:8: error: expected `:` after the case name `z`\n"
        "sheet.calc:10:7: error: the case `w` needs replacements after `:`, as in `f = 0.2, F = 30 kN`\n"
        "sheet.calc:11:11: error: expected `=` after `a` in the case `v`\n");
  CHECK(c->results.values.empty());  // a worksheet with errors shows no values
}

TEST_CASE("every case is evaluated in one run, bit for bit as the sheet with its replacements", "[cases]") {
  auto c = calc(kSheet);
  REQUIRE_FALSE(c->hasErrors());
  REQUIRE(c->cases.size() == 2);
  auto high = calc(kSheet, {"f=0.15"});
  auto over = calc(kSheet, {"F=14 kN", "f=max(0.08, 0.12)"});
  for (const Quantity& q : c->sheet.quantities) {
    INFO(q.name);
    CHECK(sameBits(caseValue(*c, "high", q.name), si(*high, q.name)));
    CHECK(sameBits(caseValue(*c, "overload", q.name), si(*over, q.name)));
  }
  CHECK(si(*c, "T") == Approx(10.0));  // the nominal is the sheet as written
  CHECK(caseValue(*c, "high", "T") == Approx(15.0));
  CHECK(caseValue(*c, "overload", "T") == Approx(16.8));
  CHECK(run(*c, "high").results.checks[0].passed);
  CHECK_FALSE(run(*c, "overload").results.checks[0].passed);
  // Only the cone is re-run: a case that changes f leaves A as the nominal's.
  CHECK(run(*c, "high").inputs->own().size() == 1);
}

TEST_CASE("cases: --set applies on top of every case and hides a case's replacement of the same name",
          "[cases]") {
  auto c = Calculation::fromText("sheet.calc", kSheet, options("", {"f=0.2"}));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(caseValue(*c, "high", "T") == Approx(20.0));      // --set f wins over the case's f
  CHECK(caseValue(*c, "overload", "T") == Approx(28.0));  // F from the case, f from --set
  auto d = Calculation::fromText("sheet.calc", kSheet, options("", {"d=40 mm"}));
  CHECK(caseValue(*d, "high", "T") == Approx(30.0));
}

TEST_CASE("cases: --case evaluates one case alone as the nominal, and an unknown name lists the cases",
          "[cases]") {
  auto c = Calculation::fromText("sheet.calc", kSheet, options("overload"));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->cases.empty());
  CHECK(c->shown_case == "overload");
  CHECK(si(*c, "T") == Approx(16.8));
  const Quantity& F = c->sheet.quantities[static_cast<size_t>(c->sheet.find("F"))];
  CHECK(F.overridden);
  CHECK(F.overrideCase() == "overload");
  const Trail t = buildTrail(*c, 4);
  CHECK(t.shown_case == "overload");
  CHECK(t.steps.get(0)->origin == "replaced in case overload");
  auto n = Calculation::fromText("sheet.calc", kSheet, options("nominal"));
  CHECK(n->cases.empty());
  CHECK(si(*n, "T") == Approx(10.0));
  auto bad = Calculation::fromText("sheet.calc", kSheet, options("overlaod"));
  CHECK(diagnostics(*bad) ==
        "sheet.calc:1:1: error: --case: the worksheet has no case `overlaod`; did you mean `overload`? "
        "(its cases: `nominal`, `high`, `overload`)\n");
}

TEST_CASE("the trail: a value per case, what varies, each check per case and the governing case",
          "[cases][report]") {
  auto c = calc(kSheet);
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.cases.size() == 3);
  CHECK(t.cases[0].name == "nominal");
  CHECK(t.cases[2].replacements == "F = 14 kN, f = max(0.08, 0.12)");
  const TrailSteps::Held T_held = t.steps.get(3);
  const TrailStep& T = *T_held;
  REQUIRE(T.cases.size() == 3);
  CHECK(T.varies);
  CHECK(valueText(T.cases[1].value) == "15.00 N·m");
  CHECK_FALSE(t.steps.get(2)->varies);  // d: no case changes it
  CHECK(t.steps.get(1)->cases[1].replaced);
  CHECK(t.steps.get(1)->cases[1].formula == "0.15");
  const TrailCheck& torque = t.checks[0];
  CHECK(torque.governing == 2);  // overload: 16.8 N*m against 15
  CHECK_FALSE(torque.cases[2].passed);
  CHECK(torque.cases[2].margin.value == Approx(-1.8));
  CHECK(torque.cases[0].margin.value == Approx(5.0));
  CHECK(t.checks[1].governing == 2);  // the stress grows with F only
  CHECK(t.failed_in_cases == 1);
  CHECK(t.cases[2].failed == 1);
  CHECK(t.failed == 0);  // the nominal's own verdict is unchanged
}

TEST_CASE("a case that divides by zero: an error naming it, the other cases still shown, exit 2",
          "[cases][cli]") {
  const std::string sheet =
      "a = 3 m\n"
      "b = 1 m\n"
      "c = a / (a - 2 * b)   # slack\n"
      "check positive: c > 0\n"
      "case zero: b = 1.5 m\n"
      "case more: a = 4 m\n";
  auto c = calc(sheet);
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->caseErrors());
  CHECK_FALSE(run(*c, "zero").ok());
  CHECK(run(*c, "more").ok());
  const std::string path = sheetFile(sheet);
  Run r = runCli("report " + path + " --format json");
  CHECK(r.status == 2);
  CHECK(r.err.find("cases.calc:3:5: error: case `zero`: `c` cannot be calculated: division by zero") !=
        std::string::npos);
  Json j;
  std::string error;
  REQUIRE(parseJson(r.out, &j, &error));
  CHECK(j["cases"].array[1]["ok"].boolean == false);
  CHECK(j["cases"].array[1]["errors"].array.size() == 1);
  CHECK(j["quantities"][2]["cases"]["more"]["value"].number == 2.0);
  CHECK(j["quantities"][2]["cases"]["zero"]["value"].type == Json::Null);
  CHECK(j["checks"][0]["governing"].string == "more");
  Run k = runCli("check " + path);
  CHECK(k.status == 2);
  CHECK(k.err == path +
                     ":3:5: error: case `zero`: `c` cannot be calculated: division by zero: the divisor is 0 "
                     "(with a = 3.000 m, b = 1.500 m)\n");
}

TEST_CASE("check fails when a check fails in any case, and its line names the case", "[cases][cli]") {
  const std::string path = sheetFile(kSheet);
  Run r = runCli("check " + path);
  CHECK(r.status == 1);
  CHECK(r.out == path +
                     ":7:7: error: check `torque` fails in case overload: 16.80 N·m <= 15 N·m is false\n"
                     "1 worksheet, 6 checks: 1 failed\n");
  CHECK(runCli("check " + path + " --case high").status == 0);
  Run alone = runCli("check " + path + " --case overload");
  CHECK(alone.status == 1);
  CHECK(alone.out.find("fails in case overload") != std::string::npos);
  Run unknown = runCli("report " + path + " --case heavy");
  CHECK(unknown.status == 2);
  CHECK(unknown.err.find("--case: the worksheet has no case `heavy`") != std::string::npos);
  CHECK(runCli("check " + path + " --set \"F=5 kN\"").status == 0);  // --set over every case
}

TEST_CASE("JSON: each quantity and check carries every case, and the demo with cases, byte for byte",
          "[cases][json][golden]") {
  Run r = runCli("report worksheets/bearing-press.calc --format json");
  REQUIRE(r.status == 0);
  const std::string path = repoPath("tests/golden/bearing-press.json");
  if (std::getenv("CALCTRAIL_UPDATE_GOLDEN")) writeFile(path, r.out);
  CHECK(r.out == readFile(path));
  Json j;
  std::string error;
  REQUIRE(parseJson(r.out, &j, &error));
  REQUIRE(j["cases"].array.size() == 4);
  for (const Json& q : j["quantities"].array) {
    INFO(q["name"].string);
    CHECK(q["cases"]["nominal"]["si"].number == q["si"].number);
    CHECK(q["cases"].object.size() == 4);
  }
  // Motor sized with the high friction, self-locking checked with the low one.
  CHECK(j["checks"][0]["name"].string == "self_locking");
  CHECK(j["checks"][0]["governing"].string == "friction_low");
  CHECK(j["checks"][3]["name"].string == "motor");
  CHECK(j["checks"][3]["governing"].string == "friction_high");
  CHECK(j["checks"][2]["governing"].string == "overload");
}

TEST_CASE("diff compares case by case and reports cases added and removed", "[cases][review]") {
  const std::string was = kSheet;
  std::string now = kSheet;
  now.replace(now.find("case high: f = 0.15"), 19, "case high: f = 0.16");
  now.replace(now.find("case overload: F = 14 kN"), 24, "case heavy: F = 13 kN");
  auto a = Calculation::fromText("old.calc", was);
  auto b = Calculation::fromText("new.calc", now);
  const SheetDiff d = diffCalculations(a.get(), b.get(), 1e-9);
  CHECK(d.has_cases);
  CHECK(d.cases_added == std::vector<std::string>{"case heavy: F = 13 kN, f = max(0.08, 0.12)"});
  CHECK(d.cases_removed == std::vector<std::string>{"case overload: F = 14 kN, f = max(0.08, 0.12)"});
  REQUIRE(d.cases.size() == 1);
  CHECK(d.cases[0].name == "high");
  CHECK(d.cases[0].flipped.size() == 1);  // torque: 16 N*m > 15 in the new side
  CHECK(d.cases[0].moved.front().name == "f");
  CHECK(d.somethingMoved());
  REQUIRE(d.formulas.size() == 1);
  CHECK(d.formulas[0].name == "case high");
  auto same_a = Calculation::fromText("old.calc", was);
  auto same_b = Calculation::fromText("new.calc", was);
  // Nothing moved; the one check that fails (torque in case overload: 14 kN *
  // 0.12 * 20 mm / 2 = 16.8 N*m > 15 N*m) is listed as still failing, never
  // read as "all good".
  const SheetDiff same = diffCalculations(same_a.get(), same_b.get(), 1e-9);
  CHECK_FALSE(same.somethingMoved());
  REQUIRE(same.still_failing.size() == 1);
  CHECK(same.still_failing[0].now.name == "torque");
  CHECK(same.still_failing[0].in_case == "overload");
  CHECK(same.still_failing[0].now.lhs == Approx(16.8));
  SheetDiff rest = same;
  rest.still_failing.clear();
  CHECK(rest.empty());
}

TEST_CASE("fmt lays out case lines canonically and keeps their meaning", "[cases][review]") {
  Diagnostics diags;
  const std::string out = formatWorksheet(
      "s.calc", "F = 10 [kN]\nf=0.1\ncase  hot :f=0.2,F = 12 [kN]   #  warm\ncase cold: f = max(0.05,0.06)\n",
      &diags);
  CHECK_FALSE(diags.hasErrors());
  CHECK(out ==
        "F = 10 kN\n"
        "f = 0.1\n"
        "case hot: f = 0.2, F = 12 kN    # warm\n"
        "case cold: f = max(0.05, 0.06)\n");
}

// A friction value out of torque_raise's usual range only in one case must
// not pass in silence because the nominal is fine.
TEST_CASE("cases: a warning only a case raises is a warning of the run, named with its case", "[cases][warnings]") {
  const std::string dir = tempDir();
  writeFile(dir + "/c.calc",
            "d = 20 mm\np = 4 mm\nl [mm/rev] = thread_lead(p, 1)\nd_m = trap_pitch_dia(d, p)\nf = 0.1\n"
            "F = 10 kN\nT [N*m] = torque_raise(F, d_m, l, f, trap_flank_angle())\ncheck t: T < 100 [N*m]\n"
            "case dry: f = 0.45\ncase oiled: f = 0.08\n");
  Run r = runCliIn(dir, "report c.calc");
  INFO(r.out << r.err);
  CHECK(r.status == 0);
  // One warning: the dry case's f, at the argument f of the torque_raise call.
  CHECK(count(r.err, ": warning:") == 1);
  CHECK(r.err.find("c.calc:7:35: warning: case `dry`: `torque_raise`: f = 0.45 is outside the usual range") !=
        std::string::npos);
  CHECK(r.out.find("WARNING: 1 warning, flagged at its step: T (line 7)") != std::string::npos);
  // With --case dry the case is the nominal: the same warning, without the case's name.
  Run alone = runCliIn(dir, "report c.calc --case dry");
  CHECK(count(alone.err, ": warning:") == 1);
  CHECK(alone.err.find("c.calc:7:35: warning: `torque_raise`: f = 0.45") != std::string::npos);
  // A warning the nominal raises too is reported once.
  writeFile(dir + "/n.calc",
            "d = 20 mm\np = 4 mm\nl [mm/rev] = thread_lead(p, 1)\nd_m = trap_pitch_dia(d, p)\nf = 0.45\n"
            "F = 10 kN\nT [N*m] = torque_raise(F, d_m, l, f, trap_flank_angle())\ncase heavy: F = 12 kN\n");
  Run both = runCliIn(dir, "report n.calc");
  // The heavy case re-runs T with the same f = 0.45: the same warning, once.
  CHECK(count(both.err, ": warning:") == 1);
  CHECK(both.err.find("case `heavy`") == std::string::npos);
}
