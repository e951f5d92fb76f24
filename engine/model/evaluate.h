// Evaluating a model: pure functions of (Model, Inputs), and the per-thread
// context they run in.
//
// muparser binds each variable by address when a program is set, so the
// values a program reads are per-evaluation state: an Evaluation owns them
// (one slot array) together with the muparser programs bound to it. Make
// one Evaluation per thread; a Model and Inputs are shared read-only. There
// is no static or shared mutable state anywhere on this path.
//
// A formula is set into a parser of its own on its second evaluation in a
// context (the first goes through one shared scratch parser), so a one-shot
// run of a huge sheet keeps no parsers, and a sweep keeps one per formula of
// the cone it re-runs, up to EvaluationOptions::max_kept_programs. A formula
// that is one library call of names (Program::direct_call), a lone name or a
// lone literal needs no parser: it is called or read directly.
#pragma once

#include <memory>
#include <vector>

#include "engine/eval/arithmetic.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"

namespace calctrail {

struct EvaluationOptions {
  /// Programs kept set in parsers of their own (a few KB each); beyond, the scratch parser serves.
  size_t max_kept_programs = 20000;
};

class Evaluation {
 public:
  explicit Evaluation(const Model& model, EvaluationOptions options = {});
  ~Evaluation();
  Evaluation(const Evaluation&) = delete;
  Evaluation& operator=(const Evaluation&) = delete;

  // Every slot in order, then (when no quantity faulted) every check.
  Results evaluate(const Inputs& inputs);

  // Re-runs only what `inputs`' own bindings can change: the downstream cone
  // of their slots, and the checks that read it. *results must hold the
  // evaluation of `inputs` without its own bindings (of its parent, say);
  // afterwards it holds, bit for bit, what evaluate(inputs) gives.
  void evaluateCone(const Inputs& inputs, Results* results);

  // Programs set in parsers of their own so far.
  size_t keptPrograms() const { return kept_count_; }

 private:
  void bindInputs(const Inputs& inputs);
  void unbindInputs();
  void evaluateSlot(Slot slot, Results* results);
  void evaluateCheck(size_t k, Results* results);
  double run(size_t id, const Program& program);
  double runOnce(const Program& program);  // a --set program: never kept
  bool callDirect(const Program& program, double* v);
  double runDirect(const Program& program);
  [[gnu::cold]] [[gnu::noinline]] void slotFailed(Slot slot, const Binding* b, const char* internal,
                                                  Results* results);
  [[gnu::cold]] [[gnu::noinline]] void slotDoubts(Slot slot, const Binding* b, Results* results);
  double runScratch(const Program& program);
  void fault(Fault::Site site, uint32_t index, const Expr& expr, const NodeDims& dims, const SourceFile& file,
             const std::string& prefix, const std::string& internal, Results* results);
  const std::vector<Slot>& coneOf(const Inputs& inputs);

  const Model& model_;
  EvaluationOptions options_;
  std::vector<double> values_;  // the slot array every program reads; never reallocated
  LibraryCallStore calls_;
  ArithmeticParser scratch_;
  std::vector<double*> addresses_;
  // Per program id (slot i is id i; check k's sides are ids n+2k and n+2k+1):
  std::vector<std::unique_ptr<ArithmeticParser>> kept_;
  std::vector<char> seen_;  // evaluated once already: the next evaluation keeps it
  size_t kept_count_ = 0;
  std::vector<const Binding*> bound_;  // per slot, during one evaluation
  std::vector<Slot> bound_slots_;
  // The cone of the last evaluateCone, for the bound slots it was built for.
  std::vector<Slot> cone_key_, cone_;
  std::vector<size_t> cone_checks_;
  std::vector<char> in_cone_, check_in_cone_;  // per slot, per check: in that cone
};

// One evaluation in a context of its own (a one-shot run).
Results evaluate(const Model& model, const Inputs& inputs);
// The cone of `inputs`' own bindings re-run over a copy of `base` (see Evaluation::evaluateCone).
Results evaluateCone(const Model& model, const Inputs& inputs, const Results& base);

}  // namespace calctrail
