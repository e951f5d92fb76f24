// The motor of a screw drive: torque and power at its shaft for several
// screws sharing a load through a reduction, nut speed and travel time, and
// the next standard rated output.
#include <cmath>
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


// Rated outputs of induction motors, kW: the preferred rated output values of
// IEC 60072-1 (clause 9 of its 1991 edition), which EN 50347 assigns to the
// frame sizes 56 to 315 up to 200 kW (the series and the assignment from
// memory). Every value held from 1.1 kW up is in a published list of IEC motor ratings
// (IPS-E-EL-100, Tables A1 and A2, tests/functions_motors_test.cc). Above
// 200 kW that list also has 220, 280, 300, 335, 375, 425, 475, 530, 600,
// 670, 750, 850 and 950 kW; no second source for them was at hand, so they
// are not held, and a requirement between two held values takes the larger.
const double kRatedKw[] = {0.06, 0.09, 0.12, 0.18, 0.25, 0.37, 0.55, 0.75, 1.1, 1.5, 2.2, 3,  4,   5.5, 7.5,
                           11,   15,   18.5, 22,   30,   37,   45,   55,   75,  90,  110, 132, 160, 200,
                           250,  315,  355,  400,  450,  500,  560,  630,  710, 800, 900, 1000};
// The table as standard_motor_power's formula quotes it, constant so that it is
// not formatted at start-up: ratedMotorText(), which tests/functions_table_texts_test.cc checks.
constexpr char kRatedSeries[] =
    "0.06, 0.09, 0.12, 0.18, 0.25, 0.37, 0.55, 0.75, 1.1, 1.5, 2.2, 3, 4, 5.5, 7.5, 11, 15, 18.5, 22, 30, 37, "
    "45, 55, 75, 90, 110, 132, 160, 200, 250, 315, 355, 400, 450, 500, 560, 630, 710, 800, 900, 1000 kW";

double screwsTorque(const double* a) {
  const double T = nonNegative(a, 0, "torque per screw T_screw", Show::Torque);
  const double n = count(a, 1, "number of screws");
  return T * n;
}

double motorTorque(const double* a) {
  const double T = screwsTorque(a);
  const double i = positive(a, 2, "reduction ratio i", Show::Plain);
  const double eta = fraction(a, 3, "drive efficiency eta");
  return result(T / (i * eta));
}

double motorPower(const double* a) {
  const double T = screwsTorque(a);
  const double n = nonNegative(a, 2, "motor speed n_motor", Show::Speed);
  const double i = positive(a, 3, "reduction ratio i", Show::Plain);
  const double eta = fraction(a, 4, "drive efficiency eta");
  return result(T * n / (i * eta));  // n in rad/s: torque times angular velocity
}

double nutSpeedOf(const double* a, int first) {
  const double n = nonNegative(a, first, "motor speed n_motor", Show::Speed);
  const double i = positive(a, first + 1, "reduction ratio i", Show::Plain);
  const double l = positive(a, first + 2, "lead l", Show::Lead);
  return n / (2.0 * kPi) / i * l;  // revolutions per second times metres per revolution
}

double nutSpeed(const double* a) { return result(nutSpeedOf(a, 0)); }

double travelTime(const double* a) {
  const double s = nonNegative(a, 0, "stroke s", Show::Length);
  const double v = nutSpeedOf(a, 1);
  if (!(v > 0)) fail(1, "motor speed n_motor = " + show(a[1], Show::Speed) + " must be > 0 to travel");
  return result(s / v);
}

double standardMotorPower(const double* a) {
  const double P = positive(a, 0, "required power P", Show::Power);
  for (double kw : kRatedKw)
    if (P <= kw * 1e3 * (1 + 1e-9)) return kw * 1e3;
  fail(0, "required power P = " + show(P, Show::Power) + " is above " + num(kRatedKw[std::size(kRatedKw) - 1]) +
              " kW, the largest rated output in this table; choose from the motor maker's range");
}


const char* kDriveSource =
    "Power and torque balance of a drive (P = T*omega, torque through a reduction T_out = T_in*i*eta), as in "
    "Shigley's Mechanical Engineering Design, Sec. 8-2 and Ch. 13 (from memory)";

}  // namespace

std::string ratedMotorText() {
  std::string s;
  for (double kw : kRatedKw) {
    if (!s.empty()) s += ", ";
    s += num(kw);
  }
  return s + " kW";
}

GroupText addMotors(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg T_screw = arg("T_screw", torque(), "torque to turn one screw (raise, with collar)");
  const FunctionArg screws = arg("screws", none(), "number of screws sharing the load, driven together");
  const FunctionArg n_motor = arg("n_motor", rotSpeed(), "motor speed");
  const FunctionArg i = arg("i", none(), "overall reduction ratio from motor to screw");
  const FunctionArg eta = arg("eta", none(), "efficiency of the drive between motor and screws");
  const FunctionArg l = arg("l", length(), "lead of the screw", true);
  {
    FunctionDecl d;
    d.name = "motor_torque";
    d.summary = "Torque at the motor shaft driving several screws through a reduction";
    d.args = {T_screw, screws, i, eta};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "screws*T_screw/(i*eta)";
    d.limits = "T_screw >= 0 (a load that drives the screw down is a brake's duty, sized on its magnitude), "
               "screws a whole number >= 1, i > 0, 0 < eta <= 1";
    d.source = kDriveSource;
    d.caution = "Size the motor for starting friction and for the worst load case, not the running average.";
    d.example = {26.18, 2, 20, 0.7};
    d.eval = motorTorque;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "motor_power";
    d.summary = "Power at the motor shaft driving several screws through a reduction";
    d.args = {T_screw, screws, n_motor, i, eta};
    d.result = power();
    d.result_unit = "kW";
    d.formula = "n_motor*screws*T_screw/(i*eta)";
    d.limits = "T_screw >= 0, screws a whole number >= 1, n_motor >= 0, i > 0, 0 < eta <= 1";
    d.source = kDriveSource;
    d.example = {26.18, 2, 1450 * 2 * kPi / 60, 20, 0.7};
    d.eval = motorPower;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "nut_speed";
    d.summary = "Linear speed of the nut from the motor speed, the reduction and the lead";
    d.args = {n_motor, i, l};
    d.result = speed();
    d.result_unit = "mm/s";
    d.formula = "n_motor*l/(i*1 [rev])";
    d.limits = "n_motor >= 0, i > 0, l > 0";
    d.source = "Kinematics of the screw: axial advance of one lead per revolution (definition of lead)";
    d.example = {1450 * 2 * kPi / 60, 20, 0.008};
    d.eval = nutSpeed;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "travel_time";
    d.summary = "Time to travel a stroke at constant nut speed (acceleration neglected)";
    d.args = {arg("s", length(), "stroke (travel of the nut)"), n_motor, i, l};
    d.result = time();
    d.result_unit = "s";
    d.formula = "s*i*1 [rev]/(n_motor*l)";
    d.limits = "s >= 0, n_motor > 0, i > 0, l > 0";
    d.source = "Kinematics of the screw: axial advance of one lead per revolution (definition of lead)";
    d.example = {0.5, 1450 * 2 * kPi / 60, 20, 0.008};
    d.eval = travelTime;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "standard_motor_power";
    d.summary = "The next standard rated output at or above a required power (IEC 60072-1 series)";
    d.args = {arg("P", power(), "required power at the motor shaft")};
    d.result = power();
    d.result_unit = "kW";
    static constexpr auto kFormula = join("smallest rated output >= P from the series ", kRatedSeries);
    d.formula = kFormula.view();
    d.formula_is_expression = false;
    d.limits = "0 < P <= 1000 kW; above it the table ends and this is an error. Up to 200 kW the outputs have "
               "standard frame sizes (EN 50347); above, the frame is the maker's";
    d.source = "Rated outputs from the preferred rated output values of IEC 60072-1 (rotating electrical "
               "machines, dimensions and output series; clause 9 of the 1991 edition; the 2022 edition, "
               "revised on the basis of EN 50347, also relates frame numbers 56 to 400 to the rated "
               "outputs), the clause and editions as the publishers' catalogue pages give them; each value "
               "held from 1.1 kW up is also in the lists of IEC motor ratings of IPS-E-EL-100 (Tables A1 "
               "and A2). The assignment of the outputs to the frame sizes 56 to 315 of three-phase induction "
               "motors is EN 50347, which the motor makers' ranges follow (from memory)";
    d.example = {1200};
    d.eval = standardMotorPower;
    out.push_back(std::move(d));
  }
  return {"Motors",
          "The motor turns all screws through the reduction: its torque is the screws' torque over ratio times "
          "efficiency, its power that torque times its angular speed. The nut advances one lead per revolution: "
          "n*l/(1 rev): rpm times mm per revolution in the units of the trade."};
}

}  // namespace calctrail::fn
