#include "engine/model/evaluate.h"

#include <algorithm>
#include <cmath>
#include <cstring>

#include "engine/eval/tree_eval.h"
#include "engine/report/number_format.h"

namespace calctrail {

Evaluation::Evaluation(const Model& model, EvaluationOptions options)
    : model_(model),
      options_(options),
      values_(model.slotCount(), NAN),
      kept_(model.slotCount() + 2 * model.checks().size()),
      seen_(kept_.size(), 0),
      bound_(model.slotCount(), nullptr) {}

Evaluation::~Evaluation() = default;

void Evaluation::bindInputs(const Inputs& inputs) {
  for (const Inputs* layer = &inputs; layer; layer = layer->parent()) {
    for (const Binding& b : layer->own()) {
      if (bound_[b.slot.index()]) continue;  // a nearer layer's binding hides this one
      bound_[b.slot.index()] = &b;
      bound_slots_.push_back(b.slot);
    }
  }
}

void Evaluation::unbindInputs() {
  for (Slot s : bound_slots_) bound_[s.index()] = nullptr;
  bound_slots_.clear();
}

double Evaluation::runScratch(const Program& program) {
  addresses_.resize(program.inputs.size());
  for (size_t k = 0; k < program.inputs.size(); ++k) addresses_[k] = &values_[program.inputs[k]];
  scratch_.set(program, addresses_.data(), &calls_);
  return scratch_.eval();
}

double Evaluation::run(size_t id, const Program& program) {
  if (program.reads_one) return values_[program.inputs[0]];
  if (program.is_constant) return program.constant;
  if (const ArithmeticParser* kept = kept_[id].get()) return kept->eval();
  if (!seen_[id] || kept_count_ >= options_.max_kept_programs) {
    seen_[id] = 1;
    return runScratch(program);
  }
  // Evaluated before: worth a parser of its own, set once, evaluated from now on.
  auto parser = std::make_unique<ArithmeticParser>();
  addresses_.resize(program.inputs.size());
  for (size_t k = 0; k < program.inputs.size(); ++k) addresses_[k] = &values_[program.inputs[k]];
  parser->set(program, addresses_.data(), &calls_);
  kept_[id] = std::move(parser);
  ++kept_count_;
  return kept_[id]->eval();
}

// A formula gave NaN or inf (or a library function refused): the tree
// interpreter finds the operation at fault, reported with the values of the
// quantities it reads.
void Evaluation::fault(Fault::Site site, uint32_t index, const Expr& expr, const NodeDims& dims,
                       const SourceFile& file,
                       const std::string& prefix, const std::string& internal, Results* results) {
  const Sheet& sheet = model_.sheet();
  EvalFault f;
  evalTree(
      expr, dims, [&](const Expr& e) { return values_[sheet.find(e.text)]; }, &f, model_.library());
  const Expr& at = f.node ? *f.node : expr;
  std::string msg = prefix + (f.node             ? f.message
                              : internal.empty() ? "the value is not a finite number"
                                                 : internal);
  std::vector<std::string> seen;
  std::string inputs;
  forEachName(at, [&](const Expr& e) {
    if (std::find(seen.begin(), seen.end(), e.text) != seen.end()) return;
    seen.push_back(e.text);
    const int j = sheet.find(e.text);
    if (j < 0 || !std::isfinite(values_[j])) return;
    inputs += (inputs.empty() ? "" : ", ") + e.text + " = " +
              formatQuantity(values_[j], model_.slot(Slot(static_cast<uint32_t>(j))).display, 4);
  });
  if (!inputs.empty()) msg += " (with " + inputs + ")";
  results->faults.push_back({site, index, &file, at.begin, at.end, std::move(msg)});
}

namespace {
// The compiled arithmetic counted a doubtful library call: the interpreter
// says which call and why, with its position in the formula.
void addDoubts(const Model& model, const std::vector<double>& values, Fault::Site site, uint32_t index,
               const Expr& expr, const NodeDims& dims, const SourceFile& file, Results* results) {
  const Sheet& sheet = model.sheet();
  for (CallDoubt& d :
       doubtsInTree(expr, dims, [&](const Expr& e) { return values[sheet.find(e.text)]; }, model.library()))
    results->warnings.push_back({site, index, &file, d.at->begin, d.at->end, std::move(d.message)});
}

// Quantities by slot, then checks by index: the same order whichever part was re-run.
void sortWarnings(std::vector<Fault>* w) {
  std::stable_sort(w->begin(), w->end(), [](const Fault& a, const Fault& b) {
    return a.site != b.site ? a.site == Fault::Site::Quantity : a.index < b.index;
  });
}
}  // namespace

void Evaluation::evaluateSlot(Slot slot, Results* results) {
  const uint32_t i = slot.index();
  values_[i] = NAN;
  const SlotInfo& info = model_.slot(slot);
  if (!info.has_dim) return;
  const Binding* b = bound_[i];
  if (b && !b->reads_slots) {
    values_[i] = b->value;
    return;
  }
  const Program& p = b ? b->program : info.formula;
  if (p.text.empty()) return;  // too long to compile: reported when the model was built
  for (int j : p.inputs)
    if (!std::isfinite(values_[j])) return;  // a quantity it reads failed: one cause, one error
  double v = NAN;
  std::string internal;
  const uint64_t doubtful = calls_.doubtfulCalls();
  try {
    v = b ? runScratch(p) : run(i, p);
  } catch (const DomainError&) {
    v = NAN;  // explained below, with the argument at fault
  } catch (const std::exception& e) {
    internal = e.what();
  }
  if (!std::isfinite(v)) {
    const Quantity& q = model_.quantity(slot);
    fault(Fault::Site::Quantity, i, b ? *b->expr : model_.formulaExpr(slot),
          b ? b->dims.view() : model_.formulaDims(slot), b ? *b->file : model_.exprFile(slot),
          "`" + q.name + "` cannot be calculated: ", internal, results);
    return;
  }
  values_[i] = v;
  if (calls_.doubtfulCalls() != doubtful)
    addDoubts(model_, values_, Fault::Site::Quantity, i, b ? *b->expr : model_.formulaExpr(slot),
              b ? b->dims.view() : model_.formulaDims(slot), b ? *b->file : model_.exprFile(slot), results);
}

void Evaluation::evaluateCheck(size_t k, Results* results) {
  const CheckInfo& info = model_.checks()[k];
  CheckResult& r = results->checks[k];
  r = CheckResult();
  if (!info.compiled) return;
  const Check& c = model_.sheet().checks[k];
  const Program* programs[2] = {&info.lhs, &info.rhs};
  const Expr* exprs[2] = {c.lhs.get(), c.rhs.get()};
  const size_t first_id = model_.slotCount() + 2 * k;
  double side[2];
  for (int j = 0; j < 2; ++j) {
    double v = NAN;
    const uint64_t doubtful = calls_.doubtfulCalls();
    try {
      v = run(first_id + static_cast<size_t>(j), *programs[j]);
    } catch (const std::exception&) {
      v = NAN;
    }
    if (!std::isfinite(v)) {
      fault(Fault::Site::Check, static_cast<uint32_t>(k), *exprs[j], model_.checkDims(k, j), model_.checkFile(k),
            "the check `" + c.name + "` cannot be evaluated: ", "", results);
      return;
    }
    side[j] = v;
    if (calls_.doubtfulCalls() != doubtful)
      addDoubts(model_, values_, Fault::Site::Check, static_cast<uint32_t>(k), *exprs[j], model_.checkDims(k, j),
                model_.checkFile(k),
                results);
  }
  r.ok = true;
  r.lhs = side[0];
  r.rhs = side[1];
  switch (c.op) {
    case Comparison::Less: r.passed = r.lhs < r.rhs; break;
    case Comparison::LessEqual: r.passed = r.lhs <= r.rhs; break;
    case Comparison::Greater: r.passed = r.lhs > r.rhs; break;
    case Comparison::GreaterEqual: r.passed = r.lhs >= r.rhs; break;
  }
}

Results Evaluation::evaluate(const Inputs& inputs) {
  Results results;
  results.checks.assign(model_.checks().size(), CheckResult());
  std::fill(values_.begin(), values_.end(), NAN);
  bindInputs(inputs);
  for (Slot s : inputs.readsSlots() ? inputs.order() : model_.order()) evaluateSlot(s, &results);
  if (results.faults.empty())
    for (size_t k = 0; k < model_.checks().size(); ++k) evaluateCheck(k, &results);
  unbindInputs();
  sortWarnings(&results.warnings);
  results.values = values_;
  return results;
}

const std::vector<Slot>& Evaluation::coneOf(const Inputs& inputs) {
  const std::vector<Binding>& own = inputs.own();
  bool same = own.size() == cone_key_.size();
  for (size_t i = 0; same && i < own.size(); ++i) same = own[i].slot == cone_key_[i];
  if (same && !cone_key_.empty()) return cone_;
  cone_key_.clear();
  for (const Binding& b : own) cone_key_.push_back(b.slot);
  cone_ = model_.downstream(cone_key_);
  std::vector<char> in(model_.slotCount(), 0);
  for (Slot s : cone_) in[s.index()] = 1;
  cone_checks_.clear();
  for (size_t k = 0; k < model_.checks().size(); ++k) {
    const std::vector<Slot>& reads = model_.checks()[k].reads;
    if (std::any_of(reads.begin(), reads.end(), [&](Slot r) { return in[r.index()] != 0; }))
      cone_checks_.push_back(k);
  }
  return cone_;
}

void Evaluation::evaluateCone(const Inputs& inputs, Results* results) {
  if (inputs.readsSlots() || !results->faults.empty() || results->values.size() != values_.size()) {
    *results = evaluate(inputs);  // a changed order or a failed base: the cone alone cannot say
    return;
  }
  const std::vector<Slot>& cone = coneOf(inputs);
  std::memcpy(values_.data(), results->values.data(), values_.size() * sizeof(double));
  // The cone's warnings are found again; the others stand.
  std::vector<char> rerun(model_.slotCount(), 0), rerun_check(model_.checks().size(), 0);
  for (Slot s : cone) rerun[s.index()] = 1;
  for (size_t k : cone_checks_) rerun_check[k] = 1;
  std::vector<Fault>& w = results->warnings;
  w.erase(std::remove_if(w.begin(), w.end(),
                         [&](const Fault& f) {
                           return f.site == Fault::Site::Quantity ? rerun[f.index] != 0
                                                                  : rerun_check[f.index] != 0;
                         }),
          w.end());
  bindInputs(inputs);
  for (Slot s : cone) evaluateSlot(s, results);
  unbindInputs();
  for (Slot s : cone) results->values[s.index()] = values_[s.index()];
  if (!results->faults.empty()) {
    // As evaluate(): no check is evaluated once a quantity has failed.
    std::fill(results->checks.begin(), results->checks.end(), CheckResult());
    w.erase(std::remove_if(w.begin(), w.end(), [](const Fault& f) { return f.site == Fault::Site::Check; }),
            w.end());
    sortWarnings(&w);
    return;
  }
  for (size_t k : cone_checks_) evaluateCheck(k, results);
  sortWarnings(&w);
}

Results evaluate(const Model& model, const Inputs& inputs) {
  Evaluation e(model);
  return e.evaluate(inputs);
}

Results evaluateCone(const Model& model, const Inputs& inputs, const Results& base) {
  Evaluation e(model);
  Results r = base;
  e.evaluateCone(inputs, &r);
  return r;
}

}  // namespace calctrail
