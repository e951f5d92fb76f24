// Buckling of a screw as a centrally loaded round column: Euler's formula for
// long columns, Johnson's parabola for intermediate ones, joined at the
// transition slenderness where both give half the yield load. The end
// condition is passed as the end-condition constant C (C = 1/K^2 with K the
// effective-length factor), a plain number a worksheet can carry.
#include <cmath>
#include <string>
#include <vector>

#include "functions/const_text.h"
#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/validity.h"
#include "engine/util/math_constants.h"

namespace calctrail::fn {

namespace {

constexpr double kMaxModulus = 1200e9;
const char* const kModulusWhy =
    "screw and shaft metals: magnesium and aluminium alloys 45 to 72 GPa, bronzes and titanium 100 to 120 GPa, "
    "cast irons 100 to 170 GPa, steels 190 to 215 GPa (handbook tables, from memory)";

// No solid exceeds the modulus of diamond, about 1200 GPa: a larger E is a slip of units.
double modulus(const double* a, int i) {
  const double E = positive(a, i, "modulus of elasticity E", Show::Modulus);
  if (!(E <= kMaxModulus))
    fail(i, "modulus of elasticity E = " + show(E, Show::Modulus) +
                " is above that of any solid (diamond, about 1200 GPa): a slip of units?");
  return E;
}

// A round section of diameter dr: radius of gyration dr/4.
struct Column {
  double dr, L, C, E;
  double area() const { return kPi * dr * dr / 4.0; }
  double slenderness() const { return 4.0 * L / dr; }
  double euler() const { return C * kPi * kPi * E * (kPi * dr * dr * dr * dr / 64.0) / (L * L); }
};

// Arguments dr, L, C, E from index `first`.
Column column(const double* a, int first) {
  Column c;
  c.dr = positive(a, first, "minor diameter dr", Show::Length);
  c.L = positive(a, first + 1, "column length L", Show::Length);
  c.C = positive(a, first + 2, "end-condition constant C", Show::Plain);
  if (!(c.C <= 4.0))
    fail(first + 2, "end-condition constant C = " + num(c.C) + " must be <= 4 (both ends fixed, theoretical)");
  c.E = modulus(a, first + 3);
  return c;
}

double yield(const double* a, int i, double E) {
  const double Sy = positive(a, i, "yield strength Sy", Show::Stress);
  if (!(Sy < E))
    fail(i, "yield strength Sy = " + show(Sy, Show::Stress) + " must be below the modulus E = " +
                show(E, Show::Modulus) + " (a slip of units?)");
  return Sy;
}

double transitionOf(double C, double E, double Sy) { return std::sqrt(2.0 * kPi * kPi * C * E / Sy); }

double johnsonOf(const Column& c, double Sy) {
  const double g = Sy * c.slenderness() / (2.0 * kPi);
  return c.area() * (Sy - g * g / (c.C * c.E));
}

double slenderness(const double* a) {
  const double L = positive(a, 0, "column length L", Show::Length);
  const double dr = positive(a, 1, "minor diameter dr", Show::Length);
  return result(4.0 * L / dr);
}

double transitionSlenderness(const double* a) {
  const double C = positive(a, 0, "end-condition constant C", Show::Plain);
  if (!(C <= 4.0)) fail(0, "end-condition constant C = " + num(C) + " must be <= 4 (both ends fixed, theoretical)");
  const double E = modulus(a, 1);
  return result(transitionOf(C, E, yield(a, 2, E)));
}

double eulerLoad(const double* a) { return result(column(a, 0).euler()); }

// Euler's load holds above the transition slenderness, that is where the
// Euler stress stays below half the yield strength. euler_load has no Sy, so
// it doubts every column whose Euler stress exceeds half the yield strength of
// a mild screw steel (Sy/E = 0.001, about 207 MPa at 207 GPa): there Euler's
// load is too high for such a material.
constexpr double kLowYieldRatio = 0.001;

std::string adviseEuler(const double* a, int, int* arg) {
  const double dr = a[0], L = a[1], C = a[2], E = a[3];
  const double s = 4.0 * L / dr;
  const double sigma = C * kPi * kPi * E / (s * s);
  if (!(sigma > kLowYieldRatio * E / 2)) return "";
  *arg = 1;
  return "the Euler stress C*pi^2*E/(L/k)^2 = " + show(sigma, Show::Stress) + " at L/k = " + num(s) +
         " is above half the yield strength of a mild screw steel: Euler's load holds only for Sy >= " +
         show(2 * sigma, Show::Stress) + " (above the transition slenderness); for a weaker material the column "
         "is intermediate and Euler's load too high (3.7 % at 0.9 of the transition slenderness, 2.3 times at "
         "half of it): use buckling_load(dr, L, C, E, Sy), which chooses";
}

double johnsonLoad(const double* a) {
  const Column c = column(a, 0);
  const double Sy = yield(a, 4, c.E);
  const double limit = transitionOf(c.C, c.E, Sy);
  if (c.slenderness() > limit * (1 + 1e-9))  // a hair of rounding at the transition is no error
    fail(1, "Johnson's parabola holds up to the transition slenderness sqrt(2*pi^2*C*E/Sy) = " + num(limit) +
                "; here L/k = " + num(c.slenderness()) + ": the column is long, use euler_load (or buckling_load)");
  return result(johnsonOf(c, Sy));
}

double bucklingLoadOf(const Column& c, double Sy) {
  return c.slenderness() > transitionOf(c.C, c.E, Sy) ? c.euler() : johnsonOf(c, Sy);
}

double bucklingLoad(const double* a) {
  const Column c = column(a, 0);
  return result(bucklingLoadOf(c, yield(a, 4, c.E)));
}

double bucklingSafety(const double* a) {
  const double F = positive(a, 0, "axial load F", Show::Force);
  const Column c = column(a, 1);
  return result(bucklingLoadOf(c, yield(a, 5, c.E)) / F);
}

const char* kSource =
    "Euler and J. B. Johnson column formulas with end-condition constants, as in Shigley's Mechanical "
    "Engineering Design (Budynas and Nisbett, 9th ed.), Secs. 4-12 and 4-13 (long and intermediate-length "
    "columns with central loading): Euler Pcr/A = C*pi^2*E/(l/k)^2, Eq. (4-43), the transition (l/k)1 = "
    "(2*pi^2*C*E/Sy)^(1/2) where Pcr/A = Sy/2, Eq. (4-45), and the parabolic formula, Eq. (4-46), p. 184; its "
    "table of end-condition constants (from memory)";
constexpr char kCaution[] =
    "Long screws buckle: these loads assume a straight screw loaded on its axis; take the end-condition "
    "constant conservatively and apply a design factor.";
constexpr char kCLimit[] =
    "0 < C <= 4: C = 1/4 fixed-free, 1 both ends pinned (rounded), 2 fixed-pinned (1.2 recommended), "
    "4 both fixed (1.2 recommended)";

}  // namespace

GroupText addColumns(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg dr = arg("dr", length(), "minor (root) diameter of the screw, the column's diameter");
  const FunctionArg L = arg("L", length(), "column length: between the nut and the thrust bearing or support");
  const FunctionArg C = arg("C", none(), "end-condition constant (1/K^2 with K the effective-length factor)");
  const FunctionArg E = usually(arg("E", stress(), "modulus of elasticity"), 40e9, 250e9, Show::Modulus,
                                kModulusWhy);
  const FunctionArg Sy = usually(arg("Sy", stress(), "yield strength"), 100e6, 2000e6, Show::Stress,
                                 "screw metals: annealed bronze and aluminium alloys from about 100 MPa, "
                                 "structural steels 235 to 355 MPa, quenched and tempered alloy steels to "
                                 "about 1500 MPa (EN 10025-2, EN 10083-3 minimum values, from memory)");
  {
    FunctionDecl d;
    d.name = "slenderness";
    d.summary = "Slenderness ratio L/k of a round screw, k = dr/4 the radius of gyration";
    d.args = {L, dr};
    d.result = none();
    d.result_unit = "1";
    d.formula = "L/(dr/4)";
    d.limits = "L > 0, dr > 0";
    d.source = kSource;
    d.caution = kCaution;
    d.example = {1.5, 0.0375};
    d.eval = slenderness;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "transition_slenderness";
    d.summary = "Slenderness at which Euler's curve and Johnson's parabola meet: Johnson below, Euler above";
    d.args = {C, E, Sy};
    d.result = none();
    d.result_unit = "1";
    d.formula = "sqrt(2*pi^2*C*E/Sy)";
    static constexpr auto kLimits = join(kCLimit, "; 0 < E <= 1200 GPa, 0 < Sy < E");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kCaution;
    d.example = {1, 207e9, 500e6};
    d.eval = transitionSlenderness;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "euler_load";
    d.summary = "Euler critical load of a long round column";
    d.args = {dr, L, C, E};
    d.result = force();
    d.result_unit = "kN";
    d.formula = "C*pi^2*E*(pi*dr^4/64)/L^2";
    static constexpr auto kLimits =
        join("dr > 0, L > 0, ", kCLimit, ", 0 < E <= 1200 GPa. Valid above the transition slenderness only: "
                                         "below it Euler overestimates the load (use buckling_load, which chooses). Without Sy the "
                                         "transition is unknown: a call whose Euler stress exceeds half the yield strength of a mild "
                                         "screw steel (0.0005*E) is a warning");
    d.limits = kLimits.view();
    d.source = kSource;
    static constexpr auto kEulerCaution = join(kCaution, " Below the transition slenderness Euler's load is unsafe.");
    d.caution = kEulerCaution.view();
    d.example = {0.0375, 1.5, 1, 207e9};
    d.eval = eulerLoad;
    d.advise = adviseEuler;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "johnson_load";
    d.summary = "Johnson critical load of an intermediate round column (parabola from yield to the transition)";
    d.args = {dr, L, C, E, Sy};
    d.result = force();
    d.result_unit = "kN";
    d.formula = "pi*dr^2/4 * (Sy - (2*Sy*L/(pi*dr))^2/(C*E))";
    static constexpr auto kLimits =
        join("dr > 0, L > 0, ", kCLimit, ", 0 < E <= 1200 GPa, 0 < Sy < E; the slenderness L/(dr/4) must not exceed the "
                                         "transition sqrt(2*pi^2*C*E/Sy): beyond it the column is long and this is an error");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kCaution;
    d.example = {0.0375, 0.5, 1, 207e9, 500e6};
    d.eval = johnsonLoad;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "buckling_load";
    d.summary = "Critical load of a round column: Johnson up to the transition slenderness, Euler beyond";
    d.args = {dr, L, C, E, Sy};
    d.result = force();
    d.result_unit = "kN";
    d.formula = "johnson_load when L/(dr/4) <= sqrt(2*pi^2*C*E/Sy), else euler_load";
    d.formula_is_expression = false;
    static constexpr auto kLimits = join("dr > 0, L > 0, ", kCLimit, ", 0 < E <= 1200 GPa, 0 < Sy < E");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kCaution;
    d.example = {0.0375, 1.5, 1, 207e9, 500e6};
    d.eval = bucklingLoad;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "buckling_safety";
    d.summary = "Safety factor against buckling: buckling_load divided by the axial load";
    d.args = {arg("F", force(), "axial compressive load on the screw (magnitude)"), dr, L, C, E, Sy};
    d.result = none();
    d.result_unit = "1";
    d.formula = "buckling_load(dr, L, C, E, Sy) / F";
    d.formula_is_expression = false;
    static constexpr auto kLimits = join("F > 0, dr > 0, L > 0, ", kCLimit, ", 0 < E <= 1200 GPa, 0 < Sy < E");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kCaution;
    d.example = {22000, 0.0375, 1.5, 1, 207e9, 500e6};
    d.eval = bucklingSafety;
    out.push_back(std::move(d));
  }
  return {"Columns (buckling)",
          "A screw in compression is a round column of its minor diameter dr (conservative). The end condition "
          "is the end-condition constant C (C = 1/K^2, K the effective-length factor): theoretical 1/4 fixed-free, "
          "1 pinned-pinned, 2 fixed-pinned, 4 fixed-fixed; for the last two 1.2 is the recommended design value, "
          "as real ends are never fully fixed. A nut guided in a long housing is not a fixed end."};
}

}  // namespace calctrail::fn
