// Thrust collars and thrust bearings: the friction torque of the face that
// carries the axial load of a screw.
#include <cmath>
#include <string>
#include <vector>

#include "functions/dims.h"
#include "functions/function_library.h"
#include "functions/validity.h"

namespace calctrail::fn {

namespace {

double load(const double* a) { return positive(a, 0, "axial load F", Show::Force); }

// Outer and inner diameters of an annular face, Do > Di >= 0.
void annulus(const double* a, int first) {
  const double Do = positive(a, first, "outer diameter Do", Show::Length);
  const double Di = nonNegative(a, first + 1, "inner diameter Di", Show::Length);
  if (!(Di < Do))
    fail(first + 1, "inner diameter Di = " + show(Di, Show::Length) + " must be smaller than the outer diameter Do = " +
                        show(Do, Show::Length));
}

double collarTorque(const double* a) {
  const double F = load(a);
  const double fc = friction(a, 1, "collar friction fc");
  const double dc = positive(a, 2, "collar mean diameter dc", Show::Length);
  return result(F * fc * dc / 2.0);
}

double uniformPressure(const double* a) {
  const double F = load(a);
  const double fc = friction(a, 1, "collar friction fc");
  annulus(a, 2);
  const double Do = a[2], Di = a[3];
  // (Do^3 - Di^3)/(Do^2 - Di^2) written without the cancelling difference.
  const double ratio = (Do * Do + Do * Di + Di * Di) / (Do + Di);
  return result(fc * F * ratio / 3.0);
}

double uniformWear(const double* a) {
  const double F = load(a);
  const double fc = friction(a, 1, "collar friction fc");
  annulus(a, 2);
  return result(fc * F * (a[2] + a[3]) / 4.0);
}

double thrustBearing(const double* a) {
  const double F = load(a);
  const double mu = nonNegative(a, 1, "bearing friction coefficient mu", Show::Plain);
  if (!(mu <= 0.05))
    fail(1, "bearing friction coefficient mu = " + num(mu) +
                " must be <= 0.05 for a rolling bearing (about 0.001 to 0.005); a sliding face is collar_torque");
  const double d = positive(a, 2, "bearing diameter d", Show::Length);
  return result(mu * F * d / 2.0);
}

const char* kCollarSource =
    "Shigley's Mechanical Engineering Design, Sec. 8-2 (collar friction) and the disc-clutch and flat-pivot "
    "analysis (uniform pressure, uniform wear) of the machine design and theory of machines textbooks (from memory)";
const char* kCollarCaution =
    "Collar friction is often the larger part of the torque: use the high value for motor sizing; "
    "it also helps hold the load, but do not count on it for self-locking.";

}  // namespace

GroupText addCollars(std::vector<FunctionDecl>& out) {
  using namespace dims;
  const FunctionArg F = arg("F", force(), "axial load on the collar (magnitude)");
  const FunctionArg fc = usually(arg("fc", none(), "collar friction coefficient"), 0.05, 0.30, Show::Plain,
                                  "thrust collars of steel on cast iron and on bronze run at 0.06 to 0.12 and start at 0.08 to 0.17 (Shigley's Mechanical Engineering Design, 9th ed., Table 8-6, p. 422); widened to 0.05 to 0.30 as for the thread (common practice), a rolling bearing is thrust_bearing_torque's");
  const FunctionArg Do = arg("Do", length(), "outer diameter of the bearing face");
  const FunctionArg Di = arg("Di", length(), "inner diameter of the bearing face (0 for a solid pivot)");
  {
    FunctionDecl d;
    d.name = "collar_torque";
    d.summary = "Friction torque of a plain thrust collar, load acting at its mean diameter";
    d.args = {F, fc, arg("dc", length(), "collar mean diameter")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "F*fc*dc/2";
    d.limits = "F > 0, 0 <= fc <= 1, dc > 0";
    d.source = kCollarSource;
    d.caution = kCollarCaution;
    d.example = {6400, 0.08, 0.040};
    d.eval = collarTorque;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "collar_torque_uniform_pressure";
    d.summary = "Friction torque of an annular collar under uniform pressure (a new, unworn face)";
    d.args = {F, fc, Do, Di};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "fc*F*(Do^3 - Di^3) / (3*(Do^2 - Di^2))";
    d.limits = "F > 0, 0 <= fc <= 1, Do > Di >= 0";
    d.source = kCollarSource;
    d.caution = kCollarCaution;
    d.example = {10000, 0.1, 0.060, 0.030};
    d.eval = uniformPressure;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "collar_torque_uniform_wear";
    d.summary = "Friction torque of an annular collar under uniform wear (a run-in face)";
    d.args = {F, fc, Do, Di};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "fc*F*(Do + Di)/4";
    d.limits = "F > 0, 0 <= fc <= 1, Do > Di >= 0";
    d.source = kCollarSource;
    d.caution = kCollarCaution;
    d.example = {10000, 0.1, 0.060, 0.030};
    d.eval = uniformWear;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "thrust_bearing_torque";
    d.summary = "Friction torque of a rolling thrust bearing from a constant friction coefficient";
    d.args = {F, arg("mu", none(), "friction coefficient of the bearing type (common practice values)"),
              arg("d", length(), "bearing bore diameter")};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "mu*F*d/2";
    d.limits = "F > 0, 0 <= mu <= 0.05, d > 0. A first estimate at normal load and speed; the bearing maker's "
               "method adds load-independent and seal terms";
    d.source = "Rolling bearing makers' catalogues: friction torque = mu*F*d/2 with a constant coefficient per "
               "bearing type, common practice (from memory: thrust ball 0.0013, spherical roller thrust 0.0018, "
               "cylindrical roller thrust 0.005)";
    d.example = {10000, 0.0013, 0.040};
    d.eval = thrustBearing;
    out.push_back(std::move(d));
  }
  return {"Collars and thrust bearings",
          "The face that carries the axial load adds its own friction torque. A plain collar is taken at its mean "
          "diameter; an annular face follows uniform pressure when new and uniform wear once run in (uniform wear "
          "gives the lower torque). A rolling thrust bearing is estimated with a constant friction coefficient "
          "referred to its bore, common practice."};
}

}  // namespace calctrail::fn
