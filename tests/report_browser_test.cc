// The HTML trail printed by a real browser: each demo is written to a
// temporary file, printed to PDF by headless Chromium, and the PDF's text
// (pdftotext) must show what a checker signs: every result as the text trail
// rounds it, every check with its state, the cautions, and on every page the
// running header (title, calc number, revision, page n of N).
#include <catch2/catch.hpp>

#include <cctype>
#include <cstdlib>
#include <string>
#include <vector>

#include "engine/report/html_renderer.h"
#include "engine/report/power_of_ten.h"
#include "engine/report/trail.h"
#include "tests/browser_support.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// PDF text for searching: no-break spaces and minus signs as ASCII, every
// run of white space (columns, wrapped lines) as one space, and a line that
// the browser broke after a hyphen ("self-" / "locking") joined again.
std::string normalize(const std::string& text) {
  std::string s = replaceAll(replaceAll(text, "\u00A0", " "), "\u2212", "-");
  std::string out;
  bool newline = false;
  for (char c : s) {
    const bool space = c == ' ' || c == '\n' || c == '\t' || c == '\f' || c == '\r';
    if (space) {
      newline = newline || c == '\n' || c == '\f';
      if (!out.empty() && out.back() != ' ') out += ' ';
      continue;
    }
    const size_t n = out.size();
    if (newline && n >= 3 && out[n - 1] == ' ' && out[n - 2] == '-' &&
        std::isalpha(static_cast<unsigned char>(out[n - 3])))
      out.pop_back();
    newline = false;
    out += c;
  }
  return out;
}

std::vector<std::string> split(const std::string& s, char sep) {
  std::vector<std::string> parts;
  size_t begin = 0;
  for (size_t at = s.find(sep); at != std::string::npos; at = s.find(sep, begin)) {
    parts.push_back(s.substr(begin, at - begin));
    begin = at + 1;
  }
  parts.push_back(s.substr(begin));
  return parts;
}

bool hasWord(const std::string& line, const std::string& word) {
  for (size_t at = line.find(word); at != std::string::npos; at = line.find(word, at + 1)) {
    const bool left = at == 0 || line[at - 1] == ' ';
    const size_t end = at + word.size();
    const bool right = end == line.size() || line[end] == ' ';
    if (left && right) return true;
  }
  return false;
}

// Returns the number of printed pages.
size_t printAndRead(const std::string& demo_name) {
  INFO("headless Chromium prints the HTML trail; install the Debian packages `chromium` and `poppler-utils` "
       "(apt-get install chromium poppler-utils)");
  REQUIRE(have("chromium"));
  REQUIRE(have("pdftotext"));
  REQUIRE(have("pdfinfo"));

  const std::string display = "worksheets/" + demo_name + ".calc";
  CalcOptions options;
  options.source_path = repoPath(display);  // its templates are found beside it, from any folder
  auto calc = Calculation::fromText(display, readFile(repoPath(display)), options);
  REQUIRE_FALSE(calc->hasErrors());
  const Trail t = buildTrail(*calc, 4);

  const std::string dir = tempDir();
  const std::string html = dir + "/" + demo_name + ".html", pdf = dir + "/" + demo_name + ".pdf";
  writeFile(html, renderHtml(t));
  const int status = printToPdf(html, pdf, dir);
  INFO("chromium log:\n" << readFile(dir + "/chromium.log"));
  REQUIRE(status == 0);
  REQUIRE(readFile(pdf).rfind("%PDF", 0) == 0);
  REQUIRE(std::system(("pdftotext -layout '" + pdf + "' '" + dir + "/out.txt'").c_str()) == 0);
  const std::string raw = replaceAll(readFile(dir + "/out.txt"), "\u00A0", " ");
  const std::string text = normalize(raw);
  INFO("PDF text (" << dir << "/out.txt):\n" << raw);

  // Every computed result, rounded as the text trail prints it.
  int results = 0;
  for (const TrailStep& s : t.steps) {
    if (s.input) continue;
    ++results;
    CHECK(text.find(normalize(valueText(s.result, NumberStyle::TimesTen))) != std::string::npos);
  }
  CHECK(results > 5);

  // Every check: its name and its state on one line of the summary table.
  std::vector<std::string> lines = split(raw, '\n');
  for (const TrailCheck& c : t.checks) {
    bool found = false;
    for (const std::string& line : lines) {
      const std::string l = normalize(line);
      if (hasWord(l, c.name) && hasWord(l, c.passed ? "pass" : "FAIL")) found = true;
    }
    INFO("check " << c.name << (c.passed ? " pass" : " FAIL"));
    CHECK(found);
  }
  CHECK(text.find(normalize(verdictSentence(t))) != std::string::npos);

  for (const std::string& caution : t.cautions) {
    INFO("caution: " << caution);
    CHECK(text.find(normalize(caution)) != std::string::npos);
  }
  CHECK(text.find(t.sha256) != std::string::npos);

  // The running header on every page, with its number.
  const std::vector<std::string> pages = split(raw, '\f');
  size_t count = pages.size();
  while (count > 0 && normalize(pages[count - 1]).find_first_not_of(' ') == std::string::npos) --count;
  REQUIRE(count >= 2);
  std::string calc_no, revision;
  for (const auto& [k, v] : t.meta) {
    if (k == "calc") calc_no = v;
    if (k == "revision") revision = v;
  }
  for (size_t i = 0; i < count; ++i) {
    const std::string page = normalize(pages[i]);
    INFO("page " << i + 1 << " of " << count);
    CHECK(page.find(normalize(t.title)) != std::string::npos);
    CHECK(page.find("calc " + calc_no) != std::string::npos);
    CHECK(page.find("revision " + revision) != std::string::npos);
    CHECK(page.find("page " + std::to_string(i + 1) + " of " + std::to_string(count)) != std::string::npos);
  }
  // Checks summary on the first page, sign-off block on the last.
  CHECK(normalize(pages[0]).find("Design checks") != std::string::npos);
  const std::string last = normalize(pages[count - 1]);
  CHECK(last.find("Sign-off") != std::string::npos);
  CHECK(last.find("Prepared") != std::string::npos);
  CHECK(last.find("Checked") != std::string::npos);
  CHECK(last.find("Signature") != std::string::npos);
  // The page count as the PDF states it, which the text's form feeds must agree with.
  REQUIRE(std::system(("pdfinfo '" + pdf + "' > '" + dir + "/info.txt'").c_str()) == 0);
  const std::string info = readFile(dir + "/info.txt");
  const size_t at = info.find("Pages:");
  REQUIRE(at != std::string::npos);
  const size_t pdf_pages = std::strtoul(info.c_str() + at + 6, nullptr, 10);
  CHECK(pdf_pages == count);
  // Kept when a REQUIRE stops the test above, for a look at the files.
  std::system(("rm -rf '" + dir + "'").c_str());
  return pdf_pages;
}

}  // namespace

TEST_CASE("browser: canal gate hoist printed to PDF by Chromium", "[browser]") {
  printAndRead("canal-gate-hoist");
}

TEST_CASE("browser: leveling jack printed to PDF by Chromium", "[browser]") { printAndRead("leveling-jack"); }

// The twin-screw demo printed on 14 Letter pages before the trail was made
// to read in one pass (each library function's formula, table and source
// repeated at every call, cautions twice, a results table repeating the
// steps); it prints on 7 now. At most half of 14, so the trail cannot grow
// back into clutter unnoticed.
TEST_CASE("browser: twin-screw lift printed to PDF by Chromium, on at most half its former pages",
          "[browser]") {
  const size_t pages = printAndRead("twin-screw-lift");
  CHECK(pages <= 7);
}
