// calculation_perftest: a benchmark program, not a test. It generates
// worksheets of 1k, 10k and 100k lines in three shapes (a long chain, a wide
// fan-in, a realistic mix of screw calculations), times every stage of the
// pipeline and the whole of it, and prints the figures with the peak memory
// and the 100k/10k ratio of end-to-end time (flagged above 12: cost must grow
// linearly). docs/performance.md explains the figures and records them.
//
//   calculation_perftest                  all shapes, 1k 10k 100k, then the muparser note
//   calculation_perftest --sizes 1000,10000 --shapes chain,mix
//   calculation_perftest --shapes none --cases one-cycle --no-note
//                                         only the worksheets with errors an audit found
//                                         super-linear (suggestions, one-cycle, two-cycles)
//   calculation_perftest --cpu            CPU time instead of wall time (a busy machine)
//   calculation_perftest --dump mix 1000  print a generated worksheet and stop
//   calculation_perftest --worksheets DIR the demos the mix copies (default: the
//                                         worksheets/ found from the current directory
//                                         or from this program's, upwards)
//
// Every run of a case is a fresh child process (fork), so that its heap is
// cold, as in one `calctrail report`, and its peak RSS is its own. The runs
// of the sizes interleave; each end-to-end figure is the best of --runs runs
// (5), each stage figure the best of the first two.
// Exit status: 0; 1 when a ratio (in CPU time) is above 12; 2 when a
// generated worksheet does not calculate cleanly (a bug in the generator or
// the engine).
#include <muParser.h>
#ifdef __GLIBC__
#include <malloc.h>
#endif
#include <dirent.h>
#include <sys/mman.h>
#include <sys/resource.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <ctime>
#include <set>
#include <string>
#include <vector>

#include "engine/calculation.h"
#include "engine/eval/dimension_check.h"
#include "engine/eval/evaluator.h"
#include "engine/eval/program.h"
#include "engine/eval/tree_eval.h"
#include "engine/graph/dependency_graph.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/sheet/source_file.h"
#include "engine/units/unit.h"
#include "functions/function_decl.h"
#include "engine/util/child_run.h"
#include "engine/util/edit_distance.h"
#include "engine/util/find_worksheets.h"

using namespace calctrail;

namespace {

// ---------------------------------------------------------------------------
// Worksheet generators. Each returns exactly `lines` lines of text (comment
// lines pad a worksheet that falls short).

std::string padToLines(std::string text, int lines) {
  int have = static_cast<int>(std::count(text.begin(), text.end(), '\n'));
  for (int i = have; i < lines; ++i) text += "# padding to the line count of the benchmark\n";
  return text;
}

// (a) A long chain: every quantity uses the one before it. A cycle of seven
// steps mixes lengths, an area and its square root, an angle and its cosine,
// a torque and back to a length; the map contracts, so values stay bounded.
std::string chainSheet(int lines) {
  // Step i uses step i-1; %s are the step's name and the previous one's.
  static const char* const kSteps[7][2] = {
      {"%s [mm] = %s / (1 kN) + 0.5 mm  # back to a length\n", "mm"},
      {"%s [mm] = %s * 0.5 + 1 mm  # halve and shift\n", "mm"},
      {"%s [mm^2] = %s^2 / 4 + 3 [mm^2]  # an area\n", "mm^2"},
      {"%s [mm] = sqrt(%s) + 0.25 mm  # side of the square\n", "mm"},
      {"%s [deg] = %s / (10 mm) * 30 deg  # an angle\n", "deg"},
      {"%s [mm] = 2 mm * cos(%s) + 1 mm  # a projection\n", "mm"},
      {"%s [N*m] = %s * 2.5 kN  # a torque\n", "N*m"},
  };
  std::string s = "title: Benchmark: a long chain\nsection Chain\nx0 = 1.5 mm  # start of the chain\n";
  const int steps = lines - 4;  // title, section, x0, check
  std::string prev = "x0";
  const char* unit = "mm";
  char buf[200];
  for (int i = 1; i <= steps; ++i) {
    const std::string name = "x" + std::to_string(i);
    std::snprintf(buf, sizeof buf, kSteps[i % 7][0], name.c_str(), prev.c_str());
    s += buf;
    unit = kSteps[i % 7][1];
    prev = name;
  }
  s += "check chain_end: " + prev + " > 0 [" + unit + "]  # the chain reaches its end\n";
  return padToLines(s, lines);
}

// (b) A wide fan-in: many inputs a_i = i kN, summed in groups of at most 50
// terms, the group sums summed again, up to one total, with a final check.
int fanInLines(int inputs) {
  int total = 3 + inputs;  // title, section, check
  for (int level = inputs; level > 1;) {
    level = (level + 49) / 50;
    total += level;
  }
  return total + (inputs > 1 ? 0 : 1);
}

std::string fanInSheet(int lines) {
  int inputs = lines;
  while (inputs > 1 && fanInLines(inputs) > lines) --inputs;
  std::string s = "title: Benchmark: a wide fan-in\nsection Loads\n";
  std::vector<std::string> level;
  for (int i = 1; i <= inputs; ++i) {
    level.push_back("a" + std::to_string(i));
    s += level.back() + " = " + std::to_string(i) + " kN  # load " + std::to_string(i) + "\n";
  }
  int depth = 0;
  while (level.size() > 1 || depth == 0) {
    ++depth;
    std::vector<std::string> next;
    for (size_t g = 0; g < level.size(); g += 50) {
      next.push_back("s" + std::to_string(depth) + "_" + std::to_string(g / 50));
      s += next.back() + " [kN] = ";
      for (size_t k = g; k < std::min(level.size(), g + 50); ++k) s += (k > g ? " + " : "") + level[k];
      s += "  # group sum\n";
    }
    level = std::move(next);
  }
  const double sum = 0.5 * inputs * (inputs + 1.0);  // kN, exact in a double
  char buf[160];
  std::snprintf(buf, sizeof buf, "check total: %s <= %.17g kN  # the sum of 1..%d kN\n", level[0].c_str(),
                sum * (1 + 1e-12), inputs);
  s += buf;
  return padToLines(s, lines);
}

// Snapshots of two demo worksheets (worksheets/*.calc, as first written,
// before they used the drive library), without their title blocks.
const char* const kGateTemplate = R"(section Loads on the gate
note The leaf slides in guides. Water pressure on the closed gate presses it onto its
note side seals, and the seal friction adds to the weight when the gate is raised
note against the full head. The high friction value is used for the lifting load.

m_leaf = 950 kg                                  # mass of the steel leaf and stem
g_n = 9.80665 [m/s^2]                            # standard gravity (exact, CGPM 1901)
W_leaf [kN] = m_leaf * g_n                       # weight of the leaf
b_gate = 1.6 m                                   # clear width of the opening
h_gate = 1.2 m                                   # height of the leaf
H_up = 2.4 m                                     # upstream water depth over the sill
rho_w = 1000 [kg/m^3]                            # density of fresh water
F_water [kN] = rho_w * g_n * b_gate * h_gate * (H_up - h_gate / 2)  # resultant water thrust on the closed leaf
mu_seal = 0.35                                   # rubber seal on stainless steel, wet (common practice 0.3 to 0.5)
F_seal [kN] = mu_seal * F_water                  # seal friction against lifting
F [kN] = W_leaf + F_seal                         # axial load on the screw while raising

section Screw and nut
note A single-start metric trapezoidal screw Tr 40x7 in steel, nut in bronze. Mean and
note minor diameters are the basic ones of the thread profile (d - p/2 and d - p).

d = 40 mm                                        # major diameter
p = 7 mm                                         # pitch
starts = 1                                       # number of thread starts
l = starts * p                                   # lead: axial advance per turn
d_m [mm] = d - p / 2                             # mean (pitch) diameter
d_r [mm] = d - p                                 # minor (root) diameter
alpha = 15 deg                                   # flank half-angle of the 30 deg trapezoidal form
f_high = 0.15                                    # steel on bronze, poorly lubricated: for torque and motor
f_low = 0.08                                     # steel on bronze, well lubricated: for self-locking

T_raise [N*m] = F * d_m / 2 * (l + pi * f_high * d_m / cos(alpha)) / (pi * d_m - f_high * l / cos(alpha))  # torque to raise the load, thread only
T_lower [N*m] = F * d_m / 2 * (pi * f_low * d_m / cos(alpha) - l) / (pi * d_m + f_low * l / cos(alpha))   # torque to lower at low friction; positive means self-locking
eta_screw [%] = F * l / (2 * pi * T_raise)       # efficiency of the thread while raising
section Thrust bearing
note The stem is carried in a rolling thrust bearing on the hoist frame.

mu_bearing = 0.005                               # rolling thrust bearing, referred to its mean diameter (common practice)
d_bearing = 60 mm                                # mean diameter of the bearing
T_bearing [N*m] = F * mu_bearing * d_bearing / 2 # bearing friction torque
T_screw [N*m] = T_raise + T_bearing              # torque at the screw while raising

section Stresses in the screw body
sigma_axial [MPa] = 4 * F / (pi * d_r^2)         # axial stress at the root diameter
tau_torsion [MPa] = 16 * T_raise / (pi * d_r^3)  # torsional shear at the root diameter
sigma_vm [MPa] = sqrt(sigma_axial^2 + 3 * tau_torsion^2)  # von Mises equivalent stress
S_y = 275 MPa                                    # yield strength, structural steel S275
n_yield = S_y / sigma_vm                         # safety factor against yield

section Drive
note A worm reducer drives the screw nut; the motor runs at its rated speed.

n_motor = 1400 rpm                               # four-pole motor at rated load
i_gear = 30                                      # worm reducer ratio
eta_gear = 0.55                                  # worm reducer efficiency, single start (catalogue value)
n_screw [rpm] = n_motor / i_gear                 # screw speed
v_gate [mm/min] = n_screw * l / (1 rev)          # lifting speed: turns per minute times lead per turn
stroke = 1.25 m                                  # travel from closed to fully open
t_open [min] = stroke / v_gate                   # time to open
P_screw [W] = T_screw * n_screw                  # power at the screw
P_motor [kW] = P_screw / eta_gear                # power the motor must give
P_rated = 1.1 kW                                 # rated power of the chosen motor

check self_locking: T_lower > 0 [N*m]            # the gate holds without the brake at low friction
check stress: n_yield >= 2.5                     # common practice margin for a lifting screw
check motor_power: P_motor <= P_rated            # motor not overloaded when raising
check opening_time: t_open <= 12 min             # operating rule of the scheme
)";

const char* const kJackTemplate = R"(section Load
W_machine = 12000 lbf                            # weight of the machine on its base
n_jacks = 4                                      # jacks under the base, one per corner
k_share = 1.3                                    # uneven share of the heaviest corner (judgment)
F [lbf] = W_machine / n_jacks * k_share          # axial load on the heaviest jack

section Screw
note Acme general purpose thread, 1 inch diameter, 5 threads per inch, single start.

d = 1 in                                         # major diameter
tpi = 5                                          # threads per inch
p [in] = 1 in / tpi                              # pitch
l [in] = p                                       # lead of a single-start thread
d_m [in] = d - p / 2                             # mean diameter
d_r [in] = d - p                                 # minor diameter
alpha = 14.5 deg                                 # flank half-angle of the 29 deg Acme form
f = 0.15                                         # steel on steel, oiled (high value for torque)
f_low = 0.10                                     # low value for self-locking
T_thread [lbf*in] = F * d_m / 2 * (l + pi * f * d_m / cos(alpha)) / (pi * d_m - f * l / cos(alpha))  # torque to raise, thread only
T_lower [lbf*in] = F * d_m / 2 * (pi * f_low * d_m / cos(alpha) - l) / (pi * d_m + f_low * l / cos(alpha))  # torque to lower at low friction

section Collar
note The jack head turns on a plain hardened steel thrust washer.

f_c = 0.12                                       # hardened steel washer on steel, oiled
d_c = 1.75 in                                    # mean diameter of the collar
T_collar [lbf*in] = F * f_c * d_c / 2            # collar friction torque
T_total [lbf*in] = T_thread + T_collar           # torque on the wrench when raising
eta [%] = F * l / (2 * pi * T_total)             # overall efficiency

section Operator effort
L_wrench = 15 in                                 # effective wrench length
P_hand [lbf] = T_total / L_wrench                # force at the hand
P_allow = 60 lbf                                 # design limit for a one-hand pull (judgment)

section Stresses
A_r [in^2] = pi * d_r^2 / 4                      # root area
sigma_c [psi] = F / A_r                          # compressive stress at the root
S_y = 36 ksi                                     # yield strength, A36 steel
n_s = S_y / sigma_c                              # safety factor against yield in compression
n_engaged = 5                                    # threads engaged in the nut
p_bearing [psi] = F / (pi * d_m * n_engaged * p / 2)  # bearing pressure on the thread flanks
p_allow = 2500 psi                               # steel on steel, low speed (handbook range, from memory)

check self_locking: T_lower > 0 [lbf*in]         # holds the load without a lock
check hand_effort: P_hand <= P_allow             # one person can turn it
check yield: n_s >= 3                            # margin against yield
check bearing: p_bearing <= p_allow              # thread flank pressure
)";

bool isNameStart(char c) { return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'); }
bool isNameChar(char c) { return isNameStart(c) || (c >= '0' && c <= '9') || c == '_'; }

bool startsWith(const std::string& s, const char* prefix) { return s.rfind(prefix, 0) == 0; }

// A worksheet split in lines, with the names it defines (quantities, checks).
struct Template {
  std::string name;
  std::vector<std::string> lines;
  std::set<std::string> names;
};

bool isMetaLine(const std::string& line) {
  const size_t colon = line.find(':');
  if (colon == std::string::npos) return false;
  const auto& keys = Metadata::keys();
  return std::find(keys.begin(), keys.end(), line.substr(0, colon)) != keys.end();
}

bool isProse(const std::string& line) {
  return line.empty() || line[0] == '#' || startsWith(line, "section ") || startsWith(line, "note ");
}

Template makeTemplate(const std::string& name, const std::string& text) {
  Template t;
  t.name = name;
  size_t b = 0;
  while (b < text.size()) {
    size_t e = text.find('\n', b);
    if (e == std::string::npos) e = text.size();
    std::string line = text.substr(b, e - b);
    if (!line.empty() && line.back() == '\r') line.pop_back();
    // The title block is given once per sheet; a copy has no load cases or
    // studies (their lines name the copy's quantities but add none).
    if (!isMetaLine(line) && !startsWith(line, "case ") && !startsWith(line, "study ")) t.lines.push_back(line);
    b = e + 1;
  }
  for (const std::string& line : t.lines) {
    if (isProse(line) || !isNameStart(line[0])) continue;
    const size_t p = startsWith(line, "check ") ? 6 : 0;
    size_t q = p;
    while (q < line.size() && isNameChar(line[q])) ++q;
    t.names.insert(line.substr(p, q - p));
  }
  return t;
}

// A copy of one worksheet line with every name the worksheet defines
// suffixed: in the formula part only, never in the description, inside
// [unit] brackets, in a function name or in the unit right after a number.
std::string renamed(const std::string& line, const Template& t, const std::string& suffix) {
  if (isProse(line)) return line;
  std::string out;
  size_t i = 0;
  int brackets = 0;
  bool after_number = false;
  while (i < line.size()) {
    const char c = line[i];
    if (c == '#') {
      out += line.substr(i);
      break;
    }
    if (c == '[') ++brackets;
    if (c == ']') --brackets;
    if ((c >= '0' && c <= '9') || c == '.') {  // a number, exponent included
      while (i < line.size() && (isNameChar(line[i]) || line[i] == '.' ||
                                 ((line[i] == '-' || line[i] == '+') && (line[i - 1] == 'e' || line[i - 1] == 'E'))))
        out += line[i++];
      after_number = true;
      continue;
    }
    if (isNameStart(c)) {
      size_t j = i;
      while (j < line.size() && isNameChar(line[j])) ++j;
      const std::string word = line.substr(i, j - i);
      out += word;
      size_t k = j;
      while (k < line.size() && line[k] == ' ') ++k;
      const bool call = k < line.size() && line[k] == '(';
      if (brackets == 0 && !after_number && !call && t.names.count(word)) out += suffix;
      after_number = false;
      i = j;
      continue;
    }
    if (c != ' ' && c != '\t') after_number = false;
    out += c;
    ++i;
  }
  return out;
}

// The demo worksheets as the benchmark was written, for when the source
// tree's worksheets/ cannot be read.
const char* const kSnapshots[][2] = {{"canal-gate-hoist.calc (snapshot)", kGateTemplate},
                                     {"leveling-jack.calc (snapshot)", kJackTemplate}};

std::string g_worksheets_dir;  // --worksheets DIR; default: the worksheets/ findWorksheets finds
std::vector<std::string> g_skipped;  // demos the mix cannot copy: they use templates

// Whether the mix can copy a worksheet as text: not when it has instances of
// templates (`use`, or is one, `param`), whose paths and dotted names a
// renamed copy would have to follow.
bool copyable(const std::string& text) {
  for (size_t b = 0; b < text.size();) {
    const size_t e = std::min(text.find('\n', b), text.size());
    const std::string line = text.substr(b, e - b);
    if (startsWith(line, "use ") || startsWith(line, "param ")) return false;
    b = e + 1;
  }
  return true;
}

std::vector<Template> loadTemplates() {
  std::string dir = g_worksheets_dir;
  if (dir.empty()) dir = findWorksheets("twin-screw-lift.calc");
  if (dir.empty()) {
    std::fprintf(stderr, "%s; the mix copies its snapshots of two early demos instead\n",
                 worksheetsNotFound("calculation_perftest", "twin-screw-lift.calc").c_str());
  }
  std::vector<std::string> files;
  if (DIR* d = opendir(dir.c_str())) {
    while (const dirent* e = readdir(d)) {
      const std::string n = e->d_name;
      if (n.size() > 5 && n.compare(n.size() - 5, 5, ".calc") == 0) files.push_back(n);
    }
    closedir(d);
  }
  std::sort(files.begin(), files.end());
  std::vector<Template> out;
  for (const std::string& f : files) {
    std::string bytes, error;
    if (!readFile(dir + "/" + f, &bytes, &error)) continue;
    if (copyable(bytes)) out.push_back(makeTemplate(f, bytes));
    else g_skipped.push_back(f);
  }
  if (out.empty()) {
    if (!dir.empty())
      std::fprintf(stderr, "calculation_perftest: no .calc file in %s could be read and copied; the mix copies "
                   "its snapshots of two early demos instead\n", dir.c_str());
    for (const auto& snap : kSnapshots) out.push_back(makeTemplate(snap[0], snap[1]));
  }
  return out;
}

const std::vector<Template>& templates() {
  static const std::vector<Template> t = loadTemplates();
  return t;
}

// (c) A realistic mix: copies of the demo worksheets in turn, each copy's
// quantities and checks renamed with a suffix _k, so 100k lines look like
// many screw calculations.
std::string mixSheet(int lines) {
  std::string s = "title: Benchmark: many screw calculations\nproject: calctrail benchmark\n\n";
  int have = 3;
  const std::vector<Template>& all = templates();
  for (int k = 0;; ++k) {
    const Template& t = all[static_cast<size_t>(k) % all.size()];
    if (have + static_cast<int>(t.lines.size()) + 1 > lines) break;
    const std::string suffix = "_" + std::to_string(k);
    for (const std::string& line : t.lines) s += renamed(line, t, suffix) + "\n";
    s += "\n";
    have += static_cast<int>(t.lines.size()) + 1;
  }
  return padToLines(s, lines);
}

std::string makeSheet(const std::string& shape, int lines) {
  if (shape == "chain") return chainSheet(lines);
  if (shape == "fanin") return fanInSheet(lines);
  return mixSheet(lines);
}

// ---------------------------------------------------------------------------
// Timing.

// Milliseconds on std::chrono::steady_clock, or with --cpu the CPU time of
// the process (user and system): on a busy machine wall time counts the
// waits for a core, CPU time does not.
bool g_cpu_time = false;

double wallNow() {
  return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

double cpuNow() {
  timespec ts{};
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &ts);
  return static_cast<double>(ts.tv_sec) * 1e3 + static_cast<double>(ts.tv_nsec) * 1e-6;
}

double now() { return g_cpu_time ? cpuNow() : wallNow(); }

double peakRssMb() {
  rusage ru{};
  getrusage(RUSAGE_SELF, &ru);
  return static_cast<double>(ru.ru_maxrss) / 1024.0;  // Linux: kilobytes
}

double currentRssMb() {
  FILE* f = std::fopen("/proc/self/statm", "r");
  if (!f) return 0;
  long pages = 0, resident = 0;
  const int got = std::fscanf(f, "%ld %ld", &pages, &resident);
  std::fclose(f);
  return got == 2 ? static_cast<double>(resident) * static_cast<double>(sysconf(_SC_PAGESIZE)) / (1024.0 * 1024.0)
                  : 0;
}

// The 1-minute load average, to judge wall times on a shared machine.
double loadAverage() {
  double load = -1;
  if (FILE* f = std::fopen("/proc/loadavg", "r")) {
    if (std::fscanf(f, "%lf", &load) != 1) load = -1;
    std::fclose(f);
  }
  return load;
}

// What a child sends back to the parent: plain numbers through a pipe.
struct CaseResult {
  int lines = 0;
  int quantities = 0;
  int checks = 0;
  int checks_passed = 0;
  int errors = 0;          // diagnostics of severity error (must be 0)
  int mismatches = 0;      // staged values that differ from Calculation's (must be 0)
  int reps = 0;
  double text_mb = 0, trail_mb = 0;
  double faults_k = 0;     // minor page faults of the end-to-end run, thousands
  double parse = 1e300, resolve = 1e300, check = 1e300, compile = 1e300, evaluate = 1e300;
  double trail = 1e300, calc = 1e300, e2e = 1e300, e2e_cpu = 1e300;
  double rss_peak_mb = 0;
  char first_error[400] = {0};
};

const Unit* writtenUnit(const Expr& e) {
  const Expr* x = withoutParensOrSigns(&e);
  return x->kind == ExprKind::Number ? x->unit.get() : nullptr;
}

bool hasCall(const Expr& e) {
  if (e.kind == ExprKind::Call) return true;
  for (const auto& a : e.args)
    if (hasCall(*a)) return true;
  return false;
}

// The stages of Calculation::run (engine/calculation.cc), reproduced with the
// public pieces so that each can be timed on its own. Overrides are left out
// (the benchmark sets none). Returns the values, for comparison.
std::vector<double> stagedRun(const std::string& text, CaseResult* r) {
  double t = now();
  auto file = std::make_shared<SourceFile>("bench.calc", text);
  Diagnostics diags;
  Sheet sheet = parseSheet(file, &diags);
  r->parse = now() - t;
  const int n = static_cast<int>(sheet.quantities.size());

  // Name resolution and the dependency graph, then the evaluation order.
  t = now();
  DependencyGraph graph(n);
  std::vector<char> input(n, 0);
  int unknown = 0;
  for (int i = 0; i < n; ++i) {
    bool any_name = false;
    forEachName(*sheet.quantities[i].expr, [&](const Expr& e) {
      any_name = true;
      const int j = sheet.find(e.text);
      if (j < 0) ++unknown;
      else graph.addUse(i, j);
    });
    input[i] = !any_name && !hasCall(*sheet.quantities[i].expr);
  }
  graph.finish();
  for (const Check& c : sheet.checks)
    for (const Expr* side : {c.lhs.get(), c.rhs.get()})
      forEachName(*side, [&](const Expr& e) { unknown += sheet.find(e.text) < 0; });
  std::vector<std::vector<int>> cycles;
  const std::vector<int> order = graph.order(&cycles);
  r->resolve = now() - t;

  // Dimension check of every formula in order, display units, then the checks.
  t = now();
  std::vector<Dimension> dims(n);
  std::vector<char> known(n, 0), broken(n, 0);
  std::vector<Unit> display(n);
  std::vector<TreeDims> tree_dims(n);
  for (int i = 0; i < n; ++i)
    forEachName(*sheet.quantities[i].expr, [&](const Expr& e) { broken[i] |= sheet.find(e.text) < 0; });
  for (int i : order) {
    const Quantity& q = sheet.quantities[i];
    if (broken[i]) continue;
    DimensionChecker checker(*sheet.file, &diags, sheet, dims, known);
    if (!checker.check(*q.expr, &tree_dims[i])) continue;
    Dimension d = tree_dims[i].of(*q.expr);
    if (workOrPower(d)) d = d.withoutAngle();
    dims[i] = d;
    known[i] = 1;
    if (q.display) {
      display[i] = *q.display;
      if (fitUnit(d, q.display->dim) == UnitFit::Incompatible) known[i] = 0;
    } else {
      const Unit* w = writtenUnit(*q.expr);
      display[i] = w ? *w : preferredUnit(d);
      (void)strayAngleWarning(q.name, d);
    }
  }
  std::vector<TreeDims> check_dims(2 * sheet.checks.size());
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    DimensionChecker checker(*sheet.file, &diags, sheet, dims, known);
    if (!checker.check(*c.lhs, &check_dims[2 * k]) || !checker.check(*c.rhs, &check_dims[2 * k + 1])) continue;
    bool incompatible;
    (void)compareForSum(check_dims[2 * k].of(*c.lhs), check_dims[2 * k + 1].of(*c.rhs), &incompatible);
  }
  r->check = now() - t;

  // Compile every formula and both sides of every check to muparser text.
  t = now();
  std::vector<Program> programs(n);
  for (int i : order)
    if (known[i]) programs[i] = compileProgram(*sheet.quantities[i].expr, tree_dims[i].view(), sheet);
  std::vector<Program> check_programs;
  check_programs.reserve(2 * sheet.checks.size());
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    check_programs.push_back(compileProgram(*c.lhs, check_dims[2 * k].view(), sheet));
    check_programs.push_back(compileProgram(*c.rhs, check_dims[2 * k + 1].view(), sheet));
  }
  r->compile = now() - t;

  // Evaluate in order with one muparser instance, then the checks.
  t = now();
  std::vector<double> values(n, NAN);
  std::vector<char> ok(n, 0);
  {
    Evaluator evaluator;
    for (int i : order) {
      if (!known[i]) continue;
      bool inputs_ok = true;
      for (int j : graph.uses(i)) inputs_ok &= ok[j] != 0;
      if (!inputs_ok) continue;
      double v = NAN;
      try {
        v = evaluator.run(programs[i], values);
      } catch (const std::exception&) {
        v = NAN;
      }
      if (!std::isfinite(v)) continue;
      values[i] = v;
      ok[i] = 1;
    }
  }
  {
    Evaluator evaluator;
    volatile double sink = 0;
    for (const Program& p : check_programs) sink = sink + evaluator.run(p, values);
  }
  r->evaluate = now() - t;
  (void)unknown;
  return values;
}

long minorFaults() {
  rusage ru{};
  getrusage(RUSAGE_SELF, &ru);
  return ru.ru_minflt;
}

// One run of a case, in a fresh child process: first the real pipeline end to
// end, as one `calctrail report` does it (calculate, build the trail, render
// it as text), with a cold heap, so that its time and peak RSS (worksheet
// text included) are those of one command; then the staged run of the same
// text, whose values must equal the first run's.
void runCase(const std::string& shape, int lines, bool staged, CaseResult* r) {
  const std::string text = makeSheet(shape, lines);
  r->lines = lines;
  r->text_mb = static_cast<double>(text.size()) / (1024.0 * 1024.0);
  std::vector<double> reference;
  {
    std::string bytes = text;  // fromText takes the bytes; copy outside the clock
    const long f0 = minorFaults();
    const double c0 = cpuNow();
    const double t0 = now();
    std::unique_ptr<Calculation> calc = Calculation::fromText("bench.calc", std::move(bytes));
    r->calc = now() - t0;
    const double t1 = now();
    Trail trail = buildTrail(*calc, 4);
    std::string out = renderText(trail);
    r->trail = now() - t1;
    r->e2e = now() - t0;
    r->e2e_cpu = cpuNow() - c0;
    r->faults_k = static_cast<double>(minorFaults() - f0) / 1000.0;
    r->rss_peak_mb = peakRssMb();
    r->trail_mb = static_cast<double>(out.size()) / (1024.0 * 1024.0);
    r->quantities = static_cast<int>(calc->quantityCount());
    r->checks = static_cast<int>(calc->checkCount());
    r->checks_passed = static_cast<int>(calc->checkCount()) - calc->failedChecks();
    r->errors = calc->diags.errorCount();
    for (const Diagnostic& d : calc->diags.list()) {
      if (d.severity != Severity::Error) continue;
      std::snprintf(r->first_error, sizeof r->first_error, "%s", d.headline().c_str());
      break;
    }
    for (size_t i = 0; i < calc->quantityCount(); ++i) reference.push_back(calc->ok(i) ? calc->si(i) : NAN);
  }
  if (!staged) return;
  const std::vector<double> values = stagedRun(text, r);
  for (size_t i = 0; i < values.size() && i < reference.size(); ++i) {
    const bool same = (std::isnan(values[i]) && std::isnan(reference[i])) || values[i] == reference[i];
    r->mismatches += !same;
  }
  if (values.size() != reference.size()) ++r->mismatches;
}

// The best (least) time of each column over the runs; the largest peak RSS.
void keepBest(const CaseResult& run, CaseResult* best) {
  if (best->reps == 0) {
    *best = run;
    best->reps = 1;
    return;
  }
  ++best->reps;
  double* const b[] = {&best->parse, &best->resolve, &best->check, &best->compile, &best->evaluate,
                       &best->trail, &best->calc, &best->e2e, &best->e2e_cpu};
  const double r[] = {run.parse, run.resolve, run.check, run.compile, run.evaluate,
                      run.trail, run.calc, run.e2e, run.e2e_cpu};
  for (size_t i = 0; i < sizeof r / sizeof r[0]; ++i) *b[i] = std::min(*b[i], r[i]);
  best->rss_peak_mb = std::max(best->rss_peak_mb, run.rss_peak_mb);
  best->faults_k = std::max(best->faults_k, run.faults_k);
  best->errors = std::max(best->errors, run.errors);
  best->mismatches = std::max(best->mismatches, run.mismatches);
}

bool forkCase(const std::string& shape, int lines, bool staged, CaseResult* out) {
  return runInChild([&](CaseResult* r) { runCase(shape, lines, staged, r); }, out);
}

// ---------------------------------------------------------------------------
// The design note: one muparser instance whose expression is set per formula
// (what Evaluator does) against one mu::Parser object per formula, kept for
// re-evaluation. Both on the real programs of a 10k-line chain.

// Heap bytes in use (glibc), else the resident set: what a kept parser costs.
double heapInUseKb() {
#ifdef __GLIBC__
  const struct mallinfo2 mi = mallinfo2();
  const size_t in_use = mi.uordblks + mi.hblkhd;
  if (in_use > 0) return static_cast<double>(in_use) / 1024.0;
  return currentRssMb() * 1024.0;  // another allocator (a sanitizer's) stands in for malloc
#else
  return currentRssMb() * 1024.0;
#endif
}

double callLib(void* decl, const double* args, int) { return static_cast<const FunctionDecl*>(decl)->eval(args); }

struct ParserNote {
  int formulas = 0;
  double one_instance_us = 0;    // per formula: ClearVar, DefineVar, SetExpr, Eval
  double per_formula_us = 0;     // per formula: new parser with the library, DefineVar, SetExpr, Eval
  double per_formula_kb = 0;     // resident memory per parser kept
  double bare_us = 0, bare_kb = 0;  // the same without the library functions defined
  double tree_us = 0;            // per formula: evalTree over the expression tree
  double compile_us = 0;         // per formula: compileProgram (the muparser text)
  double fault_us = 0, fault_cpu_us = 0;  // first touch of one fresh 4 KB page: wall, CPU
};

// The cost of touching fresh memory, which a cold run pays for every page it
// uses: cheap on bare metal, dear on some virtual machines.
void pageFaultUs(double* wall_us, double* cpu_us) {
  const size_t bytes = size_t{64} << 20;
  const double pages = static_cast<double>(bytes / 4096);
  void* p = mmap(nullptr, bytes, PROT_READ | PROT_WRITE, MAP_PRIVATE | MAP_ANONYMOUS, -1, 0);
  if (p == MAP_FAILED) return;
  const double w = wallNow();
  const double c = cpuNow();
  for (size_t i = 0; i < bytes; i += 4096) static_cast<volatile char*>(p)[i] = 1;
  *cpu_us = (cpuNow() - c) * 1000.0 / pages;
  *wall_us = (wallNow() - w) * 1000.0 / pages;
  munmap(p, bytes);
}

void runParserNote(ParserNote* note) {
  pageFaultUs(&note->fault_us, &note->fault_cpu_us);
  const std::string text = chainSheet(10000);
  Diagnostics diags;
  Sheet sheet = parseSheet(std::make_shared<SourceFile>("note.calc", text), &diags);
  const int n = static_cast<int>(sheet.quantities.size());
  std::vector<Dimension> dims(n);
  std::vector<char> known(n, 1);
  std::vector<Program> programs(n);
  std::vector<TreeDims> tree_dims(n);
  for (int i = 0; i < n; ++i) {  // a chain: document order is dependency order
    DimensionChecker checker(*sheet.file, &diags, sheet, dims, known);
    checker.check(*sheet.quantities[i].expr, &tree_dims[i]);
    dims[i] = tree_dims[i].of(*sheet.quantities[i].expr);
  }
  {
    const double t = now();
    for (int i = 0; i < n; ++i)
      programs[i] = compileProgram(*sheet.quantities[i].expr, tree_dims[i].view(), sheet);
    note->compile_us = (now() - t) * 1000.0 / n;
  }
  std::vector<double> values(n, 1.0);
  note->formulas = n;
  {
    const double t = now();
    EvalFault fault;
    const NameValue value_of = [&](const Expr& e) { return values[sheet.find(e.text)]; };
    for (int i = 0; i < n; ++i)
      values[i] = evalTree(*sheet.quantities[i].expr, tree_dims[i].view(), value_of, &fault);
    note->tree_us = (now() - t) * 1000.0 / n;
  }
  {
    Evaluator evaluator;
    double t = now();
    for (int i = 0; i < n; ++i) values[i] = evaluator.run(programs[i], values);
    note->one_instance_us = (now() - t) * 1000.0 / n;
  }
  for (int with_library = 1; with_library >= 0; --with_library) {
    std::vector<std::unique_ptr<mu::Parser>> parsers;
    parsers.reserve(n);
    std::vector<double> slots(4 * static_cast<size_t>(n), 0.0);
    const double heap0 = heapInUseKb();
    double t = now();
    for (int i = 0; i < n; ++i) {
      auto p = std::make_unique<mu::Parser>();
      if (with_library)
        for (const FunctionDecl& f : functionLibrary())
          p->DefineFunUserData(std::string(f.name), callLib, const_cast<FunctionDecl*>(&f), false);
      for (size_t k = 0; k < programs[i].inputs.size() && k < 4; ++k) {
        slots[4 * static_cast<size_t>(i) + k] = values[programs[i].inputs[k]];
        p->DefineVar("v" + std::to_string(k), &slots[4 * static_cast<size_t>(i) + k]);
      }
      p->SetExpr(programs[i].text);
      values[i] = p->Eval();
      parsers.push_back(std::move(p));
    }
    const double us = (now() - t) * 1000.0 / n;
    const double kb = (heapInUseKb() - heap0) / n;
    if (with_library) note->per_formula_us = us, note->per_formula_kb = kb;
    else note->bare_us = us, note->bare_kb = kb;
  }
}

bool forkNote(ParserNote* out) {
  return runInChild([](ParserNote* note) { runParserNote(note); }, out);
}

// ---------------------------------------------------------------------------
// Worksheets with errors, in the shapes an audit found super-linear. Each is
// timed end to end through Calculation::fromText (what `calctrail check` runs,
// without printing), and its hot stage alone through the public call:
//
//   suggestions  N quantities whose names share a 40-character stem, then N
//                formulas that use unknown names one edit from them: 2N lines;
//                the stage is nearestWords for 50 unknown names (as the
//                calculation asks) over the N names.
//   one-cycle    N quantities on one loop, x_i = x_(i+1) + 1 mm, x_(N-1) uses
//                x_0; the stage is DependencyGraph::order on that graph.
//   two-cycles   N/2 pairs a_k = b_k + 1 mm, b_k = a_k * 2; the stage as above.
//
// The cycles run at 100k and 650k lines (16.0 and 14.8 MB): 1M lines of them
// would be 25 and 23 MB, over the 16 MiB a worksheet may have (docs/limits.md),
// which SourceFile refuses. A size whose text is over the limit is reported
// as such and not run.

const char* const kStem = "quantity_with_a_very_long_shared_prefix_";

std::string stemName(char first, int i) {
  char buf[80];
  std::snprintf(buf, sizeof buf, "%s%c%05d", kStem, first, i % 100000);
  return buf;
}

std::string errorSheet(const std::string& shape, int n) {
  std::string s;
  if (shape == "suggestions") {
    for (int i = 0; i < n; ++i) s += stemName(static_cast<char>('0' + i / 100000 % 10), i) + " = 1 mm\n";
    for (int i = 0; i < n; ++i) s += "y_" + std::to_string(i) + " = " + stemName('x', i) + " + 1 mm\n";
  } else if (shape == "one-cycle") {
    for (int i = 0; i < n; ++i)
      s += "x" + std::to_string(i) + " = x" + std::to_string((i + 1) % n) + " + 1 mm\n";
  } else {
    for (int k = 0; k < n / 2; ++k) {
      const std::string a = "a" + std::to_string(k), b = "b" + std::to_string(k);
      s += a + " = " + b + " + 1 mm\n" + b + " = " + a + " * 2\n";
    }
  }
  return s;
}

int errorSheetLines(const std::string& shape, int n) { return shape == "suggestions" ? 2 * n : n / 2 * 2; }

// What a child sends back for one error case.
struct ErrorCaseResult {
  int lines = 0;
  int errors = 0;          // diagnostics of severity error
  int expected = 0;        // errors the shape must give: every unknown name, or every cycle
  int right = 0;           // of those, the ones that say what they must (the right suggestion, every member)
  double calc = 1e300, calc_cpu = 1e300;  // Calculation::fromText, ms (wall or --cpu) and CPU ms
  double stage = 1e300, stage_cpu = 1e300;  // the hot stage alone, ms and CPU ms
  double rss_peak_mb = 0;
  double mb = 0;            // the worksheet's size
  bool over_limit = false;  // the worksheet is over kMaxSourceBytes: nothing was run
};

// The number of " -> " in a cycle message: the members it names.
size_t arrows(const std::string& msg) {
  size_t count = 0;
  for (size_t at = msg.find(" -> "); at != std::string::npos; at = msg.find(" -> ", at + 4)) ++count;
  return count;
}

void runErrorCase(const std::string& shape, int n, ErrorCaseResult* r) {
  const std::string text = errorSheet(shape, n);
  r->lines = errorSheetLines(shape, n);
  r->mb = static_cast<double>(text.size()) / 1e6;
  if (text.size() > kMaxSourceBytes) {
    r->over_limit = true;
    return;
  }
  {
    std::string bytes = text;
    const double t0 = now(), c0 = cpuNow();
    std::unique_ptr<Calculation> calc = Calculation::fromText("bench.calc", std::move(bytes));
    r->calc = now() - t0;
    r->calc_cpu = cpuNow() - c0;
    r->errors = calc->diags.errorCount();
    r->expected = shape == "suggestions" ? n : shape == "one-cycle" ? 1 : n / 2;
    int suggested = 0;
    for (const Diagnostic& d : calc->diags.list()) {
      if (d.severity != Severity::Error) continue;
      if (shape == "suggestions") {
        // The first 50 distinct names get suggestions, the nearest first; the
        // rest none (the calculation's cap).
        const size_t from = d.message.find(std::string("`") + kStem + "x");
        if (from == std::string::npos) continue;
        const std::string digits = d.message.substr(from + 1 + std::strlen(kStem) + 1, 5);
        const std::string want = std::string("did you mean `") + kStem + "0" + digits + "`";
        if (d.message.find("did you mean") == std::string::npos) {
          r->right += suggested == 50;
        } else {
          ++suggested;
          r->right += d.message.find(want) != std::string::npos;
        }
      } else {
        const size_t members = shape == "one-cycle" ? static_cast<size_t>(n) : 2;
        r->right += arrows(d.message) == members;
      }
    }
  }
  if (shape == "suggestions") {
    std::vector<std::string> names;
    for (int i = 0; i < n; ++i) names.push_back(stemName(static_cast<char>('0' + i / 100000 % 10), i));
    const double s0 = now(), sc0 = cpuNow();  // the names are built outside the clock
    size_t found = 0;
    for (int i = 0; i < 50; ++i) found += nearestWords(stemName('x', i * (n / 50)), names).size();
    r->stage = now() - s0;
    r->stage_cpu = cpuNow() - sc0;
    if (found == 0) r->right = -1;
  } else {
    DependencyGraph graph(n);
    if (shape == "one-cycle") {
      for (int i = 0; i < n; ++i) graph.addUse(i, (i + 1) % n);
    } else {
      for (int k = 0; k + 1 < n; k += 2) graph.addUse(k, k + 1), graph.addUse(k + 1, k);
    }
    graph.finish();
    std::vector<std::vector<int>> cycles;
    const double s0 = now(), sc0 = cpuNow();
    graph.order(&cycles);
    r->stage = now() - s0;
    r->stage_cpu = cpuNow() - sc0;
    if (cycles.size() != static_cast<size_t>(r->expected)) r->right = -1;
  }
  r->rss_peak_mb = peakRssMb();
}

// Runs every error case at its sizes, in turn, best of `runs`; prints the
// table and the ratios. Returns 1 when a ratio in CPU time is above 1.5 times
// the ratio of the sizes (15 for 10x), 2 when a case failed or gave a wrong answer.
int runErrorCases(const std::vector<std::string>& cases, int runs) {
  std::printf("\nworksheets with errors, the shapes an audit found super-linear (Calculation::fromText\n"
              "as `calctrail check` runs it; stage = the hot call alone); best of %d runs,\n"
              "each in a fresh child; the cycles at 100k and 650k lines, since 1M lines of them\n"
              "are over the %zu MiB limit for a worksheet (docs/limits.md)\n\n", runs, kMaxSourceBytes >> 20);
  std::printf("%-11s %8s %8s %9s %9s %8s %9s %9s %8s %7s  %s\n", "case", "N", "lines", "calc", "calc cpu",
              "us/line", "stage", "stage cpu", "us/line", "RSS MB", "errors");
  int status = 0;
  for (const std::string& shape : cases) {
    const std::vector<int> sizes =
        shape == "suggestions" ? std::vector<int>{10000, 100000} : std::vector<int>{100000, 650000};
    std::vector<ErrorCaseResult> best(sizes.size());
    std::vector<char> failed(sizes.size(), 0);
    for (int run = 0; run < runs; ++run) {
      for (size_t k = 0; k < sizes.size(); ++k) {
        if (failed[k]) continue;
        ErrorCaseResult one;
        failed[k] = !runInChild([&](ErrorCaseResult* r) { runErrorCase(shape, sizes[k], r); }, &one);
        if (failed[k] || one.over_limit) {
          best[k] = one;
          failed[k] = failed[k] || one.over_limit;
          continue;
        }
        ErrorCaseResult& b = best[k];
        const ErrorCaseResult keep = b;
        b = one;
        if (run > 0) {
          b.calc = std::min(keep.calc, one.calc), b.calc_cpu = std::min(keep.calc_cpu, one.calc_cpu);
          b.stage = std::min(keep.stage, one.stage), b.stage_cpu = std::min(keep.stage_cpu, one.stage_cpu);
          b.rss_peak_mb = std::max(keep.rss_peak_mb, one.rss_peak_mb);
        }
      }
    }
    for (size_t k = 0; k < sizes.size(); ++k) {
      const ErrorCaseResult& r = best[k];
      if (r.over_limit) {
        std::printf("%-11s %8d %8d  (%.1f MB, over the %zu MiB limit for a worksheet, docs/limits.md: not run)\n",
                    shape.c_str(), sizes[k], r.lines, r.mb, kMaxSourceBytes >> 20);
        status = 2;
        continue;
      }
      if (failed[k]) {
        std::printf("%-11s %8d  (the child process failed)\n", shape.c_str(), sizes[k]);
        status = 2;
        continue;
      }
      const bool right = r.errors == r.expected && r.right == r.expected;
      std::printf("%-11s %8d %8d %9.1f %9.1f %8.2f %9.1f %9.1f %8.3f %7.1f  %d of %d right%s\n",
                  shape.c_str(), sizes[k], r.lines, r.calc, r.calc_cpu, r.calc * 1000.0 / r.lines, r.stage,
                  r.stage_cpu, r.stage * 1000.0 / r.lines, r.rss_peak_mb, r.right, r.expected,
                  right ? "" : "  ** WRONG **");
      if (!right) status = 2;
    }
    if (!failed[0] && !failed[1]) {
      const ErrorCaseResult& a = best[0];
      const ErrorCaseResult& b = best[1];
      const double calc = b.calc_cpu / a.calc_cpu, stage = b.stage_cpu / a.stage_cpu;
      // n log n (the diagnostics' sort, the order's heap) and a heap that no
      // longer fits the caches give 1.1 to 1.4 times the ratio of the sizes
      // (11 to 14 for 10x); a quadratic path 10 times it.
      const double times = static_cast<double>(sizes[1]) / sizes[0];
      const double n_log_n =
          times * std::log(static_cast<double>(sizes[1])) / std::log(static_cast<double>(sizes[0]));
      const double limit = 1.5 * times;
      const bool flagged = calc > limit || stage > limit;
      std::printf("%-11s %.1fx N: calc %.2fx (cpu), stage %.2fx (cpu); n log n would be %.2fx%s\n", "", times, calc,
                  stage, n_log_n, flagged ? "  ** NOT LINEAR: above 1.5x the sizes' ratio **" : "");
      if (flagged && status == 0) status = 1;
    }
  }
  return status;
}

std::vector<std::string> splitList(const std::string& s) {
  std::vector<std::string> out;
  size_t b = 0;
  while (b <= s.size()) {
    size_t e = s.find(',', b);
    if (e == std::string::npos) e = s.size();
    if (e > b) out.push_back(s.substr(b, e - b));
    b = e + 1;
  }
  return out;
}

int usage() {
  std::fprintf(stderr,
               "usage: calculation_perftest [--shapes chain,fanin,mix|none] [--sizes 1000,10000,100000]\n"
               "                            [--cases suggestions,one-cycle,two-cycles|none] [--runs 5]\n"
               "                            [--cpu] [--worksheets DIR] [--no-note]\n"
               "       calculation_perftest --dump chain|fanin|mix LINES\n");
  return 2;
}

}  // namespace

int main(int argc, char** argv) {
  std::vector<std::string> shapes = {"chain", "fanin", "mix"};
  std::vector<std::string> cases = {"suggestions", "one-cycle", "two-cycles"};
  std::vector<int> sizes = {1000, 10000, 100000};
  bool note = true;
  int runs = 5;
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    if (a == "--dump" && i + 2 < argc) {
      const std::string shape = argv[i + 1];
      if (shape != "chain" && shape != "fanin" && shape != "mix") return usage();
      std::fputs(makeSheet(shape, std::atoi(argv[i + 2])).c_str(), stdout);
      return 0;
    } else if (a == "--shapes" && i + 1 < argc) {
      shapes = splitList(argv[++i]);
      if (shapes == std::vector<std::string>{"none"}) shapes.clear();
      for (const std::string& s : shapes)
        if (s != "chain" && s != "fanin" && s != "mix") return usage();
    } else if (a == "--cases" && i + 1 < argc) {
      cases = splitList(argv[++i]);
      if (cases == std::vector<std::string>{"none"}) cases.clear();
      for (const std::string& s : cases)
        if (s != "suggestions" && s != "one-cycle" && s != "two-cycles") return usage();
    } else if (a == "--sizes" && i + 1 < argc) {
      sizes.clear();
      for (const std::string& s : splitList(argv[++i])) sizes.push_back(std::max(10, std::atoi(s.c_str())));
    } else if (a == "--runs" && i + 1 < argc) {
      runs = std::max(1, std::atoi(argv[++i]));
    } else if (a == "--worksheets" && i + 1 < argc) {
      g_worksheets_dir = argv[++i];
    } else if (a == "--cpu") {
      g_cpu_time = true;
    } else if (a == "--no-note") {
      note = false;
    } else {
      return usage();
    }
  }

  std::printf("calctrail benchmark: times in ms of %s; each run in a fresh child process,\n"
              "the sizes of a shape in turn; e2e best of %d runs, the stages best of %d; peak RSS of the child\n"
              "(its baseline at fork is about %.1f MB); %ld cores, load average %.2f\n\n",
              g_cpu_time ? "process CPU time (--cpu)" : "wall time (steady_clock)", runs, std::min(runs, 2),
              currentRssMb(), sysconf(_SC_NPROCESSORS_ONLN), loadAverage());
  if (std::find(shapes.begin(), shapes.end(), "mix") != shapes.end()) {
    std::printf("mix: copies, in turn, of");
    for (const Template& t : templates()) std::printf(" %s (%zu lines)", t.name.c_str(), t.lines.size());
    if (!g_skipped.empty()) {
      std::printf("\n  not copied (instances of templates, which a renamed copy cannot follow):");
      for (const std::string& f : g_skipped) std::printf(" %s", f.c_str());
    }
    std::printf("\n\n");
  }
  if (!shapes.empty())
    std::printf("%-6s %7s %7s %7s %8s %8s %8s %8s %8s %8s %8s %8s %8s %7s %7s\n", "shape", "lines",
                "quant", "parse", "res+ord", "check", "compile", "evaluate", "trail", "calc", "e2e",
                "e2e cpu", "us/line", "faults", "RSS MB");
  int status = 0;
  struct Row { std::string shape; int lines; double e2e, e2e_cpu; };
  std::vector<Row> rows;
  std::vector<std::string> notes;
  for (const std::string& shape : shapes) {
    // The runs of the sizes interleave, so that a burst of load on a shared
    // machine falls on every size alike instead of skewing their ratio.
    std::vector<CaseResult> best(sizes.size());
    std::vector<char> failed(sizes.size(), 0);
    for (int run = 0; run < runs; ++run) {
      for (size_t k = 0; k < sizes.size(); ++k) {
        CaseResult one;
        if (failed[k]) continue;
        failed[k] = !forkCase(shape, sizes[k], run < 2, &one);
        if (!failed[k]) keepBest(one, &best[k]);
      }
    }
    for (size_t k = 0; k < sizes.size(); ++k) {
      const int lines = sizes[k];
      const CaseResult& r = best[k];
      if (failed[k]) {
        std::printf("%-6s %7d  (the child process failed)\n", shape.c_str(), lines);
        status = 2;
        continue;
      }
      std::printf("%-6s %7d %7d %7.1f %8.1f %8.1f %8.1f %8.1f %8.1f %8.1f %8.1f %8.1f %8.2f %6.1fk %7.1f\n",
                  shape.c_str(), r.lines, r.quantities, r.parse, r.resolve, r.check, r.compile, r.evaluate, r.trail,
                  r.calc, r.e2e, r.e2e_cpu, r.e2e * 1000.0 / r.lines, r.faults_k, r.rss_peak_mb);
      char buf[600];
      if (r.errors || r.mismatches) {
        std::snprintf(buf, sizeof buf, "%s %d: %d errors, %d staged values differ from Calculation's%s%s",
                      shape.c_str(), lines, r.errors, r.mismatches, r.first_error[0] ? "; first: " : "",
                      r.first_error);
        notes.push_back(std::string("** ") + buf);
        status = 2;
      } else {
        std::snprintf(buf, sizeof buf, "%s %d: %d checks, %d fail; worksheet %.1f MB, text trail %.1f MB",
                      shape.c_str(), lines, r.checks, r.checks - r.checks_passed, r.text_mb, r.trail_mb);
        notes.push_back(buf);
      }
      rows.push_back({shape, lines, r.e2e, r.e2e_cpu});
    }
  }
  if (!shapes.empty())
    std::printf(
        "\ncolumns: quant = quantities; res+ord = name resolution, dependency graph and order;\n"
        "calc = Calculation::fromText (SHA-256, parse, every stage); trail = buildTrail + renderText;\n"
        "e2e = calc + trail, on a cold heap, as one `calctrail report` run; e2e cpu = its process CPU time;\n"
        "faults = its minor page faults (first touches of fresh memory); RSS MB = the child's peak RSS.\n"
        "parse to evaluate come from a staged run after it, of the same text in the same child (warm heap).\n"
        "\nworksheets (no errors allowed; in the mix, the checks the demos fail on purpose fail):\n");
  for (const std::string& n : notes) std::printf("  %s\n", n.c_str());

  bool header = false;
  for (const std::string& shape : shapes) {
    const Row* r10 = nullptr;
    const Row* r100 = nullptr;
    for (const Row& row : rows) {
      if (row.shape != shape) continue;
      if (row.lines == 10000) r10 = &row;
      if (row.lines == 100000) r100 = &row;
    }
    if (!r10 || !r100) continue;
    if (!header) {
      std::printf("\nlinearity: end-to-end time at 100k lines / at 10k lines, must be <= 12 (load average now %.2f)\n"
                  "  shape   %s    cpu\n", loadAverage(), g_cpu_time ? "  cpu" : " wall");
      header = true;
    }
    const double ratio = r100->e2e / r10->e2e;
    const double cpu_ratio = r100->e2e_cpu / r10->e2e_cpu;
    // CPU time decides: on a loaded machine wall time also counts the waits for a core.
    std::printf("  %-6s %6.2f %6.2f  %s\n", shape.c_str(), ratio, cpu_ratio,
                cpu_ratio > 12 ? "** NOT LINEAR: above 12 **"
                : ratio > 12   ? "ok in CPU time; wall time above 12 (a busy machine?)"
                               : "ok");
    if (cpu_ratio > 12 && status == 0) status = 1;
  }

  if (!cases.empty()) {
    const int error_status = runErrorCases(cases, std::min(runs, 3));
    if (error_status == 2 || (error_status == 1 && status == 0)) status = error_status;
  }

  if (note) {
    ParserNote pn;
    if (forkNote(&pn)) {
      std::printf("\nevaluation, per formula, on the %d formulas of a 10k-line chain (times of one pass):\n"
                  "  compileProgram (expression tree to muparser text):   %6.2f us\n"
                  "  one muparser instance, expression set per formula:   %6.2f us, no memory kept (Evaluator)\n"
                  "  one mu::Parser per formula, library functions defined: %6.2f us, %6.1f KB kept per formula\n"
                  "  one mu::Parser per formula, bare:                    %6.2f us, %6.1f KB kept per formula\n"
                  "  evalTree over the expression tree (for comparison):  %6.2f us\n"
                  "\nmachine: the first touch of a fresh 4 KB page costs %.2f us of wall time, %.2f us of CPU time\n"
                  "(%.1f ms of CPU per MB of fresh memory)\n",
                  pn.formulas, pn.compile_us, pn.one_instance_us, pn.per_formula_us, pn.per_formula_kb, pn.bare_us,
                  pn.bare_kb, pn.tree_us, pn.fault_us, pn.fault_cpu_us, pn.fault_cpu_us * 256 / 1000);
    } else {
      std::printf("\nmuparser note: the child process failed\n");
    }
  }
  return status;
}
