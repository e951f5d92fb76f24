// A trail's steps kept (a small sheet) or built each time a renderer reads
// one (a large sheet, engine/report/trail.h TrailSteps): both ways must give
// every format byte for byte, on every demo, with --set and per load case.
#include <catch2/catch.hpp>

#include <filesystem>
#include <string>
#include <vector>

#include "engine/report/formats.h"
#include "engine/report/trail.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::unique_ptr<Calculation> demoWith(const std::string& name, const CalcOptions& given = {}) {
  const std::string display = "worksheets/" + name + ".calc";
  CalcOptions options = given;
  options.source_path = repoPath(display);
  return Calculation::fromText(display, readFile(repoPath(display)), options);
}

std::vector<std::string> demoNames() {
  std::vector<std::string> names;
  for (const auto& e : std::filesystem::directory_iterator(repoPath("worksheets")))
    if (e.path().extension() == ".calc") names.push_back(e.path().stem().string());
  std::sort(names.begin(), names.end());
  return names;
}

void sameBothWays(const Calculation& c) {
  const Trail kept = buildTrail(c, 4, TrailKeep::All);
  const Trail built = buildTrail(c, 4, TrailKeep::None);
  REQUIRE(kept.steps.kept());
  REQUIRE_FALSE(built.steps.kept());
  REQUIRE(kept.steps.size() == c.sheet.quantities.size());
  REQUIRE(built.steps.size() == kept.steps.size());
  for (const ReportFormat& f : reportFormats()) {
    INFO("format " << f.name);
    CHECK(renderReport(kept, f.name) == renderReport(built, f.name));
  }
}

}  // namespace

TEST_CASE("trail steps built when read give every format the same bytes as kept steps", "[trail][report]") {
  const std::vector<std::string> names = demoNames();
  REQUIRE(names.size() >= 7);
  for (const std::string& name : names) {
    INFO("demo " << name);
    auto c = demoWith(name);
    REQUIRE_FALSE(c->hasErrors());
    sameBothWays(*c);
    // Each load case shown alone, as --case does.
    for (const LoadCase& lc : c->sheet.cases) {
      INFO("case " << lc.name);
      CalcOptions one;
      one.case_name = lc.name;
      auto alone = demoWith(name, one);
      REQUIRE_FALSE(alone->hasErrors());
      sameBothWays(*alone);
    }
  }
}

TEST_CASE("trail steps built when read: --set, warnings at steps and checks, failed values", "[trail][report]") {
  // --set: the modified notice, the replaced step, an undeclared unit chosen anew.
  auto set = demoWith("twin-screw-lift", [] {
    CalcOptions o;
    o.sets = {"f_run=0.15"};
    return o;
  }());
  REQUIRE_FALSE(set->hasErrors());
  sameBothWays(*set);
  // A warning at a step (a doubtful library argument) and a failing check.
  auto warned = calc(
      "F = 5 kN\nd_m = 30 mm\nl = 6 mm\nf = 0.9\n"
      "T [N*m] = torque_raise(F, d_m, l, f, 15 deg)\n"
      "check T_small: T < 1 [N*m]\n");
  INFO(diagnostics(*warned));
  REQUIRE_FALSE(warned->hasErrors());
  const Trail kept = buildTrail(*warned, 4, TrailKeep::All);
  REQUIRE_FALSE(kept.warnings.empty());
  CHECK(kept.warnings_at_steps > 0);
  sameBothWays(*warned);
}

TEST_CASE("a trail keeps the steps of a small sheet and builds those of a large one", "[trail][report]") {
  std::string small, large;
  for (size_t i = 0; i < kKeptSteps; ++i) small += "a" + std::to_string(i) + " = " + std::to_string(i) + " mm\n";
  large = small + "b = a0 * 2\n";
  auto s = calc(small), l = calc(large);
  REQUIRE_FALSE(s->hasErrors());
  REQUIRE_FALSE(l->hasErrors());
  const Trail ts = buildTrail(*s, 4), tl = buildTrail(*l, 4);
  CHECK(ts.steps.kept());
  CHECK_FALSE(tl.steps.kept());
  // Built when read, a step is the same each time and the same as kept.
  const Trail all = buildTrail(*l, 4, TrailKeep::All);
  const size_t b = static_cast<size_t>(l->sheet.find("b"));
  CHECK(tl.steps.get(b)->result.si == all.steps.get(b)->result.si);
  CHECK(lineText(tl.steps.get(b)->substituted) == "0 mm · 2");
  CHECK(lineText(all.steps.get(b)->substituted) == lineText(tl.steps.get(b)->substituted));
  CHECK_FALSE(tl.steps.isInput(b));
  CHECK(tl.steps.isInput(0));
  size_t inputs = 0;
  for (const TrailStep& st : tl.steps.inputs()) inputs += st.input ? 1 : 100;
  CHECK(inputs == kKeptSteps);
}

TEST_CASE("a step's head is the step without its explanation, kept or built when read", "[trail][report]") {
  for (const std::string& name : demoNames()) {
    INFO("demo " << name);
    auto c = demoWith(name);
    REQUIRE_FALSE(c->hasErrors());
    const Trail kept = buildTrail(*c, 4, TrailKeep::All);
    const Trail built = buildTrail(*c, 4, TrailKeep::None);
    size_t explained = 0;
    for (size_t i = 0; i < built.steps.size(); ++i) {
      INFO("step " << i);
      const TrailSteps::Held whole = kept.steps.get(i), head = built.steps.head(i);
      CHECK(built.steps.name(i) == whole->name);
      CHECK(kept.steps.name(i) == whole->name);
      CHECK(head->name == whole->name);
      CHECK(head->local_name == whole->local_name);
      CHECK(head->description == whole->description);
      CHECK(head->section == whole->section);
      CHECK(head->input == whole->input);
      CHECK(head->formula == whole->formula);
      CHECK(head->pretty == whole->pretty);
      CHECK(head->formula_in_notes == whole->formula_in_notes);
      CHECK(valueText(head->result) == valueText(whole->result));
      CHECK(head->result.si == whole->result.si);
      CHECK(head->given.has_value() == whole->given.has_value());
      CHECK(head->unit_written == whole->unit_written);
      CHECK(head->warnings == whole->warnings);
      CHECK(head->varies == whole->varies);
      CHECK(head->cases.size() == whole->cases.size());
      CHECK(head->in_part_table == whole->in_part_table);
      // What explaining adds is not in a head built when read; a kept step is whole.
      CHECK(head->origin.empty());
      CHECK(head->calls.empty());
      CHECK(head->substituted.empty());
      CHECK(kept.steps.head(i)->origin == whole->origin);
      explained += whole->origin.empty() ? 0 : 1;
    }
    CHECK(explained == built.steps.size());  // every whole step says where its value comes from
    // An instance's parameter rows, found without building the steps, are those of the kept steps.
    REQUIRE(built.instances.size() == kept.instances.size());
    for (size_t k = 0; k < kept.instances.size(); ++k) {
      const auto &a = kept.instances[k].params, &b = built.instances[k].params;
      REQUIRE(a.size() == b.size());
      for (size_t j = 0; j < a.size(); ++j) {
        INFO("parameter " << a[j].quantity);
        CHECK(a[j].name == b[j].name);
        CHECK(a[j].step == b[j].step);
        CHECK(a[j].binding == b[j].binding);
        CHECK(a[j].in_part_table == b[j].in_part_table);
        CHECK(a[j].quantity == b[j].quantity);
        CHECK(valueText(a[j].shown) == valueText(b[j].shown));
        CHECK(a[j].shown.si == b[j].shown.si);
        CHECK(valueText(a[j].result) == valueText(b[j].result));
        CHECK(a[j].unit_written == b[j].unit_written);
        CHECK(a[j].description == b[j].description);
        CHECK(a[j].overridden == b[j].overridden);
      }
    }
  }
}
