// Edit distance and "did you mean" suggestions: the banded distance against
// the whole table, the suggestions against examining every candidate in full,
// and the shapes an audit found quadratic (names sharing a long stem, long names).
#include <catch2/catch.hpp>

#include <algorithm>
#include <random>
#include <string>
#include <vector>

#include "engine/util/edit_distance.h"
#include "tests/test_support.h"

using namespace calctrail;

namespace {

// The whole optimal-string-alignment table, as the textbook writes it: the
// reference the banded, affix-stripping distance must agree with.
int fullDistance(const std::string& a, const std::string& b) {
  const size_t n = a.size(), m = b.size();
  std::vector<std::vector<int>> d(n + 1, std::vector<int>(m + 1, 0));
  for (size_t i = 0; i <= n; ++i) d[i][0] = static_cast<int>(i);
  for (size_t j = 0; j <= m; ++j) d[0][j] = static_cast<int>(j);
  for (size_t i = 1; i <= n; ++i) {
    for (size_t j = 1; j <= m; ++j) {
      const int cost = a[i - 1] == b[j - 1] ? 0 : 1;
      d[i][j] = std::min({d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost});
      if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
        d[i][j] = std::min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[n][m];
}

std::string lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

// The suggestions by examining every candidate with the whole table, sorted
// stably by distance, duplicates dropped: what nearestWords must return.
std::vector<std::string> referenceNearest(const std::string& word, const std::vector<std::string>& candidates,
                                          size_t max = 3) {
  const int limit = std::clamp(static_cast<int>(word.size()) / 3, 1, 3);
  std::vector<std::pair<int, std::string>> scored;
  for (const std::string& c : candidates) {
    if (c == word) continue;
    int d;
    if (lower(c) == lower(word)) {
      d = 0;
    } else if (word.size() < 2) {
      continue;
    } else {
      d = fullDistance(word, c);
      if (d > limit) continue;
    }
    scored.emplace_back(d, c);
  }
  std::stable_sort(scored.begin(), scored.end(),
                   [](const auto& x, const auto& y) { return x.first < y.first; });
  std::vector<std::string> out;
  for (const auto& s : scored)
    if (out.size() < max && std::find(out.begin(), out.end(), s.second) == out.end()) out.push_back(s.second);
  return out;
}

std::string randomWord(std::mt19937* rng, const std::string& alphabet, size_t min_len, size_t max_len) {
  std::uniform_int_distribution<size_t> len(min_len, max_len), pick(0, alphabet.size() - 1);
  std::string s(len(*rng), ' ');
  for (char& c : s) c = alphabet[pick(*rng)];
  return s;
}

// "quantity_with_a_very_long_shared_prefix_000123", as the audit's sheet names them.
std::string stemName(const std::string& tail) { return "quantity_with_a_very_long_shared_prefix_" + tail; }

std::string digits6(int i) {
  std::string s = std::to_string(i);
  return std::string(6 - s.size(), '0') + s;
}

}  // namespace

TEST_CASE("editDistance counts edits, a transposition as one", "[edit_distance]") {
  CHECK(editDistance("kitten", "sitting") == 3);
  CHECK(editDistance("force", "forse") == 1);
  CHECK(editDistance("ab", "ba") == 1);
  CHECK(editDistance("ca", "abc") == 3);  // optimal string alignment: no edit of a transposed pair
  CHECK(editDistance("", "abc") == 3);
  CHECK(editDistance("same", "same") == 0);
  // With a limit, anything beyond it is limit + 1.
  CHECK(editDistance("kitten", "sitting", 2) == 3);
  CHECK(editDistance("kitten", "sitting", 3) == 3);
  CHECK(editDistance("a", "abcdefgh", 3) == 4);
  CHECK(editDistance("abcdefgh", "hgfedcba", 2) == 3);
}

TEST_CASE("the banded distance equals the whole table, with and without a limit", "[edit_distance]") {
  std::mt19937 rng(20261201);
  for (const std::string alphabet : {"ab", "abc", "abcdefghij"}) {
    for (int trial = 0; trial < 4000; ++trial) {
      const std::string a = randomWord(&rng, alphabet, 0, 10);
      const std::string b = randomWord(&rng, alphabet, 0, 10);
      const int full = fullDistance(a, b);
      INFO(a << " / " << b);
      REQUIRE(editDistance(a, b) == full);
      for (int k = 1; k <= 9; ++k) REQUIRE(editDistance(a, b, k) == std::min(full, k + 1));
    }
  }
}

TEST_CASE("nearestWords gives what examining every candidate in full gives", "[edit_distance]") {
  std::mt19937 rng(7);
  for (int trial = 0; trial < 400; ++trial) {
    std::vector<std::string> candidates;
    const int count = 1 + trial % 60;
    for (int i = 0; i < count; ++i) candidates.push_back(randomWord(&rng, "abcAB_", 1, 7));
    for (int i = 0; i < count / 4; ++i)  // repeats, which must be suggested once
      candidates.push_back(candidates[static_cast<size_t>(i) * 3 % candidates.size()]);
    std::shuffle(candidates.begin(), candidates.end(), rng);
    const std::string word = randomWord(&rng, "abcAB_", 1, 8);
    INFO(word);
    for (size_t max : {1, 3, 5})
      REQUIRE(nearestWords(word, candidates, max) == referenceNearest(word, candidates, max));
  }
}

TEST_CASE("suggestions on an ordinary sheet keep their quality", "[edit_distance]") {
  const std::vector<std::string> names = {"F", "d", "d_m", "d_r", "p", "T_raise", "T_lower", "force",
                                          "alpha"};
  CHECK(nearestWords("forse", names) == std::vector<std::string>{"force"});
  CHECK(nearestWords("T_rasie", names) == std::vector<std::string>{"T_raise"});
  CHECK(nearestWords("t_raise", names) == std::vector<std::string>{"T_raise"});
  CHECK(nearestWords("D", names) == std::vector<std::string>{"d"});   // case only, even for one letter
  CHECK(nearestWords("q", names).empty());                            // one letter: no guess
  CHECK(nearestWords("d_x", names) == std::vector<std::string>{"d_m", "d_r"});  // `d` is two edits away
  CHECK(nearestWords("d_x", names, 1) == std::vector<std::string>{"d_m"});
  CHECK(nearestWords("d_x", names, 0).empty());
  CHECK(nearestWords("zzzzzz", names).empty());
}

TEST_CASE("names sharing a long stem get the right suggestions", "[edit_distance][perf]") {
  // The audit's sheet: thousands of names that differ only in their last digits.
  std::vector<std::string> names;
  for (int i = 0; i < 3000; ++i) names.push_back(stemName(digits6(i)));
  for (int i : {0, 123, 999, 2999}) {
    std::string tail = digits6(i);
    tail[0] = 'x';  // "x00123": one substitution from "000123" and from no other name
    const std::string word = stemName(tail);
    const std::vector<std::string> near = nearestWords(word, names);
    INFO(word);
    CHECK(near == referenceNearest(word, names));
    REQUIRE(near.size() == 3);
    CHECK(near[0] == stemName(digits6(i)));
  }
  // A swap of two letters in the stem is one edit from exactly one name.
  const std::string swapped = "quantity_with_a_very_long_shared_prefxi_000123";
  const std::vector<std::string> near = nearestWords(swapped, names);
  CHECK(near == referenceNearest(swapped, names));
  REQUIRE_FALSE(near.empty());
  CHECK(near[0] == stemName("000123"));
}

TEST_CASE("long names are compared in full, within the band", "[edit_distance][perf]") {
  // 300 names of 2,000 characters: the whole table would be 4M cells a pair.
  std::mt19937 rng(3);
  const std::string body = randomWord(&rng, "abcdefghijklmnopqrstuvwxyz_", 2000, 2000);
  std::vector<std::string> names;
  for (int i = 0; i < 300; ++i) {
    std::string n = body;
    n[static_cast<size_t>(i) * 6] = '0';  // each name differs from the body at its own place...
    n[n.size() - 1 - static_cast<size_t>(i)] = '1';  // ...and again near the end
    names.push_back(n);
  }
  std::string word = names[150];
  word[1000] = word[1000] == 'q' ? 'r' : 'q';  // one edit from names[150], four at least from the others
  CHECK(nearestWords(word, names) == std::vector<std::string>{names[150]});
  CHECK(editDistance(word, names[150], 3) == 1);
  CHECK(editDistance(word, names[151], 3) == 4);
  CHECK(editDistance(names[0], names[299]) == fullDistance(names[0], names[299]));
}

TEST_CASE("a sheet of stem-sharing unknown names suggests the right quantity", "[edit_distance][calc]") {
  std::string sheet;
  for (int i = 0; i < 1000; ++i) sheet += stemName(digits6(i)) + " = " + std::to_string(i) + " mm\n";
  sheet += "y = " + stemName("x00123") + " + 1 mm\n";
  const std::string d = test::diagnostics(*test::calc(sheet));
  CHECK(d.find("unknown name `" + stemName("x00123") + "`; did you mean `" + stemName("000123") + "`") !=
        std::string::npos);
}

TEST_CASE("quotedList joins words for a message", "[edit_distance]") {
  CHECK(quotedList({}).empty());
  CHECK(quotedList({"a"}) == "`a`");
  CHECK(quotedList({"a", "b"}) == "`a` or `b`");
  CHECK(quotedList({"a", "b", "c"}) == "`a`, `b` or `c`");
}
