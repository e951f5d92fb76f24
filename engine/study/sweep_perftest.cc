// sweep_perftest: a benchmark program, not a test. The cost per point of a
// 100,000-point sweep of worksheets/twin-screw-lift.calc through the study
// engine (runSweep: a Study layer of Inputs per thread, evaluateCone, the
// shown results and every check recorded), against a hand-written C++ port
// of the same calculation compiled into this program (the drive functions'
// C++ code called directly, the same results and checks recorded), their
// ratio (target: at most 5x native on one core), and the speed-up of the
// sweep on 2 threads. Figures: docs/performance.md.
//
// The port is copied from engine/model/evaluate_perftest.cc (the minimum:
// the library lookups, the inputs and the calculation), so the two
// benchmarks stay independent programs.
//
//   sweep_perftest [--points N] [--worksheets DIR]
//
// Exit status: 0; 2 when the worksheet does not calculate cleanly or the
// port's values differ from the sweep's (a bug in one of them).
#include <time.h>
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <thread>
#include <vector>

#include "engine/model/evaluate.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_loader.h"
#include "engine/util/sha256.h"
#include "engine/study/sweep.h"
#include "engine/util/math_constants.h"

using namespace calctrail;

namespace {

double now() {
  return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

// CPU seconds of the whole process (every thread): with the work per point
// unchanged by threads, 2 threads take the same CPU time as 1, and the
// wall-clock speed-up is then bounded only by the cores free.
double cpu() {
  timespec ts{};
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &ts);
  return static_cast<double>(ts.tv_sec) + static_cast<double>(ts.tv_nsec) * 1e-9;
}

// ---------------------------------------------------------------------------
// The hand-written port of twin-screw-lift.calc (as in evaluate_perftest.cc).

using Eval = double (*)(const double*);

Eval fn(const char* name) {
  const FunctionDecl* f = findFunction(name);
  if (!f) {
    std::fprintf(stderr, "sweep_perftest: the library has no `%s`\n", name);
    std::exit(2);
  }
  return f->eval;
}

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

const char* const kInputs[] = {"m_load",  "g_n",      "k_uneven", "screws",    "stroke", "t_max",
                               "d",       "f_run",    "f_low",    "f_c",       "D_o",    "D_i",
                               "n_motor", "i_worm",   "eta_worm", "eta_bevel", "S_y",    "L_nut",
                               "p_allow", "pv_allow", "E",        "L_col",     "C_end"};
constexpr int kInputCount = sizeof kInputs / sizeof kInputs[0];

struct PortOut {
  double T_motor, P_motor;
  bool checks[7];
};

void port(const Library& L, const double* in, PortOut* out) {
  const double m_load = in[0], g_n = in[1], k_uneven = in[2], screws = in[3], stroke = in[4], t_max = in[5],
               d = in[6], f_run = in[7], f_low = in[8], f_c = in[9], D_o = in[10], D_i = in[11],
               n_motor = in[12], i_worm = in[13], eta_worm = in[14], eta_bevel = in[15], S_y = in[16],
               L_nut = in[17], p_allow = in[18], pv_allow = in[19], E = in[20], L_col = in[21],
               C_end = in[22];
  const double F = m_load * g_n / screws * k_uneven;
  const double a1[] = {d};
  const double p = L.trap_pitch(a1);
  const double a2[] = {p, 1};
  const double l = L.thread_lead(a2);  // metres per revolution
  const double a3[] = {d, p};
  const double d_m = L.trap_pitch_dia(a3);
  const double d_r = L.trap_minor_dia(a3);
  const double alpha = L.trap_flank_angle(nullptr);
  const double a4[] = {f_run};
  const double f_start = L.starting_friction(a4);
  const double a5[] = {d_m, l};
  volatile double lambda_s = L.lead_angle(a5);  // computed by the sheet, read by nothing
  (void)lambda_s;
  const double a6[] = {F, f_c, D_o, D_i};
  const double T_collar = L.collar_torque(a6);
  const double a7[] = {F, d_m, l, f_start, alpha};
  const double T_thread = L.torque_raise(a7);
  const double T_screw = T_thread + T_collar;
  const double a8[] = {F, d_m, l, f_low, alpha};
  const double T_hold = L.torque_lower(a8);
  const double a9[] = {d_m, l, f_run, alpha, f_c, (D_o + D_i) / 2};
  volatile double eta = L.efficiency(a9);
  (void)eta;
  const double a10[] = {eta_worm, eta_bevel};
  const double eta_drive = L.overall_efficiency_2(a10);
  const double a11[] = {n_motor, i_worm, l};
  volatile double v_table = L.nut_speed(a11);
  (void)v_table;
  const double a12[] = {stroke, n_motor, i_worm, l};
  const double t_lift = L.travel_time(a12);
  const double a13[] = {T_screw, screws, i_worm, eta_drive};
  out->T_motor = L.motor_torque(a13);
  const double a14[] = {T_screw, screws, n_motor, i_worm, eta_drive};
  const double P_motor = out->P_motor = L.motor_power(a14);
  const double a15[] = {P_motor};
  const double P_rated = L.standard_motor_power(a15);
  const double a16[] = {F, d_r};
  const double sigma_a = L.body_axial_stress(a16);
  const double a17[] = {T_thread, d_r};
  const double tau = L.body_torsion_stress(a17);
  const double a18[] = {sigma_a, tau};
  const double sigma_vm = L.von_mises(a18);
  const double n_yield = S_y / sigma_vm;
  const double a19[] = {F, d_r, p, 0.38};
  volatile double sigma_b = L.thread_root_bending(a19);
  (void)sigma_b;
  const double a20[] = {F, d_m, p, L_nut / p};
  const double p_nut = L.bearing_pressure(a20);
  const double a21[] = {n_motor, i_worm};
  const double a22[] = {F, d_m, p, L_nut / p, l, L.output_speed(a21)};
  const double pv = L.nut_pv(a22);
  const double a23[] = {F, d_r, L_col, C_end, E, S_y};
  const double n_buckle = L.buckling_safety(a23);
  out->checks[0] = T_hold > 0;
  out->checks[1] = n_yield >= 3;
  out->checks[2] = n_buckle >= 3;
  out->checks[3] = p_nut <= p_allow;
  out->checks[4] = pv <= pv_allow;
  out->checks[5] = P_motor <= P_rated;
  out->checks[6] = t_lift <= t_max;
}

// ---------------------------------------------------------------------------

struct Figures {
  double engine1_us = 1e9, engine2_us = 1e9, native_us = 1e9;  // wall clock per point, best run
  double cpu1_us = 1e9, cpu2_us = 1e9;                         // process CPU time per point, best run
};

Figures measure(const Model& m, const Inputs& nominal, const Results& base, const Library& L,
                const char* name, double from, double to, int points, bool* agrees) {
  const Slot slot = m.find(name);
  SweepSpec spec;
  StudyRange range;
  range.input = {slot, name, m.slot(slot).display};
  for (int i = 0; i < points; ++i) range.values.push_back(from + (to - from) * i / (points - 1));
  spec.vary.push_back(range);
  spec.show = {m.find("T_motor"), m.find("P_motor")};

  double in[kInputCount];
  int index = 0;
  for (int k = 0; k < kInputCount; ++k) {
    in[k] = base.value(m.find(kInputs[k]));
    if (std::strcmp(kInputs[k], name) == 0) index = k;
  }
  // The port records what the sweep records: two results and seven checks per point.
  std::vector<double> results(2 * static_cast<size_t>(points));
  std::vector<signed char> checks(7 * static_cast<size_t>(points));
  Figures f;
  SweepTable last;
  for (int rep = 0; rep < 3; ++rep) {
    for (unsigned jobs : {1u, 2u}) {
      spec.jobs = jobs;
      const double t = now(), c = cpu();
      SweepTable table = runSweep(m, nominal, base, spec);
      const double us = (now() - t) * 1e6 / points, cpu_us = (cpu() - c) * 1e6 / points;
      double& wall = jobs == 1 ? f.engine1_us : f.engine2_us;
      double& work = jobs == 1 ? f.cpu1_us : f.cpu2_us;
      wall = std::min(wall, us);
      work = std::min(work, cpu_us);
      last = std::move(table);
    }
    const double t = now();
    PortOut out;
    for (int i = 0; i < points; ++i) {
      in[index] = range.values[static_cast<size_t>(i)];
      port(L, in, &out);
      results[2 * static_cast<size_t>(i)] = out.T_motor;
      results[2 * static_cast<size_t>(i) + 1] = out.P_motor;
      for (int k = 0; k < 7; ++k) checks[7 * static_cast<size_t>(i) + k] = out.checks[k];
    }
    f.native_us = std::min(f.native_us, (now() - t) * 1e6 / points);
  }
  for (size_t i = 0; i < results.size(); ++i)
    if (!(std::fabs(results[i] - last.results[i]) <= 1e-12 * std::fabs(last.results[i]))) {
      std::fprintf(stderr, "sweep_perftest: %s point %zu: port %.17g, sweep %.17g\n", name, i / 2, results[i],
                   last.results[i]);
      *agrees = false;
      break;
    }
  if (checks != last.check_states) *agrees = false;
  return f;
}

// The demo's model with its templates expanded, as Calculation builds it.
std::unique_ptr<const Model> buildDemo(const std::string& path, const std::string& bytes, Diagnostics* diags) {
  Sheet sheet = parseSheet(std::make_shared<SourceFile>(path, bytes), diags);
  TemplateCache cache;
  expandTemplates(&sheet, path, sha256Hex(bytes), diskSource(), &cache, diags);
  return Model::build(std::move(sheet), diags);
}

int usage() {
  std::fprintf(stderr, "usage: sweep_perftest [--points N] [--worksheets DIR]\n");
  return 2;
}

}  // namespace

int main(int argc, char** argv) {
  int points = 100000;
  std::string dir;
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    if (a == "--points" && i + 1 < argc)
      points = std::atoi(argv[++i]);
    else if (a == "--worksheets" && i + 1 < argc)
      dir = argv[++i];
    else
      return usage();
  }
  if (points < 2) return usage();
  if (dir.empty()) {
    const std::string self = __FILE__;
    const size_t at = self.rfind("engine/study/sweep_perftest.cc");
    dir = (at == std::string::npos ? std::string() : self.substr(0, at)) + "worksheets";
  }
  const std::string path = dir + "/twin-screw-lift.calc";
  std::string bytes, error;
  if (!readFile(path, &bytes, &error)) {
    std::fprintf(stderr, "sweep_perftest: %s\n", error.c_str());
    return 2;
  }
  Diagnostics diags;
  auto model = buildDemo(path, bytes, &diags);
  if (diags.hasErrors()) {
    std::fprintf(stderr, "sweep_perftest: %s has errors\n", path.c_str());
    return 2;
  }
  const Inputs nominal(*model);
  const Results base = evaluate(*model, nominal);
  if (!base.faults.empty()) return 2;
  const Library library;
  std::printf(
      "twin-screw-lift.calc, sweeps of %d points (best of 3), T_motor and P_motor and 7 checks recorded;\n"
      "%u hardware threads:\n",
      points, std::thread::hardware_concurrency());
  std::printf("  %-22s %11s %11s %7s %11s %8s %16s\n", "sweep", "1 thread", "native", "ratio", "2 threads",
              "speed-up", "CPU 1 / 2 thr");
  struct Case {
    const char* name;
    double from, to;
    const char* label;
  } cases[] = {{"m_load", 3000, 6000, "m_load 3000..6000 kg"},
               {"f_run", 0.08, 0.16, "f_run 0.08..0.16"},
               {"L_col", 0.5, 0.8, "L_col 500..800 mm"}};
  bool agrees = true;
  for (const Case& c : cases) {
    const Figures f = measure(*model, nominal, base, library, c.name, c.from, c.to, points, &agrees);
    std::printf("  %-22s %8.3f us %8.3f us %6.1fx %8.3f us %7.2fx %7.3f / %.3f us\n", c.label, f.engine1_us,
                f.native_us, f.engine1_us / f.native_us, f.engine2_us, f.engine1_us / f.engine2_us, f.cpu1_us,
                f.cpu2_us);
  }
  std::printf("  (per point, wall clock; target: at most 5x native on one thread)\n");
  return agrees ? 0 : 2;
}
