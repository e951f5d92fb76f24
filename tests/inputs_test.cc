// engine/model/inputs: replacements bound to slots, parsed and checked
// against the model (name, dimension, twice), layered over a parent, and
// never written into the model.
#include "engine/model/inputs.h"

#include <catch2/catch.hpp>
#include <memory>
#include <string>

#include "engine/model/evaluate.h"
#include "engine/sheet/sheet_parser.h"

using namespace calctrail;

namespace {
std::unique_ptr<const Model> build(const std::string& text) {
  Diagnostics diags;
  auto m = Model::build(parseSheet(std::make_shared<SourceFile>("i.calc", text), &diags), &diags);
  REQUIRE_FALSE(diags.hasErrors());
  return m;
}

std::string headlines(const Diagnostics& diags) {
  std::string out;
  for (const Diagnostic& d : diags.list()) out += d.headline() + "\n";
  return out;
}

const char* kSheet = "d = 20 mm\nL [mm] = 100 mm\nk = 2\nA = d * L * k\n";
}  // namespace

TEST_CASE("inputs: a literal binds to its slot as an SI value", "[inputs]") {
  auto m = build(kSheet);
  Inputs in(*m);
  Diagnostics diags;
  REQUIRE(in.set("d = 2 * 7 mm", &diags));
  const Binding* b = in.find(m->find("d"));
  REQUIRE(b);
  CHECK(b->text == " 2 * 7 mm");
  CHECK_FALSE(b->reads_slots);
  CHECK(b->value == Approx(0.014).epsilon(1e-15));
  CHECK(in.find(m->find("L")) == nullptr);
  CHECK(evaluate(*m, in).value(m->find("A")) == Approx(0.014 * 0.1 * 2).epsilon(1e-15));
}

TEST_CASE("inputs: an unknown name suggests the nearest", "[inputs][diagnostics]") {
  auto m = build(kSheet);
  Inputs in(*m);
  Diagnostics diags;
  CHECK_FALSE(in.set("D=10 mm", &diags));
  CHECK_FALSE(in.set("d", &diags));
  CHECK_FALSE(in.set("d = 2 * kk", &diags));
  CHECK(headlines(diags) ==
        "--set:1:1: error: --set: the worksheet defines no quantity `D`; did you mean `d`?\n"
        "--set:1:1: error: --set takes NAME=VALUE, as in --set \"d=10 mm\"\n"
        "--set:1:9: error: unknown name `kk`; did you mean `k`?\n");
  CHECK(in.own().empty());
}

TEST_CASE("inputs: the dimension must match the quantity's", "[inputs][diagnostics]") {
  auto m = build(kSheet);
  Inputs in(*m);
  Diagnostics diags;
  CHECK_FALSE(in.set("L = 3 s", &diags));  // declared: the sheet's own message, at its unit
  CHECK_FALSE(in.set("d = 3 s", &diags));  // undeclared: the formulas that read it expect a length
  CHECK(headlines(diags) ==
        "i.calc:2:4: error: `L` is declared in [mm], length (mm), but its formula gives time (s)\n"
        "--set:1:5: error: --set: `d` is length (mm) in the worksheet, but the value given is time (s)\n");
  CHECK(in.own().empty());
}

TEST_CASE("inputs: a name given twice in one layer is an error, a child layer hides its parent", "[inputs]") {
  auto m = build(kSheet);
  Diagnostics diags;
  Inputs base(*m);  // a load case, say
  REQUIRE(base.set("d=30 mm", &diags));
  REQUIRE(base.set("k=3", &diags));
  CHECK_FALSE(base.set("d=40 mm", &diags));
  CHECK(headlines(diags) == "--set:1:1: error: --set gives `d` twice\n");
  Inputs over(*m, &base);  // a --set over the case
  REQUIRE(over.set("d=50 mm", &diags));
  CHECK(over.find(m->find("d"))->value == Approx(0.05));
  CHECK(over.find(m->find("k"))->value == 3);  // from the parent
  CHECK(base.find(m->find("d"))->value == Approx(0.03));
  const Slot A = m->find("A");
  CHECK(evaluate(*m, over).value(A) == Approx(0.05 * 0.1 * 3));
  CHECK(evaluate(*m, base).value(A) == Approx(0.03 * 0.1 * 3));
  CHECK(evaluate(*m, Inputs(*m)).value(A) == Approx(0.02 * 0.1 * 2));
}

TEST_CASE("inputs: bind replaces a value without text", "[inputs]") {
  auto m = build(kSheet);
  Inputs in(*m);
  in.bind(m->find("k"), 4);
  in.bind(m->find("k"), 5);  // a sweep's next point
  REQUIRE(in.own().size() == 1);
  CHECK(evaluate(*m, in).value(m->find("A")) == Approx(0.02 * 0.1 * 5));
}

TEST_CASE("inputs: an expression over other quantities is evaluated after them", "[inputs]") {
  // d comes first in the sheet; bound to L / 4 it must wait for L.
  auto m = build(kSheet);
  Inputs in(*m);
  Diagnostics diags;
  REQUIRE(in.set("d = L / 4", &diags));
  REQUIRE(in.readsSlots());
  const Results r = evaluate(*m, in);
  CHECK(r.value(m->find("d")) == Approx(0.025));
  CHECK(r.value(m->find("A")) == Approx(0.025 * 0.1 * 2));
  // A replacement that would read its own value, through others, is refused.
  Inputs loop(*m);
  CHECK_FALSE(loop.set("k = A / 1 [mm^2]", &diags));
  CHECK(headlines(diags).find("--set: `k` would depend on its own value") != std::string::npos);
}

TEST_CASE("inputs: a value that cannot be calculated is explained when bound", "[inputs][diagnostics]") {
  auto m = build(kSheet);
  Inputs in(*m);
  Diagnostics diags;
  CHECK_FALSE(in.set("k = 1 / (2 - 2)", &diags));
  CHECK(headlines(diags) ==
        "--set:1:5: error: `k` cannot be calculated: division by zero: the divisor is 0\n");
}
