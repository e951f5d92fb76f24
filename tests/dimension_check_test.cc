// engine/eval/dimension_check: the checker on its own, formula by formula,
// without evaluating anything: sums, powers, roots, math and library calls,
// and the angle rules that keep a 2*pi from going missing.
#include "engine/eval/dimension_check.h"

#include <catch2/catch.hpp>
#include <memory>
#include <string>

#include "engine/sheet/sheet_parser.h"

using namespace calctrail;

namespace {

struct Checked {
  bool ok = false;
  Dimension dim;         // of the last quantity's formula, when ok
  std::string messages;  // every diagnostic headline
};

// Checks every formula of `text` in document order (each may read the ones
// above it), and reports on the last.
Checked check(const std::string& text) {
  Diagnostics diags;
  Sheet sheet = parseSheet(std::make_shared<SourceFile>("dims.calc", text), &diags);
  const size_t n = sheet.quantities.size();
  std::vector<Dimension> dims(n);
  std::vector<char> known(n, 0);
  Checked out;
  for (size_t i = 0; i < n; ++i) {
    DimensionChecker checker(*sheet.file, &diags, sheet, dims, known);
    TreeDims tree;
    out.ok = checker.check(*sheet.quantities[i].expr, &tree);
    if (out.ok) {
      dims[i] = tree.of(*sheet.quantities[i].expr);
      known[i] = 1;
      out.dim = dims[i];
    }
  }
  for (const Diagnostic& d : diags.list()) out.messages += d.headline() + "\n";
  return out;
}

const Dimension kLength = Dimension::of(Base::Length);
const Dimension kAngle = Dimension::of(Base::Angle);

}  // namespace

TEST_CASE("dimension check: products, quotients and sums of alike dimensions", "[dimcheck]") {
  Checked c = check("F = 2 kN\nd = 30 mm\nT = F * d / 2\n");
  REQUIRE(c.ok);
  CHECK(c.dim == Dimension::exponents(2, 1, -2));  // N*m
  c = check("a = 1 m\nb = 2 mm\ns = a + b - 3 in\n");
  REQUIRE(c.ok);
  CHECK(c.dim == kLength);
}

TEST_CASE("dimension check: unlike sums are errors that name both dimensions", "[dimcheck]") {
  const Checked c = check("a = 1 m\nb = 2 s\nx = a + b\n");
  CHECK_FALSE(c.ok);
  CHECK(c.messages == "dims.calc:3:5: error: cannot add time (s) to length (mm)\n");
  CHECK(check("a = 1 m\nb = 2 s\nx = a - b\n").messages ==
        "dims.calc:3:5: error: cannot subtract time (s) from length (mm)\n");
}

TEST_CASE("dimension check: an angle plus a plain number is allowed, with a warning", "[dimcheck][angles]") {
  const Checked c = check("x = 1 rad + 2\n");
  CHECK(c.ok);
  CHECK(c.messages.find("warning: adds angle") != std::string::npos);
  CHECK(c.messages.find("check that no 2*pi is missing") != std::string::npos);
}

TEST_CASE("dimension check: powers and roots keep whole exponents", "[dimcheck]") {
  Checked c = check("A = 4 [mm^2]\nd = A^0.5\n");
  REQUIRE(c.ok);
  CHECK(c.dim == kLength);
  c = check("A = 4 [mm^2]\nd = sqrt(A)\n");
  REQUIRE(c.ok);
  CHECK(c.dim == kLength);
  c = check("d = 2 mm\nV = d^(1 + 2)\n");  // a constant exponent is folded
  REQUIRE(c.ok);
  CHECK(c.dim == Dimension::of(Base::Length, 3));
  CHECK(
      check("d = 2 mm\nr = d^0.5\n").messages ==
      "dims.calc:2:5: error: raising length (mm) to the power 0.5 gives no dimension with whole exponents\n");
  CHECK(check("d = 2 mm\nk = 2\nr = d^k\n").messages.find("the exponent must be a fixed number") !=
        std::string::npos);
  CHECK(check("d = 2 mm\nr = 2^d\n").messages.find("an exponent must be a plain number") !=
        std::string::npos);
  CHECK(check("d = 2 mm\nr = sqrt(d)\n").messages.find("only even powers have a square root") !=
        std::string::npos);
}

TEST_CASE("dimension check: math functions take and give the dimensions the contract says", "[dimcheck]") {
  Checked c = check("a = 30 deg\ns = sin(a)\n");
  REQUIRE(c.ok);
  CHECK(c.dim.dimensionless());
  c = check("t = asin(0.5)\n");
  REQUIRE(c.ok);
  CHECK(c.dim == kAngle);
  c = check("y = 1 mm\nx = 2 mm\nt = atan2(y, x)\n");
  REQUIRE(c.ok);
  CHECK(c.dim == kAngle);
  CHECK(
      check("d = 1 mm\ns = sin(d)\n").messages.find("`sin` takes an angle (or plain radians), not length") !=
      std::string::npos);
  CHECK(check("d = 1 mm\ns = ln(d)\n").messages.find("`ln` takes a plain number") != std::string::npos);
  CHECK(check("d = 1 mm\nt = 1 s\ns = max(d, t)\n").messages.find("argument 2 is time") != std::string::npos);
  CHECK(check("s = min(1)\n").messages.find("`min` takes at least 2 arguments, not 1") != std::string::npos);
  CHECK(check("s = sqroot(4)\n").messages.find("unknown function `sqroot`; did you mean `sqrt`?") !=
        std::string::npos);
}

TEST_CASE("dimension check: library arguments, and leads per revolution", "[dimcheck][angles]") {
  // lead_angle(dm, l): l is a lead, given plain or per revolution.
  CHECK(check("dm = 30 mm\nl = 6 mm\nx = lead_angle(dm, l)\n").ok);
  CHECK(check("dm = 30 mm\nl = 6 [mm/rev]\nx = lead_angle(dm, l)\n").ok);
  const Checked c = check("dm = 30 mm\nl = 6 s\nx = lead_angle(dm, l)\n");
  CHECK_FALSE(c.ok);
  CHECK(c.messages.find("argument 2 of `lead_angle`") != std::string::npos);
  CHECK(c.messages.find("or a length per revolution, not time (s)") != std::string::npos);
  CHECK(check("x = lead_angle(1 mm)\n").messages.find("`lead_angle` takes 2 arguments (dm, l), not 1") !=
        std::string::npos);
}

TEST_CASE("dimension check: the helpers for sums, stray angles, work and power", "[dimcheck][angles]") {
  bool incompatible = true;
  CHECK(compareForSum(kLength, kLength, &incompatible).empty());
  CHECK_FALSE(incompatible);
  CHECK(compareForSum(kLength, Dimension::of(Base::Time), &incompatible).empty());
  CHECK(incompatible);
  const Dimension torque = Dimension::exponents(2, 1, -2);
  CHECK(workOrPower(torque * kAngle));                                // T*theta is work
  CHECK(workOrPower(Dimension::exponents(2, 1, -3, 0, 0, 0, 0, 1)));  // T*omega is power
  CHECK_FALSE(workOrPower(kLength));
  CHECK(strayAngleWarning("n", Dimension::exponents(0, 0, -1, 0, 0, 0, 0, 1)).empty());  // rpm
  CHECK(strayAngleWarning("l", kLength / kAngle).empty());                               // a lead per rev
  CHECK(strayAngleWarning("v", Dimension::exponents(1, 0, -1, 0, 0, 0, 0, 1)).find("2*pi too large") !=
        std::string::npos);
  CHECK(strayAngleWarning("x", kLength * kAngle).find("stray angle") != std::string::npos);
}

TEST_CASE("dimension check: constant exponents fold only numbers, pi and arithmetic", "[dimcheck]") {
  Diagnostics diags;
  Sheet sheet = parseSheet(
      std::make_shared<SourceFile>("c.calc", "a = (1 + 2) * 3 / 4\nb = a * 2\nc = 1 / 0\n"), &diags);
  double v = 0;
  REQUIRE(constantValue(*sheet.quantities[0].expr, &v));
  CHECK(v == 2.25);
  CHECK_FALSE(constantValue(*sheet.quantities[1].expr, &v));  // reads a name
  CHECK_FALSE(constantValue(*sheet.quantities[2].expr, &v));  // not finite
}
