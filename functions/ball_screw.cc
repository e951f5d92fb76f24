// Ball screws: driving and back-driving torque from efficiency, basic rating
// life per ISO 3408-5 from the cubic-mean load of a duty cycle, and the
// critical (whirling) speed of the screw shaft.
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

// A duty step's value, checked; the argument's name ("speed n3") is built
// only when the value is refused.
double stepValue(const double* a, int k, Show how) {
  const double v = a[k];
  if (std::isfinite(v) && v >= 0) return v;
  static const char* const kWhat[] = {"load F", "speed n", "time fraction q"};
  const std::string what = kWhat[k % 3] + std::to_string(k / 3 + 1);
  nonNegative(a, k, what.c_str(), how);
  fail(k, what + " is outside its limits");
}

// Steps of (load, speed, time fraction), n/3 of them.
double cubicMeanN(const double* a, int n) {
  double sum_f3 = 0, sum_n = 0;
  for (int k = 0; k + 2 < n; k += 3) {
    const double F = stepValue(a, k, Show::Force);
    const double speed = stepValue(a, k + 1, Show::Speed);
    const double q = stepValue(a, k + 2, Show::Plain);
    sum_f3 += F * F * F * speed * q;
    sum_n += speed * q;
  }
  if (!(sum_n > 0))
    fail(-1, "the duty cycle has no revolutions: at least one step needs a speed n > 0 and a time fraction q > 0");
  return result(std::cbrt(sum_f3 / sum_n));
}

double cubicMean(const double* a) { return cubicMeanN(a, 6); }

// End-fixity factors (first eigenvalue of the beam, lambda*L) of the four
// classical end conditions.
const double kFixities[] = {1.8751, kPi, 3.9266, 4.7300};

double criticalSpeed(const double* a) {
  const double dr = positive(a, 0, "minor diameter dr", Show::Length);
  const double L = positive(a, 1, "unsupported length L", Show::Length);
  const double fixity = positive(a, 2, "end-fixity factor", Show::Plain);
  if (!(fixity <= 4.7301))
    fail(2, "end-fixity factor = " + num(fixity) + " must be <= 4.730 (both ends fixed)");
  const double E = positive(a, 3, "modulus of elasticity E", Show::Modulus);
  if (!(E <= 1200e9))
    fail(3, "modulus of elasticity E = " + show(E, Show::Modulus) +
                " is above that of any solid (diamond, about 1200 GPa): a slip of units?");
  const double rho = positive(a, 4, "density rho", Show::Density);
  if (!(rho <= 23000))
    fail(4, "density rho = " + show(rho, Show::Density) +
                " is above that of any solid (osmium, 22 600 kg/m^3): a slip of units?");
  // First bending mode of a uniform round shaft: omega = fixity^2/L^2 * sqrt(E*I/(rho*A)), I/A = dr^2/16.
  return result(fixity * fixity / (L * L) * dr / 4.0 * std::sqrt(E / rho));
}

// A fixity factor within 1 % of no end condition is a ball screw maker's
// speed factor (0.32 to 2.23 in some catalogues) or a slip.
std::string adviseFixity(const double* a, int, int* arg) {
  const double fixity = a[2];
  for (double f : kFixities)
    if (std::fabs(fixity - f) <= 0.01 * f) return "";
  *arg = 2;
  return "end-fixity factor = " + num(fixity) + " matches no end condition: 1.875 fixed-free, 3.142 both "
         "supported, 3.927 fixed-supported, 4.730 both fixed (a catalogue's speed factor is another number)";
}

double staticSafety(const double* a) {
  const double C0a = positive(a, 0, "static load rating C0a", Show::Force);
  const double F = positive(a, 1, "largest axial load F_max", Show::Force);
  return result(C0a / F);
}

// Reliability factor a1 of the basic rating life, by reliability in percent.
struct ReliabilityRow {
  double percent, a1;
};
const ReliabilityRow kReliability[] = {{90, 1.0}, {95, 0.62}, {96, 0.53}, {97, 0.44}, {98, 0.33}, {99, 0.21}};

double reliabilityFactor(const double* a) {
  const double R = positive(a, 0, "reliability R", Show::Plain);
  for (const ReliabilityRow& r : kReliability)
    if (std::fabs(R - r.percent / 100) <= 1e-9) return r.a1;
  fail(0, "reliability R = " + num(R * 100) + " % is not a row of the table: 90, 95, 96, 97, 98 or 99 % "
          "(write 95 %)");
}

// Adjusted life in revolutions: a1*(Ca/(fw*Fm))^3 million.
double lifeRevs(const double* a) {
  const double Ca = positive(a, 0, "dynamic load rating Ca", Show::Force);
  const double Fm = positive(a, 1, "mean load Fm", Show::Force);
  const double a1 = fraction(a, 2, "reliability factor a1");
  const double fw = positive(a, 3, "load factor fw", Show::Plain);
  if (!(fw >= 1)) fail(3, "load factor fw = " + num(fw) + " must be >= 1 (1.0 to 1.2 smooth running)");
  const double r = Ca / (fw * Fm);
  return a1 * r * r * r * 1e6;
}

double lifeAdjusted(const double* a) { return result(lifeRevs(a) * 2.0 * kPi); }

double lifeHours(const double* a) {
  const double revs = lifeRevs(a);
  const double n = positive(a, 4, "mean speed n_m", Show::Speed);
  return result(revs * 2.0 * kPi / n);
}

double lifeTravel(const double* a) {
  const double revs = lifeRevs(a);
  const double l = positive(a, 4, "lead l", Show::Lead);
  return result(revs * l);
}

// The d*n value is a plain number in the catalogues' units, mm times rpm.
double dnSpeed(const double* a) {
  const double d0 = positive(a, 0, "ball circle diameter d0", Show::Length);
  const double dn = positive(a, 1, "d*n value dn", Show::Plain);
  return result(dn / (d0 / 1e-3) * 2.0 * kPi / 60.0);
}

double preloadTorque(const double* a) {
  const double Fp = positive(a, 0, "preload Fpr", Show::Force);
  const double l = positive(a, 1, "lead l", Show::Lead);
  const double d0 = positive(a, 2, "ball circle diameter d0", Show::Length);
  const double tan_beta = l / (kPi * d0);
  return result(0.05 / std::sqrt(tan_beta) * Fp * l / (2.0 * kPi));
}

const char* kLifeSource =
    "ISO 3408-5:2006 (ball screws: static and dynamic axial load ratings and operational life): basic dynamic "
    "axial load rating Ca (clause 5.2), equivalent speed and equivalent axial load of a duty cycle (clause 7.1, "
    "7.1.2 for a nut with backlash), nominal life L in revolutions and Lh in hours (clause 7.2.1); the clause "
    "numbers as the standard's published contents give them, the cube law and the cubic mean from memory";
const char* kAdjustedSource =
    "ISO 3408-5:2006, nominal life with the reliability factor (clause 7.2.4, where the factor is named f_ar; "
    "a1 here) and modified life (clause 7.3), clause numbers as the standard's published contents give them; "
    "the factor's values 90 % 1, 95 % 0.62, 96 % 0.53, 97 % 0.44, 98 % 0.33, 99 % 0.21 (the ISO 281:1990 values, "
    "from memory; ISO 281:2007 gives 0.64, 0.55, 0.47, 0.37, 0.25); the "
    "load (operating) factor fw as in the THK and NSK ball screw catalogues: 1.0 to 1.2 smooth, 1.2 to 1.5 "
    "normal, 1.5 to 3 with shock (common practice, from memory)";
const char* kCatalogueSource =
    "Ball screw makers' catalogues (THK, NSK, Bosch Rexroth): static safety factor C0a/F_max >= 1 to 3 by duty; "
    "permissible speed from the d*n value of the ball circle diameter d0 in mm times the speed in rpm, about "
    "50 000 to 70 000 for standard ball returns and 100 000 to 160 000 for high-speed nuts; preload drag torque "
    "Tp = 0.05*tan(beta)^-0.5*Fpr*l/(2*pi) (common practice, from memory)";
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
              arg("Fm", force(), "cubic-mean axial load of the duty cycle (cubic_mean_load)")};
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
  {
    FunctionDecl d;
    d.name = "cubic_mean_load";
    d.summary = "Cubic-mean axial load of a duty cycle of any number of steps (load, speed, time fraction)";
    d.args = {arg("F1", force(), "axial load of step 1"), arg("n1", rotSpeed(), "screw speed of step 1"),
              arg("q1", none(), "time fraction of step 1 (fractions need not add up to 1)"),
              arg("F2", force(), "axial load of step 2 or of a further step"),
              arg("n2", rotSpeed(), "screw speed of step 2 or of a further step"),
              arg("q2", none(), "time fraction of step 2 or of a further step")};
    d.repeat = 3;
    d.result = force();
    d.result_unit = "kN";
    d.formula = "((F1^3*n1*q1 + F2^3*n2*q2) / (n1*q1 + n2*q2))^(1/3)";
    d.limits = "two steps or more (the formula shows two: each further step adds its F^3*n*q and n*q); loads, "
               "speeds and time fractions >= 0, with at least one step that turns (n*q > 0). The mean speed of "
               "the cycle is the sum of n*q over the sum of q";
    d.source = kLifeSource;
    d.example = {4000, 100 * 2 * kPi / 60, 0.25, 1000, 300 * 2 * kPi / 60, 0.75};
    d.eval = cubicMean;
    d.eval_n = cubicMeanN;
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
              usually(arg("E", stress(), "modulus of elasticity"), 40e9, 250e9, Show::Modulus,
                      "screw shaft metals: aluminium alloys about 70 GPa, bronzes and titanium 100 to 120 GPa, "
                      "steels 190 to 215 GPa (handbook tables, from memory)"),
              usually(arg("rho", density(), "density of the screw material"), 1500, 9500, Show::Density,
                      "screw shaft materials: fibre composites from about 1550, aluminium 2700, titanium 4500, "
                      "steels 7750 to 8050, bronzes 7500 to 8900 kg/m^3 (handbook tables, from memory)")};
    d.result = rotSpeed();
    d.result_unit = "rpm";
    d.formula = "fixity^2*dr/(4*L^2) * sqrt(E/rho)";
    d.limits = "dr > 0, L > 0, 0 < fixity <= 4.730, 0 < E <= 1200 GPa, 0 < rho <= 23000 kg/m^3 (above "
               "them no solid). A fixity within 1 % of none of the four end conditions is a warning. The "
               "theoretical speed: run below it with a margin (80 % is common practice)";
    d.source = "First natural frequency of a uniform Euler-Bernoulli beam, omega = fixity^2/L^2*sqrt(E*I/(rho*A)) "
               "with the eigenvalues of its end conditions, as tabulated in the vibration handbooks; ball screw "
               "makers' catalogues print it with a factor 0.8 (from memory)";
    d.caution = "A screw run near its critical speed whips: keep the working speed at most about 80 % of it, "
                "with the longest unsupported length of the stroke.";
    d.example = {0.028, 1.5, 3.927, 206e9, 7850};
    d.eval = criticalSpeed;
    d.advise = adviseFixity;
    out.push_back(std::move(d));
  }
  const FunctionArg Ca = arg("Ca", force(), "basic dynamic axial load rating (maker's catalogue)");
  const FunctionArg Fm = arg("Fm", force(), "cubic-mean axial load of the duty cycle (cubic_mean_load)");
  const FunctionArg a1 = arg("a1", none(), "reliability factor (ball_screw_reliability_factor; 1 for 90 %)");
  const FunctionArg fw = usually(arg("fw", none(), "load (operating) factor for the running conditions"), 1, 3,
                                 Show::Plain,
                                 "1.0 to 1.2 smooth, 1.2 to 1.5 normal, 1.5 to 3 with shock and vibration "
                                 "(makers' catalogues, common practice)");
  const FunctionArg d0 = arg("d0", length(), "ball circle (pitch) diameter of the screw");
  static constexpr char kLifeLimits[] = "Ca > 0, Fm > 0, 0 < a1 <= 1, fw >= 1";
  {
    FunctionDecl d;
    d.name = "ball_screw_static_safety";
    d.summary = "Static safety factor of a ball screw: static load rating over the largest axial load";
    d.args = {arg("C0a", force(), "basic static axial load rating (maker's catalogue)"),
              arg("F_max", force(), "largest axial load, shocks included")};
    d.result = none();
    d.result_unit = "1";
    d.formula = "C0a/F_max";
    d.limits = "C0a > 0, F_max > 0. Makers ask at least 1 to 2 for normal running and 2 to 3 with shock "
               "(common practice)";
    d.source = kCatalogueSource;
    d.caution = "A load above C0a dents the raceways (brinelling): the peak of a crash or an emergency stop "
                "counts, not the mean load.";
    d.example = {60000, 12000};
    d.eval = staticSafety;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_reliability_factor";
    d.summary = "Reliability factor a1 of the rating life for a reliability of 90 to 99 %";
    d.args = {arg("R", none(), "reliability: the share of screws that reach the life (write 95 %)")};
    d.result = none();
    d.result_unit = "1";
    d.formula = "table lookup: R = 90 % a1 = 1, 95 % 0.62, 96 % 0.53, 97 % 0.44, 98 % 0.33, 99 % 0.21";
    d.formula_is_expression = false;
    d.limits = "R one of 90, 95, 96, 97, 98, 99 % (exactly); any other value is an error naming the rows";
    d.source = kAdjustedSource;
    d.example = {0.95};
    d.eval = reliabilityFactor;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_life_adjusted";
    d.summary = "Rating life in revolutions for a reliability (a1) and running conditions (load factor fw)";
    d.args = {Ca, Fm, a1, fw};
    d.result = angle();
    d.result_unit = "rev";
    d.formula = "a1*(Ca/(fw*Fm))^3 * 1e6 [rev]";
    static constexpr auto kLimits = join(kLifeLimits, ". The peak load must also stay below C0a (ball_screw_static_safety)");
    d.limits = kLimits.view();
    d.source = kAdjustedSource;
    d.caution = "A rating life is statistical: shock loads, misalignment and poor lubrication shorten it.";
    d.example = {30000, 3000, 0.62, 1.2};
    d.eval = lifeAdjusted;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_life_hours";
    d.summary = "Rating life as running time at the mean speed of the duty cycle";
    d.args = {Ca, Fm, a1, fw, arg("n_m", rotSpeed(), "mean speed of the duty cycle (sum of n*q over sum of q)")};
    d.result = time();
    d.result_unit = "h";
    d.formula = "a1*(Ca/(fw*Fm))^3 * 1e6 [rev] / n_m";
    static constexpr auto kLimits =
        join(kLifeLimits, ", n_m > 0. Running hours: divide by the share of time the axis runs "
                          "for calendar hours");
    d.limits = kLimits.view();
    d.source = kAdjustedSource;
    d.caution = "A rating life is statistical: shock loads, misalignment and poor lubrication shorten it.";
    d.example = {30000, 3000, 1, 1.2, 500 * 2 * kPi / 60};
    d.eval = lifeHours;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_life_travel";
    d.summary = "Rating life as distance travelled by the nut: revolutions times the lead";
    d.args = {Ca, Fm, a1, fw, l};
    d.result = length();
    d.result_unit = "km";
    d.formula = "a1*(Ca/(fw*Fm))^3 * 1e6 * l";
    static constexpr auto kLimits = join(kLifeLimits, ", l > 0");
    d.limits = kLimits.view();
    d.source = kAdjustedSource;
    d.caution = "A rating life is statistical: shock loads, misalignment and poor lubrication shorten it.";
    d.example = {30000, 3000, 1, 1.2, 0.010};
    d.eval = lifeTravel;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_dn_speed";
    d.summary = "Speed limit of a ball screw from its permissible d*n value (ball circle diameter times speed)";
    d.args = {d0, usually(arg("dn", none(), "permissible d*n value of the nut in mm*rpm, a plain number as the "
                                            "catalogues print it (70000)"),
                           20000, 250000, Show::Plain,
                           "ball nuts: 50 000 to 70 000 standard, 100 000 to 160 000 high-speed, up to about "
                           "220 000 for the fastest (makers' catalogues)")};
    d.result = rotSpeed();
    d.result_unit = "rpm";
    d.formula = "dn/(d0/1 mm) * 1 rpm";
    d.limits = "d0 > 0, dn > 0. The critical speed of the shaft (critical_speed) is a second limit: the lower "
               "one governs";
    d.source = kCatalogueSource;
    d.example = {0.040, 70000};
    d.eval = dnSpeed;
    out.push_back(std::move(d));
  }
  {
    FunctionDecl d;
    d.name = "ball_screw_preload_torque";
    d.summary = "Drag torque of a preloaded ball nut, from the preload and the lead angle (catalogue estimate)";
    d.args = {arg("Fpr", force(), "preload of the nut"), l, d0};
    d.result = torque();
    d.result_unit = "N*m";
    d.formula = "0.05/sqrt(l/(pi*d0)) * Fpr*l/(1 [rev])";
    d.limits = "Fpr > 0, l > 0, d0 > 0. An estimate within about +-30 %, as the makers say; seals add their "
               "own drag";
    d.source = kCatalogueSource;
    d.example = {1500, 0.010, 0.040};
    d.eval = preloadTorque;
    out.push_back(std::move(d));
  }
  return {"Ball screws",
          "Rolling-element screws: high efficiency (about 0.9, common practice), so never self-locking. Life "
          "follows ISO 3408-5: L10 = (Ca/Fm)^3 million revolutions, with Fm the cubic mean of the duty cycle "
          "weighted by revolutions (speed times time fraction). A life in revolutions is an angle (1e6 [rev]): "
          "divided by a speed in rpm it gives a time."};
}

}  // namespace calctrail::fn
