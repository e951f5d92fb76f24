// The units a result is shown in when its line declares none: the unit a
// library function declares for its result (issue 11: a rating life printed
// as an angle, threads per inch as 1/mm, an efficiency as a bare number), and
// the sheet's `units:` line (SI or US customary, with units to prefer).
#include <catch2/catch.hpp>

#include <cmath>

#include "engine/units/unit_parser.h"
#include "engine/units/unit_preferences.h"
#include "functions/function_decl.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::calc;
using calctrail::test::diagnostics;
using calctrail::test::si;

namespace {

std::string shownUnit(const Calculation& c, const std::string& name) {
  return c.display(static_cast<size_t>(c.sheet.find(name))).text;
}

Unit parsed(const char* text) {
  Unit u;
  UnitError err;
  REQUIRE(parseUnit(text, &u, &err));
  return u;
}

// An Acme clamp of our own in US customary units, with no bracketed unit on
// any line (the sheet of issue 11).
const char* const kClamp =
    "title: Hand-cranked Acme clamp\n"
    "units: US\n"
    "d = 1.25 in                            # nominal size\n"
    "tpi = acme_tpi(d)                      # threads per inch\n"
    "p = acme_pitch(d)                      # pitch\n"
    "d_m = acme_pitch_dia(d, p)             # pitch diameter\n"
    "d_r = acme_minor_dia(d, p)             # minor diameter\n"
    "l = thread_lead(p, 1)                  # lead\n"
    "alpha = acme_flank_angle()             # flank angle\n"
    "F = 2000 lbf                           # clamp force\n"
    "f = 0.15                               # thread friction\n"
    "T = torque_raise(F, d_m, l, f, alpha)  # clamp torque\n"
    "eta = screw_efficiency(d_m, l, f, alpha)  # efficiency\n"
    "sig = F / (pi * d_r^2 / 4)             # root stress\n"
    "P = T * 60 rpm                         # crank power\n"
    "v = l * 60 rpm                         # nut speed\n"
    "h = d - d_m                            # a length by subtraction\n"
    "check stress: sig < 20 ksi\n";

}  // namespace

TEST_CASE("a library result is shown in the unit its function declares", "[units][preferences]") {
  // Issue 11: `45.00e6°` for a rating life (revolutions taken as an angle),
  // `0.1969 1/mm` for threads per inch, an efficiency as a bare number.
  auto c = calc(
      "C_a = 30 kN\n"
      "F_m = 3.5 kN\n"
      "L = ball_screw_life(C_a, F_m)\n"
      "tpi = acme_tpi(1 in)\n"
      "eta = screw_efficiency(20 mm, 4 [mm/rev], 0.1, 15 deg)\n"
      "P = input_power(2000 W, 0.9)\n"
      "F = cubic_mean_load(3 kN, 100 rpm, 0.5, 4 kN, 100 rpm, 0.5)\n"
      "x = C_a / F_m\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(shownUnit(*c, "L") == "rev");
  CHECK(shownUnit(*c, "tpi") == "1/in");
  CHECK(shownUnit(*c, "eta") == "%");
  CHECK(shownUnit(*c, "P") == "kW");
  CHECK(shownUnit(*c, "F") == "kN");
  CHECK(shownUnit(*c, "x") == "1");  // a ratio of the sheet's own stays a plain number
  // L10 = (C_a/F_m)^3 * 1e6 rev (ISO 3408-5 / ISO 281 form): (30/3.5)^3 = 629.7 million rev.
  const double rev = 2 * M_PI;
  CHECK(si(*c, "L") / rev == Approx(std::pow(30.0 / 3.5, 3) * 1e6).epsilon(1e-12));
  // 1 in Acme: 5 threads per inch (ASME B1.5 Table of the general-purpose series).
  CHECK(c->display(static_cast<size_t>(c->sheet.find("tpi"))).fromSI(si(*c, "tpi")) ==
        Approx(5.0).epsilon(1e-12));
}

TEST_CASE("a library result unit gives way to a unit written on the line", "[units][preferences]") {
  auto c = calc("eta [1] = screw_efficiency(20 mm, 4 [mm/rev], 0.1, 15 deg)\nL [h] = 2 h\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(shownUnit(*c, "eta") == "1");
}

TEST_CASE("every library result unit parses to the result's dimension", "[units][preferences][functions]") {
  for (const FunctionDecl& f : functionLibrary()) {
    INFO(f.name << " shown in " << f.result_unit);
    Unit u;
    UnitError err;
    REQUIRE(parseUnit(std::string(f.result_unit) + (f.result_per_revolution ? "/rev" : ""), &u, &err));
    const Dimension want = f.result_per_revolution ? f.result / Dimension::of(Base::Angle) : f.result;
    CHECK(u.dim == want);
  }
}

TEST_CASE("a US customary sheet shows US units where none is declared", "[units][preferences]") {
  auto c = calc(kClamp);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->sheet.units.system() == UnitSystem::US);
  CHECK(shownUnit(*c, "p") == "in");
  CHECK(shownUnit(*c, "d_m") == "in");
  CHECK(shownUnit(*c, "l") == "in/rev");  // not 5.080 mm/rev
  CHECK(shownUnit(*c, "h") == "in");      // not 2.540 mm
  CHECK(shownUnit(*c, "T") == "lbf*in");
  CHECK(shownUnit(*c, "sig") == "psi");
  CHECK(shownUnit(*c, "P") == "hp");
  CHECK(shownUnit(*c, "v") == "in/min");
  CHECK(shownUnit(*c, "tpi") == "1/in");
  CHECK(shownUnit(*c, "eta") == "%");
  CHECK(shownUnit(*c, "alpha") == "deg");
  // The numbers are the same in any unit: the raise torque by hand (Shigley's
  // power-screw torque with the flank angle), d_m = 1.15 in, l = 0.2 in,
  // f = 0.15, alpha = 14.5 deg: T = F dm/2 (l + pi f dm sec a)/(pi dm - f l sec a).
  const double sec = 1 / std::cos(14.5 * M_PI / 180), dm = 1.15, l = 0.2, f = 0.15;
  const double t_lbf_in = 2000 * dm / 2 * (l + M_PI * f * dm * sec) / (M_PI * dm - f * l * sec);
  CHECK(si(*c, "T") == Approx(t_lbf_in * 4.4482216152605 * 0.0254).epsilon(1e-12));
}

TEST_CASE("the units line names units to prefer per dimension", "[units][preferences]") {
  auto c = calc(std::string(kClamp).replace(std::string(kClamp).find("units: US"), 9, "units: US, ksi, lbf*ft, in/s"));
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(shownUnit(*c, "sig") == "ksi");
  CHECK(shownUnit(*c, "T") == "lbf*ft");
  CHECK(shownUnit(*c, "v") == "in/s");
  CHECK(shownUnit(*c, "d_m") == "in");
}

TEST_CASE("an SI sheet shows an inch library result in mm", "[units][preferences]") {
  auto c = calc("units: SI\nd_m = acme_pitch_dia(1 in, 0.2 in)\nL = ball_screw_life(30 kN, 3 kN)\nF = 500 lbf\nG = F * 2\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(shownUnit(*c, "d_m") == "mm");
  CHECK(shownUnit(*c, "L") == "rev");  // neutral: neither system's
  CHECK(shownUnit(*c, "F") == "lbf");  // a literal stays as written
  CHECK(shownUnit(*c, "G") == "N");
}

TEST_CASE("the substitution lines of a US sheet never mix in and mm", "[units][preferences][report]") {
  const std::string dir = test::tempDir();
  test::writeFile(dir + "/clamp.calc", kClamp);
  for (const char* format : {"text", "md", "html", "json", "csv"}) {
    INFO(format);
    const test::Run r = test::runCli("report '" + dir + "/clamp.calc' --format " + format);
    REQUIRE(r.status == 0);
    CHECK(r.out.find(" mm") == std::string::npos);  // the stylesheet's 8mm is not a value
    CHECK(r.out.find("mm/rev") == std::string::npos);
    CHECK(r.out.find("MPa") == std::string::npos);
    CHECK(r.out.find("N·m") == std::string::npos);
    CHECK(r.out.find("N*m") == std::string::npos);
    CHECK(r.out.find("lbf") != std::string::npos);
  }
  const test::Run text = test::runCli("report '" + dir + "/clamp.calc'");
  CHECK(text.out.find("= 1.25 in - 0.2000 in / 2") != std::string::npos);
  CHECK(text.out.find("= 0.2000 in/rev") != std::string::npos);
}

TEST_CASE("fmt keeps the units line", "[units][preferences][fmt]") {
  const std::string dir = test::tempDir();
  test::writeFile(dir + "/clamp.calc", "units: US, ksi\nd = 1.25 in  # size\n");
  const test::Run r = test::runCli("fmt '" + dir + "/clamp.calc'");
  REQUIRE(r.status == 0);
  CHECK(r.out.find("units: US, ksi\n") == 0);
}

TEST_CASE("a units line that cannot be read is an error at its place", "[units][preferences][diagnostics]") {
  struct Bad {
    const char* line;
    int column;
    const char* words;
  };
  for (const Bad& b : {Bad{"units: metric", 8, "`metric` is not a system of units"},
                       Bad{"units:", 7, "needs a system"},
                       Bad{"units: US, ksi, MPa", 17, "`MPa` and `ksi` are both pressure or stress"},
                       Bad{"units: US, lbs", 12, "lbs"},
                       Bad{"units: US, %", 12, "every plain number"},
                       Bad{"units: SI, degC", 12, "temperature scale"},
                       Bad{"units: US,, in", 11, "empty item"}}) {
    INFO(b.line);
    auto c = calc(std::string(b.line) + "\nd = 2 in\n");
    REQUIRE(c->hasErrors());
    const std::string d = diagnostics(*c);
    CHECK(d.find(":1:" + std::to_string(b.column) + ": error: ") != std::string::npos);
    CHECK(d.find(b.words) != std::string::npos);
  }
  auto twice = calc("units: US\nunits: SI\n");
  CHECK(diagnostics(*twice).find("`units:` is given twice") != std::string::npos);
}

TEST_CASE("unit families and the US table", "[units][preferences]") {
  CHECK(unitFamily(parsed("in/rev")) == UnitFamily::US);
  CHECK(unitFamily(parsed("1/in")) == UnitFamily::US);
  CHECK(unitFamily(parsed("N*m")) == UnitFamily::SI);
  CHECK(unitFamily(parsed("kg*cm^2")) == UnitFamily::SI);
  CHECK(unitFamily(parsed("rev")) == UnitFamily::Neutral);
  CHECK(unitFamily(parsed("rpm")) == UnitFamily::Neutral);
  CHECK(unitFamily(parsed("%")) == UnitFamily::Neutral);
  CHECK(unitFamily(parsed("lbf*mm")) == UnitFamily::US);  // mixed: any US unit makes it US
  // Every row of the US table parses, has the dimension of its row, and is US.
  const std::vector<PreferenceRow> rows = preferenceTable();
  CHECK(rows.size() >= 15);
  for (const PreferenceRow& r : rows) {
    INFO(r.quantity << ": " << r.si << " / " << r.us);
    CHECK(parsed(r.us.c_str()).dim == parsed(r.si.c_str()).dim);
    CHECK(unitFamily(parsed(r.us.c_str())) == UnitFamily::US);
  }
}

TEST_CASE("an instance is shown with the preferences of the sheet that is run", "[units][preferences][template]") {
  const std::string dir = test::tempDir();
  test::writeFile(dir + "/half.calc", "units: SI\nparam d = 1 in\nh = d / 2  # half\n");
  test::writeFile(dir + "/top.calc", "units: US\nuse half.calc as a\nx = a.h * 2  # twice\n");
  const test::Run r = test::runCli("report '" + dir + "/top.calc'");
  REQUIRE(r.status == 0);
  CHECK(r.out.find("= 0.5000 in") != std::string::npos);  // a.h, in the running sheet's inches
  CHECK(r.out.find(" mm") == std::string::npos);
}

TEST_CASE("a US sheet substitutes inline arguments and nested calls in inches", "[units][preferences][report]") {
  const std::string dir = test::tempDir();
  test::writeFile(dir + "/inline.calc",
                  "units: US\n"
                  "d = 1.25 in  # size\n"
                  "p = 0.2 in  # pitch\n"
                  "T = torque_raise(100 lbf, d - p / 2, 0.2 [in/rev], 0.15, 14.5 deg)  # torque\n"
                  "h = trap_pitch_dia(30 mm, 6 mm) + 1 in  # a nested call\n");
  const test::Run r = test::runCli("report '" + dir + "/inline.calc'");
  REQUIRE(r.status == 0);
  // The argument d - p/2 = 1.15 in, before this shown as 29.21 mm.
  CHECK(r.out.find("= 100 lbf · 1.150 in / 2 ·") != std::string::npos);
  // A nested call of a metric table, in the US sheet's unit: 27 mm = 1.063 in.
  CHECK(r.out.find("where trap_pitch_dia(30 mm, 6 mm) = 30 mm - 6 mm / 2 = 1.063 in") != std::string::npos);
}
