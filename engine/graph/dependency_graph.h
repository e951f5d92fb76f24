// The dependency graph of a worksheet: node i is quantity i, an edge a -> b
// means b's formula uses a. Evaluation order, cycles, and the cones up and
// down from a node (what a result depends on; what an edit touches). All
// walks are iterative, so a 100k-long chain cannot overflow the stack.
#pragma once

#include <vector>

namespace calctrail {

class DependencyGraph {
 public:
  explicit DependencyGraph(int nodes);

  int size() const { return static_cast<int>(uses_.size()); }
  // `user` uses `used` in its formula. Repeated edges are kept once. O(1)
  // amortized when the uses of one user are added together, as a formula's are.
  void addUse(int user, int used);
  const std::vector<int>& uses(int node) const { return uses_[node]; }
  const std::vector<int>& usedBy(int node) const { return used_by_[node]; }

  // Every node whose inputs can all be evaluated, dependencies first; ties in
  // node order, so the order is stable. Nodes on a cycle, or downstream of
  // one, are left out; each cycle found goes to *cycles as its members in
  // order along the loop (first member repeated at the end is implied),
  // starting at its least member; members off that shortest loop (a knot of
  // loops) follow it in node order. Cycles are sorted by first member.
  // O((nodes + edges) log nodes), however many cycles and however long.
  std::vector<int> order(std::vector<std::vector<int>>* cycles = nullptr) const;

  // The downstream cone: `node` and everything that depends on it, directly or
  // not, in evaluation order. What to recalculate after `node` changes.
  std::vector<int> downstream(int node) const;
  // The upstream cone: `node` and everything it depends on, in evaluation order.
  std::vector<int> upstream(int node) const;

 private:
  std::vector<int> reach(int node, bool down) const;
  std::vector<std::vector<int>> uses_;     // uses_[v]: the nodes v's formula uses, first use first
  std::vector<std::vector<int>> used_by_;  // used_by_[v]: the nodes whose formulas use v
  std::vector<int> mark_;    // mark_[w] == marked_user_: marked_user_ already uses w
  int marked_user_ = -1;     // the user whose uses mark_ holds; -1 before the first edge
  mutable std::vector<int> rank_;  // position in order(), built on the first cone query
};

}  // namespace calctrail
