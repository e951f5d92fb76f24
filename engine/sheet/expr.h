// The expression tree of a formula, as written. It stays the source of truth
// for units, dimension checks and rendering; muparser only does arithmetic.
#pragma once

#include <cstdint>
#include <functional>
#include <memory>
#include <string>
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

// What a temperature-valued node stands for. The SI value of both is in
// kelvin, but only an interval may be scaled, negated or summed.
enum class TemperatureKind : uint8_t {
  Unknown,     // not a temperature, or one in K (which serves for both)
  Absolute,    // a point on a scale with an offset: 20 degC, T1 + 5 ddegC
  Difference,  // an interval: 5 ddegC, T2 - T1
};

struct Expr;
using ExprPtr = std::unique_ptr<Expr>;

// The operands of a node: a vector of ExprPtr in 16 bytes instead of 24
// (a pointer and two 32-bit counts). Most nodes are leaves, and a large
// sheet has millions of nodes, so the 8 bytes take every node down a malloc
// size class (docs/performance.md, Memory).
class ExprList {
 public:
  ExprList() = default;
  ExprList(ExprList&& o) noexcept;
  ExprList& operator=(ExprList&& o) noexcept;
  ExprList(const ExprList&) = delete;
  ExprList& operator=(const ExprList&) = delete;
  ~ExprList();

  size_t size() const { return size_; }
  bool empty() const { return size_ == 0; }
  ExprPtr& operator[](size_t i) { return data_[i]; }
  const ExprPtr& operator[](size_t i) const { return data_[i]; }
  ExprPtr* begin() { return data_; }
  ExprPtr* end() { return data_ + size_; }
  const ExprPtr* begin() const { return data_; }
  const ExprPtr* end() const { return data_ + size_; }
  ExprPtr& back() { return data_[size_ - 1]; }
  const ExprPtr& back() const { return data_[size_ - 1]; }
  void push_back(ExprPtr e);
  void reserve(size_t n);
  void clear();

 private:
  ExprPtr* data_ = nullptr;  // new ExprPtr[capacity_]
  uint32_t size_ = 0, capacity_ = 0;
};

// Members ordered so that the node fits 120 bytes (a 128-byte malloc chunk).
struct Expr {
  ExprKind kind = ExprKind::Number;
  TemperatureKind temperature = TemperatureKind::Unknown;  // filled in by the dimension check
  uint32_t begin = 0, end = 0;  // byte offsets of the whole node in its file
  Dimension dim;  // filled in by the dimension check
  // Number: the literal as written ("0.25") and its value in that unit.
  // Name, Call: the name.
  std::string text;
  double number = 0.0;
  // Number with a unit: the unit as written ("kN", "[m/s^2]") and resolved.
  std::string unit_written;
  std::unique_ptr<Unit> unit;
  ExprList args;  // operands or call arguments

  double siValue() const { return unit ? unit->toSI(number) : number; }
};

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

}  // namespace calctrail
