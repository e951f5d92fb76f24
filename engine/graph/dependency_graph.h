// The dependency graph of a worksheet: node i is quantity i, an edge a -> b
// means b's formula uses a. Evaluation order, cycles, and the cones up and
// down from a node (what a result depends on; what an edit touches). All
// walks are iterative, so a 100k-long chain cannot overflow the stack.
#pragma once

#include <cstddef>
#include <cstdint>
#include <utility>
#include <vector>

namespace calctrail {

// The nodes at one end of a node's edges: a range of a graph's edge array
// (or of a program's inputs), read-only.
class NodeList {
 public:
  NodeList(const int* begin, const int* end) : begin_(begin), end_(end) {}
  explicit NodeList(const std::vector<int>& v) : begin_(v.data()), end_(v.data() + v.size()) {}
  const int* begin() const { return begin_; }
  const int* end() const { return end_; }
  size_t size() const { return static_cast<size_t>(end_ - begin_); }
  bool empty() const { return begin_ == end_; }
  int operator[](size_t i) const { return begin_[i]; }
  std::vector<int> toVector() const { return std::vector<int>(begin_, end_); }

 private:
  const int* begin_;
  const int* end_;
};

class DependencyGraph {
 public:
  explicit DependencyGraph(int nodes);

  int size() const { return nodes_; }
  // `user` uses `used` in its formula. Repeated edges are kept once. O(1).
  void addUse(int user, int used);
  // Ends the adding: the edges go to two compressed arrays (offsets and
  // edges, each way), 4 bytes an edge and a node, where a vector per node
  // cost 24 bytes and an allocation (docs/performance.md, Memory). Every
  // query below needs it (a query before it throws std::logic_error);
  // adding after it starts again from the edges kept.
  void finish();
  // The nodes `node`'s formula uses, first use first; the nodes whose formulas use `node`.
  NodeList uses(int node) const;
  NodeList usedBy(int node) const;
  // Heap bytes held, for the benchmark's figures.
  size_t bytes() const;

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
  void requireFinished() const;
  int nodes_ = 0;
  // While adding: every edge (user, used) in the order added, repeats included.
  std::vector<std::pair<int, int>> adding_;
  bool finished_ = false;
  // uses_[uses_at_[v], uses_at_[v + 1]): the nodes v's formula uses, first use first.
  std::vector<uint32_t> uses_at_;
  std::vector<int> uses_;
  // used_by_[used_by_at_[v], used_by_at_[v + 1]): the nodes whose formulas use v, in the order added.
  std::vector<uint32_t> used_by_at_;
  std::vector<int> used_by_;
  mutable std::vector<int> rank_;  // position in order(), built on the first cone query
};

}  // namespace calctrail
