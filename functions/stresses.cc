// Stresses in a power screw and its nut: body stresses at the minor
// diameter, thread bearing pressure, root bending and shear of the most
// loaded thread, von Mises combinations, nut size for an allowable pressure
// and nut wear as pressure times sliding speed (pV).
#include <cmath>
#include <string>
#include <vector>

#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/validity.h"
#include "engine/util/math_constants.h"

namespace calctrail::fn {

namespace {


double load(const double* a) { return positive(a, 0, "axial load F", Show::Force); }

double bodyTorsion(const double* a) {
  const double T = nonNegative(a, 0, "torque T", Show::Torque);
  const double dr = positive(a, 1, "minor diameter dr", Show::Length);
  return result(16.0 * T / (kPi * dr * dr * dr));
}

double bodyAxial(const double* a) {
  const double F = load(a);
  const double dr = positive(a, 1, "minor diameter dr", Show::Length);
  return result(4.0 * F / (kPi * dr * dr));
}

double bearingPressure(const double* a) {
  const double F = load(a);
  const double dm = positive(a, 1, "mean diameter dm", Show::Length);
  const double p = positive(a, 2, "pitch p", Show::Lead);
  const double nt = positive(a, 3, "engaged threads nt", Show::Plain);
  return result(2.0 * F / (kPi * dm * nt * p));
}

double rootCommon(const double* a, double factor) {
  const double F = load(a);
  const double dr = positive(a, 1, "minor diameter dr", Show::Length);
  const double p = positive(a, 2, "pitch p", Show::Lead);
  const double share = fraction(a, 3, "load share of the most loaded thread");
  return result(factor * share * F / (kPi * dr * p));
}

double rootBending(const double* a) { return rootCommon(a, 6.0); }
double rootShear(const double* a) { return rootCommon(a, 3.0); }

double vonMises(const double* a) {
  const double s = finite(a, 0, "normal stress sigma", Show::Stress);
  const double t = finite(a, 1, "shear stress tau", Show::Stress);
  return result(std::sqrt(s * s + 3.0 * t * t));
}

double vonMisesRoot(const double* a) {
  const double sb = std::fabs(finite(a, 0, "root bending stress sigma_b", Show::Stress));
  const double sa = std::fabs(finite(a, 1, "axial stress sigma_a", Show::Stress));
  const double t = finite(a, 2, "torsional shear stress tau", Show::Stress);
  return result(std::sqrt((sb * sb + sa * sa + (sa + sb) * (sa + sb)) / 2.0 + 3.0 * t * t));
}

// Above 3000 MPa a flank pressure exceeds the compressive yield strength of any
// screw or nut steel: an allowable that high is a slip of units.
constexpr double kMaxAllowablePressure = 3000e6;

double allowablePressure(const double* a, int i) {
  const double pa = positive(a, i, "allowable bearing pressure p_allow", Show::Stress);
  if (!(pa <= kMaxAllowablePressure))
    fail(i, "allowable bearing pressure p_allow = " + show(pa, Show::Stress) +
                " is above the compressive yield strength of any screw or nut steel (3000 MPa): a slip of units? "
                "sliding nuts allow 1.4 to 24 MPa");
  return pa;
}

double nutThreads(const double* a) {
  const double F = load(a);
  const double dm = positive(a, 1, "mean diameter dm", Show::Length);
  const double p = positive(a, 2, "pitch p", Show::Lead);
  const double pa = allowablePressure(a, 3);
  return result(2.0 * F / (kPi * dm * p * pa));
}

double nutLength(const double* a) {
  const double F = load(a);
  const double dm = positive(a, 1, "mean diameter dm", Show::Length);
  const double pa = allowablePressure(a, 2);
  return result(2.0 * F / (kPi * dm * pa));
}

double slidingSpeedOf(double dm, double l, double n) {
  return n / (2.0 * kPi) * std::sqrt(kPi * dm * kPi * dm + l * l);
}

double slidingSpeed(const double* a) {
  const double dm = positive(a, 0, "mean diameter dm", Show::Length);
  const double l = positive(a, 1, "lead l", Show::Lead);
  const double n = nonNegative(a, 2, "screw speed n", Show::Speed);
  return result(slidingSpeedOf(dm, l, n));
}

// The finest pitch of the standard series is about dm/25 (Tr 300x12, d2 = 294 mm;
// the finest Acme, 5-2, is dm/9.5): a lead finer than dm/50 is a pitch or a
// diameter slipped, or a lead in the wrong unit.
constexpr double kFinestLeadRatio = 1.0 / 50.0;

std::string adviseLead(double dm, double l) {
  if (!(l < dm * kFinestLeadRatio)) return "";
  return "lead l = " + show(l, Show::Lead) + " is finer than any standard pitch for the mean diameter dm = " +
         show(dm, Show::Length) + " (the finest, Tr 300x12, is about dm/25; below dm/50 is no thread of the " +
         "ISO 2904 or ASME B1.5 series): a pitch of another thread, or a lead in the wrong unit?";
}

std::string adviseSliding(const double* a, int, int* arg) {
  *arg = 1;
  return adviseLead(a[0], a[1]);
}
std::string adviseNutPv(const double* a, int, int* arg) {
  *arg = 4;
  return adviseLead(a[1], a[4]);
}

// Thread stripping: the shear area per unit length of engagement, on the
// cylinder where the mating thread's crest ends. The thread's width there is
// half the pitch at the pitch line plus tan(alpha) per unit of radius towards
// its root on each flank: p/2 + (d2 - D)*tan(alpha) for the screw at the nut's
// minor diameter D1, p/2 + (D - D2)*tan(alpha) for the nut at the screw's
// major diameter d. One thread per pitch of length.
double shearAreaScrew(const double* a) {
  const double D1 = positive(a, 0, "minor diameter of the nut D1", Show::Length);
  const double d2 = positive(a, 1, "pitch diameter of the screw d2", Show::Length);
  const double p = positive(a, 2, "pitch p", Show::Lead);
  const double alpha = flankAngle(a, 3, "flank angle alpha");
  if (!(D1 < d2))
    fail(0, "minor diameter of the nut D1 = " + show(D1, Show::Length) +
                " must be smaller than the pitch diameter d2 = " + show(d2, Show::Length));
  return result(kPi * D1 * (p / 2 + (d2 - D1) * std::tan(alpha)) / p);
}

double shearAreaNut(const double* a) {
  const double d = positive(a, 0, "major diameter of the screw d", Show::Length);
  const double D2 = positive(a, 1, "pitch diameter of the nut D2", Show::Length);
  const double p = positive(a, 2, "pitch p", Show::Lead);
  const double alpha = flankAngle(a, 3, "flank angle alpha");
  if (!(D2 < d))
    fail(1, "pitch diameter of the nut D2 = " + show(D2, Show::Length) +
                " must be smaller than the major diameter d = " + show(d, Show::Length));
  return result(kPi * d * (p / 2 + (d - D2) * std::tan(alpha)) / p);
}

double stripStress(const double* a) {
  const double F = load(a);
  const double A = positive(a, 1, "shear area per unit length A_l", Show::Length);
  const double Le = positive(a, 2, "length of engagement Le", Show::Length);
  return result(F / (A * Le));
}

double engagementNeeded(const double* a) {
  const double F = load(a);
  const double A = positive(a, 1, "shear area per unit length A_l", Show::Length);
  const double tau = positive(a, 2, "allowable shear stress tau_allow", Show::Stress);
  return result(F / (A * tau));
}

double nutPv(const double* a) {
  const double p_bearing = bearingPressure(a);
  const double l = positive(a, 4, "lead l", Show::Lead);
  // The lead is the pitch times the number of starts: never less than the pitch.
  if (l < a[2] * (1 - 1e-9))
    fail(4, "lead l = " + show(l, Show::Lead) + " is smaller than the pitch p = " + show(a[2], Show::Lead) +
                ": a lead is the pitch times the number of starts (thread_lead(p, starts)); are the two swapped?");
  const double n = nonNegative(a, 5, "screw speed n", Show::Speed);
  return result(p_bearing * slidingSpeedOf(a[1], l, n));
}

const char* kSource =
    "Shigley's Mechanical Engineering Design, Sec. 8-2 (power screw body and thread stresses; "
    "first-thread load share 0.38, common practice) (from memory)";
const char* kBodySource =
    "Shigley's Mechanical Engineering Design, Sec. 8-2 (power screw body stresses at the minor diameter), with "
    "the torsion and axial stress of a round bar, Ch. 3 (from memory)";
const char* kStripSource =
    "Machinery's Handbook, strength of screw threads (length of engagement): shear area of the external "
    "thread As = pi*n*Le*Kn*[1/(2n) + 0.57735*(Es - Kn)] and of the internal thread An = pi*n*Le*Ds*[1/(2n) + "
    "0.57735*(Ds - En)] for 60 deg threads, as in FED-STD-H28/2; the same geometry with tan(alpha) for other "
    "flank angles (from memory)";
const char* kStressCaution =
    "A stress is half a check: compare it with an allowable value under the applicable code, and check fatigue "
    "where the load cycles.";
const char* kNutCaution =
    "Allowable bearing pressure and pV depend on the nut material, lubrication and duty: take them from the nut "
    "maker or a handbook table, not from habit.";

}  // namespace

GroupText addStresses(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg F = arg("F", force(), "axial load on the screw (magnitude)");
  const FunctionArg dr = arg("dr", length(), "minor (root) diameter of the screw");
  const FunctionArg dm = arg("dm", length(), "mean (pitch) diameter of the thread");
  const FunctionArg p = arg("p", length(), "pitch", true);
  const FunctionArg l = arg("l", length(), "lead", true);
  const FunctionArg nt = usually(arg("nt", none(), "number of engaged threads (nut length / pitch)"), 1, 40,
                                 Show::Plain,
                                 "a nut engages at least one whole thread; 1 for the most loaded thread alone, "
                                 "power screw nuts 5 to 25 (nut length 1.5 to 2.5 d), common practice");
  const FunctionArg share =
      arg("share", none(), "share of the load on the most loaded thread (0.38 common practice; 1/nt if even)");
  const FunctionArg n = arg("n", rotSpeed(), "screw speed relative to the nut");
  const FunctionArg p_allow =
      usually(arg("p_allow", stress(), "allowable thread bearing pressure"), 0.5e6, 30e6, Show::Stress,
              "sliding nuts: Shigley's Table 8-4, 1.4 to 24 MPa from a steel-on-bronze hand press to a steel-on-"
              "cast-iron hoist; plastic nuts from 0.5 MPa (from memory)");

  {
    FunctionDecl d;
    d.name = "body_torsion_stress";
    d.summary = "Torsional shear stress in the screw body at the minor diameter";
    d.args = {arg("T", torque(), "torque carried by the screw body"), dr};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "16*T/(pi*dr^3)";
    d.limits = "T >= 0, dr > 0";
    d.source = kBodySource;
    d.caution = kStressCaution;
    d.example = {26.18, 0.028};
    d.eval = bodyTorsion;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "body_axial_stress";
    d.summary = "Axial (tension or compression) stress in the screw body at the minor diameter, as a magnitude";
    d.args = {F, dr};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "4*F/(pi*dr^2)";
    d.limits = "F > 0, dr > 0. A long screw in compression may buckle first: see the column functions";
    d.source = kBodySource;
    d.caution = kStressCaution;
    d.example = {6400, 0.028};
    d.eval = bodyAxial;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_bearing_pressure";
    d.summary = "Thread bearing pressure, the load spread over nt engaged threads of depth p/2";
    d.args = {F, dm, p, nt};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "F/(pi*dm*nt*p/2)";
    d.limits = "F > 0, dm > 0, p > 0, nt > 0 (pass share*F and nt = 1 for the most loaded thread); fewer than "
               "one engaged thread is a warning";
    d.source = kSource;
    d.caution = kNutCaution;
    d.example = {0.38 * 6400, 0.030, 0.004, 1};
    d.eval = bearingPressure;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_root_bending";
    d.summary = "Bending stress at the root of the most loaded thread, which carries share*F";
    d.args = {F, dr, p, share};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "6*share*F/(pi*dr*p)";
    d.limits = "F > 0, dr > 0, p > 0, 0 < share <= 1";
    d.source = kSource;
    d.caution = kStressCaution;
    d.example = {6400, 0.028, 0.004, 0.38};
    d.eval = rootBending;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_root_shear";
    d.summary = "Largest transverse shear stress at the root of the most loaded thread (3/2 of the mean)";
    d.args = {F, dr, p, share};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "3*share*F/(pi*dr*p)";
    d.limits = "F > 0, dr > 0, p > 0, 0 < share <= 1";
    d.source = kSource;
    d.caution = kStressCaution;
    d.example = {6400, 0.028, 0.004, 0.38};
    d.eval = rootShear;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "von_mises";
    d.summary = "Von Mises equivalent stress of one normal and one shear stress (screw body)";
    d.args = {arg("sigma", stress(), "normal stress"), arg("tau", stress(), "shear stress")};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "sqrt(sigma^2 + 3*tau^2)";
    d.limits = "finite stresses of either sign";
    d.source = "Distortion-energy (von Mises) theory, as in Shigley's Mechanical Engineering Design, Ch. 5 "
               "(from memory)";
    d.caution = kStressCaution;
    d.example = {10.39e6, 6.07e6};
    d.eval = vonMises;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "von_mises_thread_root";
    d.summary = "Von Mises stress at the top of the thread root plane: root bending, body axial stress and body "
                "torsion, the axial stress taken against the bending (the worse case)";
    d.args = {arg("sigma_b", stress(), "root bending stress (thread_root_bending)"),
              arg("sigma_a", stress(), "body axial stress (body_axial_stress)"),
              arg("tau", stress(), "body torsional stress (body_torsion_stress)")};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "sqrt((sigma_b^2 + sigma_a^2 + (abs(sigma_a) + abs(sigma_b))^2)/2 + 3*tau^2)";
    d.limits = "finite stresses; signs are ignored: magnitudes are combined in the worse case, bending tension "
               "against axial compression";
    d.source = kSource;
    d.caution = kStressCaution;
    d.example = {41.5e6, 10.39e6, 6.07e6};
    d.eval = vonMisesRoot;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "nut_threads_needed";
    d.summary = "Engaged threads needed to keep the thread bearing pressure within an allowable value";
    d.args = {F, dm, p, p_allow};
    d.result = none();
    d.result_unit = "1";
    d.formula = "2*F/(pi*dm*p*p_allow)";
    d.limits = "F > 0, dm > 0, p > 0, 0 < p_allow <= 3000 MPa (above it no steel bears the pressure)";
    d.source = kSource;
    d.caution = kNutCaution;
    d.example = {6400, 0.030, 0.004, 10e6};
    d.eval = nutThreads;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "nut_length_needed";
    d.summary = "Nut length needed for an allowable bearing pressure (engaged threads times pitch: the pitch "
                "cancels)";
    d.args = {F, dm, p_allow};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "2*F/(pi*dm*p_allow)";
    d.limits = "F > 0, dm > 0, 0 < p_allow <= 3000 MPa (above it no steel bears the pressure)";
    d.source = kSource;
    d.caution = kNutCaution;
    d.example = {6400, 0.030, 10e6};
    d.eval = nutLength;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "sliding_speed";
    d.summary = "Sliding speed of the thread flanks at the mean diameter, along the helix";
    d.args = {dm, l, n};
    d.result = speed();
    d.result_unit = "m/s";
    d.formula = "n*sqrt((pi*dm)^2 + l^2)/(1 [rev])";
    d.limits = "dm > 0, l > 0, n >= 0; a lead finer than dm/50 (finer than any standard pitch) is a warning";
    d.source = "Kinematics of the helix, as for the sliding velocity of a worm, pi*d*n/cos(lambda), in the "
               "worm gearing chapters of Shigley's Mechanical Engineering Design (from memory)";
    d.example = {0.030, 0.008, 60 * 2 * kPi / 60};
    d.eval = slidingSpeed;
    d.advise = adviseSliding;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "nut_pv";
    d.summary = "Nut wear factor pV: thread bearing pressure times sliding speed, to compare with the nut "
                "maker's limit";
    d.args = {F, dm, p, nt, l, n};
    d.result = pressureSpeed();
    d.result_unit = "MPa*m/s";
    d.formula = "F/(pi*dm*nt*p/2) * n*sqrt((pi*dm)^2 + l^2)/(1 [rev])";
    d.limits = "F > 0, dm > 0, p > 0, nt > 0, l >= p (a lead is the pitch times the starts), n >= 0; a lead "
               "finer than dm/50 is a warning";
    d.source = "Common practice of nut makers and handbooks: wear of a sliding nut judged by pV; bearing pressure "
               "and sliding speed as in Shigley's Mechanical Engineering Design, Sec. 8-2 (from memory)";
    d.caution = kNutCaution;
    d.example = {6400, 0.030, 0.004, 6, 0.008, 100 * 2 * kPi / 60};
    d.eval = nutPv;
    d.advise = adviseNutPv;
    out.push_back(std::move(d));
  }
  const FunctionArg alpha = arg("alpha", angle(), "flank angle (half the included angle; 0 for square)");
  {
    FunctionDecl d;
    d.name = "thread_shear_area_screw";
    d.summary = "Stripping shear area of the screw thread per unit length of engagement, at the nut's minor "
                "diameter";
    d.args = {arg("D1", length(), "minor diameter of the nut (where the nut's crests end)"),
              arg("d2", length(), "pitch diameter of the screw"), p, alpha};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "pi*D1*(p/2 + (d2 - D1)*tan(alpha))/p";
    d.limits = "D1 > 0, d2 > D1, p > 0, 0 <= alpha <= 45 deg. Times the length of engagement it is the area "
               "that shears when the screw's threads strip; use the maximum D1 and minimum d2 of the tolerance "
               "classes where the margin is small";
    d.source = kStripSource;
    d.caution = "Stripping is sudden: the thread shears along its whole engagement at once. Check the softer "
                "part on its own side: a bronze nut strips before a steel screw.";
    d.example = {0.033, 0.0365, 0.007, 15 * kPi / 180};
    d.eval = shearAreaScrew;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_shear_area_nut";
    d.summary = "Stripping shear area of the nut thread per unit length of engagement, at the screw's major "
                "diameter";
    d.args = {arg("d", length(), "major diameter of the screw (where the screw's crests end)"),
              arg("D2", length(), "pitch diameter of the nut"), p, alpha};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "pi*d*(p/2 + (d - D2)*tan(alpha))/p";
    d.limits = "d > D2 > 0, p > 0, 0 <= alpha <= 45 deg; use the minimum d and maximum D2 of the tolerance "
               "classes where the margin is small";
    d.source = kStripSource;
    d.caution = "Stripping is sudden: the thread shears along its whole engagement at once. Check the softer "
                "part on its own side: a bronze nut strips before a steel screw.";
    d.example = {0.040, 0.0365, 0.007, 15 * kPi / 180};
    d.eval = shearAreaNut;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_strip_stress";
    d.summary = "Mean shear stress in the threads that strip: the load over the shear area of the engagement";
    d.args = {F, arg("A_l", length(), "shear area per unit length (thread_shear_area_screw or _nut)"),
              arg("Le", length(), "length of engagement (nut length)")};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "F/(A_l*Le)";
    d.limits = "F > 0, A_l > 0, Le > 0. A mean over the engagement: the first threads carry more, so compare "
               "it with an allowable that has the margin in it";
    d.source = kStripSource;
    d.caution = kStressCaution;
    d.example = {20000, 0.0575, 0.060};
    d.eval = stripStress;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thread_engagement_needed";
    d.summary = "Length of engagement needed to keep the stripping shear stress within an allowable value";
    d.args = {F, arg("A_l", length(), "shear area per unit length (thread_shear_area_screw or _nut)"),
              usually(arg("tau_allow", stress(), "allowable shear stress of the part that strips"), 5e6,
                      1000e6, Show::Stress,
                      "allowable shear of screw and nut metals, from cast bronze at about 10 MPa with a large "
                      "factor to hardened steel at a few hundred MPa (common practice)")};
    d.result = length();
    d.result_unit = "mm";
    d.formula = "F/(A_l*tau_allow)";
    d.limits = "F > 0, A_l > 0, tau_allow > 0";
    d.source = kStripSource;
    d.caution = kStressCaution;
    d.example = {20000, 0.0575, 40e6};
    d.eval = engagementNeeded;
    out.push_back(std::move(d));
  }
  return {"Stresses and nut wear",
          "Body stresses are taken at the minor diameter dr. Thread stresses follow the textbook model of a thread "
          "as a short cantilever of depth p/2; the first engaged thread carries far more than its even share "
          "(0.38 of the load is common practice). Inputs are magnitudes. Stripping: the shear area of each part "
          "per unit length of engagement, taken where the mating crests end, times the engagement length; a "
          "softer nut is checked with its own shear area (thread_shear_area_nut) and allowable."};
}

}  // namespace calctrail::fn
