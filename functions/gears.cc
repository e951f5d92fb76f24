// Gear reductions between motor and screw: overall ratio and efficiency of
// stages in series, output torque and speed, input power, and worm gear
// efficiency both ways (the worm self-locks when back-driving fails).
#include <cmath>
#include <string>
#include <vector>

#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/validity.h"
#include "engine/util/math_constants.h"

namespace calctrail::fn {

namespace {


double ratio(const double* a, int i, const char* what) { return positive(a, i, what, Show::Plain); }

// Stage k of a train (0-based): a ratio > 0, or an efficiency 0 < eta <= 1.
// The argument's name is built only when the value is refused.
double stage(const double* a, int k, bool efficiency) {
  const double v = a[k];
  if (std::isfinite(v) && v > 0 && (!efficiency || v <= 1)) return v;
  const std::string what = (efficiency ? "efficiency eta" : "ratio i") + std::to_string(k + 1);
  if (efficiency) fraction(a, k, what.c_str());
  positive(a, k, what.c_str(), Show::Plain);
  fail(k, what + " = " + num(v) + " is outside its limits");
}

double overallRatioN(const double* a, int n) {
  double r = 1;
  for (int k = 0; k < n; ++k) r *= stage(a, k, false);
  return result(r);
}
double overallEffN(const double* a, int n) {
  double r = 1;
  for (int k = 0; k < n; ++k) r *= stage(a, k, true);
  return result(r);
}
double overallRatio(const double* a) { return overallRatioN(a, 2); }
double overallEff(const double* a) { return overallEffN(a, 2); }

double outputTorque(const double* a) {
  const double T = nonNegative(a, 0, "input torque T_in", Show::Torque);
  return result(T * ratio(a, 1, "ratio i") * fraction(a, 2, "efficiency eta"));
}

double outputSpeed(const double* a) {
  const double n = nonNegative(a, 0, "input speed n_in", Show::Speed);
  return result(n / ratio(a, 1, "ratio i"));
}

double inputPower(const double* a) {
  const double P = nonNegative(a, 0, "output power P_out", Show::Power);
  return result(P / fraction(a, 1, "efficiency eta"));
}

struct Worm {
  double lambda, phi, f;
};

Worm worm(const double* a) {
  Worm w;
  w.lambda = positive(a, 0, "lead angle lambda", Show::Angle);
  if (!(w.lambda < kPi / 2)) fail(0, "lead angle lambda = " + show(w.lambda, Show::Angle) + " must be < 90 deg");
  w.phi = flankAngle(a, 1, "normal pressure angle phi_n");
  w.f = friction(a, 2, "friction f");
  return w;
}

double wormEfficiency(const double* a) {
  const Worm w = worm(a);
  const double num_ = std::cos(w.phi) - w.f * std::tan(w.lambda);
  if (!(num_ > 0))
    fail(-1, "the worm cannot drive: f*tan(lambda) = " + num(w.f * std::tan(w.lambda)) +
                 " must be < cos(phi_n) = " + num(std::cos(w.phi)) + " (lead angle beyond the friction limit)");
  return result(num_ / (std::cos(w.phi) + w.f / std::tan(w.lambda)));
}

double wormLockMargin(const Worm& w) { return w.f - std::cos(w.phi) * std::tan(w.lambda); }

double wormBackdriveEfficiency(const double* a) {
  const Worm w = worm(a);
  // Self-locking: the wheel cannot drive the worm, and the formula's negative value is no efficiency.
  if (wormLockMargin(w) > 0)
    fail(-1, "self-locking, back-driving efficiency not defined: f = " + num(w.f) +
                 " > cos(phi_n)*tan(lambda) = " + num(std::cos(w.phi) * std::tan(w.lambda)) +
                 ", so the wheel cannot drive the worm; worm_self_locking_margin gives the margin");
  return result((std::cos(w.phi) - w.f / std::tan(w.lambda)) / (std::cos(w.phi) + w.f * std::tan(w.lambda)));
}

double wormSelfLockingMargin(const double* a) { return result(wormLockMargin(worm(a))); }

double brakeTorque(const double* a) {
  const double T = nonNegative(a, 0, "back-driving torque at the screw T_back", Show::Torque);
  const double i = positive(a, 1, "reduction ratio i", Show::Plain);
  const double eta_b = fraction(a, 2, "back-driving efficiency of the reduction eta_rb");
  const double S = positive(a, 3, "safety factor S", Show::Plain);
  if (!(S >= 1)) fail(3, "safety factor S = " + num(S) + " must be >= 1");
  return result(S * T * eta_b / i);
}

const char* kTrainSource =
    "Gear train value and power balance, as in Shigley's Mechanical Engineering Design, Ch. 13 (gear trains) "
    "(from memory)";
const char* kWormSource =
    "Worm gear efficiency with the normal pressure angle, as in Shigley's Mechanical Engineering Design, "
    "worm gearing chapters, and AGMA practice (from memory)";

}  // namespace

GroupText addGears(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg lambda = arg("lambda", angle(), "lead angle of the worm at its mean diameter (lead_angle)");
  const FunctionArg phi_n = arg("phi_n", angle(), "normal pressure angle (14.5, 20, 25 or 30 deg)");
  const FunctionArg f = arg("f", none(), "friction coefficient at the sliding speed of the mesh");
  {
    FunctionDecl d;
    d.name = "overall_ratio";
    d.summary = "Overall reduction ratio of any number of stages in series";
    d.args = {arg("i1", none(), "ratio of stage 1 (input speed / output speed)"),
              arg("i2", none(), "ratio of stage 2 or of a further stage")};
    d.repeat = 1;
    d.result = none();
    d.result_unit = "1";
    d.formula = "i1*i2";
    d.limits = "every ratio > 0 (a ratio below 1 steps the speed up); two stages or more (the formula shows two: "
               "each further stage multiplies in)";
    d.source = kTrainSource;
    d.example = {5.5, 5.5};
    d.eval = overallRatio;
    d.eval_n = overallRatioN;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "overall_efficiency";
    d.summary = "Overall efficiency of any number of stages or elements in series";
    d.args = {arg("eta1", none(), "efficiency of element 1"),
              arg("eta2", none(), "efficiency of element 2 or of a further element")};
    d.repeat = 1;
    d.result = none();
    d.result_unit = "%";
    d.formula = "eta1*eta2";
    d.limits = "0 < every eta <= 1; two elements or more (the formula shows two: each further one multiplies in)";
    d.source = kTrainSource;
    d.example = {0.97, 0.95};
    d.eval = overallEff;
    d.eval_n = overallEffN;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "output_torque";
    d.summary = "Output torque of a reduction from its input torque, ratio and efficiency";
    d.args = {arg("T_in", torque(), "input torque"), arg("i", none(), "reduction ratio (input / output speed)"),
              arg("eta", none(), "efficiency of the reduction")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "T_in*i*eta";
    d.limits = "T_in >= 0, i > 0, 0 < eta <= 1";
    d.source = kTrainSource;
    d.example = {20, 25, 0.8};
    d.eval = outputTorque;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "output_speed";
    d.summary = "Output speed of a reduction";
    d.args = {arg("n_in", rotSpeed(), "input speed"), arg("i", none(), "reduction ratio (input / output speed)")};
    d.result = rotSpeed();
    d.result_unit = "rpm";
    d.formula = "n_in/i";
    d.limits = "n_in >= 0, i > 0";
    d.source = kTrainSource;
    d.example = {1450 * 2 * kPi / 60, 25};
    d.eval = outputSpeed;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "input_power";
    d.summary = "Input power of a drive from its output power and efficiency";
    d.args = {arg("P_out", power(), "output power"), arg("eta", none(), "efficiency between input and output")};
    d.result = power();
    d.result_unit = "kW";
    d.formula = "P_out/eta";
    d.limits = "P_out >= 0, 0 < eta <= 1";
    d.source = kTrainSource;
    d.example = {1000, 0.8};
    d.eval = inputPower;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "worm_efficiency";
    d.summary = "Efficiency of a worm gear set, worm driving";
    d.args = {lambda, phi_n, f};
    d.result = none();
    d.result_unit = "%";
    d.formula = "(cos(phi_n) - f*tan(lambda)) / (cos(phi_n) + f/tan(lambda))";
    d.limits = "0 < lambda < 90 deg, 0 <= phi_n <= 45 deg, 0 <= f <= 1; f*tan(lambda) < cos(phi_n), else the "
               "worm cannot drive (lead angle beyond the friction limit)";
    d.source = kWormSource;
    d.example = {10 * kPi / 180, 20 * kPi / 180, 0.05};
    d.eval = wormEfficiency;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "worm_backdrive_efficiency";
    d.summary = "Efficiency of a worm gear set driven from the wheel (not self-locking sets only)";
    d.args = {lambda, phi_n, f};
    d.result = none();
    d.result_unit = "%";
    d.formula = "(cos(phi_n) - f/tan(lambda)) / (cos(phi_n) + f*tan(lambda))";
    d.limits = "0 < lambda < 90 deg, 0 <= phi_n <= 45 deg, 0 <= f <= 1; f <= cos(phi_n)*tan(lambda): a "
               "self-locking set is an error (self-locking, back-driving efficiency not defined), never a "
               "negative efficiency; worm_self_locking_margin tells. Check it with the LOW friction value "
               "(friction falls as the sliding speed rises)";
    d.source = kWormSource;
    d.caution = "A self-locking worm is no brake: vibration, running friction and wear can let it back-drive; "
                "provide a brake where a load is held.";
    d.example = {10 * kPi / 180, 20 * kPi / 180, 0.05};
    d.eval = wormBackdriveEfficiency;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "worm_self_locking_margin";
    d.summary = "Self-locking margin of a worm gear set, f - cos(phi_n)*tan(lambda): the wheel cannot drive the "
                "worm when it is >= 0";
    d.args = {lambda, phi_n, f};
    d.result = none();
    d.result_unit = "1";
    d.formula = "f - cos(phi_n)*tan(lambda)";
    d.limits = "0 < lambda < 90 deg, 0 <= phi_n <= 45 deg, 0 <= f <= 1. Evaluate it twice: with the static "
               "(starting) friction it says whether the set holds at standstill, with the running friction at "
               "the sliding speed whether it runs on, back-driven, once moving";
    d.source = kWormSource;
    d.caution = "A worm that locks at standstill may not lock when running (friction falls with sliding speed) "
                "or under vibration: a held load needs a brake.";
    d.example = {5 * kPi / 180, 20 * kPi / 180, 0.1};
    d.eval = wormSelfLockingMargin;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "brake_holding_torque";
    d.summary = "Torque a brake on the motor shaft must hold: the load's back-driving torque at the screw, "
                "referred through the reduction driven backwards, times a safety factor";
    d.args = {arg("T_back", torque(), "torque the held load exerts on the screw (ball_screw_backdrive_torque, "
                                      "or -torque_lower of a screw that is not self-locking)"),
              arg("i", none(), "reduction ratio from motor to screw (input speed / output speed)"),
              arg("eta_rb", none(), "back-driving efficiency of the reduction (the screw side driving)"),
              arg("S", none(), "safety factor on the holding torque (brake makers ask 1.5 to 2, common "
                               "practice)")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "S*T_back*eta_rb/i";
    d.limits = "T_back >= 0, i > 0, 0 < eta_rb <= 1, S >= 1. The back-driven efficiency of the reduction lowers "
               "the torque at the brake; take its HIGH value (a reduction that runs in well back-drives better)";
    d.source = "Power balance of a drive driven backwards: T_in = T_out*eta_b/i, as for the output torque of a "
               "reduction, Shigley's Mechanical Engineering Design, Ch. 13 (from memory); safety factor as in "
               "the brake makers' selection guides, common practice";
    d.caution = "A brake that holds the static load may not stop a falling one: check the dynamic braking torque "
                "and the stopping distance too.";
    d.example = {7.0, 10, 0.9, 2};
    d.eval = brakeTorque;
    out.push_back(std::move(d));
  }
  return {"Gears and drive",
          "Ratios are input speed over output speed (reductions above 1). Efficiencies multiply along the chain; "
          "output torque is input torque times ratio times efficiency, so power in = power out / efficiency. The "
          "worm formulas are the power-screw formulas written with the lead angle and the normal pressure angle."};
}

}  // namespace calctrail::fn
