#include "engine/util/edit_distance.h"

#include <algorithm>
#include <cctype>

namespace calctrail {

int editDistance(std::string_view a, std::string_view b, int max_distance) {
  const int n = static_cast<int>(a.size());
  const int m = static_cast<int>(b.size());
  if (max_distance > 0 && std::abs(n - m) > max_distance) return max_distance + 1;
  // Three rows suffice for the transposition rule.
  std::vector<int> prev2(m + 1), prev(m + 1), cur(m + 1);
  for (int j = 0; j <= m; ++j) prev[j] = j;
  for (int i = 1; i <= n; ++i) {
    cur[0] = i;
    int row_best = cur[0];
    for (int j = 1; j <= m; ++j) {
      const int cost = a[i - 1] == b[j - 1] ? 0 : 1;
      int v = std::min({prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost});
      if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
        v = std::min(v, prev2[j - 2] + 1);
      cur[j] = v;
      row_best = std::min(row_best, v);
    }
    if (max_distance > 0 && row_best > max_distance) return max_distance + 1;
    std::swap(prev2, prev);
    std::swap(prev, cur);
  }
  return prev[m];
}

namespace {
std::string lower(std::string_view s) {
  std::string out(s);
  for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}
}  // namespace

std::vector<std::string> nearestWords(std::string_view word,
                                      const std::vector<std::string>& candidates,
                                      size_t max) {
  const int limit = std::clamp(static_cast<int>(word.size()) / 3, 1, 3);
  const std::string lw = lower(word);
  std::vector<std::pair<int, std::string>> scored;
  for (const std::string& c : candidates) {
    if (c == word) continue;
    int d;
    if (lower(c) == lw) {
      d = 0;  // only the case differs: the likeliest slip
    } else if (word.size() < 2) {
      continue;  // one letter is one edit from every other: no guess is useful
    } else {
      d = editDistance(word, c, limit);
      if (d > limit) continue;
    }
    scored.emplace_back(d, c);
  }
  std::stable_sort(scored.begin(), scored.end(),
                   [](const auto& x, const auto& y) { return x.first < y.first; });
  std::vector<std::string> out;
  for (auto& s : scored) {
    if (out.size() >= max) break;
    if (std::find(out.begin(), out.end(), s.second) == out.end()) out.push_back(s.second);
  }
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
