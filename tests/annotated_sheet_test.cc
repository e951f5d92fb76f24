// `calctrail textconv` of a sheet that uses templates: after each `use` line
// the results of its instance, nested instances under their dotted names, in
// the template's order, bounded; the rest of the text is the sheet unchanged.
//
// The numbers are worked by hand: T = F * f * d / 2 with f = 0.10 and
// d = 20 mm gives 10 N*m for F = 10 kN and 5 N*m for 5 kN.
#include <catch2/catch.hpp>

#include <sstream>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

const char* kScrew =
    "param F [N]\nparam f = 0.10\nd = 20 mm\nT [N*m] = F * f * d / 2\ncheck t: T < 12 [N*m]\n";

// Two screws, the second under half the load; its `use` line after a quantity of its own.
const char* kPair =
    "param F [N] = 8 kN\nuse screw.calc as left with F = F\nT_sum [N*m] = left.T + right.T\n"
    "use screw.calc as right with F = F / 2\n";

// The lines of `text` that do not start with the mark, in order.
std::string unmarked(const std::string& text) {
  std::istringstream in(text);
  std::string line, rest;
  while (std::getline(in, line))
    if (line.rfind("#=", 0) != 0) rest += line + "\n";
  return rest;
}

}  // namespace

TEST_CASE("textconv writes an instance's results after its use line, nested ones under dotted names",
          "[textconv][template][review]") {
  const std::string dir = tempDir();
  writeFile(dir + "/screw.calc", kScrew);
  writeFile(dir + "/pair.calc", kPair);
  const std::string sheet = "use pair.calc as p with F = 10 kN\nT2 [N*m] = 2 * p.T_sum\n";
  writeFile(dir + "/a.calc", sheet);
  Run r = runCliIn(dir, "textconv a.calc");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK(r.err.empty());
  // In pair.calc's order: its parameter, the instance `left` at its use line,
  // T_sum (10 + 5 N*m), then `right`; every quantity of the template, given values too.
  CHECK(r.out ==
        "#= calctrail: 2 checks, all PASS\n"
        "use pair.calc as p with F = 10 kN\n"
        "#= p.F = 10000 N\n"
        "#= p.left.F = 10000 N\n"
        "#= p.left.f = 0.1\n"
        "#= p.left.d = 20 mm\n"
        "#= p.left.T = 10 N\u00b7m\n"
        "#= check p.left.t: PASS  10 N\u00b7m < 12 N\u00b7m\n"
        "#= p.T_sum = 15 N\u00b7m\n"
        "#= p.right.F = 5000 N\n"
        "#= p.right.f = 0.1\n"
        "#= p.right.d = 20 mm\n"
        "#= p.right.T = 5 N\u00b7m\n"
        "#= check p.right.t: PASS  5 N\u00b7m < 12 N\u00b7m\n"
        "T2 [N*m] = 2 * p.T_sum\n"
        "#= T2 = 30 N\u00b7m\n");
  CHECK(unmarked(r.out) == sheet);
  // The same again: the text is deterministic, or git would show changes that are none.
  CHECK(runCliIn(dir, "textconv a.calc").out == r.out);
}

TEST_CASE("textconv writes each use line's instance after that line, a failing check as FAIL",
          "[textconv][template][review]") {
  const std::string dir = tempDir();
  writeFile(dir + "/screw.calc", kScrew);
  // 15 kN: T = 15000 * 0.10 * 0.020 / 2 = 15 N*m, over the 12 N*m of the check.
  const std::string sheet =
      "use screw.calc as a with F = 10 kN\n# between\nuse screw.calc as b with F = 15 kN, f = 0.10\n";
  writeFile(dir + "/two.calc", sheet);
  Run r = runCliIn(dir, "textconv two.calc");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK(r.out.rfind("#= calctrail: 2 checks, 1 PASS, 1 FAIL (b.t)\n", 0) == 0);
  CHECK(r.out.find("use screw.calc as a with F = 10 kN\n#= a.F = 10000 N\n#= a.f = 0.1\n#= a.d = 20 mm\n"
                   "#= a.T = 10 N\u00b7m\n#= check a.t: PASS  10 N\u00b7m < 12 N\u00b7m\n# between\n") !=
        std::string::npos);
  CHECK(r.out.find("use screw.calc as b with F = 15 kN, f = 0.10\n#= b.F = 15000 N\n#= b.f = 0.1\n"
                   "#= b.d = 20 mm\n#= b.T = 15 N\u00b7m\n#= check b.t: FAIL  15 N\u00b7m < 12 N\u00b7m\n") !=
        std::string::npos);
  CHECK(unmarked(r.out) == sheet);
}

TEST_CASE("textconv lists 100 result lines of an instance, then counts the rest",
          "[textconv][template][review]") {
  const std::string dir = tempDir();
  // 130 quantities: x = 1, q1 = x + 1 = 2, ..., q129 = 130.
  std::string big = "x = 1\n";
  for (int k = 1; k < 130; ++k)
    big += "q" + std::to_string(k) + " = " + (k == 1 ? std::string("x") : "q" + std::to_string(k - 1)) +
           " + 1\n";
  writeFile(dir + "/big.calc", big);
  const std::string sheet = "use big.calc as one\nuse big.calc as two\n";
  writeFile(dir + "/s.calc", sheet);
  Run r = runCliIn(dir, "textconv s.calc");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  // Each use line is bounded on its own: 100 lines (x, q1 .. q99), then the count of 30.
  CHECK(r.out.find("use big.calc as one\n#= one.x = 1\n#= one.q1 = 2\n") != std::string::npos);
  CHECK(r.out.find("\n#= one.q99 = 100\n#= and 30 more results of the instance one\nuse big.calc as two\n") !=
        std::string::npos);
  CHECK(r.out.find("one.q100") == std::string::npos);
  CHECK(r.out.find("\n#= two.q99 = 100\n#= and 30 more results of the instance two\n") != std::string::npos);
  CHECK(unmarked(r.out) == sheet);
}

TEST_CASE("textconv of a sheet whose binding is wrong shows the error and no instance results",
          "[textconv][template][review]") {
  const std::string dir = tempDir();
  writeFile(dir + "/screw.calc", kScrew);
  writeFile(dir + "/bad.calc", "use screw.calc as s with F = 10 mm\n");
  Run r = runCliIn(dir, "textconv bad.calc");
  INFO(r.out << r.err);
  CHECK(r.status == 0);
  CHECK(r.out.rfind(
            "#= calctrail: 1 error, nothing calculated\nuse screw.calc as s with F = 10 mm\n#= error: ", 0) ==
        0);
  CHECK(r.out.find("#= s.") == std::string::npos);
}
