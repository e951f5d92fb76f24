// functions/validity.cc: fn::num, the four significant digits of every
// library message and of the tables' texts (docs/functions.md), written with
// std::to_chars and a fast path for whole numbers. The oracle is C's
// printf("%.4g"), which it replaced: the same text for every value.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdio>
#include <cstring>
#include <limits>
#include <random>
#include <string>

#include "functions/validity.h"

using namespace calctrail;

namespace {
std::string printed(double v) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.4g", v);
  return buf;
}
}  // namespace

TEST_CASE("validity: num() writes what printf's %.4g writes", "[functions][validity]") {
  const double edges[] = {0.0,
                          -0.0,
                          1.0,
                          -1.0,
                          12.0,
                          9999.0,
                          -9999.0,
                          10000.0,
                          10001.0,
                          1e4,
                          99999.,
                          1.5,
                          0.35,
                          0.1,
                          2.54e-2,
                          25.4,
                          1.875,
                          4.730,
                          33.02,
                          6400,
                          1e-5,
                          1e-4,
                          0.00012345,
                          123.456,
                          1234.5,
                          1235.5,
                          9999.5,
                          1e300,
                          -1e300,
                          1e-300,
                          std::numeric_limits<double>::denorm_min(),
                          std::numeric_limits<double>::max(),
                          2147483647.0,
                          4294967296.0};
  for (double v : edges) {
    INFO(printed(v));
    CHECK(fn::num(v) == printed(v));
  }
  // Whole numbers on both sides of the fast path's bound, and random bits.
  for (int k = -20000; k <= 20000; k += 7) CHECK(fn::num(k) == printed(k));
  std::mt19937_64 gen(20261203);
  std::uniform_int_distribution<uint64_t> bits;
  std::uniform_real_distribution<double> small(-2e4, 2e4);
  for (int k = 0; k < 3000; ++k) {
    const uint64_t b = bits(gen);
    double v;
    std::memcpy(&v, &b, sizeof v);
    if (!std::isfinite(v)) continue;
    REQUIRE(fn::num(v) == printed(v));
    const double w = small(gen);
    REQUIRE(fn::num(w) == printed(w));
    REQUIRE(fn::num(std::round(w * 100) / 100) == printed(std::round(w * 100) / 100));
  }
  CHECK(fn::num(NAN) == "NaN");
  CHECK(fn::num(HUGE_VAL) == "inf");
  CHECK(fn::num(-HUGE_VAL) == "-inf");
}
