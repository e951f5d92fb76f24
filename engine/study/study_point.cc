#include "engine/study/study_point.h"

namespace calctrail {

StudyPoint::StudyPoint(const Model& model, const Inputs& base, const Results& base_results)
    : model_(model), context_(model), layer_(model, &base), results_(base_results) {}

const Results& StudyPoint::at(Slot slot, double si) {
  layer_.bind(slot, si);
  context_.evaluateCone(layer_, &results_);
  return results_;
}

const Results& StudyPoint::at(const std::vector<Slot>& slots, const double* si) {
  for (size_t k = 0; k < slots.size(); ++k) layer_.bind(slots[k], si[k]);
  context_.evaluateCone(layer_, &results_);
  return results_;
}

const Fault* firstFault(const Results& r) {
  return r.faults.empty() ? nullptr : &r.faults.front();
}

}  // namespace calctrail
