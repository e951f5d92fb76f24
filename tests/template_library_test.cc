// The template library (worksheets/templates/): each template runs on its
// own and gives values derived here independently of the drive library's
// formulas: the frictionless limit T = F*l/(2*pi), the friction-angle form
// of the raise and lower torques, published thread dimensions, Euler's
// column. And the demo that uses one template twice.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::unique_ptr<Calculation> library(const std::string& name, const std::vector<std::string>& sets) {
  CalcOptions options;
  options.sets = sets;
  auto c = Calculation::fromFile(repoPath("worksheets/templates/" + name), options);
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  return c;
}

}  // namespace

TEST_CASE("trapezoidal screw stage: thread of the series, frictionless limit, friction-angle form",
          "[template][library]") {
  // Tr 40x7 (ISO 2904 / DIN 103 tables): pitch 7, d2 = 36.5 mm, d3 = 32 mm.
  auto c = library("trapezoidal-screw-stage.calc", {"F=20 kN"});
  CHECK(si(*c, "p") == Approx(0.007));
  CHECK(si(*c, "d_m") == Approx(0.0365));
  CHECK(si(*c, "d_r") == Approx(0.032));
  // The friction-angle form (Shigley, Sec. 8-2, rewritten with tan(phi) = f/cos(alpha)):
  // T_raise = F*dm/2 * tan(lambda + phi), T_lower = F*dm/2 * tan(phi - lambda).
  const double F = 20000, dm = 0.0365, l = 0.007, alpha = 15 * M_PI / 180;
  const double lambda = std::atan(l / (M_PI * dm));
  const double phi = std::atan(0.12 / std::cos(alpha)), phi_low = std::atan(0.08 / std::cos(alpha));
  CHECK(si(*c, "T_thread") == Approx(F * dm / 2 * std::tan(lambda + phi)).epsilon(1e-12));
  CHECK(si(*c, "T_lower") == Approx(F * dm / 2 * std::tan(phi_low - lambda)).epsilon(1e-12));
  CHECK(si(*c, "T_collar") == Approx(F * 0.10 * 0.060 / 2));
  CHECK(si(*c, "T_raise") == Approx(F * dm / 2 * std::tan(lambda + phi) + F * 0.10 * 0.030).epsilon(1e-12));
  CHECK(si(*c, "sigma_a") == Approx(F / (M_PI * 0.032 * 0.032 / 4)));
  CHECK(si(*c, "P") == Approx(si(*c, "T_raise") * 2 * M_PI));  // 60 rpm is 2*pi rad/s

  // Raise minus lower at one friction: F*dm/2 * (tan(lambda + phi) - tan(phi - lambda)).
  auto same = library("trapezoidal-screw-stage.calc", {"F=20 kN", "f_low=0.12"});
  CHECK(si(*same, "T_thread") - si(*same, "T_lower") ==
        Approx(F * dm / 2 * (std::tan(lambda + phi) - std::tan(phi - lambda))).epsilon(1e-12));

  // A start from rest: the thread at a starting friction, the collar an annular washer under
  // uniform pressure, Tc = F*fc*(Do^3 - Di^3)/(3*(Do^2 - Di^2)) (Shigley, Sec. 8-2, from memory);
  // the efficiency stays the running one.
  auto start = library("trapezoidal-screw-stage.calc",
                       {"F=20 kN", "f_start=0.16", "T_collar=collar_torque_uniform_pressure(F, f_c, 80 mm, 50 mm)"});
  const double phi_start = std::atan(0.16 / std::cos(alpha));
  CHECK(si(*start, "T_thread") == Approx(F * dm / 2 * std::tan(lambda + phi_start)).epsilon(1e-12));
  const double Do = 0.080, Di = 0.050;
  CHECK(si(*start, "T_collar") ==
        Approx(F * 0.10 * (Do * Do * Do - Di * Di * Di) / (3 * (Do * Do - Di * Di))).epsilon(1e-12));
  CHECK(si(*start, "tau") > si(*c, "tau"));  // the torsion of the breakaway torque
  // The efficiency is work out over work in per turn at the running friction, whatever the
  // collar: F*l / (2*pi*(F*dm/2*tan(lambda + phi) + T_collar)).
  CHECK(si(*c, "eta") == Approx(F * l / (2 * M_PI * (F * dm / 2 * std::tan(lambda + phi) + F * 0.10 * 0.030)))
                             .epsilon(1e-12));
  const double Tc_start = F * 0.10 * (Do * Do * Do - Di * Di * Di) / (3 * (Do * Do - Di * Di));
  CHECK(si(*start, "eta") ==
        Approx(F * l / (2 * M_PI * (F * dm / 2 * std::tan(lambda + phi) + Tc_start))).epsilon(1e-12));

  // A screw pulled while raising is a column only under its closing thrust F_col: a long
  // pinned column is Euler's, F_crit = pi^2*E*I/L^2 with I = pi*dr^4/64.
  auto pulled = library("trapezoidal-screw-stage.calc", {"F=20 kN", "F_col=5 kN", "L_col=3000 mm", "C_end=1"});
  const double I = M_PI * std::pow(0.032, 4) / 64;
  CHECK(si(*pulled, "n_buckle") == Approx(M_PI * M_PI * 210e9 * I / (3.0 * 3.0) / 5000).epsilon(1e-9));
  // The margin asked against yield is a parameter (3 by default).
  auto strict = library("trapezoidal-screw-stage.calc", {"F=20 kN", "n_yield_min=" + std::to_string(si(*c, "n_yield") + 0.1)});
  CHECK(si(*strict, "n_yield") == si(*c, "n_yield"));
  CHECK_FALSE(strict->checkResult(1).passed);
  CHECK(c->checkResult(1).passed);

  // Without friction the screw is a perfect wedge: T = F*l/(2*pi) both ways, efficiency 1.
  auto ideal = library("trapezoidal-screw-stage.calc", {"F=20 kN", "f=0", "f_low=0", "f_c=0"});
  CHECK(si(*ideal, "T_raise") == Approx(F * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "T_lower") == Approx(-F * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "eta") == Approx(1.0));
  CHECK(ideal->checkResult(0).passed == false);  // without friction nothing holds the load
}

TEST_CASE("Acme screw stage: the 1 in size, and the frictionless limit", "[template][library]") {
  // 1 in Acme, general purpose (ASME B1.5): 5 threads per inch, dm = d - p/2, dr = d - p.
  auto c = library("acme-screw-stage.calc", {"F=3000 lbf"});
  const double in = 0.0254;
  CHECK(si(*c, "p") == Approx(0.2 * in));
  CHECK(si(*c, "d_m") == Approx(0.9 * in));
  CHECK(si(*c, "d_r") == Approx(0.8 * in));
  const double F = 3000 * 4.4482216152605, l = 0.2 * in;
  // Self-locking margin f - tan(lambda)*cos(alpha) (the sign of torque_lower, from the friction-angle
  // form), and the threads that spread F over flanks of depth p/2 at p_allow = 2500 psi.
  const double dm = 0.9 * in, alpha = 14.5 * M_PI / 180, psi = 4.4482216152605 / (in * in);
  CHECK(si(*c, "margin") == Approx(0.10 - l / (M_PI * dm) * std::cos(alpha)).epsilon(1e-12));
  CHECK(si(*c, "n_needed") == Approx(F / (M_PI * dm * (0.2 * in / 2) * 2500 * psi)).epsilon(1e-12));
  auto ideal = library("acme-screw-stage.calc", {"F=3000 lbf", "f=0", "f_c=0", "f_low=0"});
  CHECK(si(*ideal, "T_raise") == Approx(F * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "eta") == Approx(1.0));
}

TEST_CASE("worm reducer, motor choice and column check templates", "[template][library]") {
  auto w = library("worm-reducer.calc", {"T_out=100 [N*m]", "f=0"});
  CHECK(si(*w, "eta") == Approx(1.0));  // no friction, no loss
  CHECK(si(*w, "T_in") == Approx(100.0 / 20));
  CHECK(si(*w, "n_out") == Approx(1450.0 / 20 * 2 * M_PI / 60));

  auto m = library("motor-choice.calc", {"T_screw=40 [N*m]", "screws=2", "i=10", "eta_drive=0.8"});
  CHECK(si(*m, "T_motor") == Approx(40.0 * 2 / (10 * 0.8)));
  CHECK(si(*m, "P_motor") == Approx(40.0 * 2 / (10 * 0.8) * 1450 * 2 * M_PI / 60));
  CHECK(si(*m, "P_rated") >= si(*m, "P_needed"));

  // A long column is Euler's: F_crit = C*pi^2*E*I/L^2, I = pi*dr^4/64.
  auto col = library("column-check.calc", {"F=5 kN", "d_r=20 mm", "L=2000 mm", "C_end=1"});
  const double I = M_PI * std::pow(0.020, 4) / 64;
  CHECK(si(*col, "s_ratio") > si(*col, "s_transition"));
  CHECK(si(*col, "F_crit") == Approx(1 * M_PI * M_PI * 210e9 * I / (2.0 * 2.0)).epsilon(1e-9));
  CHECK(si(*col, "n_buckle") == Approx(si(*col, "F_crit") / 5000));
}

namespace {

// A duty of two different steps, so that the cubic mean, the mean speed and
// the top speed each differ from a single step's value.
const std::vector<std::string> kBallScrewAxis = {
    "F_1=4000 N", "n_1=300 rpm", "q_1=0.25", "F_2=1000 N", "n_2=600 rpm", "q_2=0.5", "F_max=6 kN",
    "d_0=32 mm", "d_r=27.2 mm", "l=10 [mm/rev]", "C_a=30 kN", "C_0a=60 kN", "R=95 %", "L=1200 mm",
    "i=2", "eta_rb=0.95", "T_brake_rated=20 [N*m]"};

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

// The axis with some of its values replaced (--set refuses a name given twice).
std::vector<std::string> axisWith(const std::vector<std::string>& changes) {
  std::vector<std::string> sets = kBallScrewAxis;
  for (const std::string& change : changes) {
    const std::string name = change.substr(0, change.find('='));
    auto same = std::find_if(sets.begin(), sets.end(), [&](const std::string& s) { return s.rfind(name + "=", 0) == 0; });
    if (same != sets.end()) *same = change;
    else sets.push_back(change);
  }
  return sets;
}

std::string setArgs(const std::vector<std::string>& sets) {
  std::string args;
  for (const std::string& s : sets) args += " --set '" + s + "'";
  return args;
}

}  // namespace

TEST_CASE("ball screw stage: torques, life, speeds and brake against a hand derivation", "[template][library]") {
  auto c = library("ball-screw-stage.calc", kBallScrewAxis);
  const double F1 = 4000, n1 = 300, q1 = 0.25, F2 = 1000, n2 = 600, q2 = 0.5;  // N, rpm
  const double l = 0.010, d0 = 0.032, dr = 0.0272, Ca = 30000, L = 1.2, rpm = 2 * M_PI / 60;
  // Energy balance over one turn: T*2*pi*eta = F*l.
  const double T_pre = 0.05 / std::sqrt(l / (M_PI * d0)) * (0.03 * Ca) * l / (2 * M_PI);  // makers' estimate
  CHECK(si(*c, "T_pre") == Approx(T_pre).epsilon(1e-12));
  CHECK(si(*c, "T_drive") == Approx(F1 * l / (2 * M_PI * 0.9) + T_pre).epsilon(1e-12));
  const double T_back = F1 * l * 0.9 / (2 * M_PI);
  CHECK(si(*c, "T_back") == Approx(T_back).epsilon(1e-12));
  // The brake holds the back-driving torque through the 2:1 reduction driven backwards, times 2.
  CHECK(si(*c, "T_brake") == Approx(2 * T_back * 0.95 / 2).epsilon(1e-12));
  CHECK(si(*c, "n_static") == Approx(60000.0 / 6000));
  // ISO 3408-5 (from memory): Fm is the cube root of sum F^3*n*q over sum n*q, the
  // adjusted life a1*(Ca/(fw*Fm))^3 million revolutions, a1 = 0.62 at 95 %.
  const double Fm = std::cbrt((F1 * F1 * F1 * n1 * q1 + F2 * F2 * F2 * n2 * q2) / (n1 * q1 + n2 * q2));
  CHECK(si(*c, "F_m") == Approx(Fm).epsilon(1e-12));
  CHECK(si(*c, "a_1") == Approx(0.62));
  const double revs = 0.62 * std::pow(Ca / (1.2 * Fm), 3) * 1e6;
  const double n_m = n1 * q1 + n2 * q2;
  CHECK(si(*c, "n_m") == Approx(n_m * rpm).epsilon(1e-12));
  CHECK(si(*c, "L_rev") == Approx(revs * 2 * M_PI).epsilon(1e-12));
  CHECK(si(*c, "L_h") == Approx(revs / n_m * 60).epsilon(1e-12));  // seconds
  CHECK(si(*c, "L_km") == Approx(revs * l).epsilon(1e-12));
  // First bending mode of a uniform shaft (Euler-Bernoulli beam, fixed-supported eigenvalue
  // 3.927): omega = lambda^2/L^2 * sqrt(E*I/(rho*A)) with I = pi*dr^4/64, A = pi*dr^2/4.
  const double I = M_PI * std::pow(dr, 4) / 64, A = M_PI * dr * dr / 4;
  CHECK(si(*c, "n_crit") == Approx(3.927 * 3.927 / (L * L) * std::sqrt(206e9 * I / (7850 * A))).epsilon(1e-12));
  CHECK(si(*c, "n_dn") == Approx(70000.0 / 32 * rpm).epsilon(1e-12));  // d*n in mm*rpm
  CHECK(si(*c, "n_top") == Approx(n2 * rpm));
  CHECK(c->allChecksPass());

  // Without losses the screw is a perfect wedge: T = F*l/(2*pi) both ways.
  auto ideal = library("ball-screw-stage.calc", axisWith({"eta=1", "eta_b=1"}));
  CHECK(si(*ideal, "T_drive") - si(*ideal, "T_pre") == Approx(F1 * l / (2 * M_PI)).epsilon(1e-12));
  CHECK(si(*ideal, "T_back") == Approx(F1 * l / (2 * M_PI)).epsilon(1e-12));

  // The basic rating life's definition (ISO 3408-5): at the rated load, 90 % reliability and
  // fw = 1 a screw makes one million revolutions.
  auto rated = library("ball-screw-stage.calc", axisWith({"F_1=30 kN", "F_2=30 kN", "R=90 %", "f_w=1"}));
  CHECK(si(*rated, "L_rev") == Approx(1e6 * 2 * M_PI).epsilon(1e-12));
  CHECK(si(*rated, "L_km") == Approx(1e6 * l).epsilon(1e-12));
}

TEST_CASE("ball screw stage runs on its own: check and report with its defaults", "[template][library]") {
  Run ok = runCli("check worksheets/templates/ball-screw-stage.calc" + setArgs(kBallScrewAxis));
  INFO(ok.out << ok.err);
  CHECK(ok.status == 0);
  Run report = runCli("report worksheets/templates/ball-screw-stage.calc --format json" + setArgs(kBallScrewAxis));
  CHECK(report.status == 0);
  CHECK(contains(report.out, "\"name\": \"L_h\""));
  // Only the parameters no default can stand for are required; each is named.
  Run bare = runCli("check worksheets/templates/ball-screw-stage.calc");
  CHECK(bare.status == 2);
  for (const char* name : {"F_1", "n_1", "d_0", "d_r", "l", "C_a", "C_0a", "L", "T_brake_rated"})
    CHECK(contains(bare.err, std::string("the parameter `") + name + "` has no default"));
  CHECK(count(bare.err, "has no default") == 9);
  // A brake too small for the load fails its check, and only that one.
  Run fails = runCli("check worksheets/templates/ball-screw-stage.calc" + setArgs(axisWith({"T_brake_rated=5 [N*m]"})));
  CHECK(fails.status == 1);
  CHECK(contains(fails.out, "error: check `brake` fails"));
  CHECK(count(fails.out, "error: check `") == 1);
}

TEST_CASE("templates of templates: the twin-screw drive uses the screw stage twice", "[template][library]") {
  auto c = library("twin-screw-drive.calc", {"F_total=50 kN", "share=0.6"});
  auto first = library("trapezoidal-screw-stage.calc", {"F=30 kN"});
  auto second = library("trapezoidal-screw-stage.calc", {"F=20 kN"});
  CHECK(si(*c, "first.T_raise") == Approx(si(*first, "T_raise")).epsilon(1e-15));
  CHECK(si(*c, "second.T_raise") == Approx(si(*second, "T_raise")).epsilon(1e-15));
  CHECK(si(*c, "T_out") == Approx(si(*first, "T_raise") + si(*second, "T_raise")));
  CHECK(si(*c, "reducer.n_in") == Approx(60.0 * 20 * 2 * M_PI / 60));
  CHECK(si(*c, "motor.T_screw") == Approx(si(*c, "reducer.T_in")));
}

TEST_CASE("the platform-lift demo uses one template twice with different bindings", "[template][library]") {
  auto c = Calculation::fromFile(repoPath("worksheets/platform-lift.calc"));
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->allChecksPass());
  const double F_total = (1800 + 1500) * 9.80665;
  CHECK(si(*c, "heavy.F") == Approx(F_total * 0.62));
  CHECK(si(*c, "light.F") == Approx(F_total * 0.38));
  CHECK(si(*c, "heavy.d") == Approx(0.044));
  CHECK(si(*c, "light.d") == Approx(0.040));
  // The same template with the same inputs gives the same numbers on its own.
  auto alone = library("trapezoidal-screw-stage.calc",
                       {"F=" + std::to_string(F_total * 0.62) + " N", "d=44 mm", "L_col=800 mm"});
  CHECK(si(*c, "heavy.n_buckle") == Approx(si(*alone, "n_buckle")).epsilon(1e-12));
  REQUIRE(c->sheet.files.size() == 3);
  CHECK(c->sheet.files[1].path == "templates/trapezoidal-screw-stage.calc");
  CHECK(c->sheet.files[2].path == "templates/motor-choice.calc");
}
