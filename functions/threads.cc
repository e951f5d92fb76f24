// Thread forms and standard series: Acme (ASME B1.5), metric trapezoidal
// (ISO 2904 / DIN 103) and square threads, and the tolerance limits of the
// screw (Acme class 2G, trapezoidal class 7e). The worksheet language has numbers
// only, so each form has its own functions (acme_..., trap_..., square_...)
// rather than a form code.
#include <cctype>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <string>
#include <vector>

#include "functions/const_text.h"
#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/table_texts.h"
#include "functions/validity.h"
#include "engine/util/math_constants.h"

namespace calctrail::fn {

namespace {

constexpr double kInch = 0.0254;  // exact (NIST SP 811)
constexpr double kMm = 1e-3;
// A size matches a table row within 1 um: far below the smallest gap between
// rows (1/16 in, 1 mm) and far above the rounding of any unit conversion.
constexpr double kMatch = 1e-6;

// ASME B1.5 general-purpose Acme series: nominal major diameter and threads
// per inch, the preferred combinations (from memory of the standard's table;
// the same rows are reprinted in Machinery's Handbook).
struct AcmeRow {
  double d_in;
  double tpi;
  const char* label;
};
const AcmeRow kAcme[] = {
    {0.25, 16, "1/4"},      {0.3125, 14, "5/16"},  {0.375, 12, "3/8"},   {0.4375, 12, "7/16"},
    {0.5, 10, "1/2"},       {0.625, 8, "5/8"},     {0.75, 6, "3/4"},     {0.875, 6, "7/8"},
    {1.0, 5, "1"},          {1.125, 5, "1-1/8"},   {1.25, 5, "1-1/4"},   {1.375, 4, "1-3/8"},
    {1.5, 4, "1-1/2"},      {1.75, 4, "1-3/4"},    {2.0, 4, "2"},        {2.25, 3, "2-1/4"},
    {2.5, 3, "2-1/2"},      {2.75, 3, "2-3/4"},    {3.0, 2, "3"},        {3.5, 2, "3-1/2"},
    {4.0, 2, "4"},          {4.5, 2, "4-1/2"},     {5.0, 2, "5"},
};

// ISO 2904 / DIN 103-1 metric trapezoidal series: nominal diameter and its
// pitches (fine, preferred, coarse), in mm; 0 where the standard lists fewer
// (the standard's table of diameter-pitch combinations, checked against a
// published reprint of it; its diameters 105, 115, ... 195 mm are not held).
struct TrapRow {
  double d_mm;
  double fine, preferred, coarse;
};
const TrapRow kTrap[] = {
    {8, 0, 1.5, 0},     {9, 1.5, 2, 0},     {10, 1.5, 2, 0},    {11, 2, 3, 0},
    {12, 2, 3, 0},      {14, 2, 3, 0},      {16, 2, 4, 0},      {18, 2, 4, 0},
    {20, 2, 4, 0},      {22, 3, 5, 8},      {24, 3, 5, 8},      {26, 3, 5, 8},
    {28, 3, 5, 8},      {30, 3, 6, 10},     {32, 3, 6, 10},     {34, 3, 6, 10},
    {36, 3, 6, 10},     {38, 3, 7, 10},     {40, 3, 7, 10},     {42, 3, 7, 10},
    {44, 3, 7, 12},     {46, 3, 8, 12},     {48, 3, 8, 12},     {50, 3, 8, 12},
    {52, 3, 8, 12},     {55, 3, 9, 14},     {60, 3, 9, 14},     {65, 4, 10, 16},
    {70, 4, 10, 16},    {75, 4, 10, 16},    {80, 4, 10, 16},    {85, 4, 12, 18},
    {90, 4, 12, 18},    {95, 4, 12, 18},    {100, 4, 12, 20},   {110, 4, 12, 20},
    {120, 6, 14, 22},   {130, 6, 14, 22},   {140, 6, 14, 24},   {150, 6, 16, 24},
    {160, 6, 16, 28},   {170, 6, 16, 28},   {180, 8, 18, 28},   {190, 8, 18, 32},
    {200, 8, 18, 32},   {210, 8, 20, 36},   {220, 8, 20, 36},   {230, 8, 20, 36},
    {240, 8, 22, 36},   {250, 12, 22, 40},  {260, 12, 22, 40},  {270, 12, 24, 40},
    {280, 12, 24, 40},  {290, 12, 24, 44},  {300, 12, 24, 44},
};

// ISO 2904 pitches and the root clearance ac of the external thread:
// 0.15 mm for 1.5 mm, 0.25 mm for 2..5 mm, 0.5 mm for 6..12 mm, 1 mm for
// 14..44 mm (from memory of the standard).
const double kTrapPitches[] = {1.5, 2, 3, 4, 5, 6, 7, 8, 9, 10, 12,
                               14, 16, 18, 20, 22, 24, 28, 32, 36, 40, 44};

double trapClearanceMm(double p_mm) {
  if (p_mm < 1.75) return 0.15;
  if (p_mm < 5.5) return 0.25;
  if (p_mm < 13.0) return 0.5;
  return 1.0;
}

// "1-1/4 in and 1-3/8 in", or the one end of the series.
template <typename Row, typename Size, typename Label>
std::string nearest(const Row* rows, std::size_t n, double d, Size size, Label label) {
  if (d < size(rows[0])) return "the smallest is " + label(rows[0]);
  if (d > size(rows[n - 1])) return "the largest is " + label(rows[n - 1]);
  for (std::size_t k = 1; k < n; ++k)
    if (d < size(rows[k])) return "nearest standard sizes: " + label(rows[k - 1]) + " and " + label(rows[k]);
  return "";
}

// The value (in the unit of the table) with 4 significant digits, or as many
// more (up to 17) as it takes not to read as one of the table's sizes: 40.004
// mm, never "40 mm" for a value that is not 40 mm.
template <typename Row, typename Size>
std::string distinctValue(double v, const Row* rows, std::size_t n, Size size_in_unit) {
  char buf[40];
  for (int digits = 4; digits <= 17; ++digits) {
    std::snprintf(buf, sizeof buf, "%.*g", digits, v);
    const double read = std::strtod(buf, nullptr);
    bool like_a_size = false;
    for (std::size_t k = 0; k < n; ++k) like_a_size |= read == size_in_unit(rows[k]);
    if (!like_a_size) break;
  }
  return buf;
}

// "4 um", "0.35 mm": a small distance in the unit that reads best.
std::string distance(double m) {
  return m < 1e-3 ? num(m * 1e6) + " um" : num(m * 1e3) + " mm";
}

// Within 1 % of a size: how far off and the fix ("is 4 um above the size 40 mm;
// write `40 mm`"); "" when no size is that near.
template <typename Row, typename Size, typename Label, typename Written>
std::string nearMiss(const Row* rows, std::size_t n, double v, Size size, Label label, Written written,
                     const char* what) {
  for (std::size_t k = 0; k < n; ++k) {
    const double s = size(rows[k]);
    if (std::fabs(v - s) > 0.01 * s) continue;
    return std::string("it is ") + distance(std::fabs(v - s)) + (v > s ? " above" : " below") + " the " + what +
           " " + label(rows[k]) + "; write `" + written(rows[k]) + "`";
  }
  return "";
}

const AcmeRow& acmeRow(const double* a) {
  const double d = positive(a, 0, "nominal diameter d", Show::Length);
  for (const AcmeRow& r : kAcme)
    if (std::fabs(d - r.d_in * kInch) <= kMatch) return r;
  const auto size = [](const AcmeRow& r) { return r.d_in * kInch; };
  const auto label = [](const AcmeRow& r) { return std::string(r.label) + " in"; };
  const auto written = [](const AcmeRow& r) { return num(r.d_in) + " in"; };
  const auto in_inches = [](const AcmeRow& r) { return r.d_in; };
  const auto in_mm = [](const AcmeRow& r) { return r.d_in * 25.4; };
  const std::string near = nearMiss(kAcme, std::size(kAcme), d, size, label, written, "size");
  fail(0, "nominal diameter d = " + distinctValue(d / kInch, kAcme, std::size(kAcme), in_inches) + " in (" +
              distinctValue(d / kMm, kAcme, std::size(kAcme), in_mm) +
              " mm) is not a size of the ASME B1.5 general-purpose Acme series; " +
              (near.empty() ? nearest(kAcme, std::size(kAcme), d, size, label) : near));
}

const TrapRow& trapRow(const double* a) {
  const double d = positive(a, 0, "nominal diameter d", Show::Length);
  for (const TrapRow& r : kTrap)
    if (std::fabs(d - r.d_mm * kMm) <= kMatch) return r;
  const auto size = [](const TrapRow& r) { return r.d_mm * kMm; };
  const auto label = [](const TrapRow& r) { return num(r.d_mm) + " mm"; };
  const auto in_mm = [](const TrapRow& r) { return r.d_mm; };
  const std::string near = nearMiss(kTrap, std::size(kTrap), d, size, label, label, "size");
  fail(0, "nominal diameter d = " + distinctValue(d / kMm, kTrap, std::size(kTrap), in_mm) +
              " mm is not a size of the ISO 2904 trapezoidal series; " +
              (near.empty() ? nearest(kTrap, std::size(kTrap), d, size, label) : near));
}

// The pitch of a trapezoidal thread, checked against the ISO 2904 pitches
// (the root clearance is defined for those only); returns it in mm.
double trapPitchMm(const double* a) {
  const double p = positive(a, 1, "pitch p", Show::Lead);
  for (double s : kTrapPitches)
    if (std::fabs(p - s * kMm) <= kMatch) return s;
  const auto size = [](const double& s) { return s * kMm; };
  const auto label = [](const double& s) { return num(s) + " mm"; };
  const auto in_mm = [](const double& s) { return s; };
  std::string near = nearMiss(kTrapPitches, std::size(kTrapPitches), p, size, label, label, "pitch");
  if (near.empty()) {
    near = nearest(kTrapPitches, std::size(kTrapPitches), p, size, label);
    const std::string prefix = "nearest standard sizes: ";
    if (near.compare(0, prefix.size(), prefix) == 0)
      near = "nearest standard pitches: " + near.substr(prefix.size());
  }
  fail(1, "pitch p = " + distinctValue(p / kMm, kTrapPitches, std::size(kTrapPitches), in_mm) +
              " mm/rev is not an ISO 2904 trapezoidal pitch; " + near);
}

bool isTrapPitch(double p) {
  for (double s : kTrapPitches)
    if (std::fabs(p - s * kMm) <= kMatch) return true;
  return false;
}

// "a trapezoidal thread", "an Acme thread".
std::string withArticle(const char* word) {
  const char c = static_cast<char>(std::tolower(static_cast<unsigned char>(word[0])));
  return std::string(c == 'a' || c == 'e' || c == 'i' || c == 'o' || c == 'u' ? "an " : "a ") + word;
}

// Major diameter and pitch of a thread (square, Acme, trapezoidal, stub Acme,
// buttress): the minor diameter must stay positive, so the pitch is below the
// diameter. `call` is the function's name, for the fix of swapped arguments;
// `iso_pitch`: a swapped call must also find an ISO 2904 pitch.
void majorAndPitch(const double* a, const char* form, const char* call, bool iso_pitch = false) {
  const double d = positive(a, 0, "major diameter d", Show::Length);
  const double p = positive(a, 1, "pitch p", Show::Lead);
  if (p < d) return;
  // Each argument named by its position and the value it received: the worksheet's own names may differ.
  std::string msg = std::string("argument 2 (pitch p) = ") + show(p, Show::Length) +
                    " must be smaller than argument 1 (major diameter d) = " + show(d, Show::Length) + " of " +
                    withArticle(form) + " thread";
  const bool swap_fits = d < p && (!iso_pitch || isTrapPitch(d));
  if (swap_fits)
    msg += "; the two look swapped: " + std::string(call) + "(d, p) takes the major diameter first, so write " +
           call + "(" + show(p, Show::Length) + ", " + show(d, Show::Length) + ")";
  fail(swap_fits ? -1 : 1, msg);
}

double acmeTpi(const double* a) { return acmeRow(a).tpi / kInch; }
double acmePitch(const double* a) { return kInch / acmeRow(a).tpi; }
double acmePitchDia(const double* a) {
  majorAndPitch(a, "Acme", "acme_pitch_dia");
  return result(a[0] - a[1] / 2);
}
double acmeMinorDia(const double* a) {
  majorAndPitch(a, "Acme", "acme_minor_dia");
  return result(a[0] - a[1]);
}
double acmeFlankAngle(const double*) { return 14.5 * kPi / 180.0; }

double trapPitch(const double* a) { return trapRow(a).preferred * kMm; }
double trapPitchDia(const double* a) {
  majorAndPitch(a, "trapezoidal", "trap_pitch_dia", true);
  trapPitchMm(a);
  return result(a[0] - a[1] / 2);
}
double trapMinorDia(const double* a) {
  majorAndPitch(a, "trapezoidal", "trap_minor_dia", true);
  const double p_mm = trapPitchMm(a);
  const double d3 = a[0] - a[1] - 2.0 * trapClearanceMm(p_mm) * kMm;
  if (!(d3 > 0))
    fail(0, "major diameter d = " + show(a[0], Show::Length) + " leaves no minor diameter for pitch p = " +
                show(a[1], Show::Lead) + " (d3 = " + show(d3, Show::Length) + ")");
  return result(d3);
}
double trapFlankAngle(const double*) { return 15.0 * kPi / 180.0; }

double squarePitchDia(const double* a) {
  majorAndPitch(a, "square", "square_pitch_dia");
  return result(a[0] - a[1] / 2);
}
double squareMinorDia(const double* a) {
  majorAndPitch(a, "square", "square_minor_dia");
  return result(a[0] - a[1]);
}
double squareFlankAngle(const double*) { return 0.0; }

// Stub Acme (ASME B1.8): basic thread height 0.3p, 29 deg included angle.
double stubAcmePitchDia(const double* a) {
  majorAndPitch(a, "Stub Acme", "stub_acme_pitch_dia");
  return result(a[0] - 0.3 * a[1]);
}
double stubAcmeMinorDia(const double* a) {
  majorAndPitch(a, "Stub Acme", "stub_acme_minor_dia");
  return result(a[0] - 0.6 * a[1]);
}

// Buttress, 7 deg load flank and 45 deg trailing flank (ASME B1.9): sharp-V
// height H = p/(tan 7 deg + tan 45 deg) = 0.89064p, basic height of engagement
// h = 0.6p, so the pitch line lies 0.3p below the major diameter.
double buttressPitchDia(const double* a) {
  majorAndPitch(a, "buttress", "buttress_pitch_dia");
  return result(a[0] - 0.6 * a[1]);
}
double buttressMinorDia(const double* a) {
  majorAndPitch(a, "buttress", "buttress_minor_dia");
  const double d1 = a[0] - 1.2 * a[1];
  if (!(d1 > 0))
    fail(1, "argument 2 (pitch p) = " + show(a[1], Show::Length) + " leaves no minor diameter of the buttress "
            "thread d - 1.2*p for argument 1 (major diameter d) = " + show(a[0], Show::Length));
  return result(d1);
}
double buttressFlankAngle(const double*) { return 7.0 * kPi / 180.0; }

// ISO 2904 nut (internal thread): minor diameter D1 = d - p (no clearance at
// the nut's crest) and major diameter D4 = d + 2*ac.
double trapNutMinorDia(const double* a) {
  majorAndPitch(a, "trapezoidal", "trap_nut_minor_dia", true);
  trapPitchMm(a);
  return result(a[0] - a[1]);
}
double trapNutMajorDia(const double* a) {
  majorAndPitch(a, "trapezoidal", "trap_nut_major_dia", true);
  return result(a[0] + 2.0 * trapClearanceMm(trapPitchMm(a)) * kMm);
}

// ASME B1.5 general-purpose Acme, class 2G external thread (the screw). With
// D the nominal major diameter and p the pitch, both in inches: pitch diameter
// allowance 0.008*sqrt(D); pitch diameter tolerance 0.006*sqrt(D) +
// 0.030*sqrt(p); maximum minor diameter D - (p + 0.020 in) for 10 threads per inch and
// coarser, D - (p + 0.010 in) finer; minor diameter tolerance 1.5 times the
// pitch diameter tolerance. Checked against two published 2G tables (see
// docs/verification.md). Held for the series combinations only: for another
// pitch the published tables take the tolerances of a different diameter.
// Like the published class 2G tables, each basic size, allowance and tolerance is
// rounded to 0.0001 in before the limits are added up from them, so the
// limits are the printed ones (exact formulas differ by up to 0.00011 in).
double round4(double in) { return std::round(in * 1e4) / 1e4; }

struct Acme2G {
  double d_in, p_in;
  double tolerance() const { return 0.006 * std::sqrt(d_in) + 0.030 * std::sqrt(p_in); }
  double maxPitchDia() const { return round4(d_in - p_in / 2) - round4(0.008 * std::sqrt(d_in)); }
  double minPitchDia() const { return maxPitchDia() - round4(tolerance()); }
  double maxMinorDia() const { return round4(d_in - p_in - (p_in >= 0.1 - 1e-9 ? 0.020 : 0.010)); }
  double minMinorDia() const { return maxMinorDia() - round4(1.5 * tolerance()); }
};

Acme2G acme2G(const double* a, const char* call) {
  majorAndPitch(a, "Acme", call);
  const AcmeRow& row = acmeRow(a);
  const double series_p = kInch / row.tpi;
  if (std::fabs(a[1] - series_p) > kMatch)
    fail(1, "pitch p = " + num(a[1] / kInch) + " in (" + show(a[1], Show::Length) + ") is not the series pitch " +
                num(series_p / kInch) + " in (" + num(row.tpi) + " threads per inch) of the " + row.label +
                " in size; the class 2G limits are held for the ASME B1.5 general-purpose combinations only "
                "(write acme_pitch(d) for the pitch)");
  return {a[0] / kInch, a[1] / kInch};
}

double acmeMaxPitchDia(const double* a) { return result(acme2G(a, "acme_max_pitch_dia").maxPitchDia() * kInch); }
double acmeMinPitchDia(const double* a) { return result(acme2G(a, "acme_min_pitch_dia").minPitchDia() * kInch); }
double acmeMinMinorDia(const double* a) { return result(acme2G(a, "acme_min_minor_dia").minMinorDia() * kInch); }

// ISO 2903 metric trapezoidal, tolerance class 7e of the external thread (the
// screw), in um: the fundamental deviation es of the pitch diameter for
// position e (Table 1) and the grade 7 pitch diameter tolerance Td2 for a
// diameter range "over ... up to and including" (clauses 7 and 11.4.1). The
// major and minor diameters are of position h (es = 0, clause 6), and the
// minor diameter tolerance is Td3 = 1.25*Td2 + |es| (clause 11.5; the
// relation from memory, and it reproduces every published d3 limit to the
// half um). Only the cells that
// published tables of 7e limits confirm are held: the Engineers Edge table
// (Tr 8x1.5 to Tr 18x2, and its Tr 320x5 row for es of 5 mm) and a lead-screw
// maker's table of 7e screws (Tr 10x2 to Tr 25x5, docs/verification.md).
// Larger diameters and the pitches from 6 mm are not held: no published
// value of theirs was at hand.
struct Trap7eDeviation {
  double p_mm, es_um;
};
const Trap7eDeviation kTrap7eDeviation[] = {{1.5, -67}, {2, -71}, {3, -85}, {4, -95}, {5, -106}};

struct Trap7eTolerance {
  double d_over_mm, d_upto_mm, p_mm, td2_um;
};
const Trap7eTolerance kTrap7eTolerance[] = {
    {5.6, 11.2, 1.5, 170}, {5.6, 11.2, 2, 190}, {5.6, 11.2, 3, 212},  {11.2, 22.4, 2, 200},
    {11.2, 22.4, 3, 224},  {11.2, 22.4, 4, 265}, {11.2, 22.4, 5, 280}, {22.4, 45, 3, 250},
    {22.4, 45, 5, 300},
};

// The tables as the declarations quote them, constant so that no table is
// formatted at start-up; each is the text that the function named beside it
// builds from the table, which tests/functions_table_texts_test.cc checks.
constexpr char kAcmeSeries[] =  // acmeSeriesText()
    "1/4 (16), 5/16 (14), 3/8 (12), 7/16 (12), 1/2 (10), 5/8 (8), 3/4 (6), 7/8 (6), 1 (5), 1-1/8 (5), "
    "1-1/4 (5), 1-3/8 (4), 1-1/2 (4), 1-3/4 (4), 2 (4), 2-1/4 (3), 2-1/2 (3), 2-3/4 (3), 3 (2), 3-1/2 (2), "
    "4 (2), 4-1/2 (2), 5 (2)";
constexpr char kTrapSeries[] =  // trapSeriesText()
    "Tr 8x1.5, Tr 9x2, Tr 10x2, Tr 11x3, Tr 12x3, Tr 14x3, Tr 16x4, Tr 18x4, Tr 20x4, Tr 22x5, Tr 24x5, "
    "Tr 26x5, Tr 28x5, Tr 30x6, Tr 32x6, Tr 34x6, Tr 36x6, Tr 38x7, Tr 40x7, Tr 42x7, Tr 44x7, Tr 46x8, "
    "Tr 48x8, Tr 50x8, Tr 52x8, Tr 55x9, Tr 60x9, Tr 65x10, Tr 70x10, Tr 75x10, Tr 80x10, Tr 85x12, "
    "Tr 90x12, Tr 95x12, Tr 100x12, Tr 110x12, Tr 120x14, Tr 130x14, Tr 140x14, Tr 150x16, Tr 160x16, "
    "Tr 170x16, Tr 180x18, Tr 190x18, Tr 200x18, Tr 210x20, Tr 220x20, Tr 230x20, Tr 240x22, Tr 250x22, "
    "Tr 260x22, Tr 270x24, Tr 280x24, Tr 290x24, Tr 300x24";
constexpr char kTrap7eHeld[] =  // trap7eHeldText()
    "d over 5.6 up to 11.2 mm with p = 1.5, 2 and 3 mm, over 11.2 up to 22.4 mm with p = 2, 3, 4 and 5 mm "
    "and over 22.4 up to 45 mm with p = 3 and 5 mm";
constexpr char kTrap7eDeviationText[] =  // trap7eDeviationText()
    "-67 um for p = 1.5 mm, -71 um for 2 mm, -85 um for 3 mm, -95 um for 4 mm, -106 um for 5 mm";
constexpr char kTrap7eToleranceText[] =  // trap7eToleranceText()
    "170, 190, 212 um for p = 1.5, 2, 3 mm (d over 5.6 up to 11.2 mm); 200, 224, 265, 280 um for p = 2, 3, "
    "4, 5 mm (d over 11.2 up to 22.4 mm); 250, 300 um for p = 3, 5 mm (d over 22.4 up to 45 mm)";

// "1.5, 2 and 3" mm: the list of numbers in words.
std::string andList(const std::vector<std::string>& items) {
  std::string s;
  for (std::size_t k = 0; k < items.size(); ++k) {
    if (k > 0) s += k + 1 == items.size() ? " and " : ", ";
    s += items[k];
  }
  return s;
}




struct Trap7e {
  double d_mm, p_mm, es_um, td2_um;
  double maxPitchDia() const { return d_mm - p_mm / 2 + es_um * 1e-3; }
  double minPitchDia() const { return maxPitchDia() - td2_um * 1e-3; }
  double maxMinorDia() const { return d_mm - p_mm - 2 * trapClearanceMm(p_mm); }
  double minMinorDia() const { return maxMinorDia() - (1.25 * td2_um - es_um) * 1e-3; }
};

Trap7e trap7e(const double* a, const char* call) {
  majorAndPitch(a, "trapezoidal", call, true);
  const double p_mm = trapPitchMm(a);
  const double d_mm = a[0] / kMm;
  for (const Trap7eTolerance& t : kTrap7eTolerance) {
    if (t.p_mm != p_mm || !(d_mm > t.d_over_mm + kMatch / kMm) || !(d_mm <= t.d_upto_mm + kMatch / kMm)) continue;
    for (const Trap7eDeviation& e : kTrap7eDeviation)
      if (e.p_mm == p_mm) {
        const Trap7e r{d_mm, p_mm, e.es_um, t.td2_um};
        if (!(r.minMinorDia() > 0))
          fail(0, "major diameter d = " + show(a[0], Show::Length) + " leaves no minor diameter for pitch p = " +
                      show(a[1], Show::Lead));
        return r;
      }
  }
  fail(-1, "the ISO 2903 class 7e tolerances of d = " + show(a[0], Show::Length) + ", p = " + show(a[1], Show::Lead) +
               " are not held here: they are held for " + kTrap7eHeld +
               " (the values published tables of limits confirm); take the limits of this size from ISO 2903");
}

double trapMaxPitchDia(const double* a) { return result(trap7e(a, "trap_max_pitch_dia").maxPitchDia() * kMm); }
double trapMinPitchDia(const double* a) { return result(trap7e(a, "trap_min_pitch_dia").minPitchDia() * kMm); }
double trapMinMinorDia(const double* a) { return result(trap7e(a, "trap_min_minor_dia").minMinorDia() * kMm); }

double threadLead(const double* a) {
  const double p = positive(a, 0, "pitch p", Show::Lead);
  const double n = count(a, 1, "number of starts");
  return result(n * p);
}



const char* kAcmeSource =
    "ASME B1.5 (Acme screw threads), general-purpose series and basic dimensions, reprinted in Machinery's "
    "Handbook (from memory); fourteen sizes 1/4 to 3 in with their pitches also as Shigley's Mechanical "
    "Engineering Design, 9th ed., Table 8-3 (p. 414) prints them, and 1/4-16 to 7/8-6 as Lew Merrick's Acme "
    "thread data sheets do";
const char* kTrapSource =
    "ISO 2904 / DIN 103 (metric trapezoidal screw threads), basic dimensions: d2, d3, D1 and D4 checked "
    "against two published reprints of the ISO 2904 table; the diameters and their coarse, normal (preferred) "
    "and fine pitches against a published reprint of ISO 2904's diameter-pitch combinations, F-M-S's "
    "(docs/verification.md); the root clearances ac from memory, which the reprinted d3 and D4 reproduce "
    "(pitches 1.5 to 5, 7, 8 and 12 mm; the 1 mm of the pitches 14 to 44 mm is in no reprint at hand)";
const char* kStubSource =
    "ASME B1.8 (Stub Acme screw threads): basic thread height 0.3p, 29 deg included angle, the preferred "
    "diameter-pitch combinations of the general-purpose Acme series (from memory)";
const char* kButtressSource =
    "ASME B1.9-1973, reaffirmed 2017 (buttress inch screw threads, 7 deg/45 deg form with 0.6 pitch basic "
    "height of thread engagement, as its title says): basic pitch diameter D - 0.6p (from memory; the sharp-V "
    "height p/(tan 7 deg + tan 45 deg) = 0.89064p, truncated alike at crest and root to the 0.6p engagement, "
    "puts the pitch line 0.3p below the major diameter); the standard's preferred "
    "diameter-pitch combinations (its Table 1) and pitch diameter tolerances (para. 6.1) are not held here";
const char* kAcme2GSource =
    "ASME B1.5 (Acme screw threads), general-purpose class 2G external thread: pitch diameter allowance "
    "0.008*sqrt(D), pitch diameter tolerance 0.006*sqrt(D) + 0.030*sqrt(p), minor diameter max D - (p + 0.020 "
    "in) for 10 tpi and coarser, D - (p + 0.010 in) finer, minor diameter tolerance 1.5 times the pitch "
    "diameter tolerance (D, p in inches); checked against two published class 2G tables, a thread maker's "
    "and Lew Merrick's Acme thread data sheets (see docs/verification.md)";
// The sizes the 2G and 7e tolerance functions hold, the same for each limit.
const char* kAcme2GLimits =
    "d a size of the ASME B1.5 general-purpose series and p its series pitch (acme_pitch(d)), each "
    "within 1 um. The limits of a single-start thread, as the published tables give them; a "
    "multiple-start screw may be made to other limits: take them from its drawing";
// Single-start threads only, the same for the three 7e limits.
constexpr char kTrap7eSingleStart[] =
    "; any other size is an error (its values are not held here). Single-start threads: ISO 2903 "
    "widens Td2 of a multiple-start thread (clause 10), which is not held here";
const char* kTrap7eSource =
    "ISO 2903 (ISO metric trapezoidal screw threads, tolerances), class 7e of the external thread: "
    "fundamental deviation es of d2 for position e (Table 1), grade 7 tolerance Td2 (clause 7, its formula "
    "clause 11.4.1), d and d3 of position h (clause 6), Td3 (clause 11.5) = 1.25*Td2 + |es| (the relation from "
    "memory); clause and table numbers as the published contents and text of ISO 2903:2016 give them. Every es "
    "and Td2 held is read from two published tables of 7e limits, Engineers Edge's and a lead-screw maker's "
    "(see docs/verification.md)";
const char* kSquareSource =
    "Square thread proportions as in the machine design textbooks (e.g. Shigley's "
    "Mechanical Engineering Design, Fig. 8-3) and Machinery's Handbook: depth p/2; "
    "no current standard series";

}  // namespace

// The sizes held, read from the table: "over 5.6 up to 11.2 mm with p = 1.5,
// 2 and 3 mm, over 11.2 up to 22.4 mm with ...". One text for the limits of
// the three functions and for the error outside them.
std::string trap7eHeldText() {
  std::vector<std::string> ranges;
  for (std::size_t k = 0; k < std::size(kTrap7eTolerance);) {
    const Trap7eTolerance& first = kTrap7eTolerance[k];
    std::vector<std::string> pitches;
    for (; k < std::size(kTrap7eTolerance) && kTrap7eTolerance[k].d_over_mm == first.d_over_mm; ++k)
      pitches.push_back(num(kTrap7eTolerance[k].p_mm));
    ranges.push_back("over " + num(first.d_over_mm) + " up to " + num(first.d_upto_mm) + " mm with p = " +
                     andList(pitches) + " mm");
  }
  std::string s;
  for (std::size_t k = 0; k < ranges.size(); ++k)
    s += (k == 0 ? "" : k + 1 == ranges.size() ? " and " : ", ") + ranges[k];
  return "d " + s;
}

// "-67 um for p = 1.5 mm, -71 um for 2 mm, ...".
std::string trap7eDeviationText() {
  std::string s;
  for (const Trap7eDeviation& e : kTrap7eDeviation)
    s += (s.empty() ? num(e.es_um) + " um for p = " : ", " + num(e.es_um) + " um for ") + num(e.p_mm) + " mm";
  return s;
}

// "170, 190, 212 um for p = 1.5, 2, 3 mm (d over 5.6 up to 11.2 mm), ...".
std::string trap7eToleranceText() {
  std::string s;
  for (std::size_t k = 0; k < std::size(kTrap7eTolerance);) {
    const Trap7eTolerance& first = kTrap7eTolerance[k];
    std::string values, pitches;
    for (; k < std::size(kTrap7eTolerance) && kTrap7eTolerance[k].d_over_mm == first.d_over_mm; ++k) {
      values += (values.empty() ? "" : ", ") + num(kTrap7eTolerance[k].td2_um);
      pitches += (pitches.empty() ? "" : ", ") + num(kTrap7eTolerance[k].p_mm);
    }
    s += (s.empty() ? "" : "; ") + values + " um for p = " + pitches + " mm (d over " + num(first.d_over_mm) +
         " up to " + num(first.d_upto_mm) + " mm)";
  }
  return s;
}

std::string acmeSeriesText() {
  std::string s;
  for (const AcmeRow& r : kAcme) {
    if (!s.empty()) s += ", ";
    s += std::string(r.label) + " (" + num(r.tpi) + ")";
  }
  return s;
}

std::string trapSeriesText() {
  std::string s;
  for (const TrapRow& r : kTrap) {
    if (!s.empty()) s += ", ";
    s += "Tr " + num(r.d_mm) + "x" + num(r.preferred);
  }
  return s;
}

GroupText addThreads(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg major = arg("d", length(), "nominal (major) diameter of the thread");
  const FunctionArg pitch = arg("p", length(), "pitch (axial distance between adjacent threads)", true);
  // The limits of the three class 7e functions, built once.
  static constexpr auto kHeld = join(kTrap7eHeld, kTrap7eSingleStart);
  const std::string_view held = kHeld.view();

  {
    FunctionDecl d;
    d.name = "acme_tpi";
    d.summary = "Threads per inch of a general-purpose Acme size (ASME B1.5 series)";
    d.args = {major};
    d.result = perLength();
    d.result_unit = "1/in";
    static constexpr auto kFormula =
        join("table lookup, ASME B1.5 general-purpose series, nominal size in inches (threads per inch): ", kAcmeSeries);
    d.formula = kFormula.view();
    d.formula_is_expression = false;
    d.limits = "d must be a size of the series (within 1 um); any other size is an error naming the nearest sizes";
    d.source = kAcmeSource;
    d.example = {kInch};
    d.eval = acmeTpi;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_pitch";
    d.summary = "Pitch of a general-purpose Acme size: 1 in divided by its threads per inch (ASME B1.5)";
    d.args = {major};
    d.result = length();
    d.result_unit = "in";
    d.formula = "table lookup, ASME B1.5 general-purpose series: p = 1 in / (threads per inch of size d); see acme_tpi";
    d.formula_is_expression = false;
    d.limits = "d must be a size of the series (within 1 um); any other size is an error naming the nearest sizes";
    d.source = kAcmeSource;
    d.example = {kInch};
    d.eval = acmePitch;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_pitch_dia";
    d.summary = "Basic pitch (mean) diameter of an Acme thread: major diameter less half the pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - p/2";
    d.limits = "d > 0, 0 < p < d; any diameter-pitch combination (specials are made): "
               "use acme_pitch for the standard one";
    d.source = kAcmeSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = acmePitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_minor_dia";
    d.summary = "Basic minor diameter of an Acme thread: major diameter less the pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - p";
    d.limits = "d > 0, 0 < p < d. Basic size: the minor diameter of a class 2G external thread is "
               "smaller by its root clearance and tolerance; acme_min_minor_dia gives its least value";
    d.source = kAcmeSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = acmeMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_flank_angle";
    d.summary = "Flank angle (half the 29 deg included angle) of an Acme thread: 14.5 deg";
    d.result = angle();
    d.result_unit = "deg";
    d.formula = "14.5*pi/180";
    d.limits = "none (a constant of the form)";
    d.source = kAcmeSource;
    d.eval = acmeFlankAngle;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_pitch";
    d.summary = "Preferred pitch of a metric trapezoidal size (ISO 2904 / DIN 103 series)";
    d.args = {major};
    d.result = length();
    d.result_unit = "mm";
    static constexpr auto kFormula = join("table lookup, ISO 2904 series (preferred combinations): ", kTrapSeries);
    d.formula = kFormula.view();
    d.formula_is_expression = false;
    d.limits = "d must be a diameter of the series, 8 to 300 mm (within 1 um); any other size is an error naming "
               "the nearest sizes. The finer and coarser pitches of the series are accepted by trap_pitch_dia "
               "and trap_minor_dia";
    d.source = kTrapSource;
    d.example = {0.020};
    d.eval = trapPitch;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_pitch_dia";
    d.summary = "Basic pitch diameter d2 of a metric trapezoidal thread: major diameter less half the pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "d - p/2";
    d.limits = "d > 0, 0 < p < d; p must be an ISO 2904 pitch (1.5 to 44 mm); the diameter is not checked "
               "against the series (specials are made)";
    d.source = kTrapSource;
    d.example = {0.020, 0.004};
    d.eval = trapPitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_minor_dia";
    d.summary = "Minor diameter d3 of the external (screw) metric trapezoidal thread, root clearance included";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "d3 = d - p - 2*ac, with the root clearance ac = 0.15 mm for p = 1.5 mm, 0.25 mm for p = 2 to 5 mm, "
                "0.5 mm for p = 6 to 12 mm, 1 mm for p = 14 to 44 mm";
    d.formula_is_expression = false;
    d.limits = "d > 0, 0 < p < d, d3 > 0; p must be an ISO 2904 pitch (1.5 to 44 mm) because ac depends on it. "
               "The largest d3 of a screw of any tolerance class (position h, ISO 2903); trap_min_minor_dia gives "
               "the least of class 7e";
    d.source = kTrapSource;
    d.example = {0.020, 0.004};
    d.eval = trapMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_flank_angle";
    d.summary = "Flank angle (half the 30 deg included angle) of a metric trapezoidal thread: 15 deg";
    d.result = angle();
    d.result_unit = "deg";
    d.formula = "15*pi/180";
    d.limits = "none (a constant of the form)";
    d.source = kTrapSource;
    d.eval = trapFlankAngle;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "square_pitch_dia";
    d.summary = "Pitch (mean) diameter of a square thread: major diameter less half the pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "d - p/2";
    d.limits = "d > 0, 0 < p < d";
    d.source = kSquareSource;
    d.example = {0.032, 0.004};
    d.eval = squarePitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "square_minor_dia";
    d.summary = "Minor diameter of a square thread: major diameter less the pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "d - p";
    d.limits = "d > 0, 0 < p < d";
    d.source = kSquareSource;
    d.example = {0.032, 0.004};
    d.eval = squareMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "square_flank_angle";
    d.summary = "Flank angle of a square thread: 0";
    d.result = angle();
    d.result_unit = "deg";
    d.formula = "0";
    d.limits = "none (a constant of the form)";
    d.source = kSquareSource;
    d.eval = squareFlankAngle;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "stub_acme_pitch_dia";
    d.summary = "Basic pitch diameter of a Stub Acme thread (ASME B1.8): major diameter less 0.3 pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - 0.3*p";
    d.limits = "d > 0, 0 < p < d. The Stub Acme sizes are the general-purpose Acme diameters and pitches "
               "(acme_pitch); the flank angle is the Acme one (acme_flank_angle)";
    d.source = kStubSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = stubAcmePitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "stub_acme_minor_dia";
    d.summary = "Basic minor diameter of a Stub Acme thread (ASME B1.8): major diameter less 0.6 pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - 0.6*p";
    d.limits = "d > 0, 0 < p < d. Basic size: the minor diameter of a class 2G external thread is smaller by "
               "its allowance and tolerance (ASME B1.8 tables, not held here)";
    d.source = kStubSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = stubAcmeMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "buttress_pitch_dia";
    d.summary = "Basic pitch diameter of a 7/45 deg buttress thread (ASME B1.9): major diameter less 0.6 pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - 0.6*p";
    d.limits = "d > 0, 0 < p < d. No size series is held here: ASME B1.9 recommends pitches per diameter "
               "range; take the pitch from it";
    d.source = kButtressSource;
    d.example = {2 * kInch, kInch / 8};
    d.eval = buttressPitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "buttress_minor_dia";
    d.summary = "Basic minor diameter of a 7/45 deg buttress thread (ASME B1.9): major diameter less 1.2 pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - 1.2*p";
    d.limits = "d > 0, 0 < p < d/1.2. Basic size: the root radius and the allowance of the class reduce it "
               "(ASME B1.9 tables, not held here)";
    d.source = kButtressSource;
    d.example = {2 * kInch, kInch / 8};
    d.eval = buttressMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "buttress_flank_angle";
    d.summary = "Load flank angle of a buttress thread (ASME B1.9): 7 deg, the flank the torque functions take";
    d.result = angle();
    d.result_unit = "deg";
    d.formula = "7*pi/180";
    d.limits = "none (a constant of the form). The load must press on the 7 deg flank; a load on the 45 deg "
               "flank is not what the form is for";
    d.source = kButtressSource;
    d.eval = buttressFlankAngle;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_nut_minor_dia";
    d.summary = "Minor diameter D1 of the internal (nut) metric trapezoidal thread: major diameter less the pitch";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "d - p";
    d.limits = "d > 0, 0 < p < d; p must be an ISO 2904 pitch (1.5 to 44 mm). Basic size: a nut of tolerance "
               "class 7H has a larger minor diameter (the 7H values are not held here)";
    d.source = kTrapSource;
    d.example = {0.040, 0.007};
    d.eval = trapNutMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_nut_major_dia";
    d.summary = "Major diameter D4 of the internal (nut) metric trapezoidal thread, root clearance included";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "D4 = d + 2*ac, with the root clearance ac = 0.15 mm for p = 1.5 mm, 0.25 mm for p = 2 to 5 mm, "
                "0.5 mm for p = 6 to 12 mm, 1 mm for p = 14 to 44 mm";
    d.formula_is_expression = false;
    d.limits = "d > 0, 0 < p < d; p must be an ISO 2904 pitch (1.5 to 44 mm) because ac depends on it";
    d.source = kTrapSource;
    d.example = {0.040, 0.007};
    d.eval = trapNutMajorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_max_pitch_dia";
    d.summary = "Maximum pitch diameter of a class 2G general-purpose Acme screw (ASME B1.5)";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - p/2 - 0.008*sqrt(D) in, with D = d/(1 in): the basic pitch diameter less the class 2G "
                "allowance; each term rounded to 0.0001 in as the published 2G tables are";
    d.formula_is_expression = false;
    d.limits = kAcme2GLimits;
    d.source = kAcme2GSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = acmeMaxPitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_min_pitch_dia";
    d.summary = "Minimum pitch diameter of a class 2G general-purpose Acme screw (ASME B1.5)";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "acme_max_pitch_dia(d, p) - (0.006*sqrt(D) + 0.030*sqrt(P)) in, with D = d/(1 in) and "
                "P = p/(1 in): less the class 2G pitch diameter tolerance (rounded to 0.0001 in)";
    d.formula_is_expression = false;
    d.limits = kAcme2GLimits;
    d.source = kAcme2GSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = acmeMinPitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "acme_min_minor_dia";
    d.summary = "Minimum minor diameter of a class 2G general-purpose Acme screw (ASME B1.5): the least "
                "material a body stress or buckling check may count on";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "in";
    d.formula = "d - p - c - 1.5*(0.006*sqrt(D) + 0.030*sqrt(P)) in, with D = d/(1 in), P = p/(1 in) and the "
                "root clearance c = 0.020 in for 10 threads per inch and coarser, 0.010 in finer; d - p - c and the "
                "tolerance each rounded to 0.0001 in";
    d.formula_is_expression = false;
    d.limits = kAcme2GLimits;
    d.source = kAcme2GSource;
    d.example = {kInch, 0.2 * kInch};
    d.eval = acmeMinMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_max_pitch_dia";
    d.summary = "Maximum pitch diameter d2 of a class 7e metric trapezoidal screw (ISO 2903)";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    static constexpr auto kFormula =
        join("d - p/2 + es, with the fundamental deviation es of position e: ", kTrap7eDeviationText);
    d.formula = kFormula.view();
    d.formula_is_expression = false;
    d.limits = held;
    d.source = kTrap7eSource;
    d.example = {0.020, 0.004};
    d.eval = trapMaxPitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_min_pitch_dia";
    d.summary = "Minimum pitch diameter d2 of a class 7e metric trapezoidal screw (ISO 2903)";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    static constexpr auto kFormula =
        join("trap_max_pitch_dia(d, p) - Td2, with the grade 7 tolerance Td2 = ", kTrap7eToleranceText);
    d.formula = kFormula.view();
    d.formula_is_expression = false;
    d.limits = held;
    d.source = kTrap7eSource;
    d.example = {0.020, 0.004};
    d.eval = trapMinPitchDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trap_min_minor_dia";
    d.summary = "Minimum minor diameter d3 of a class 7e metric trapezoidal screw (ISO 2903): the least "
                "material a body stress or buckling check may count on";
    d.args = {major, pitch};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "trap_minor_dia(d, p) - Td3, with Td3 = 1.25*Td2 + |es| (Td2 and es as in trap_min_pitch_dia "
                "and trap_max_pitch_dia)";
    d.formula_is_expression = false;
    d.limits = held;
    d.source = kTrap7eSource;
    d.example = {0.020, 0.004};
    d.eval = trapMinMinorDia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_lead";
    d.summary = "Lead of a thread: axial advance per revolution, the pitch times the number of starts";
    d.args = {pitch, arg("starts", none(), "number of starts (1 single, 2 double, ...)")};
    d.result = length();
    d.result_per_revolution = true;
    d.result_unit = "mm";
    d.formula = "starts*p";
    d.limits = "p > 0; starts a whole number >= 1";
    d.source = "Definition of lead, as in Shigley's Mechanical Engineering Design (Sec. 8-1), ASME B1.5 and ISO 2904";
    d.example = {0.004, 2};
    d.eval = threadLead;
    out.push_back(std::move(d));
  }
  return {"Threads",
          "Standard series and basic dimensions of the thread forms used on power screws. Each form has its own "
          "functions (acme_..., stub_acme_..., trap_..., square_..., buttress_...), since a worksheet passes "
          "numbers only. The flank angle is "
          "half the included angle, measured in the axial plane, as the torque functions take it. A size that is "
          "not in a series is an error that names the nearest standard sizes. The basic sizes are those of the "
          "profile; the least material of a screw (the minimum minor diameter a stress or buckling check should "
          "use) is given for Acme class 2G and trapezoidal class 7e where the tolerance values are held."};
}

}  // namespace calctrail::fn
