#include <iostream>
#include <thread>

#include "engine/cli/study_common.h"
#include "engine/report/number_format.h"
#include "engine/study/sweep.h"
#include "engine/study/sweep_merge.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

namespace {

std::string render(const SweepTable& t, const StudyArgs& args) {
  if (args.format == "json") return renderSweepJson(t);
  if (args.format == "csv") return renderSweepCsv(t);
  if (args.format == "svg") return renderSweepSvg(t);
  return renderSweepText(t, args.digits);
}

int merge(const SweepArgs& args) {
  if (!args.study.file.empty() || !args.vary.empty() || !args.show.empty() || !args.shard.empty()) {
    std::cerr << "calctrail: error: sweep --merge takes only the shards' JSON files (and --format, -o): "
                 "the sweep itself is in them\n";
    return kExitError;
  }
  std::vector<SweepTable> shards;
  for (const std::string& path : args.merge) {
    std::string bytes, error;
    shards.emplace_back();
    if (!readFile(path, &bytes, &error) || !readSweepJson(bytes, &shards.back(), &error)) {
      std::cerr << path << ":1:1: error: " << error << "\n";
      return kExitError;
    }
  }
  SweepTable whole;
  std::string error;
  if (!mergeSweeps(std::move(shards), &whole, &error)) {
    std::cerr << args.merge.front() << ":1:1: error: cannot merge: " << error << "\n";
    return kExitError;
  }
  if (!writeStudyOutput(args.study, render(whole, args.study))) return kExitError;
  return whole.anyError() ? kExitError : kExitOk;
}

bool parseShard(const std::string& text, int* k, int* n) {
  const size_t slash = text.find('/');
  if (slash == std::string::npos) return false;
  try {
    size_t a = 0, b = 0;
    *k = std::stoi(text.substr(0, slash), &a);
    *n = std::stoi(text.substr(slash + 1), &b);
    if (a != slash || b != text.size() - slash - 1) return false;
  } catch (const std::exception&) {
    return false;
  }
  return *n >= 1 && *k >= 1 && *k <= *n;
}

}  // namespace

int runSweepCommand(const SweepArgs& args) {
  if (!args.merge.empty()) return merge(args);
  if (args.study.file.empty()) {
    std::cerr << "calctrail: error: sweep needs a worksheet FILE (or --merge SHARD.json...)\n";
    return kExitError;
  }
  if (args.vary.empty() || args.vary.size() > 2) {
    std::cerr << "calctrail: error: sweep takes one --vary, or two for a grid\n";
    return kExitError;
  }
  if (args.show.empty()) {
    std::cerr << "calctrail: error: sweep needs --show NAME[,NAME...]: the results to record at each point\n";
    return kExitError;
  }
  SweepSpec spec;
  if (!args.shard.empty() && !parseShard(args.shard, &spec.shard, &spec.shards)) {
    std::cerr << "calctrail: error: --shard takes K/N with 1 <= K <= N, as in --shard 2/4 (got `"
              << args.shard << "`)\n";
    return kExitError;
  }
  auto calc = loadStudySheet(args.study);
  if (!calc) return kExitError;
  const Model& m = *calc->model;
  Diagnostics diags;
  for (const std::string& v : args.vary) {
    StudyRange r;
    if (parseVary(m, *calc->inputs, v, args.steps, args.log, &diags, &r)) spec.vary.push_back(std::move(r));
  }
  if (spec.vary.size() == 2 && spec.vary[0].input.slot == spec.vary[1].input.slot)
    diags.error("--vary", "`" + spec.vary[0].input.name + "` is varied twice");
  std::vector<std::string> names;
  for (const Quantity& q : m.sheet().quantities) names.push_back(q.name);
  for (const std::string& list : args.show) {
    const SourceFile file("--show", list);
    size_t b = 0;
    while (b <= list.size()) {
      size_t e = list.find(',', b);
      if (e == std::string::npos) e = list.size();
      size_t nb = b, ne = e;
      while (nb < ne && list[nb] == ' ') ++nb;
      while (ne > nb && list[ne - 1] == ' ') --ne;
      const std::string name = list.substr(nb, ne - nb);
      const Slot s = m.find(name);
      if (name.empty()) {
        diags.error(file, static_cast<uint32_t>(nb), static_cast<uint32_t>(nb + 1),
                    "a name is missing in --show");
      } else if (!s.valid()) {
        std::string msg = "the worksheet defines no quantity `" + name + "`";
        const auto near = nearestWords(name, names);
        if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
        diags.error(file, static_cast<uint32_t>(nb), static_cast<uint32_t>(ne), msg);
      } else {
        spec.show.push_back(s);
      }
      b = e + 1;
    }
  }
  if (diags.hasErrors()) {
    printDiagnostics(diags);
    return kExitError;
  }
  // The table of one run is held in memory: bound it before anything is allocated for it.
  constexpr double kMaxPoints = 1e7;
  double total = 1;
  for (const StudyRange& r : spec.vary) total *= static_cast<double>(r.values.size());
  if (total / spec.shards > kMaxPoints) {
    std::cerr << "calctrail: error: the sweep has " << total << " points, " << total / spec.shards
              << " in this run; at most 10000000 points a run (split it with --shard K/N)\n";
    return kExitError;
  }
  spec.log = args.log;
  spec.jobs = args.jobs ? args.jobs : std::max(1u, std::thread::hardware_concurrency());
  SweepTable t = runSweep(m, *calc->inputs, calc->results, spec);
  t.sheet_path = calc->path;
  t.sheet_sha256 = calc->sha256;
  t.sets = args.study.sets;

  // A point that cannot be calculated: its error, where the sheet writes it (the first ten).
  Diagnostics faults;
  int shown = 0, more = 0;
  for (size_t p = 0; p < t.size(); ++p) {
    if (!t.failed(p)) continue;
    if (shown++ >= 10) {
      ++more;
      continue;
    }
    std::string at;
    for (size_t j = 0; j < t.vary.size(); ++j)
      at += (j ? ", " : "") + t.vary[j].name + " = " + formatQuantity(t.input(p, j), t.vary[j].unit, 4);
    const Fault& f = t.faults[p];
    faults.error(*f.file, f.begin, f.end, "at " + at + ": " + f.message);
  }
  printDiagnostics(faults);
  if (more)
    std::cerr << "... and " << more << " more point" << (more == 1 ? "" : "s") << " cannot be calculated\n";
  if (!writeStudyOutput(args.study, render(t, args.study))) return kExitError;
  return t.anyError() ? kExitError : kExitOk;
}

}  // namespace calctrail
