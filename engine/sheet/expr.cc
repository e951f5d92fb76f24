#include "engine/sheet/expr.h"

#include <algorithm>
#include <new>

namespace calctrail {

ExprList::ExprList() {
  for (uint32_t i = 0; i < kInline; ++i) new (&store_.own[i]) ExprPtr();
}

ExprList::ExprList(ExprList&& o) noexcept : ExprList() { *this = std::move(o); }

ExprList& ExprList::operator=(ExprList&& o) noexcept {
  if (this == &o) return *this;
  clear();  // inline and empty
  if (o.inlined()) {
    for (uint32_t i = 0; i < o.size_; ++i) store_.own[i] = std::move(o.store_.own[i]);
  } else {
    for (uint32_t i = 0; i < kInline; ++i) store_.own[i].~ExprPtr();
    store_.heap = o.store_.heap;
    capacity_ = o.capacity_;
    for (uint32_t i = 0; i < kInline; ++i) new (&o.store_.own[i]) ExprPtr();
    o.capacity_ = kInline;
  }
  size_ = o.size_;
  o.size_ = 0;
  return *this;
}

ExprList::~ExprList() {
  if (inlined()) {
    for (uint32_t i = 0; i < kInline; ++i) store_.own[i].~ExprPtr();
  } else {
    delete[] store_.heap;
  }
}

void ExprList::reserve(size_t n) {
  if (n <= capacity_) return;
  auto* grown = new ExprPtr[n];
  ExprPtr* from = data();
  for (uint32_t i = 0; i < size_; ++i) grown[i] = std::move(from[i]);
  if (inlined()) {
    for (uint32_t i = 0; i < kInline; ++i) store_.own[i].~ExprPtr();
  } else {
    delete[] store_.heap;
  }
  store_.heap = grown;
  capacity_ = static_cast<uint32_t>(n);
}

void ExprList::push_back(ExprPtr e) {
  if (size_ == capacity_) reserve(size_t{capacity_} * 2);
  data()[size_++] = std::move(e);
}

void ExprList::clear() {
  if (!inlined()) {
    delete[] store_.heap;
    for (uint32_t i = 0; i < kInline; ++i) new (&store_.own[i]) ExprPtr();
    capacity_ = kInline;
  } else {
    for (uint32_t i = 0; i < kInline; ++i) store_.own[i].reset();
  }
  size_ = 0;
}

ExprPtr cloneExpr(const Expr& e) {
  auto c = std::make_unique<Expr>();
  c->kind = e.kind;
  c->begin = e.begin;
  c->end = e.end;
  c->text = e.text;
  c->number = e.number;
  c->id = e.id;
  if (e.unit) c->unit = std::make_unique<NumberUnit>(*e.unit);
  c->args.reserve(e.args.size());
  for (const ExprPtr& a : e.args) c->args.push_back(cloneExpr(*a));
  return c;
}

const std::string& Expr::unitWritten() const {
  static const std::string none;
  return unit ? unit->written : none;
}

namespace {
// The parser limits nesting, so these walks stay shallow.
void numberFrom(Expr& e, uint32_t* next) {
  e.id = (*next)++;
  for (ExprPtr& a : e.args) numberFrom(*a, next);
}
}  // namespace

void numberNodes(Expr& root) {
  uint32_t next = 0;
  numberFrom(root, &next);
}

uint32_t nodeCount(const Expr& root) {
  uint32_t n = root.id + 1;
  for (const ExprPtr& a : root.args) n = std::max(n, nodeCount(*a));
  return n;
}

void forEachName(const Expr& e, const std::function<void(const Expr&)>& fn) {
  if (e.kind == ExprKind::Name) fn(e);
  for (const ExprPtr& a : e.args) forEachName(*a, fn);
}

namespace {
// A number whose unit is written without brackets where `render` shows it.
bool numberShownWithBareUnit(const Expr& e, bool pretty) {
  if (e.kind != ExprKind::Number || e.unitWritten().empty()) return false;
  return pretty ? e.unit != nullptr : e.unitWritten()[0] != '[';
}

void render(const Expr& e, NameWriter* names, bool pretty, std::string* out) {
  auto binary = [&](const char* op) {
    render(*e.args[0], names, pretty, out);
    *out += op;
    render(*e.args[1], names, pretty, out);
  };
  switch (e.kind) {
    case ExprKind::Number:
      *out += e.text;
      if (pretty && e.unit) {
        // For people: "1 rev", "9.81 m/s²", "15°" (no space before the degree sign).
        const std::string u = e.unit->pretty();
        if (u != "\u00B0") *out += ' ';
        *out += u;
      } else if (!e.unitWritten().empty()) {
        // "95 %", "20 kN", "9.81 [m/s^2]": one space between number and unit.
        *out += ' ';
        *out += e.unitWritten();
      }
      break;
    case ExprKind::Pi:
      *out += pretty ? "\u03C0" : "pi";
      break;
    case ExprKind::Name:
      if (names) names->write(e, false, out);
      else *out += e.text;
      break;
    case ExprKind::Call:
      *out += e.text;
      *out += '(';
      for (size_t i = 0; i < e.args.size(); ++i) {
        if (i) *out += ", ";
        render(*e.args[i], names, pretty, out);
      }
      *out += ')';
      break;
    case ExprKind::Negate:
      *out += '-';
      render(*e.args[0], names, pretty, out);
      break;
    case ExprKind::Add: binary(" + "); break;
    case ExprKind::Subtract: binary(" - "); break;
    case ExprKind::Multiply: binary(pretty ? " \u00B7 " : " * "); break;
    case ExprKind::Divide: binary(" / "); break;
    case ExprKind::Power:
      if (names && e.args[0]->kind == ExprKind::Name) {
        names->write(*e.args[0], true, out);
        *out += '^';
        render(*e.args[1], names, pretty, out);
        break;
      }
      if (numberShownWithBareUnit(*e.args[0], pretty)) {
        // `3 [mm]^2` is shown `(3 mm)^2`: `3 mm^2` would read two ways (docs/format.md).
        *out += '(';
        render(*e.args[0], names, pretty, out);
        *out += ")^";
        render(*e.args[1], names, pretty, out);
        break;
      }
      binary("^");
      break;
    case ExprKind::Group:
      *out += '(';
      render(*e.args[0], names, pretty, out);
      *out += ')';
      break;
  }
}

}  // namespace

size_t renderedSize(const Expr& e) {
  // The source text, and room for the spaces, dots and values that canonical spelling adds.
  return 2 * static_cast<size_t>(e.end > e.begin ? e.end - e.begin : 0) + 16;
}

void renderExprTo(const Expr& e, NameWriter* names, bool pretty, std::string* out) {
  render(e, names, pretty, out);
}

std::string renderExpr(const Expr& e, const NameRenderer& value_of, bool pretty) {
  std::string out;
  out.reserve(renderedSize(e));
  if (!value_of) {
    render(e, nullptr, pretty, &out);
    return out;
  }
  // A power's base in parentheses where its text holds a space and has none around it already.
  NameWriterOf names([&](const Expr& name_node, bool power_base, std::string* to) {
    const std::string text = value_of(name_node);
    const bool wrap = power_base && text.find(' ') != std::string::npos && text[0] != '(';
    if (wrap) *to += '(';
    *to += text;
    if (wrap) *to += ')';
  });
  render(e, &names, pretty, &out);
  return out;
}

}  // namespace calctrail
