// The dependency graph: order, cycles, and the cones up and down from a node.
#include <catch2/catch.hpp>

#include "engine/graph/dependency_graph.h"
#include "tests/test_support.h"

using namespace calctrail;

TEST_CASE("order puts dependencies first, ties in node order", "[graph]") {
  DependencyGraph g(5);
  g.addUse(0, 3);  // 0 uses 3
  g.addUse(0, 1);
  g.addUse(1, 3);
  g.addUse(2, 4);
  g.addUse(2, 4);  // kept once
  CHECK(g.uses(2).size() == 1);
  std::vector<std::vector<int>> cycles;
  CHECK(g.order(&cycles) == std::vector<int>{3, 1, 0, 4, 2});
  CHECK(cycles.empty());
}

TEST_CASE("cycles are found with every member, downstream nodes are left out", "[graph]") {
  DependencyGraph g(6);
  g.addUse(0, 1);
  g.addUse(1, 2);
  g.addUse(2, 0);  // 0 -> 1 -> 2 -> 0
  g.addUse(3, 0);  // 3 is downstream of the cycle: no value, no cycle of its own
  g.addUse(4, 4);  // a self-loop
  std::vector<std::vector<int>> cycles;
  const std::vector<int> order = g.order(&cycles);
  CHECK(order == std::vector<int>{5});
  REQUIRE(cycles.size() == 2);
  CHECK(cycles[0] == std::vector<int>{0, 1, 2});
  CHECK(cycles[1] == std::vector<int>{4});
}

TEST_CASE("a strongly connected knot names members off the shortest loop too", "[graph]") {
  DependencyGraph g(4);
  g.addUse(0, 1);
  g.addUse(1, 0);
  g.addUse(1, 2);
  g.addUse(2, 3);
  g.addUse(3, 1);
  std::vector<std::vector<int>> cycles;
  g.order(&cycles);
  REQUIRE(cycles.size() == 1);
  CHECK(cycles[0] == std::vector<int>{0, 1, 2, 3});
}

TEST_CASE("the downstream cone is what an edit touches, the upstream cone what a result needs", "[graph]") {
  // d = 0, a = 1 (uses d), b = 2 (uses a), c = 3 (uses d), e = 4 (alone)
  DependencyGraph g(5);
  g.addUse(1, 0);
  g.addUse(2, 1);
  g.addUse(3, 0);
  CHECK(g.downstream(0) == std::vector<int>{0, 1, 2, 3});
  CHECK(g.downstream(1) == std::vector<int>{1, 2});
  CHECK(g.downstream(4) == std::vector<int>{4});
  CHECK(g.upstream(2) == std::vector<int>{0, 1, 2});
}

TEST_CASE("a 100k-long chain is walked without recursion", "[graph]") {
  const int n = 100000;
  DependencyGraph g(n);
  for (int i = 1; i < n; ++i) g.addUse(i, i - 1);
  const std::vector<int> order = g.order();
  REQUIRE(order.size() == static_cast<size_t>(n));
  CHECK(order.front() == 0);
  CHECK(order.back() == n - 1);
  CHECK(g.downstream(n - 2).size() == 2);
  // A 100k cycle is found, too.
  g.addUse(0, n - 1);
  std::vector<std::vector<int>> cycles;
  CHECK(g.order(&cycles).empty());
  REQUIRE(cycles.size() == 1);
  CHECK(cycles[0].size() == static_cast<size_t>(n));
}

TEST_CASE("the worksheet's graph gives the downstream cone of an input", "[graph][calc]") {
  auto c = test::calc("d = 40 mm\np = 7 mm\nd_m = d - p / 2\nd_r = d - p\nA = pi * d_r^2 / 4\nW = 3 kN\n");
  REQUIRE_FALSE(c->hasErrors());
  std::vector<std::string> names;
  for (int i : c->graph->downstream(c->sheet.find("p"))) names.push_back(c->sheet.quantities[i].name);
  CHECK(names == std::vector<std::string>{"p", "d_m", "d_r", "A"});
}
