// startup_perftest: a benchmark program, not a test. One `calctrail report`
// of a demo worksheet, as a user or a build script starts it, against the
// cheapest process start there is (/bin/true), in one interleaved run:
// true, report, true, report, ... so that a burst of load on a shared
// machine falls on both. Each run is a fresh process (posix_spawn), its
// output thrown away; wall time from spawn to reap, CPU time and peak RSS
// from wait4. Target (issue 10): the report at most 3x /bin/true.
//
//   startup_perftest [--runs N] [--calctrail PATH] [--worksheet FILE] [--format F]
//
// PATH defaults to the calctrail beside this program (both in build/), FILE
// to twin-screw-lift.calc in the worksheets/ found from the current directory
// or this program's upwards (engine/util/find_worksheets.h).
// Exit status: 0; 2 when a run fails.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <fcntl.h>
#include <spawn.h>
#include <string>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>
#include <vector>

#include "engine/util/find_worksheets.h"

extern char** environ;

namespace {

struct Run {
  double wall_ms = 0, cpu_ms = 0;
  long rss_kb = 0;
};

double now() {
  return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

double toMs(const timeval& t) { return static_cast<double>(t.tv_sec) * 1e3 + static_cast<double>(t.tv_usec) / 1e3; }

// Runs argv with stdout and stderr sent to /dev/null; false when it fails.
bool runOnce(const std::vector<std::string>& args, Run* out) {
  std::vector<char*> argv;
  for (const std::string& a : args) argv.push_back(const_cast<char*>(a.c_str()));
  argv.push_back(nullptr);
  posix_spawn_file_actions_t actions;
  posix_spawn_file_actions_init(&actions);
  posix_spawn_file_actions_addopen(&actions, 1, "/dev/null", O_WRONLY, 0);
  posix_spawn_file_actions_addopen(&actions, 2, "/dev/null", O_WRONLY, 0);
  const double start = now();
  pid_t pid = 0;
  const int spawned = posix_spawn(&pid, argv[0], &actions, nullptr, argv.data(), environ);
  posix_spawn_file_actions_destroy(&actions);
  if (spawned != 0) return false;
  int status = 0;
  rusage usage{};
  if (wait4(pid, &status, 0, &usage) != pid) return false;
  out->wall_ms = (now() - start) * 1e3;
  out->cpu_ms = toMs(usage.ru_utime) + toMs(usage.ru_stime);
  out->rss_kb = usage.ru_maxrss;
  return WIFEXITED(status) && WEXITSTATUS(status) == 0;
}

double median(std::vector<double> v) {
  std::sort(v.begin(), v.end());
  const size_t n = v.size();
  return n % 2 ? v[n / 2] : (v[n / 2 - 1] + v[n / 2]) / 2;
}

struct Summary {
  double best_wall, median_wall, best_cpu, median_cpu;
  long rss_kb;
};

Summary summarize(const std::vector<Run>& runs) {
  std::vector<double> wall, cpu;
  long rss = 0;
  for (const Run& r : runs) {
    wall.push_back(r.wall_ms);
    cpu.push_back(r.cpu_ms);
    rss = std::max(rss, r.rss_kb);
  }
  return {*std::min_element(wall.begin(), wall.end()), median(wall), *std::min_element(cpu.begin(), cpu.end()),
          median(cpu), rss};
}

std::string besideThisProgram(const char* argv0, const char* name) {
  std::string dir = argv0;
  const size_t slash = dir.rfind('/');
  dir = slash == std::string::npos ? "." : dir.substr(0, slash);
  return dir + "/" + name;
}

}  // namespace

int main(int argc, char** argv) {
  int runs = 200;
  std::string calctrail = besideThisProgram(argv[0], "calctrail");
  std::string worksheet;
  std::string format = "text";
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    const bool has_value = i + 1 < argc;
    if (a == "--runs" && has_value) runs = std::max(1, std::atoi(argv[++i]));
    else if (a == "--calctrail" && has_value) calctrail = argv[++i];
    else if (a == "--worksheet" && has_value) worksheet = argv[++i];
    else if (a == "--format" && has_value) format = argv[++i];
    else {
      std::fprintf(stderr, "usage: startup_perftest [--runs N] [--calctrail PATH] [--worksheet FILE] [--format F]\n");
      return 2;
    }
  }
  if (worksheet.empty()) {
    const std::string dir = calctrail::findWorksheets("twin-screw-lift.calc");
    if (dir.empty()) {
      std::fprintf(stderr, "%s\n",
                   calctrail::worksheetsNotFound("startup_perftest", "twin-screw-lift.calc", "--worksheet FILE")
                       .c_str());
      return 2;
    }
    worksheet = dir + "/twin-screw-lift.calc";
  }
  const std::vector<std::string> truth = {"/bin/true"};
  const std::vector<std::string> report = {calctrail, "report", worksheet, "--format", format};
  std::vector<Run> true_runs, report_runs;
  for (int i = 0; i < runs; ++i) {
    Run t, r;
    if (!runOnce(truth, &t)) {
      std::fprintf(stderr, "startup_perftest: /bin/true failed\n");
      return 2;
    }
    if (!runOnce(report, &r)) {
      std::fprintf(stderr, "startup_perftest: `%s report %s --format %s` failed (pass --calctrail and --worksheet)\n",
                   calctrail.c_str(), worksheet.c_str(), format.c_str());
      return 2;
    }
    true_runs.push_back(t);
    report_runs.push_back(r);
  }
  const Summary t = summarize(true_runs), r = summarize(report_runs);
  double load[1] = {0};
  getloadavg(load, 1);
  std::printf("startup: %d runs each, interleaved; ms per process, spawn to reap (wall) and user+system (cpu);"
              " load average %.2f\n\n", runs, load[0]);
  std::printf("%-52s %9s %9s %9s %9s %8s\n", "program", "best", "median", "cpu best", "cpu med", "RSS MB");
  auto row = [](const std::string& name, const Summary& s) {
    std::printf("%-52s %9.2f %9.2f %9.2f %9.2f %8.1f\n", name.c_str(), s.best_wall, s.median_wall, s.best_cpu,
                s.median_cpu, static_cast<double>(s.rss_kb) / 1024.0);
  };
  row("/bin/true", t);
  row("calctrail report " + worksheet.substr(worksheet.rfind('/') + 1) + " --format " + format, r);
  std::printf("\nratio report / true: best %.2fx, median %.2fx (target: at most 3x)\n", r.best_wall / t.best_wall,
              r.median_wall / t.median_wall);
  return 0;
}
