// The trail a checker reads in one pass, losing nothing auditable: a
// library function described once, a table lookup by its row, nested calls
// and trivial constants by their values, leads as leads, each caution once,
// each check with its utilisation, each warning at its step. Each case
// starts from the input the issue quoted.
#include <catch2/catch.hpp>

#include <string>

#include "engine/report/cautions.h"
#include "engine/report/html_renderer.h"
#include "engine/report/json_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/mathml.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "functions/function_decl.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::unique_ptr<Calculation> demo(const std::string& name) {
  const std::string display = "worksheets/" + name + ".calc";
  CalcOptions options;
  options.source_path = repoPath(display);  // its templates, from wherever the tests run
  auto c = Calculation::fromText(display, readFile(repoPath(display)), options);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  return c;
}

bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

TrailStep step(const Trail& t, const std::string& name) {
  for (const TrailStep& s : t.steps)
    if (s.name == name) return s;
  FAIL("no step " << name);
  return {};
}

const TrailCheck& check(const Trail& t, const std::string& name) {
  for (const TrailCheck& c : t.checks)
    if (c.name == name) return c;
  FAIL("no check " << name);
  return t.checks.front();
}

}  // namespace

TEST_CASE("a library function is described once and each step shows its call, values and result",
          "[report][layout]") {
  auto c = demo("twin-screw-lift");
  const Trail t = buildTrail(*c, 4);
  const std::string text = renderText(t), md = renderMarkdown(t), html = renderHtml(t);
  for (const TrailFunction& f : t.functions) {
    INFO(f.name);
    if (f.trivial) continue;
    // The twin-screw sheet cites some sources for several functions: the
    // text and Markdown list each function once with its source, HTML numbers them.
    CHECK(count(text, "  " + f.signature + "  used by ") == 1);
    CHECK(count(text, "verified: docs/verification.md, `" + f.name + "`\n") == 1);
    CHECK(count(md, "**`" + f.signature + "`** used by") == 1);
    CHECK(count(html, "id=\"fn-" + f.name + "\"") == 1);
  }
  CHECK(count(html,
              "<li>Shigley&#39;s Mechanical Engineering Design (Budynas and Nisbett, 9th ed.), Sec. 8-2 (mechanics "
              "of power screws): the raise and lower torques of a square thread, Eqs. (8-1) and (8-2), and the "
              "self-locking condition, f above the tangent of the lead angle, Eq. (8-3), p. 416; the flank-angle "
              "form (the friction divided by cos(alpha)) and Machinery&#39;s Handbook, power screws (from "
              "memory)</li>") == 1);
  // The thread formula once (in the list), not at the step that calls it.
  CHECK(count(text, "= F \u00B7 dm / 2 \u00B7 (l + \u03C0 \u00B7 f \u00B7 dm / cos(alpha))") == 1);
  // Only where the call is a term of a sum (the stage's running torque, thread plus
  // collar) does the step show it with its values, as any nested library call.
  CHECK(count(text, "      where torque_raise") == 1);
  CHECK(text.find("      where torque_raise") > text.find("  screw.T_run  "));
  CHECK(text.find("      where torque_raise") < text.find("  screw.eta  "));
}

TEST_CASE("a table lookup shows the row it found, never the whole table", "[report][layout]") {
  auto twin = demo("twin-screw-lift");
  const Trail t = buildTrail(*twin, 4);
  CHECK(step(t, "screw.p").calls.at(0).row == "Tr 48x8, ISO 2904 table");
  CHECK(step(t, "motor.P_rated").calls.at(0).row == "5.5 kW, IEC 60072-1 series");
  const std::string text = renderText(t);
  CHECK(text.find("      = 8.000 mm  (Tr 48x8, ISO 2904 table)\n") != std::string::npos);
  for (const std::string& out : {text, renderMarkdown(t), renderHtml(t)}) {
    CHECK(out.find("Tr 8x1.5") == std::string::npos);    // the table's first row
    CHECK(out.find("0.06, 0.09, 0.12") == std::string::npos);  // the motor series
  }
  auto jack = demo("leveling-jack");
  const Trail j = buildTrail(*jack, 4);
  CHECK(step(j, "jack.p").calls.at(0).row == "Acme 1-5, ASME B1.5 table");
  // A call outside the table is never given a row it did not find.
  auto other = calc("P [kW] = standard_motor_power(4.9 kW)\nd = 50 mm\nq [mm] = trap_pitch(d)\n");
  INFO(diagnostics(*other));
  const Trail o = buildTrail(*other, 4);
  CHECK(step(o, "P").calls.at(0).row == "5.5 kW, IEC 60072-1 series");
  CHECK(step(o, "q").calls.at(0).row == "Tr 50x8, ISO 2904 table");
}

TEST_CASE("every table lookup of the library has its row finder", "[report][layout]") {
  for (const FunctionDecl& f : functionLibrary()) {
    if (f.formula_is_expression) continue;
    const bool table = f.formula.find("table lookup") != std::string::npos ||
                       f.formula.find("from the series") != std::string::npos;
    if (!table) continue;
    INFO(f.name << ": add its row to lookupTables() in engine/report/trail.cc");
    std::unique_ptr<Calculation> c;
    for (const char* arg : {"1 in", "48 mm", "2 kW", "95 %"}) {
      c = calc("x = " + std::string(f.name) + "(" + arg + ")\n");
      if (!c->hasErrors()) break;
    }
    INFO(diagnostics(*c));
    REQUIRE_FALSE(c->hasErrors());
    const Trail t = buildTrail(*c, 4);
    CHECK_FALSE(t.steps.get(0)->calls.at(0).row.empty());
  }
}

TEST_CASE("trivial definitions get no block, and a nested call is shown by its value", "[report][layout]") {
  // The input: torque_raise(..., trap_flank_angle()) showed the call, not 15.00°.
  auto c = calc("F = 12 kN\nd_m = 27 mm\nl = 12 [mm/rev]\nf = 0.1\n"
                "T [N*m] = torque_raise(F, d_m, l, f, trap_flank_angle())\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const TrailStep& s = step(t, "T");
  CHECK(lineText(s.substituted) == "torque_raise(12 kN, 27 mm, 12 mm/rev, 0.1, 15.00\u00B0)");
  CHECK(s.calls.at(1).nested);
  const std::string text = renderText(t);
  CHECK(text.find("trap_flank_angle()  used by") == std::string::npos);
  CHECK(text.find("  Definitions: trap_flank_angle() = 15.00\u00B0\n") != std::string::npos);
  CHECK(renderMarkdown(t).find("`= torque_raise(12 kN, 27 mm, 12 mm/rev, 0.1, 15.00\u00B0)`") !=
        std::string::npos);
  // HTML typesets the same line from the tree, the nested call as its value.
  const std::string html = renderHtml(t);
  CHECK(html.find("<mrow><mn>15.00</mn><mi mathvariant=\"normal\">\u00B0</mi></mrow><mo>)</mo>") !=
        std::string::npos);
  // The twin-screw demo: the pV step shows the speed, not the call that gives it.
  auto twin = demo("twin-screw-lift");
  const Trail tw = buildTrail(*twin, 4);
  CHECK(lineText(step(tw, "screw.pv").substituted).find("8.000 mm/rev, 72.50 rpm)") != std::string::npos);
}

TEST_CASE("a lead stays a lead where it is made and where it is read", "[report][layout]") {
  // The input: l = 7.000 mm/rev shown as 7.000 mm in both substitutions.
  auto c = calc("p = 7 mm\nl = thread_lead(p, 1)\nd_m = 27 mm\nlam = lead_angle(d_m, l)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  CHECK(valueText(step(t, "l").result) == "7.000 mm/rev");
  CHECK(valueText(*step(t, "l").calls.at(0).result) == "7.000 mm/rev");
  CHECK(lineText(step(t, "lam").substituted) == "lead_angle(27 mm, 7.000 mm/rev)");
  CHECK(lineText(step(t, "lam").calls.at(0).substituted) == "atan(7.000 mm/rev / (\u03C0 \u00B7 27 mm))");
  const std::string text = renderText(t);
  CHECK(text.find("7.000 mm ") == std::string::npos);
  CHECK(text.find("7.000 mm)") == std::string::npos);
}

TEST_CASE("each caution once: one catalogue, general and function cautions merged by identity",
          "[report][layout]") {
  auto c = demo("twin-screw-lift");
  const Trail t = buildTrail(*c, 4);
  const std::string text = renderText(t);
  // The three pairs that said the same thing twice.
  CHECK(text.find("Friction varies widely") == std::string::npos);
  CHECK(count(text, "Friction values vary widely") == 1);
  CHECK(count(text, "Self-locking is no brake") == 1);
  CHECK(count(text, "Long screws") == 1);
  CHECK(t.cautions.size() == t.caution_ids.size());
  for (size_t i = 0; i < t.caution_ids.size(); ++i)
    for (size_t k = i + 1; k < t.caution_ids.size(); ++k) CHECK(t.caution_ids[i] != t.caution_ids[k]);
  for (const std::string& out : {renderMarkdown(t), renderHtml(t)})
    CHECK(count(out, "Self-locking is no brake") == 1);
  // JSON lists each entry once too (a call's own `caution` field keeps the library's words).
  CHECK(count(renderJson(t), "\"Self-locking is no brake: vibration, shock") == 1);
}

TEST_CASE("every library function's caution maps to a catalogue entry", "[report][layout]") {
  for (const FunctionDecl& f : functionLibrary()) {
    if (f.caution.empty()) continue;
    INFO(f.name << ": map its caution to an entry of cautionsForFunctionText (engine/report/cautions.cc)\n"
                << f.caution);
    CHECK_FALSE(cautionsForFunctionText(f.caution).empty());
  }
  for (const Caution& c : cautionCatalogue()) {
    CHECK(findCaution(c.id) == &c);  // identities are unique
    CHECK_FALSE(c.text.empty());
  }
  CHECK(cautionsForFunctionText("").empty());
  CHECK(cautionsForFunctionText("A caution nobody mapped.").empty());
}

TEST_CASE("checks show their utilisation, with the sense of the comparison", "[report][layout]") {
  // The inputs: a factor of safety below its need, a torque just over its limit.
  auto c = calc("n_buck = 0.46\nT = 40.28 [N*m]\nT_hold = 14.06 [N*m]\nx = 0.996\n"
                "check buckling: n_buck >= 3\ncheck speed: T < 40 [N*m]\ncheck holds: T_hold > 0 [N*m]\n"
                "check close: x <= 1\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  // Demand / capacity: above 100 % fails, whichever way the comparison points.
  CHECK(check(t, "buckling").utilisation.value() == Approx(3 / 0.46));
  CHECK(check(t, "buckling").measure == "utilisation 652 %");
  CHECK(check(t, "speed").measure == "utilisation 101 %");
  // Nothing to divide by: the margin instead.
  CHECK_FALSE(check(t, "holds").utilisation);
  CHECK(check(t, "holds").measure == "margin 14.06 N\u00B7m");
  // A pass is never rounded to look like 100 %.
  CHECK(check(t, "close").measure == "utilisation 99.6 %");
  CHECK(renderText(t).find("0.4600 >= 3: utilisation 652 %") != std::string::npos);
  CHECK(renderMarkdown(t).find("| **utilisation 101 %** |") != std::string::npos);
  CHECK(renderHtml(t).find("<td class=\"value\">652 %</td>") != std::string::npos);
  const std::string json = renderJson(t);
  CHECK(json.find("\"utilisation\": null,\n      \"margin\": 14.06,") != std::string::npos);
  CHECK(verdictSentence(t) == "FAIL: 2 of 4 checks fail: buckling, speed");
}

TEST_CASE("a warning is flagged at its step in every format and counted in the summary", "[report][layout]") {
  // rpm times a plain length: the example of a warning on a step.
  auto c = calc("n = 1450 rpm\nl = 5 mm\nv = n * l  # speed\ncheck slow: v < 10 [m/s]\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.warnings.size() == 2);
  CHECK(t.warnings_at_steps == 2);
  REQUIRE(step(t, "v").warnings.size() == 1);
  CHECK(step(t, "v").warnings[0].find("rotational speed times a plain length") != std::string::npos);
  CHECK(check(t, "slow").warnings.size() == 1);
  CHECK(warningSummary(t) == "WARNING: 2 warnings, flagged at their steps: v (line 3), check slow (line 4)");
  const std::string text = renderText(t);
  const size_t at_step = text.find("\n    WARNING: `v` is a rotational speed times a plain length");
  CHECK(at_step > text.find("  v  speed\n"));
  CHECK(at_step < text.find("CHECKS"));
  CHECK(text.find(warningSummary(t)) < text.find("INPUTS"));
  const std::string md = renderMarkdown(t);
  CHECK(md.find("**WARNING:** \\`v\\` is a rotational speed") > md.find("**`v`** speed"));
  CHECK(md.find("**WARNING: 2 warnings, flagged at their steps") < md.find("## Inputs"));
  const std::string html = renderHtml(t);
  CHECK(html.find("<p class=\"warn\"><span class=\"fail-mark\">WARNING</span> `v` is a rotational speed") >
        html.find("id=\"q-v\""));
  CHECK(html.find("<span class=\"fail-mark\">WARNING:</span> 2 warnings") < html.find("<h2>Inputs</h2>"));
  const std::string json = renderJson(t);
  CHECK(json.find("\"warnings\": [\n        \"`v` is a rotational speed") != std::string::npos);
  CHECK(json.find("\"warnings_at_steps\": 2") != std::string::npos);
}

TEST_CASE("HTML: one naming rule for the library and the sheet, no repeated name column",
          "[report][layout]") {
  // dm in a library formula is set as the sheet's d_m is.
  CHECK(mathmlName("dm") == mathmlName("d_m"));
  CHECK(mathmlName("fc") == mathmlName("f_c"));
  CHECK(mathmlName("Sy") == mathmlName("S_y"));
  CHECK(mathmlName("mu") == "<mi>\u03BC</mi>");  // a Greek name stays Greek
  CHECK(mathmlName("stroke") == "<mi>stroke</mi>");
  auto c = demo("twin-screw-lift");
  const std::string html = renderHtml(buildTrail(*c, 4));
  CHECK(html.find("<th>Symbol</th>") == std::string::npos);
  // A plain name once; a subscripted one with its name as written beside it.
  CHECK(html.find("<tr><td><math><mi>stroke</mi></math></td>") != std::string::npos);
  CHECK(html.find("<math><msub><mi>f</mi><mi>run</mi></msub></math> <code class=\"name\">f_run</code>") !=
        std::string::npos);
  CHECK(html.find("<mi>dm</mi>") == std::string::npos);
}

TEST_CASE("an instance is a part of its own: heading, parameters with their values and bindings, steps, checks",
          "[report][layout][template]") {
  auto c = demo("platform-lift");
  const Trail t = buildTrail(*c, 4);
  // Independent check of the bound value: heavy.F = (1800 kg + 1500 kg) * 9.80665 m/s^2 * 0.62 = 20064.4 N.
  CHECK(step(t, "heavy.F").result.si == Approx(3300 * 9.80665 * 0.62).epsilon(1e-12));
  const std::string md = renderMarkdown(t);
  CHECK(contains(
      md,
      "\n### Instance `heavy`\n\nTrapezoidal screw stage: torques, efficiency, self-locking, "
      "stresses, nut, buckling (`templates/trapezoidal-screw-stage.calc`)\n\n"
      "| Parameter | Value | Bound by |\n|---|---|---|\n| `F` | 20.06 kN | `F_total * share_heavy` |\n"
      "| `n` | 60 rpm | *default*: screw speed |\n"
      "| `d` | 44 mm | `44 mm`: major diameter, Tr series |\n"));
  // Those given values (a default, a literal binding) are listed in the part, not twice in Inputs.
  CHECK(md.find("| `heavy.n` |") == std::string::npos);
  CHECK(contains(md, "The given parameters of the instances heavy, light, motor: in each instance's part"));
  CHECK(contains(md, "| `i` | 25.00 | `i_drive` |\n"));
  // The part names its checks once, before the next instance; their rows are in the summary.
  const size_t heavy = md.find("### Instance `heavy`"), light = md.find("### Instance `light`");
  const size_t buckling =
      md.find("Checks of heavy, each with its condition and values in Design checks: ", heavy);
  CHECK(count(md, "| pass | `heavy.buckling` | `heavy.n_buckle >= 3` |") == 1);
  CHECK(heavy != std::string::npos);
  CHECK(buckling < light);
  CHECK(md.find("Parameters: ") == std::string::npos);  // the table, not the paragraph

  const std::string html = renderHtml(t);
  CHECK(contains(html, "<h3 class=\"instance\">Instance <code>light</code>: Trapezoidal screw stage: torques, "
                       "efficiency, self-locking, stresses, nut, buckling <span class=\"source\">(<code>"
                       "templates/trapezoidal-screw-stage.calc</code>)</span></h3>\n<table class=\"params\">"));
  CHECK(contains(html, "<td class=\"value\">12.30&nbsp;kN</td><td><code>F_total * (1 - share_heavy)</code></td>"));
  CHECK(count(html, "<table class=\"params\">") == 3);
  CHECK(count(html, "<p class=\"note part-checks\">Checks of ") == 3);
  CHECK(html.find("instance-checks") == std::string::npos);
  CHECK(html.find("Parameters: ") == std::string::npos);

  const std::string text = renderText(t);
  CHECK(contains(text, "  parameter  value      bound by\n  T_screw    133.5 N·m  max(heavy.T_raise, light.T_raise)\n"));

  // A parameter set on the command line says so where its binding would be.
  CalcOptions options;
  options.sets = {"light.f=0.15"};
  options.source_path = repoPath("worksheets/platform-lift.calc");
  auto set = Calculation::fromText("worksheets/platform-lift.calc",
                                   readFile(repoPath("worksheets/platform-lift.calc")), options);
  INFO(diagnostics(*set));
  REQUIRE_FALSE(set->hasErrors());
  const Trail ts = buildTrail(*set, 4);
  CHECK(contains(renderMarkdown(ts),
                 "| `f` | 0.15 | *set on the command line*: steel on bronze, greased "
                 "(high value for torque; common practice) |\n"));
  CHECK(contains(renderText(ts),
                 "  f            0.15         [set on the command line]  steel on bronze, greased "
                 "(high value for torque; common practice)\n"));
}
