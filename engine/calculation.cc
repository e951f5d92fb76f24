#include "engine/calculation.h"

#include "engine/model/evaluate.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/util/sha256.h"

namespace calctrail {

std::unique_ptr<Calculation> Calculation::fromFile(const std::string& path, const CalcOptions& options) {
  std::string bytes, error;
  if (!readFile(path, &bytes, &error)) {
    auto calc = std::make_unique<Calculation>();
    calc->path = path;
    calc->diags.error(path, error);
    return calc;
  }
  return fromText(path, std::move(bytes), options);
}

std::unique_ptr<Calculation> Calculation::fromText(const std::string& display_path, std::string bytes,
                                                   const CalcOptions& options) {
  auto calc = std::make_unique<Calculation>();
  calc->path = display_path;
  calc->sha256 = sha256Hex(bytes);
  calc->run(std::make_shared<SourceFile>(display_path, std::move(bytes)), options);
  return calc;
}

bool Calculation::allChecksPass() const { return failedChecks() == 0; }

int Calculation::failedChecks() const {
  int n = 0;
  for (const CheckState& c : checks) n += c.ok && !c.passed;
  return n;
}

void Calculation::run(std::shared_ptr<SourceFile> file, const CalcOptions& options) {
  sheet = parseSheet(std::move(file), &diags);
  model = Model::borrow(&sheet, &diags);
  inputs = std::make_unique<Inputs>(*model);
  for (const std::string& set : options.sets) inputs->set(set, &diags);
  if (!diags.hasErrors()) {
    results = evaluate(*model, *inputs);
    for (const Fault& f : results.faults) diags.error(*f.file, f.begin, f.end, f.message);
    for (const Fault& w : results.warnings) diags.warning(*w.file, w.begin, w.end, w.message);
  }
  fillStates();
  diags.sort();
}

namespace {
bool readsNothing(const Expr& e) {
  if (e.kind == ExprKind::Name || e.kind == ExprKind::Call) return false;
  for (const ExprPtr& a : e.args)
    if (!readsNothing(*a)) return false;
  return true;
}
}  // namespace

void Calculation::fillStates() {
  const Model& m = *model;
  graph = std::make_unique<DependencyGraph>(m.graph());
  const std::vector<Slot>& slots = inputs->readsSlots() ? inputs->order() : m.order();
  order.clear();
  for (Slot s : slots) order.push_back(static_cast<int>(s.index()));
  const bool evaluated = !results.values.empty();
  quantities.assign(m.slotCount(), QuantityState());
  for (size_t i = 0; i < m.slotCount(); ++i) {
    const Slot slot(static_cast<uint32_t>(i));
    const SlotInfo& info = m.slot(slot);
    QuantityState& s = quantities[i];
    s.dim = info.dim;
    s.has_dim = info.has_dim;
    s.display = info.display;
    s.declared = info.declared;
    s.input = info.input;
    s.ok = evaluated && results.ok(slot);
    s.si = s.ok ? results.value(slot) : 0.0;
  }
  // Show each --set formula where the sheet's stood; keep the model's tree alive.
  for (const Binding& b : inputs->own()) {
    if (!b.expr) continue;
    Quantity& q = sheet.quantities[b.slot.index()];
    QuantityState& s = quantities[b.slot.index()];
    replaced_.push_back(std::move(q.expr));
    q.expr = cloneExpr(*b.expr);
    q.overridden = true;
    q.override_text = b.text;
    q.override_file = std::const_pointer_cast<SourceFile>(b.file);
    s.input = readsNothing(*q.expr);
    if (!s.declared && s.has_dim) {
      const Unit* written = unitAsWritten(*q.expr);
      s.display = written ? *written : preferredUnit(s.dim);
    }
  }
  checks.assign(m.checks().size(), CheckState());
  for (size_t k = 0; k < m.checks().size(); ++k) {
    const CheckInfo& info = m.checks()[k];
    CheckState& s = checks[k];
    s.dim = info.dim;
    s.display = info.display;
    if (!evaluated || !info.has_dim) continue;
    const CheckResult& r = results.checks[k];
    s.ok = r.ok;
    s.lhs = r.lhs;
    s.rhs = r.rhs;
    s.passed = r.passed;
  }
}

}  // namespace calctrail
