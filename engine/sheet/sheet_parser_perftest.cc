// sheet_parser_perftest: a benchmark program, not a test. Parses worksheets
// of 10k and 100k lines made of one kind of statement each (definitions,
// checks, prose) and a typical mix, and prints the parse time per line and
// the 100k/10k ratio, flagged above 12: parsing must stay linear whatever
// the statements are. engine/calculation_perftest times the whole pipeline;
// docs/performance.md has the figures.
//
//   sheet_parser_perftest [--sizes 10000,100000]
//
// Every run is a fresh child process, so that each parse starts from a cold
// heap as in one `calctrail` command (a warm heap flatters small sheets);
// each figure is the best of 3 runs, or of one when a run takes over 2 s.
// Exit status 1 when a ratio in CPU time is above 12.

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <memory>
#include <string>
#include <vector>

#include "engine/sheet/sheet_parser.h"
#include "engine/util/child_run.h"

using namespace calctrail;

namespace {

// One line of the given kind; `i` numbers the line.
std::string line(const std::string& kind, int i) {
  const std::string n = std::to_string(i);
  const std::string prev = std::to_string(std::max(0, i - 1));
  if (kind == "define") return "q" + n + " [mm] = q" + prev + " * 1.01 + 2 mm  # step " + n + "\n";
  if (kind == "check") return "check c" + n + ": q0 < " + n + " [m]  # limit " + n + "\n";
  switch (i % 4) {  // prose: sections, notes, comments, blank lines
    case 0: return "section Part " + n + "\n";
    case 1: return "note The load on part " + n + " is carried by the screw and the nut.\n";
    case 2: return "# a comment on part " + n + "\n";
    default: return "\n";
  }
}

std::string sheet(const std::string& shape, int lines) {
  std::string s = "title: Parser benchmark\nq0 = 1 mm\n";
  for (int i = 2; i < lines; ++i) {
    if (shape != "mix") {
      s += line(shape, i);
      continue;
    }
    // Like the demo worksheets: about 6 definitions, 1 check and 3 prose lines in 10.
    const int r = i % 10;
    s += line(r < 6 ? "define" : r == 6 ? "check" : "prose", i);
  }
  return s;
}

double cpuMs() {
  timespec ts{};
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &ts);
  return static_cast<double>(ts.tv_sec) * 1e3 + static_cast<double>(ts.tv_nsec) * 1e-6;
}

struct Run {
  double wall_ms = 0, cpu_ms = 0;
  int statements = 0;  // one per line, or the generator is wrong
  int errors = 0;
};

// Parses in a child process; false when the child fails.
bool parseInChild(const std::string& shape, int lines, Run* out) {
  return runInChild(
      [&](Run* r) {
        const std::string text = sheet(shape, lines);
        const double c0 = cpuMs();
        const auto t0 = std::chrono::steady_clock::now();
        Diagnostics diags;
        Sheet s = parseSheet(std::make_shared<SourceFile>("bench.calc", text), &diags);
        r->wall_ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
        r->cpu_ms = cpuMs() - c0;
        r->statements = static_cast<int>(s.statements.size());
        r->errors = diags.errorCount();
      },
      out);
}

}  // namespace

int main(int argc, char** argv) {
  std::vector<int> sizes = {10000, 100000};
  if (argc == 3 && std::string(argv[1]) == "--sizes") {
    sizes.clear();
    const std::string list = argv[2];
    for (size_t b = 0; b < list.size();) {
      size_t e = list.find(',', b);
      if (e == std::string::npos) e = list.size();
      sizes.push_back(std::max(10, std::atoi(list.substr(b, e - b).c_str())));
      b = e + 1;
    }
  } else if (argc != 1) {
    std::fprintf(stderr, "usage: sheet_parser_perftest [--sizes 10000,100000]\n");
    return 2;
  }
  std::printf("parseSheet in a fresh process per run: best of 3 (1 when a run takes over 2 s);\n"
              "us/line and MB/s from CPU time\n\n");
  std::printf("%-7s %7s %9s %9s %8s %8s\n", "shape", "lines", "wall ms", "cpu ms", "us/line", "MB/s");
  int status = 0;
  for (const char* shape : {"define", "check", "prose", "mix"}) {
    double c10 = 0, c100 = 0, w10 = 0, w100 = 0;
    for (int lines : sizes) {
      Run best;
      best.wall_ms = best.cpu_ms = 1e300;
      bool ok = true;
      for (int rep = 0; rep < 3 && ok; ++rep) {
        Run r;
        ok = parseInChild(shape, lines, &r);
        if (!ok) break;
        best.wall_ms = std::min(best.wall_ms, r.wall_ms);
        best.cpu_ms = std::min(best.cpu_ms, r.cpu_ms);
        best.statements = r.statements;
        best.errors = r.errors;
        if (r.wall_ms > 2000) break;
      }
      if (!ok) {
        std::printf("%-7s %7d  (the child process failed)\n", shape, lines);
        status = 2;
        continue;
      }
      const double mb = static_cast<double>(sheet(shape, lines).size()) / (1024.0 * 1024.0);
      std::printf("%-7s %7d %9.1f %9.1f %8.2f %8.1f\n", shape, lines, best.wall_ms, best.cpu_ms,
                  best.cpu_ms * 1000 / lines, mb / (best.cpu_ms / 1000));
      if (best.statements != lines || best.errors)
        std::printf("  (%d statements for %d lines, %d errors: the generator is wrong)\n", best.statements, lines,
                    best.errors);
      if (lines == 10000) c10 = best.cpu_ms, w10 = best.wall_ms;
      if (lines == 100000) c100 = best.cpu_ms, w100 = best.wall_ms;
    }
    if (c10 > 0 && c100 > 0) {
      std::printf("        100k/10k: wall %.2f, cpu %.2f%s\n", w100 / w10, c100 / c10,
                  c100 / c10 > 12 ? "  ** NOT LINEAR: above 12 **" : "");
      if (c100 / c10 > 12) status = 1;
    }
  }
  return status;
}
