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

double overallRatio2(const double* a) { return result(ratio(a, 0, "ratio i1") * ratio(a, 1, "ratio i2")); }
double overallRatio3(const double* a) {
  return result(ratio(a, 0, "ratio i1") * ratio(a, 1, "ratio i2") * ratio(a, 2, "ratio i3"));
}
double overallEff2(const double* a) {
  return result(fraction(a, 0, "efficiency eta1") * fraction(a, 1, "efficiency eta2"));
}
double overallEff3(const double* a) {
  return result(fraction(a, 0, "efficiency eta1") * fraction(a, 1, "efficiency eta2") *
                fraction(a, 2, "efficiency eta3"));
}

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

double wormBackdriveEfficiency(const double* a) {
  const Worm w = worm(a);
  return result((std::cos(w.phi) - w.f / std::tan(w.lambda)) / (std::cos(w.phi) + w.f * std::tan(w.lambda)));
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
    d.name = "overall_ratio_2";
    d.summary = "Overall reduction ratio of two stages in series";
    d.args = {arg("i1", none(), "ratio of stage 1 (input speed / output speed)"),
              arg("i2", none(), "ratio of stage 2")};
    d.result = none();
    d.result_unit = "1";
    d.formula = "i1*i2";
    d.limits = "i1 > 0, i2 > 0 (a ratio below 1 steps the speed up)";
    d.source = kTrainSource;
    d.example = {5.5, 5.5};
    d.eval = overallRatio2;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "overall_ratio_3";
    d.summary = "Overall reduction ratio of three stages in series";
    d.args = {arg("i1", none(), "ratio of stage 1 (input speed / output speed)"),
              arg("i2", none(), "ratio of stage 2"), arg("i3", none(), "ratio of stage 3")};
    d.result = none();
    d.result_unit = "1";
    d.formula = "i1*i2*i3";
    d.limits = "i1, i2, i3 > 0";
    d.source = kTrainSource;
    d.example = {5.5, 1, 5.5};
    d.eval = overallRatio3;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "overall_efficiency_2";
    d.summary = "Overall efficiency of two stages or elements in series";
    d.args = {arg("eta1", none(), "efficiency of element 1"), arg("eta2", none(), "efficiency of element 2")};
    d.result = none();
    d.result_unit = "%";
    d.formula = "eta1*eta2";
    d.limits = "0 < eta1, eta2 <= 1";
    d.source = kTrainSource;
    d.example = {0.97, 0.95};
    d.eval = overallEff2;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "overall_efficiency_3";
    d.summary = "Overall efficiency of three stages or elements in series";
    d.args = {arg("eta1", none(), "efficiency of element 1"), arg("eta2", none(), "efficiency of element 2"),
              arg("eta3", none(), "efficiency of element 3")};
    d.result = none();
    d.result_unit = "%";
    d.formula = "eta1*eta2*eta3";
    d.limits = "0 < eta1, eta2, eta3 <= 1";
    d.source = kTrainSource;
    d.example = {0.97, 0.95, 0.9};
    d.eval = overallEff3;
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
    d.summary = "Efficiency of a worm gear set driven from the wheel; <= 0 means the worm self-locks";
    d.args = {lambda, phi_n, f};
    d.result = none();
    d.result_unit = "%";
    d.formula = "(cos(phi_n) - f/tan(lambda)) / (cos(phi_n) + f*tan(lambda))";
    d.limits = "0 < lambda < 90 deg, 0 <= phi_n <= 45 deg, 0 <= f <= 1; the result may be negative "
               "(self-locking). Check it with the LOW friction value (friction falls as the sliding speed rises)";
    d.source = kWormSource;
    d.caution = "A self-locking worm is no brake: vibration, running friction and wear can let it back-drive; "
                "provide a brake where a load is held.";
    d.example = {10 * kPi / 180, 20 * kPi / 180, 0.05};
    d.eval = wormBackdriveEfficiency;
    out.push_back(std::move(d));
  }
  return {"Gears and drive",
          "Ratios are input speed over output speed (reductions above 1). Efficiencies multiply along the chain; "
          "output torque is input torque times ratio times efficiency, so power in = power out / efficiency. The "
          "worm formulas are the power-screw formulas written with the lead angle and the normal pressure angle."};
}

}  // namespace calctrail::fn
