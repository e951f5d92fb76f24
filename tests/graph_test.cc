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
  g.finish();
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
  g.finish();
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
  g.finish();
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
  g.finish();
  CHECK(g.downstream(0) == std::vector<int>{0, 1, 2, 3});
  CHECK(g.downstream(1) == std::vector<int>{1, 2});
  CHECK(g.downstream(4) == std::vector<int>{4});
  CHECK(g.upstream(2) == std::vector<int>{0, 1, 2});
}

TEST_CASE("a 100k-long chain is walked without recursion", "[graph]") {
  const int n = 100000;
  DependencyGraph g(n);
  for (int i = 1; i < n; ++i) g.addUse(i, i - 1);
  g.finish();
  const std::vector<int> order = g.order();
  REQUIRE(order.size() == static_cast<size_t>(n));
  CHECK(order.front() == 0);
  CHECK(order.back() == n - 1);
  CHECK(g.downstream(n - 2).size() == 2);
  // A 100k cycle is found, too.
  g.addUse(0, n - 1);
  std::vector<std::vector<int>> cycles;
  g.finish();
  CHECK(g.order(&cycles).empty());
  REQUIRE(cycles.size() == 1);
  CHECK(cycles[0].size() == static_cast<size_t>(n));
}

TEST_CASE("the worksheet's graph gives the downstream cone of an input", "[graph][calc]") {
  auto c = test::calc("d = 40 mm\np = 7 mm\nd_m = d - p / 2\nd_r = d - p\nA = pi * d_r^2 / 4\nW = 3 kN\n");
  REQUIRE_FALSE(c->hasErrors());
  std::vector<std::string> names;
  for (int i : c->model->graph().downstream(c->sheet.find("p"))) names.push_back(c->sheet.quantities[i].name);
  CHECK(names == std::vector<std::string>{"p", "d_m", "d_r", "A"});
}

TEST_CASE("one cycle through 300k quantities names every member in order along the loop", "[graph][perf]") {
  const int n = 300000;
  DependencyGraph g(n + 1);
  for (int i = 0; i < n; ++i) g.addUse(i, (i + 1) % n);  // 0 uses 1 uses 2 ... uses n-1 uses 0
  g.addUse(n, 5);                                        // downstream of the cycle
  std::vector<std::vector<int>> cycles;
  g.finish();
  CHECK(g.order(&cycles).empty());
  REQUIRE(cycles.size() == 1);
  REQUIRE(cycles[0].size() == static_cast<size_t>(n));
  bool in_order = true;
  for (int i = 0; i < n; ++i) in_order = in_order && cycles[0][static_cast<size_t>(i)] == i;
  CHECK(in_order);
}

TEST_CASE("150k two-member cycles are each found, in node order", "[graph][perf]") {
  const int n = 300000;
  DependencyGraph g(n + 2);
  for (int i = 0; i < n; i += 2) {
    g.addUse(i + 1, i);  // a pair in the order the sheet writes b = a, a = b
    g.addUse(i, i + 1);
  }
  g.addUse(n + 1, n);  // a small healthy chain beside them
  std::vector<std::vector<int>> cycles;
  g.finish();
  CHECK(g.order(&cycles) == std::vector<int>{n, n + 1});
  REQUIRE(cycles.size() == static_cast<size_t>(n / 2));
  bool all = true;
  for (int k = 0; k < n / 2; ++k)
    all = all && cycles[static_cast<size_t>(k)] == std::vector<int>{2 * k, 2 * k + 1};
  CHECK(all);
}

TEST_CASE("cycles of every size and knots together: each named whole, sorted by first member", "[graph]") {
  // 0..2 a triangle entered at 1; 3 a self-loop; 4 <-> 5 and 5 -> 6 -> 4 (a knot); 7 alone; 8 uses the knot.
  DependencyGraph g(9);
  g.addUse(2, 1);
  g.addUse(1, 0);
  g.addUse(0, 2);  // 0 uses 2 uses 1 uses 0
  g.addUse(3, 3);
  g.addUse(4, 5);
  g.addUse(5, 4);
  g.addUse(5, 6);
  g.addUse(6, 4);
  g.addUse(8, 6);
  std::vector<std::vector<int>> cycles;
  g.finish();
  CHECK(g.order(&cycles) == std::vector<int>{7});
  REQUIRE(cycles.size() == 3);
  CHECK(cycles[0] == std::vector<int>{0, 2, 1});
  CHECK(cycles[1] == std::vector<int>{3});
  CHECK(cycles[2] == std::vector<int>{4, 5, 6});
  // The same graph asked twice gives the same answer: no scratch state is left behind.
  std::vector<std::vector<int>> again;
  g.order(&again);
  CHECK(again == cycles);
}

TEST_CASE("a repeated use is kept once, however the uses of formulas are interleaved", "[graph]") {
  DependencyGraph g(4);
  g.addUse(1, 0);
  g.addUse(2, 0);
  g.addUse(1, 0);  // back to 1: still a repeat
  g.addUse(1, 3);
  g.addUse(2, 3);
  g.addUse(2, 0);
  g.finish();
  CHECK(g.uses(1).toVector() == std::vector<int>{0, 3});
  CHECK(g.uses(2).toVector() == std::vector<int>{0, 3});
  CHECK(g.usedBy(0).toVector() == std::vector<int>{1, 2});
  CHECK(g.usedBy(3).toVector() == std::vector<int>{1, 2});
}

TEST_CASE("one formula of 200k distinct names, each used twice, keeps each use once", "[graph][perf]") {
  const int n = 200000;
  DependencyGraph g(n + 1);
  for (int round = 0; round < 2; ++round)
    for (int i = 0; i < n; ++i) g.addUse(n, i);
  g.finish();
  CHECK(g.uses(n).size() == static_cast<size_t>(n));
  const std::vector<int> order = g.order();
  REQUIRE(order.size() == static_cast<size_t>(n + 1));
  CHECK(order.back() == n);
}

TEST_CASE("a worksheet cycle through 20k quantities names every one of them in order", "[graph][calc]") {
  const int n = 20000;
  std::string sheet, expected = "a cycle: ";
  for (int i = 0; i < n; ++i) {
    sheet += "x" + std::to_string(i) + " = x" + std::to_string((i + 1) % n) + " + 1 mm\n";
    expected += "x" + std::to_string(i) + " -> ";
  }
  expected += "x0 (" + std::to_string(n) + " quantities depend on each other";
  const std::string d = test::diagnostics(*test::calc(sheet));
  CHECK(d.find(expected) != std::string::npos);
}
