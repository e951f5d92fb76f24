// End-to-end behaviour of a calculation: values, units, dimension checks,
// evaluation errors, overrides. Expected values are derived by hand beside
// each check (independent derivations) or come from the cited definitions.
#include <catch2/catch.hpp>

#include <cmath>

#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::calc;
using calctrail::test::diagnostics;
using calctrail::test::si;

TEST_CASE("definitions evaluate in dependency order, not file order", "[calc]") {
  auto c = calc("c = a + b\nb = 2 * a\na = 3 mm\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "c") == Approx(0.009).epsilon(1e-15));
  CHECK(c->order() == std::vector<Slot>{Slot(2), Slot(1), Slot(0)});
}

TEST_CASE("the contract's expression forms", "[calc]") {
  auto c = calc(
      "a = 12\n"
      "b = 0.5\n"
      "e = 1e-3\n"
      "f = -a + b * (a - 2) / 4 ^ 2\n"      // -12 + 0.5*10/16 = -11.6875
      "g = -2^2\n"                           // the power binds first: -4
      "h = 2^3^2\n"                          // right-associative: 2^9 = 512
      "k = pi\n"
      "m = max(1, 3, 2) + min(4, 5) + abs(-2)\n"  // 3 + 4 + 2
      "n = exp(ln(2)) + log10(1000)\n"       // 2 + 3
      "p = atan2(1, 1)\n"                    // 45 deg
      "q = sin(30 deg) + cos(60 deg) + tan(45 deg)\n"  // 0.5 + 0.5 + 1
      "r = asin(0.5)\n");                    // 30 deg
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "e") == 1e-3);
  CHECK(si(*c, "f") == Approx(-11.6875).epsilon(1e-15));
  CHECK(si(*c, "g") == -4);
  CHECK(si(*c, "h") == 512);
  CHECK(si(*c, "k") == M_PI);
  CHECK(si(*c, "m") == 9);
  CHECK(si(*c, "n") == Approx(5).epsilon(1e-15));
  CHECK(si(*c, "p") == Approx(M_PI / 4).epsilon(1e-15));
  CHECK(si(*c, "q") == Approx(2).epsilon(1e-15));
  CHECK(si(*c, "r") == Approx(M_PI / 6).epsilon(1e-15));
}

TEST_CASE("numbers carry one unit, or a compound unit in brackets", "[calc][units]") {
  auto c = calc(
      "F = 20 kN\n"
      "x = 0.25 in\n"
      "n = 1450 rpm\n"
      "a = 14.5 deg\n"
      "eta = 95 %\n"
      "g = 9.81 [m/s^2]\n"
      "T = 100 [lbf*in]\n"
      "k = 5 [1/in]\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "F") == 20000);
  CHECK(si(*c, "x") == Approx(0.00635).epsilon(1e-15));            // in = 0.0254 m exactly (NIST SP 811)
  CHECK(si(*c, "n") == Approx(1450 * 2 * M_PI / 60).epsilon(1e-15)); // rev = 2*pi rad
  CHECK(si(*c, "a") == Approx(14.5 * M_PI / 180).epsilon(1e-15));
  CHECK(si(*c, "eta") == Approx(0.95).epsilon(1e-15));
  CHECK(si(*c, "g") == 9.81);
  CHECK(si(*c, "T") == Approx(100 * 0.45359237 * 9.80665 * 0.0254).epsilon(1e-15));
  CHECK(si(*c, "k") == Approx(5 / 0.0254).epsilon(1e-15));
}

TEST_CASE("angles: torque times rpm is power, rpm times a lead per rev is a speed", "[calc][units][angles]") {
  auto c = calc(
      "T = 100 [N*m]\n"
      "n = 1450 rpm\n"
      "P [W] = T * n\n"
      "P2 = T * n\n"
      "v [mm/min] = n * 5 [mm/rev]\n"
      "v_us [in/min] = n * 0.2 [in/rev]\n"
      "check power: P <= 16 kW\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->diags.list().empty());  // no warning: every angle cancels or is work/power
  // P = T*omega with omega = 1450*2*pi/60 rad/s (independent derivation).
  CHECK(si(*c, "P") == Approx(100 * 1450 * 2 * M_PI / 60).epsilon(1e-14));
  CHECK(si(*c, "P2") == si(*c, "P"));
  const int p2 = c->sheet.find("P2");
  CHECK(c->display(p2).text == "W");
  // 1450 rev/min * 5 mm/rev = 7250 mm/min exactly.
  CHECK(si(*c, "v") == Approx(7250.0 / 1000 / 60).epsilon(1e-14));
  CHECK(si(*c, "v_us") == Approx(1450 * 0.2 * 0.0254 / 60).epsilon(1e-14));
  CHECK(c->checkResult(0).passed);
}

TEST_CASE("rpm times a plain length is loud, with the fix", "[calc][units][angles]") {
  auto c = calc("n = 1450 rpm\nlead = 5 mm\nv = n * lead\n");
  REQUIRE_FALSE(c->hasErrors());
  CHECK(diagnostics(*c) ==
        "sheet.calc:3:1: warning: `v` is a rotational speed times a plain length (m*rad/s): if the length is a lead, "
        "this is 2*pi too large; write the lead per revolution, as in `5 [mm/rev]` or `0.2 [in/rev]`\n");
  // Declared in a unit without the angle, the number itself would be wrong: an error with the fix.
  CHECK(diagnostics(*calc("n = 1450 rpm\nlead = 5 mm\nv [m/s] = n * lead\n")) ==
        "sheet.calc:3:4: error: `v` is declared in [m/s], speed (m/s), but its formula gives m*rad/s (no common name): "
        "they differ by an angle, so the number shown would be off by 2*pi; if the length is a lead, this is 2*pi too large; "
        "write the lead per revolution, as in `5 [mm/rev]` or `0.2 [in/rev]`\n");
  CHECK(diagnostics(*calc("F = 1 kN\nl = 5 [mm/rev]\nT = 2 [N*m]\neta [%] = F * l / (2 * pi * T)\n")).find(
            "error: `eta` is declared in [%]") != std::string::npos);
  auto ok = calc("F = 1 kN\nl = 5 [mm/rev]\nT = 2 [N*m]\neta [%] = F * l * 1 [rev] / (2 * pi * T)\n");
  REQUIRE_FALSE(ok->hasErrors());
  CHECK(si(*ok, "eta") == Approx(1000 * 0.005 / (2 * M_PI * 2)).epsilon(1e-15));
}

TEST_CASE("a display unit converts the result and asserts its dimension", "[calc][units]") {
  auto c = calc("F = 1000 lbf\nF_kN [kN] = F\nd [mm] = 1 in\n");
  REQUIRE_FALSE(c->hasErrors());
  const int i = c->sheet.find("F_kN");
  CHECK(c->display(i).fromSI(c->si(i)) == Approx(4.4482216152605).epsilon(1e-13));
  const int j = c->sheet.find("d");
  CHECK(c->display(j).fromSI(c->si(j)) == Approx(25.4).epsilon(1e-15));
}

TEST_CASE("dimension errors name both sides in words and units", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("a = 3 kN + 2 m\n")) == "sheet.calc:1:5: error: cannot add length (mm) to force (N)\n");
  CHECK(diagnostics(*calc("a = 3 kN - 2 m\n")) == "sheet.calc:1:5: error: cannot subtract length (mm) from force (N)\n");
  CHECK(diagnostics(*calc("a = 3 kN\ncheck c: a < 2 m\n")) ==
        "sheet.calc:2:12: error: the check `c` compares force (N) with length (mm)\n");
  CHECK(diagnostics(*calc("T [N*m] = 3 kN\n")) ==
        "sheet.calc:1:4: error: `T` is declared in [N*m], torque or energy (N*m), but its formula gives force (N)\n");
  CHECK(diagnostics(*calc("a = sqrt(3 mm)\n")) ==
        "sheet.calc:1:10: error: sqrt of length (mm) has no dimension with whole exponents; only even powers have a square root\n");
  CHECK(diagnostics(*calc("a = sin(3 mm)\n")) ==
        "sheet.calc:1:9: error: `sin` takes an angle (or plain radians), not length (mm)\n");
  CHECK(diagnostics(*calc("a = 2 ^ (3 mm)\n")) ==
        "sheet.calc:1:9: error: an exponent must be a plain number, not length (mm)\n");
  CHECK(diagnostics(*calc("n = 2\na = (3 mm)^n\n")) ==
        "sheet.calc:2:12: error: the base is length (mm), so the exponent must be a fixed number (like 2 or 0.5), not a formula of quantities\n");
  CHECK(diagnostics(*calc("a = sqr(2)\n")) ==
        "sheet.calc:1:5: error: unknown function `sqr`; did you mean `sqrt`? (`calctrail functions` lists them)\n");
  CHECK(diagnostics(*calc("a = max(1 m, 2 s)\n")) ==
        "sheet.calc:1:14: error: `max` compares alike values; argument 2 is time (s), the first is length (mm)\n");
  CHECK(diagnostics(*calc("a = sqrt(1, 2)\n")) == "sheet.calc:1:5: error: `sqrt` takes 1 argument, not 2\n");
}

TEST_CASE("powers and roots of dimensions", "[calc][units]") {
  auto c = calc("A = 16 [mm^2]\nd = sqrt(A)\nV = (2 m)^3\ns = V^(1/3)\nr = A^0.5\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "d") == Approx(0.004).epsilon(1e-15));
  CHECK(si(*c, "V") == 8);
  CHECK(si(*c, "s") == Approx(2).epsilon(1e-15));
  CHECK(si(*c, "r") == Approx(0.004).epsilon(1e-15));
}

TEST_CASE("unknown names and units suggest the nearest ones", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("force = 3 kN\nx = forse * 2\n")) ==
        "sheet.calc:2:5: error: unknown name `forse`; did you mean `force`?\n");
  CHECK(diagnostics(*calc("x = y + 1\n")) == "sheet.calc:1:5: error: unknown name `y`; define it with `y = ...`\n");
  CHECK(diagnostics(*calc("F = 3 kN * m\n")).find("`m` is a unit: a unit follows a number") != std::string::npos);
  const std::string unit = diagnostics(*calc("F = 3 lbs\n"));
  CHECK(unit.rfind("sheet.calc:1:7: error: unknown unit `lbs`", 0) == 0);
  CHECK(unit.find("`3 lb`") != std::string::npos);
  CHECK(unit.find("`3 lbf`") != std::string::npos);
}

TEST_CASE("an ambiguous unit power shows both bracketed readings", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("A = 3 mm^2\n")) ==
        "sheet.calc:1:7: error: `3 mm^2` can be read two ways: write `3 [mm^2]` for a value in mm^2, or `(3 mm)^2` for the power of 3 mm\n");
  auto ok = calc("A = 3 [mm^2]\nB = (3 mm)^2\n");
  REQUIRE_FALSE(ok->hasErrors());
  CHECK(si(*ok, "A") == Approx(3e-6).epsilon(1e-15));
  CHECK(si(*ok, "B") == Approx(9e-6).epsilon(1e-15));
}

TEST_CASE("cycles name every quantity on them", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("a = b + 1\nb = c * 2\nc = a\nd = d\ne = a\n")) ==
        "sheet.calc:1:1: error: a cycle: a -> b -> c -> a (3 quantities depend on each other; each needs the others' values first)\n"
        "sheet.calc:4:1: error: `d` uses itself: d -> d; a quantity cannot depend on its own value\n");
}

TEST_CASE("a duplicate definition points at both", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("a = 1\na = 2\n")) ==
        "sheet.calc:2:1: error: `a` is defined twice; the first definition is on line 1\n");
  CHECK(diagnostics(*calc("a = 1\ncheck x: a > 0\ncheck x: a < 2\n")) ==
        "sheet.calc:3:7: error: the check `x` is defined twice; the first is on line 2\n");
}

TEST_CASE("division by zero and domain errors name the quantity and its inputs", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("a = 0 mm\nb = 5 / a\n")) ==
        "sheet.calc:2:5: error: `b` cannot be calculated: division by zero: the divisor is 0 (with a = 0.000 mm)\n");
  CHECK(diagnostics(*calc("x = 1.5\ny = asin(x)\n")) ==
        "sheet.calc:2:5: error: `y` cannot be calculated: asin of 1.5, outside [-1, 1] (with x = 1.500)\n");
  CHECK(diagnostics(*calc("A = -2 [m^2]\nd = sqrt(A)\n")) ==
        "sheet.calc:2:5: error: `d` cannot be calculated: sqrt of a negative value (-2 in SI units) (with A = -2.000 m²)\n");
  CHECK(diagnostics(*calc("x = 0\ny = ln(x)\n")) ==
        "sheet.calc:2:5: error: `y` cannot be calculated: ln of 0: the logarithm needs a value above 0 (with x = 0.000)\n");
  CHECK(diagnostics(*calc("x = 1e300\ny = x * x\n")) ==
        "sheet.calc:2:5: error: `y` cannot be calculated: the result overflows the range of numbers (with x = 1.000e300)\n");
  CHECK(diagnostics(*calc("x = -8\ny = x^0.5\n")) ==
        "sheet.calc:2:5: error: `y` cannot be calculated: a negative base (-8) to a fractional power (0.5) has no real value (with x = -8.000)\n");
  CHECK(diagnostics(*calc("a = 1\ncheck c: 1 / (a - 1) > 0\n")) ==
        "sheet.calc:2:10: error: the check `c` cannot be evaluated: division by zero: the divisor is 0 (with a = 1.000)\n");
}

TEST_CASE("users of a broken quantity stay quiet: one cause, one error", "[calc][diagnostics]") {
  CHECK(diagnostics(*calc("a = 1 m + 1 s\nb = a * 2\nc = b + 1 m\n")) ==
        "sheet.calc:1:5: error: cannot add time (s) to length (mm)\n");
}

TEST_CASE("temperatures: degC and degF are absolute, ddegC a difference", "[calc][units]") {
  auto c = calc("t = 20 degC\nt2 = -40 degF\ndt = 10 ddegC\nt3 [degC] = t + dt\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "t") == Approx(293.15).epsilon(1e-15));
  CHECK(si(*c, "t2") == Approx(233.15).epsilon(1e-14));  // -40 degF = -40 degC
  const int i = c->sheet.find("t3");
  CHECK(c->display(i).fromSI(c->si(i)) == Approx(30).epsilon(1e-13));
}

TEST_CASE("an override with --set replaces a definition for one run", "[calc][set]") {
  const std::string sheet = "d = 20 mm\nA [mm^2] = pi * d^2 / 4\n";
  auto c = calc(sheet, {"d=10 mm"});
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "A") == Approx(M_PI * 1e-4 / 4).epsilon(1e-15));
  CHECK(c->sheet.quantities[0].overridden);
  auto e = calc(sheet, {"d = 2 * 7 mm"});
  CHECK(si(*e, "d") == Approx(0.014).epsilon(1e-15));
  CHECK(diagnostics(*calc(sheet, {"D=10 mm"})) == "--set:1:1: error: --set: the worksheet defines no quantity `D`; did you mean `d`?\n");
  CHECK(diagnostics(*calc(sheet, {"d"})) == "--set:1:1: error: --set takes NAME=VALUE, as in --set \"d=10 mm\"\n");
  CHECK(diagnostics(*calc(sheet, {"d=10 mmm"})).rfind("--set:1:6: error: unknown unit `mmm`", 0) == 0);
  CHECK(diagnostics(*calc("d [mm] = 20 mm\n", {"d=10 s"})) ==
        "sheet.calc:1:4: error: `d` is declared in [mm], length (mm), but its formula gives time (s)\n");
}

TEST_CASE("a formula too long for the arithmetic engine is an error, not an internal failure", "[calc][diagnostics]") {
  std::string sum = "a = 1.123456789 mm";
  for (int i = 0; i < 3000; ++i) sum += " + 1.123456789 mm";
  const std::string d = diagnostics(*calc(sum + "\n"));
  CHECK(d.rfind("sheet.calc:1:5: error: `a` is too long to compile (", 0) == 0);
  CHECK(d.find("split it into named steps") != std::string::npos);
}

TEST_CASE("a check side too long for the arithmetic engine gets the length error, as a formula does",
          "[calc][diagnostics]") {
  std::string sum = "1.123456789 mm";
  for (int i = 0; i < 3000; ++i) sum += " + 1.123456789 mm";
  const std::string d = diagnostics(*calc("a = 1 mm\ncheck big: " + sum + " > a\n"));
  CHECK(d.rfind("sheet.calc:2:12: error: a side of the check `big` is too long to compile (", 0) == 0);
  CHECK(d.find("split it into named steps") != std::string::npos);
  CHECK(d.find("not a finite number") == std::string::npos);
}

TEST_CASE("an override with --set may read other quantities, and the sheet shows it as given", "[calc][set]") {
  auto c = calc("d = 20 mm\nL = 100 mm\nA = d * L\n", {"d = L / 4"});
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "d") == Approx(0.025).epsilon(1e-15));
  CHECK(si(*c, "A") == Approx(0.0025).epsilon(1e-15));
  const Quantity& d = c->sheet.quantities[0];
  CHECK(d.overridden);
  CHECK(d.overrideText() == " L / 4");
  CHECK(renderExpr(*d.expr) == "L / 4");
  CHECK_FALSE(c->isInput(0));
  // The model keeps the worksheet's own formula.
  CHECK(renderExpr(c->model->formulaExpr(c->model->find("d"))) == "20 mm");
}

TEST_CASE("what a quantity shows is read from the stages, a --set changing only its own slot", "[calc][set]") {
  auto c = calc("a = 2000 N\nb = a * 2\nw = 10 mm\ns = b / w\ncheck ok: b < 50 kN\n", {"b = 20 kN"});
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  REQUIRE(c->quantityCount() == 4);
  const Slot b = c->model->find("b");
  // The model, built before --set, shows b as calculated, in the unit of a's.
  REQUIRE_FALSE(c->model->slot(b).input);
  REQUIRE(c->model->slot(b).display->text == "N");
  // The --set literal makes it a given value, shown in the unit it was written in.
  CHECK(c->isInput(b.index()));
  CHECK(c->display(b.index()).text == "kN");
  CHECK(c->quantity(b.index()).display.text == "kN");
  CHECK(c->si(b.index()) == 20000.0);
  // Every other slot is the model's, with the results' values.
  for (const char* name : {"a", "w", "s"}) {
    const Slot s = c->model->find(name);
    INFO(name);
    CHECK(&c->display(s.index()) == c->model->slot(s).display);
    CHECK(c->isInput(s.index()) == c->model->slot(s).input);
    CHECK(c->ok(s.index()));
    CHECK(c->si(s.index()) == c->results.value(s));
  }
  CHECK(c->si(c->model->find("s").index()) == Approx(2e6).epsilon(1e-15));
  REQUIRE(c->checkCount() == 1);
  CHECK(c->checkResult(0).ok);
  CHECK(c->checkResult(0).passed);
  CHECK(c->check(0).lhs == 20000.0);
  CHECK(c->check(0).rhs == 50000.0);
  CHECK(c->checkDisplay(0).text == c->model->checks()[0].display.text);
  // No --set formula reads another quantity: the model's order.
  CHECK(&c->order() == &c->model->order());
}

TEST_CASE("a --set that reads another quantity evaluates in the order its Inputs worked out", "[calc][set]") {
  auto c = calc("x = 1 mm\ny = 2 mm\nz = x + y\n", {"x = y * 3"});
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  REQUIRE(c->inputs->readsSlots());
  CHECK(&c->order() == &c->inputs->order());
  CHECK(c->order() == std::vector<Slot>{Slot(1), Slot(0), Slot(2)});
  CHECK_FALSE(c->isInput(0));
  CHECK(si(*c, "z") == Approx(0.008).epsilon(1e-15));
}

TEST_CASE("a worksheet with errors shows no value and no check result", "[calc][diagnostics]") {
  SECTION("an error found before evaluation: nothing is evaluated") {
    auto c = calc("a = 2 mm\nb = a + 1 s\ncheck big: a > 1 m\n");
    REQUIRE(c->hasErrors());
    REQUIRE(c->results.values.empty());
    REQUIRE(c->quantityCount() == 2);
    for (size_t i = 0; i < c->quantityCount(); ++i) {
      CHECK_FALSE(c->ok(i));
      CHECK(c->si(i) == 0.0);
    }
    CHECK_FALSE(c->checkResult(0).ok);
    CHECK_FALSE(c->checkResult(0).passed);
  }
  SECTION("a fault in evaluation: the faulted quantity has no value, the checks are not evaluated") {
    auto c = calc("a = 2 mm\nb = a / (a - a)\ncheck big: a > 1 m\n");
    REQUIRE(c->hasErrors());
    CHECK(c->ok(0));
    CHECK(c->si(0) == 0.002);
    CHECK_FALSE(c->ok(1));
    CHECK(c->si(1) == 0.0);
    const CheckView k = c->check(0);
    CHECK_FALSE(k.ok);
    CHECK_FALSE(k.passed);
    CHECK(k.lhs == 0.0);
    CHECK(k.rhs == 0.0);
    CHECK(c->failedChecks() == 0);
    CHECK(&k.display == &c->model->checks()[0].display);
  }
}

TEST_CASE("a file that cannot be read has no quantities, checks or order", "[calc][diagnostics]") {
  auto c = Calculation::fromFile("no-such-dir/no-such-sheet.calc");
  REQUIRE(c->hasErrors());
  CHECK(c->model == nullptr);
  CHECK(c->quantityCount() == 0);
  CHECK(c->checkCount() == 0);
  CHECK(c->order().empty());
  CHECK(c->allChecksPass());
}
