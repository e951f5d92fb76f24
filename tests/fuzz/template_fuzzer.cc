// libFuzzer target: template resolution. The input is split at NUL bytes into
// a main sheet and up to three templates, read from memory as t1.calc,
// t2.calc and t3.calc (so `use t1.calc as a with ...`, nesting and cycles
// of uses are all reachable). Holds: no crash, no hang, no sanitizer report;
// a sheet without errors has a finite value for every quantity and check,
// and its trail renders in every format.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <map>
#include <string>

#include "engine/calculation.h"
#include "engine/report/formats.h"
#include "engine/report/trail.h"
#include "engine/template/file_source.h"

namespace {

class MemorySource final : public calctrail::FileSource {
 public:
  std::map<std::string, std::string> files;
  bool read(const std::string& path, std::string* bytes, std::string* error) const override {
    auto it = files.find(path.rfind("./", 0) == 0 ? path.substr(2) : path);
    if (it == files.end()) {
      *error = "no such file";
      return false;
    }
    *bytes = it->second;
    return true;
  }
  bool realPath(const std::string&, std::string*) const override { return false; }
  std::string id() const override { return "fuzz"; }
};

[[noreturn]] void broken(const std::string& why) {
  std::fprintf(stderr, "fuzz invariant broken: %s\n", why.c_str());
  std::abort();  // libFuzzer saves the input as a crash
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const std::string input(reinterpret_cast<const char*>(data), size);
  std::string parts[4];
  size_t at = 0;
  for (int k = 0; k < 4; ++k) {
    const size_t end = k == 3 ? input.size() : std::min(input.find('\0', at), input.size());
    parts[k] = input.substr(std::min(at, input.size()), end - std::min(at, input.size()));
    at = end == input.size() ? input.size() : end + 1;
  }
  MemorySource source;
  for (int k = 1; k < 4; ++k) source.files["t" + std::to_string(k) + ".calc"] = parts[k];
  calctrail::CalcOptions options;
  options.source = &source;
  options.source_path = "main.calc";
  auto calc = calctrail::Calculation::fromText("main.calc", parts[0], options);
  if (!calc) broken("Calculation::fromText gave nothing");
  if (calc->hasErrors()) return 0;
  for (size_t i = 0; i < calc->quantityCount(); ++i)
    if (!calc->ok(i) || !std::isfinite(calc->si(i)))
      broken("`" + calc->sheet.quantities[i].name + "` has no finite value, and no error says why");
  for (size_t k = 0; k < calc->checkCount(); ++k)
    if (!calc->checkResult(k).ok) broken("the check `" + calc->sheet.checks[k].name + "` has no value");
  const calctrail::Trail trail = calctrail::buildTrail(*calc, 4);
  for (const calctrail::ReportFormat& f : calctrail::reportFormats())
    if (calctrail::renderReport(trail, f.name).empty()) broken(std::string("empty ") + f.name + " output");
  return 0;
}
