// A hand-written C++ port of worksheets/twin-screw-lift.calc, for the
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

// The drive functions the sheet calls, resolved once.
struct Library {
  Eval trap_pitch = fn("trap_pitch"), thread_lead = fn("thread_lead"), trap_pitch_dia = fn("trap_pitch_dia"),
       trap_minor_dia = fn("trap_minor_dia"), trap_flank_angle = fn("trap_flank_angle"),
       starting_friction = fn("starting_friction"), lead_angle = fn("lead_angle"),
       collar_torque = fn("collar_torque_uniform_pressure"), torque_raise = fn("torque_raise"),
       torque_lower = fn("torque_lower"), efficiency = fn("screw_efficiency_with_collar"),
       overall_efficiency_2 = fn("overall_efficiency"), nut_speed = fn("nut_speed"),
       travel_time = fn("travel_time"), motor_torque = fn("motor_torque"), motor_power = fn("motor_power"),
       standard_motor_power = fn("standard_motor_power"), body_axial_stress = fn("body_axial_stress"),
       body_torsion_stress = fn("body_torsion_stress"), von_mises = fn("von_mises"),
       thread_root_bending = fn("thread_root_bending"), bearing_pressure = fn("thread_bearing_pressure"),
       nut_pv = fn("nut_pv"), output_speed = fn("output_speed"), buckling_safety = fn("buckling_safety");
};

// The given values, SI, in sheet order of the names below.
inline const char* const kInputs[] = {"m_load",  "g_n",      "k_uneven", "screws",    "stroke", "t_max",
                               "d",       "f_run",    "f_low",    "f_c",       "D_o",    "D_i",
                               "n_motor", "i_worm",   "eta_worm", "eta_bevel", "S_y",    "L_nut",
                               "p_allow", "pv_allow", "E",        "L_col",     "C_end"};
constexpr int kInputCount = sizeof kInputs / sizeof kInputs[0];

// The results the port computes, named as in the sheet (l per radian, as stored).
inline const char* const kOutputs[] = {
    "F",        "p",       "l",      "d_m",      "d_r",       "alpha",   "f_start", "lambda_s", "T_collar",
    "T_thread", "T_screw", "T_hold", "eta",      "eta_drive", "v_table", "t_lift",  "T_motor",  "P_motor",
    "P_rated",  "sigma_a", "tau",    "sigma_vm", "n_yield",   "sigma_b", "p_nut",   "pv",       "n_buckle"};
constexpr int kOutputCount = sizeof kOutputs / sizeof kOutputs[0];

struct PortOut {
  double v[kOutputCount];
  bool checks[7];
};

inline void port(const Library& L, const double* in, PortOut* out) {
  const double m_load = in[0], g_n = in[1], k_uneven = in[2], screws = in[3], stroke = in[4], t_max = in[5],
               d = in[6], f_run = in[7], f_low = in[8], f_c = in[9], D_o = in[10], D_i = in[11],
               n_motor = in[12], i_worm = in[13], eta_worm = in[14], eta_bevel = in[15], S_y = in[16],
               L_nut = in[17], p_allow = in[18], pv_allow = in[19], E = in[20], L_col = in[21],
               C_end = in[22];
  double* v = out->v;
  const double F = v[0] = m_load * g_n / screws * k_uneven;
  const double a1[] = {d};
  const double p = v[1] = L.trap_pitch(a1);
  const double a2[] = {p, 1};
  const double l = L.thread_lead(a2);  // metres per revolution
  v[2] = l / kTwoPi;
  const double a3[] = {d, p};
  const double d_m = v[3] = L.trap_pitch_dia(a3);
  const double d_r = v[4] = L.trap_minor_dia(a3);
  const double alpha = v[5] = L.trap_flank_angle(nullptr);
  const double a4[] = {f_run};
  const double f_start = v[6] = L.starting_friction(a4);
  const double a5[] = {d_m, l};
  v[7] = L.lead_angle(a5);
  const double a6[] = {F, f_c, D_o, D_i};
  const double T_collar = v[8] = L.collar_torque(a6);
  const double a7[] = {F, d_m, l, f_start, alpha};
  const double T_thread = v[9] = L.torque_raise(a7);
  const double T_screw = v[10] = T_thread + T_collar;
  const double a8[] = {F, d_m, l, f_low, alpha};
  const double T_hold = v[11] = L.torque_lower(a8);
  const double a9[] = {d_m, l, f_run, alpha, f_c, (D_o + D_i) / 2};
  v[12] = L.efficiency(a9);
  const double a10[] = {eta_worm, eta_bevel};
  const double eta_drive = v[13] = L.overall_efficiency_2(a10);
  const double a11[] = {n_motor, i_worm, l};
  v[14] = L.nut_speed(a11);
  const double a12[] = {stroke, n_motor, i_worm, l};
  const double t_lift = v[15] = L.travel_time(a12);
  const double a13[] = {T_screw, screws, i_worm, eta_drive};
  v[16] = L.motor_torque(a13);
  const double a14[] = {T_screw, screws, n_motor, i_worm, eta_drive};
  const double P_motor = v[17] = L.motor_power(a14);
  const double a15[] = {P_motor};
  const double P_rated = v[18] = L.standard_motor_power(a15);
  const double a16[] = {F, d_r};
  const double sigma_a = v[19] = L.body_axial_stress(a16);
  const double a17[] = {T_thread, d_r};
  const double tau = v[20] = L.body_torsion_stress(a17);
  const double a18[] = {sigma_a, tau};
  const double sigma_vm = v[21] = L.von_mises(a18);
  const double n_yield = v[22] = S_y / sigma_vm;
  const double a19[] = {F, d_r, p, 0.38};
  v[23] = L.thread_root_bending(a19);
  const double a20[] = {F, d_m, p, L_nut / p};
  const double p_nut = v[24] = L.bearing_pressure(a20);
  const double a21[] = {n_motor, i_worm};
  const double a22[] = {F, d_m, p, L_nut / p, l, L.output_speed(a21)};
  const double pv = v[25] = L.nut_pv(a22);
  const double a23[] = {F, d_r, L_col, C_end, E, S_y};
  const double n_buckle = v[26] = L.buckling_safety(a23);
  out->checks[0] = T_hold > 0;
  out->checks[1] = n_yield >= 3;
  out->checks[2] = n_buckle >= 3;
  out->checks[3] = p_nut <= p_allow;
  out->checks[4] = pv <= pv_allow;
  out->checks[5] = P_motor <= P_rated;
  out->checks[6] = t_lift <= t_max;
}

/// Where kOutputs names `name`, or -1.
inline int outputIndex(const char* name) {
  for (int k = 0; k < kOutputCount; ++k)
    if (std::string_view(kOutputs[k]) == name) return k;
  return -1;
}

}  // namespace perftest
}  // namespace calctrail
