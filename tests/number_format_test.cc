// Numbers for people and for machines (engine/report/number_format.h): the
// rounding rules, engineering exponents, and a sweep over every magnitude a
// double has, both signs and every digits setting.
#include <catch2/catch.hpp>

#include <cfloat>
#include <cmath>
#include <cstdlib>
#include <random>
#include <string_view>
#include <regex>

#include "engine/report/number_format.h"
#include "engine/report/formats.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

TEST_CASE("number format: significant digits, integer digits kept, engineering exponents",
          "[number_format]") {
  CHECK(formatNumber(15184.36, 4) == "15184");
  CHECK(formatNumber(0.35, 4) == "0.3500");
  CHECK(formatNumber(2.5e-7, 4) == "250.0e-9");
  CHECK(formatNumber(1.5e9, 4) == "1.500e9");
  CHECK(formatNumber(999.96, 4) == "1000");
  CHECK(formatNumber(999999.6, 4) == "1.000e6");
  CHECK(formatNumber(0.00099996, 4) == "1.000e-3");
  CHECK(formatNumber(0.001, 4) == "0.001000");
  CHECK(formatNumber(-3.0, 4) == "-3.000");
  CHECK(formatNumber(2.6e-7, 1) == "300e-9");
  CHECK(formatNumber(2.5e-7, 1) == "200e-9");  // the double is 2.4999999999999999e-7
  CHECK(formatNumber(12.5, 17) == "12.500000000000000");
  CHECK(formatNumber(0.0, 4) == "0.000");
  CHECK(formatNumber(-0.0, 4) == "0.000");  // a sign on a zero says nothing true
  CHECK(formatNumber(0.0, 1) == "0");
  CHECK(formatNumber(1.0, 0) == "1");     // digits clamped to 1..17
  CHECK(formatNumber(1.0, 40) == "1.0000000000000000");
}

TEST_CASE("number format: subnormals and the largest doubles (no infe-324)", "[number_format]") {
  CHECK(formatNumber(1e-322, 4) == "98.81e-324");  // the nearest double to 1e-322
  CHECK(formatNumber(std::numeric_limits<double>::denorm_min(), 4) == "4.941e-324");
  CHECK(formatNumber(-std::numeric_limits<double>::denorm_min(), 2) == "-4.9e-324");
  CHECK(formatNumber(DBL_MIN, 4) == "22.25e-309");
  CHECK(formatNumber(DBL_MAX, 4) == "179.8e306");
  CHECK(formatNumber(-DBL_MAX, 17) == "-179.76931348623157e306");
}

TEST_CASE("number format: the hardening case a = 1e-300, b = a * 1e-22 in every human format",
          "[number_format]") {
  auto c = calc("a = 1e-300\nb = a * 1e-22\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  for (const char* format : {"text", "md", "html"}) {
    const std::string out = renderReport(t, format);
    INFO(format << ":\n" << out);
    CHECK(out.find("inf") == std::string::npos);
    CHECK(out.find("nan") == std::string::npos);
  }
  // 1e-322 is subnormal: the nearest double is 9.881e-323.
  CHECK(renderText(t).find("= 98.81e-324\n") != std::string::npos);
}

TEST_CASE("number format: every magnitude, both signs, every digits setting reads back", "[number_format]") {
  const std::regex shape("-?[0-9]+(\\.[0-9]+)?(e-?[0-9]+)?");
  std::vector<double> values = {std::numeric_limits<double>::denorm_min(), DBL_MIN, DBL_MAX,
                                std::nextafter(DBL_MIN, 0.0)};
  for (int e = -324; e <= 308; ++e)
    for (double m : {1.0, 1.5, 2.2250738585072014, 4.9999999, 9.9996})
      if (std::isfinite(m * std::pow(10.0, e)))
        values.push_back(std::strtod(fmt::format("{}e{}", m, e).c_str(), nullptr));
  size_t checked = 0;
  for (double magnitude : values) {
    if (magnitude == 0) continue;
    for (double v : {magnitude, -magnitude}) {
      for (int digits = 1; digits <= 17; ++digits) {
        const std::string text = formatNumber(v, digits);
        INFO(formatExact(v) << " with " << digits << " digits: " << text);
        REQUIRE(std::regex_match(text, shape));
        const size_t e = text.find('e');
        if (e != std::string::npos) REQUIRE(std::atoi(text.c_str() + e + 1) % 3 == 0);
        // Read back in long double, whose range holds 179.8e306 and whose
        // precision is finer than 17 digits: the text must be within half a
        // unit of the last digit asked for.
        const long double back = std::strtold(text.c_str(), nullptr);
        const long double x = v;
        const long double tolerance = 0.5L * std::pow(10.0L, 1 - digits) * std::fabs(x) * (1 + 1e-15L);
        REQUIRE(std::fabs(back - x) <= tolerance);
        REQUIRE((back < 0) == (v < 0));
        ++checked;
      }
    }
  }
  CHECK(checked > 2 * 17 * 3000);
}

namespace {
std::string_view digitsOf(const RoundedDigits& r) { return {r.digits, static_cast<size_t>(r.count)}; }
}  // namespace

TEST_CASE("number format: the fast rounding agrees with fmt's wherever it answers", "[number_format]") {
  std::vector<double> values = {1.0, 0.001, 0.00099996, 999.96, 999.95, 999.949999, 9.9996, 99999.7, 1e6,
                                999999.6, 0.125, 0.375, 2.5, 2.675, 1.0005, 0.15, 1.45, 15184.36, 1e15,
                                1e22, 1e-22, 123456789012345.0, 0.1 + 0.2, 1.0 / 3, 2.0 / 3,
                                std::numeric_limits<double>::denorm_min(), DBL_MIN, DBL_MAX,
                                std::nextafter(1.0, 0.0), std::nextafter(1.0, 2.0)};
  // Values on and beside the ties of every digits setting: k.5 units of the last digit.
  for (int e = -8; e <= 16; ++e)
    for (double m : {1.5, 1.05, 1.005, 1.0005, 9.5, 9.95, 9.995, 9.9995, 2.25, 6.125, 4.4445})
      {
        const double v = std::strtod(fmt::format("{}e{}", m, e).c_str(), nullptr);
        values.push_back(v);
        values.push_back(std::nextafter(v, 0.0));
        values.push_back(std::nextafter(v, DBL_MAX));
      }
  // Every magnitude, and many random significands.
  std::mt19937_64 random(20261204);
  std::uniform_real_distribution<double> significand(1.0, 10.0);
  for (int e = -324; e <= 308; ++e)
    for (int n = 0; n < 20; ++n) {
      const double v = std::strtod(fmt::format("{}e{}", significand(random), e).c_str(), nullptr);
      if (v > 0 && std::isfinite(v)) values.push_back(v);
    }
  for (int n = 0; n < 20000; ++n) values.push_back(significand(random) * std::pow(10.0, n % 12 - 4));
  size_t fast = 0, compared = 0;
  for (double v : values) {
    if (!(v > 0) || !std::isfinite(v)) continue;
    for (int digits = 1; digits <= 17; ++digits) {
      const RoundedDigits exact = roundDigitsExact(v, digits);
      RoundedDigits quick;
      ++compared;
      if (!roundDigitsFast(v, digits, &quick)) continue;
      ++fast;
      INFO(formatExact(v) << " with " << digits << " digits");
      REQUIRE(digitsOf(quick) == digitsOf(exact));
      REQUIRE(quick.exp10 == exact.exp10);
    }
  }
  // The fast way answers nearly always where a report's numbers are.
  CHECK(fast > compared / 2);
}

TEST_CASE("number format: typeset powers of ten and literals as written", "[number_format]") {
  CHECK(numberText(roundNumber(1.5e9, 4), NumberStyle::TimesTen) == "1.500 \u00D7 10\u2079");
  CHECK(numberText(roundNumber(2.5e-7, 4), NumberStyle::TimesTen) == "250.0 \u00D7 10\u207B\u2079");
  CHECK(numberText(roundNumber(42, 4), NumberStyle::TimesTen) == "42.00");
  CHECK(numberText(writtenNumber("1E+03")) == "1E+03");
  CHECK(numberText(writtenNumber("1E+03"), NumberStyle::TimesTen) == "1 \u00D7 10\u00B3");
  CHECK(numberText(writtenNumber("2e-07"), NumberStyle::TimesTen) == "2 \u00D7 10\u207B\u2077");
  CHECK(numberText(writtenNumber("0.35"), NumberStyle::TimesTen) == "0.35");
}

TEST_CASE("number format: exact text is the shortest that reads back", "[number_format][json]") {
  CHECK(formatExact(0.1) == "0.1");
  CHECK(formatExact(12000) == "12000");
  CHECK(formatExact(-0.0) == "-0");
  CHECK(formatExact(1e-300) == "1e-300");
  CHECK(formatExact(53378.659383125996) == "53378.659383125996");
  CHECK(formatExact(std::numeric_limits<double>::denorm_min()) == "5e-324");
  CHECK(formatExact(DBL_MAX) == "1.7976931348623157e+308");
  CHECK(formatExact(1e15) == "1000000000000000");
  CHECK(formatExact(1e16) == "1e+16");
  CHECK(formatExact(0.0001) == "0.0001");
  CHECK(formatExact(0.00001) == "1e-05");
  double v = 1.0;
  for (int i = 0; i < 2000; ++i) {
    v = v * 1.37 + 1e-7;
    if (v > 1e300) v = 1e-300 * (1 + i);
    REQUIRE(std::strtod(formatExact(v).c_str(), nullptr) == v);
    REQUIRE(std::strtod(formatExact(-v / 3).c_str(), nullptr) == -v / 3);
  }
}
