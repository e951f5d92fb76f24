#include "engine/study/sensitivity.h"

#include <algorithm>
#include <cmath>

#include "engine/study/study_point.h"
#include "engine/study/upstream.h"

namespace calctrail {

namespace {

InputSensitivity oneInput(const Model& m, const Inputs& base, const Results& base_results, Slot of, Slot in,
                          const SensitivityOptions& o) {
  InputSensitivity s;
  s.slot = in;
  s.name = m.quantity(in).name;
  s.value = base_results.value(in);
  const double y0 = base_results.value(of);
  StudyPoint point(m, base, base_results);
  const double x0 = s.value;
  if (x0 == 0) {
    s.error = "`" + s.name + "` is 0: a relative change of it is not defined";
  } else {
    const double xp = x0 * (1 + o.step), xm = x0 * (1 - o.step);
    const Results& rp = point.at(in, xp);
    const bool bad_p = firstFault(rp) != nullptr;
    const double yp = rp.value(of);
    const std::string ep = bad_p ? firstFault(rp)->message : "";
    const Results& rm = point.at(in, xm);
    const Fault* fm = firstFault(rm);
    const double ym = rm.value(of);
    if (bad_p || fm) {
      s.error = "cannot be differentiated: " + (bad_p ? ep : fm->message);
    } else if ((yp > 0 && ym > 0 && y0 > 0) || (yp < 0 && ym < 0 && y0 < 0)) {
      // Logarithms of both: exact for a power law whatever the step.
      s.elasticity = (std::log(std::fabs(yp)) - std::log(std::fabs(ym))) / (std::log(xp / xm));
      s.ok = true;
    } else {
      s.elasticity = (yp - ym) / (xp - xm) * x0 / y0;
      s.ok = std::isfinite(s.elasticity);
      if (!s.ok) s.error = "the result changes sign at the nominal point";
    }
  }
  // The checks that flip within +-flip_range: the nearest sample on each side.
  std::vector<signed char> nominal;
  for (const CheckResult& c : base_results.checks) nominal.push_back(c.passed ? 1 : 0);
  for (int side : {1, -1}) {
    std::vector<char> reported(nominal.size(), 0);
    for (int i = 1; i <= o.flip_steps && x0 != 0; ++i) {
      const double change = side * o.flip_range * i / o.flip_steps;
      const Results& r = point.at(in, x0 * (1 + change));
      if (const Fault* f = firstFault(r)) {
        if (s.fails_at == 0 || std::fabs(change) < std::fabs(s.fails_at)) {
          s.fails_at = change;
          s.fails_message = f->message;
        }
        break;
      }
      for (size_t k = 0; k < nominal.size(); ++k) {
        if (reported[k] || (r.checks[k].passed ? 1 : 0) == nominal[k]) continue;
        reported[k] = 1;
        s.flips.push_back({m.sheet().checks[k].name, change, r.checks[k].passed});
      }
    }
  }
  std::stable_sort(s.flips.begin(), s.flips.end(), [](const SensitivityFlip& a, const SensitivityFlip& b) {
    return std::fabs(a.change) < std::fabs(b.change);
  });
  return s;
}

}  // namespace

SensitivityOutcome runSensitivity(const Model& m, const Inputs& base, const Results& base_results, Slot of,
                                  const SensitivityOptions& o) {
  SensitivityOutcome out;
  out.of = of;
  out.value = base_results.value(of);
  for (Slot in : upstreamInputs(m, base, of)) {
    if (in == of) continue;
    out.inputs.push_back(oneInput(m, base, base_results, of, in, o));
  }
  std::stable_sort(out.inputs.begin(), out.inputs.end(),
                   [](const InputSensitivity& a, const InputSensitivity& b) {
                     if (a.ok != b.ok) return a.ok;
                     return a.ok && std::fabs(a.elasticity) > std::fabs(b.elasticity);
                   });
  return out;
}

}  // namespace calctrail
