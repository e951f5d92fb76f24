// libFuzzer target: any bytes as a worksheet, calculated twice and diffed with itself
// (engine/review/sheet_diff.h).
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <string>

#include "tests/fuzz/invariants.h"

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const std::string broken =
      calctrail::fuzz::selfDiffHolds(std::string(reinterpret_cast<const char*>(data), size));
  if (!broken.empty()) {
    std::fprintf(stderr, "fuzz invariant broken: %s\n", broken.c_str());
    std::abort();  // libFuzzer saves the input as a crash
  }
  return 0;
}
