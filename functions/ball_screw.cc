// Ball screws: driving and back-driving torque from efficiency, basic rating
// life per ISO 3408-5 from the cubic-mean load of a duty cycle, and the
// critical (whirling) speed of the screw shaft.
#include <cmath>
#include <string>
#include <vector>

#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/validity.h"
#include "engine/util/math_constants.h"

namespace calctrail::fn {

namespace {


double driveTorque(const double* a) {
  const double F = positive(a, 0, "axial load F", Show::Force);
  const double l = positive(a, 1, "lead l", Show::Lead);
  const double eta = fraction(a, 2, "efficiency eta");
  return result(F * l / (2.0 * kPi * eta));
}

double backdriveTorque(const double* a) {
  const double F = positive(a, 0, "axial load F", Show::Force);
  const double l = positive(a, 1, "lead l", Show::Lead);
  const double eta_b = fraction(a, 2, "back-driving efficiency eta_b");
  return result(F * l * eta_b / (2.0 * kPi));
}

double life(const double* a) {
  const double Ca = positive(a, 0, "dynamic load rating Ca", Show::Force);
  const double Fm = positive(a, 1, "mean load Fm", Show::Force);
  const double r = Ca / Fm;
  return result(r * r * r * 1e6 * 2.0 * kPi);  // revolutions, as an angle in rad
}

// Steps of (load, speed, time fraction) from argument 0 on.
double cubicMean(const double* a, int steps) {
  static const char* kLoad[] = {"load F1", "load F2", "load F3"};
  static const char* kSpeed[] = {"speed n1", "speed n2", "speed n3"};
  static const char* kShare[] = {"time fraction q1", "time fraction q2", "time fraction q3"};
  double sum_f3 = 0, sum_n = 0;
  for (int k = 0; k < steps; ++k) {
    const double F = nonNegative(a, 3 * k, kLoad[k], Show::Force);
    const double n = nonNegative(a, 3 * k + 1, kSpeed[k], Show::Speed);
    const double q = nonNegative(a, 3 * k + 2, kShare[k], Show::Plain);
    sum_f3 += F * F * F * n * q;
    sum_n += n * q;
  }
  if (!(sum_n > 0))
    fail(-1, "the duty cycle has no revolutions: at least one step needs a speed n > 0 and a time fraction q > 0");
  return result(std::cbrt(sum_f3 / sum_n));
}

double cubicMean2(const double* a) { return cubicMean(a, 2); }
double cubicMean3(const double* a) { return cubicMean(a, 3); }

double criticalSpeed(const double* a) {
  const double dr = positive(a, 0, "minor diameter dr", Show::Length);
  const double L = positive(a, 1, "unsupported length L", Show::Length);
  const double fixity = positive(a, 2, "end-fixity factor", Show::Plain);
  if (!(fixity <= 4.7301))
    fail(2, "end-fixity factor = " + num(fixity) + " must be <= 4.730 (both ends fixed)");
  const double E = positive(a, 3, "modulus of elasticity E", Show::Modulus);
  const double rho = positive(a, 4, "density rho", Show::Density);
  // First bending mode of a uniform round shaft: omega = fixity^2/L^2 * sqrt(E*I/(rho*A)), I/A = dr^2/16.
  return result(fixity * fixity / (L * L) * dr / 4.0 * std::sqrt(E / rho));
}

const char* kLifeSource =
    "ISO 3408-5 (ball screws: static and dynamic axial load ratings and operational life), basic rating life "
    "and equivalent load of a duty cycle (from memory)";
const char* kTorqueSource =
    "Definition of efficiency (output work over input work per revolution), as used in the ball screw makers' "
    "catalogues and Shigley's Mechanical Engineering Design, Sec. 8-2 (from memory)";

}  // namespace

GroupText addBallScrews(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg F = arg("F", force(), "axial load (magnitude)");
  const FunctionArg l = arg("l", length(), "lead", true);
  {
    FunctionDecl d;
    d.name = "ball_screw_drive_torque";
    d.summary = "Torque to drive a screw against an axial load, from its efficiency (ball screw, or any screw)";
    d.args = {F, l, arg("eta", none(), "driving efficiency (ball screws about 0.9, common practice)")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "F*l/(2*pi*eta)";
    d.limits = "F > 0, l > 0, 0 < eta <= 1. Preload and seal drag torque come on top";
    d.source = kTorqueSource;
    d.example = {6400, 0.008, 0.9};
    d.eval = driveTorque;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_backdrive_torque";
    d.summary = "Torque the axial load exerts on a ball screw that it back-drives: what a brake must hold";
    d.args = {F, l, arg("eta_b", none(), "back-driving efficiency (from the maker; a little below eta)")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "F*l*eta_b/(2*pi)";
    d.limits = "F > 0, l > 0, 0 < eta_b <= 1";
    d.source = kTorqueSource;
    d.caution = "A ball screw is not self-locking: a held load needs a brake sized for this torque, with the "
                "high efficiency value.";
    d.example = {6400, 0.008, 0.8};
    d.eval = backdriveTorque;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_life";
    d.summary = "Basic rating life L10 in revolutions (90 % reliability) from the dynamic load rating and the "
                "mean load";
    d.args = {arg("Ca", force(), "basic dynamic axial load rating (maker's catalogue)"),
              arg("Fm", force(), "cubic-mean axial load of the duty cycle (cubic_mean_load_2, _3)")};
    d.result = angle();
    d.result_unit = "rev";
    d.formula = "(Ca/Fm)^3 * 1e6 [rev]";
    d.limits = "Ca > 0, Fm > 0. Life in revolutions; divide by the mean speed for a time. The peak load must also "
               "stay below the static rating C0a";
    d.source = kLifeSource;
    d.caution = "L10 is a statistical life: one screw in ten fails sooner; shock loads, misalignment and poor "
                "lubrication shorten it.";
    d.example = {30000, 3000};
    d.eval = life;
    out.push_back(std::move(d));
  }
  const char* kMeanFormula2 = "((F1^3*n1*q1 + F2^3*n2*q2) / (n1*q1 + n2*q2))^(1/3)";
  const char* kMeanFormula3 = "((F1^3*n1*q1 + F2^3*n2*q2 + F3^3*n3*q3) / (n1*q1 + n2*q2 + n3*q3))^(1/3)";
  for (int steps = 2; steps <= 3; ++steps) {
    FunctionDecl d;
    d.name = steps == 2 ? "cubic_mean_load_2" : "cubic_mean_load_3";
    d.summary = steps == 2 ? "Cubic-mean axial load of a two-step duty cycle (load, speed, time fraction)"
                           : "Cubic-mean axial load of a three-step duty cycle (load, speed, time fraction)";
    for (int k = 1; k <= steps; ++k) {
      const std::string s = std::to_string(k);
      FunctionArg load = arg("", force(), "");
      load.name = "F" + s;
      load.description = "axial load of step " + s;
      FunctionArg speed = arg("", rotSpeed(), "");
      speed.name = "n" + s;
      speed.description = "screw speed of step " + s;
      FunctionArg share = arg("", none(), "");
      share.name = "q" + s;
      share.description = "time fraction of step " + s + " (fractions need not add up to 1)";
      d.args.push_back(load);
      d.args.push_back(speed);
      d.args.push_back(share);
    }
    d.result = force();
    d.result_unit = "kN";
    d.formula = steps == 2 ? kMeanFormula2 : kMeanFormula3;
    d.limits = "loads, speeds and time fractions >= 0, with at least one step that turns (n*q > 0). "
               "The mean speed of the cycle is the sum of n*q over the sum of q";
    d.source = kLifeSource;
    if (steps == 2)
      d.example = {4000, 100 * 2 * kPi / 60, 0.25, 1000, 300 * 2 * kPi / 60, 0.75};
    else
      d.example = {2000, 50 * 2 * kPi / 60, 0.2, 3000, 100 * 2 * kPi / 60, 0.5, 1000, 1000 * 2 * kPi / 60, 0.3};
    d.eval = steps == 2 ? cubicMean2 : cubicMean3;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "critical_speed";
    d.summary = "Critical (whirling) speed of a screw shaft: first bending mode of a uniform round shaft";
    d.args = {arg("dr", length(), "minor (root) diameter of the screw"),
              arg("L", length(), "unsupported length between bearings (or to the free end)"),
              arg("fixity", none(), "end-fixity factor: 1.875 fixed-free, pi (3.142) both supported, "
                                    "3.927 fixed-supported, 4.730 both fixed"),
              arg("E", stress(), "modulus of elasticity"), arg("rho", density(), "density of the screw material")};
    d.result = rotSpeed();
    d.result_unit = "rpm";
    d.formula = "fixity^2*dr/(4*L^2) * sqrt(E/rho)";
    d.limits = "dr > 0, L > 0, 0 < fixity <= 4.730, E > 0, rho > 0. The theoretical speed: run below it with a "
               "margin (80 % is common practice)";
    d.source = "First natural frequency of a uniform Euler-Bernoulli beam, omega = fixity^2/L^2*sqrt(E*I/(rho*A)) "
               "with the eigenvalues of its end conditions, as tabulated in the vibration handbooks; ball screw "
               "makers' catalogues print it with a factor 0.8 (from memory)";
    d.caution = "A screw run near its critical speed whips: keep the working speed at most about 80 % of it, "
                "with the longest unsupported length of the stroke.";
    d.example = {0.028, 1.5, 3.927, 206e9, 7850};
    d.eval = criticalSpeed;
    out.push_back(std::move(d));
  }
  return {"Ball screws",
          "Rolling-element screws: high efficiency (about 0.9, common practice), so never self-locking. Life "
          "follows ISO 3408-5: L10 = (Ca/Fm)^3 million revolutions, with Fm the cubic mean of the duty cycle "
          "weighted by revolutions (speed times time fraction). A life in revolutions is an angle (1e6 [rev]): "
          "divided by a speed in rpm it gives a time."};
}

}  // namespace calctrail::fn
