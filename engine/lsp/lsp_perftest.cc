// lsp_perftest: a benchmark program, not a test. The time from a didChange
// (one keystroke: a digit of a given value changed) to its published
// diagnostics, through the server's message API (JSON in, JSON out), on
// worksheets/twin-screw-lift.calc, on worksheets/platform-lift.calc (three
// instances of two templates, read at every edit) and on a generated
// 10k-line sheet; and a burst of edits read together, which costs one
// recalculation.
//
//   lsp_perftest [--rounds N] [--worksheets DIR]
//
// DIR defaults to the worksheets/ folder found from the current directory or
// from this program's, upwards (engine/util/find_worksheets.h).
//
// Exit status: 0; 2 when a sheet does not calculate cleanly.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <string>
#include <vector>

#include "engine/calculation.h"
#include "engine/lsp/json_rpc.h"
#include "engine/lsp/lsp_server.h"
#include "engine/sheet/source_file.h"
#include "engine/util/find_worksheets.h"

using namespace calctrail;
using nlohmann::json;

namespace {

double now() {
  return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

const std::string kUri = "file:///bench/sheet.calc";

void send(lsp::Server* s, const json& m) {
  s->receive(lsp::dump(m));
}

json didChange(const std::string& uri, int version, int line, int character, const std::string& old_text,
               const std::string& text) {
  const json range = {
      {"start", {{"line", line}, {"character", character}}},
      {"end", {{"line", line}, {"character", character + static_cast<int>(old_text.size())}}}};
  return {{"jsonrpc", "2.0"},
          {"method", "textDocument/didChange"},
          {"params",
           {{"textDocument", {{"uri", uri}, {"version", version}}},
            {"contentChanges", json::array({{{"range", range}, {"text", text}}})}}}};
}

// The diagnostics published in `out`, or -1 when none were.
long published(const std::vector<json>& out) {
  for (const json& m : out)
    if (m.value("method", "") == "textDocument/publishDiagnostics")
      return static_cast<long>(m["params"]["diagnostics"].size());
  return -1;
}

// A dotted instance name as a plain one: screw.T_raise is screw_T_raise.
std::string plainName(std::string name) {
  std::replace(name.begin(), name.end(), '.', '_');
  return name;
}

// The twin-screw formulas `blocks` times, each copy's names suffixed _k (as evaluate_perftest makes it).
std::string largeSheet(const Calculation& demo, int blocks, size_t* lines) {
  std::string out;
  *lines = 0;
  for (int b = 0; b < blocks; ++b) {
    const std::string suffix = "_" + std::to_string(b);
    for (const Quantity& q : demo.sheet.quantities) {
      // The expanded sheet's names are resolved already ("l" in `screw` reads screw.l).
      out += plainName(q.name) + suffix;
      if (!q.unit_written.empty()) out += " [" + q.unit_written + "]";
      out += " = " + renderExpr(*q.expr, [&](const Expr& n) { return plainName(n.text) + suffix; }) + "\n";
      ++*lines;
    }
  }
  return out;
}

struct Figures {
  double best_ms = 0, median_ms = 0, worst_ms = 0;
  double burst_ms = 0;  // ten edits read together, then published
  int burst_recalcs = 0;
  double calc_ms = 0;  // Calculation::fromText alone, best of three: the engine's share
};

// Times `rounds` edits of the text `value` at (line, character), alternating with `other`.
// `uri` names the sheet (its folder is where its templates are read from).
Figures measure(const std::string& text, int line, int character, const std::string& value,
                const std::string& other, int rounds, const std::string& uri = kUri) {
  lsp::Server server;
  send(&server,
       {{"jsonrpc", "2.0"}, {"id", 1}, {"method", "initialize"}, {"params", {{"capabilities", {}}}}});
  send(&server, {{"jsonrpc", "2.0"},
                 {"method", "textDocument/didOpen"},
                 {"params", {{"textDocument", {{"uri", uri}, {"version", 1}, {"text", text}}}}}});
  server.flush();
  if (published(server.takeOutgoing()) != 0) {
    std::fprintf(stderr, "lsp_perftest: the sheet has diagnostics\n");
    std::exit(2);
  }
  std::vector<double> ms;
  int version = 1;
  for (int r = 0; r < rounds; ++r) {
    const bool odd = r % 2 == 0;
    const double t = now();
    send(&server, didChange(uri, ++version, line, character, odd ? value : other, odd ? other : value));
    server.flush();
    const long n = published(server.takeOutgoing());
    ms.push_back((now() - t) * 1e3);
    if (n != 0) {
      std::fprintf(stderr, "lsp_perftest: an edit gave %ld diagnostics\n", n);
      std::exit(2);
    }
  }
  std::sort(ms.begin(), ms.end());
  Figures f;
  f.best_ms = ms.front();
  f.median_ms = ms[ms.size() / 2];
  f.worst_ms = ms.back();
  // Ten keystrokes arrive while the server is busy: all are read, then one recalculation.
  const int before = server.recalculations();
  const std::string current = rounds % 2 == 0 ? value : other;
  const double t = now();
  for (int k = 0; k < 10; ++k)
    send(&server,
         didChange(uri, ++version, line, character, k % 2 ? other : current, k % 2 ? current : other));
  server.flush();
  published(server.takeOutgoing());
  f.burst_ms = (now() - t) * 1e3;
  f.burst_recalcs = server.recalculations() - before;
  f.calc_ms = 1e300;
  for (int k = 0; k < 3; ++k) {
    const double t0 = now();
    auto c = Calculation::fromText(lsp::pathFromUri(uri), text);  // its templates beside it
    f.calc_ms = std::min(f.calc_ms, (now() - t0) * 1e3);
  }
  return f;
}

void print(const char* what, size_t lines, const Figures& f) {
  std::printf("%-22s %7zu %9.2f %9.2f %9.2f %10.2f %7d %9.2f\n", what, lines, f.best_ms, f.median_ms,
              f.worst_ms, f.burst_ms, f.burst_recalcs, f.calc_ms);
}

}  // namespace

int main(int argc, char** argv) {
  int rounds = 50;
  std::string dir;
  for (int i = 1; i + 1 < argc; i += 2) {
    if (!std::strcmp(argv[i], "--rounds")) rounds = std::max(2, std::atoi(argv[i + 1]));
    if (!std::strcmp(argv[i], "--worksheets")) dir = argv[i + 1];
  }
  if (dir.empty()) dir = findWorksheets("twin-screw-lift.calc");
  if (dir.empty()) {
    std::fprintf(stderr, "%s\n", worksheetsNotFound("lsp_perftest", "twin-screw-lift.calc").c_str());
    return 2;
  }
  std::string text, error;
  if (!readFile(dir + "/twin-screw-lift.calc", &text, &error)) {
    std::fprintf(stderr, "lsp_perftest: %s/twin-screw-lift.calc: %s\n", dir.c_str(), error.c_str());
    return 2;
  }
  const std::string demo_path = dir + "/twin-screw-lift.calc";  // its templates beside it
  auto demo = Calculation::fromText(demo_path, text);
  if (demo->hasErrors()) {
    std::fprintf(stderr, "lsp_perftest: twin-screw-lift.calc has errors\n");
    return 2;
  }
  // The edit: m_load = 4200 kg -> 4300 kg and back, a keystroke on a given value.
  const Quantity& m = demo->sheet.quantities[demo->sheet.find("m_load")];
  const int line = m.line - 1;
  const int character = static_cast<int>(m.expr->begin - demo->model->file().lineStart(m.line));
  std::printf("from a didChange to its publishDiagnostics, in process, %d edits (ms)\n", rounds);
  std::printf("%-22s %7s %9s %9s %9s %10s %7s %9s\n", "sheet", "lines", "best", "median", "worst", "10 edits",
              "recalcs", "fromText");
  print("twin-screw-lift.calc", static_cast<size_t>(std::count(text.begin(), text.end(), '\n')),
        measure(text, line, character, "4200", "4300", rounds,
                lsp::uriFromPath(std::filesystem::absolute(demo_path).string())));
  // A sheet with `use` lines: three instances of two templates, read from the disk at each edit.
  const std::string platform_path = dir + "/platform-lift.calc";
  std::string platform;
  if (!readFile(platform_path, &platform, &error)) {
    std::fprintf(stderr, "lsp_perftest: %s\n", error.c_str());
    return 2;
  }
  const size_t payload = platform.find("m_payload = 1500 kg");
  if (payload == std::string::npos) {
    std::fprintf(stderr, "lsp_perftest: platform-lift.calc has no `m_payload = 1500 kg`\n");
    return 2;
  }
  const int payload_line =
      static_cast<int>(std::count(platform.begin(), platform.begin() + static_cast<long>(payload), '\n'));
  print("platform-lift.calc", static_cast<size_t>(std::count(platform.begin(), platform.end(), '\n')),
        measure(platform, payload_line, 12, "1500", "1600", rounds,
                lsp::uriFromPath(std::filesystem::absolute(platform_path).string())));
  const int blocks = 10000 / static_cast<int>(demo->sheet.quantities.size()) + 1;
  size_t lines = 0;
  const std::string large = largeSheet(*demo, blocks, &lines);
  // In the generated sheet m_load_0 is the first line: "m_load_0 = 4200 kg".
  print("generated", lines, measure(large, 0, 11, "4200", "4300", std::max(2, rounds / 5)));
  return 0;
}
