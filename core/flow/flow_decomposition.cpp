// Flow decomposition into paths and cycles; see flow_decomposition.h.
#include "apportion/flow/flow_decomposition.h"

#include <algorithm>
#include <cmath>

namespace apportion {

FlowDecomposition decompose_flow(const FlowGraph& g, const std::vector<double>& flow, const Tolerance& tol) {
  const int n = g.node_count();
  FlowDecomposition out;
  // Directed residual copy: each arc as the lane its flow uses.
  std::vector<int> from(g.arc_count()), to(g.arc_count());
  std::vector<double> rest(g.arc_count());
  std::vector<double> balance(n, 0.0);  // net outflow still to explain
  std::vector<std::vector<int>> out_arcs(n);
  for (int a = 0; a < g.arc_count(); ++a) {
    const bool backward = flow[a] < 0;
    from[a] = backward ? g.head(a) : g.tail(a);
    to[a] = backward ? g.tail(a) : g.head(a);
    rest[a] = std::abs(flow[a]);
    if (tol.positive(rest[a])) {
      out_arcs[from[a]].push_back(a);
      balance[from[a]] += rest[a];
      balance[to[a]] -= rest[a];
    }
  }
  std::vector<std::size_t> next(n, 0);  // first arc of out_arcs[v] that may still carry flow
  auto next_arc = [&](int v) -> int {
    while (next[v] < out_arcs[v].size() && !tol.positive(rest[out_arcs[v][next[v]]])) ++next[v];
    return next[v] < out_arcs[v].size() ? out_arcs[v][next[v]] : -1;
  };
  std::vector<int> pos(n, -1);  // position of a node on the current walk

  // Returns whether the walk removed any flow (it may not, on rounding dust).
  auto walk_from = [&](int start, bool want_path) -> bool {
    const std::size_t pieces = out.paths.size() + out.cycles.size();
    std::vector<int> nodes{start}, arcs;
    pos[start] = 0;
    for (;;) {
      const int v = nodes.back();
      if (want_path && v != start && tol.negative(balance[v])) {
        double amount = std::min(balance[start], -balance[v]);
        for (int a : arcs) amount = std::min(amount, rest[a]);
        for (int a : arcs) rest[a] -= amount;
        balance[start] -= amount;
        balance[v] += amount;
        out.paths.push_back({nodes, arcs, amount});
        break;
      }
      const int a = next_arc(v);
      if (a < 0) break;  // only rounding dust left here
      const int w = to[a];
      if (pos[w] >= 0) {  // a cycle closes: cut it off, keep walking from w
        std::vector<int> cyc_nodes(nodes.begin() + pos[w], nodes.end());
        std::vector<int> cyc_arcs(arcs.begin() + pos[w], arcs.end());
        cyc_arcs.push_back(a);
        double amount = rest[a];
        for (int c : cyc_arcs) amount = std::min(amount, rest[c]);
        for (int c : cyc_arcs) rest[c] -= amount;
        out.cycles.push_back({cyc_nodes, cyc_arcs, amount});
        for (std::size_t i = pos[w] + 1; i < nodes.size(); ++i) pos[nodes[i]] = -1;
        nodes.resize(pos[w] + 1);
        arcs.resize(pos[w]);
        continue;
      }
      pos[w] = static_cast<int>(nodes.size());
      nodes.push_back(w);
      arcs.push_back(a);
    }
    for (int v : nodes) pos[v] = -1;
    return out.paths.size() + out.cycles.size() > pieces;
  };

  for (int s = 0; s < n; ++s)
    while (tol.positive(balance[s]) && next_arc(s) >= 0 && walk_from(s, true)) {
    }
  for (int v = 0; v < n; ++v)
    while (next_arc(v) >= 0 && walk_from(v, false)) {
    }
  return out;
}

}  // namespace apportion
