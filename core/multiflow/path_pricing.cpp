// Shortest-path trees for pricing; see path_pricing.h.
#include "apportion/multiflow/path_pricing.h"

#include <algorithm>
#include <limits>
#include <queue>

namespace apportion {

namespace {
constexpr double kInf = std::numeric_limits<double>::infinity();
}

std::vector<char> usable_arcs(const FlowGraph& g) {
  std::vector<char> u(g.arc_count());
  for (int a = 0; a < g.arc_count(); ++a) u[a] = g.capacity(a) > 0 && g.tail(a) != g.head(a);
  return u;
}

PathPricer::PathPricer(const FlowGraph& g, const std::vector<char>& usable, int hop_limit)
    : n_(g.node_count()), arc_count_(g.arc_count()), hop_limit_(hop_limit) {
  for (const Lane& l : g.lanes())
    if (usable[l.arc] && l.tail != l.head) lanes_.push_back(l);
  first_out_.assign(n_ + 1, 0);
  for (const Lane& l : lanes_) ++first_out_[l.tail + 1];
  for (int v = 0; v < n_; ++v) first_out_[v + 1] += first_out_[v];
  out_lanes_.resize(lanes_.size());
  std::vector<int> pos(first_out_.begin(), first_out_.end() - 1);
  for (int i = 0; i < static_cast<int>(lanes_.size()); ++i) out_lanes_[pos[lanes_[i].tail]++] = i;
  dist_.assign(n_, kInf);
  pred_.assign(n_, -1);
}

void PathPricer::search(int origin, const std::vector<double>& length) {
  std::fill(dist_.begin(), dist_.end(), kInf);
  dist_[origin] = 0;
  if (hop_limit_ <= 0) {
    std::fill(pred_.begin(), pred_.end(), -1);
    using Item = std::pair<double, int>;
    std::priority_queue<Item, std::vector<Item>, std::greater<Item>> heap;
    heap.push({0.0, origin});
    while (!heap.empty()) {
      auto [d, u] = heap.top();
      heap.pop();
      if (d > dist_[u]) continue;
      for (int k = first_out_[u]; k < first_out_[u + 1]; ++k) {
        const int i = out_lanes_[k];
        const int v = lanes_[i].head;
        const double nd = d + length[lanes_[i].arc];
        if (nd < dist_[v]) {
          dist_[v] = nd;
          pred_[v] = i;
          heap.push({nd, v});
        }
      }
    }
    return;
  }
  // Bellman-Ford by rounds: after round h, dist_by_hops_[h][v] is the least length of a
  // path of at most h lanes.
  dist_by_hops_.assign(hop_limit_ + 1, std::vector<double>(n_, kInf));
  pred_by_hops_.assign(hop_limit_ + 1, std::vector<int>(n_, -1));
  dist_by_hops_[0][origin] = 0;
  for (int h = 1; h <= hop_limit_; ++h) {
    dist_by_hops_[h] = dist_by_hops_[h - 1];
    pred_by_hops_[h] = pred_by_hops_[h - 1];
    for (int i = 0; i < static_cast<int>(lanes_.size()); ++i) {
      const Lane& l = lanes_[i];
      const double du = dist_by_hops_[h - 1][l.tail];
      if (du == kInf) continue;
      const double nd = du + length[l.arc];
      if (nd < dist_by_hops_[h][l.head]) {
        dist_by_hops_[h][l.head] = nd;
        pred_by_hops_[h][l.head] = i;
      }
    }
  }
  dist_ = dist_by_hops_[hop_limit_];
}

double PathPricer::distance(int node) const { return dist_[node]; }

LanePath PathPricer::path_to(int node) const {
  LanePath p;
  if (hop_limit_ <= 0) {
    for (int v = node; pred_[v] >= 0; v = lanes_[pred_[v]].tail) p.lanes.push_back(pred_[v]);
  } else {
    // Walk back through the rounds: the lane that set v's distance in round h came from a
    // distance of round h-1, so the path has at most h lanes.
    int v = node;
    for (int h = hop_limit_; h > 0 && v >= 0; --h) {
      const int i = pred_by_hops_[h][v];
      if (i < 0) break;
      if (dist_by_hops_[h - 1][v] == dist_by_hops_[h][v]) continue;  // copied from an earlier round
      p.lanes.push_back(i);
      v = lanes_[i].tail;
    }
  }
  std::reverse(p.lanes.begin(), p.lanes.end());
  return p;
}

bool PathPricer::shortest_hop_path(int origin, int destination, LanePath& out) {
  const std::vector<double> unit(arc_count_, 1.0);
  search(origin, unit);
  if (dist_[destination] == kInf) return false;
  out = path_to(destination);
  return true;
}

}  // namespace apportion
