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

double allowablePressure(const double* a, int i) {
  return positive(a, i, "allowable bearing pressure p_allow", Show::Stress);
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

double nutPv(const double* a) {
  const double p_bearing = bearingPressure(a);
  const double l = positive(a, 4, "lead l", Show::Lead);
  const double n = nonNegative(a, 5, "screw speed n", Show::Speed);
  return result(p_bearing * slidingSpeedOf(a[1], l, n));
}

const char* kSource =
    "Shigley's Mechanical Engineering Design, Sec. 8-2 (power screw body and thread stresses; "
    "first-thread load share 0.38, common practice) (from memory)";
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
  const FunctionArg nt = arg("nt", none(), "number of engaged threads (nut length / pitch)");
  const FunctionArg share =
      arg("share", none(), "share of the load on the most loaded thread (0.38 common practice; 1/nt if even)");
  const FunctionArg n = arg("n", rotSpeed(), "screw speed relative to the nut");
  const FunctionArg p_allow = arg("p_allow", stress(), "allowable thread bearing pressure");

  {
    FunctionDecl d;
    d.name = "body_torsion_stress";
    d.summary = "Torsional shear stress in the screw body at the minor diameter";
    d.args = {arg("T", torque(), "torque carried by the screw body"), dr};
    d.result = stress();
    d.result_unit = "MPa";
    d.formula = "16*T/(pi*dr^3)";
    d.limits = "T >= 0, dr > 0";
    d.source = kSource;
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
    d.source = kSource;
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
    d.limits = "F > 0, dm > 0, p > 0, nt > 0 (pass share*F and nt = 1 for the most loaded thread)";
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
    d.limits = "F > 0, dm > 0, p > 0, p_allow > 0";
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
    d.limits = "F > 0, dm > 0, p_allow > 0";
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
    d.limits = "dm > 0, l > 0, n >= 0";
    d.source = "Kinematics of the helix, as for the sliding velocity of a worm, pi*d*n/cos(lambda), in the "
               "worm gearing chapters of Shigley's Mechanical Engineering Design (from memory)";
    d.example = {0.030, 0.008, 60 * 2 * kPi / 60};
    d.eval = slidingSpeed;
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
    d.limits = "F > 0, dm > 0, p > 0, nt > 0, l > 0, n >= 0";
    d.source = "Common practice of nut makers and handbooks: wear of a sliding nut judged by pV; bearing pressure "
               "and sliding speed as in Shigley's Mechanical Engineering Design, Sec. 8-2 (from memory)";
    d.caution = kNutCaution;
    d.example = {6400, 0.030, 0.004, 6, 0.008, 100 * 2 * kPi / 60};
    d.eval = nutPv;
    out.push_back(std::move(d));
  }
  return {"Stresses and nut wear",
          "Body stresses are taken at the minor diameter dr. Thread stresses follow the textbook model of a thread "
          "as a short cantilever of depth p/2; the first engaged thread carries far more than its even share "
          "(0.38 of the load is common practice). Inputs are magnitudes."};
}

}  // namespace calctrail::fn
