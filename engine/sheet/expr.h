// The expression tree of a formula, as written. It stays the source of truth
// for units, dimension checks and rendering; muparser only does arithmetic.
#pragma once

#include <cstdint>
#include <functional>
#include <memory>
#include <string>
#include <utility>
#include <vector>

#include "engine/units/unit.h"

namespace calctrail {

enum class ExprKind : uint8_t {
  Number,    // 20, 0.5, 1e-3, with an optional unit: 20 kN, 9.81 [m/s^2]
  Pi,        // the constant pi
  Name,      // a quantity
  Call,      // f(a, b)
  Negate,    // -a
  Add,
  Subtract,
  Multiply,
  Divide,
  Power,     // a^b
  Group,     // (a): kept so the trail shows the author's parentheses
};

// The unit of a Number node: the unit resolved, and as written ("kN",
// "[m/s^2]"). One allocation for the few nodes that have a unit, instead of
// a string in every node (docs/performance.md, Memory).
struct NumberUnit : Unit {
  /// The unit as written after the number, brackets included.
  std::string written;
};

struct Expr;
using ExprPtr = std::unique_ptr<Expr>;

// The operands of a node: a vector of ExprPtr in 24 bytes whose first two
// operands live in the node itself (an operator's two, a negation's or a
// group's one, a call's first two): only a call of three arguments or more
// allocates an array. A large sheet has millions of nodes, and an operand
// array of two pointers was a 32-byte malloc chunk of its own
// (docs/performance.md, Memory).
class ExprList {
 public:
  ExprList();
  ExprList(ExprList&& o) noexcept;
  ExprList& operator=(ExprList&& o) noexcept;
  ExprList(const ExprList&) = delete;
  ExprList& operator=(const ExprList&) = delete;
  ~ExprList();

  size_t size() const { return size_; }
  bool empty() const { return size_ == 0; }
  ExprPtr& operator[](size_t i) { return data()[i]; }
  const ExprPtr& operator[](size_t i) const { return data()[i]; }
  ExprPtr* begin() { return data(); }
  ExprPtr* end() { return data() + size_; }
  const ExprPtr* begin() const { return data(); }
  const ExprPtr* end() const { return data() + size_; }
  ExprPtr& back() { return data()[size_ - 1]; }
  const ExprPtr& back() const { return data()[size_ - 1]; }
  void push_back(ExprPtr e);
  void reserve(size_t n);
  void clear();

 private:
  static constexpr uint32_t kInline = 2;
  bool inlined() const { return capacity_ <= kInline; }
  ExprPtr* data() { return inlined() ? store_.own : store_.heap; }
  const ExprPtr* data() const { return inlined() ? store_.own : store_.heap; }
  // The operands in the node while capacity_ <= kInline, else new ExprPtr[capacity_].
  union Store {
    Store() {}
    ~Store() {}
    ExprPtr own[kInline];
    ExprPtr* heap;
  } store_;
  uint32_t size_ = 0, capacity_ = kInline;
};

// A node of the tree as parsed. Nothing later writes into it: what the
// dimension check finds (each node's dimension, its temperature kind) is
// kept apart, by `id`, in the Model (engine/eval/node_dims.h). Members
// ordered so that the node, its first two operands included, fits 88 bytes
// (a 96-byte malloc chunk).
struct Expr {
  ExprKind kind = ExprKind::Number;
  /// The node's number in its tree, in preorder from 0 at the root (numberNodes): the index
  /// of its entry in a side table over the tree (NodeDims). A copy (cloneExpr) keeps it.
  uint32_t id = 0;
  uint32_t begin = 0, end = 0;  // byte offsets of the whole node in its file
  // Number: the literal as written ("0.25") and its value in that unit.
  // Name, Call: the name.
  std::string text;
  double number = 0.0;
  // Number with a unit: the unit resolved, and as written.
  std::unique_ptr<NumberUnit> unit;
  ExprList args;  // operands or call arguments

  double siValue() const { return unit ? unit->toSI(number) : number; }
  /// The unit as written ("kN", "[m/s^2]"); "" for a number without one and any other node.
  const std::string& unitWritten() const;
};

// Numbers the nodes of `root` 0, 1, 2, ... in preorder (Expr::id). The
// expression parser does it once for every tree it returns.
void numberNodes(Expr& root);
// The size of a side table over `root`: its largest Expr::id plus one (its
// node count, for a tree the parser numbered).
uint32_t nodeCount(const Expr& root);

// `e` without the parentheses around it: `((a))` is `a`.
inline const Expr* withoutParens(const Expr* e) {
  while (e->kind == ExprKind::Group) e = e->args[0].get();
  return e;
}
// `e` without parentheses and leading minus signs: `-(-a)` is `a`; null stays null.
inline const Expr* withoutParensOrSigns(const Expr* e) {
  while (e && (e->kind == ExprKind::Group || e->kind == ExprKind::Negate)) e = e->args[0].get();
  return e;
}

// A deep copy of `e`, every member included (a --set tree shown in a sheet).
ExprPtr cloneExpr(const Expr& e);

// Calls fn on every Name node, in source order.
void forEachName(const Expr& e, const std::function<void(const Expr&)>& fn);

// The formula in canonical spelling: "F * dm / 2 * (l + pi * f * dm)". When
// `value_of` is given, every name is replaced by what it returns (the
// substituted line of the trail).
// `pretty` writes products with the SI Brochure's dot (F · dm) and pi as π.
using NameRenderer = std::function<std::string(const Expr& name_node)>;
std::string renderExpr(const Expr& e, const NameRenderer& value_of = nullptr, bool pretty = false);

// What renderExprTo writes in place of each name. An interface rather than a
// NameRenderer: the trail writes every formula with its values, and a text
// returned per name was a string made, copied and freed each time.
class NameWriter {
 public:
  // Appends the text for `name_node` to `out`. `power_base`: the name is the
  // base of a power, whose text is then put in parentheses where it holds a
  // space ((33.00 mm)^2, not 33.00 mm^2: the power applies to the value with its unit).
  virtual void write(const Expr& name_node, bool power_base, std::string* out) = 0;

 protected:
  ~NameWriter() = default;
};

// A NameWriter that calls `write` (a lambda taking the same arguments as NameWriter::write).
template <class Write>
class NameWriterOf final : public NameWriter {
 public:
  explicit NameWriterOf(Write write) : write_(std::move(write)) {}
  void write(const Expr& name_node, bool power_base, std::string* out) override { write_(name_node, power_base, out); }

 private:
  Write write_;
};

// renderExpr appended to `out`, each name written by `names` (as written when null).
void renderExprTo(const Expr& e, NameWriter* names, bool pretty, std::string* out);
// About how long a rendering of `e` is, for a string's reserve(): from its source offsets.
size_t renderedSize(const Expr& e);

}  // namespace calctrail
