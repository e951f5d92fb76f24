// Thread series and basic dimensions against ASME B1.5 and ISO 2904 / DIN 103
// table rows (from memory), and against the geometry of the basic profile.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>
#include <vector>

#include "tests/function_calls.h"
#include "functions/series_tables.h"
#include "functions/function_decl.h"

namespace {

using calctrail::DomainError;
using calctrail::FunctionDecl;
using calctrail::findFunction;

constexpr double kPi = 3.14159265358979323846;
constexpr double mm = 1e-3;
constexpr double in = 0.0254;  // exact (NIST SP 811)
constexpr double deg = kPi / 180;
constexpr double arcmin = deg / 60;

using calctrail::test::call;
using calctrail::test::errorOf;

}  // namespace

TEST_CASE("acme_tpi: ASME B1.5 general-purpose series, every row (from memory)", "[functions][threads]") {
  // Nominal size in inches and threads per inch, as the standard's table lists them.
  const struct {
    double d, tpi;
  } rows[] = {{0.25, 16},  {0.3125, 14}, {0.375, 12}, {0.4375, 12}, {0.5, 10}, {0.625, 8},  {0.75, 6},  {0.875, 6},
              {1.0, 5},    {1.125, 5},   {1.25, 5},   {1.375, 4},   {1.5, 4},  {1.75, 4},   {2.0, 4},   {2.25, 3},
              {2.5, 3},    {2.75, 3},    {3.0, 2},    {3.5, 2},     {4.0, 2},  {4.5, 2},    {5.0, 2}};
  for (const auto& r : rows) {
    INFO("size " << r.d << " in");
    CHECK(call("acme_tpi", {r.d * in}) == Approx(r.tpi / in).epsilon(1e-12));
  }
}

TEST_CASE("acme_tpi: the rows 1/4-16 to 7/8-6 as a published class 2G data sheet lists them", "[functions][threads]") {
  // Lew Merrick's Acme Thread Data Sheets (2009) list the general-purpose sizes .2500-16, .3125-14, .3750-12,
  // .4375-12, .5000-10, .6250-8, .7500-6 and .8750-6 before the inch sizes.
  const double rows[][2] = {{0.25, 16}, {0.3125, 14}, {0.375, 12}, {0.4375, 12},
                            {0.5, 10},  {0.625, 8},   {0.75, 6},   {0.875, 6}};
  for (const auto& r : rows) {
    INFO("size " << r[0] << " in");
    CHECK(call("acme_tpi", {r[0] * in}) * in == Approx(r[1]).epsilon(1e-12));
  }
}

// A second published source for the series: Shigley's Mechanical Engineering Design (Budynas and Nisbett, 9th ed.),
// Table 8-3, "Preferred Pitches for Acme Threads", p. 414: fourteen sizes 1/4 to 3 in with their pitches.
TEST_CASE("acme_tpi: the fourteen sizes of Shigley's Table 8-3, preferred pitches for Acme threads (9th ed., p. 414)",
          "[functions][threads]") {
  const struct {
    double d_in, p_in;
  } rows[] = {{0.25, 1.0 / 16}, {0.3125, 1.0 / 14}, {0.375, 1.0 / 12}, {0.5, 1.0 / 10}, {0.625, 1.0 / 8},
              {0.75, 1.0 / 6},  {0.875, 1.0 / 6},   {1.0, 1.0 / 5},    {1.25, 1.0 / 5}, {1.5, 1.0 / 4},
              {1.75, 1.0 / 4},  {2.0, 1.0 / 4},     {2.5, 1.0 / 3},    {3.0, 1.0 / 2}};
  for (const auto& r : rows) {
    INFO(r.d_in << " in");
    CHECK(call("acme_pitch", {r.d_in * in}) == Approx(r.p_in * in));
    CHECK(call("acme_tpi", {r.d_in * in}) * in == Approx(1 / r.p_in));
  }
}

TEST_CASE("acme_tpi: a size given in mm finds the same row (unit-system swap)", "[functions][threads]") {
  CHECK(call("acme_tpi", {25.4 * mm}) == Approx(call("acme_tpi", {1.0 * in})));
  CHECK(call("acme_tpi", {38.1 * mm}) == Approx(4 / in));  // 1-1/2 in
}

TEST_CASE("acme_tpi: a size outside the series names the nearest sizes", "[functions][threads][limits]") {
  const std::string msg = errorOf("acme_tpi", {1.3 * in});
  CHECK_THAT(msg, Catch::Contains("not a size of the ASME B1.5"));
  CHECK_THAT(msg, Catch::Contains("1-1/4 in and 1-3/8 in"));
  CHECK_THAT(errorOf("acme_tpi", {0.2 * in}), Catch::Contains("the smallest is 1/4 in"));
  CHECK_THAT(errorOf("acme_tpi", {6 * in}), Catch::Contains("the largest is 5 in"));
  CHECK_THAT(errorOf("acme_tpi", {-1 * in}), Catch::Contains("must be > 0"));
  try {
    call("acme_tpi", {1.3 * in});
  } catch (const DomainError& e) {
    CHECK(e.arg() == 0);
  }
}

TEST_CASE("acme_pitch: ASME B1.5 1-5 and 2-1/2-3 rows (from memory)", "[functions][threads]") {
  CHECK(call("acme_pitch", {1.0 * in}) == Approx(0.2 * in));
  CHECK(call("acme_pitch", {2.5 * in}) == Approx(in / 3));
  // Independent: pitch times threads per inch is one inch for every size.
  for (double d : {0.25, 0.625, 1.375, 3.0, 5.0})
    CHECK(call("acme_pitch", {d * in}) * call("acme_tpi", {d * in}) == Approx(1.0));
}

TEST_CASE("acme_pitch_dia: ASME B1.5 basic pitch diameter, 1-5 and 2-4 (from memory)", "[functions][threads]") {
  CHECK(call("acme_pitch_dia", {1.0 * in, 0.2 * in}) == Approx(0.9 * in));
  CHECK(call("acme_pitch_dia", {2.0 * in, 0.25 * in}) == Approx(1.875 * in));
}

TEST_CASE("acme_pitch_dia with lead_angle: ASME B1.5 lead angles 1/4-16 5 deg 12 min, 1-5 4 deg 3 min (from memory)",
          "[functions][threads]") {
  // The standard tabulates the lead angle of single-start threads at the basic pitch diameter.
  const double p1 = call("acme_pitch", {0.25 * in});
  const double lam1 = call("lead_angle", {call("acme_pitch_dia", {0.25 * in, p1}), p1});
  CHECK(std::fabs(lam1 - (5 * deg + 12 * arcmin)) < 0.5 * arcmin);
  const double p2 = call("acme_pitch", {1.0 * in});
  const double lam2 = call("lead_angle", {call("acme_pitch_dia", {1.0 * in, p2}), p2});
  CHECK(std::fabs(lam2 - (4 * deg + 3 * arcmin)) < 0.5 * arcmin);
}

TEST_CASE("acme_minor_dia: ASME B1.5 basic minor diameter, 1-5 (from memory)", "[functions][threads]") {
  CHECK(call("acme_minor_dia", {1.0 * in, 0.2 * in}) == Approx(0.8 * in));
  // Independent: the basic profile is symmetric about the pitch line (depth p/2 each side).
  const double d = 1.75 * in, p = 0.25 * in;
  CHECK(call("acme_minor_dia", {d, p}) == Approx(2 * call("acme_pitch_dia", {d, p}) - d));
}

TEST_CASE("acme_minor_dia: a pitch not below the diameter is an error", "[functions][threads][limits]") {
  CHECK_THAT(errorOf("acme_minor_dia", {0.25 * in, 0.3 * in}),
             Catch::Contains("argument 2 (pitch p) = 7.62 mm must be smaller than argument 1 (major diameter d) = "
                             "6.35 mm of an Acme thread"));
}

TEST_CASE("acme_flank_angle: ASME B1.5 29 deg included angle", "[functions][threads]") {
  CHECK(call("acme_flank_angle", {}) == Approx(14.5 * deg));
  CHECK(2 * call("acme_flank_angle", {}) == Approx(29 * deg));  // independent: twice the flank angle
}

TEST_CASE("trap_pitch: ISO 2904 / DIN 103 preferred pitches, Tr 10x2, 20x4, 40x7, 100x12, 300x24 (from memory)",
          "[functions][threads]") {
  CHECK(call("trap_pitch", {10 * mm}) == Approx(2 * mm));
  CHECK(call("trap_pitch", {20 * mm}) == Approx(4 * mm));
  CHECK(call("trap_pitch", {40 * mm}) == Approx(7 * mm));
  CHECK(call("trap_pitch", {100 * mm}) == Approx(12 * mm));
  CHECK(call("trap_pitch", {300 * mm}) == Approx(24 * mm));
  // Unit-system swap: a diameter written in inches that is exactly 25.4 mm is no series size.
  CHECK_THAT(errorOf("trap_pitch", {1 * in}), Catch::Contains("24 mm and 26 mm"));
}

// The series against a published reprint of the ISO 2904 diameter-pitch combinations: F-M-S (www.f-m-s.dk),
// "ISO Trapezoidal screw threads Tr", sheet 3.11 2007/1, page 1 (scribd 415160259), columns coarse, normal, fine;
// the rows 8 to 20 mm print two pitches (normal, fine) or one (8 mm). trap_pitch gives the normal pitch, and
// every pitch of a row is an ISO 2904 pitch that trap_pitch_dia accepts. The reprint's 11 mm row reads "3 2 2"
// (a doubled 2); its 105, 115, 125, ... 195 mm rows are diameters trap_pitch does not hold.
TEST_CASE("trap_pitch: every diameter of the series against a published reprint of ISO 2904's combinations",
          "[functions][threads]") {
  const struct {
    double d, coarse, normal, fine;
  } rows[] = {{8, 0, 1.5, 0},     {9, 0, 2, 1.5},     {10, 0, 2, 1.5},    {11, 0, 3, 2},      {12, 0, 3, 2},
              {14, 0, 3, 2},      {16, 0, 4, 2},      {18, 0, 4, 2},      {20, 0, 4, 2},      {22, 8, 5, 3},
              {24, 8, 5, 3},      {26, 8, 5, 3},      {28, 8, 5, 3},      {30, 10, 6, 3},     {32, 10, 6, 3},
              {34, 10, 6, 3},     {36, 10, 6, 3},     {38, 10, 7, 3},     {40, 10, 7, 3},     {42, 10, 7, 3},
              {44, 12, 7, 3},     {46, 12, 8, 3},     {48, 12, 8, 3},     {50, 12, 8, 3},     {52, 12, 8, 3},
              {55, 14, 9, 3},     {60, 14, 9, 3},     {65, 16, 10, 4},    {70, 16, 10, 4},    {75, 16, 10, 4},
              {80, 16, 10, 4},    {85, 18, 12, 4},    {90, 18, 12, 4},    {95, 18, 12, 4},    {100, 20, 12, 4},
              {110, 20, 12, 4},   {120, 22, 14, 6},   {130, 22, 14, 6},   {140, 24, 14, 6},   {150, 24, 16, 6},
              {160, 28, 16, 6},   {170, 28, 16, 6},   {180, 28, 18, 8},   {190, 32, 18, 8},   {200, 32, 18, 8},
              {210, 36, 20, 8},   {220, 36, 20, 8},   {230, 36, 20, 8},   {240, 36, 22, 8},   {250, 40, 22, 12},
              {260, 40, 22, 12},  {270, 40, 24, 12},  {280, 40, 24, 12},  {290, 44, 24, 12},  {300, 44, 24, 12}};
  for (const auto& r : rows) {
    INFO("Tr " << r.d);
    CHECK(call("trap_pitch", {r.d * mm}) == Approx(r.normal * mm));
    for (const double p : {r.coarse, r.fine})
      if (p > 0) CHECK(errorOf("trap_pitch_dia", {r.d * mm, p * mm}) == "(no error)");
  }
  // Independent: the diameters trap_pitch holds are exactly those rows (the probe of every whole millimetre).
  CHECK(calctrail::fn::trapezoidalDiameters().size() == std::size(rows));
}

TEST_CASE("trap_pitch: a diameter outside the series names the nearest sizes", "[functions][threads][limits]") {
  const std::string msg = errorOf("trap_pitch", {33 * mm});
  CHECK_THAT(msg, Catch::Contains("not a size of the ISO 2904"));
  CHECK_THAT(msg, Catch::Contains("32 mm and 34 mm"));
  CHECK_THAT(errorOf("trap_pitch", {6 * mm}), Catch::Contains("the smallest is 8 mm"));
  CHECK_THAT(errorOf("trap_pitch", {320 * mm}), Catch::Contains("the largest is 300 mm"));
}

TEST_CASE("trap_pitch_dia: DIN 103 basic pitch diameters, Tr 20x4 18.000 and Tr 40x7 36.500 (from memory)",
          "[functions][threads]") {
  CHECK(call("trap_pitch_dia", {20 * mm, 4 * mm}) == Approx(18.0 * mm));
  CHECK(call("trap_pitch_dia", {40 * mm, 7 * mm}) == Approx(36.5 * mm));
  // A finer pitch of the series is accepted: Tr 20x2.
  CHECK(call("trap_pitch_dia", {20 * mm, 2 * mm}) == Approx(19.0 * mm));
}

TEST_CASE("trap_minor_dia: DIN 103 screw minor diameters d3, Tr 8x1.5, 10x2, 20x4, 40x7, 100x12 (from memory)",
          "[functions][threads]") {
  CHECK(call("trap_minor_dia", {8 * mm, 1.5 * mm}) == Approx(6.2 * mm));
  CHECK(call("trap_minor_dia", {10 * mm, 2 * mm}) == Approx(7.5 * mm));
  CHECK(call("trap_minor_dia", {20 * mm, 4 * mm}) == Approx(15.5 * mm));
  CHECK(call("trap_minor_dia", {40 * mm, 7 * mm}) == Approx(32.0 * mm));
  CHECK(call("trap_minor_dia", {100 * mm, 12 * mm}) == Approx(87.0 * mm));
  CHECK(call("trap_minor_dia", {120 * mm, 14 * mm}) == Approx(104.0 * mm));
}

// Two published reprints of the ISO 2904 basic dimensions: RoyMech's table of ISO 2904:1977 (d2, D4, d3, D1;
// the rows its page prints legibly) and the d3 max column of the Engineers Edge class 7e table (the minor
// diameter is of position h, so its maximum is the basic d3).
TEST_CASE("trap_pitch_dia, trap_minor_dia, trap_nut_minor_dia, trap_nut_major_dia: two published reprints of the "
          "ISO 2904 table",
          "[functions][threads]") {
  const struct {
    double d, p, d2, D4, d3, D1;
  } roymech[] = {{8, 1.5, 7.25, 8.3, 6.2, 6.5}, {9, 1.5, 8.25, 9.3, 7.2, 7.5},  {10, 2, 9.0, 10.5, 7.5, 8.0},
                 {11, 2, 10.0, 11.5, 8.5, 9.0}, {11, 3, 9.5, 11.5, 7.5, 8.0},   {12, 2, 11.0, 12.5, 9.5, 10.0},
                 {12, 3, 10.5, 12.5, 8.5, 9.0}, {14, 2, 13.0, 14.5, 11.5, 12.0}, {14, 3, 12.5, 14.5, 10.5, 11.0},
                 {16, 2, 15.0, 16.5, 13.5, 14.0}, {42, 3, 40.5, 42.5, 38.5, 39.0}, {42, 7, 38.5, 43.0, 34.0, 35.0},
                 {44, 3, 42.5, 44.5, 40.5, 41.0}, {44, 7, 40.5, 45.0, 36.0, 37.0}, {44, 12, 38.0, 45.0, 31.0, 32.0},
                 {46, 3, 44.5, 46.5, 42.5, 43.0}, {46, 8, 42.0, 47.0, 37.0, 38.0}, {46, 12, 40.0, 47.0, 33.0, 34.0},
                 {48, 3, 46.5, 48.5, 44.5, 45.0}, {48, 8, 44.0, 49.0, 39.0, 40.0}};
  for (const auto& r : roymech) {
    INFO("Tr " << r.d << "x" << r.p);
    const std::vector<double> dp = {r.d * mm, r.p * mm};
    CHECK(call("trap_pitch_dia", dp) / mm == Approx(r.d2));
    CHECK(call("trap_nut_major_dia", dp) / mm == Approx(r.D4));
    CHECK(call("trap_minor_dia", dp) / mm == Approx(r.d3));
    CHECK(call("trap_nut_minor_dia", dp) / mm == Approx(r.D1));
  }
  const struct {
    double d, p, d3;
  } engineers_edge[] = {{8, 1.5, 6.2},  {9, 1.5, 7.2},  {9, 2, 6.5},    {10, 1.5, 8.2}, {10, 2, 7.5},
                        {11, 2, 8.5},   {11, 3, 7.5},   {12, 2, 9.5},    {12, 3, 8.5},   {14, 2, 11.5},
                        {14, 3, 10.5},  {16, 2, 13.5},  {16, 3, 12.5},   {16, 4, 11.5},  {18, 2, 15.5}};
  for (const auto& r : engineers_edge) {
    INFO("Tr " << r.d << "x" << r.p);
    CHECK(call("trap_minor_dia", {r.d * mm, r.p * mm}) / mm == Approx(r.d3));
  }
}

TEST_CASE("trap_minor_dia: below the basic minor diameter by twice the root clearance", "[functions][threads]") {
  // Independent: the root clearance ac is the only difference from the basic profile (d - p).
  CHECK(call("trap_minor_dia", {32 * mm, 6 * mm}) == Approx(32 * mm - 6 * mm - 2 * 0.5 * mm));
  CHECK(call("trap_minor_dia", {32 * mm, 6 * mm}) < 2 * call("trap_pitch_dia", {32 * mm, 6 * mm}) - 32 * mm);
}

TEST_CASE("trap_minor_dia: a pitch that is not an ISO 2904 pitch names the nearest pitches",
          "[functions][threads][limits]") {
  const std::string msg = errorOf("trap_minor_dia", {20 * mm, 4.5 * mm});
  CHECK_THAT(msg, Catch::Contains("not an ISO 2904 trapezoidal pitch"));
  CHECK_THAT(msg, Catch::Contains("nearest standard pitches: 4 mm and 5 mm"));
  CHECK_THAT(errorOf("trap_pitch_dia", {20 * mm, 4.5 * mm}), Catch::Contains("4 mm and 5 mm"));
}

TEST_CASE("trap_flank_angle: ISO 2904 30 deg included angle", "[functions][threads]") {
  CHECK(call("trap_flank_angle", {}) == Approx(15 * deg));
  CHECK(2 * call("trap_flank_angle", {}) == Approx(30 * deg));
}

TEST_CASE("square_pitch_dia and square_minor_dia: Shigley's Example 8-1, 32 mm x 4 mm (from memory)",
          "[functions][threads]") {
  // The worked example takes dm = 32 - 4/2 = 30 mm and dr = 32 - 4 = 28 mm.
  CHECK(call("square_pitch_dia", {32 * mm, 4 * mm}) == Approx(30 * mm));
  CHECK(call("square_minor_dia", {32 * mm, 4 * mm}) == Approx(28 * mm));
  // Independent: square and Acme basic profiles share the depth p/2.
  CHECK(call("square_minor_dia", {50 * mm, 8 * mm}) == Approx(call("acme_minor_dia", {50 * mm, 8 * mm})));
}

TEST_CASE("square_flank_angle: zero, so the torque formula reduces to the square-thread one (Shigley Ex. 8-1)",
          "[functions][threads]") {
  CHECK(call("square_flank_angle", {}) == 0.0);
  const double alpha = call("square_flank_angle", {});
  CHECK(call("torque_raise", {6400, 30 * mm, 8 * mm, 0.08, alpha}) == Approx(15.94).margin(0.005));
}

TEST_CASE("thread_lead: Shigley's Example 8-1, double thread of 4 mm pitch has an 8 mm lead (from memory)",
          "[functions][threads]") {
  CHECK(call("thread_lead", {4 * mm, 2}) == Approx(8 * mm));
  CHECK(call("thread_lead", {0.2 * in, 1}) == Approx(0.2 * in));  // independent: single start, lead = pitch
}

TEST_CASE("thread_lead: starts must be a whole number", "[functions][threads][limits]") {
  CHECK_THAT(errorOf("thread_lead", {4 * mm, 1.5}), Catch::Contains("number of starts = 1.5 must be a whole number"));
  CHECK_THAT(errorOf("thread_lead", {4 * mm, 0}), Catch::Contains("must be > 0"));
}

TEST_CASE("stub_acme_pitch_dia and stub_acme_minor_dia: ASME B1.8 basic height 0.3p, 1-5 gives 0.94 in and 0.88 in "
          "(from memory)",
          "[functions][threads]") {
  CHECK(call("stub_acme_pitch_dia", {1 * in, 0.2 * in}) / in == Approx(0.94));
  CHECK(call("stub_acme_minor_dia", {1 * in, 0.2 * in}) / in == Approx(0.88));
  // Independent: the stub thread is 0.6 of the general-purpose depth (0.3p against 0.5p) on either side.
  for (double d : {0.5, 1.25, 3.0}) {
    const double p = 1.0 / call("acme_tpi", {d * in});
    const double stub = d * in - call("stub_acme_minor_dia", {d * in, p});
    const double full = d * in - call("acme_minor_dia", {d * in, p});
    CHECK(stub / full == Approx(0.6));
  }
}

TEST_CASE("buttress_pitch_dia and buttress_minor_dia: ASME B1.9 7/45 deg form, 2-8 gives 1.925 in and 1.85 in "
          "(from memory)",
          "[functions][threads]") {
  CHECK(call("buttress_pitch_dia", {2 * in, in / 8}) / in == Approx(1.925));
  CHECK(call("buttress_minor_dia", {2 * in, in / 8}) / in == Approx(1.85));
  CHECK(call("buttress_flank_angle", {}) == Approx(7 * deg));
  // Independent: the profile from its flank angles. The sharp V of flanks at 7 and 45 deg has the height
  // H = p/(tan 7 + tan 45) = 0.89064p (the standard's figure); the pitch line, where thread and groove are
  // both p/2 wide, is H/2 below the sharp crest; the crest is truncated so that the basic height is 0.6p,
  // equally at crest and root: so the pitch line is H/2 - (H - 0.6p)/2 = 0.3p below the major diameter.
  const double p = in / 8;
  const double H = p / (std::tan(7 * deg) + std::tan(45 * deg));
  CHECK(H / p == Approx(0.89064).epsilon(1e-5));
  const double below_major = H / 2 - (H - 0.6 * p) / 2;
  CHECK(call("buttress_pitch_dia", {2 * in, p}) == Approx(2 * in - 2 * below_major));
  // Width at the pitch line by bisection on the profile: the thread is p/2 wide there.
  const auto width = [&](double depth_below_crest) { return depth_below_crest * (std::tan(7 * deg) + 1.0); };
  CHECK(width(H / 2) == Approx(p / 2));
  CHECK_THAT(errorOf("buttress_minor_dia", {2 * in, 1.8 * in}), Catch::Contains("leaves no minor diameter"));
}

TEST_CASE("trap_nut_minor_dia and trap_nut_major_dia: ISO 2904 Tr 40x7 D1 = 33, D4 = 41 mm, Tr 20x4 D1 = 16, "
          "D4 = 20.5 mm (from memory)",
          "[functions][threads]") {
  CHECK(call("trap_nut_minor_dia", {40 * mm, 7 * mm}) / mm == Approx(33));
  CHECK(call("trap_nut_major_dia", {40 * mm, 7 * mm}) / mm == Approx(41));
  CHECK(call("trap_nut_minor_dia", {20 * mm, 4 * mm}) / mm == Approx(16));
  CHECK(call("trap_nut_major_dia", {20 * mm, 4 * mm}) / mm == Approx(20.5));
  // Independent: screw and nut threads have the same depth H4 = h3 = p/2 + ac, so D4 - D1 = d - d3.
  for (double p : {2.0, 3.0, 7.0, 10.0, 16.0}) {
    const double d = 80 * mm;
    INFO("pitch " << p << " mm");
    CHECK(call("trap_nut_major_dia", {d, p * mm}) - call("trap_nut_minor_dia", {d, p * mm}) ==
          Approx(d - call("trap_minor_dia", {d, p * mm})));
  }
}

TEST_CASE("threads: a near miss of a size says how far off and the fix", "[functions][threads][limits]") {
  // 40.004 mm is within 1 % of 40 mm: printed with the digits that tell it apart, then the distance.
  CHECK(errorOf("trap_pitch", {40.004 * mm}) ==
        "nominal diameter d = 40.004 mm is not a size of the ISO 2904 trapezoidal series; it is 4 um above the "
        "size 40 mm; write `40 mm`");
  CHECK_THAT(errorOf("trap_pitch", {39.9 * mm}), Catch::Contains("d = 39.9 mm") &&
                                                    Catch::Contains("it is 100 um below the size 40 mm"));
  // Far from any size: the neighbours, as before.
  CHECK_THAT(errorOf("trap_pitch", {41 * mm}), Catch::Contains("nearest standard sizes: 40 mm and 42 mm"));
  // Never a value rounded onto a real size: 4 digits print 40.0011 as "40", 5 digits tell it apart.
  CHECK_THAT(errorOf("trap_pitch", {40.0011 * mm}), Catch::Contains("d = 40.001 mm is not a size"));
  CHECK_THAT(errorOf("acme_tpi", {1.0004 * in}),
             Catch::Contains("d = 1.0004 in (25.41 mm)") && Catch::Contains("it is 10.16 um above the size 1 in; "
                                                                             "write `1 in`"));
  CHECK_THAT(errorOf("trap_minor_dia", {40 * mm, 7.02 * mm}),
             Catch::Contains("pitch p = 7.02 mm/rev is not an ISO 2904 trapezoidal pitch; it is 20 um above the "
                             "pitch 7 mm; write `7 mm`"));
}

TEST_CASE("threads: swapped arguments are named by position and value, and the swap is suggested",
          "[functions][threads][limits]") {
  CHECK(errorOf("trap_pitch_dia", {7 * mm, 40 * mm}) ==
        "argument 2 (pitch p) = 40 mm must be smaller than argument 1 (major diameter d) = 7 mm of a trapezoidal "
        "thread; the two look swapped: trap_pitch_dia(d, p) takes the major diameter first, so write "
        "trap_pitch_dia(40 mm, 7 mm)");
  try {
    call("trap_pitch_dia", {7 * mm, 40 * mm});
  } catch (const DomainError& e) {
    CHECK(e.arg() == -1);  // the whole call, so the trail names both quantities
  }
  // A swap that would not satisfy the limits is not suggested: 41 mm is no ISO 2904 pitch.
  CHECK_THAT(errorOf("trap_pitch_dia", {41 * mm, 41 * mm}), !Catch::Contains("swapped"));
  CHECK_THAT(errorOf("trap_pitch_dia", {7.5 * mm, 41 * mm}), !Catch::Contains("swapped"));
  CHECK_THAT(errorOf("acme_pitch_dia", {0.2 * in, 1 * in}), Catch::Contains("of an Acme thread; the two look "
                                                                            "swapped"));
}

// Class 2G limits of the screw, against two published tables of ASME B1.5 class 2G external threads: a thread
// maker's (Dependable Acme, "Internal and external thread dimensions") and Lew Merrick's "Acme Thread Data
// Sheets" (2009). Both print 4 decimals, adding up allowances and tolerances rounded to 0.0001 in.
TEST_CASE("acme_max_pitch_dia, acme_min_pitch_dia, acme_min_minor_dia: published ASME B1.5 class 2G limits",
          "[functions][threads]") {
  const struct {
    double d, tpi, pd_max, pd_min, minor_min;
  } maker[] = {{0.375, 12, 0.3284, 0.3161, 0.2632}, {0.5, 10, 0.4443, 0.4306, 0.3594},
               {0.625, 8, 0.5562, 0.5408, 0.4570},  {0.75, 6, 0.6598, 0.6424, 0.5371},
               {0.875, 6, 0.7842, 0.7663, 0.6615},  {1.0, 5, 0.8920, 0.8726, 0.7509},
               {1.125, 5, 1.0165, 0.9967, 0.8753}};
  for (const auto& r : maker) {
    INFO(r.d << "-" << r.tpi << " Acme 2G");
    const std::vector<double> dp = {r.d * in, in / r.tpi};
    CHECK(call("acme_max_pitch_dia", dp) / in == Approx(r.pd_max).margin(1e-9));
    CHECK(call("acme_min_pitch_dia", dp) / in == Approx(r.pd_min).margin(1e-9));
    CHECK(call("acme_min_minor_dia", dp) / in == Approx(r.minor_min).margin(1e-9));
  }
  const struct {
    double d, tpi, minor_min;
  } sheets[] = {{0.3125, 14, 0.2140}, {0.375, 12, 0.2632}, {0.4375, 12, 0.3253}, {0.5, 10, 0.3594},
                {0.625, 8, 0.4570},   {0.75, 6, 0.5371},   {0.875, 6, 0.6615}};
  for (const auto& r : sheets) {
    INFO(r.d << "-" << r.tpi << " Acme 2G");
    CHECK(call("acme_min_minor_dia", {r.d * in, in / r.tpi}) / in == Approx(r.minor_min).margin(1e-9));
  }
  // 1/4-16: 1.5 times the tolerance 0.0105 in is 0.01575 in, a half that the data sheets round down (0.1618)
  // and this function rounds up (0.1617): the one row where the two differ, by the last digit.
  CHECK(call("acme_min_minor_dia", {0.25 * in, in / 16}) / in == Approx(0.1618).margin(1.0001e-4));
}

TEST_CASE("acme_min_minor_dia: the limits add up to the ASME B1.5 allowances, in mm as in inches",
          "[functions][threads]") {
  for (double d_in : {0.25, 0.4375, 0.5, 1.0, 2.0, 3.0, 5.0}) {
    INFO(d_in << " in");
    const double d = d_in * in, p = call("acme_pitch", {d});
    const double pd_basic = call("acme_pitch_dia", {d, p}), minor_basic = call("acme_minor_dia", {d, p});
    const double pd_max = call("acme_max_pitch_dia", {d, p}), pd_min = call("acme_min_pitch_dia", {d, p});
    const double minor_min = call("acme_min_minor_dia", {d, p});
    // Independent: the pitch diameter allowance 0.008*sqrt(D) and tolerance 0.006*sqrt(D) + 0.030*sqrt(p), the
    // root clearance 0.020 in for 10 tpi and coarser (0.010 in finer), the minor tolerance 1.5 times the pitch
    // diameter one: each within the 0.0001 in rounding of the tables.
    const double tol = 0.006 * std::sqrt(d_in) + 0.030 * std::sqrt(p / in);
    CHECK((pd_basic - pd_max) / in == Approx(0.008 * std::sqrt(d_in)).margin(1e-4));
    CHECK((pd_max - pd_min) / in == Approx(tol).margin(1e-4));
    const double clearance = p / in > 0.1 - 1e-9 ? 0.020 : 0.010;  // 10 tpi and coarser
    CHECK((minor_basic - minor_min) / in == Approx(clearance + 1.5 * tol).margin(1.5e-4));
    CHECK(minor_min < minor_basic);
    CHECK(pd_min < pd_max);
    CHECK(pd_max < pd_basic);
    // Unit-system swap: the size and pitch written in mm give the same limit.
    CHECK(call("acme_min_minor_dia", {d_in * 25.4 * mm, p / in * 25.4 * mm}) == Approx(minor_min).epsilon(1e-12));
  }
  // 10 tpi takes the 0.020 in clearance, 12 tpi the 0.010 in one: 1/2-10 max minor 0.38 in, 7/16-12 0.3442 in.
  CHECK((call("acme_minor_dia", {0.5 * in, in / 10}) - call("acme_min_minor_dia", {0.5 * in, in / 10})) / in ==
        Approx(0.020 + 0.0206).margin(1e-9));
}

TEST_CASE("acme_min_minor_dia: a size or pitch outside the series is an error", "[functions][threads][limits]") {
  CHECK(errorOf("acme_min_minor_dia", {1 * in, 0.25 * in}) ==
        "pitch p = 0.25 in (6.35 mm) is not the series pitch 0.2 in (5 threads per inch) of the 1 in size; the "
        "class 2G limits are held for the ASME B1.5 general-purpose combinations only (write acme_pitch(d) for "
        "the pitch)");
  CHECK_THAT(errorOf("acme_max_pitch_dia", {1.1 * in, 0.2 * in}),
             Catch::Contains("is not a size of the ASME B1.5 general-purpose Acme series"));
  CHECK_THAT(errorOf("acme_min_pitch_dia", {0.2 * in, 0.25 * in}), Catch::Contains("must be smaller than"));
}

// Class 7e limits of the screw, against the published table of ISO metric trapezoidal external threads, class 7e
// (Engineers Edge, "External ISO Metric Trapezoidal Screw Threads Table Chart Sizes TR8 - TR315"), printed to
// 0.001 mm; the lead-screw maker's table of the next test confirms the same es and Td2 on the rows both print.
TEST_CASE("trap_max_pitch_dia, trap_min_pitch_dia, trap_min_minor_dia: published ISO 2903 class 7e limits",
          "[functions][threads]") {
  const struct {
    double d, p, d2_max, d2_min, d3_min;
  } rows[] = {{8, 1.5, 7.183, 7.013, 5.921},   {9, 1.5, 8.183, 8.013, 6.921},   {9, 2, 7.929, 7.739, 6.191},
              {10, 1.5, 9.183, 9.013, 7.921},  {10, 2, 8.929, 8.739, 7.191},    {11, 2, 9.929, 9.739, 8.191},
              {11, 3, 9.415, 9.203, 7.150},    {12, 2, 10.929, 10.729, 9.179},  {12, 3, 10.415, 10.191, 8.135},
              {14, 2, 12.929, 12.729, 11.179}, {14, 3, 12.415, 12.191, 10.135}, {16, 2, 14.929, 14.729, 13.179},
              {16, 3, 14.415, 14.191, 12.135}, {16, 4, 13.905, 13.640, 11.074}, {18, 2, 16.929, 16.729, 15.179}};
  for (const auto& r : rows) {
    INFO("Tr " << r.d << "x" << r.p << " 7e");
    const std::vector<double> dp = {r.d * mm, r.p * mm};
    CHECK(call("trap_max_pitch_dia", dp) / mm == Approx(r.d2_max).margin(1e-9));
    CHECK(call("trap_min_pitch_dia", dp) / mm == Approx(r.d2_min).margin(1e-9));
    // Td3 = 1.25*Td2 + |es| comes to a half um for Tr 8x1.5 and 9x2 (279.5, 308.5 um), which the table rounds
    // one way and the other: 0.0005 mm and a hair.
    CHECK(call("trap_min_minor_dia", dp) / mm == Approx(r.d3_min).margin(5.0001e-4));
  }
}

TEST_CASE("trap_min_minor_dia: d3 is of position h, and Td3 = 1.25*Td2 + abs(es) (ISO 2903 clause 11.5)",
          "[functions][threads]") {
  for (const double d : {8.0, 11.2, 11.3, 16.0, 22.4, 22.5, 30.0, 45.0}) {
    for (const double p : {1.5, 2.0, 3.0, 4.0, 5.0}) {
      const std::vector<double> dp = {d * mm, p * mm};
      if (errorOf("trap_min_minor_dia", dp) != "(no error)") continue;
      INFO("Tr " << d << "x" << p);
      const double es = call("trap_max_pitch_dia", dp) - call("trap_pitch_dia", dp);
      const double td2 = call("trap_max_pitch_dia", dp) - call("trap_min_pitch_dia", dp);
      CHECK(es < 0);
      CHECK(call("trap_minor_dia", dp) - call("trap_min_minor_dia", dp) == Approx(1.25 * td2 - es));
    }
  }
  // 11.2 mm is the top of the lower diameter range ("up to and including"), 11.3 mm in the next: 190 and 200 um.
  CHECK((call("trap_max_pitch_dia", {11.2 * mm, 2 * mm}) - call("trap_min_pitch_dia", {11.2 * mm, 2 * mm})) / mm ==
        Approx(0.190));
  CHECK((call("trap_max_pitch_dia", {11.3 * mm, 2 * mm}) - call("trap_min_pitch_dia", {11.3 * mm, 2 * mm})) / mm ==
        Approx(0.200));
}

// Class 7e limits of the screw, against a lead-screw maker's table of trapezoidal screws (d tolerance 4h, d2 7e,
// d3 7h), printed to 0.001 mm: "Trapezoidal screw specifications", reprinted by its UK distributor
// (transdev.co.uk) and as "Trapezoidal screw nut technical catalogue" (scribd 468437809), the same table;
// single-start rows only (ISO 2903 widens Td2 of a multiple-start thread). Tr 10x3 and Tr 25x3, 25x5 are not
// ISO 2904 combinations; the tolerances depend on the diameter range and the pitch only.
TEST_CASE("trap_max_pitch_dia, trap_min_pitch_dia, trap_min_minor_dia: a lead-screw maker's 7e table, Tr 10x2 to "
          "Tr 25x5", "[functions][threads]") {
  const struct {
    double d, p, d2_min, d2_max, d3_min, d3_max;
  } rows[] = {{10, 2, 8.739, 8.929, 7.191, 7.500},     {10, 3, 8.203, 8.415, 6.150, 6.500},
              {12, 3, 10.191, 10.415, 8.135, 8.500},   {14, 3, 12.191, 12.415, 10.135, 10.500},
              {14, 4, 11.640, 11.905, 9.074, 9.500},   {16, 4, 13.640, 13.905, 11.074, 11.500},
              {18, 4, 15.640, 15.905, 13.074, 13.500}, {20, 4, 17.640, 17.905, 15.074, 15.500},
              {22, 5, 19.114, 19.394, 16.044, 16.500}, {24, 5, 21.094, 21.394, 18.019, 18.500},
              {25, 3, 23.165, 23.415, 21.103, 21.500}, {25, 5, 22.094, 22.394, 19.019, 19.500}};
  for (const auto& r : rows) {
    INFO("Tr " << r.d << "x" << r.p << " 7e");
    const std::vector<double> dp = {r.d * mm, r.p * mm};
    CHECK(call("trap_max_pitch_dia", dp) / mm == Approx(r.d2_max).margin(1e-9));
    CHECK(call("trap_min_pitch_dia", dp) / mm == Approx(r.d2_min).margin(1e-9));
    CHECK(call("trap_minor_dia", dp) / mm == Approx(r.d3_max).margin(1e-9));
    // Td3 = 1.25*Td2 + |es| comes to a half um on Tr 10x2 (308.5 um) and Tr 25x3 (397.5 um).
    CHECK(call("trap_min_minor_dia", dp) / mm == Approx(r.d3_min).margin(5.0001e-4));
  }
  // The 5 mm deviation from a second, independent table: the Engineers Edge table of large trapezoidal screws
  // ("External ISO Metric Trapezoidal Screw Threads Table Chart Sizes TR320 - TR1120") gives Tr 320x5 7e a
  // maximum d2 of 317.394 mm against the basic 317.500 mm; es depends on the pitch alone.
  CHECK((call("trap_max_pitch_dia", {24 * mm, 5 * mm}) - call("trap_pitch_dia", {24 * mm, 5 * mm})) / mm ==
        Approx(317.394 - 317.5).margin(1e-9));
}

// Independent of the tables: ISO 2903:2016 bases its tolerance system (clause 5) on ISO 965-1, whose deviation of
// position e is es = -(50 + 11*P) um (P in mm, from memory); rounded to the nearest number of the R40 series of
// preferred numbers (ISO 3) it gives every held deviation.
TEST_CASE("trap_max_pitch_dia: es of position e is -(50 + 11*P) um rounded to the R40 series",
          "[functions][threads]") {
  const double r40[] = {50, 53, 56, 60, 63, 67, 71, 75, 80, 85, 90, 95, 100, 106, 112, 118, 125};
  for (const double p : {1.5, 2.0, 3.0, 4.0, 5.0}) {
    INFO("P = " << p << " mm");
    const double raw = 50 + 11 * p;
    double nearest = r40[0];
    for (const double v : r40)
      if (std::fabs(v - raw) < std::fabs(nearest - raw)) nearest = v;
    const double d = p < 2.5 ? 10 : 20;  // a diameter whose range holds this pitch
    const std::vector<double> dp = {d * mm, p * mm};
    const double es = call("trap_max_pitch_dia", dp) - call("trap_pitch_dia", dp);
    CHECK(es / mm == Approx(-nearest * 1e-3).margin(1e-9));
  }
}

// Independent plausibility of every held Td2: ISO 965-1's grade 6 pitch diameter tolerance 90*P^0.4*d^0.1 um (P in
// mm, d the geometric mean of the diameter range; from memory), times 1.25 for grade 7, lies within one step of
// the R40 series (a factor 10^(1/40)) of each held value. It is no derivation of ISO 2903's table (it misses
// 170, 190 and 224 um by about a step), but it catches a slip of a digit in any cell.
TEST_CASE("trap_min_pitch_dia: every held Td2 within one R40 step of ISO 965-1's grade 7 formula",
          "[functions][threads]") {
  const struct {
    double d_over, d_upto, d, p;
  } cells[] = {{5.6, 11.2, 10, 1.5}, {5.6, 11.2, 10, 2}, {5.6, 11.2, 10, 3}, {11.2, 22.4, 20, 2},
               {11.2, 22.4, 20, 3},  {11.2, 22.4, 20, 4}, {11.2, 22.4, 22, 5}, {22.4, 45, 30, 3},
               {22.4, 45, 30, 5}};
  for (const auto& c : cells) {
    INFO("Tr " << c.d << "x" << c.p);
    const std::vector<double> dp = {c.d * mm, c.p * mm};
    const double td2_um = (call("trap_max_pitch_dia", dp) - call("trap_min_pitch_dia", dp)) / mm * 1e3;
    const double formula_um = 1.25 * 90 * std::pow(c.p, 0.4) * std::pow(std::sqrt(c.d_over * c.d_upto), 0.1);
    CHECK(std::fabs(std::log(td2_um / formula_um)) <= std::log(10.0) / 40);
  }
}

TEST_CASE("trap_min_minor_dia: a size whose 7e values are not held is an error that says which are",
          "[functions][threads][limits]") {
  const std::string held =
      "are not held here: they are held for d over 5.6 up to 11.2 mm with p = 1.5, 2 and 3 mm, over 11.2 up to "
      "22.4 mm with p = 2, 3, 4 and 5 mm and over 22.4 up to 45 mm with p = 3 and 5 mm";
  CHECK_THAT(errorOf("trap_min_minor_dia", {40 * mm, 7 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_min_minor_dia", {22.5 * mm, 4 * mm}), Catch::Contains(held));
  // The 5 mm pitch is held up to 45 mm and no further; 6 mm and above are not held at all.
  CHECK_THAT(errorOf("trap_min_minor_dia", {46 * mm, 5 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_max_pitch_dia", {30 * mm, 6 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_min_pitch_dia", {100 * mm, 12 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_min_pitch_dia", {8 * mm, 5 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_max_pitch_dia", {10 * mm, 4 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_min_pitch_dia", {20 * mm, 1.5 * mm}), Catch::Contains(held));
  CHECK_THAT(errorOf("trap_min_minor_dia", {20 * mm, 4.5 * mm}), Catch::Contains("is not an ISO 2904 trapezoidal pitch"));
}
