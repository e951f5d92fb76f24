// engine/units/dimension: siSymbol writes one string in two passes; it must
// spell every dimension as the plain version that joined the numerator and
// the denominator built apart (kept here as the reference) did.
#include "engine/units/dimension.h"

#include <catch2/catch.hpp>

#include <string>

using namespace calctrail;

namespace {

std::string referenceSiSymbol(const Dimension& d) {
  static const std::pair<Base, const char*> order[] = {
      {Base::Mass, "kg"}, {Base::Length, "m"},      {Base::Time, "s"},    {Base::Current, "A"},
      {Base::Temperature, "K"}, {Base::Amount, "mol"}, {Base::Luminous, "cd"}, {Base::Angle, "rad"},
  };
  const auto factor = [](const char* symbol, int power) {
    std::string s = symbol;
    if (power != 1) s += "^" + std::to_string(power);
    return s;
  };
  std::string num, den;
  int den_count = 0;
  for (const auto& [base, symbol] : order) {
    const int e = d.exponent(base);
    if (e > 0) {
      if (!num.empty()) num += "*";
      num += factor(symbol, e);
    } else if (e < 0) {
      if (!den.empty()) den += "*";
      den += factor(symbol, -e);
      ++den_count;
    }
  }
  if (num.empty()) num = "1";
  if (den.empty()) return num;
  return num + "/" + (den_count > 1 ? "(" + den + ")" : den);
}

}  // namespace

TEST_CASE("siSymbol spells every dimension as the reference does", "[units][dimension]") {
  // Every combination of exponents -2..2 over the eight bases, and a few large ones.
  int e[Dimension::kBases] = {};
  for (int n = 0; n < 390625; ++n) {
    for (int k = 0, m = n; k < Dimension::kBases; ++k, m /= 5) e[k] = m % 5 - 2;
    const Dimension d = Dimension::exponents(e[0], e[1], e[2], e[3], e[4], e[5], e[6], e[7]);
    REQUIRE(d.siSymbol() == referenceSiSymbol(d));
  }
  for (int big : {-60, -12, 12, 60}) {
    const Dimension d = Dimension::exponents(big, 1, -big, 0, 3, 0, 0, -1);
    CHECK(d.siSymbol() == referenceSiSymbol(d));
  }
  CHECK(Dimension().siSymbol() == "1");
  CHECK(Dimension::exponents(2, 1, -2).siSymbol() == "kg*m^2/s^2");
  CHECK(Dimension::exponents(1, 1, -3, 0, -1).siSymbol() == "kg*m/(s^3*K)");
}
