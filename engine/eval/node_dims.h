// What the dimension check finds about a tree, kept apart from the tree:
// the dimension of every node, by Expr::id. The parse tree is never written
// after parsing; the Model owns the dimensions of its formulas and check
// sides (Model::formulaDims, Model::checkDims), and whoever checks a tree of
// its own (an Inputs binding, a study's expression) keeps a TreeDims.
#pragma once

#include <cstdint>
#include <vector>

#include "engine/sheet/expr.h"
#include "engine/units/dimension.h"

namespace calctrail {

// What a temperature-valued node stands for. The SI value of both is in
// kelvin, but only an interval may be scaled, negated or summed.
enum class TemperatureKind : uint8_t {
  Unknown,     // not a temperature, or one in K (which serves for both)
  Absolute,    // a point on a scale with an offset: 20 degC, T1 + 5 ddegC
  Difference,  // an interval: 5 ddegC, T2 - T1
};

// A read-only view of the dimensions of one tree's nodes, indexed by Expr::id.
class NodeDims {
 public:
  NodeDims() = default;
  NodeDims(const Dimension* dims, uint32_t count) : dims_(dims), count_(count) {}

  /// The dimension of `e`, a node of the tree the view was made for. A node
  /// the view does not cover (a tree that failed its check) reads as plain.
  const Dimension& of(const Expr& e) const { return e.id < count_ ? dims_[e.id] : none(); }
  uint32_t size() const { return count_; }

 private:
  static const Dimension& none() {
    static const Dimension plain;
    return plain;
  }
  const Dimension* dims_ = nullptr;
  uint32_t count_ = 0;
};

// The dimension check's result for one tree, owned: what DimensionChecker::check fills.
struct TreeDims {
  /// The dimension of every node, by Expr::id.
  std::vector<Dimension> dims;
  /// The temperature kind of the root.
  TemperatureKind temperature = TemperatureKind::Unknown;

  NodeDims view() const { return NodeDims(dims.data(), static_cast<uint32_t>(dims.size())); }
  const Dimension& of(const Expr& e) const { return view().of(e); }
};

}  // namespace calctrail
