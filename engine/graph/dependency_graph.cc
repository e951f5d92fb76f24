#include "engine/graph/dependency_graph.h"

#include <algorithm>
#include <queue>
#include <stdexcept>
#include <utility>

namespace calctrail {

DependencyGraph::DependencyGraph(int nodes)
    : nodes_(nodes), uses_at_(static_cast<size_t>(nodes) + 1, 0), used_by_at_(static_cast<size_t>(nodes) + 1, 0) {}

void DependencyGraph::addUse(int user, int used) {
  if (finished_) {
    // Adding again: back to the list of edges, from the arrays.
    for (int v = 0; v < nodes_; ++v)
      for (uint32_t k = uses_at_[v]; k < uses_at_[v + 1]; ++k) adding_.emplace_back(v, uses_[k]);
    finished_ = false;
  }
  adding_.emplace_back(user, used);
}

void DependencyGraph::finish() {
  if (finished_) return;
  const size_t n = static_cast<size_t>(nodes_);
  // Each user's edges together, in the order added (a stable counting sort),
  // then the repeats dropped: a mark per node says the user at hand uses it.
  std::vector<uint32_t> at(n + 1, 0);
  for (const auto& e : adding_) ++at[static_cast<size_t>(e.first) + 1];
  for (size_t v = 0; v < n; ++v) at[v + 1] += at[v];
  std::vector<uint32_t> by_user(adding_.size());
  {
    std::vector<uint32_t> next(at.begin(), at.end() - 1);
    for (uint32_t k = 0; k < adding_.size(); ++k) by_user[next[static_cast<size_t>(adding_[k].first)]++] = k;
  }
  std::vector<char> kept(adding_.size(), 0);
  std::vector<int> mark(n, -1);
  uses_at_.assign(n + 1, 0);
  uses_.clear();
  for (size_t v = 0; v < n; ++v) {
    for (uint32_t k = at[v]; k < at[v + 1]; ++k) {
      const int used = adding_[by_user[k]].second;
      if (mark[static_cast<size_t>(used)] == static_cast<int>(v)) continue;
      mark[static_cast<size_t>(used)] = static_cast<int>(v);
      kept[by_user[k]] = 1;
      uses_.push_back(used);
    }
    uses_at_[v + 1] = static_cast<uint32_t>(uses_.size());
  }
  uses_.shrink_to_fit();
  // The other way, in the order the edges were added.
  used_by_at_.assign(n + 1, 0);
  for (uint32_t k = 0; k < adding_.size(); ++k)
    if (kept[k]) ++used_by_at_[static_cast<size_t>(adding_[k].second) + 1];
  for (size_t v = 0; v < n; ++v) used_by_at_[v + 1] += used_by_at_[v];
  used_by_.assign(uses_.size(), 0);
  {
    std::vector<uint32_t> next(used_by_at_.begin(), used_by_at_.end() - 1);
    for (uint32_t k = 0; k < adding_.size(); ++k)
      if (kept[k]) used_by_[next[static_cast<size_t>(adding_[k].second)]++] = adding_[k].first;
  }
  std::vector<std::pair<int, int>>().swap(adding_);
  rank_.clear();  // the order may have changed
  finished_ = true;
}

void DependencyGraph::requireFinished() const {
  if (!finished_) throw std::logic_error("DependencyGraph: finish() before reading the graph");
}

NodeList DependencyGraph::uses(int node) const {
  requireFinished();
  return NodeList(uses_.data() + uses_at_[node], uses_.data() + uses_at_[node + 1]);
}

NodeList DependencyGraph::usedBy(int node) const {
  requireFinished();
  return NodeList(used_by_.data() + used_by_at_[node], used_by_.data() + used_by_at_[node + 1]);
}

size_t DependencyGraph::bytes() const {
  return (uses_at_.capacity() + used_by_at_.capacity()) * sizeof(uint32_t) +
         (uses_.capacity() + used_by_.capacity()) * sizeof(int) + adding_.capacity() * sizeof(adding_[0]) +
         rank_.capacity() * sizeof(int);
}

namespace {

// Tarjan's strongly connected components, iterative, over `nodes` only.
std::vector<std::vector<int>> stronglyConnected(const DependencyGraph& g, const std::vector<char>& in_set) {
  const int n = g.size();
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
      if (f.next < g.uses(f.node).size()) {
        const int w = g.uses(f.node)[f.next++];
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

// A shortest loop from `start` back to itself through the nodes of component
// `comp` only, by BFS. `parent` is scratch of the graph's size, all -1, and is
// left so: only the nodes visited are reset, so each component costs its own
// size and edges, not the whole graph's.
std::vector<int> loopThrough(int start, int comp, const DependencyGraph& g,
                             const std::vector<int>& comp_of, std::vector<int>* parent) {
  std::vector<int>& from = *parent;
  std::vector<int> visited{start};  // also the BFS queue, read from `head`
  from[start] = start;
  std::vector<int> path;
  for (size_t head = 0; head < visited.size() && path.empty(); ++head) {
    const int v = visited[head];
    for (int w : g.uses(v)) {
      if (comp_of[w] != comp) continue;
      if (w == start) {
        for (int x = v; x != start; x = from[x]) path.push_back(x);
        path.push_back(start);
        std::reverse(path.begin(), path.end());
        break;
      }
      if (from[w] < 0) {
        from[w] = v;
        visited.push_back(w);
      }
    }
  }
  for (int v : visited) from[v] = -1;
  if (path.empty()) path.push_back(start);
  return path;
}

}  // namespace

std::vector<int> DependencyGraph::order(std::vector<std::vector<int>>* cycles) const {
  requireFinished();
  const int n = size();
  std::vector<int> pending(n);
  // A min-heap keeps ties in node order: the same sheet, the same order.
  std::priority_queue<int, std::vector<int>, std::greater<int>> ready;
  for (int i = 0; i < n; ++i) {
    pending[i] = static_cast<int>(uses(i).size());
    if (pending[i] == 0) ready.push(i);
  }
  std::vector<int> out;
  out.reserve(n);
  while (!ready.empty()) {
    const int v = ready.top();
    ready.pop();
    out.push_back(v);
    for (int w : usedBy(v))
      if (--pending[w] == 0) ready.push(w);
  }
  if (cycles && static_cast<int>(out.size()) < n) {
    std::vector<char> left(n, 1);
    for (int v : out) left[v] = 0;
    std::vector<std::vector<int>> comps = stronglyConnected(*this, left);
    // Scratch of the graph's size, allocated once for every component: one
    // array per component would make N/2 two-member cycles cost N^2 / 2.
    std::vector<int> comp_of(n, -1), parent(n, -1);
    std::vector<char> on_loop(n, 0);
    for (size_t c = 0; c < comps.size(); ++c)
      for (int v : comps[c]) comp_of[v] = static_cast<int>(c);
    for (size_t c = 0; c < comps.size(); ++c) {
      std::vector<int>& comp = comps[c];
      const NodeList own = uses(comp[0]);
      const bool self_loop = comp.size() == 1 && std::find(own.begin(), own.end(), comp[0]) != own.end();
      if (comp.size() < 2 && !self_loop) continue;  // only downstream of a cycle
      const int start = *std::min_element(comp.begin(), comp.end());
      std::vector<int> loop = loopThrough(start, static_cast<int>(c), *this, comp_of, &parent);
      // Name every member: those off the shortest loop follow it, in node order.
      for (int v : loop) on_loop[v] = 1;
      std::sort(comp.begin(), comp.end());
      for (int v : comp)
        if (!on_loop[v]) loop.push_back(v);
      for (int v : comp) on_loop[v] = 0;
      cycles->push_back(std::move(loop));
    }
    // Each loop starts at its least member and no two share one: the sort
    // compares first elements only.
    std::sort(cycles->begin(), cycles->end());
  }
  return out;
}

std::vector<int> DependencyGraph::reach(int node, bool down) const {
  requireFinished();
  const int n = size();
  std::vector<char> seen(n, 0);
  std::vector<int> todo{node}, reached{node};
  seen[node] = 1;
  while (!todo.empty()) {
    const int v = todo.back();
    todo.pop_back();
    for (int w : down ? usedBy(v) : uses(v)) {
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
