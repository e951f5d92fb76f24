// Every unit of the table against an independent oracle: GNU units (the Debian
// package `units`), which has its own definitions file. GNU units treats the
// radian as dimensionless, so the angle exponent is left out of the SI side.
#include <catch2/catch.hpp>

#include <unistd.h>

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <iomanip>
#include <sstream>
#include <string>

#include "engine/units/unit_parser.h"
#include "engine/units/unit_table.h"

using namespace calctrail;

namespace {

const char* const kGnuUnits = "/usr/bin/units";

std::string shellQuote(const std::string& s) {
  std::string out = "'";
  for (char c : s) out += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return out + "'";
}

// Converts `from` into `to` with GNU units in one-line mode, 15 digits, the
// standard definitions file only (no personal file), C locale. False, with
// what GNU units printed, when the answer is not a number.
bool gnuUnits(const std::string& from, const std::string& to, double* value,
              std::string* output) {
  const std::string cmd = std::string("LC_ALL=C ") + kGnuUnits + " -f '' -t -d 15 -- " +
                          shellQuote(from) + " " + shellQuote(to) + " 2>&1";
  FILE* pipe = popen(cmd.c_str(), "r");
  if (!pipe) {
    *output = "could not run " + cmd;
    return false;
  }
  std::string out;
  char buf[256];
  while (std::fgets(buf, sizeof buf, pipe)) out += buf;
  const int status = pclose(pipe);
  while (!out.empty() && (out.back() == '\n' || out.back() == ' ')) out.pop_back();
  *output = out;
  if (status != 0 || out.empty()) return false;
  char* end = nullptr;
  *value = std::strtod(out.c_str(), &end);
  return end != nullptr && *end == '\0';
}

void requireGnuUnits() {
  if (access(kGnuUnits, X_OK) != 0)
    FAIL("GNU units is not installed at /usr/bin/units; install the Debian package "
         "`units` (apt-get install units) to run the unit oracle test");
}

double relErr(double a, double b) { return std::fabs(a - b) / std::fabs(b); }

// One check, named so that a failure says which unit and both numbers.
void compare(const std::string& what, const std::string& oracle, const std::string& si,
             double ours) {
  double theirs = 0;
  std::string output;
  const bool ok = gnuUnits(oracle, si, &theirs, &output);
  INFO(what << ": GNU units `" << oracle << "` -> `" << si << "` said: " << output);
  CHECK(ok);  // all units are checked, so one bad oracle does not hide others
  if (!ok) return;
  INFO(std::setprecision(17) << what << ": calctrail " << ours << ", GNU units " << theirs
                             << " (relative difference " << relErr(ours, theirs) << ")");
  CHECK(relErr(ours, theirs) <= 1e-12);
}

}  // namespace

TEST_CASE("unit oracle: every unit of the table agrees with GNU units", "[units][oracle]") {
  requireGnuUnits();
  for (const UnitDef& d : unitTable()) {
    const std::string si = d.dim.withoutAngle().siSymbol();
    const std::string name(d.name), oracle(d.oracle);
    if (d.offset == 0.0) {
      compare("unit `" + name + "` factor", oracle, si, d.factor);
      continue;
    }
    // Absolute temperatures: GNU units writes them as functions, `tempC(1)`.
    // Two (here three) points give the factor and the offset.
    const std::string suffix = "(1)";
    INFO("unit `" << d.name << "`: an offset unit's oracle is `function(1)`");
    REQUIRE(oracle.size() > suffix.size());
    REQUIRE(oracle.compare(oracle.size() - suffix.size(), suffix.size(), suffix) == 0);
    const std::string function = oracle.substr(0, oracle.size() - suffix.size());
    for (double x : {0.0, 100.0, -40.0}) {
      std::ostringstream point;
      point << function << "(" << x << ")";
      compare("unit `" + name + "` at " + std::to_string(static_cast<int>(x)) + " " + name,
              point.str(), si, d.factor * x + d.offset);
    }
  }
}

TEST_CASE("unit oracle: compound units agree with GNU units", "[units][oracle]") {
  requireGnuUnits();
  struct Case {
    const char* ours;
    const char* theirs;
  };
  const Case cases[] = {
      {"N*m", "N m"},           {"lbf*in", "lbf inch"},     {"in/min", "inch/minute"},
      {"kg/m^3", "kg/m^3"},     {"N/mm^2", "N/mm^2"},       {"1/in", "1/inch"},
      {"rev/min", "rev/min"},   {"ft*lbf/s", "ft lbf/s"},   {"W/(m*K)", "W/(m K)"},
      {"mm/rev", "mm/rev"},     {"kN*m/rad", "kN m/radian"}, {"psi*ft/min", "psi ft/min"},
      {"m/s/s", "m/s/s"},       {"kip/in^2", "kip/inch^2"}, {"1/ddegF", "1/degF"},
      {"slug*ft^2", "slug ft^2"}, {"hp/rpm", "hp/rpm"},
  };
  for (const Case& c : cases) {
    Unit u;
    UnitError err;
    INFO("`" << c.ours << "`: " << err.message);
    REQUIRE(parseUnit(c.ours, &u, &err));
    compare(std::string("`") + c.ours + "`", c.theirs, u.dim.withoutAngle().siSymbol(),
            u.factor);
  }
}
