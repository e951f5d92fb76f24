// What a checker signs: a report changed by --set says so, next to the hash
// and in the sign-off, in every format, and names every replacement; every
// format names the calctrail version that made it. A checker must never be
// able to sign modified numbers believing they are the file's.
#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "engine/report/formats.h"
#include "engine/report/html_renderer.h"
#include "engine/report/json_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::unique_ptr<Calculation> twinScrew(const std::vector<std::string>& sets) {
  const std::string display = "worksheets/twin-screw-lift.calc";
  CalcOptions options;
  options.sets = sets;
  options.source_path = repoPath(display);  // its templates are read beside it
  auto c = Calculation::fromText(display, readFile(repoPath(display)), options);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  return c;
}

// The text between the first `from` and the next `to` (to the end when none).
std::string between(const std::string& s, const std::string& from, const std::string& to) {
  const size_t at = s.find(from);
  if (at == std::string::npos) return "";
  const size_t end = s.find(to, at + from.size());
  return s.substr(at, end == std::string::npos ? std::string::npos : end - at);
}

}  // namespace

TEST_CASE("a --set run: every format names the replacement next to the hash and in the sign-off",
          "[report][integrity]") {
  // The failing input of the issue: the numbers of a --set run signed as the file's own.
  auto c = twinScrew({"f_run=0.10"});
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.modified_by.size() == 1);
  CHECK(t.modified_by[0].name == "f_run");
  CHECK(t.modified_by[0].value == "0.10");
  const std::string set = "--set f_run=0.10";

  // Text: on the line under the hash, in the notice after the header, and in the sign-off.
  const std::string text = renderText(t);
  // (the sheet uses two templates: the line follows the last file's hash)
  const size_t modified = text.find("\nMODIFIED  by " + set + "\n");
  REQUIRE(modified != std::string::npos);
  CHECK(text.find("sha256    " + t.sha256 + "\n") < modified);
  CHECK(text.rfind("\nsha256    ", modified) + 11 + 64 == modified);
  // (wrapped at 78 columns)
  CHECK(text.find(
            "\nMODIFIED: the numbers in this report come from the file AS MODIFIED by --set\nf_run=0.10;") <
        text.find("INPUTS"));
  const std::string text_sign = between(text, "SIGN-OFF", "\n\n  Prepared");
  CHECK(text_sign.find("MODIFIED   by " + set) != std::string::npos);
  CHECK(text_sign.find("NOT the calculation of the worksheet with this SHA-256") != std::string::npos);
  CHECK(text_sign.find("covers the worksheet with this SHA-256 only") == std::string::npos);

  // Markdown: a notice right after the hash, and the sign-off.
  const std::string md = renderMarkdown(t);
  CHECK(md.find("- **sha256:** `" + t.sha256 + "`\n- **generator:** " + t.generator +
                "\n\n> **MODIFIED: the numbers in this report come from the file AS MODIFIED by --set "
                "f\\_run=0.10") != std::string::npos);
  CHECK(md.find("> **MODIFIED:") < md.find("## Design checks"));
  const std::string md_sign = between(md, "## Sign-off", "| | Name |");
  CHECK(md_sign.find("- **MODIFIED BY:** `" + set + "`") != std::string::npos);
  CHECK(md_sign.find("**This report is NOT the calculation") != std::string::npos);

  // HTML: a framed notice in the title block, the footer of every page, and the sign-off.
  const std::string html = renderHtml(t);
  const std::string title_block = between(html, "<header class=\"title-block\">", "</header>");
  CHECK(title_block.find(t.sha256) <
        title_block.find("<p class=\"modified\"><span class=\"fail-mark\">MODIFIED"
                         "</span> the numbers in this report come from the file "
                         "AS MODIFIED by " +
                         set));
  CHECK(html.find("@bottom-left { content: \"worksheets/twin-screw-lift.calc \u00B7 SHA-256 " + t.sha256 +
                  " \u00B7 MODIFIED BY " + set + "\"") != std::string::npos);
  const std::string html_sign = between(html, "<h2>Sign-off</h2>", "<table class=\"signatures\">");
  CHECK(html_sign.find("<tr><th>MODIFIED BY</th><td colspan=\"3\"><code>" + set + "</code></td></tr>") !=
        std::string::npos);
  CHECK(html_sign.find("<p class=\"modified\"><strong>This report is NOT the calculation") !=
        std::string::npos);
  CHECK(html_sign.find("cover the worksheet with this SHA-256 only") == std::string::npos);

  // JSON: a field of its own, the notice, and the sign-off statement.
  const std::string json = renderJson(t);
  CHECK(json.find("\"modified_by\": [\n    {\n      \"name\": \"f_run\",\n      \"value\": \"0.10\",") !=
        std::string::npos);
  CHECK(
      json.find("\"modified_notice\": \"MODIFIED: the numbers in this report come from the file AS MODIFIED "
                "by " +
                set) != std::string::npos);
  CHECK(json.find("\"sign_off\": \"This report is NOT the calculation") != std::string::npos);
}

TEST_CASE("every replacement is listed, in worksheet order, as typed", "[report][integrity]") {
  auto c = twinScrew({"L_col = 700 mm", "d=52 mm"});
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.modified_by.size() == 2);
  CHECK(replacementList(t) == "--set d=52 mm, --set L_col=700 mm");
  for (const ReportFormat& f : reportFormats()) {
    INFO(f.name);
    const std::string out = renderReport(t, f.name);
    CHECK(out.find("--set d=52 mm, --set L_col=700 mm") != std::string::npos);
  }
}

TEST_CASE("the file's own numbers: the sign-off covers this SHA-256 only, no notice anywhere",
          "[report][integrity]") {
  auto c = twinScrew({});
  const Trail t = buildTrail(*c, 4);
  CHECK(t.modified_by.empty());
  CHECK(modifiedNotice(t).empty());
  for (const ReportFormat& f : reportFormats()) {
    INFO(f.name);
    const std::string out = renderReport(t, f.name);
    CHECK(out.find("AS MODIFIED") == std::string::npos);
    CHECK(out.find("cover the worksheet with this SHA-256 only") != std::string::npos);
  }
  CHECK(renderJson(t).find("\"modified_by\": [],") != std::string::npos);
}

TEST_CASE("every format names the calctrail version that made it", "[report][integrity]") {
  auto c = twinScrew({});
  const Trail t = buildTrail(*c, 4);
  const std::string version = std::string("calctrail ") + CALCTRAIL_VERSION;
  CHECK(t.generator == version);
  CHECK(renderText(t).find("\ngenerator " + version + "\n") != std::string::npos);
  CHECK(renderMarkdown(t).find("- **generator:** " + version + "\n") != std::string::npos);
  const std::string html = renderHtml(t);
  CHECK(html.find("<meta name=\"generator\" content=\"" + version + "\">") != std::string::npos);
  CHECK(html.find("<tr><th>generator</th><td colspan=\"3\">" + version + "</td></tr>") != std::string::npos);
  CHECK(html.find("@bottom-right { content: \"" + version + "\"") != std::string::npos);
  CHECK(renderJson(t).find("\"generator\": \"" + version + "\"") != std::string::npos);
}
