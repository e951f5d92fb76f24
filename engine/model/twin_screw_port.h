// A hand-written C++ port of worksheets/twin-screw-lift.calc (with its
// screw stage and motor templates expanded), for the
// benchmarks that compare the engine with native code (evaluate_perftest,
// sweep_perftest; docs/performance.md). It calls the drive functions' own
// C++ code directly (resolved once, leads passed per revolution by hand), as
// a C++ program using the library would, and keeps every result and check,
// so that the comparison is the engine's overhead alone. Not part of the
// engine: only the perftest programs include it.
#pragma once

#include <cstdio>
#include <cstdlib>
#include <string_view>

#include "engine/util/math_constants.h"
#include "functions/function_decl.h"

namespace calctrail {
namespace perftest {

using Eval = double (*)(const double*);

inline Eval fn(const char* name) {
  const FunctionDecl* f = findFunction(name);
  if (!f) {
    std::fprintf(stderr, "the drive library has no `%s`\n", name);
    std::exit(2);
  }
  return f->eval;
}

// The drive functions the sheet and its two templates call, resolved once.
struct Library {
  Eval trap_pitch = fn("trap_pitch"), thread_lead = fn("thread_lead"), trap_pitch_dia = fn("trap_pitch_dia"),
       trap_minor_dia = fn("trap_minor_dia"), trap_flank_angle = fn("trap_flank_angle"),
       starting_friction = fn("starting_friction"), lead_angle = fn("lead_angle"),
       collar_torque = fn("collar_torque_uniform_pressure"), torque_raise = fn("torque_raise"),
       torque_lower = fn("torque_lower"), self_locking_margin = fn("self_locking_margin"),
       overall_efficiency_2 = fn("overall_efficiency"), nut_speed = fn("nut_speed"),
       travel_time = fn("travel_time"), motor_torque = fn("motor_torque"), motor_power = fn("motor_power"),
       standard_motor_power = fn("standard_motor_power"), body_axial_stress = fn("body_axial_stress"),
       body_torsion_stress = fn("body_torsion_stress"), von_mises = fn("von_mises"),
       thread_root_bending = fn("thread_root_bending"), bearing_pressure = fn("thread_bearing_pressure"),
       nut_pv = fn("nut_pv"), output_speed = fn("output_speed"), buckling_safety = fn("buckling_safety");
};

// The given values, SI, in the order of the names below: the sheet's, then
// the template defaults it leaves (screw.d_c is left out: the sheet binds
// the collar torque, so nothing reads it).
inline const char* const kInputs[] = {
    "m_load",        "g_n",           "k_uneven",          "screws",          "stroke",      "t_max",
    "d",             "f_run",         "f_low",             "L_col",           "f_c",         "D_o",
    "D_i",           "n_motor",       "i_worm",            "eta_worm",        "eta_bevel",   "screw.starts",
    "screw.S_y",     "screw.n_yield_min", "screw.p_allow", "screw.pv_allow",  "screw.C_end", "screw.E",
    "motor.k_service"};
constexpr int kInputCount = sizeof kInputs / sizeof kInputs[0];

// The results the port computes, named as in the sheet (l per radian, as stored).
inline const char* const kOutputs[] = {
    "F",              "f_start",        "T_collar",      "eta_drive",      "n_screw",       "v_table",
    "t_lift",         "sigma_b",        "screw.p",       "screw.l",        "screw.d_m",     "screw.d_r",
    "screw.alpha",    "screw.lambda_s", "screw.T_thread", "screw.T_raise", "screw.T_lower", "screw.T_run",
    "screw.eta",      "screw.margin",   "screw.P",       "screw.sigma_a",  "screw.tau",     "screw.sigma_vm",
    "screw.n_yield",  "screw.L_nut",    "screw.p_nut",   "screw.pv",       "screw.n_buckle", "motor.T_motor",
    "motor.P_motor",  "motor.P_needed", "motor.P_rated"};
constexpr int kOutputCount = sizeof kOutputs / sizeof kOutputs[0];

struct PortOut {
  double v[kOutputCount];
  bool checks[7];  // in the model's order: the sheet's, then screw's, then motor's
};

inline void port(const Library& L, const double* in, PortOut* out) {
  const double m_load = in[0], g_n = in[1], k_uneven = in[2], screws = in[3], stroke = in[4], t_max = in[5],
               d = in[6], f_run = in[7], f_low = in[8], L_col = in[9], f_c = in[10], D_o = in[11],
               D_i = in[12], n_motor = in[13], i_worm = in[14], eta_worm = in[15], eta_bevel = in[16],
               starts = in[17], S_y = in[18], n_yield_min = in[19], p_allow = in[20], pv_allow = in[21],
               C_end = in[22], E = in[23], k_service = in[24];
  double* v = out->v;
  // The sheet's own lines.
  const double F = v[0] = m_load * g_n / screws * k_uneven;
  const double a1[] = {f_run};
  const double f_start = v[1] = L.starting_friction(a1);
  const double a2[] = {F, f_c, D_o, D_i};
  const double T_collar = v[2] = L.collar_torque(a2);
  const double a3[] = {eta_worm, eta_bevel};
  const double eta_drive = v[3] = L.overall_efficiency_2(a3);
  const double a4[] = {n_motor, i_worm};
  const double n_screw = v[4] = L.output_speed(a4);
  // screw: templates/trapezoidal-screw-stage.calc.
  const double a5[] = {d};
  const double p = v[8] = L.trap_pitch(a5);
  const double a6[] = {p, starts};
  const double l = L.thread_lead(a6);  // metres per revolution
  v[9] = l / kTwoPi;
  const double a7[] = {d, p};
  const double d_m = v[10] = L.trap_pitch_dia(a7);
  const double d_r = v[11] = L.trap_minor_dia(a7);
  const double alpha = v[12] = L.trap_flank_angle(nullptr);
  const double a8[] = {d_m, l};
  v[13] = L.lead_angle(a8);
  const double a9[] = {F, d_m, l, f_start, alpha};
  const double T_thread = v[14] = L.torque_raise(a9);
  const double T_raise = v[15] = T_thread + T_collar;
  const double a10[] = {F, d_m, l, f_low, alpha};
  const double T_lower = v[16] = L.torque_lower(a10);
  const double a11[] = {F, d_m, l, f_run, alpha};
  const double T_run = v[17] = L.torque_raise(a11) + T_collar;
  v[18] = F * l / (kTwoPi * T_run);  // work out over work in, per revolution
  const double a12[] = {d_m, l, f_low, alpha};
  v[19] = L.self_locking_margin(a12);
  v[20] = T_raise * n_screw;
  const double a13[] = {F, d_r};
  const double sigma_a = v[21] = L.body_axial_stress(a13);
  const double a14[] = {T_thread, d_r};
  const double tau = v[22] = L.body_torsion_stress(a14);
  const double a15[] = {sigma_a, tau};
  const double sigma_vm = v[23] = L.von_mises(a15);
  const double n_yield = v[24] = S_y / sigma_vm;
  const double L_nut = v[25] = 2 * d;
  const double a16[] = {F, d_m, p, L_nut / p};
  const double p_nut = v[26] = L.bearing_pressure(a16);
  const double a17[] = {F, d_m, p, L_nut / p, l, n_screw};
  const double pv = v[27] = L.nut_pv(a17);
  const double a18[] = {F, d_r, L_col, C_end, E, S_y};
  const double n_buckle = v[28] = L.buckling_safety(a18);
  // motor: templates/motor-choice.calc.
  const double a19[] = {T_raise, screws, i_worm, eta_drive};
  v[29] = L.motor_torque(a19);
  const double a20[] = {T_raise, screws, n_motor, i_worm, eta_drive};
  const double P_motor = v[30] = L.motor_power(a20);
  const double P_needed = v[31] = P_motor * k_service;
  const double a21[] = {P_needed};
  const double P_rated = v[32] = L.standard_motor_power(a21);
  // The sheet's lines that read the stage.
  const double a22[] = {n_motor, i_worm, l};
  v[5] = L.nut_speed(a22);
  const double a23[] = {stroke, n_motor, i_worm, l};
  const double t_lift = v[6] = L.travel_time(a23);
  const double a24[] = {F, d_r, p, 0.38};
  v[7] = L.thread_root_bending(a24);
  out->checks[0] = t_lift <= t_max;
  out->checks[1] = T_lower > 0;
  out->checks[2] = n_yield >= n_yield_min;
  out->checks[3] = p_nut <= p_allow;
  out->checks[4] = pv <= pv_allow;
  out->checks[5] = n_buckle >= 3;
  out->checks[6] = P_needed <= P_rated;
}

/// Where kOutputs names `name`, or -1.
inline int outputIndex(const char* name) {
  for (int k = 0; k < kOutputCount; ++k)
    if (std::string_view(kOutputs[k]) == name) return k;
  return -1;
}

}  // namespace perftest
}  // namespace calctrail
