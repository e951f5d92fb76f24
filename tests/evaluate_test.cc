// engine/model/evaluate: evaluation as a pure function of (Model, Inputs):
// the cone re-run equals a full evaluation bit for bit on every demo
// worksheet for every single-input change, and two threads evaluate one
// model at once.
#include "engine/model/evaluate.h"

#include <catch2/catch.hpp>
#include <cstring>
#include <memory>
#include <string>
#include <thread>
#include <vector>

#include "engine/eval/evaluator.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_loader.h"
#include "engine/util/sha256.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::readFile;
using calctrail::test::repoPath;

namespace {

// The demo's model with its templates expanded, as Calculation builds it.
std::unique_ptr<const Model> buildDemo(const std::string& name) {
  Diagnostics diags;
  const std::string path = repoPath("worksheets/" + name);
  const std::string bytes = readFile(path);
  Sheet sheet = parseSheet(std::make_shared<SourceFile>(name, bytes), &diags);
  TemplateCache cache;
  expandTemplates(&sheet, path, sha256Hex(bytes), diskSource(), &cache, &diags);
  auto m = Model::build(std::move(sheet), &diags);
  REQUIRE_FALSE(diags.hasErrors());
  return m;
}

// Equal bit for bit: values (NaN where both have none), checks, faults.
void requireSame(const Results& a, const Results& b) {
  REQUIRE(a.values.size() == b.values.size());
  CHECK(std::memcmp(a.values.data(), b.values.data(), a.values.size() * sizeof(double)) == 0);
  REQUIRE(a.checks.size() == b.checks.size());
  for (size_t k = 0; k < a.checks.size(); ++k) {
    CHECK(a.checks[k].ok == b.checks[k].ok);
    CHECK(a.checks[k].passed == b.checks[k].passed);
    CHECK(std::memcmp(&a.checks[k].lhs, &b.checks[k].lhs, sizeof(double)) == 0);
    CHECK(std::memcmp(&a.checks[k].rhs, &b.checks[k].rhs, sizeof(double)) == 0);
  }
  REQUIRE(a.faults.size() == b.faults.size());
  for (size_t k = 0; k < a.faults.size(); ++k) CHECK(a.faults[k].message == b.faults[k].message);
}

const char* kDemos[] = {"twin-screw-lift.calc", "canal-gate-hoist.calc", "leveling-jack.calc"};

}  // namespace

TEST_CASE("evaluate: the nominal evaluation equals the calculation's values", "[evaluate]") {
  for (const char* demo : kDemos) {
    INFO(demo);
    auto m = buildDemo(demo);
    const Results r = evaluate(*m, Inputs(*m));
    CHECK(r.faults.empty());
    auto calc = Calculation::fromFile(repoPath(std::string("worksheets/") + demo));
    REQUIRE_FALSE(calc->hasErrors());
    for (Slot s : m->order()) CHECK(r.value(s) == calc->si(s.index()));
    for (size_t k = 0; k < r.checks.size(); ++k) CHECK(r.checks[k].passed == calc->checkResult(k).passed);
  }
}

TEST_CASE("evaluate: the cone of every single-input change equals a full evaluation, bit for bit",
          "[evaluate][cone]") {
  const double factors[] = {0.5, 0.9, 1.1, 3.0, -1.0};  // -1: most leave their domain, and fault
  for (const char* demo : kDemos) {
    auto m = buildDemo(demo);
    const Inputs nominal(*m);
    Evaluation context(*m);
    const Results base = context.evaluate(nominal);
    REQUIRE(base.faults.empty());
    int inputs = 0, faulted = 0;
    for (Slot s : m->order()) {
      if (!m->slot(s).input) continue;
      ++inputs;
      for (double f : factors) {
        INFO(demo << ": " << m->quantity(s).name << " * " << f);
        Inputs point(*m, &nominal);
        point.bind(s, base.value(s) * f);
        const Results full = evaluate(*m, point);  // a fresh context, nothing reused
        Results cone = base;
        context.evaluateCone(point, &cone);
        requireSame(cone, full);
        requireSame(evaluateCone(*m, point, base), full);
        faulted += !full.faults.empty();
      }
    }
    INFO(demo);
    CHECK(inputs >= 10);
    CHECK(faulted > 0);                 // the faulting points were compared too
    CHECK(context.keptPrograms() > 0);  // formulas evaluated again were kept set
  }
}

TEST_CASE("evaluate: a formula called without muparser gives muparser's bits on every demo",
          "[evaluate][direct]") {
  int direct = 0;
  for (const char* demo : kDemos) {
    auto m = buildDemo(demo);
    const Results r = evaluate(*m, Inputs(*m));
    REQUIRE(r.faults.empty());
    Evaluator muparser;  // sets every program in muparser, whatever its form
    for (Slot s : m->order()) {
      const Program& p = m->slot(s).formula;
      if (!p.direct_call) continue;
      INFO(demo << ": " << m->quantity(s).name);
      const double v = muparser.run(p, r.values);
      CHECK(std::memcmp(&v, &r.values[s.index()], sizeof v) == 0);
      ++direct;
    }
  }
  CHECK(direct >= 30);
}

TEST_CASE("evaluate: repeated cone runs in one context stay equal to full evaluations", "[evaluate][cone]") {
  auto m = buildDemo("twin-screw-lift.calc");
  const Inputs nominal(*m);
  Evaluation context(*m);
  const Results base = context.evaluate(nominal);
  const Slot d = m->find("d"), mass = m->find("m_load");
  Inputs point(*m, &nominal);
  Results r = base;
  for (int i = 0; i < 20; ++i) {
    point.bind(i % 2 ? d : mass, base.value(i % 2 ? d : mass) * (1.0 + 0.01 * i));
    r = base;
    context.evaluateCone(point, &r);
    requireSame(r, evaluate(*m, point));
  }
}

TEST_CASE("evaluate: two threads evaluate one model at once", "[evaluate][threads]") {
  auto m = buildDemo("twin-screw-lift.calc");
  const Inputs nominal(*m);
  const Results base = evaluate(*m, nominal);
  const Slot slots[2] = {m->find("d"), m->find("m_load")};
  constexpr int kPoints = 200;
  // The expected results, one thread, one context per point.
  std::vector<Results> expected[2];
  for (int t = 0; t < 2; ++t) {
    for (int i = 0; i < kPoints; ++i) {
      Inputs point(*m, &nominal);
      point.bind(slots[t], base.value(slots[t]) * (0.8 + 0.002 * i));
      expected[t].push_back(evaluate(*m, point));
    }
  }
  std::vector<Results> got[2];
  auto work = [&](int t) {
    Evaluation context(*m);  // per thread: its parsers and slot array
    for (int i = 0; i < kPoints; ++i) {
      Inputs point(*m, &nominal);
      point.bind(slots[t], base.value(slots[t]) * (0.8 + 0.002 * i));
      Results r = base;
      if (i % 2)
        context.evaluateCone(point, &r);
      else
        r = context.evaluate(point);
      got[t].push_back(std::move(r));
    }
  };
  std::thread a(work, 0), b(work, 1);
  a.join();
  b.join();
  for (int t = 0; t < 2; ++t) {
    REQUIRE(got[t].size() == expected[t].size());
    for (int i = 0; i < kPoints; ++i) requireSame(got[t][i], expected[t][i]);
  }
}
