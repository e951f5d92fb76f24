// evaluate_perftest: a benchmark program, not a test. Two figures for the
// engine split (docs/engine.md):
//
// 1. The per-point cost of re-evaluating worksheets/twin-screw-lift.calc
//    after changing one input (the cone of that input, then the checks that
//    read it), side by side with a hand-written C++ port of the same
//    calculation compiled into this program, and their ratio (target: at
//    most 5x native). The port calls the drive functions' own C++ code
//    directly (resolved once, leads passed per revolution by hand), as a
//    C++ program using the library would; so the ratio is the engine's
//    overhead: slots, muparser bytecode, the library-call boundary, checks.
// 2. The memory a model keeps per line of a large generated sheet (the
//    twin-screw formulas repeated under new names), and what an evaluation
//    context adds after one evaluation (scratch parser only) and after a
//    second (every formula kept set in a parser of its own).
//
//   evaluate_perftest [--points N] [--blocks B] [--worksheets DIR] [--input NAME]
//                     [--memory-only] [--write-sheet FILE]
//
// --input NAME measures that input's cone alone and skips the rest (for a
// profiler: `valgrind --tool=callgrind build/evaluate_perftest --input d`).
// --memory-only skips part 1; --write-sheet writes the generated sheet of
// part 2 to FILE and stops (for `calctrail report` under /usr/bin/time -v,
// docs/performance.md; do not commit the file).
//
// DIR defaults to the worksheets/ folder found from the current directory or
// from this program's, upwards (engine/util/find_worksheets.h).
//
// Exit status: 0; 2 when the worksheet does not calculate cleanly or the
// port's values differ from the engine's (a bug in one of them).
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <vector>
#ifdef __GLIBC__  // defined by the C library headers above
#include <malloc.h>
#endif

#include "engine/calculation.h"
#include "engine/model/evaluate.h"
#include "engine/model/twin_screw_port.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/sheet/source_file.h"
#include "engine/template/template_loader.h"
#include "engine/util/find_worksheets.h"
#include "engine/util/sha256.h"
#include "engine/util/math_constants.h"

using namespace calctrail;
using namespace calctrail::perftest;

namespace {

double now() {
  return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

double heapBytes() {
#ifdef __GLIBC__
  const auto mi = ::mallinfo2();
  return static_cast<double>(mi.uordblks + mi.hblkhd);
#else
  return 0;
#endif
}

std::string readAll(const std::string& path) {
  std::string bytes, error;
  if (!readFile(path, &bytes, &error)) {
    std::fprintf(stderr, "evaluate_perftest: %s: %s\n", path.c_str(), error.c_str());
    std::exit(2);
  }
  return bytes;
}

// ---------------------------------------------------------------------------

struct Figures {
  const char* input;
  size_t cone = 0;       // slots re-run
  double engine_us = 0;  // per point: bind + evaluateCone (cone + checks)
  double native_us = 0;  // per point: the port, whole
};

// The points move the input by up to +-5 %, inside every validity limit; the
// screw diameter steps through sizes of the trapezoidal series instead.
double perturbed(const char* name, double base, int i) {
  if (std::strcmp(name, "d") == 0) {
    static constexpr double kSizes[] = {0.044, 0.048, 0.050, 0.052};
    return kSizes[i % 4];
  }
  return base * (1.0 + 0.05 * std::sin(0.1 * i));
}

// Points per timed chunk (see measure).
constexpr int kChunk = 500;

Figures measure(const Model& m, const Inputs& nominal, const Results& base, const Library& L,
                const char* name, int points) {
  Figures f;
  f.input = name;
  const Slot slot = m.find(name);
  f.cone = m.downstream({slot}).size();
  int index = 0;
  while (std::strcmp(kInputs[index], name) != 0) ++index;
  double in[kInputCount];
  for (int k = 0; k < kInputCount; ++k) in[k] = base.value(m.find(kInputs[k]));
  const double x0 = base.value(slot);

  Evaluation context(m);
  Inputs point(m, &nominal);
  Results r = base;
  volatile double sink = 0;
  double best_engine = 1e9, best_native = 1e9;
  // Interleaved in short chunks, engine then native, the best chunk of each
  // kept: on a shared machine a burst of load falls on both sides, and a
  // chunk (about 0.1 to 1 ms) is seldom interrupted, so the best of many is
  // the undisturbed cost even when another build runs.
  const int chunk = std::min(points, kChunk);
  const int rounds = std::max(5, 5 * points / chunk);
  PortOut out;
  for (int round = 0, i0 = 0; round < rounds; ++round, i0 += chunk) {
    double t = now();
    for (int i = i0; i < i0 + chunk; ++i) {
      point.bind(slot, perturbed(name, x0, i));
      context.evaluateCone(point, &r);
      sink = sink + r.values[m.slotCount() - 1] + (r.checks.empty() ? 0 : r.checks[0].passed);
    }
    best_engine = std::min(best_engine, (now() - t) / chunk);
    t = now();
    for (int i = i0; i < i0 + chunk; ++i) {
      in[index] = perturbed(name, x0, i);
      port(L, in, &out);
      sink = sink + out.v[kOutputCount - 1] + out.checks[0];
    }
    best_native = std::min(best_native, (now() - t) / chunk);
  }
  f.engine_us = best_engine * 1e6;
  f.native_us = best_native * 1e6;
  return f;
}

// The demo's model with its templates expanded, as Calculation builds it.
std::unique_ptr<const Model> buildDemo(const std::string& path, const std::string& bytes, Diagnostics* diags) {
  Sheet sheet = parseSheet(std::make_shared<SourceFile>(path, bytes), diags);
  TemplateCache cache;
  expandTemplates(&sheet, path, sha256Hex(bytes), diskSource(), &cache, diags);
  return Model::build(std::move(sheet), diags);
}

// The port and the engine agree at the nominal point (a check on the port).
bool portAgrees(const Model& m, const Results& base, const Library& L) {
  double in[kInputCount];
  for (int k = 0; k < kInputCount; ++k) in[k] = base.value(m.find(kInputs[k]));
  PortOut out;
  port(L, in, &out);
  bool same = true;
  for (int k = 0; k < kOutputCount; ++k) {
    const double e = base.value(m.find(kOutputs[k]));
    if (!(std::fabs(out.v[k] - e) <= 1e-12 * std::fabs(e))) {
      std::fprintf(stderr, "evaluate_perftest: %s: port %.17g, engine %.17g\n", kOutputs[k], out.v[k], e);
      same = false;
    }
  }
  for (int k = 0; k < 7; ++k) same &= out.checks[k] == base.checks[k].passed;
  return same;
}

// A dotted instance name as a plain one: screw.T_raise is screw_T_raise.
std::string plainName(std::string name) {
  std::replace(name.begin(), name.end(), '.', '_');
  return name;
}

// The twin-screw formulas `blocks` times, each copy's names suffixed _k.
std::string largeSheet(const Model& demo, int blocks, size_t* lines) {
  std::string out;
  *lines = 0;
  for (int b = 0; b < blocks; ++b) {
    const std::string suffix = "_" + std::to_string(b);
    for (size_t i = 0; i < demo.slotCount(); ++i) {
      const Quantity& q = demo.sheet().quantities[i];
      // The expanded sheet's names are resolved already ("l" in `screw` reads screw.l).
      out += plainName(q.name) + suffix;
      if (!q.unit_written.empty()) out += " [" + q.unit_written + "]";
      out += " = " + renderExpr(*q.expr, [&](const Expr& n) { return plainName(n.text) + suffix; }) + "\n";
      ++*lines;
    }
  }
  return out;
}

void memoryFigures(const Model& demo, int blocks) {
  size_t lines = 0;
  const std::string text = largeSheet(demo, blocks, &lines);
  if (text.size() > kMaxSourceBytes) {  // SourceFile refuses it (docs/limits.md)
    std::fprintf(stderr, "evaluate_perftest: %d blocks make %.1f MB, over the worksheet limit of %zu MB\n",
                 blocks, static_cast<double>(text.size()) / 1e6, kMaxSourceBytes >> 20);
    std::exit(2);
  }
  const double h0 = heapBytes();
  Diagnostics diags;
  Sheet sheet = parseSheet(std::make_shared<SourceFile>("large.calc", text), &diags);
  const double h1 = heapBytes();
  double t = now();
  auto model = Model::build(std::move(sheet), &diags);
  const double build_s = now() - t;
  const double h2 = heapBytes();
  if (diags.hasErrors()) {
    std::fprintf(stderr, "evaluate_perftest: the generated sheet has errors:\n%s\n",
                 diags.list().front().headline().c_str());
    std::exit(2);
  }
  const Inputs nominal(*model);
  Evaluation context(*model);
  t = now();
  Results first = context.evaluate(nominal);
  const double first_s = now() - t;
  const double h3 = heapBytes();
  t = now();
  Results second = context.evaluate(nominal);
  const double second_s = now() - t;
  const double h4 = heapBytes();
  t = now();
  Results third = context.evaluate(nominal);
  const double third_s = now() - t;
  const double n = static_cast<double>(lines);
  std::printf("\nmemory: a generated sheet of %zu lines (the twin-screw formulas %d times), per line:\n",
              lines, blocks);
  std::printf("  parsed sheet (expression trees, text):      %7.0f bytes\n", (h1 - h0) / n);
  std::printf("  model beyond its sheet (slots, programs):   %7.0f bytes  (compiledBytes() says %.0f)\n",
              (h2 - h1) / n, static_cast<double>(model->compiledBytes()) / n);
  std::printf(
      "  evaluation context after one evaluation:    %7.0f bytes  (results included; scratch parser only)\n",
      (h3 - h2) / n);
  std::printf("  after a second evaluation (all kept set):   %7.0f bytes  (%zu parsers kept)\n",
              (h4 - h3) / n, context.keptPrograms());
  std::printf(
      "  time per line: build %.2f us, first evaluation %.2f us, second %.2f us (setting each\n"
      "  program in its parser), third %.3f us (bytecode only)\n",
      build_s * 1e6 / n, first_s * 1e6 / n, second_s * 1e6 / n, third_s * 1e6 / n);
}

int usage() {
  std::fprintf(stderr,
               "usage: evaluate_perftest [--points N] [--blocks B] [--worksheets DIR] [--input NAME] "
               "[--memory-only] [--write-sheet FILE]\n");
  return 2;
}

}  // namespace

int main(int argc, char** argv) {
  int points = 20000, blocks = 2000;
  std::string dir, only, write_sheet;
  bool memory_only = false;
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    if (a == "--points" && i + 1 < argc)
      points = std::atoi(argv[++i]);
    else if (a == "--blocks" && i + 1 < argc)
      blocks = std::atoi(argv[++i]);
    else if (a == "--worksheets" && i + 1 < argc)
      dir = argv[++i];
    else if (a == "--input" && i + 1 < argc)
      only = argv[++i];
    else if (a == "--write-sheet" && i + 1 < argc)
      write_sheet = argv[++i];
    else if (a == "--memory-only")
      memory_only = true;
    else
      return usage();
  }
  if (points < 1 || blocks < 1) return usage();
  if (dir.empty()) dir = findWorksheets("twin-screw-lift.calc");
  if (dir.empty()) {
    std::fprintf(stderr, "%s\n", worksheetsNotFound("evaluate_perftest", "twin-screw-lift.calc").c_str());
    return 2;
  }
  const std::string path = dir + "/twin-screw-lift.calc";
  Diagnostics diags;
  auto model = buildDemo(path, readAll(path), &diags);
  if (diags.hasErrors()) {
    std::fprintf(stderr, "evaluate_perftest: %s has errors\n", path.c_str());
    return 2;
  }
  if (!write_sheet.empty()) {
    size_t lines = 0;
    const std::string text = largeSheet(*model, blocks, &lines);
    std::FILE* f = std::fopen(write_sheet.c_str(), "wb");
    if (!f || std::fwrite(text.data(), 1, text.size(), f) != text.size() || std::fclose(f) != 0) {
      std::fprintf(stderr, "evaluate_perftest: cannot write %s\n", write_sheet.c_str());
      return 2;
    }
    std::printf("%s: %zu lines, %.1f MB\n", write_sheet.c_str(), lines, static_cast<double>(text.size()) / 1e6);
    return 0;
  }
  if (memory_only) {
    memoryFigures(*model, blocks);
    return 0;
  }
  const Inputs nominal(*model);
  const Results base = evaluate(*model, nominal);
  const Library library;
  if (!base.faults.empty() || !portAgrees(*model, base, library)) return 2;

  std::printf(
      "twin-screw-lift.calc: %zu quantities, %zu checks; per point (%d points 5 times, in chunks of %d\n"
      "points, engine and native in turn, the best chunk of each):\n",
      model->slotCount(), model->checks().size(), points, std::min(points, kChunk));
  std::printf("  %-18s %5s %14s %12s %7s\n", "input", "cone", "engine (us)", "native (us)", "ratio");
  double engine_sum = 0, native_sum = 0;
  int n = 0;
  for (const char* name : kInputs) {
    // Whole numbers: a 5 % change leaves their limits.
    if (std::strcmp(name, "screws") == 0 || std::strcmp(name, "screw.starts") == 0) continue;
    if (!only.empty() && only != name) continue;
    const Figures f = measure(*model, nominal, base, library, name, points);
    std::printf("  %-18s %5zu %14.3f %12.3f %6.1fx\n", f.input, f.cone, f.engine_us, f.native_us,
                f.engine_us / f.native_us);
    engine_sum += f.engine_us;
    native_sum += f.native_us;
    ++n;
  }
  if (!only.empty()) {
    if (n == 0) {
      std::fprintf(stderr, "evaluate_perftest: `%s` is not one of the inputs measured\n", only.c_str());
      return 2;
    }
    return 0;
  }
  std::printf("  %-18s %5s %14.3f %12.3f %6.1fx   (target: at most 5x)\n", "mean", "", engine_sum / n,
              native_sum / n, engine_sum / native_sum);

  // For scale: a whole evaluation in a context kept, one in a fresh context, and the CLI's path.
  {
    Evaluation context(*model);
    context.evaluate(nominal);
    double t = now();
    const int reps = std::max(1, points / 10);
    for (int i = 0; i < reps; ++i) context.evaluate(nominal);
    const double kept_us = (now() - t) * 1e6 / reps;
    t = now();
    for (int i = 0; i < reps / 10 + 1; ++i) evaluate(*model, nominal);
    const double fresh_us = (now() - t) * 1e6 / (reps / 10 + 1);
    const std::string bytes = readAll(path);
    t = now();
    for (int i = 0; i < reps / 10 + 1; ++i) Calculation::fromText(path, bytes);
    const double calc_us = (now() - t) * 1e6 / (reps / 10 + 1);
    std::printf(
        "  whole evaluation, context kept: %.2f us; in a fresh context: %.1f us; "
        "Calculation::fromText: %.1f us\n",
        kept_us, fresh_us, calc_us);
  }
  memoryFigures(*model, blocks);
  return 0;
}
