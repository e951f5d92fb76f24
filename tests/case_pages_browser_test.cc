// Many load cases side by side, printed by a real browser: a sheet of 8
// and one of 12 cases is rendered to HTML, printed to PDF by headless
// Chromium on portrait A4 and Letter, and read back with pdftotext. Every
// case name and every case value must be on the pages, each group of case
// columns on one line (the tables wrap into groups instead of running off
// the page), and no word may lie outside the page's printable width.
#include <catch2/catch.hpp>

#include <cstdlib>
#include <regex>
#include <string>
#include <vector>

#include "engine/report/html_renderer.h"
#include "engine/report/trail.h"
#include "tests/browser_support.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// PDF text with no-break spaces and minus signs as ASCII and every run of
// spaces as one, line by line.
std::string plain(const std::string& text) {
  std::string s = replaceAll(replaceAll(text, "\u00A0", " "), "\u2212", "-"), out;
  for (char c : s) {
    if (c == ' ' && !out.empty() && out.back() == ' ') continue;
    out += c;
  }
  return out;
}

std::vector<std::string> lines(const std::string& s) {
  std::vector<std::string> out;
  size_t begin = 0;
  for (size_t at = s.find('\n'); at != std::string::npos; at = s.find('\n', begin)) {
    out.push_back(s.substr(begin, at - begin));
    begin = at + 1;
  }
  out.push_back(s.substr(begin));
  return out;
}

// A line holding every word of `words` in order.
bool lineInOrder(const std::vector<std::string>& text, const std::vector<std::string>& words) {
  for (const std::string& line : text) {
    size_t at = 0;
    bool all = true;
    for (const std::string& w : words) {
      at = line.find(w, at);
      if (at == std::string::npos) {
        all = false;
        break;
      }
      at += w.size();
    }
    if (all) return true;
  }
  return false;
}

// A screw torque T = F * f * r with n load cases, case k (1..n) at
// F = (10 + k) kN and f = 0.10 + 0.01 k: several quantities change in every
// case, and some cases fail the torque check.
std::string sheetWithCases(int n) {
  std::string s =
      "title: Many load cases side by side\ncalc: CT-TEST\nrevision: 1\n"
      "F = 10 kN          # axial load\n"
      "f = 0.10           # thread friction\n"
      "r = 20 mm          # lever\n"
      "T [N*m] = F * f * r  # torque\n"
      "P [W] = T * 60 rpm   # power at 60 rpm\n"
      "check torque: T <= 60 [N*m]\n"
      "check load: F <= 30 kN\n";
  for (int k = 1; k <= n; ++k)
    s += fmt::format("case overload_dry_{:02}: F = {} kN, f = {:.2f}\n", k, 10 + k, 0.10 + 0.01 * k);
  return s;
}

void printCases(int n, const std::string& paper) {
  INFO(
      "headless Chromium prints the HTML trail; install the Debian packages `chromium` and `poppler-utils` "
      "(apt-get install chromium poppler-utils)");
  REQUIRE(have("chromium"));
  REQUIRE(have("pdftotext"));
  auto c = calc(sheetWithCases(n));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.cases.size() == static_cast<size_t>(n) + 1);

  // The independent check of the numbers the pages must show: case k has
  // T = (10 + k) kN * (0.10 + 0.01 k) * 20 mm, e.g. k = 12: 22 kN * 0.22 *
  // 0.02 m = 96.80 N*m.
  for (int k = 1; k <= n; ++k) {
    const TrailSteps::Held T_held = t.steps.get(3);
    const TrailStep& T = *T_held;
    REQUIRE(T.name == "T");
    CHECK(T.cases[static_cast<size_t>(k)].value.si ==
          Approx((10.0 + k) * 1000.0 * (0.10 + 0.01 * k) * 0.020).epsilon(1e-12));
  }

  // A page size for the print, as a user's print dialog would set it.
  std::string html = renderHtml(t);
  html = replaceAll(html, "</style>", "@page { size: " + paper + " portrait; }\n</style>");
  const std::string dir = tempDir();
  const std::string file = dir + "/cases.html", pdf = dir + "/cases.pdf";
  writeFile(file, html);
  const int status = printToPdf(file, pdf, dir);
  INFO("chromium log:\n" << readFile(dir + "/chromium.log"));
  REQUIRE(status == 0);
  REQUIRE(std::system(("pdftotext -layout '" + pdf + "' '" + dir + "/out.txt'").c_str()) == 0);
  REQUIRE(std::system(("pdftotext -bbox '" + pdf + "' '" + dir + "/box.html'").c_str()) == 0);
  const std::string raw = plain(readFile(dir + "/out.txt"));
  const std::vector<std::string> text = lines(raw);
  INFO("PDF text (" << dir << "/out.txt):\n" << raw);

  // Every case name, and every value a case changes, in every group of
  // columns: the names of a group on one line, their values on one line.
  for (const TrailCase& k : t.cases) CHECK(raw.find(k.name) != std::string::npos);
  for (const auto& [first, last] : caseGroups(t.cases.size(), 5)) {
    std::vector<std::string> names;
    for (size_t k = first; k < last; ++k) names.push_back(t.cases[k].name);
    INFO("case columns " << first << " to " << last);
    CHECK(lineInOrder(text, names));
    for (const TrailStep& s : t.steps) {
      if (!s.varies) continue;
      std::vector<std::string> values;
      for (size_t k = first; k < last; ++k)
        values.push_back(plain(valueText(s.cases[k].value, NumberStyle::TimesTen)));
      INFO("values of " << s.name);
      CHECK(lineInOrder(text, values));
    }
  }
  // The check by case: each cell's state and margin is on the pages.
  for (const TrailCheck& ch : t.checks)
    for (const TrailCaseCheck& cc : ch.cases)
      CHECK(raw.find(plain(valueText(cc.margin, NumberStyle::TimesTen))) != std::string::npos);

  // No word outside the printable width (page margins 15 mm each side;
  // two points of tolerance for the glyphs' side bearings).
  const std::string boxes = readFile(dir + "/box.html");
  const std::regex page_re(R"re(<page width="([0-9.]+)")re");
  const std::regex word_re(
      R"re(<word xMin="([0-9.]+)" yMin="[0-9.]+" xMax="([0-9.]+)"[^>]*>([^<]*)</word>)re");
  std::smatch m;
  REQUIRE(std::regex_search(boxes, m, page_re));
  const double width = std::stod(m[1]);
  const double margin = 15.0 / 25.4 * 72.0 - 2.0;
  int words = 0;
  for (auto it = std::sregex_iterator(boxes.begin(), boxes.end(), word_re); it != std::sregex_iterator();
       ++it) {
    ++words;
    const double x0 = std::stod((*it)[1]), x1 = std::stod((*it)[2]);
    INFO("word " << (*it)[3] << " from " << x0 << " to " << x1 << " pt on a page " << width << " pt wide");
    CHECK(x0 >= margin);
    CHECK(x1 <= width - margin);
  }
  CHECK(words > 100);
  std::system(("rm -rf '" + dir + "'").c_str());
}

}  // namespace

TEST_CASE("browser: 8 load cases side by side fit a portrait A4 page", "[browser][cases]") {
  printCases(8, "A4");
}

TEST_CASE("browser: 12 load cases side by side fit a portrait Letter page", "[browser][cases]") {
  printCases(12, "letter");
}
