#include "engine/util/edit_distance.h"

#include <algorithm>
#include <utility>

namespace calctrail {

namespace {

// ASCII only: names are ASCII or UTF-8, whose bytes above 127 have no case
// here; and no call into the locale for every byte of every candidate.
char lowerAscii(char c) { return c >= 'A' && c <= 'Z' ? static_cast<char>(c - 'A' + 'a') : c; }

bool equalIgnoringCase(std::string_view a, std::string_view b) {
  if (a.size() != b.size()) return false;
  for (size_t i = 0; i < a.size(); ++i)
    if (a[i] != b[i] && lowerAscii(a[i]) != lowerAscii(b[i])) return false;
  return true;
}

// The optimal string alignment distance of a and b, or k + 1 once it exceeds
// k, filling only the diagonal band |i - j| <= k of the table (Ukkonen): no
// path through a cell outside it costs k or less. (2k + 1) * |a| cells, not
// |a| * |b|. Needs |len a - len b| <= k.
int bandedDistance(std::string_view a, std::string_view b, int k) {
  const int n = static_cast<int>(a.size());
  const int m = static_cast<int>(b.size());
  const int inf = k + 1;  // "more than k": every value is clamped to it
  const int w = 2 * k + 1;
  // Three rows of the band: row i, column j sits at t = j - i + k, stored at
  // t + 1 so that both neighbours outside the band read as inf.
  constexpr int kSmall = 3 * (2 * 8 + 3);
  int small[kSmall];
  std::vector<int> large;
  int* store = small;
  const size_t row_size = static_cast<size_t>(w) + 2;
  if (3 * row_size > static_cast<size_t>(kSmall)) {
    large.resize(3 * row_size);
    store = large.data();
  }
  std::fill(store, store + 3 * row_size, inf);
  int* prev2 = store;                 // row i - 2
  int* prev = store + row_size;       // row i - 1
  int* cur = store + 2 * row_size;    // row i
  for (int t = 0; t < w; ++t) {       // row 0: D[0][j] = j
    const int j = t - k;
    if (j >= 0 && j <= m) prev[t + 1] = j;
  }
  for (int i = 1; i <= n; ++i) {
    int row_best = inf;
    for (int t = 0; t < w; ++t) {
      const int j = i + t - k;
      int v = inf;
      if (j == 0) {
        v = std::min(i, inf);
      } else if (j > 0 && j <= m) {
        const int cost = a[i - 1] == b[j - 1] ? 0 : 1;
        v = std::min({prev[t + 1] + cost,    // D[i-1][j-1]: substitute or match
                      prev[t + 2] + 1,       // D[i-1][j]: delete a[i-1]
                      cur[t] + 1,            // D[i][j-1]: insert b[j-1]
                      inf});
        if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
          v = std::min(v, prev2[t + 1] + 1);  // D[i-2][j-2]: transpose
      }
      cur[t + 1] = v;
      row_best = std::min(row_best, v);
    }
    if (row_best > k) return inf;  // every path from here costs more than k
    std::swap(prev2, prev);
    std::swap(prev, cur);
  }
  return prev[m - n + k + 1];
}

}  // namespace

int editDistance(std::string_view a, std::string_view b, int max_distance) {
  // A common prefix or suffix never changes the distance: strip it, so that
  // names sharing a long stem cost only their differing middle.
  size_t p = 0;
  while (p < a.size() && p < b.size() && a[p] == b[p]) ++p;
  a.remove_prefix(p);
  b.remove_prefix(p);
  size_t s = 0;
  while (s < a.size() && s < b.size() && a[a.size() - 1 - s] == b[b.size() - 1 - s]) ++s;
  a.remove_suffix(s);
  b.remove_suffix(s);
  const int n = static_cast<int>(a.size());
  const int m = static_cast<int>(b.size());
  const int k = max_distance > 0 ? max_distance : std::max(n, m);
  if (std::abs(n - m) > k) return k + 1;  // that many insertions at least
  if (n == 0 || m == 0) return std::max(n, m);
  return bandedDistance(a, b, k);
}

std::vector<std::string> nearestWords(std::string_view word,
                                      const std::vector<std::string>& candidates,
                                      size_t max) {
  const int limit = std::clamp(static_cast<int>(word.size()) / 3, 1, 3);
  // The best so far, distinct, by distance and then candidate order: the
  // first `max` of a stable sort of every candidate within the limit. Once it
  // is full, a candidate must beat its last entry, which tightens the band.
  std::vector<std::pair<int, const std::string*>> best;
  if (max == 0) return {};
  for (const std::string& c : candidates) {
    if (c == word) continue;
    const int bound = best.size() < max ? limit : best.back().first - 1;
    if (bound < 0) break;  // `max` case-only matches: nothing later can displace one
    int d;
    if (equalIgnoringCase(c, word)) {
      d = 0;  // only the case differs: the likeliest slip
    } else if (word.size() < 2) {
      continue;  // one letter is one edit from every other: no guess is useful
    } else if (bound == 0) {
      continue;  // only a case-only match could still get in
    } else {
      d = editDistance(word, c, bound);
      if (d > bound) continue;
    }
    if (std::any_of(best.begin(), best.end(), [&](const auto& b) { return *b.second == c; })) continue;
    auto at = std::upper_bound(best.begin(), best.end(), d,
                               [](int x, const auto& b) { return x < b.first; });
    best.insert(at, {d, &c});
    if (best.size() > max) best.pop_back();
  }
  std::vector<std::string> out;
  out.reserve(best.size());
  for (const auto& b : best) out.push_back(*b.second);
  return out;
}

std::string quotedList(const std::vector<std::string>& words) {
  std::string out;
  for (size_t i = 0; i < words.size(); ++i) {
    if (i > 0) out += (i + 1 == words.size()) ? " or " : ", ";
    out += "`" + words[i] + "`";
  }
  return out;
}

}  // namespace calctrail
