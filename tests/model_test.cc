// engine/model/model: building a model once from a parsed sheet: slots,
// dimensions and display units, the order, the compiled programs, the
// library passed in, and no change to the model by evaluating it.
#include "engine/model/model.h"

#include <catch2/catch.hpp>
#include <cstring>
#include <memory>
#include <string>

#include "engine/model/evaluate.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/util/math_constants.h"

using namespace calctrail;

namespace {
std::unique_ptr<const Model> build(const std::string& text, Diagnostics* diags,
                                   const std::vector<FunctionDecl>& library = functionLibrary()) {
  return Model::build(parseSheet(std::make_shared<SourceFile>("m.calc", text), diags), diags, library);
}

std::string headlines(const Diagnostics& diags) {
  std::string out;
  for (const Diagnostic& d : diags.list()) out += d.headline() + "\n";
  return out;
}
}  // namespace

TEST_CASE("model: every quantity has a slot with its dimension, unit and role", "[model]") {
  Diagnostics diags;
  auto m = build("T [N*m] = F * d / 2\nF = 2 kN\nd = 30 mm\nn = 1450 rpm\nP = T * n\n", &diags);
  INFO(headlines(diags));
  REQUIRE_FALSE(diags.hasErrors());
  REQUIRE(m->slotCount() == 5);
  const Slot T = m->find("T"), F = m->find("F"), P = m->find("P");
  CHECK(T == Slot(0));
  CHECK(F == Slot(1));
  CHECK_FALSE(m->find("nothing").valid());
  CHECK(m->slot(T).dim == Dimension::exponents(2, 1, -2));
  CHECK(m->slot(T).declared);
  CHECK(m->slot(T).display->text == "N*m");
  CHECK(m->slot(F).display->text == "kN");  // a lone literal keeps the unit it was written in
  CHECK(m->slot(F).input);
  CHECK_FALSE(m->slot(T).input);
  CHECK(m->slot(P).dim == Dimension::exponents(2, 1, -3));  // N*m*rad/s is W: the angle dropped
  CHECK(m->slot(P).display->text == "W");
  // Dependencies first; ties in sheet order.
  REQUIRE(m->order().size() == 5);
  CHECK(m->rank(F) < m->rank(T));
  CHECK(m->rank(T) < m->rank(P));
  // Each formula is compiled once, over slots.
  CHECK(m->slot(T).formula.text == "v0*v1/2");  // parentheses only where muparser needs them
  CHECK(m->slot(T).formula.inputs == std::vector<int>{1, 2});
  CHECK(m->slot(F).formula.text == "2000");
}

TEST_CASE("model: checks are compiled with the slots they read", "[model]") {
  Diagnostics diags;
  auto m = build("a = 2 mm\nb = 3 mm\ncheck fits: a + 1 mm <= b\n", &diags);
  REQUIRE_FALSE(diags.hasErrors());
  REQUIRE(m->checks().size() == 1);
  const CheckInfo& c = m->checks()[0];
  CHECK(c.has_dim);
  CHECK(c.compiled);
  CHECK(c.display.text == "mm");
  CHECK(c.reads == std::vector<Slot>{m->find("a"), m->find("b")});
}

TEST_CASE("model: building reports every problem, as the calculation did", "[model][diagnostics]") {
  Diagnostics diags;
  build("a = b + 1\nc = d\nd = c\nx [mm] = 2 s\n", &diags);
  diags.sort();
  CHECK(headlines(diags) ==
        "m.calc:1:5: error: unknown name `b`; define it with `b = ...`\n"
        "m.calc:2:1: error: a cycle: c -> d -> c (2 quantities depend on each other; each needs the others' "
        "values first)\n"
        "m.calc:4:4: error: `x` is declared in [mm], length (mm), but its formula gives time (s)\n");
}

TEST_CASE("model: a check side too long to compile says so, as a formula does", "[model][diagnostics]") {
  std::string sum = "1.123456789 mm";
  for (int i = 0; i < 3000; ++i) sum += " + 1.123456789 mm";
  Diagnostics diags;
  auto m = build("a = 1 mm\ncheck big: a < " + sum + "\n", &diags);
  const std::string d = headlines(diags);
  CHECK(d.rfind("m.calc:2:16: error: a side of the check `big` is too long to compile (", 0) == 0);
  CHECK(d.find("split it into named steps") != std::string::npos);
  CHECK(d.find("not a finite number") == std::string::npos);
  CHECK_FALSE(m->checks()[0].compiled);
}

TEST_CASE("model: evaluating never changes the model: two inputs, then the first again", "[model][inputs]") {
  Diagnostics diags;
  auto m = build("d = 20 mm\nA [mm^2] = pi * d^2 / 4\ncheck small: A < 1000 [mm^2]\n", &diags);
  REQUIRE_FALSE(diags.hasErrors());
  const std::string formula_before = m->slot(m->find("A")).formula.text;
  const Dimension dim_before = m->formulaDims(m->find("A")).of(m->formulaExpr(m->find("A")));
  const Inputs nominal(*m);
  Inputs bigger(*m);
  REQUIRE(bigger.set("d = 40 mm", &diags));
  const Results first = evaluate(*m, nominal);
  const Results second = evaluate(*m, bigger);
  const Results again = evaluate(*m, nominal);
  const Slot A = m->find("A");
  CHECK(first.value(A) == Approx(kPi * 0.02 * 0.02 / 4));
  CHECK(second.value(A) == Approx(kPi * 0.04 * 0.04 / 4));
  CHECK(first.checks[0].passed);
  CHECK_FALSE(second.checks[0].passed);
  CHECK(std::memcmp(first.values.data(), again.values.data(), first.values.size() * sizeof(double)) == 0);
  CHECK(again.checks[0].passed);
  CHECK(m->slot(A).formula.text == formula_before);
  CHECK(m->formulaDims(A).of(m->formulaExpr(A)) == dim_before);
  CHECK(m->sheet().quantities[0].expr->text == "20");
  CHECK_FALSE(m->sheet().quantities[0].overridden);
}

TEST_CASE("model: the function library is passed in", "[model]") {
  // A library of one function, of our own: twice(x) = 2x, for any length.
  std::vector<FunctionDecl> library(1);
  library[0].name = "twice";
  library[0].args = {fn::arg("x", Dimension::of(Base::Length), "a length")};
  library[0].result = Dimension::of(Base::Length);
  library[0].eval = [](const double* a) { return 2 * a[0]; };
  Diagnostics diags;
  auto m = build("a = 3 mm\nb = twice(a)\n", &diags, library);
  INFO(headlines(diags));
  REQUIRE_FALSE(diags.hasErrors());
  CHECK(&m->library() == &library);
  const Results r = evaluate(*m, Inputs(*m));
  CHECK(r.value(m->find("b")) == 0.006);
  // The standard library's functions are unknown to this model.
  Diagnostics other;
  build("a = 3 mm\nb = lead_angle(a, a)\n", &other, library);
  CHECK(headlines(other).find("unknown function `lead_angle`") != std::string::npos);
}
