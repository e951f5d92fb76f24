#include "engine/study/sweep.h"

#include <algorithm>
#include <exception>
#include <thread>

#include "engine/study/study_point.h"

namespace calctrail {

uint64_t SweepTable::totalPoints() const {
  uint64_t n = 1;
  for (uint64_t g : grid) n *= g;
  return n;
}

bool SweepTable::anyError() const {
  return std::any_of(faults.begin(), faults.end(), [](const Fault& f) { return !f.message.empty(); });
}

namespace {

// Points [begin, end) of the table, in one context.
void runChunk(const Model& m, const Inputs& base, const Results& base_results, const SweepSpec& spec,
              SweepTable* t, size_t begin, size_t end) {
  StudyPoint point(m, base, base_results);
  const size_t nv = spec.vary.size(), ns = spec.show.size(), nc = m.checks().size();
  std::vector<Slot> slots;
  for (const StudyRange& r : spec.vary) slots.push_back(r.input.slot);
  std::vector<double> x(nv, 0.0);
  for (size_t p = begin; p < end; ++p) {
    uint64_t rest = t->index[p];
    for (size_t j = nv; j-- > 0;) {  // the last input varies fastest
      const uint64_t n = spec.vary[j].values.size();
      x[j] = spec.vary[j].values[rest % n];
      rest /= n;
    }
    const Results& r = point.at(slots, x.data());
    for (size_t j = 0; j < nv; ++j) t->inputs[p * nv + j] = x[j];
    for (size_t j = 0; j < ns; ++j) t->results[p * ns + j] = r.value(spec.show[j]);
    const Fault* f = firstFault(r);
    for (size_t k = 0; k < nc; ++k)
      t->check_states[p * nc + k] = f ? -1 : static_cast<signed char>(r.checks[k].passed ? 1 : 0);
    if (f) t->faults[p] = *f;
  }
}

}  // namespace

SweepTable runSweep(const Model& m, const Inputs& base, const Results& base_results, const SweepSpec& spec) {
  SweepTable t;
  for (const StudyRange& r : spec.vary) {
    t.vary.push_back({r.input.name, r.input.unit});
    t.grid.push_back(r.values.size());
  }
  for (Slot s : spec.show) t.show.push_back({m.quantity(s).name, *m.slot(s).display});
  for (const Check& c : m.sheet().checks) t.checks.push_back(c.name);
  t.log = spec.log;
  t.shard = spec.shard;
  t.shards = spec.shards;
  const uint64_t total = t.totalPoints();
  for (uint64_t i = static_cast<uint64_t>(spec.shard - 1); i < total; i += static_cast<uint64_t>(spec.shards))
    t.index.push_back(i);
  const size_t n = t.index.size();
  t.inputs.assign(n * t.vary.size(), 0.0);
  t.results.assign(n * t.show.size(), 0.0);
  t.check_states.assign(n * t.checks.size(), -1);
  t.faults.assign(n, Fault());

  // Contiguous chunks, one context per thread: each point is computed as it
  // would be alone, so the split changes nothing in the table.
  const size_t jobs = std::max<size_t>(1, std::min<size_t>(spec.jobs, n / 64 + 1));
  std::vector<std::exception_ptr> failed(jobs);
  std::vector<std::thread> threads;
  for (size_t k = 0; k < jobs; ++k) {
    const size_t b = n * k / jobs, e = n * (k + 1) / jobs;
    auto work = [&, b, e, k] {
      try {
        runChunk(m, base, base_results, spec, &t, b, e);
      } catch (...) {
        failed[k] = std::current_exception();
      }
    };
    if (k + 1 == jobs)
      work();  // the last chunk on this thread
    else
      threads.emplace_back(work);
  }
  for (std::thread& th : threads) th.join();
  for (const std::exception_ptr& e : failed)
    if (e) std::rethrow_exception(e);
  return t;
}

}  // namespace calctrail
