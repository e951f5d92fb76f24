// cases_perftest: a benchmark program, not a test. The cost of N load cases
// evaluated in one run (docs/cases.md) against N separate runs of the same
// worksheet, side by side, on worksheets/twin-screw-lift.calc with N case
// lines appended (each replaces one or two given values: the load, the
// friction, the screw diameter, the motor speed, so the cones differ).
//
// 1. End to end (read, parse, model, evaluate, as `calctrail report` does
//    it): the sheet with N cases against the sheet without any (the cost of
//    one case, the nominal), and against N runs each with the case's
//    replacements given as --set. Target: 20 cases at most 3x one case.
// 2. Evaluation alone, the model built once: the nominal and N cones in one
//    context against N whole evaluations in fresh contexts (N separate runs).
//
//   cases_perftest [--cases N] [--repeat R] [--worksheets DIR]
//
// DIR defaults to the worksheets/ folder found from the current directory or
// from this program's, upwards (engine/util/find_worksheets.h).
//
// Exit status: 0; 2 when a sheet does not calculate cleanly or a case's
// values differ from its separate run's (a bug).
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <vector>

#include "engine/calculation.h"
#include "engine/model/evaluate.h"
#include "engine/util/find_worksheets.h"

using namespace calctrail;

namespace {

double now() {
  return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

// The replacements of case i, as a case line writes them and as --set takes them.
std::vector<std::string> replacementsOf(int i) {
  const std::string k = std::to_string(i);
  switch (i % 4) {
    case 0: return {"m_load = " + std::to_string(3000 + 100 * i) + " kg"};
    case 1: return {"f_run = 0." + std::to_string(10 + i % 9), "f_c = 0." + std::to_string(8 + i % 7)};
    case 2: return {"d = " + std::to_string(44 + 2 * (i % 4)) + " mm"};
    default: return {"n_motor = " + std::to_string(1400 + 10 * i) + " rpm"};
  }
}

std::string withCases(const std::string& sheet, int n) {
  std::string out = sheet;
  for (int i = 0; i < n; ++i) {
    out += "case c" + std::to_string(i) + ":";
    const auto r = replacementsOf(i);
    for (size_t j = 0; j < r.size(); ++j) out += (j ? ", " : " ") + r[j];
    out += "\n";
  }
  return out;
}

std::vector<std::string> setsOf(int i) {
  std::vector<std::string> sets;
  for (const std::string& r : replacementsOf(i)) {
    std::string s = r;
    s.erase(std::remove(s.begin(), s.end(), ' '), s.end());  // "m_load=3000kg" reads as `3000 kg`
    const size_t eq = s.find('=');
    sets.push_back(s.substr(0, eq) + "=" + r.substr(r.find('=') + 2));
  }
  return sets;
}

// `path` is the sheet's place on the disk: its templates are read beside it.
std::unique_ptr<Calculation> mustCalculate(const std::string& path, const std::string& text,
                                           const CalcOptions& o = {}) {
  auto c = Calculation::fromText(path, text, o);
  if (c->hasErrors() || c->caseErrors()) {
    for (const Diagnostic& d : c->diags.list()) std::fprintf(stderr, "%s\n", d.headline().c_str());
    std::exit(2);
  }
  return c;
}

template <typename Fn>
double best(int repeat, Fn fn) {
  double t = 1e30;
  for (int r = 0; r < repeat; ++r) {
    const double t0 = now();
    fn();
    t = std::min(t, now() - t0);
  }
  return t;
}

}  // namespace

int main(int argc, char** argv) {
  int n = 20, repeat = 7;
  std::string dir;
  for (int i = 1; i < argc; ++i) {
    if (!std::strcmp(argv[i], "--cases") && i + 1 < argc)
      n = std::atoi(argv[++i]);
    else if (!std::strcmp(argv[i], "--repeat") && i + 1 < argc)
      repeat = std::atoi(argv[++i]);
    else if (!std::strcmp(argv[i], "--worksheets") && i + 1 < argc)
      dir = argv[++i];
    else {
      std::fprintf(stderr, "usage: cases_perftest [--cases N] [--repeat R] [--worksheets DIR]\n");
      return 2;
    }
  }
  if (dir.empty()) dir = findWorksheets("twin-screw-lift.calc");
  if (dir.empty()) {
    std::fprintf(stderr, "%s\n", worksheetsNotFound("cases_perftest", "twin-screw-lift.calc").c_str());
    return 2;
  }
  const std::string path = dir + "/twin-screw-lift.calc";
  std::string base, error;
  if (!readFile(path, &base, &error)) {
    std::fprintf(stderr, "cases_perftest: %s: %s\n", path.c_str(), error.c_str());
    return 2;
  }
  const std::string sheet = withCases(base, n);

  // The cases give, bit for bit, what their separate runs give.
  auto all = mustCalculate(path, sheet);
  for (int i = 0; i < n; ++i) {
    CalcOptions o;
    o.sets = setsOf(i);
    auto alone = mustCalculate(path, base, o);
    if (std::memcmp(all->cases[static_cast<size_t>(i)].results.values.data(), alone->results.values.data(),
                    alone->results.values.size() * sizeof(double)) != 0) {
      std::fprintf(stderr, "cases_perftest: case c%d differs from its separate run\n", i);
      return 2;
    }
  }

  std::printf("twin-screw-lift.calc (%zu quantities, %zu checks), %d cases, best of %d\n\n",
              all->quantityCount(), all->checkCount(), n, repeat);
  const double one = best(repeat, [&] { mustCalculate(path, base); });
  const double with_cases = best(repeat, [&] { mustCalculate(path, sheet); });
  const double separate = best(repeat, [&] {
    for (int i = 0; i < n; ++i) {
      CalcOptions o;
      o.sets = setsOf(i);
      mustCalculate(path, base, o);
    }
  });
  std::printf("end to end (read, parse, model, evaluate):\n");
  std::printf("  one case (the nominal alone)        %9.1f us\n", one * 1e6);
  std::printf("  nominal + %2d cases in one run       %9.1f us   %.2fx one case\n", n, with_cases * 1e6,
              with_cases / one);
  std::printf("  %2d separate runs with --set         %9.1f us   %.2fx one case\n", n, separate * 1e6,
              separate / one);

  // Evaluation alone over one model: the stage a sweep or an editor uses.
  const Model& m = *all->model;
  const double cones = best(repeat, [&] {
    Evaluation e(m);
    const Results nominal = e.evaluate(*all->inputs);
    for (const CaseRun& c : all->cases) {
      Results r = nominal;
      e.evaluateCone(*c.inputs, &r);
    }
  });
  const double fresh = best(repeat, [&] {
    for (const CaseRun& c : all->cases) {
      Evaluation e(m);
      e.evaluate(*c.inputs);
    }
  });
  const double nominal_once = best(repeat, [&] {
    Evaluation e(m);
    e.evaluate(*all->inputs);
  });
  std::printf("evaluation alone (model built once):\n");
  std::printf("  nominal, fresh context               %9.1f us\n", nominal_once * 1e6);
  std::printf("  nominal + %2d cones, one context     %9.1f us   %.2fx the nominal\n", n, cones * 1e6,
              cones / nominal_once);
  std::printf("  %2d whole evaluations, fresh contexts %8.1f us   %.2fx the nominal\n", n, fresh * 1e6,
              fresh / nominal_once);
  return 0;
}
