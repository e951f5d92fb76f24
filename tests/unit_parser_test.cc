// Unit expressions as engineers type them, and every kind of bad input, with
// the message and the byte offset it points at.
#include <catch2/catch.hpp>

#include <cmath>
#include <random>
#include <string>
#include <vector>

#include "engine/units/unit_parser.h"
#include "engine/units/unit_table.h"

using namespace calctrail;

namespace {

constexpr double kPi = 3.141592653589793238462643383279502884;
constexpr double kLbf = 4.4482216152605;  // N, NIST SP 811 (2008) B.8, exact

struct Good {
  const char* input;
  const char* text;  // canonical spelling
  double factor;
  Dimension dim;
};

struct Bad {
  std::string input;
  size_t offset;
  std::vector<std::string> says;  // substrings of the message
};

Dimension d(int l, int m, int t, int theta = 0, int angle = 0) {
  return Dimension::exponents(l, m, t, 0, theta, 0, 0, angle);
}

}  // namespace

TEST_CASE("unit parser: the forms engineers write", "[units][parser]") {
  const Dimension energy = d(2, 1, -2), speed = d(1, 0, -1), pressure = d(-1, 1, -2);
  const Good cases[] = {
      {"N*m", "N*m", 1.0, energy},
      {"lbf*in", "lbf*in", kLbf * 0.0254, energy},
      {"in/min", "in/min", 0.0254 / 60, speed},
      {"kg/m^3", "kg/m^3", 1.0, d(-3, 1, 0)},
      {"m/s^2", "m/s^2", 1.0, d(1, 0, -2)},
      {"N/mm^2", "N/mm^2", 1e6, pressure},
      {"1/in", "1/in", 1 / 0.0254, d(-1, 0, 0)},
      {"rev/min", "rev/min", 2 * kPi / 60, d(0, 0, -1, 0, 1)},
      {"ft*lbf/s", "ft*lbf/s", 0.3048 * kLbf, d(2, 1, -3)},
      {"W/(m*K)", "W/(m*K)", 1.0, d(1, 1, -3, -1)},
      {"mm/rev", "mm/rev", 1e-3 / (2 * kPi), d(1, 0, 0, 0, -1)},
      {"in/rev", "in/rev", 0.0254 / (2 * kPi), d(1, 0, 0, 0, -1)},
      {"kN*m/rad", "kN*m/rad", 1e3, d(2, 1, -2, 0, -1)},
      {"MPa*m/s", "MPa*m/s", 1e6, d(0, 1, -3)},
      {"kip/in^2", "kip/in^2", 1e3 * kLbf / (0.0254 * 0.0254), pressure},
      // Product signs and superscripts as typeset documents have them.
      {"N\u00B7m", "N*m", 1.0, energy},
      {"N\u22C5m", "N*m", 1.0, energy},
      {"mm\u00B2", "mm^2", 1e-6, d(2, 0, 0)},
      {"m\u00B3", "m^3", 1.0, d(3, 0, 0)},
      {"m\u207B\u00B9", "m^-1", 1.0, d(-1, 0, 0)},
      {"m\u00B7s\u207B\u00B2", "m*s^-2", 1.0, d(1, 0, -2)},
      {"N/mm\u00B2", "N/mm^2", 1e6, pressure},
      {"\u00B5m", "um", 1e-6, d(1, 0, 0)},
      {"\u03BCm", "um", 1e-6, d(1, 0, 0)},
      // Negative powers, with the minus sign U+2212 accepted.
      {"m^-1", "m^-1", 1.0, d(-1, 0, 0)},
      {"m^\u22121", "m^-1", 1.0, d(-1, 0, 0)},
      {"ft^(-1)", "ft^-1", 1 / 0.3048, d(-1, 0, 0)},
      {"s^+2", "s^2", 1.0, d(0, 0, 2)},
      // Division is left-associative: a/b*c is (a/b)*c.
      {"N/m*s", "N/m*s", 1.0, d(0, 1, -1)},
      {"m/s/s", "m/s/s", 1.0, d(1, 0, -2)},
      {"kg/m/s^2", "kg/m/s^2", 1.0, pressure},
      {"m/(s/h)", "m/(s/h)", 3600.0, d(1, 0, 0)},
      // Parentheses that change nothing are dropped from the canonical text.
      {"(N*m)/s", "N*m/s", 1.0, d(2, 1, -3)},
      {"N*(m/s)", "N*m/s", 1.0, d(2, 1, -3)},
      {"(m)^2", "m^2", 1.0, d(2, 0, 0)},
      {"((((m))))", "m", 1.0, d(1, 0, 0)},
      {"(m*s)^2", "(m*s)^2", 1.0, d(2, 0, 2)},
      {"(m^2)^3", "(m^2)^3", 1.0, d(6, 0, 0)},
      {"(km)^2", "km^2", 1e6, d(2, 0, 0)},
      {"m*(1/s)", "m/s", 1.0, speed},
      {"(1/s)*m", "1/s*m", 1.0, speed},
      {"(1/s)^2", "(1/s)^2", 1.0, d(0, 0, -2)},
      {"m/(1)", "m", 1.0, d(1, 0, 0)},
      // Spaces around operators, brackets as in `9.81 [m/s^2]`.
      {" N * m ", "N*m", 1.0, energy},
      {"m ^ 2", "m^2", 1.0, d(2, 0, 0)},
      {"[m/s^2]", "m/s^2", 1.0, d(1, 0, -2)},
      {"[ mm/rev ]", "mm/rev", 1e-3 / (2 * kPi), d(1, 0, 0, 0, -1)},
      {"N\u00A0*\u00A0m", "N*m", 1.0, energy},
      // Dimensionless and temperatures.
      {"1", "1", 1.0, Dimension()},
      {"%", "%", 0.01, Dimension()},
      {"1/ppm", "1/ppm", 1e6, Dimension()},
      {"\u00B0", "deg", kPi / 180, d(0, 0, 0, 0, 1)},
      {"\u00B0C", "degC", 1.0, d(0, 0, 0, 1)},
      {"\u2103", "degC", 1.0, d(0, 0, 0, 1)},
      {"1/ddegC", "1/ddegC", 1.0, d(0, 0, 0, -1)},
      {"W/(m*ddegF)", "W/(m*ddegF)", 1.8, d(1, 1, -3, -1)},
      {"\u0394\u00B0C", "ddegC", 1.0, d(0, 0, 0, 1)},
  };
  for (const Good& c : cases) {
    INFO("input `" << c.input << "`");
    Unit u;
    UnitError err;
    const bool ok = parseUnit(c.input, &u, &err);
    INFO("error at " << err.offset << ": " << err.message);
    REQUIRE(ok);
    CHECK(u.text == c.text);
    CHECK(std::fabs(u.factor - c.factor) <= 1e-15 * c.factor);
    CHECK(u.dim == c.dim);
    // The canonical text reads back as the same unit.
    Unit again;
    REQUIRE(parseUnit(u.text, &again, &err));
    CHECK(again.text == u.text);
    CHECK(again.factor == u.factor);
    CHECK(again.dim == u.dim);
  }
}

TEST_CASE("unit parser: offsets only on a lone absolute temperature", "[units][parser]") {
  Unit u;
  UnitError err;
  REQUIRE(parseUnit("degC", &u, &err));
  CHECK(u.offset == 273.15);
  REQUIRE(parseUnit(" [degF] ", &u, &err));
  CHECK(u.offset == Approx(459.67 * 5 / 9).epsilon(1e-15));
  REQUIRE(parseUnit("ddegC", &u, &err));
  CHECK(u.offset == 0.0);
}

TEST_CASE("unit parser: bad input gets a clear message at the right offset",
          "[units][parser]") {
  const Bad cases[] = {
      // Empty.
      {"", 0, {"empty unit", "`1` for a dimensionless"}},
      {"   ", 0, {"empty unit"}},
      {"[ ]", 2, {"empty unit"}},
      {"[]", 1, {"empty unit"}},
      {"[m", 0, {"`[` has no matching `]`"}},
      // Operators.
      {"kN**2", 2, {"`**` is not a power here; write `kN^2`"}},
      {"m**-1", 1, {"write `m^-1`"}},
      {"m/", 1, {"nothing after `/`"}},
      {"N*", 1, {"nothing after `*`"}},
      {"N\u00B7", 1, {"nothing after `\u00B7`"}},
      {"m//s", 1, {"nothing after `/`"}},
      {"m/)", 1, {"nothing after `/`"}},
      {"/s", 0, {"`/` has no unit before it"}},
      {"*m", 0, {"`*` has no unit before it"}},
      {"N \u00D7 m", 2, {"`\u00D7` is not a product sign", "`*`"}},
      {"N m", 2, {"two units side by side", "`N*m`"}},
      {"N-m", 1, {"a dash is not a product", "`N*m`"}},
      {"lbf\u2212in", 3, {"a dash is not a product", "`lbf*in`"}},
      {"m-1", 1, {"`m^-1`"}},
      // Powers.
      {"mm2", 2, {"write a power with `^`: `mm^2`"}},
      {"m 2", 2, {"`m^2`"}},
      {"m^0.5", 1, {"whole number"}},
      {"m^(1/2)", 1, {"whole number"}},
      {"m^", 1, {"expected a whole number after `^`"}},
      {"m^x", 1, {"expected a whole number after `^`"}},
      {"m^(2", 1, {"`^(` has no matching `)`"}},
      {"m^0", 1, {"power of 0"}},
      {"m^13", 1, {"beyond 12"}},
      {"m^2^3", 3, {"one power", "`(m^2)^3`"}},
      {"m^\u00B2", 1, {"not both"}},
      {"\u00B2", 0, {"superscript power needs a unit"}},
      {"m\u207B", 1, {"superscript digits"}},
      {"1^2", 1, {"`1` takes no power"}},
      {"km^12*km^12*km^12*km^12*km^12*km^12", 29, {"too large"}},
      {"((ppm^12)^12)^12", 0, {"too large or too small"}},
      // Numbers and parentheses.
      {"2/s", 0, {"only number a unit may hold is `1`"}},
      {"m/1", 2, {"only number a unit may hold is `1`"}},
      {"0.5*m", 0, {"only number"}},
      {"(m", 0, {"`(` has no matching `)`"}},
      {"W/(m*K", 2, {"`(` has no matching `)`"}},
      {"m)", 1, {"`)` has no matching `(`"}},
      {"()", 0, {"empty parentheses"}},
      {std::string(40, '(') + "m" + std::string(40, ')'), 32, {"too many nested"}},
      // Unknown units, with suggestions, case-sensitive.
      {"xyzzy", 0, {"unknown unit `xyzzy`", "`calctrail units` lists"}},
      {"lbs", 0, {"unknown unit `lbs`; did you mean `lb` or `lbf`?"}},
      {"Nm", 0, {"unknown unit `Nm`; did you mean `N*m`"}},
      {"kgs", 0, {"did you mean `kg`"}},
      {"sec", 0, {"did you mean `s`?"}},
      {"mins", 0, {"did you mean `min`?"}},
      {"RPM", 0, {"did you mean `rpm`?"}},
      {"lbf*inch", 4, {"unknown unit `inch`; did you mean `in`?"}},
      {"mPa", 0, {"unknown unit `mPa`; did you mean `MPa`"}},
      {"kkm", 0, {"unknown unit `kkm`; did you mean `km`", "not a prefixed unit"}},
      {"mkm", 0, {"unknown unit `mkm`", "`km`"}},
      {"N/kMPa", 2, {"unknown unit `kMPa`", "`MPa`", "`kPa`"}},
      {"\u00B5s", 0, {"unknown unit `\u00B5s`"}},
      // Look-alike characters.
      {"\u0441m", 0, {"U+0441", "Cyrillic", "looks like `c`"}},
      {"m\u043C", 1, {"U+043C", "Cyrillic", "looks like `m`"}},
      {"kg/\u043C^3", 3, {"U+043C", "looks like `m`"}},
      {"\u041C\u0420a", 0, {"U+041C", "looks like `M`"}},
      {"\uFF4D\uFF4D", 0, {"U+FF4D", "fullwidth", "looks like `m`"}},
      {"\u039C\u0050a", 0, {"U+039C", "Greek", "looks like `M`"}},
      {"\u212A", 0, {"U+212A", "looks like `K`"}},
      {"m\u2603", 1, {"unexpected character", "U+2603"}},
      {"m#", 1, {"unexpected `#`"}},
      {"m\xff", 1, {"invalid UTF-8", "0xFF"}},
      {"m\xC3", 1, {"invalid UTF-8", "0xC3"}},
      {std::string("m\x01", 2), 1, {"control character U+0001"}},
      {std::string("m\0s", 3), 1, {"control character U+0000"}},
      // Absolute temperatures are only valid alone.
      {"1/degC", 2, {"absolute temperature", "`1/ddegC` or `1/K`"}},
      {"degC^2", 0, {"with a power", "`ddegC^2`"}},
      {"W/(m*degF)", 5, {"absolute temperature", "`W/(m*ddegF)`"}},
      {"1/\u00B0C", 2, {"`\u00B0C` is an absolute temperature", "`1/ddegC`"}},
      {"[1/degC]", 3, {"`1/ddegC` or `1/K`"}},
  };
  for (const Bad& c : cases) {
    INFO("input `" << c.input << "`");
    Unit u;
    UnitError err;
    REQUIRE_FALSE(parseUnit(c.input, &u, &err));
    INFO("message: " << err.message);
    CHECK(err.offset == c.offset);
    for (const std::string& s : c.says) {
      INFO("expected to contain: " << s);
      CHECK(err.message.find(s) != std::string::npos);
    }
  }
}

// Random byte soup built from the pieces above: never a crash, and any unit
// accepted round-trips through its canonical text.
TEST_CASE("unit parser: random input never crashes", "[units][parser]") {
  const std::vector<std::string> pieces = {
      "m", "mm", "N", "kN", "lbf", "in", "rpm", "rev", "degC", "ddegC", "%", "1", "2",
      "*", "/", "^", "-", "(", ")", "[", "]", " ", "\u00B7", "\u00B2", "\u207B", "\u2212",
      "\u00B5", "\u0441", "\xff", "\xC3", "**", "^-1", "^2", "s", "Pa", "K", "\u00B0"};
  std::mt19937 rng(20240601);
  std::uniform_int_distribution<size_t> pick(0, pieces.size() - 1);
  std::uniform_int_distribution<int> count(0, 8);
  int accepted = 0;
  for (int i = 0; i < 20000; ++i) {
    std::string text;
    for (int k = count(rng); k > 0; --k) text += pieces[pick(rng)];
    Unit u;
    UnitError err;
    if (parseUnit(text, &u, &err)) {
      ++accepted;
      Unit again;
      INFO("`" << text << "` -> `" << u.text << "`");
      REQUIRE(parseUnit(u.text, &again, &err));
      CHECK(again.dim == u.dim);
      CHECK(std::fabs(again.factor - u.factor) <= 1e-14 * u.factor);
    } else {
      INFO("`" << text << "`");
      CHECK_FALSE(err.message.empty());
      CHECK(err.offset <= text.size());
    }
  }
  CHECK(accepted > 0);
}

TEST_CASE("unit parser: units run together, split into known units", "[units][parser][hints]") {
  CHECK(runTogetherUnits("Nm") == std::vector<std::string>{"N*m"});
  CHECK(runTogetherUnits("kNm") == std::vector<std::string>{"kN*m"});
  CHECK(runTogetherUnits("Nmm") == std::vector<std::string>{"N*mm"});
  CHECK(runTogetherUnits("lbfin") == std::vector<std::string>{"lbf*in"});
  CHECK(runTogetherUnits("mkg").empty());  // a lone prefix letter is not split off: not m*kg
  CHECK(runTogetherUnits("kWh").empty());  // a unit of its own
  CHECK(runTogetherUnits("xyz").empty());
  Unit u;
  UnitError err;
  REQUIRE_FALSE(parseUnit("Nm", &u, &err));
  CHECK(err.message.rfind("unknown unit `Nm`; did you mean `N*m`", 0) == 0);
  // After a number, the fixes are whole literals: a compound in brackets.
  REQUIRE_FALSE(parseUnit("kNm", &u, &err, "3"));
  CHECK(err.message.rfind("unknown unit `kNm`; did you mean `3 [kN*m]`, `3 km` or `3 kN`?", 0) == 0);
  // A plural is a plural: "lbs" is pounds before it is lb*s.
  REQUIRE_FALSE(parseUnit("lbs", &u, &err, "3"));
  CHECK(err.message.rfind("unknown unit `lbs`; did you mean `3 lb` or `3 lbf`?", 0) == 0);
}

// parseUnit takes a table name in ASCII letters (or `%`) straight from the
// table; the same text in brackets always goes through the expression parser.
// Both must give the same unit, and the same error one byte further on.
TEST_CASE("unit parser: a plain unit name gives what the expression parser gives", "[units][parser]") {
  std::vector<std::string> words = {"", "%", "m", "mm", "kN", "degC", "ddegF", "K", "rpm", "Nm", "lbs", "mN",
                                    "kkm", "x", "Mm", "um", "\u00B5m", "N_m", "deg"};
  for (const UnitDef& u : unitTable()) {
    const std::string name(u.name);
    words.push_back(name);
    words.push_back(name + "s");
    words.push_back("k" + name);
    for (std::string_view a : u.aliases) words.emplace_back(a);
  }
  std::mt19937 random(20261204);
  std::uniform_int_distribution<int> length(1, 5), letter(0, 51);
  for (int k = 0; k < 2000; ++k) {
    std::string w(static_cast<size_t>(length(random)), 'a');
    for (char& c : w) {
      const int l = letter(random);
      c = static_cast<char>(l < 26 ? 'a' + l : 'A' + (l - 26));
    }
    words.push_back(w);
  }
  for (const std::string& w : words) {
    for (const std::string_view after : {std::string_view(), std::string_view("5")}) {
      INFO("unit `" << w << "` after `" << after << "`");
      Unit plain, parsed;
      UnitError plain_err, parsed_err;
      const bool ok = parseUnit(w, &plain, &plain_err, after);
      REQUIRE(ok == parseUnit("[" + w + "]", &parsed, &parsed_err, after));
      if (ok) {
        CHECK(plain.factor == parsed.factor);
        CHECK(plain.offset == parsed.offset);
        CHECK(plain.dim == parsed.dim);
        CHECK(plain.text == parsed.text);
      } else if (!w.empty()) {
        CHECK(plain_err.offset + 1 == parsed_err.offset);
        CHECK(plain_err.message == parsed_err.message);
      }
    }
  }
}
