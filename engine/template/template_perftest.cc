// template_perftest: a benchmark program, not a test. The cost of templates
// as a sheet grows: one sheet with 1,000 and then 10,000 instances of the
// trapezoidal screw stage (worksheets/templates/trapezoidal-screw-stage.calc),
// each with its own binding, through the public stages: parse, expand
// (TemplateCache, expandTemplates), Model::build, evaluate. Prints the time
// per instance of each stage; 10x the instances should cost at most 12x the
// time (every stage linear).
//
//   template_perftest [--worksheets DIR] [--repeat R]
//
// DIR defaults to the worksheets/ folder found from the current directory or
// from this program's, upwards (engine/util/find_worksheets.h).
//
// Exit status: 0; 2 when the sheet does not calculate cleanly.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <memory>
#include <string>

#include "engine/model/evaluate.h"
#include "engine/model/model.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_loader.h"
#include "engine/util/find_worksheets.h"
#include "engine/util/sha256.h"

using namespace calctrail;

namespace {

double now() {
  return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

// The template from memory, so that the figures do not include the disk.
class MemorySource final : public FileSource {
 public:
  explicit MemorySource(std::string text) : text_(std::move(text)) {}
  bool read(const std::string&, std::string* bytes, std::string*) const override {
    *bytes = text_;
    return true;
  }
  bool realPath(const std::string&, std::string*) const override { return false; }
  std::string id() const override { return "memory"; }

 private:
  std::string text_;
};

struct Figures {
  double parse = 0, expand = 0, model = 0, evaluate = 0;
  double total() const { return parse + expand + model + evaluate; }
};

Figures run(const std::string& text, const FileSource& source, int instances) {
  std::string sheet = "F_total = " + std::to_string(instances * 10) + " kN  # shared by every screw\n";
  for (int k = 0; k < instances; ++k)
    sheet += "use t.calc as s" + std::to_string(k) + " with F = F_total / " + std::to_string(instances) +
             " * " + std::to_string(1 + k % 7) + " / 4, d = " + std::to_string(36 + 4 * (k % 3)) + " mm\n";
  Figures f;
  Diagnostics diags;
  double t0 = now();
  Sheet s = parseSheet(std::make_shared<SourceFile>("main.calc", sheet), &diags);
  double t1 = now();
  TemplateCache cache;
  expandTemplates(&s, "main.calc", sha256Hex(sheet), source, &cache, &diags);
  double t2 = now();
  auto model = Model::build(std::move(s), &diags);
  double t3 = now();
  Inputs inputs(*model);
  Results r = evaluate(*model, inputs);
  double t4 = now();
  if (diags.hasErrors() || !r.faults.empty()) {
    std::fprintf(stderr, "template_perftest: the sheet does not calculate: %s\n",
                 diags.hasErrors() ? diags.list().front().headline().c_str() : r.faults.front().message.c_str());
    std::exit(2);
  }
  (void)text;
  f.parse = t1 - t0;
  f.expand = t2 - t1;
  f.model = t3 - t2;
  f.evaluate = t4 - t3;
  return f;
}

}  // namespace

int main(int argc, char** argv) {
  std::string dir;
  int repeat = 3;
  for (int i = 1; i < argc; ++i) {
    if (!std::strcmp(argv[i], "--worksheets") && i + 1 < argc) dir = argv[++i];
    else if (!std::strcmp(argv[i], "--repeat") && i + 1 < argc) repeat = std::max(1, std::atoi(argv[++i]));
  }
  const std::string stage = "templates/trapezoidal-screw-stage.calc";
  if (dir.empty()) dir = findWorksheets(stage);
  if (dir.empty()) {
    std::fprintf(stderr, "%s\n", worksheetsNotFound("template_perftest", stage).c_str());
    return 2;
  }
  std::string text, error;
  if (!readFile(dir + "/" + stage, &text, &error)) {
    std::fprintf(stderr, "template_perftest: %s/%s: %s\n", dir.c_str(), stage.c_str(), error.c_str());
    return 2;
  }
  const MemorySource source(text);
  std::printf("instances of the trapezoidal screw stage in one sheet, best of %d, us per instance:\n", repeat);
  std::printf("%10s %9s %9s %9s %9s %9s\n", "instances", "parse", "expand", "model", "evaluate", "total");
  double totals[2] = {0, 0};
  const int sizes[2] = {1000, 10000};
  for (int k = 0; k < 2; ++k) {
    Figures best;
    for (int r = 0; r < repeat; ++r) {
      const Figures f = run(text, source, sizes[k]);
      if (r == 0 || f.total() < best.total()) best = f;
    }
    const double per = 1e6 / sizes[k];
    std::printf("%10d %9.2f %9.2f %9.2f %9.2f %9.2f\n", sizes[k], best.parse * per, best.expand * per,
                best.model * per, best.evaluate * per, best.total() * per);
    totals[k] = best.total();
  }
  std::printf("10x the instances: %.2fx the time (target: at most 12x)\n", totals[1] / totals[0]);
  return 0;
}
