// Servo and stepper sizing of a screw axis: the inertia the motor sees (the
// screw, the load through the screw, parts behind a reduction), the torque to
// accelerate it, the speed of a trapezoidal move and the RMS torque of a duty
// cycle, to compare with the motor's rated (continuous) torque.
#include <cmath>
#include <string>
#include <vector>

#include "engine/util/math_constants.h"
#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/validity.h"

namespace calctrail::fn {

namespace {

double screwInertia(const double* a) {
  const double d = positive(a, 0, "screw diameter d", Show::Length);
  const double L = positive(a, 1, "screw length L", Show::Length);
  const double rho = positive(a, 2, "density rho", Show::Density);
  if (!(rho <= 23000))
    fail(2, "density rho = " + show(rho, Show::Density) +
                " is above that of any solid (osmium, 22 600 kg/m^3): a slip of units?");
  return result(kPi * rho * L * d * d * d * d / 32.0);
}

double loadInertia(const double* a) {
  const double m = positive(a, 0, "moved mass m", Show::Mass);
  const double l = positive(a, 1, "lead l", Show::Lead);
  const double r = l / (2.0 * kPi);  // metres of travel per radian
  return result(m * r * r);
}

double reflectedInertia(const double* a) {
  const double J = nonNegative(a, 0, "inertia J", Show::Inertia);
  const double i = positive(a, 1, "reduction ratio i", Show::Plain);
  return result(J / (i * i));
}

double accelTorque(const double* a) {
  const double J = nonNegative(a, 0, "inertia J", Show::Inertia);
  const double n = nonNegative(a, 1, "speed change n", Show::Speed);
  const double t = positive(a, 2, "ramp time t_acc", Show::Time);
  return result(J * n / t);
}

double peakSpeed(const double* a) {
  const double s = positive(a, 0, "move length s", Show::Length);
  const double t = positive(a, 1, "move time t_move", Show::Time);
  const double ta = nonNegative(a, 2, "ramp time t_acc", Show::Time);
  if (!(ta <= t / 2))
    fail(2, "ramp time t_acc = " + show(ta, Show::Time) + " must be at most half the move time t_move = " +
                show(t, Show::Time) + " (a triangular move): two ramps must fit into the move");
  return result(s / (t - ta));
}

// Segments of (torque, duration), n/2 of them.
double rmsTorqueN(const double* a, int n) {
  double sum_t2 = 0, sum_t = 0;
  for (int k = 0; k + 1 < n; k += 2) {
    const double T = a[k];
    const double t = a[k + 1];
    if (!std::isfinite(T)) {
      const std::string what = "torque T" + std::to_string(k / 2 + 1);
      finite(a, k, what.c_str(), Show::Torque);
    }
    if (!(std::isfinite(t) && t >= 0)) {
      const std::string what = "duration t" + std::to_string(k / 2 + 1);
      nonNegative(a, k + 1, what.c_str(), Show::Time);
    }
    sum_t2 += T * T * t;
    sum_t += t;
  }
  if (!(sum_t > 0)) fail(-1, "the duty cycle has no duration: at least one segment needs a time t > 0");
  return result(std::sqrt(sum_t2 / sum_t));
}

double rmsTorque(const double* a) {
  return rmsTorqueN(a, 4);
}

const char* kInertiaSource =
    "Mass moment of inertia of a solid cylinder, J = m*d^2/8 (Machinery's Handbook, moments of inertia), and "
    "the inertia referred through a screw, m*(l/(2*pi))^2, and through a reduction, J/i^2, from the equality "
    "of "
    "kinetic energy, as in the servo makers' sizing guides (from memory)";
const char* kMotionSource =
    "Newton's law for rotation, T = J*d(omega)/dt, for a linear speed ramp, and the RMS (thermally "
    "equivalent) "
    "torque of a duty cycle, sqrt(sum(T^2*t)/sum(t)), as in the servo makers' sizing guides (from memory)";

}  // namespace

GroupText addServo(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg J = arg("J", inertia(), "mass moment of inertia");
  const FunctionArg i =
      arg("i", none(), "reduction ratio from motor to the part (input speed / output speed)");
  {
    FunctionDecl d;
    d.name = "screw_inertia";
    d.summary = "Mass moment of inertia of a screw shaft about its axis, as a solid cylinder";
    d.args = {arg("d", length(), "diameter of the shaft (the nominal diameter is conservative)"),
              arg("L", length(), "length of the shaft"),
              usually(arg("rho", density(), "density of the shaft material"), 1500, 9500, Show::Density,
                      "screw shaft materials: aluminium 2700, titanium 4500, steels 7750 to 8050 kg/m^3 "
                      "(handbook tables, from memory)")};
    d.result = inertia();
    d.result_unit = "kg*cm^2";
    d.formula = "pi*rho*L*d^4/32";
    d.limits = "d > 0, L > 0, 0 < rho <= 23000 kg/m^3";
    d.source = kInertiaSource;
    d.example = {0.032, 1.2, 7850};
    d.eval = screwInertia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "load_inertia_screw";
    d.summary = "Inertia of a moved mass as the screw sees it: m*(l/(2*pi))^2";
    d.args = {arg("m", mass(), "mass moved by the nut (carriage, load, nut)"),
              arg("l", length(), "lead", true)};
    d.result = inertia();
    d.result_unit = "kg*cm^2";
    d.formula = "m*(l/(1 [rev]))^2";
    d.limits = "m > 0, l > 0. Friction and thrust forces are torques, not inertia: add them apart";
    d.source = kInertiaSource;
    d.example = {120, 0.010};
    d.eval = loadInertia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "reflected_inertia";
    d.summary = "Inertia of a part behind a reduction as the motor sees it: J/i^2";
    d.args = {J, i};
    d.result = inertia();
    d.result_unit = "kg*cm^2";
    d.formula = "J/i^2";
    d.limits = "J >= 0, i > 0. Parts on the motor side (coupling, pinion) count at full value";
    d.source = kInertiaSource;
    d.example = {0.004, 3};
    d.eval = reflectedInertia;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "accel_torque";
    d.summary = "Torque to change the speed of an inertia by n in a linear ramp of time t_acc";
    d.args = {arg("J", inertia(), "total inertia at the motor shaft, the motor's own included"),
              arg("n", rotSpeed(), "speed change at the motor shaft"), arg("t_acc", time(), "ramp time")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "J*n/t_acc";
    d.limits =
        "J >= 0, n >= 0, t_acc > 0. Friction and load torques come on top while accelerating and are "
        "subtracted while decelerating";
    d.source = kMotionSource;
    d.caution =
        "Size the peak torque for the worst case: the highest load, the shortest ramp, and friction at "
        "its high value.";
    d.example = {0.002, 3000 * 2 * kPi / 60, 0.1};
    d.eval = accelTorque;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "trapezoid_peak_speed";
    d.summary = "Top speed of a trapezoidal move (equal ramps up and down) of length s in a time t_move";
    d.args = {arg("s", length(), "length of the move"),
              arg("t_move", time(), "time of the move, ramps included"),
              arg("t_acc", time(), "time of each ramp (t_move/2 for a triangular move)")};
    d.result = speed();
    d.result_unit = "m/s";
    d.formula = "s/(t_move - t_acc)";
    d.limits = "s > 0, t_move > 0, 0 <= t_acc <= t_move/2";
    d.source =
        "Kinematics of a trapezoidal speed profile: the area under the speed, v*(t_move - t_acc), is the "
        "move length (servo makers' sizing guides, from memory)";
    d.example = {0.3, 0.8, 0.15};
    d.eval = peakSpeed;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "rms_torque";
    d.summary = "RMS torque of a duty cycle of any number of segments (torque, duration), dwell included";
    d.args = {
        arg("T1", torque(), "torque of segment 1 (accelerating, say)"),
        arg("t1", time(), "duration of segment 1"),
        arg("T2", torque(), "torque of segment 2 or of a further one (a dwell: its holding torque, often 0)"),
        arg("t2", time(), "duration of segment 2 or of a further one")};
    d.repeat = 2;
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "sqrt((T1^2*t1 + T2^2*t2)/(t1 + t2))";
    d.limits =
        "two segments or more (the formula shows two: each further one adds its T^2*t and t); torques "
        "of either sign, durations >= 0 with a total > 0. Compare it with the motor's rated "
        "(continuous) torque, and the largest segment torque with its peak torque";
    d.source = kMotionSource;
    d.caution =
        "The RMS torque judges heating over a cycle much shorter than the motor's thermal time "
        "constant; a long peak heats the winding on its own.";
    d.example = {3.2, 0.15, 0.4, 0.5};
    d.eval = rmsTorque;
    d.eval_n = rmsTorqueN;
    out.push_back(std::move(d));
  }
  return {
      "Servo sizing",
      "The motor of a positioning axis is sized on inertia and on a move profile, not on power alone. The "
      "inertia at the motor is the motor's own, plus coupling and screw, plus the moved mass through the "
      "screw, m*(l/(2*pi))^2, each part behind a reduction divided by i^2. A trapezoidal move accelerates, "
      "runs and decelerates; each segment's torque is the friction and load torque plus or minus J times "
      "the angular acceleration. The RMS torque over the cycle, dwell included, is compared with the "
      "rated torque; the largest segment torque with the peak torque."};
}

}  // namespace calctrail::fn
