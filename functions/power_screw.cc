// Power screws with sliding threads: torque to raise and to lower a load,
// lead angle, efficiency, self-locking and back-driving. The flank angle
// alpha enters through 1/cos(alpha) in the axial plane, as in the textbook
// treatment (the small difference from the normal-plane angle is neglected).
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


// The thread geometry and friction shared by every function here, checked.
// `first` is the index of dm in the argument list.
struct Thread {
  double dm, l, f, alpha;
  double sec() const { return 1.0 / std::cos(alpha); }
  // pi*dm - f*l*sec(alpha): the screw cannot raise the load when it is <= 0.
  double raiseDenominator() const { return kPi * dm - f * l * sec(); }
  double raiseNumerator() const { return l + kPi * f * dm * sec(); }
  double lowerNumerator() const { return kPi * f * dm * sec() - l; }
  double lowerDenominator() const { return kPi * dm + f * l * sec(); }
};

Thread thread(const double* a, int first) {
  Thread t;
  t.dm = positive(a, first, "mean diameter dm", Show::Length);
  t.l = positive(a, first + 1, "lead l", Show::Lead);
  t.f = friction(a, first + 2, "thread friction f");
  t.alpha = flankAngle(a, first + 3, "flank angle alpha");
  return t;
}

// Raising is possible only while the lead angle plus the friction angle stays
// below 90 deg; beyond, the formula's denominator vanishes or turns negative.
void requireRaisable(const Thread& t) {
  if (!(t.raiseDenominator() > 0))
    fail(-1, "the thread cannot raise the load: f*l/cos(alpha) = " + show(t.f * t.l * t.sec(), Show::Length) +
                 " must be < pi*dm = " + show(kPi * t.dm, Show::Length) + " (lead angle " +
                 show(std::atan(t.l / (kPi * t.dm)), Show::Angle) + " is beyond the friction limit)");
}

double load(const double* a) { return positive(a, 0, "axial load F", Show::Force); }

double collarTorque(const double* a, int first, double F) {
  const double fc = friction(a, first, "collar friction fc");
  const double dc = positive(a, first + 1, "collar mean diameter dc", Show::Length);
  return F * fc * dc / 2.0;
}

double threadRaise(double F, const Thread& t) {
  requireRaisable(t);
  return F * t.dm / 2.0 * t.raiseNumerator() / t.raiseDenominator();
}

double threadLower(double F, const Thread& t) {
  return F * t.dm / 2.0 * t.lowerNumerator() / t.lowerDenominator();
}

double leadAngle(const double* a) {
  const double dm = positive(a, 0, "mean diameter dm", Show::Length);
  const double l = positive(a, 1, "lead l", Show::Lead);
  return result(std::atan(l / (kPi * dm)));
}

double torqueRaise(const double* a) {
  const double F = load(a);
  return result(threadRaise(F, thread(a, 1)));
}

double torqueLower(const double* a) {
  const double F = load(a);
  return result(threadLower(F, thread(a, 1)));
}

double torqueRaiseWithCollar(const double* a) {
  const double F = load(a);
  const Thread t = thread(a, 1);
  return result(threadRaise(F, t) + collarTorque(a, 5, F));
}

double torqueLowerWithCollar(const double* a) {
  const double F = load(a);
  const Thread t = thread(a, 1);
  return result(threadLower(F, t) + collarTorque(a, 5, F));
}

double screwEfficiency(const double* a) {
  const Thread t = thread(a, 0);
  requireRaisable(t);
  return result(t.l * t.raiseDenominator() / (kPi * t.dm * t.raiseNumerator()));
}

double screwEfficiencyWithCollar(const double* a) {
  const Thread t = thread(a, 0);
  requireRaisable(t);
  // Torque per unit load, so the load cancels: e = l / (2*pi*T/F).
  const double per_load = t.dm / 2.0 * t.raiseNumerator() / t.raiseDenominator() + collarTorque(a, 4, 1.0);
  return result(t.l / (2.0 * kPi * per_load));
}

double selfLockingMargin(const double* a) {
  const Thread t = thread(a, 0);
  return result(t.f - t.l * std::cos(t.alpha) / (kPi * t.dm));
}

double screwBackdriveEfficiency(const double* a) {
  const Thread t = thread(a, 0);
  // Self-locking: the load cannot turn the screw, and the formula's negative value is no efficiency.
  if (t.lowerNumerator() > 0)
    fail(-1, "self-locking, back-driving efficiency not defined: f = " + num(t.f) + " > tan(lambda)*cos(alpha) = " +
                 num(t.l * std::cos(t.alpha) / (kPi * t.dm)) +
                 ", so the load cannot turn the screw; self_locking_margin gives the margin");
  return result(kPi * t.dm * -t.lowerNumerator() / (t.l * t.lowerDenominator()));
}

double backdriveForce(const double* a) {
  const double T = nonNegative(a, 0, "resisting torque T", Show::Torque);
  const Thread t = thread(a, 1);
  const double drive = -t.lowerNumerator();  // l - pi*f*dm*sec(alpha)
  if (!(drive > 0))
    fail(-1, "the thread is self-locking: f = " + num(t.f) + " >= tan(lambda)*cos(alpha) = " +
                 num(t.l * std::cos(t.alpha) / (kPi * t.dm)) + ", so no axial force back-drives it");
  return result(2.0 * T / t.dm * t.lowerDenominator() / drive);
}

double startingFriction(const double* a) {
  const double f = friction(a, 0, "running friction f");
  // The result is a friction coefficient too, and no metal pair of the trade exceeds 1.
  if (!(f <= 0.75))
    fail(0, "running friction f = " + num(f) + " must be <= 0.75: its starting value 4/3*f = " + num(f * 4.0 / 3.0) +
                " would exceed 1, above any metal pair of the trade (a slip of a decimal point?)");
  return result(f * 4.0 / 3.0);
}

const char* kSource =
    "Shigley's Mechanical Engineering Design (Budynas and Nisbett, 9th ed.), Sec. 8-2 (mechanics of power "
    "screws): the raise and lower torques of a square thread, Eqs. (8-1) and (8-2), and the self-locking "
    "condition, f above the tangent of the lead angle, Eq. (8-3), p. 416; the flank-angle form (the friction "
    "divided by cos(alpha)) and Machinery's Handbook, power screws (from memory)";
const char* kFrictionCaution =
    "Friction varies widely: size motors and brakes with the high value and check holding with the low one.";
const char* kLockCaution =
    "Self-locking is no brake: vibration and low friction can back-drive the screw; provide a brake where a "
    "load is held.";
constexpr char kThreadLimits[] =
    "F > 0, dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg";
constexpr char kRaiseLimits[] =
    "F > 0, dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg; pi*dm - f*l/cos(alpha) > 0 (beyond it the lead "
    "angle plus the friction angle reach 90 deg and the screw cannot raise the load)";

}  // namespace

GroupText addPowerScrews(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg F = arg("F", force(), "axial load on the screw (magnitude)");
  const FunctionArg dm = arg("dm", length(), "mean (pitch) diameter of the thread");
  const FunctionArg l = arg("l", length(), "lead (axial advance per revolution)", true);
  const FunctionArg f = usually(arg("f", none(), "thread friction coefficient"), 0.05, 0.30, Show::Plain,
                                 "threaded pairs of steel screws with steel, bronze, brass and cast-iron nuts run at 0.10 to 0.25, machine oil to dry (Shigley's Mechanical Engineering Design, 9th ed., Table 8-5, p. 422); the range is widened to 0.05 for well-lubricated and polymer nuts at the low value of a self-locking check and to 0.30 for a dry worst case (common practice). A value of 15 or 1.5 is a percent or a slip");
  const FunctionArg alpha = arg("alpha", angle(), "flank angle (half the included thread angle; 0 for square)");
  const FunctionArg fc = usually(arg("fc", none(), "collar friction coefficient"), 0.05, 0.30, Show::Plain,
                                  "thrust collars of steel on cast iron and on bronze run at 0.06 to 0.12 and start at 0.08 to 0.17 (Shigley's Mechanical Engineering Design, 9th ed., Table 8-6, p. 422); widened to 0.05 to 0.30 as for the thread (common practice), a rolling bearing is thrust_bearing_torque's");
  const FunctionArg dc = arg("dc", length(), "collar mean diameter");
  static constexpr char kRaise[] = "F*dm/2 * (l + pi*f*dm/cos(alpha)) / (pi*dm - f*l/cos(alpha))";
  static constexpr char kLower[] = "F*dm/2 * (pi*f*dm/cos(alpha) - l) / (pi*dm + f*l/cos(alpha))";

  {
    FunctionDecl d;
    d.name = "lead_angle";
    d.summary = "Lead angle of a thread at its mean diameter (also the lead angle of a worm)";
    d.args = {dm, l};
    d.result = angle();
    d.result_unit = "deg";
    d.formula = "atan(l/(pi*dm))";
    d.limits = "dm > 0, l > 0";
    d.source = kSource;
    d.example = {0.030, 0.008};
    d.eval = leadAngle;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "torque_raise";
    d.summary = "Torque to raise a load (or to drive against it), thread friction only";
    d.args = {F, dm, l, f, alpha};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = kRaise;
    d.limits = kRaiseLimits;
    d.source = kSource;
    d.caution = kFrictionCaution;
    d.example = {6400, 0.030, 0.008, 0.08, 14.5 * kPi / 180};
    d.eval = torqueRaise;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "torque_lower";
    d.summary = "Torque to lower a load, thread friction only; negative when the load back-drives the screw";
    d.args = {F, dm, l, f, alpha};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = kLower;
    static constexpr auto kLimits = join(kThreadLimits, "; a negative result is the torque needed to hold the load");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kLockCaution;
    d.example = {6400, 0.030, 0.008, 0.08, 14.5 * kPi / 180};
    d.eval = torqueLower;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "torque_raise_with_collar";
    d.summary = "Torque to raise a load: thread plus a plain thrust collar";
    d.args = {F, dm, l, f, alpha, fc, dc};
    d.result = torque();
    d.result_unit = "N*m";
    static constexpr auto kFormula = join(kRaise, " + F*fc*dc/2");
    d.formula = kFormula.view();
    static constexpr auto kLimits = join(kRaiseLimits, "; 0 <= fc <= 1, dc > 0");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kFrictionCaution;
    d.example = {6400, 0.030, 0.008, 0.08, 0, 0.08, 0.040};
    d.eval = torqueRaiseWithCollar;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "torque_lower_with_collar";
    d.summary = "Torque to lower a load: thread plus a plain thrust collar";
    d.args = {F, dm, l, f, alpha, fc, dc};
    d.result = torque();
    d.result_unit = "N*m";
    static constexpr auto kFormula = join(kLower, " + F*fc*dc/2");
    d.formula = kFormula.view();
    static constexpr auto kLimits =
        join(kThreadLimits, "; 0 <= fc <= 1, dc > 0; a negative result is the torque needed to "
                            "hold the load");
    d.limits = kLimits.view();
    d.source = kSource;
    d.caution = kLockCaution;
    d.example = {6400, 0.030, 0.008, 0.08, 0, 0.08, 0.040};
    d.eval = torqueLowerWithCollar;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "screw_efficiency";
    d.summary = "Efficiency of a power screw raising a load, thread only: F*l / (2*pi*torque_raise)";
    d.args = {dm, l, f, alpha};
    d.result = none();
    d.result_unit = "%";
    d.formula = "l*(pi*dm - f*l/cos(alpha)) / (pi*dm*(l + pi*f*dm/cos(alpha)))";
    d.limits = "dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg; pi*dm - f*l/cos(alpha) > 0";
    d.source = kSource;
    d.example = {0.030, 0.008, 0.08, 0};
    d.eval = screwEfficiency;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "screw_efficiency_with_collar";
    d.summary = "Overall efficiency of a power screw with a plain thrust collar: F*l / (2*pi*torque_raise_with_collar)";
    d.args = {dm, l, f, alpha, fc, dc};
    d.result = none();
    d.result_unit = "%";
    d.formula = "l / (pi*(dm*(l + pi*f*dm/cos(alpha))/(pi*dm - f*l/cos(alpha)) + fc*dc))";
    d.limits = "dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg, 0 <= fc <= 1, dc > 0; "
               "pi*dm - f*l/cos(alpha) > 0";
    d.source = kSource;
    d.example = {0.030, 0.008, 0.08, 0, 0.08, 0.040};
    d.eval = screwEfficiencyWithCollar;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "self_locking_margin";
    d.summary = "Self-locking margin of a thread, f - tan(lambda)*cos(alpha): the thread alone holds the load "
                "when it is > 0 (same sign as torque_lower)";
    d.args = {dm, l, f, alpha};
    d.result = none();
    d.result_unit = "1";
    d.formula = "f - l*cos(alpha)/(pi*dm)";
    d.limits = "dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg. Check it with the LOW friction value";
    d.source = kSource;
    d.caution = kLockCaution;
    d.example = {0.030, 0.008, 0.08, 0};
    d.eval = selfLockingMargin;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "screw_backdrive_efficiency";
    d.summary = "Back-driving efficiency of a thread that is not self-locking (the load turning the screw)";
    d.args = {dm, l, f, alpha};
    d.result = none();
    d.result_unit = "%";
    d.formula = "pi*dm*(l - pi*f*dm/cos(alpha)) / (l*(pi*dm + f*l/cos(alpha)))";
    d.limits = "dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg; the thread must not be self-locking "
               "(f <= tan(lambda)*cos(alpha)): a self-locking thread is an error (self-locking, back-driving "
               "efficiency not defined), never a negative efficiency; self_locking_margin tells which";
    d.source = kSource;
    d.caution = kLockCaution;
    d.example = {0.030, 0.008, 0.08, 0};
    d.eval = screwBackdriveEfficiency;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "backdrive_force";
    d.summary = "Axial load at which a non-self-locking thread turns against a resisting torque T "
                "(a brake, a motor's holding torque)";
    d.args = {arg("T", torque(), "torque resisting rotation of the screw"), dm, l, f, alpha};
    d.result = force();
    d.result_unit = "kN";
    d.formula = "2*T/dm * (pi*dm + f*l/cos(alpha)) / (l - pi*f*dm/cos(alpha))";
    d.limits = "T >= 0, dm > 0, l > 0, 0 <= f <= 1, 0 <= alpha <= 45 deg; the thread must not be self-locking "
               "(l - pi*f*dm/cos(alpha) > 0): a self-locking thread is an error. Use the LOW friction value";
    d.source = kSource;
    d.caution = kLockCaution;
    d.example = {0.4656, 0.030, 0.008, 0.08, 0};
    d.eval = backdriveForce;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "starting_friction";
    d.summary = "Starting (static) friction from running friction: 4/3 of it, common practice";
    d.args = {usually(arg("f", none(), "running friction coefficient"), 0.05, 0.30, Show::Plain,
                      "running values of threads and collars (Shigley's Mechanical Engineering Design, 9th ed., Tables 8-5 and 8-6, p. 422, widened as for the thread friction of torque_raise, common practice)")};
    d.result = none();
    d.result_unit = "1";
    d.formula = "4/3*f";
    d.limits = "0 <= f <= 0.75, so that the starting value stays <= 1. Common practice only: the pairs of the "
               "source table start at 1.25 to 1.67 times their running value";
    d.source = "Common practice: starting friction about one third above running friction, as the thrust-collar "
               "friction coefficients of Shigley's Mechanical Engineering Design, 9th ed., Table 8-6 (p. 422) show: running/"
               "starting 0.12/0.17 soft steel on cast iron, 0.09/0.15 hard steel on cast iron, 0.08/0.10 soft "
               "steel on bronze, 0.06/0.08 hard steel on bronze, ratios 1.25 to 1.67";
    d.caution = "Use the starting value for the breakaway torque of a motor and the running value, at its low end, "
                "for self-locking.";
    d.example = {0.06};
    d.eval = startingFriction;
    out.push_back(std::move(d));
  }
  return {"Power screws",
          "Sliding-thread screws (square, Acme, trapezoidal). F is the axial load as a magnitude, dm the mean "
          "diameter, l the lead, f the thread friction, alpha the flank angle (acme_flank_angle(), ...). Friction "
          "varies widely with materials, lubrication and finish: use the high value for torque and motor sizing, "
          "the low one for self-locking and back-driving, and starting friction for breakaway."};
}

}  // namespace calctrail::fn
