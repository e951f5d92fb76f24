// sweep_perftest: a benchmark program, not a test. The cost per point of a
// 100,000-point sweep of worksheets/twin-screw-lift.calc through the study
// engine (runSweep: a Study layer of Inputs per thread, evaluateCone, the
// shown results and every check recorded), against a hand-written C++ port
// of the same calculation compiled into this program (the drive functions'
// C++ code called directly, the same results and checks recorded), their
// ratio (target: at most 5x native on one core), and the speed-up of the
// sweep on 2 threads. Figures: docs/performance.md.
//
// The port is engine/model/twin_screw_port.h, shared with evaluate_perftest.
//
//   sweep_perftest [--points N] [--worksheets DIR]
//
// DIR defaults to the worksheets/ folder found from the current directory or
// from this program's, upwards (engine/util/find_worksheets.h).
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
#include "engine/model/twin_screw_port.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_loader.h"
#include "engine/util/find_worksheets.h"
#include "engine/util/sha256.h"
#include "engine/study/sweep.h"
#include "engine/util/math_constants.h"

using namespace calctrail;
using namespace calctrail::perftest;

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

// The two results the sweep shows, in the port's outputs.
const int kTMotor = outputIndex("motor.T_motor"), kPMotor = outputIndex("motor.P_motor");

struct Figures {
  double engine1_us = 1e9, engine2_us = 1e9, native_us = 1e9;  // wall clock per point, best run
  double cpu1_us = 1e9, cpu2_us = 1e9;                         // process CPU time per point, best run
};

Figures measure(const Model& m, const Inputs& nominal, const Results& base, const Library& L,
                const char* name, double from, double to, int points, bool* agrees) {
  const Slot slot = m.find(name);
  SweepSpec spec;
  StudyRange range;
  range.input = {slot, name, *m.slot(slot).display};
  for (int i = 0; i < points; ++i) range.values.push_back(from + (to - from) * i / (points - 1));
  spec.vary.push_back(range);
  spec.show = {m.find("motor.T_motor"), m.find("motor.P_motor")};

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
      results[2 * static_cast<size_t>(i)] = out.v[kTMotor];
      results[2 * static_cast<size_t>(i) + 1] = out.v[kPMotor];
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
  if (dir.empty()) dir = findWorksheets("twin-screw-lift.calc");
  if (dir.empty()) {
    std::fprintf(stderr, "%s\n", worksheetsNotFound("sweep_perftest", "twin-screw-lift.calc").c_str());
    return 2;
  }
  const std::string path = dir + "/twin-screw-lift.calc";
  std::string bytes, error;
  if (!readFile(path, &bytes, &error)) {
    std::fprintf(stderr, "sweep_perftest: %s: %s\n", path.c_str(), error.c_str());
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
