#include "engine/study/pick.h"

#include <algorithm>
#include <cmath>
#include <memory>

#include "engine/study/study_point.h"

namespace calctrail {

PickOutcome runPick(const Model& m, const Inputs& base, const Results& base_results, const StudyInput& input,
                    std::vector<double> candidates, const StudyExpr* by) {
  std::stable_sort(candidates.begin(), candidates.end());
  candidates.erase(std::unique(candidates.begin(), candidates.end()), candidates.end());
  StudyPoint point(m, base, base_results);
  std::unique_ptr<StudyExprEvaluator> by_eval;
  if (by) by_eval = std::make_unique<StudyExprEvaluator>(*by);
  PickOutcome out;
  for (double v : candidates) {
    const Results& r = point.at(input.slot, v);
    PickCandidate c;
    c.value = v;
    c.by = NAN;
    if (const Fault* f = firstFault(r)) {
      c.error = f->message;
    } else {
      for (size_t k = 0; k < r.checks.size(); ++k)
        if (!r.checks[k].passed) c.failed.push_back(m.sheet().checks[k].name);
      c.passed = c.failed.empty();
      if (by_eval) c.by = by_eval->eval(r);
    }
    out.tried.push_back(std::move(c));
    const PickCandidate& t = out.tried.back();
    if (!t.passed) continue;
    const int here = static_cast<int>(out.tried.size()) - 1;
    if (!by) {
      out.chosen = here;
      break;  // the smallest that passes
    }
    if (std::isfinite(t.by) && (out.chosen < 0 || t.by < out.tried[static_cast<size_t>(out.chosen)].by))
      out.chosen = here;
  }
  return out;
}

}  // namespace calctrail
