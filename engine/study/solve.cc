#include "engine/study/solve.h"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <memory>

#include <boost/math/tools/roots.hpp>

#include "engine/report/number_format.h"
#include "engine/study/study_point.h"

namespace calctrail {

double checkMargin(const Model& m, size_t k, const Results& r) {
  const CheckResult& c = r.checks[k];
  switch (m.sheet().checks[k].op) {
    case Comparison::Less:
    case Comparison::LessEqual: return c.rhs - c.lhs;
    case Comparison::Greater:
    case Comparison::GreaterEqual: break;
  }
  return c.lhs - c.rhs;
}

namespace {

// Thrown out of an objective (and through the solver) when the sheet cannot
// be calculated at a value tried.
struct EvalFailure {
  Fault fault;
  double at;
};

bool allPass(const Results& r) {
  return std::all_of(r.checks.begin(), r.checks.end(), [](const CheckResult& c) { return c.ok && c.passed; });
}

std::vector<std::string> failingChecks(const Model& m, const Results& r) {
  std::vector<std::string> out;
  for (size_t k = 0; k < r.checks.size(); ++k)
    if (!r.checks[k].passed) out.push_back(m.sheet().checks[k].name);
  return out;
}

// TOMS 748 to within a few units in the last place: the root is then as
// exact as the arithmetic of the sheet allows.
using Tolerance = boost::math::tools::eps_tolerance<double>;
Tolerance tolerance() {
  return Tolerance(std::numeric_limits<double>::digits - 2);
}
constexpr std::uintmax_t kMaxIterations = 200;

class Solver {
 public:
  Solver(const Model& m, const Inputs& base, const Results& base_results, const SolveSpec& spec)
      : m_(m), spec_(spec), point_(m, base, base_results) {
    if (spec.mode == SolveMode::Target) {
      lhs_ = std::make_unique<StudyExprEvaluator>(spec.lhs);
      rhs_ = std::make_unique<StudyExprEvaluator>(spec.rhs);
    }
  }

  SolveOutcome run() {
    try {
      if (spec_.mode == SolveMode::Target)
        target();
      else
        capacity(spec_.mode == SolveMode::CapacityMax);
    } catch (const EvalFailure& f) {
      out_.status = SolveStatus::EvalFailed;
      out_.fault = f.fault;
      out_.fault_at = f.at;
    }
    out_.evaluations = evaluations_;
    return std::move(out_);
  }

 private:
  const Results& at(double x) {
    ++evaluations_;
    const Results& r = point_.at(spec_.input.slot, x);
    if (const Fault* f = firstFault(r)) throw EvalFailure{*f, x};
    return r;
  }

  // lhs - rhs at x; lhs and rhs in *l, *r.
  double gap(double x, double* l = nullptr, double* r = nullptr) {
    const Results& res = at(x);
    const double a = lhs_->eval(res), b = rhs_->eval(res);
    if (!std::isfinite(a) || !std::isfinite(b)) {
      Fault f;
      f.message = "the target `" + spec_.lhs.text + " = " + spec_.rhs.text + "` cannot be evaluated";
      throw EvalFailure{f, x};
    }
    if (l) *l = a;
    if (r) *r = b;
    return a - b;
  }

  std::vector<double> samplePoints() const {
    const int n = std::max(3, spec_.samples);
    std::vector<double> xs(static_cast<size_t>(n));
    for (int i = 0; i < n; ++i)
      xs[static_cast<size_t>(i)] = spec_.lo + (spec_.hi - spec_.lo) * static_cast<double>(i) / (n - 1);
    xs.back() = spec_.hi;
    return xs;
  }

  void target() {
    const std::vector<double> xs = samplePoints();
    std::vector<double> gs(xs.size());
    for (size_t i = 0; i < xs.size(); ++i) gs[i] = gap(xs[i]);
    gap(xs.front(), &out_.lhs_at_lo, &out_.rhs_at_lo);
    gap(xs.back(), &out_.lhs_at_hi, &out_.rhs_at_hi);
    bool rises = false, falls = false;
    for (size_t i = 0; i + 1 < gs.size(); ++i) {
      rises |= gs[i + 1] > gs[i];
      falls |= gs[i + 1] < gs[i];
    }
    std::vector<size_t> changes;  // i: a root in [xs[i], xs[i+1]], or at xs[i]
    for (size_t i = 0; i < xs.size(); ++i) {
      if (gs[i] == 0 || (i + 1 < xs.size() && (gs[i] < 0) != (gs[i + 1] < 0) && gs[i + 1] != 0))
        changes.push_back(i);
    }
    const std::string what = "`" + spec_.lhs.text + "`";
    if (rises && falls)
      out_.warnings.push_back(
          what + " is not monotone in `" + spec_.input.name + "` over the bracket (it rises " +
          "and falls between the " + std::to_string(xs.size()) + " points sampled)" +
          (changes.size() > 1 ? "; it meets the target " + std::to_string(changes.size()) +
                                    " times: the value nearest LO is given"
                              : ""));
    if (changes.empty()) {
      out_.status = SolveStatus::NotReached;
      return;
    }
    const size_t i = changes.front();
    if (gs[i] == 0) {
      out_.value = out_.bracket_lo = out_.bracket_hi = xs[i];
    } else {
      std::uintmax_t iterations = kMaxIterations;
      auto f = [this](double x) { return gap(x); };
      const auto [a, b] =
          boost::math::tools::toms748_solve(f, xs[i], xs[i + 1], gs[i], gs[i + 1], tolerance(), iterations);
      out_.bracket_lo = a;
      out_.bracket_hi = b;
      out_.value = std::fabs(gap(a)) <= std::fabs(gap(b)) ? a : b;
    }
    gap(out_.value, &out_.lhs, &out_.rhs);
    out_.results = point_.at(spec_.input.slot, out_.value);
  }

  // The largest (max) or smallest value passing every check.
  void capacity(bool max) {
    const std::vector<double> xs = samplePoints();
    std::vector<char> pass(xs.size());
    for (size_t i = 0; i < xs.size(); ++i) pass[i] = allPass(at(xs[i]));
    int runs = 0;  // stretches of passing samples
    for (size_t i = 0; i < xs.size(); ++i) runs += pass[i] && (i == 0 || !pass[i - 1]);
    if (std::none_of(pass.begin(), pass.end(), [](char p) { return p != 0; })) {
      out_.status = SolveStatus::NotReached;
      out_.failing_lo = failingChecks(m_, at(xs.front()));
      out_.failing_hi = failingChecks(m_, at(xs.back()));
      return;
    }
    if (runs > 1)
      out_.warnings.push_back("every check passes in " + std::to_string(runs) +
                              " separate parts of the bracket " + "(sampled at " + std::to_string(xs.size()) +
                              " points), so the result is not " + "monotone in `" + spec_.input.name +
                              "`; the " + (max ? "largest" : "smallest") + " passing value is given");
    // The passing sample nearest the end sought, and its neighbour beyond.
    size_t k = max ? xs.size() - 1 : 0;
    while (!pass[k]) k = max ? k - 1 : k + 1;
    if ((max && k == xs.size() - 1) || (!max && k == 0)) {
      out_.value = out_.bracket_lo = out_.bracket_hi = xs[k];
      out_.results = at(xs[k]);
      return;  // the bracket's end limits: no check does
    }
    double good = xs[k], bad = xs[max ? k + 1 : k - 1];
    std::string limiting;
    for (int round = 0; round < 16; ++round) {
      const Results fails = at(bad);
      const Results passes = at(good);
      double best = bad;
      std::string best_check;
      double best_lo = good, best_hi = bad;
      for (size_t c = 0; c < fails.checks.size(); ++c) {
        if (fails.checks[c].passed) continue;
        const double mg = checkMargin(m_, c, passes);
        double mb = checkMargin(m_, c, fails);
        if (mb == 0) mb = -std::numeric_limits<double>::denorm_min();  // a strict check failing at equality
        double side = good, lo = std::min(good, bad), hi = std::max(good, bad);
        if (mg > 0 && mb < 0) {
          std::uintmax_t iterations = kMaxIterations;
          auto f = [this, c](double x) { return checkMargin(m_, c, at(x)); };
          const double flo = max ? mg : mb, fhi = max ? mb : mg;
          const auto ab = boost::math::tools::toms748_solve(f, lo, hi, flo, fhi, tolerance(), iterations);
          lo = ab.first;
          hi = ab.second;
          side = max ? lo : hi;  // the end of the last bracket on the passing side
        }
        if (best_check.empty() || (max ? side < best : side > best)) {
          best = side;
          best_check = m_.sheet().checks[c].name;
          best_lo = lo;
          best_hi = hi;
        }
      }
      limiting = best_check;
      out_.bracket_lo = best_lo;
      out_.bracket_hi = best_hi;
      if (allPass(at(best))) {
        good = best;
        break;
      }
      bad = best;  // another check fails first, between the samples: refine toward it
    }
    out_.value = good;
    out_.limiting_check = limiting;
    out_.results = at(good);
  }

  const Model& m_;
  const SolveSpec& spec_;
  StudyPoint point_;
  std::unique_ptr<StudyExprEvaluator> lhs_, rhs_;
  SolveOutcome out_;
  int evaluations_ = 0;
};

}  // namespace

SolveOutcome runSolve(const Model& m, const Inputs& base, const Results& base_results,
                      const SolveSpec& spec) {
  Solver solver(m, base, base_results, spec);
  return solver.run();
}

}  // namespace calctrail
