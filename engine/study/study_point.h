// One evaluation context of a study: the base Inputs (the sheet with --set)
// and a layer over them that binds the study's inputs. Each point re-runs
// only the downstream cone of the bound inputs (Evaluation::evaluateCone),
// so nothing is parsed, resolved, dimension-checked or compiled per point.
// Not shared between threads: make one per thread.
#pragma once

#include <vector>

#include "engine/model/evaluate.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"

namespace calctrail {

class StudyPoint {
 public:
  // `base_results` must be the evaluation of `base`; both must outlive this.
  StudyPoint(const Model& model, const Inputs& base, const Results& base_results);
  StudyPoint(const StudyPoint&) = delete;
  StudyPoint& operator=(const StudyPoint&) = delete;

  // The evaluation with `slot` at `si`, everything else as in the base. The
  // same slots must be bound at every call of one StudyPoint.
  const Results& at(Slot slot, double si);
  // The same with several slots at once (a grid point), si[k] for slots[k].
  const Results& at(const std::vector<Slot>& slots, const double* si);

  const Model& model() const { return model_; }

 private:
  const Model& model_;
  Evaluation context_;
  Inputs layer_;
  Results results_;  // the last point's evaluation: the base outside the cone
};

// The first fault of `r` (what a study reports for a point), or nullptr when there is none.
const Fault* firstFault(const Results& r);

}  // namespace calctrail
