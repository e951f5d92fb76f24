// Edit distance and "did you mean" suggestions, for unknown names and units.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

// Levenshtein distance with adjacent transpositions counted as one edit
// (optimal string alignment). When max_distance > 0, returns max_distance + 1
// for any distance above it, and fills at most 2 * max_distance + 1 cells per
// character of `a` once a common prefix and suffix are stripped (a band of the
// table): linear in the length, however long the names.
int editDistance(std::string_view a, std::string_view b, int max_distance = 0);

// The candidates nearest to `word`, best first (ties in candidate order), at
// most `max` of them, and only those close enough to be a plausible slip (a
// third of the length, at least 1, at most 3 edits). A case-only difference
// counts as nearest. One pass over the candidates, each compared within the
// distance still worth knowing: O(total length of the candidates).
std::vector<std::string> nearestWords(std::string_view word,
                                      const std::vector<std::string>& candidates,
                                      size_t max = 3);

// "`a`", "`a` or `b`", "`a`, `b` or `c`": for messages.
std::string quotedList(const std::vector<std::string>& words);

}  // namespace calctrail
