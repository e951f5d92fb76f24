// Edit distance and "did you mean" suggestions, for unknown names and units.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

// Levenshtein distance with adjacent transpositions counted as one edit
// (optimal string alignment). Stops early and returns max_distance + 1 once
// the distance is known to exceed max_distance (when max_distance > 0).
int editDistance(std::string_view a, std::string_view b, int max_distance = 0);

// The candidates nearest to `word`, best first, at most `max` of them, and
// only those close enough to be a plausible slip (a third of the length, at
// least 1, at most 3 edits). A case-only difference counts as nearest.
std::vector<std::string> nearestWords(std::string_view word,
                                      const std::vector<std::string>& candidates,
                                      size_t max = 3);

// "`a`", "`a` or `b`", "`a`, `b` or `c`": for messages.
std::string quotedList(const std::vector<std::string>& words);

}  // namespace calctrail
