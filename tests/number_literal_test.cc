// engine/sheet/number_literal: decimalValue takes from_chars' value where it
// can and strtod's elsewhere; over many literals, both its value (bit for bit)
// and its range verdict must be strtod's.
#include "engine/sheet/number_literal.h"

#include <catch2/catch.hpp>

#include <cerrno>
#include <cmath>
#include <cstdlib>
#include <cstring>
#include <random>
#include <string>
#include <vector>

using namespace calctrail;

namespace {

void compareWithStrtod(const std::string& literal) {
  INFO("literal " << literal);
  errno = 0;
  const double expected = std::strtod(literal.c_str(), nullptr);
  const bool expected_in_range = errno != ERANGE;
  bool in_range = false;
  const double value = decimalValue(literal, &in_range);
  CHECK(std::memcmp(&value, &expected, sizeof value) == 0);
  CHECK(in_range == expected_in_range);
}

}  // namespace

TEST_CASE("decimalValue gives strtod's value and range verdict on the edge cases", "[sheet][number_literal]") {
  const std::vector<std::string> literals = {
      "0", "0.0", "00", "0e5", "0.000", ".5", "5.", "1", "9", "10", "999.96", "999.95", "0.1", "0.3", "1e-3",
      "4200", "9.80665", "2.54e-5", "4.4482216152605", "1e22", "1e23", "123456789012345678901234567890",
      "9007199254740993",                   // 2^53 + 1: halfway, rounds to even
      "9007199254740992.5",
      "2.2250738585072014e-308",            // the least normal double
      "2.2250738585072011e-308",            // just below it: subnormal
      "4.9e-324", "5e-324", "2e-324", "1e-400", "1e-320",
      "1.7976931348623157e308",             // the largest double
      "1.7976931348623158e308",             // rounds to it
      "1.7976931348623159e308",             // overflows
      "1e309", "1e400", "1E5", "1e+5", "1e-5", "1E-05",
      "0.30000000000000004441", "3.0000000000000004441e-1", "7.2057594037927933e16",
      std::string(400, '9'), "0." + std::string(400, '0') + "1", "1" + std::string(310, '0'),
      "1" + std::string(308, '0'),
  };
  for (const std::string& l : literals) compareWithStrtod(l);
}

TEST_CASE("decimalValue gives strtod's value and range verdict on random literals", "[sheet][number_literal]") {
  std::mt19937 random(20261204);
  std::uniform_int_distribution<int> digit(0, 9), count(0, 25), exponent(-330, 330), shape(0, 3);
  for (int k = 0; k < 20000; ++k) {
    std::string l;
    const int whole = count(random), fraction = count(random);
    for (int i = 0; i < whole; ++i) l += static_cast<char>('0' + digit(random));
    if (whole == 0 || shape(random) > 0) {
      l += '.';
      for (int i = 0; i < fraction; ++i) l += static_cast<char>('0' + digit(random));
    }
    if (l == "." || l.empty()) l = "0" + l;
    if (l.front() == '.' && l.size() == 1) continue;
    if (shape(random) == 0) l += "e" + std::to_string(exponent(random));
    compareWithStrtod(l);
  }
}
