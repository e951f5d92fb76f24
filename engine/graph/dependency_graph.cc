#include "engine/graph/dependency_graph.h"

#include <algorithm>
#include <queue>

namespace calctrail {

DependencyGraph::DependencyGraph(int nodes) : uses_(nodes), used_by_(nodes) {}

void DependencyGraph::addUse(int user, int used) {
  std::vector<int>& u = uses_[user];
  if (std::find(u.begin(), u.end(), used) != u.end()) return;
  rank_.clear();  // the order changes
  u.push_back(used);
  used_by_[used].push_back(user);
}

namespace {

// Tarjan's strongly connected components, iterative, over `nodes` only.
std::vector<std::vector<int>> stronglyConnected(const std::vector<std::vector<int>>& uses,
                                                const std::vector<char>& in_set) {
  const int n = static_cast<int>(uses.size());
  std::vector<int> index(n, -1), low(n, 0);
  std::vector<char> on_stack(n, 0);
  std::vector<int> stack;
  std::vector<std::vector<int>> out;
  int counter = 0;
  struct Frame { int node; size_t next; };
  for (int root = 0; root < n; ++root) {
    if (!in_set[root] || index[root] >= 0) continue;
    std::vector<Frame> frames{{root, 0}};
    index[root] = low[root] = counter++;
    stack.push_back(root);
    on_stack[root] = 1;
    while (!frames.empty()) {
      Frame& f = frames.back();
      if (f.next < uses[f.node].size()) {
        const int w = uses[f.node][f.next++];
        if (!in_set[w]) continue;
        if (index[w] < 0) {
          index[w] = low[w] = counter++;
          stack.push_back(w);
          on_stack[w] = 1;
          frames.push_back({w, 0});
        } else if (on_stack[w]) {
          low[f.node] = std::min(low[f.node], index[w]);
        }
        continue;
      }
      const int v = f.node;
      frames.pop_back();
      if (!frames.empty()) low[frames.back().node] = std::min(low[frames.back().node], low[v]);
      if (low[v] == index[v]) {
        std::vector<int> comp;
        int w;
        do {
          w = stack.back();
          stack.pop_back();
          on_stack[w] = 0;
          comp.push_back(w);
        } while (w != v);
        out.push_back(std::move(comp));
      }
    }
  }
  return out;
}

// A shortest loop from `start` back to itself inside `members`, by BFS.
std::vector<int> loopThrough(int start, const std::vector<std::vector<int>>& uses,
                             const std::vector<char>& member) {
  std::vector<int> parent(uses.size(), -1);
  std::queue<int> q;
  q.push(start);
  parent[start] = start;
  while (!q.empty()) {
    const int v = q.front();
    q.pop();
    for (int w : uses[v]) {
      if (!member[w]) continue;
      if (w == start) {
        std::vector<int> path;
        for (int x = v; x != start; x = parent[x]) path.push_back(x);
        path.push_back(start);
        std::reverse(path.begin(), path.end());
        return path;
      }
      if (parent[w] < 0) {
        parent[w] = v;
        q.push(w);
      }
    }
  }
  return {start};
}

}  // namespace

std::vector<int> DependencyGraph::order(std::vector<std::vector<int>>* cycles) const {
  const int n = size();
  std::vector<int> pending(n);
  // A min-heap keeps ties in node order: the same sheet, the same order.
  std::priority_queue<int, std::vector<int>, std::greater<int>> ready;
  for (int i = 0; i < n; ++i) {
    pending[i] = static_cast<int>(uses_[i].size());
    if (pending[i] == 0) ready.push(i);
  }
  std::vector<int> out;
  out.reserve(n);
  while (!ready.empty()) {
    const int v = ready.top();
    ready.pop();
    out.push_back(v);
    for (int w : used_by_[v])
      if (--pending[w] == 0) ready.push(w);
  }
  if (cycles && static_cast<int>(out.size()) < n) {
    std::vector<char> left(n, 1);
    for (int v : out) left[v] = 0;
    for (std::vector<int>& comp : stronglyConnected(uses_, left)) {
      const bool self_loop = comp.size() == 1 &&
          std::find(uses_[comp[0]].begin(), uses_[comp[0]].end(), comp[0]) != uses_[comp[0]].end();
      if (comp.size() < 2 && !self_loop) continue;  // only downstream of a cycle
      std::vector<char> member(n, 0);
      for (int v : comp) member[v] = 1;
      const int start = *std::min_element(comp.begin(), comp.end());
      std::vector<int> loop = loopThrough(start, uses_, member);
      // Name every member: those off the shortest loop follow it.
      std::sort(comp.begin(), comp.end());
      for (int v : comp)
        if (std::find(loop.begin(), loop.end(), v) == loop.end()) loop.push_back(v);
      cycles->push_back(std::move(loop));
    }
    std::sort(cycles->begin(), cycles->end());
  }
  return out;
}

std::vector<int> DependencyGraph::reach(int node, bool down) const {
  const int n = size();
  std::vector<char> seen(n, 0);
  std::vector<int> todo{node}, reached{node};
  seen[node] = 1;
  while (!todo.empty()) {
    const int v = todo.back();
    todo.pop_back();
    for (int w : down ? used_by_[v] : uses_[v]) {
      if (!seen[w]) {
        seen[w] = 1;
        todo.push_back(w);
        reached.push_back(w);
      }
    }
  }
  // Sorted by the position in the evaluation order, computed once per graph,
  // so a small cone costs little however large the sheet.
  if (rank_.empty()) {
    rank_.assign(n, n);
    const std::vector<int> o = order();
    for (size_t i = 0; i < o.size(); ++i) rank_[o[i]] = static_cast<int>(i);
  }
  std::vector<int> out;
  for (int v : reached)
    if (rank_[v] < n) out.push_back(v);  // nodes on or below a cycle have no place in the order
  std::sort(out.begin(), out.end(), [&](int a, int b) { return rank_[a] < rank_[b]; });
  return out;
}

std::vector<int> DependencyGraph::downstream(int node) const { return reach(node, true); }
std::vector<int> DependencyGraph::upstream(int node) const { return reach(node, false); }

}  // namespace calctrail
