// Absolute temperatures (degC, degF) against temperature differences (ddegC,
// ddegF; K serves for both): the arithmetic that has a physical meaning is
// allowed, the rest is an error that names the fix (docs/format.md,
// "Temperatures"). The rule is absoluteTemperatureRule in
// engine/eval/dimension_check.h.
#include <catch2/catch.hpp>

#include <string>

#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::calc;
using calctrail::test::diagnostics;
using calctrail::test::si;

namespace {

// The one error of `text`, or a failed test.
std::string oneError(const std::string& text) {
  auto c = calc(text);
  const std::string d = diagnostics(*c);
  INFO(d);
  REQUIRE(c->diags.errorCount() == 1);
  return d;
}

bool namesTheFix(const std::string& message) {
  return message.find("ddegC, ddegF or K") != std::string::npos;
}

}  // namespace

TEST_CASE("temperature: the audit's product and negation are errors, not 313.1 degC and -566.3 degC",
          "[temperature][units]") {
  const std::string product = oneError("T1 = 20 degC\nT2 [degC] = T1 * 2\n");
  CHECK(product.rfind("sheet.calc:2:13: error: `T1` is an absolute temperature (degC and degF count from "
                      "an arbitrary zero), so multiplying it (2 * 20 degC is not 40 degC) has no physical "
                      "meaning",
                      0) == 0);
  CHECK(namesTheFix(product));
  CHECK(product.find("declare its quantity in [K]") != std::string::npos);

  const std::string negation = oneError("T1 = 20 degC\nT3 [degC] = -T1\n");
  CHECK(negation.rfind("sheet.calc:2:13: error: `T1` is an absolute temperature", 0) == 0);
  CHECK(negation.find("its negative (below absolute zero)") != std::string::npos);
  CHECK(negation.find("`-40 degC`") != std::string::npos);
  CHECK(namesTheFix(negation));

  // Without a declared unit as well, and on a literal.
  CHECK(namesTheFix(oneError("T1 = 20 degC\nT2 = 2 * T1\n")));
  CHECK(namesTheFix(oneError("T = -(20 degC)\n")));
  CHECK(namesTheFix(oneError("T = 2 * 68 degF\n")));
}

TEST_CASE("temperature: quotients, powers and sums of two absolute temperatures are errors",
          "[temperature][units]") {
  CHECK(oneError("T1 = 20 degC\nr = T1 / 2\n").find("dividing it, or dividing by it,") != std::string::npos);
  CHECK(oneError("T1 = 20 degC\nr = 300 K / T1\n").find("`T1` is an absolute temperature") !=
        std::string::npos);
  CHECK(oneError("T1 = 20 degC\nr = T1^2 / 1 [K^2]\n").find("a power of it") != std::string::npos);
  const std::string sum = oneError("T1 = 20 degC\nT2 = 30 degC\nT = T1 + T2\n");
  CHECK(sum.rfind("sheet.calc:3:5: error: adding two absolute temperatures has no physical meaning", 0) == 0);
  CHECK(sum.find("`T + 5 ddegC`") != std::string::npos);
  // A difference minus an absolute temperature, and a mixed min or max.
  CHECK(namesTheFix(oneError("T1 = 20 degC\nx = 5 ddegC - T1\n")));
  CHECK(namesTheFix(oneError("T1 = 20 degC\nT2 = 30 degC\nx = max(T1, T2 - T1)\n")));
  // The kind travels through quantities: Ta is absolute because T1 is.
  CHECK(namesTheFix(oneError("T1 = 20 degC\nTa = T1 + 5 ddegC\nx = Ta * 2\n")));
}

TEST_CASE("temperature: absolute plus or minus a difference, differences, comparisons and literals stay",
          "[temperature][units]") {
  auto c = calc(
      "T1 = 20 degC\n"
      "T_cold = -40 degF\n"
      "Ta [degC] = T1 + 5 ddegC\n"
      "Tb [degC] = 5 K + T1\n"
      "Tc [degF] = T1 - 9 ddegF\n"
      "dT = Ta - T1\n"
      "dT2 [ddegC] = Ta - T_cold\n"
      "twice [K] = 2 * dT\n"
      "Tk [K] = 20 degC\n"
      "ratio = Tk / 300 K\n"
      "alpha = 12e-6 [1/ddegC]\n"
      "strain = alpha * (Ta - T1)\n"
      "hot = max(T1, Ta)\n"
      "check below: T1 < 100 degC\n"
      "check rise: Ta - T1 < 50 ddegC\n"
      "check rise_k: dT <= 5 K\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "Ta") == Approx(298.15).epsilon(1e-14));
  CHECK(si(*c, "Tb") == Approx(298.15).epsilon(1e-14));
  CHECK(si(*c, "Tc") == Approx(288.15).epsilon(1e-14));
  CHECK(si(*c, "dT") == Approx(5).epsilon(1e-12));
  CHECK(si(*c, "dT2") == Approx(65).epsilon(1e-12));
  CHECK(si(*c, "twice") == Approx(10).epsilon(1e-12));
  CHECK(si(*c, "ratio") == Approx(293.15 / 300).epsilon(1e-14));
  CHECK(si(*c, "strain") == Approx(60e-6).epsilon(1e-9));
  CHECK(si(*c, "hot") == Approx(298.15).epsilon(1e-14));
  for (size_t k = 0; k < c->checkCount(); ++k) CHECK(c->checkResult(k).passed);
  // A difference shows as one: 5 K (not as an absolute temperature).
  const int i = c->sheet.find("dT");
  CHECK(c->display(i).text == "K");
}

TEST_CASE("temperature: a difference declared in [degC] and an absolute in [ddegC] are errors",
          "[temperature][units]") {
  const std::string diff = oneError("T1 = 20 degC\nT2 = 30 degC\ndT [degC] = T2 - T1\n");
  CHECK(diff ==
        "sheet.calc:3:13: error: `dT` is a temperature difference, but [degC] shows absolute "
        "temperatures: the number shown would be off by the zero of the scale; declare it in [ddegC], "
        "[ddegF] or [K]\n");
  CHECK(oneError("rise = 10 ddegC\nshown [degF] = rise\n").find("`shown` is a temperature difference") !=
        std::string::npos);
  CHECK(oneError("T1 = 20 degC\nT [ddegC] = T1\n") ==
        "sheet.calc:2:13: error: `T` is an absolute temperature, but [ddegC] is a unit of temperature "
        "differences; declare it in [degC], [degF] or [K]\n");
  // A declared [degC] makes a kelvin value absolute: its product is then an error too.
  CHECK(namesTheFix(oneError("T [degC] = 293.15 K\nx = T * 2\n")));
}

TEST_CASE("temperature: a check comparing a difference with an absolute temperature is an error",
          "[temperature][units]") {
  const std::string rhs = oneError("T1 = 20 degC\nT2 = 30 degC\ncheck rise: T2 - T1 < 50 degC\n");
  CHECK(rhs.rfind("sheet.calc:3:23: error: the check `rise` compares an absolute temperature with a "
                  "temperature difference",
                  0) == 0);
  CHECK(rhs.find("`50 ddegC`") != std::string::npos);
  const std::string lhs = oneError("T1 = 20 degC\nT2 = 30 degC\ncheck rise: 50 degC > T2 - T1\n");
  CHECK(lhs.find("compares an absolute") != std::string::npos);
}

TEST_CASE("temperature: --set is held to the same rule", "[temperature][units]") {
  auto c = calc("T1 = 20 degC\nT2 [degC] = T1 + 5 ddegC\n", {"T1=2 * 20 degC"});
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(c->hasErrors());
  CHECK(namesTheFix(d));
  auto ok = calc("T1 = 20 degC\nT2 [degC] = T1 + 5 ddegC\n", {"T1=40 degC"});
  REQUIRE_FALSE(ok->hasErrors());
  CHECK(si(*ok, "T2") == Approx(318.15).epsilon(1e-14));
}
