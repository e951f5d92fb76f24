// The worksheet format (docs/format.md): statements, metadata, sections,
// notes, descriptions, line endings, and recovery after errors.
#include <catch2/catch.hpp>

#include "engine/sheet/sheet_parser.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::calc;
using calctrail::test::diagnostics;

namespace {
Sheet parse(const std::string& text, Diagnostics* d) {
  return parseSheet(std::make_shared<SourceFile>("s.calc", text), d);
}
}  // namespace

TEST_CASE("core statements parse in any order, with descriptions", "[sheet]") {
  Diagnostics d;
  Sheet s = parse(
      "# a comment line\n"
      "\n"
      "T [N*m] = F * r    # torque on the arm\n"
      "F = 20 kN          # load\n"
      "r = 0.25 m\n"
      "check arm: T < 10 [kN*m]   # arm rating\n",
      &d);
  REQUIRE(diagnostics(*calc("a = 1")).empty());
  REQUIRE(d.list().empty());
  REQUIRE(s.quantities.size() == 3);
  CHECK(s.quantities[0].name == "T");
  CHECK(s.quantities[0].unit_written == "N*m");
  CHECK(s.quantities[0].description == "torque on the arm");
  CHECK(s.quantities[1].description == "load");
  CHECK(s.quantities[2].description.empty());
  REQUIRE(s.checks.size() == 1);
  CHECK(s.checks[0].name == "arm");
  CHECK(s.checks[0].op == Comparison::Less);
  CHECK(s.checks[0].description == "arm rating");
  CHECK(s.statements[0].kind == Statement::Comment);
  CHECK(s.statements[1].kind == Statement::Blank);
}

TEST_CASE("metadata, sections and notes", "[sheet]") {
  Diagnostics d;
  Sheet s = parse(
      "title: Gate hoist\n"
      "calc: CT-9\n"
      "revision: B\n"
      "prepared: A. Person\n"
      "checked:\n"
      "section Loads\n"
      "note The gate is heavy. # hashes stay in narrative\n"
      "W = 3 kN\n"
      "section Screw\n"
      "d = 40 mm\n",
      &d);
  REQUIRE(d.list().empty());
  CHECK(s.meta.get("title") == "Gate hoist");
  CHECK(s.meta.get("calc") == "CT-9");
  CHECK(s.meta.get("checked").empty());
  CHECK(s.quantities[0].section == "Loads");
  CHECK(s.quantities[1].section == "Screw");
  CHECK(s.statements[6].kind == Statement::Note);
  CHECK(s.statements[6].text() == "The gate is heavy. # hashes stay in narrative");
}

TEST_CASE("keywords stay usable as quantity names", "[sheet]") {
  auto c = calc("note = 2\nsection [mm] = 3 mm\ncheck = note * 2\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(test::si(*c, "check") == 4);
  CHECK(test::si(*c, "section") == Approx(0.003));
}

TEST_CASE("Greek letters work in names, ASCII names keep working", "[sheet]") {
  auto c = calc("\xCE\xB1 = 15 deg\neta_2 = cos(\xCE\xB1)\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(test::si(*c, "eta_2") == Approx(std::cos(15 * M_PI / 180)));
}

TEST_CASE("CRLF line endings and a byte-order mark are accepted", "[sheet][diagnostics]") {
  auto c = calc("\xEF\xBB\xBF" "a = 1 kN\r\nb [N] = a * 2\r\n\r\ncheck ok: b > 1 N\r\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(test::si(*c, "b") == 2000);
  CHECK(c->checkResult(0).passed);
}

TEST_CASE("every error of a file is reported in one run, line by line", "[sheet][diagnostics]") {
  auto c = calc(
      "a = 3 +\n"
      "b = (2\n"
      "c = 2 ** 3\n"
      "d = 4 5\n"
      "e = 1\n");
  CHECK(diagnostics(*c) ==
        "sheet.calc:1:7: error: the formula ends too early: a value is missing\n"
        "sheet.calc:2:5: error: this `(` is never closed\n"
        "sheet.calc:3:7: error: `**` is not an operator here; write `^` for a power\n"
        "sheet.calc:4:7: error: expected an operator (+ - * / ^) before this; a product needs `*`\n");
}

TEST_CASE("malformed lines get plain messages", "[sheet][diagnostics]") {
  CHECK(diagnostics(*calc("x\n")) ==
        "sheet.calc:1:1: error: `x` alone is not a statement; define a quantity with `x = ...`\n");
  CHECK(diagnostics(*calc("x 3\n")) == "sheet.calc:1:3: error: expected `=` after the name `x` (or `[unit] =`)\n");
  CHECK(diagnostics(*calc("x =\n")) == "sheet.calc:1:3: error: `x =` needs a formula or a value after `=`\n");
  CHECK(diagnostics(*calc("titel: Gate\n")) ==
        "sheet.calc:1:1: error: `titel:` is not a metadata key; did you mean `title`?\n");
  CHECK(diagnostics(*calc("title: A\ntitle: B\n")) == "sheet.calc:2:1: error: `title:` is given twice\n");
  CHECK(diagnostics(*calc("check a b\n")) == "sheet.calc:1:9: error: expected `:` after the check name `a`\n");
  CHECK(diagnostics(*calc("a = 1\ncheck c: a = 1\n")) ==
        "sheet.calc:2:12: error: a check compares with <, <=, > or >=; `=` is not a comparison (exact equality of computed values is never safe to test)\n");
  CHECK(diagnostics(*calc("a = 1\ncheck c: 0 < a < 2\n")) ==
        "sheet.calc:2:16: error: one comparison per check; write two checks for a range\n");
  CHECK(diagnostics(*calc("pi = 3\n")) == "sheet.calc:1:1: error: `pi` is the constant 3.14159...; choose another name\n");
  CHECK(diagnostics(*calc("a [mm = 3\n")) ==
        "sheet.calc:1:3: error: this `[` is never closed: the display unit ends with `]`\n");
  CHECK(diagnostics(*calc("a = 3 [mm\n")) ==
        "sheet.calc:1:7: error: this `[` is never closed: a unit in brackets ends with `]`\n");
  CHECK(diagnostics(*calc("a = [mm]\n")) ==
        "sheet.calc:1:5: error: a unit in brackets must follow a number, as in `9.81 [m/s^2]`\n");
  CHECK(diagnostics(*calc("a = sqrt(2\n")) ==
        "sheet.calc:1:9: error: this `(` of the call to `sqrt` is never closed\n");
  CHECK(diagnostics(*calc("a = 2)\n")) == "sheet.calc:1:6: error: unmatched `)`\n");
}

TEST_CASE("look-alike characters are named, not silently accepted", "[sheet][diagnostics]") {
  // U+2212 MINUS SIGN, as word processors write it.
  CHECK(diagnostics(*calc("a = 3 \xE2\x88\x92 1\n")) ==
        "sheet.calc:1:7: error: unexpected character \xE2\x88\x92 (U+2212 MINUS SIGN); it looks like `-` but is not ASCII: type `-`\n");
  // A Cyrillic letter at the start of a line.
  CHECK(diagnostics(*calc("\xD1\x81 = 1\n")) ==
        "sheet.calc:1:1: error: a line starts with a name, `check`, `section`, `note`, a metadata key or `#`; found \xD1\x81 (U+0441 CYRILLIC SMALL LETTER ES), which looks like `c` but is not ASCII\n");
}

TEST_CASE("bytes that are not UTF-8 are an error at their place", "[sheet][diagnostics]") {
  auto c = calc("a = 1\nb\xFF = 2\nc = a\n");
  CHECK(diagnostics(*c) == "sheet.calc:2:2: error: byte 0xFF is not UTF-8; save the worksheet as UTF-8\n");
  REQUIRE(c->diags.list().size() == 1);
  CHECK(c->diags.list()[0].source_line == "b? = 2");  // shown safely
}

TEST_CASE("an empty file is an error", "[sheet][diagnostics]") {
  CHECK(diagnostics(*calc("")) == "sheet.calc:1:1: error: the worksheet is empty: nothing to calculate\n");
  CHECK(diagnostics(*calc("\n  \n\r\n")) == "sheet.calc:1:1: error: the worksheet is empty: nothing to calculate\n");
  // Found by the pipeline fuzzer: a byte-order mark and a line end were read as content.
  CHECK(diagnostics(*calc("\xEF\xBB\xBF\n")) ==
        "sheet.calc:1:1: error: the worksheet is empty: nothing to calculate\n");
}

TEST_CASE("deep nesting and very long formulas are refused, never a crash", "[sheet][diagnostics]") {
  std::string deep = "a = " + std::string(5000, '(') + "1" + std::string(5000, ')') + "\n";
  CHECK(diagnostics(*calc(deep)) == "sheet.calc:1:133: error: the formula nests too deeply (more than 128 levels)\n");
  std::string minus = "a = " + std::string(5000, '-') + "1\n";
  CHECK(calc(minus)->hasErrors());
  std::string power = "a = 1";
  for (int i = 0; i < 3000; ++i) power += "^1";
  CHECK(calc(power + "\n")->hasErrors());
  std::string sum = "a = 1";
  for (int i = 0; i < 5000; ++i) sum += " + 1";
  CHECK(diagnostics(*calc(sum + "\n")).find("too long (more than 4096 operations)") != std::string::npos);
  std::string fine = "a = 1";
  for (int i = 0; i < 4000; ++i) fine += " + 1";
  auto c = calc(fine + "\n");
  REQUIRE_FALSE(c->hasErrors());
  CHECK(test::si(*c, "a") == 4001);
}

TEST_CASE("diagnostics show the source line and a caret under the problem", "[diagnostics]") {
  auto c = calc("force = 3 kN\nx = 2 * forse\n");
  REQUIRE(c->diags.list().size() == 1);
  CHECK(c->diags.list()[0].render() ==
        "sheet.calc:2:9: error: unknown name `forse`; did you mean `force`?\n"
        "    x = 2 * forse\n"
        "            ^~~~~\n");
}
