// Markdown and HTML trails: the golden file of every demo (read by a person,
// compared byte for byte; regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read
// the diff), plus the rules those formats keep: escaping, MathML typesetting,
// engineering exponents, the checks summary first and the sign-off last.
#include <catch2/catch.hpp>

#include <cstdlib>

#include "engine/report/formats.h"
#include "engine/report/html_renderer.h"
#include "engine/report/json_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/text_renderer.h"
#include "engine/report/mathml.h"
#include "engine/report/power_of_ten.h"
#include "engine/report/trail.h"
#include "engine/report/xml_escape.h"
#include "engine/sheet/expr_parser.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// The demo calculated under the path the CLI is given ("worksheets/NAME.calc"),
// so that no machine path reaches a golden file.
std::unique_ptr<Calculation> demo(const std::string& name) {
  const std::string display = "worksheets/" + name + ".calc";
  CalcOptions options;
  options.source_path = repoPath(display);  // its templates, from wherever the tests run
  auto c = Calculation::fromText(display, readFile(repoPath(display)), options);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  return c;
}

void compareGolden(const std::string& actual, const std::string& golden) {
  const std::string path = repoPath("tests/golden/" + golden);
  if (std::getenv("CALCTRAIL_UPDATE_GOLDEN")) writeFile(path, actual);
  const std::string expected = readFile(path);
  INFO(
      "golden file tests/golden/" << golden
                                  << " differs; regenerate with CALCTRAIL_UPDATE_GOLDEN=1 and read the diff");
  CHECK(actual == expected);
}

// A formula of its own, parsed as the worksheet parser would.
struct Parsed {
  std::unique_ptr<Calculation> calc;
  const Expr* expr = nullptr;
};
Parsed formula(const std::string& sheet, const std::string& name) {
  Parsed p;
  p.calc = calc(sheet);
  INFO(diagnostics(*p.calc));
  const int i = p.calc->sheet.find(name);
  REQUIRE(i >= 0);
  p.expr = p.calc->sheet.quantities[i].expr.get();
  return p;
}

}  // namespace

TEST_CASE("golden: canal gate hoist, Markdown and HTML trails", "[report][golden]") {
  auto c = demo("canal-gate-hoist");
  const Trail t = buildTrail(*c, 4);
  compareGolden(renderMarkdown(t), "canal-gate-hoist.md");
  compareGolden(renderHtml(t), "canal-gate-hoist.html");
}

TEST_CASE("golden: leveling jack, Markdown and HTML trails", "[report][golden]") {
  auto c = demo("leveling-jack");
  const Trail t = buildTrail(*c, 4);
  compareGolden(renderMarkdown(t), "leveling-jack.md");
  compareGolden(renderHtml(t), "leveling-jack.html");
}

TEST_CASE("golden: twin-screw lift, Markdown and HTML trails", "[report][golden]") {
  auto c = demo("twin-screw-lift");
  const Trail t = buildTrail(*c, 4);
  compareGolden(renderMarkdown(t), "twin-screw-lift.md");
  compareGolden(renderHtml(t), "twin-screw-lift.html");
}

TEST_CASE("golden: bearing press (load cases), Markdown and HTML trails", "[report][golden][cases]") {
  auto c = demo("bearing-press");
  const Trail t = buildTrail(*c, 4);
  compareGolden(renderMarkdown(t), "bearing-press.md");
  compareGolden(renderHtml(t), "bearing-press.html");
}

TEST_CASE("golden: platform lift (one template used twice), Markdown and HTML trails", "[report][golden]") {
  auto c = demo("platform-lift");
  const Trail t = buildTrail(*c, 4);
  compareGolden(renderMarkdown(t), "platform-lift.md");
  compareGolden(renderHtml(t), "platform-lift.html");
}

TEST_CASE("golden files carry no machine path", "[report]") {
  for (const char* name :
       {"canal-gate-hoist", "leveling-jack", "twin-screw-lift", "bearing-press", "platform-lift"}) {
    for (const char* ext : {".txt", ".md", ".html", ".json"}) {
      const std::string f = std::string(name) + ext;
      const std::string text = readFile(repoPath("tests/golden/" + f));
      INFO(f);
      REQUIRE_FALSE(text.empty());
      CHECK(text.find("/tmp") == std::string::npos);
      CHECK(text.find("/work") == std::string::npos);
      CHECK(text.find("/home") == std::string::npos);
    }
  }
}

TEST_CASE("every human format carries the SHA-256, the cautions and the verdict", "[report]") {
  auto c = demo("press-overload-fails");
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.failed == 1);  // the demo that shows a failed check on purpose
  const std::string counts = "1 of " + std::to_string(t.checks.size());
  for (const std::string& out : {renderMarkdown(t), renderHtml(t)}) {
    CHECK(out.find(t.sha256) != std::string::npos);
    for (const std::string& caution : t.cautions) CHECK(out.find(caution) != std::string::npos);
    CHECK(out.find(counts) != std::string::npos);
  }
  const std::string md = renderMarkdown(t);
  CHECK(md.find("| **FAIL** | **`nut_pressure`** |") != std::string::npos);
  // The check summary first, as in the HTML.
  CHECK(md.find("**FAIL: " + counts + " checks fails: nut\\_pressure**") < md.find("## Inputs"));
  CHECK(md.find("## Design checks") < md.find("## Inputs"));
}

TEST_CASE("HTML: checks summary first, sign-off last, no script and no fetch", "[report]") {
  auto c = demo("press-overload-fails");
  const Trail t = buildTrail(*c, 4);
  const std::string html = renderHtml(t);
  const size_t checks = html.find("<section class=\"verdict has-fail\">");
  REQUIRE(checks != std::string::npos);
  CHECK(checks < html.find("<h2>Inputs</h2>"));
  CHECK(html.find("<h2>Sign-off</h2>") > html.find("<h2>Cautions</h2>"));
  CHECK(html.find("<h2>Sign-off</h2>") > html.find("<h2>Library functions used</h2>"));
  // The failed check is marked in words, not only by style.
  CHECK(html.find(
            "<tr class=\"fail\"><td><span class=\"fail-mark\">FAIL</span></td><td><code>nut_pressure</code>") !=
        std::string::npos);
  CHECK(count(html, "<td>pass</td>") == static_cast<size_t>(t.passed));
  for (const char* banned : {"<script", "http://", "https://", "@import", "url(", "<link", "<img", "<iframe"})
    CHECK(html.find(banned) == std::string::npos);
  // Page headers: margin boxes with title, calc number, revision, page n of N.
  CHECK(html.find("@top-left { content: \"Bench press at overload: a failing check, shown on purpose\"") !=
        std::string::npos);
  const std::string calc_no = c->sheet.meta.get("calc"), revision = c->sheet.meta.get("revision");
  REQUIRE_FALSE(calc_no.empty());
  REQUIRE_FALSE(revision.empty());
  CHECK(html.find("content: \"calc " + calc_no + " \u00B7 revision " + revision +
                  " \u00B7 page \" counter(page) \" of \" counter(pages)") != std::string::npos);
  // Sign-off from the metadata; `checked:` is empty, so its name cell is blank to fill in.
  CHECK(html.find("<tr><th>Prepared</th><td>" + c->sheet.meta.get("prepared") +
                  "</td><td class=\"sign\"></td><td>" + c->sheet.meta.get("date") + "</td></tr>") !=
        std::string::npos);
  CHECK(html.find("<tr><th>Checked</th><td></td><td class=\"sign\"></td><td></td></tr>") !=
        std::string::npos);
}

TEST_CASE("HTML: worksheet text is escaped everywhere", "[report]") {
  const std::string sheet =
      "title: Gate <b>&</b> \"hoist\" </style><script>alert(1)</script>\n"
      "calc: A&B \\ \"1\"\n"
      "revision: <r>\n"
      "section Loads <i>\n"
      "note Watch <this> & that.\n"
      "F = 2 kN  # weight <kg> & \"more\"\n"
      "G [kN] = F * 2  # doubled <x>\n"
      "check c_1: G < 1 kN  # must <fail> & show\n";
  auto c = calc(sheet);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const std::string html = renderHtml(t);
  CHECK(html.find("<script") == std::string::npos);
  CHECK(html.find("<b>") == std::string::npos);
  CHECK(html.find("<i>") == std::string::npos);
  CHECK(html.find("<this>") == std::string::npos);
  CHECK(html.find("<fail>") == std::string::npos);
  CHECK(html.find("Gate &lt;b&gt;&amp;&lt;/b&gt; &quot;hoist&quot;") != std::string::npos);
  CHECK(html.find("weight &lt;kg&gt; &amp; &quot;more&quot;") != std::string::npos);
  // Only the stylesheet's own </style> closes it: the title in the @page
  // rules cannot end the style element early.
  CHECK(count(html, "</style>") == 1);
  CHECK(
      html.find(
          "content: \"Gate \\3C b>&\\3C /b> \\\"hoist\\\" \\3C /style>\\3C script>alert(1)\\3C /script>\"") !=
      std::string::npos);
  CHECK(html.find("calc A&B \\\\ \\\"1\\\" \u00B7 revision \\3C r> \u00B7 page ") != std::string::npos);
  // The check's relation in MathML is an entity, not a tag opener.
  CHECK(html.find("<mo>&lt;</mo>") != std::string::npos);

  const std::string md = renderMarkdown(t);
  CHECK(md.find("# Gate \\<b\\>&\\</b\\> \"hoist\" \\</style\\>\\<script\\>alert(1)\\</script\\>") !=
        std::string::npos);
  CHECK(md.find("weight \\<kg\\> & \"more\"") != std::string::npos);
  CHECK(md.find("| **FAIL** | **`c_1`** | `G < 1 kN` |") != std::string::npos);
}

TEST_CASE("escapeXml", "[report]") {
  CHECK(escapeXml("a<b>&\"c\"'d'") == "a&lt;b&gt;&amp;&quot;c&quot;&#39;d&#39;");
  CHECK(escapeXml("N\u00B7m \u03C3") == "N\u00B7m \u03C3");
}

TEST_CASE("engineering exponents shown as powers of ten", "[report]") {
  CHECK(timesTenPowers("1.500e9 W") == "1.500 \u00D7 10\u2079 W");
  CHECK(timesTenPowers("250.0e-9 m") == "250.0 \u00D7 10\u207B\u2079 m");
  CHECK(timesTenPowers("12.00e12") == "12.00 \u00D7 10\u00B9\u00B2");
  CHECK(timesTenPowers("1e-03 + 2E6") == "1 \u00D7 10\u207B\u00B3 + 2 \u00D7 10\u2076");
  CHECK(timesTenPowers("(4.2e-6 m)^2") == "(4.2 \u00D7 10\u207B\u2076 m)^2");
  // Names and words are left alone.
  CHECK(timesTenPowers("x1e3 + d_2e4 + 3 each + 7 elements") == "x1e3 + d_2e4 + 3 each + 7 elements");
  CHECK(timesTenPowers("15.94 N\u00B7m") == "15.94 N\u00B7m");
}

TEST_CASE("MathML: names, Greek letters, subscripts", "[report]") {
  CHECK(mathmlName("F") == "<mi>F</mi>");
  CHECK(mathmlName("d_m") == "<msub><mi>d</mi><mi mathvariant=\"normal\">m</mi></msub>");
  CHECK(mathmlName("T_raise") == "<msub><mi>T</mi><mi>raise</mi></msub>");
  CHECK(mathmlName("alpha") == "<mi>\u03B1</mi>");
  CHECK(mathmlName("eta_gear") == "<msub><mi>\u03B7</mi><mi>gear</mi></msub>");
  CHECK(mathmlName("sigma_vm") == "<msub><mi>\u03C3</mi><mi>vm</mi></msub>");
  CHECK(mathmlName("Delta_x") == "<msub><mi>\u0394</mi><mi mathvariant=\"normal\">x</mi></msub>");
  CHECK(mathmlName("F1") == "<msub><mi>F</mi><mn>1</mn></msub>");
  CHECK(mathmlName("T_max_2") ==
        "<msub><mi>T</mi><mrow><mi>max</mi><mo separator=\"true\">,</mo><mn>2</mn></mrow></msub>");
  CHECK(mathmlName("f_mu") == "<msub><mi>f</mi><mi>\u03BC</mi></msub>");
  CHECK(mathmlName("stroke") == "<mi>stroke</mi>");
  CHECK(mathmlName("etamax") == "<mi>etamax</mi>");
}

TEST_CASE("MathML: fractions, powers, roots, units, pi, products", "[report]") {
  auto p = formula(
      "d_r = 30 mm\nF = 2 kN\nT = 1 [N*m]\nx [MPa] = sqrt((4 * F / (pi * d_r^2))^2 + 3 * (16 * T / (pi * "
      "d_r^3))^2)\n",
      "x");
  const std::string m = mathmlExpr(*p.expr);
  CHECK(m.rfind("<msqrt>", 0) == 0);
  // 4·F over π·d_r²: a fraction, the parentheses dropped under the bar.
  CHECK(m.find("<mfrac><mrow><mn>4</mn><mo>\u00B7</mo><mi>F</mi></mrow>"
               "<mrow><mi mathvariant=\"normal\">\u03C0</mi><mo>\u00B7</mo>"
               "<msubsup><mi>d</mi><mi mathvariant=\"normal\">r</mi><mn>2</mn></msubsup></mrow></mfrac>") !=
        std::string::npos);
  // A squared group keeps its parentheses.
  CHECK(m.find("<msup><mrow><mo>(</mo><mfrac>") != std::string::npos);

  auto q = formula("g = 9.81 [m/s^2]\nh = 1e-3 m\na = 14.5 deg\ny = g * h * cos(a) * 95 % - -h\n", "y");
  const std::string n = mathmlExpr(*q.expr);
  CHECK(n.find("<mi>cos</mi><mo>&#x2061;</mo>") != std::string::npos);
  CHECK(n.find("<mrow><mn>95</mn><mspace width=\"0.22em\"/><mi mathvariant=\"normal\">%</mi></mrow>") !=
        std::string::npos);
  CHECK(n.find("<mo>\u2212</mo><mrow><mo>\u2212</mo><mi>h</mi></mrow>") != std::string::npos);
  auto g = formula("g = 9.81 [m/s^2]\n", "g");
  CHECK(mathmlExpr(*g.expr) == "<mrow><mn>9.81</mn><mspace width=\"0.22em\"/><mi>m/s\u00B2</mi></mrow>");
  auto h = formula("h = 1e-3 m\n", "h");
  CHECK(mathmlExpr(*h.expr) ==
        "<mrow><mn>1</mn><mo>\u00D7</mo><msup><mn>10</mn><mrow><mo>\u2212</mo><mn>3</mn></mrow></msup>"
        "<mspace width=\"0.22em\"/><mi mathvariant=\"normal\">m</mi></mrow>");
  auto a = formula("a = 14.5 deg\n", "a");
  CHECK(mathmlExpr(*a.expr) == "<mrow><mn>14.5</mn><mi mathvariant=\"normal\">\u00B0</mi></mrow>");
}

TEST_CASE("HTML: long formulas break between terms or shrink, never overflow", "[report]") {
  std::string sum = "a_1", product = "a_1";
  for (int i = 0; i < 24; ++i) sum += " + a_1 * 2", product += " * (a_1 / a_1 + 2)";
  auto c = calc("a_1 = 1 m\nlong_sum [m] = " + sum + "\nlong_product [m] = " + product +
                "\none_fraction = (" + sum + ") / a_1\nshort [m] = a_1 * 2\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const std::string html = renderHtml(buildTrail(*c, 4));
  auto stepOf = [&](const std::string& name, const std::string& next) {
    const size_t at = html.find("id=\"q-" + name + "\"");
    const size_t end = html.find("id=\"q-" + next + "\"");
    REQUIRE(at != std::string::npos);
    REQUIRE(end != std::string::npos);
    return html.substr(at, end - at);
  };
  // A long sum: several lines, each continuation starting with its sign, at full size.
  const std::string sum_step = stepOf("long_sum", "long_product");
  CHECK(sum_step.find("<div class=\"broken\"><div><math display=\"block\">") != std::string::npos);
  CHECK(count(sum_step, "<div class=\"cont\"><math display=\"block\"><mo>+</mo>") >= 2);
  CHECK(sum_step.find("font-size") == std::string::npos);
  // A long product breaks before a product dot, at full size.
  const std::string product_step = stepOf("long_product", "one_fraction");
  CHECK(count(product_step, "<div class=\"cont\"><math display=\"block\"><mo>\u00B7</mo>") >= 2);
  CHECK(product_step.find("font-size") == std::string::npos);
  // One fraction too wide for the page cannot break: it is shrunk.
  const std::string fraction_step = stepOf("one_fraction", "short");
  CHECK(fraction_step.find("<math display=\"block\" style=\"font-size: ") != std::string::npos);
  CHECK(html.substr(html.find("id=\"q-short\"")).find("<math display=\"block\">") != std::string::npos);
}

TEST_CASE("HTML and Markdown: values for people", "[report]") {
  auto c = calc("P = 1.5e9 W\nd = 2e-7 m\nA [m^2] = d^2\nT = -3 [N*m]\ncheck t: T < 0 [N*m]\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const std::string html = renderHtml(t);
  CHECK(html.find("1.5&nbsp;\u00D7&nbsp;10\u2079&nbsp;W") != std::string::npos);
  CHECK(html.find("40.00&nbsp;\u00D7&nbsp;10\u207B\u00B9\u2075&nbsp;m\u00B2") != std::string::npos);
  // The substituted line is typeset like the formula: the value under the power in parentheses.
  CHECK(
      html.find("<msup><mrow><mo>(</mo><mrow><mn>2</mn><mo>\u00D7</mo><msup><mn>10</mn><mrow><mo>\u2212</mo>"
                "<mn>7</mn></mrow></msup><mspace width=\"0.22em\"/><mi mathvariant=\"normal\">m</mi></mrow>"
                "<mo>)</mo></mrow><mn>2</mn></msup>") != std::string::npos);
  CHECK(html.find("\u22123.000&nbsp;N\u00B7m &lt; 0&nbsp;N\u00B7m") != std::string::npos);
  const std::string md = renderMarkdown(t);
  CHECK(md.find("| `P` | 1.5 \u00D7 10\u2079 W |") != std::string::npos);
  CHECK(md.find("`= (2 \u00D7 10\u207B\u2077 m)^2`") != std::string::npos);
}

TEST_CASE("HTML and Markdown: library calls are audited, each function described once", "[report]") {
  auto c = calc(
      "F = 20 kN\nd_m = 36.5 mm\nl = 7 mm\nf = 0.15\nalpha = 15 deg\n"
      "T [N*m] = torque_raise(F, d_m, l, f, alpha)  # raise\n"
      "U [N*m] = torque_raise(F, d_m, l, f, alpha) * 2\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const std::string src = t.steps.get(5)->calls.at(0).source;
  REQUIRE_FALSE(src.empty());
  // T is the call alone: its chain goes on into the function's formula with the values.
  CHECK(t.steps.get(5)->single_call);
  CHECK_FALSE(t.steps.get(6)->single_call);
  const std::string html = renderHtml(t);
  // The source, the formula and the limits once, in "Library functions used", with both users.
  CHECK(count(html, escapeXml(src)) == 1);
  CHECK(html.find("<p class=\"fn\" id=\"fn-torque_raise\"><code class=\"sig\">torque_raise(F, dm, l, f, "
                  "alpha)</code> <span class=\"used\">(used for <code>T</code>, <code>U</code>)</span>") !=
        std::string::npos);
  CHECK(html.find("verified: docs/verification.md, <code>torque_raise</code>") != std::string::npos);
  // U uses the call inside a formula: a where line with the call's values, typeset substitution, result.
  CHECK(html.find("<div class=\"where\"><span class=\"w\">where</span> <span class=\"call\">torque_raise("
                  "20&nbsp;kN, 36.5&nbsp;mm, 7&nbsp;mm, 0.15, 15\u00B0)</span> = <math") !=
        std::string::npos);
  CHECK(html.find("No library function is called") == std::string::npos);
  const std::string md = renderMarkdown(t);
  CHECK(md.find("where `torque_raise(20 kN, 36.5 mm, 7 mm, 0.15, 15\u00B0)` `= 20 kN \u00B7 36.5 mm / 2") !=
        std::string::npos);
  CHECK(count(md, src) == 1);
  CHECK(md.find("**`torque_raise(F, dm, l, f, alpha)`** used by `T`, `U`") != std::string::npos);
  const std::string text = renderText(t);
  CHECK(count(text, "= F \u00B7 dm / 2 \u00B7 (l + \u03C0 \u00B7 f \u00B7 dm / cos(alpha))") == 1);
  CHECK(text.find("    verified: docs/verification.md, `torque_raise`\n") != std::string::npos);
}

TEST_CASE("formats: each registered once, dispatched by name", "[report][formats]") {
  CHECK(reportFormatNames() == std::vector<std::string>{"text", "md", "html", "json", "csv"});
  CHECK(reportFormatHelp() ==
        "text (terminal, git), md (pull requests), html (print to PDF), json (tools), csv (spreadsheets)");
  CHECK(findReportFormat("pdf") == nullptr);
  auto c = demo("leveling-jack");
  const Trail t = buildTrail(*c, 4);
  CHECK(renderReport(t, "text") == renderText(t));
  CHECK(renderReport(t, "md") == renderMarkdown(t));
  CHECK(renderReport(t, "html") == renderHtml(t));
  CHECK(renderReport(t, "json") == renderJson(*c, t));
  ReportSink sink;
  CHECK_FALSE(renderReport(t, "pdf", sink));
  CHECK(sink.text().empty());
  CHECK(renderReport(t, "pdf") == renderText(t));  // the default
}

TEST_CASE("renderers append to the sink they are given", "[report][formats]") {
  auto c = demo("canal-gate-hoist");
  const Trail t = buildTrail(*c, 4);
  for (const ReportFormat& f : reportFormats()) {
    ReportSink sink;
    fmt::format_to(std::back_inserter(sink.buffer()), "kept\n");
    f.render(t, sink);
    INFO(f.name);
    CHECK(sink.text() == "kept\n" + renderReport(t, f.name));
  }
}

TEST_CASE("a sink with a writer hands a large report on in pieces, in order", "[report][formats]") {
  // A sheet larger than a kept trail (kKeptSteps quantities), so that it is built and written a step at a time.
  std::string sheet;
  for (size_t i = 0; i <= kKeptSteps; ++i)
    sheet += "F" + std::to_string(i) + " = " + std::to_string(i + 1) + " kN\nT" + std::to_string(i) +
             " [N*m] = F" + std::to_string(i) + " * 12 mm / 2\n";
  auto c = calc(sheet);
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  REQUIRE_FALSE(t.steps.kept());
  for (const ReportFormat& f : reportFormats()) {
    INFO(f.name);
    std::vector<size_t> sizes;
    std::string whole;
    ReportSink sink([&](std::string_view piece) {
      sizes.push_back(piece.size());
      whole.append(piece);
      return true;
    });
    f.render(t, sink);
    REQUIRE(sink.finish());
    CHECK(whole == renderReport(t, f.name));
    REQUIRE(sizes.size() > 1);
    // Every piece but the last is at least a chunk, and none holds much more than one step past it.
    for (size_t k = 0; k + 1 < sizes.size(); ++k) {
      CHECK(sizes[k] >= ReportSink::kChunk);
      CHECK(sizes[k] < ReportSink::kChunk + 4096);
    }
  }
  // A writer that fails: finish() says so, and nothing more is handed on.
  int calls = 0;
  ReportSink failing([&](std::string_view) {
    ++calls;
    return false;
  });
  renderText(t, failing);
  CHECK_FALSE(failing.finish());
  CHECK(calls == 1);
}

TEST_CASE("the trail is all a renderer reads: JSON, text and Markdown outlive the calculation",
          "[report][formats]") {
  auto c = demo("twin-screw-lift");
  const Trail t = buildTrail(*c, 4);
  const std::string json = renderJson(*c, t), text = renderText(t), md = renderMarkdown(t);
  // The trail keeps the numbers themselves, not only their text.
  for (const TrailStep& s : t.steps) {
    CHECK(s.result.si == c->si(s.index));
    CHECK(s.result.value == c->display(s.index).fromSI(c->si(s.index)));
  }
  c.reset();
  CHECK(renderJson(t) == json);
  CHECK(renderText(t) == text);
  CHECK(renderMarkdown(t) == md);
}

TEST_CASE("the verdict is one sentence, the same words in every format", "[report]") {
  auto none = calc("a = 1\n");
  auto one = calc("a = 1\ncheck big: a > 0\n");
  auto pass = calc("a = 1\ncheck big: a > 0\ncheck small: a < 2\n");
  auto fail = calc("a = 1\ncheck big: a > 0\ncheck huge: a > 5\ncheck vast: a > 9\n");
  const Trail tn = buildTrail(*none, 4), to = buildTrail(*one, 4), tp = buildTrail(*pass, 4),
              tf = buildTrail(*fail, 4);
  CHECK(verdictSentence(tn) == "NO CHECKS: this worksheet has no design checks");
  CHECK(verdictSentence(to) == "PASS: the 1 check passes");
  CHECK(verdictSentence(tp) == "PASS: all 2 checks pass");
  CHECK(verdictSentence(tf) == "FAIL: 2 of 3 checks fail: huge, vast");
  CHECK(verdictState(tf) == "FAIL");
  CHECK(renderText(tf).find("\nFAIL: 2 of 3 checks fail: huge, vast\n") != std::string::npos);
  CHECK(renderMarkdown(tf).find("**FAIL: 2 of 3 checks fail: huge, vast**") != std::string::npos);
  CHECK(renderHtml(tf).find("<span class=\"fail-mark\">FAIL:</span> 2 of 3 checks fail: huge, vast</p>") !=
        std::string::npos);
  CHECK(renderHtml(tp).find(">PASS: all 2 checks pass</p>") != std::string::npos);
  CHECK(renderJson(tf).find("\"verdict\": \"FAIL: 2 of 3 checks fail: huge, vast\"") != std::string::npos);
  CHECK(tf.checks[1].condition == "a > 5");
}

TEST_CASE("values are written from their numbers in each format's style", "[report]") {
  auto c = calc("P = 1.5e9 W\nQ [W] = P * 2\nd = 2e-7 m\nA [m^2] = d^2 * 3\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  const TrailSteps::Held q_held = t.steps.get(1);
  const TrailStep& q = *q_held;
  CHECK(q.result.number.digits == "3.000");
  CHECK(q.result.number.exponent == "9");
  CHECK(valueText(q.result) == "3.000e9 W");
  CHECK(valueText(q.result, NumberStyle::TimesTen) == "3.000 \u00D7 10\u2079 W");
  // The given literal as written, and the substituted line cut into text and values.
  REQUIRE(t.steps.get(0)->given);
  CHECK(valueText(*t.steps.get(0)->given) == "1.5e9 W");
  CHECK(lineText(q.substituted) == "1.5e9 W \u00B7 2");
  CHECK(q.substituted.marked() == "\x1E \u00B7 2");  // a value, then the text
  REQUIRE(q.substituted.values().size() == 1);
  CHECK(valueText(q.substituted.values()[0]) == "1.5e9 W");
  CHECK(lineText(t.steps.get(3)->substituted) == "(2e-7 m)^2 \u00B7 3");
  CHECK(lineText(t.steps.get(3)->substituted, NumberStyle::TimesTen) == "(2 \u00D7 10\u207B\u2077 m)^2 \u00B7 3");
  CHECK(renderMarkdown(t).find("| `Q` | 3.000 \u00D7 10\u2079 W |") != std::string::npos);
  CHECK(renderText(t).find("= 3.000e9 W\n") != std::string::npos);
}
