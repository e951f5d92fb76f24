// Where a line ends (docs/format.md, "Lines"): LF or CRLF, nothing else. The
// worksheet parser and the formatter agree, so `report`, `check` and `fmt`
// accept and reject the same files with the same diagnostic, and `fmt` of a
// CRLF file comes back to the same canonical text.
#include <catch2/catch.hpp>

#include <string>

#include "engine/review/sheet_format.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// The first line of what `calctrail COMMAND FILE` printed on standard error.
std::string firstError(const Run& r) { return r.err.substr(0, r.err.find('\n')); }

}  // namespace

TEST_CASE("line endings: a CR that does not end a line is the same error in report, check and fmt",
          "[lines][cli]") {
  struct Case {
    const char* bytes;
    const char* headline;  // after "DIR/sheet.calc:"
  };
  const std::string cr =
      ": error: a control character (CR, 0x0D) that does not end a line: a line ends with LF or CRLF; "
      "delete it or end the line there";
  const Case cases[] = {
      {"x = 1 # d\r \n", "1:10"},          // a CR inside a description, before blanks
      {"section A\r \nx = 1\n", "1:10"},   // in a section title
      {"# c\r\r\nx = 1\n", "1:4"},         // a CR before a CRLF
      {"x = 1\ny = 2\r", "2:6"},           // the last line, a CR and no LF
      {"x = 1\rnote a\n", "1:6"},          // an old Mac line end
  };
  const std::string dir = tempDir();
  for (const Case& c : cases) {
    INFO("bytes: " << c.bytes);
    const std::string file = dir + "/sheet.calc";
    writeFile(file, c.bytes);
    const std::string want = file + ":" + c.headline + cr;
    const Run report = runCli("report '" + file + "'");
    const Run check = runCli("check '" + file + "'");
    const Run fmt = runCli("fmt '" + file + "'");
    CHECK(report.status == 2);
    CHECK(check.status == 2);
    CHECK(fmt.status == 2);
    CHECK(firstError(report) == want);
    CHECK(firstError(check) == want);
    CHECK(firstError(fmt) == want);
    CHECK(fmt.err.find("internal error") == std::string::npos);
    CHECK(fmt.out.empty());
    CHECK(readFile(file) == c.bytes);  // never modified
    CHECK(runCli("fmt --write '" + file + "'").status == 2);
    CHECK(readFile(file) == c.bytes);
  }
}

TEST_CASE("line endings: the caret line shows no raw CR", "[lines][diagnostics]") {
  auto c = calc("x = 1 # d\r \n");
  REQUIRE(c->diags.list().size() == 1);
  const std::string shown = c->diags.list()[0].render();
  CHECK(shown.find('\r') == std::string::npos);
  CHECK(shown.find("    x = 1 # d? \n") != std::string::npos);
}

TEST_CASE("line endings: fmt of a CRLF file is a round trip", "[lines][fmt]") {
  const std::string lf =
      "title: Bench press\n"
      "\n"
      "section Load\n"
      "note Two lines of narrative,\n"
      "note joined.\n"
      "# a comment\n"
      "F = 8 kN  # pressing force\n"
      "d [mm] = 20 mm\n"
      "check torque: F * d <= 200 [N*m]\n";
  std::string crlf;
  for (char ch : lf) crlf += ch == '\n' ? std::string("\r\n") : std::string(1, ch);

  Diagnostics d1, d2;
  const std::string from_lf = formatWorksheet("sheet.calc", lf, &d1);
  const std::string from_crlf = formatWorksheet("sheet.calc", crlf, &d2);
  REQUIRE_FALSE(d1.hasErrors());
  REQUIRE_FALSE(d2.hasErrors());
  CHECK(from_crlf == from_lf);
  CHECK(from_crlf.find('\r') == std::string::npos);  // canonical layout ends lines with LF
  Diagnostics d3;
  CHECK(formatWorksheet("sheet.calc", from_crlf, &d3) == from_crlf);

  // The same through the program: fmt --write turns the CRLF file into the
  // canonical one, and the report of both is the same but for the hash.
  const std::string dir = tempDir();
  writeFile(dir + "/crlf.calc", crlf);
  const Run before = runCli("report '" + dir + "/crlf.calc' --format json");
  CHECK(before.status == 0);
  CHECK(runCli("fmt --write '" + dir + "/crlf.calc'").status == 0);
  CHECK(readFile(dir + "/crlf.calc") == from_lf);
  CHECK(runCli("fmt --check '" + dir + "/crlf.calc'").status == 0);
  const Run after = runCli("report '" + dir + "/crlf.calc' --format json");
  CHECK(after.status == 0);
  CHECK(after.out.find("\"si\": 8000") != std::string::npos);
  CHECK(before.out.find("\"si\": 8000") != std::string::npos);
}

TEST_CASE("line endings: CRLF and a final line without LF are accepted", "[lines][sheet]") {
  auto c = calc("a = 1 kN\r\nb [N] = a * 2\r\n# c\r\nnote text\r\nc = 3");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "b") == 2000);
  CHECK(si(*c, "c") == 3);
  CHECK(c->sheet.statements[2].text() == "c");
  CHECK(c->sheet.statements[3].text() == "text");
}
