// A sweep: one input over a range or a list, or two inputs on a grid, each
// point evaluated through the cone of the varied inputs, the chosen results
// and the state of every check recorded. Points spread over threads (one
// Evaluation each); every point is computed exactly as alone, so the table
// is bit for bit the same for any number of threads and any sharding.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "engine/eval/slot.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/model/results.h"
#include "engine/study/study_range.h"
#include "engine/units/unit.h"

namespace calctrail {

struct SweepSpec {
  /// One input, or two for a grid (the first varies slowest).
  std::vector<StudyRange> vary;
  /// The results recorded at every point.
  std::vector<Slot> show;
  /// Logarithmic steps (for the plot's x axis).
  bool log = false;
  /// Threads to spread the points over (at least 1).
  unsigned jobs = 1;
  /// This run computes the points whose index i has i % shards == shard - 1.
  int shard = 1, shards = 1;
};

struct SweepColumn {
  /// The quantity's name.
  std::string name;
  /// The unit its values are shown in (factor and offset as the run had them).
  Unit unit;
};

// What a sweep gives, for the renderers; also read back from a shard's JSON
// to merge shards (sweep_merge.h). Values are SI; point p's entries are at
// p * vary.size() + j, p * show.size() + j, p * checks.size() + k.
struct SweepTable {
  /// The worksheet as named on the command line, and the SHA-256 of its bytes.
  std::string sheet_path, sheet_sha256;
  /// The --set replacements of the run, as given.
  std::vector<std::string> sets;
  /// The varied inputs and the shown results.
  std::vector<SweepColumn> vary, show;
  /// The first input steps logarithmically (the plot's x axis is logarithmic).
  bool log = false;
  /// Values per varied input: the grid is their product.
  std::vector<uint64_t> grid;
  /// The checks of the sheet, in sheet order.
  std::vector<std::string> checks;
  /// Which shard of how many this table holds (1 of 1: the whole sweep).
  int shard = 1, shards = 1;
  /// Per point held: its index in the whole grid, ascending.
  std::vector<uint64_t> index;
  /// Per point and varied input: the SI value.
  std::vector<double> inputs;
  /// Per point and shown result: the SI value; NaN where the point could not be calculated.
  std::vector<double> results;
  /// Per point and check: 1 passed, 0 failed, -1 not evaluated (the point has an error).
  std::vector<signed char> check_states;
  /// Per point: the first fault (an empty message when the point was calculated). Its file points
  /// into the Model or the Inputs of the run; null in a table read back from JSON.
  std::vector<Fault> faults;

  uint64_t totalPoints() const;
  size_t size() const { return index.size(); }
  double input(size_t p, size_t j) const { return inputs[p * vary.size() + j]; }
  double result(size_t p, size_t j) const { return results[p * show.size() + j]; }
  signed char check(size_t p, size_t k) const { return check_states[p * checks.size() + k]; }
  bool failed(size_t p) const { return !faults[p].message.empty(); }
  // Some point of this table could not be calculated.
  bool anyError() const;
};

// Runs the sweep over `base` (the sheet with --set), whose evaluation is
// `base_results`. The table's sheet_path, sheet_sha256 and sets are left for
// the caller.
SweepTable runSweep(const Model& model, const Inputs& base, const Results& base_results,
                    const SweepSpec& spec);

}  // namespace calctrail
