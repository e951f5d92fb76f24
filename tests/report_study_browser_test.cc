// A study in the worksheet, printed by a real browser: the ball-screw demo's
// HTML trail (its `study move_time: sweep ...` line) is printed to PDF by
// headless Chromium; the PDF's text (pdftotext) must show the plot (its
// title, the axis label of each panel, the
// legend of the shaded region where a check fails), and the page with the
// plot is rendered to PNG by pdftoppm, for a person to look at.
#include <catch2/catch.hpp>

#include <cstdlib>
#include <string>

#include "engine/report/html_renderer.h"
#include "engine/report/trail.h"
#include "tests/browser_support.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// Every run of white space as one blank: pdftotext keeps columns and line breaks.
std::string squeezed(const std::string& text) {
  std::string out;
  for (char c : text) {
    const bool blank = c == ' ' || c == '\n' || c == '\t' || c == '\f';
    if (blank && (out.empty() || out.back() == ' ')) continue;
    out += blank ? ' ' : c;
  }
  return out;
}

}  // namespace

TEST_CASE("browser: the HTML trail of a demo with a study shows its plot on the page", "[report][browser][study]") {
  INFO("headless Chromium prints the HTML trail; install the Debian packages `chromium` and `poppler-utils` "
       "(apt-get install chromium poppler-utils)");
  REQUIRE(have("chromium"));
  REQUIRE(have("pdftotext"));
  REQUIRE(have("pdftoppm"));
  REQUIRE(have("pdfinfo"));

  const std::string display = "worksheets/ball-screw-axis.calc";
  auto calc = Calculation::fromText(display, readFile(repoPath(display)));
  REQUIRE_FALSE(calc->hasErrors());
  const Trail t = buildTrail(*calc, 4);
  REQUIRE(t.studies.size() == 2);
  REQUIRE_FALSE(t.studies[0].svg.empty());

  const std::string dir = tempDir();
  const std::string html = dir + "/study.html", pdf = dir + "/study.pdf";
  writeFile(html, renderHtml(t));
  const int status = printToPdf(html, pdf, dir);
  INFO("chromium log:\n" << readFile(dir + "/chromium.log"));
  REQUIRE(status == 0);
  REQUIRE(readFile(pdf).rfind("%PDF", 0) == 0);

  // The page that holds the plot: the first whose text has its legend.
  REQUIRE(std::system(("pdfinfo '" + pdf + "' | sed -n 's/^Pages: *//p' >'" + dir + "/pages'").c_str()) == 0);
  const int pages = std::atoi(readFile(dir + "/pages").c_str());
  REQUIRE(pages > 1);
  int plot_page = 0;
  std::string whole, plot_text;
  for (int p = 1; p <= pages; ++p) {
    const std::string txt = dir + "/page" + std::to_string(p) + ".txt";
    REQUIRE(std::system(("pdftotext -f " + std::to_string(p) + " -l " + std::to_string(p) + " '" + pdf + "' '" +
                         txt + "'")
                            .c_str()) == 0);
    const std::string page = squeezed(readFile(txt));
    whole += page + " ";
    if (!plot_page && page.find("shaded: a check fails (motor_speed, life)") != std::string::npos) {
      plot_page = p;
      plot_text = page;
    }
  }
  INFO("PDF text:\n" << whole);
  CHECK(plot_page > 0);
  CHECK(whole.find("Study move_time") != std::string::npos);
  CHECK(whole.find("A check fails at 3 of 8 points: motor_speed (3), life (1).") != std::string::npos);
  CHECK(whole.find("limited by the check `motor_speed`") != std::string::npos);
  // Each axis label on the page of the plot (the table's heads wrap in their cells, so they are not
  // these strings), and the plot's title.
  for (const char* label : {"t_move [s]", "T_rms [N*m]", "T_peak [N*m]", "n_motor [rpm]", "Study move_time"}) {
    INFO(label);
    CHECK(count(plot_text, label) >= 1);
  }

  // The page with the plot as an image, to look at (its path is in the test's output with -s).
  REQUIRE(plot_page > 0);
  const std::string png = dir + "/plot-page";
  REQUIRE(std::system(("pdftoppm -png -r 60 -f " + std::to_string(plot_page) + " -l " +
                       std::to_string(plot_page) + " -singlefile '" + pdf + "' '" + png + "'")
                          .c_str()) == 0);
  const std::string image = readFile(png + ".png");
  REQUIRE(image.size() > 8);
  CHECK(image.compare(1, 3, "PNG") == 0);
  // A blank page compresses to a few hundred bytes; one with a plot and a table does not.
  CHECK(image.size() > 10000);
  UNSCOPED_INFO("the page with the plot: " << png << ".png");
  SUCCEED("plot on page " << plot_page << " of " << pages << ": " << png << ".png");
}
