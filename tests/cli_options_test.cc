// Every numeric option of every command is checked before anything runs: a
// value that is not a finite number in its range is `calctrail: error:` and
// exit 2, never a silent result (docs/limits.md, "Options").
#include <catch2/catch.hpp>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

const char* const kOld = "F = 2 kN\nr = 0.1 m\nT [N*m] = F * r\ncheck t: T < 500 [N*m]\n";
const char* const kNew = "F = 6 kN\nr = 0.1 m\nT [N*m] = F * r\ncheck t: T < 500 [N*m]\n";

// One numeric option of one command, and the command line it belongs to.
struct NumericOption {
  const char* name;     // the option, as typed
  const char* command;  // the command line before it, run in the sheets' folder
  const char* wanted;   // what the error says to give instead
};

const NumericOption kOptions[] = {
    {"--digits", "report old.calc", "give a whole number from 1 to 15"},
    {"--digits", "textconv old.calc", "give a whole number from 1 to 15"},
    {"--digits", "diff old.calc new.calc", "give a whole number from 1 to 15"},
    {"--rtol", "diff old.calc new.calc", "give a finite number, 0 or more, such as 1e-6"},
};

std::string sheetsDir() {
  const std::string dir = tempDir();
  writeFile(dir + "/old.calc", kOld);
  writeFile(dir + "/new.calc", kNew);
  return dir;
}

}  // namespace

TEST_CASE("diff --rtol nan is refused instead of hiding every change", "[cli-options]") {
  const std::string dir = sheetsDir();
  Run moved = runCliIn(dir, "diff old.calc new.calc");
  REQUIRE(moved.status == 1);  // the load tripled: a change to show
  for (const char* nan : {"nan", "NaN", "-nan", "nan(1)"}) {
    INFO(nan);
    Run r = runCliIn(dir, std::string("diff old.calc new.calc --rtol '") + nan + "'");
    CHECK(r.status == 2);
    CHECK(r.out.empty());
    CHECK(r.err.rfind(std::string("calctrail: error: --rtol: `") + nan +
                          "` is not a number; give a finite number, 0 or more, such as 1e-6\n",
                      0) == 0);
  }
}

TEST_CASE("every numeric option refuses what is not a finite number in its range", "[cli-options]") {
  const std::string dir = sheetsDir();
  for (const NumericOption& o : kOptions) {
    const bool whole = std::string(o.name) == "--digits";
    std::vector<std::pair<std::string, std::string>> bad = {
        {"nan", "is not a"},   {"inf", "is not a"},
        {"-inf", "is not a"},  {"1e400", whole ? "is not a" : "is too large"},
        {"0x10", "is not a"},  {" 1", "is not a"},
        {"1 ", "is not a"},    {"", "is not a"},
        {"1e-9x", "is not a"}, {"-1", whole ? "is out of range" : "is negative"},
        {"ten", "is not a"}};
    if (whole) {
      for (const char* v : {"0", "16", "-0", "99999999999999999999"}) bad.push_back({v, "is out of range"});
      bad.push_back({"4.5", "is not a"});
      bad.push_back({"1e1", "is not a"});
    }
    for (const auto& [value, says] : bad) {
      INFO(o.command << " " << o.name << " '" << value << "'");
      Run r = runCliIn(dir, std::string(o.command) + " " + o.name + " '" + value + "'");
      CHECK(r.status == 2);
      CHECK(r.out.empty());
      CHECK(r.err.rfind("calctrail: error: " + std::string(o.name) + ": `" + value + "` " + says, 0) == 0);
      CHECK(r.err.find(o.wanted) != std::string::npos);
    }
  }
}

TEST_CASE("numeric options take every value in their range", "[cli-options]") {
  const std::string dir = sheetsDir();
  for (const NumericOption& o : kOptions) {
    const bool whole = std::string(o.name) == "--digits";
    const std::vector<std::string> good =
        whole ? std::vector<std::string>{"1", "15", "+7", "04"}
              : std::vector<std::string>{"0", "-0", "1e-6", ".5", "5.", "2E+3", "1e-400"};
    const int expected = std::string(o.command).rfind("diff", 0) == 0 ? 1 : 0;
    for (const std::string& value : good) {
      INFO(o.command << " " << o.name << " " << value);
      Run r = runCliIn(dir, std::string(o.command) + " " + o.name + " '" + value + "'");
      CHECK(r.err.empty());
      CHECK(r.status == expected);  // diff: the input F changed, whatever the tolerance
    }
  }
}

TEST_CASE("textconv --digits changes the rounding it promises", "[cli-options]") {
  const std::string dir = sheetsDir();
  writeFile(dir + "/pi.calc", "a = 1 mm\nx [mm] = a * pi\n");
  CHECK(runCliIn(dir, "textconv pi.calc --digits 3").out.find("#= x = 3.14 mm\n") != std::string::npos);
  CHECK(runCliIn(dir, "textconv pi.calc --digits 9").out.find("#= x = 3.14159265 mm\n") != std::string::npos);
}
