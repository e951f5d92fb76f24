// Sweep shards back into one sweep: `calctrail sweep FILE ... --shard K/N
// --format json` runs the points whose index i has i % N == K - 1, in a
// process of its own (on another machine, say); `calctrail sweep --merge
// SHARD.json...` reads the shards back and gives the table one run of the
// whole sweep gives, in any format, byte for byte.
#pragma once

#include <string>
#include <vector>

#include "engine/study/sweep.h"

namespace calctrail {

// A sweep's JSON (renderSweepJson) read back into a table; false with the reason in *error.
bool readSweepJson(const std::string& text, SweepTable* out, std::string* error);

// The shards of one sweep (the same worksheet bytes, --set, inputs, results
// and grid; every shard 1..N exactly once) merged into the whole table;
// false with the reason in *error.
bool mergeSweeps(std::vector<SweepTable> shards, SweepTable* out, std::string* error);

}  // namespace calctrail
