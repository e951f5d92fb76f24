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

// A formula that is one library call of names (Program::direct_call): the
// arguments gathered and converted as the function receives them
// (LibraryCall::argumentIn) in one pass, then the call. False, and no call,
// when an argument is not finite.
bool Evaluation::callDirect(const Program& program, double* v) {
  const LibraryCall& c = program.calls[0];
  const size_t n = program.inputs.size();
  if (__builtin_expect(n > 16, 0)) {
    std::vector<double> many(n);
    for (size_t k = 0; k < n; ++k)
      if (!std::isfinite(many[k] = values_[program.inputs[k]])) return false;
    *v = c.call(many.data(), static_cast<int>(n), calls_.doubtCounter());
    return true;
  }
  double args[16];
  const int* in = program.inputs.data();
  bool finite = true;
  for (size_t k = 0; k < n; ++k) {
    const double x = values_[in[k]];
    finite &= std::isfinite(x);
    args[k] = c.argumentIn(static_cast<int>(k), x);
  }
  if (!finite) return false;
  *v = c.callConverted(args, static_cast<int>(n), calls_.doubtCounter());
  return true;
}

double Evaluation::runDirect(const Program& program) {
  double v = NAN;  // an argument not finite: no value, as the function would refuse it
  callDirect(program, &v);
  return v;
}

double Evaluation::runOnce(const Program& program) {
  if (program.reads_one) return values_[program.inputs[0]];
  if (program.is_constant) return program.constant;
  if (program.direct_call) return runDirect(program);
  return runScratch(program);
}

double Evaluation::run(size_t id, const Program& program) {
  if (program.reads_one) return values_[program.inputs[0]];
  if (program.is_constant) return program.constant;
  if (program.direct_call) return runDirect(program);
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
              formatQuantity(values_[j], *model_.slot(Slot(static_cast<uint32_t>(j))).display, 4);
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

// Out of line: the success path of evaluateSlot builds no string.
void Evaluation::slotFailed(Slot slot, const Binding* b, const char* internal, Results* results) {
  const Quantity& q = model_.quantity(slot);
  fault(Fault::Site::Quantity, slot.index(), b ? *b->expr : model_.formulaExpr(slot),
        b ? b->dims.view() : model_.formulaDims(slot), b ? *b->file : model_.exprFile(slot),
        "`" + q.name + "` cannot be calculated: ", internal ? std::string(internal) : std::string(), results);
}

void Evaluation::slotDoubts(Slot slot, const Binding* b, Results* results) {
  addDoubts(model_, values_, Fault::Site::Quantity, slot.index(), b ? *b->expr : model_.formulaExpr(slot),
            b ? b->dims.view() : model_.formulaDims(slot), b ? *b->file : model_.exprFile(slot), results);
}

// Inlined into the two loops over slots: one frame per loop, not one per slot.
[[gnu::always_inline]] inline void Evaluation::evaluateSlot(Slot slot, Results* results) {
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
  double v = NAN;
  const uint64_t doubtful = calls_.doubtfulCalls();
  try {
    // A quantity it reads failed (not finite): one cause, one error, so no value and no fault here.
    if (p.direct_call) {
      if (!callDirect(p, &v)) return;
    } else {
      for (int j : p.inputs)
        if (!std::isfinite(values_[j])) return;
      v = b ? runOnce(p) : run(i, p);
    }
  } catch (const DomainError&) {
    v = NAN;  // explained below, with the argument at fault
  } catch (const std::exception& e) {
    slotFailed(slot, b, e.what(), results);
    return;
  }
  if (__builtin_expect(!std::isfinite(v), 0)) {
    slotFailed(slot, b, nullptr, results);
    return;
  }
  values_[i] = v;
  if (__builtin_expect(calls_.doubtfulCalls() != doubtful, 0)) slotDoubts(slot, b, results);
}

void Evaluation::evaluateCheck(size_t k, Results* results) {
  const CheckInfo& info = model_.checks()[k];
  CheckResult& r = results->checks[k];
  r = CheckResult();
  if (!info.compiled) return;
  const Check& c = model_.sheet().checks[k];
  const Program* programs[2] = {&info.lhs, &info.rhs};
  double side[2] = {NAN, NAN};
  const bool read =
      (info.lhs.reads_one || info.lhs.is_constant) && (info.rhs.reads_one || info.rhs.is_constant);
  if (read) {
    // Most checks compare two names, or a name and a literal: no arithmetic, nothing to throw.
    for (int j = 0; j < 2; ++j)
      side[j] = programs[j]->reads_one ? values_[programs[j]->inputs[0]] : programs[j]->constant;
  }
  if (!read || !std::isfinite(side[0]) || !std::isfinite(side[1])) {
    const Expr* exprs[2] = {c.lhs.get(), c.rhs.get()};
    const size_t first_id = model_.slotCount() + 2 * k;
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
                  model_.checkFile(k), results);
    }
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
  in_cone_.assign(model_.slotCount(), 0);
  for (Slot s : cone_) in_cone_[s.index()] = 1;
  cone_checks_.clear();
  check_in_cone_.assign(model_.checks().size(), 0);
  for (size_t k = 0; k < model_.checks().size(); ++k) {
    const std::vector<Slot>& reads = model_.checks()[k].reads;
    if (std::any_of(reads.begin(), reads.end(), [&](Slot r) { return in_cone_[r.index()] != 0; })) {
      cone_checks_.push_back(k);
      check_in_cone_[k] = 1;
    }
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
  std::vector<Fault>& w = results->warnings;
  if (!w.empty())
    w.erase(std::remove_if(w.begin(), w.end(),
                           [&](const Fault& f) {
                             return f.site == Fault::Site::Quantity ? in_cone_[f.index] != 0
                                                                    : check_in_cone_[f.index] != 0;
                           }),
            w.end());
  bindInputs(inputs);
  for (Slot s : cone) evaluateSlot(s, results);
  unbindInputs();
  // Outside the cone values_ holds the base's values, copied in above: copy the whole array back.
  std::memcpy(results->values.data(), values_.data(), values_.size() * sizeof(double));
  if (!results->faults.empty()) {
    // As evaluate(): no check is evaluated once a quantity has failed.
    std::fill(results->checks.begin(), results->checks.end(), CheckResult());
    w.erase(std::remove_if(w.begin(), w.end(), [](const Fault& f) { return f.site == Fault::Site::Check; }),
            w.end());
    sortWarnings(&w);
    return;
  }
  for (size_t k : cone_checks_) evaluateCheck(k, results);
  if (w.size() > 1) sortWarnings(&w);
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
