// Yen's k shortest loopless paths; see k_shortest_paths.h.
#include "apportion/multiflow/k_shortest_paths.h"

#include <algorithm>
#include <limits>
#include <queue>
#include <set>

namespace apportion {

namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

struct Search {
  int n;
  const std::vector<Lane>& lanes;
  const std::vector<double>& length;
  std::vector<std::vector<int>> out;

  Search(int node_count, const std::vector<Lane>& l, const std::vector<double>& len)
      : n(node_count), lanes(l), length(len), out(node_count) {
    for (int i = 0; i < static_cast<int>(lanes.size()); ++i) out[lanes[i].tail].push_back(i);
  }

  // Dijkstra avoiding banned nodes and lanes; false when the destination is unreachable.
  bool run(int s, int t, const std::vector<char>& banned_node, const std::vector<char>& banned_lane,
           std::vector<int>& path) const {
    std::vector<double> dist(n, kInf);
    std::vector<int> pred(n, -1);
    using Item = std::pair<double, int>;
    std::priority_queue<Item, std::vector<Item>, std::greater<Item>> heap;
    dist[s] = 0;
    heap.push({0, s});
    while (!heap.empty()) {
      auto [d, u] = heap.top();
      heap.pop();
      if (d > dist[u]) continue;
      if (u == t) break;
      for (int i : out[u]) {
        const int v = lanes[i].head;
        if (banned_lane[i] || banned_node[v]) continue;
        const double nd = d + length[lanes[i].arc];
        if (nd < dist[v]) dist[v] = nd, pred[v] = i, heap.push({nd, v});
      }
    }
    if (dist[t] == kInf) return false;
    path.clear();
    for (int v = t; v != s; v = lanes[pred[v]].tail) path.push_back(pred[v]);
    std::reverse(path.begin(), path.end());
    return true;
  }

  double cost(const std::vector<int>& p) const {
    double c = 0;
    for (int i : p) c += length[lanes[i].arc];
    return c;
  }
};

}  // namespace

std::vector<LanePath> k_shortest_paths(int node_count, const std::vector<Lane>& lanes,
                                       const std::vector<double>& length, int origin, int destination, int k) {
  std::vector<LanePath> result;
  if (k <= 0 || origin == destination) return result;
  Search search(node_count, lanes, length);
  std::vector<char> banned_node(node_count, 0), banned_lane(lanes.size(), 0);
  std::vector<int> first;
  if (!search.run(origin, destination, banned_node, banned_lane, first)) return result;
  std::vector<std::vector<int>> found{first};
  std::set<std::pair<double, std::vector<int>>> candidates;
  while (static_cast<int>(found.size()) < k) {
    const std::vector<int>& last = found.back();
    int spur = origin;
    for (std::size_t i = 0; i < last.size(); ++i) {
      const std::vector<int> root(last.begin(), last.begin() + i);
      // Ban the next lane of every found path sharing this root, and the root's nodes.
      for (const auto& p : found)
        if (p.size() > i && std::equal(root.begin(), root.end(), p.begin())) banned_lane[p[i]] = 1;
      for (int l : root) banned_node[lanes[l].tail] = 1;
      std::vector<int> spur_path;
      if (search.run(spur, destination, banned_node, banned_lane, spur_path)) {
        std::vector<int> total = root;
        total.insert(total.end(), spur_path.begin(), spur_path.end());
        candidates.insert({search.cost(total), total});
      }
      std::fill(banned_lane.begin(), banned_lane.end(), 0);
      std::fill(banned_node.begin(), banned_node.end(), 0);
      spur = lanes[last[i]].head;
    }
    // The cheapest candidate not found yet.
    bool added = false;
    while (!candidates.empty() && !added) {
      auto best = candidates.begin()->second;
      candidates.erase(candidates.begin());
      if (std::find(found.begin(), found.end(), best) == found.end()) found.push_back(best), added = true;
    }
    if (!added) break;
  }
  for (auto& p : found) result.push_back({p});
  return result;
}

}  // namespace apportion
