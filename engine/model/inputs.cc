#include "engine/model/inputs.h"

#include <algorithm>
#include <cmath>
#include <queue>

#include "engine/eval/dimension_check.h"
#include "engine/eval/evaluator.h"
#include "engine/eval/tree_eval.h"
#include "engine/sheet/expr_parser.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

Inputs::Inputs(const Model& model, const Inputs* parent) : model_(&model), parent_(parent) {
  if (parent_ && parent_->readsSlots()) order_ = parent_->order_;
}

Binding* Inputs::ownBinding(Slot slot) {
  for (Binding& b : own_)
    if (b.slot == slot) return &b;
  return nullptr;
}

const Binding* Inputs::find(Slot slot) const {
  for (const Inputs* layer = this; layer; layer = layer->parent_)
    for (const Binding& b : layer->own_)
      if (b.slot == slot) return &b;
  return nullptr;
}

void Inputs::bind(Slot slot, double si) {
  Binding* b = ownBinding(slot);
  if (!b) {
    own_.emplace_back();
    b = &own_.back();
  }
  *b = Binding();
  b->slot = slot;
  b->value = si;
  if (!order_.empty()) computeOrder(&order_);  // a value reads nothing: an edge less
}

// Evaluation order over the model's slots with every binding's own reads in
// place of the replaced formulas'; false on a cycle. Ties go by the model's
// order, so an order without slot-reading bindings is the model's own.
bool Inputs::computeOrder(std::vector<Slot>* order) const {
  const Model& m = *model_;
  const size_t n = m.slotCount();
  std::vector<std::vector<int>> users(n);
  std::vector<int> pending(n, 0);
  std::vector<char> in_model(n, 0);
  for (Slot s : m.order()) in_model[s.index()] = 1;
  bool any = false;
  for (Slot s : m.order()) {
    const Binding* b = find(s);
    any |= b && b->reads_slots;
    const NodeList reads = b ? NodeList(b->program.inputs) : m.graph().uses(static_cast<int>(s.index()));
    for (int j : reads) {
      if (!in_model[j]) continue;  // on a cycle of the sheet: reported there
      users[j].push_back(static_cast<int>(s.index()));
      ++pending[s.index()];
    }
  }
  order->clear();
  if (!any) return true;
  auto later = [&](int a, int b) {
    return m.rank(Slot(static_cast<uint32_t>(a))) > m.rank(Slot(static_cast<uint32_t>(b)));
  };
  std::priority_queue<int, std::vector<int>, decltype(later)> ready(later);
  size_t count = 0;
  for (Slot s : m.order())
    if (pending[s.index()] == 0) ready.push(static_cast<int>(s.index()));
  while (!ready.empty()) {
    const int i = ready.top();
    ready.pop();
    order->push_back(Slot(static_cast<uint32_t>(i)));
    ++count;
    for (int u : users[i])
      if (--pending[u] == 0) ready.push(u);
  }
  return count == m.order().size();
}

namespace {
std::string trimmed(const std::string& s, size_t* b, size_t* e) {
  while (*b < *e && s[*b] == ' ') ++*b;
  while (*e > *b && s[*e - 1] == ' ') --*e;
  return s.substr(*b, *e - *b);
}
}  // namespace

bool Inputs::set(const std::string& assignment, Diagnostics* diags, const std::string& origin) {
  auto file = std::make_shared<SourceFile>(origin, assignment);
  const size_t eq = assignment.find('=');
  if (eq == std::string::npos) {
    diags->error(*file, 0, static_cast<uint32_t>(assignment.size()),
                 "--set takes NAME=VALUE, as in --set \"d=10 mm\"");
    return false;
  }
  size_t b = 0, e = eq;
  const std::string name = trimmed(assignment, &b, &e);
  const uint32_t nb = static_cast<uint32_t>(b), ne = static_cast<uint32_t>(e);
  if (!model_->find(name).valid() || ownBinding(model_->find(name)))
    return bindExpr(name, nb, ne, nullptr, file, diags, "--set");
  ExprParser parser(*file, static_cast<uint32_t>(eq + 1), static_cast<uint32_t>(assignment.size()), diags);
  ExprPtr expr = parser.parseWhole();
  if (!expr) return false;
  return bindExpr(name, nb, ne, std::move(expr), file, diags, "--set");
}

bool Inputs::replace(const std::string& name, uint32_t name_begin, uint32_t name_end, const Expr& expr,
                     std::shared_ptr<const SourceFile> file, Diagnostics* diags, const std::string& who) {
  return bindExpr(name, name_begin, name_end, cloneExpr(expr), std::move(file), diags, who);
}

// The checks and the binding shared by set() and replace(); `expr` is null
// only when the name is unknown or already bound here (reported first, as
// before the expression is read).
bool Inputs::bindExpr(const std::string& name, uint32_t nb, uint32_t ne, ExprPtr expr,
                      std::shared_ptr<const SourceFile> file, Diagnostics* diags, const std::string& who) {
  const Model& m = *model_;
  const bool from_set = who == "--set";
  const Slot slot = m.find(name);
  if (!slot.valid()) {
    std::vector<std::string> names;
    for (const Quantity& q : m.sheet().quantities) names.push_back(q.name);
    std::string msg = who + ": the worksheet defines no quantity `" + name + "`";
    auto near = nearestWords(name, names);
    if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
    diags->error(*file, nb, std::max(ne, nb + 1), msg);
    return false;
  }
  if (ownBinding(slot)) {
    diags->error(*file, nb, ne, who + " gives `" + name + "` twice");
    return false;
  }
  if (!expr) return false;

  TreeDims dims;
  if (!checkOverModel(m, *file, *expr, diags, &dims)) return false;
  const Quantity& q = m.quantity(slot);
  const SlotInfo& info = m.slot(slot);
  const Dimension dim = quantityDimension(dims.of(*expr));
  if (q.display && from_set) {
    if (!fitsDeclaredUnit(q, *expr, dims.view(), m.sheet(), m.sheet().quantityFile(slot.index()), dim, diags))
      return false;
  } else if (q.display) {
    // The worksheet's own message, but at the replacement that is wrong.
    Diagnostics why;
    if (!fitsDeclaredUnit(q, *expr, dims.view(), m.sheet(), m.sheet().quantityFile(slot.index()), dim, &why)) {
      std::string msg = why.list().front().message;
      const size_t at = msg.find("its formula gives");
      if (at != std::string::npos) msg.replace(at, 17, "the value given is");
      diags->error(*file, expr->begin, expr->end, who + ": " + msg);
      return false;
    }
  } else if (info.has_dim && dim != info.dim) {
    // Every formula that reads it was checked with the worksheet's dimension.
    diags->error(*file, expr->begin, expr->end,
                 who + ": `" + name + "` is " + info.dim.describe() +
                     " in the worksheet, but the value given is " + dim.describe());
    return false;
  }

  Binding bnd;
  bnd.slot = slot;
  bnd.text = file->bytes().substr(expr->begin, expr->end - expr->begin);
  if (from_set) bnd.text = file->bytes().substr(file->bytes().find('=') + 1);
  bnd.program = compileProgram(*expr, dims.view(), m.sheet(), m.library());
  if (bnd.program.text.size() > kMaxProgramLength) {
    diags->error(*file, expr->begin, expr->end, tooLongMessage("`" + name + "`", bnd.program.text.size()));
    return false;
  }
  bnd.reads_slots = !bnd.program.inputs.empty();
  if (!bnd.reads_slots) {
    // A value: calculated once, now, by the same arithmetic as every formula.
    // A lone literal is read as the evaluation reads it (Program::constant):
    // no parser to set up for the common case of a value.
    double v = bnd.program.is_constant ? bnd.program.constant : NAN;
    if (!bnd.program.is_constant) {
      try {
        Evaluator once;
        v = once.run(bnd.program, {});
      } catch (const std::exception&) {
        v = NAN;
      }
    }
    if (!std::isfinite(v)) {
      EvalFault fault;
      evalTree(
          *expr, dims.view(), [](const Expr&) { return NAN; }, &fault, m.library());
      const Expr& at = fault.node ? *fault.node : *expr;
      diags->error(*file, at.begin, at.end,
                   (from_set ? std::string() : who + ": ") + "`" + name + "` cannot be calculated: " +
                       (fault.node ? fault.message : std::string("the value is not a finite number")));
      return false;
    }
    bnd.value = v;
    bnd.program = Program();
  }
  bnd.file = file;
  bnd.expr = std::shared_ptr<const Expr>(std::move(expr));
  bnd.dims = std::move(dims);
  own_.push_back(std::move(bnd));
  if (own_.back().reads_slots || !order_.empty()) {
    std::vector<Slot> order;
    if (!computeOrder(&order)) {
      diags->error(*file, nb, ne,
                   who + ": `" + name + "` would depend on its own value through the quantities it reads");
      own_.pop_back();
      return false;
    }
    order_ = std::move(order);
  }
  return true;
}

}  // namespace calctrail
