// Minimum-cost flow by primal network simplex; see min_cost_flow.h for the model.
#include "apportion/flow/min_cost_flow.h"

#include <algorithm>
#include <cmath>
#include <limits>

namespace apportion {

namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();
constexpr int kLower = 1, kTree = 0, kUpper = -1;  // arc states; sign of the allowed change
constexpr int kUp = 1, kDown = -1;                 // tree arc points to the parent / away from it

class NetworkSimplex {
 public:
  NetworkSimplex(const FlowGraph& g, const std::vector<double>& supply, Tolerance flow_tol)
      : n_(g.node_count()), root_(g.node_count()), flow_tol_(flow_tol) {
    for (int a = 0; a < g.arc_count(); ++a) {
      add(g.tail(a), g.head(a), g.capacity(a), g.cost(a));
      if (g.two_way(a)) add(g.head(a), g.tail(a), g.capacity(a), g.cost(a));
    }
    real_arcs_ = static_cast<int>(src_.size());
    const double max_cost = g.max_abs_cost();
    // Big-M: dearer than any simple path of real arcs, so artificial flow leaves if it can.
    const double art_cost = (max_cost + 1.0) * (n_ + 1);
    cost_tol_ = Tolerance(1e-12 * (max_cost + 1.0) * std::max(1.0, std::sqrt(double(n_))));

    parent_.assign(n_ + 1, -1);
    pred_.assign(n_ + 1, -1);
    dir_.assign(n_ + 1, kUp);
    depth_.assign(n_ + 1, 0);
    pi_.assign(n_ + 1, 0.0);
    child_.assign(n_ + 1, -1);
    next_sib_.assign(n_ + 1, -1);
    prev_sib_.assign(n_ + 1, -1);
    for (int v = 0; v < n_; ++v) {
      int e;
      if (supply[v] >= 0) {
        e = add(v, root_, kInf, art_cost);
        flow_[e] = supply[v];
        dir_[v] = kUp;
        pi_[v] = -art_cost;
      } else {
        e = add(root_, v, kInf, art_cost);
        flow_[e] = -supply[v];
        dir_[v] = kDown;
        pi_[v] = art_cost;
      }
      state_[e] = kTree;
      parent_[v] = root_;
      pred_[v] = e;
      depth_[v] = 1;
      attach(v, root_);
    }
    block_ = std::max(10, static_cast<int>(std::sqrt(double(src_.size()))));
  }

  // Returns false when a cycle of unbounded capacity has negative cost.
  bool run() {
    int in = -1;
    while (find_entering(in)) {
      ++pivots_;
      const int join = find_join(src_[in], tgt_[in]);
      int first, second;
      if (state_[in] == kLower)
        first = src_[in], second = tgt_[in];
      else
        first = tgt_[in], second = src_[in];
      double delta = cap_[in];
      int result = 0, u_out = -1;
      for (int u = first; u != join; u = parent_[u]) {
        const int e = pred_[u];
        const double d = dir_[u] == kDown ? cap_[e] - flow_[e] : flow_[e];
        if (d < delta) delta = d, u_out = u, result = 1;
      }
      for (int u = second; u != join; u = parent_[u]) {
        const int e = pred_[u];
        const double d = dir_[u] == kUp ? cap_[e] - flow_[e] : flow_[e];
        if (d <= delta) delta = d, u_out = u, result = 2;
      }
      if (delta == kInf) return false;
      if (delta > 0) {
        const double val = state_[in] * delta;
        flow_[in] += val;
        for (int u = src_[in]; u != join; u = parent_[u]) flow_[pred_[u]] -= dir_[u] * val;
        for (int u = tgt_[in]; u != join; u = parent_[u]) flow_[pred_[u]] += dir_[u] * val;
      }
      if (result == 0) {
        state_[in] = -state_[in];
        flow_[in] = state_[in] == kLower ? 0.0 : cap_[in];
        continue;
      }
      // The leaving arc sits at the bound it reached: snap it there exactly.
      const int out = pred_[u_out];
      const bool to_upper = (result == 1) == (dir_[u_out] == kDown);
      state_[out] = to_upper ? kUpper : kLower;
      flow_[out] = to_upper ? cap_[out] : 0.0;
      state_[in] = kTree;
      const int u_in = result == 1 ? first : second;
      const int v_in = result == 1 ? second : first;
      rehang(in, u_in, v_in, u_out);
    }
    return true;
  }

  bool artificial_flow_left() const {
    for (std::size_t e = real_arcs_; e < src_.size(); ++e)
      if (flow_tol_.positive(flow_[e])) return true;
    return false;
  }
  double flow(int e) const { return flow_[e]; }
  double potential(int v) const { return pi_[v] - pi_[root_]; }
  long long pivots() const { return pivots_; }

 private:
  int add(int s, int t, double cap, double cost) {
    src_.push_back(s), tgt_.push_back(t), cap_.push_back(cap), cost_.push_back(cost);
    flow_.push_back(0.0), state_.push_back(kLower);
    return static_cast<int>(src_.size()) - 1;
  }

  // Block search: the most violating arc in the first block that has one, scanning from
  // where the last search stopped and wrapping around once.
  bool find_entering(int& in) {
    const int m = static_cast<int>(src_.size());
    double best = 0.0;
    int count = block_;
    for (int pass = 0; pass < 2; ++pass) {
      const int begin = pass == 0 ? next_arc_ : 0, end = pass == 0 ? m : next_arc_;
      for (int e = begin; e < end; ++e) {
        const double v = state_[e] * (cost_[e] + pi_[src_[e]] - pi_[tgt_[e]]);
        if (v < best) best = v, in = e;
        if (--count == 0) {
          if (cost_tol_.negative(best)) {
            next_arc_ = e + 1 < m ? e + 1 : 0;
            return true;
          }
          count = block_;
        }
      }
    }
    if (cost_tol_.negative(best)) {
      next_arc_ = in + 1 < m ? in + 1 : 0;
      return true;
    }
    return false;
  }

  int find_join(int u, int v) const {
    while (u != v) {
      if (depth_[u] > depth_[v])
        u = parent_[u];
      else if (depth_[v] > depth_[u])
        v = parent_[v];
      else
        u = parent_[u], v = parent_[v];
    }
    return u;
  }

  void attach(int v, int p) {
    prev_sib_[v] = -1;
    next_sib_[v] = child_[p];
    if (child_[p] >= 0) prev_sib_[child_[p]] = v;
    child_[p] = v;
  }

  void detach(int v, int p) {
    if (prev_sib_[v] >= 0)
      next_sib_[prev_sib_[v]] = next_sib_[v];
    else
      child_[p] = next_sib_[v];
    if (next_sib_[v] >= 0) prev_sib_[next_sib_[v]] = prev_sib_[v];
  }

  // The entering arc joins u_in (inside the subtree cut off by the leaving arc above u_out)
  // to v_in: reverse the tree path u_in .. u_out, hang it below v_in, and update depths and
  // potentials of the moved subtree.
  void rehang(int in, int u_in, int v_in, int u_out) {
    int new_parent = v_in, arc = in, dir = src_[in] == u_in ? kUp : kDown;
    for (int u = u_in;;) {
      const int old_parent = parent_[u], old_arc = pred_[u], old_dir = dir_[u];
      detach(u, old_parent);
      parent_[u] = new_parent, pred_[u] = arc, dir_[u] = dir;
      attach(u, new_parent);
      if (u == u_out) break;
      new_parent = u, arc = old_arc, dir = -old_dir, u = old_parent;
    }
    const double new_pi = dir_[u_in] == kUp ? pi_[v_in] - cost_[in] : pi_[v_in] + cost_[in];
    const double shift = new_pi - pi_[u_in];
    stack_.clear();
    stack_.push_back(u_in);
    while (!stack_.empty()) {
      const int u = stack_.back();
      stack_.pop_back();
      pi_[u] += shift;
      depth_[u] = depth_[parent_[u]] + 1;
      for (int c = child_[u]; c >= 0; c = next_sib_[c]) stack_.push_back(c);
    }
  }

  int n_, root_, real_arcs_ = 0, block_ = 10, next_arc_ = 0;
  Tolerance flow_tol_, cost_tol_;
  std::vector<int> src_, tgt_, state_;
  std::vector<double> cap_, cost_, flow_;
  std::vector<int> parent_, pred_, dir_, depth_, child_, next_sib_, prev_sib_, stack_;
  std::vector<double> pi_;
  long long pivots_ = 0;
};

}  // namespace

MinCostFlowResult min_cost_flow(const FlowGraph& g, const std::vector<double>& supply) {
  MinCostFlowResult result;
  const int n = g.node_count();
  if (static_cast<int>(supply.size()) != n) {
    result.status = SolveStatus::kBadInput;
    result.message = "one supply per node is needed";
    return result;
  }
  double scale = g.max_capacity(), total = 0.0;
  for (double b : supply) {
    if (!std::isfinite(b)) {
      result.status = SolveStatus::kBadInput;
      result.message = "a supply is not finite";
      return result;
    }
    scale = std::max(scale, std::abs(b));
    total += b;
  }
  for (int a = 0; a < g.arc_count(); ++a) {
    if (!std::isfinite(g.capacity(a)) || g.capacity(a) < 0 || !std::isfinite(g.cost(a)) ||
        (g.two_way(a) && g.cost(a) < 0)) {
      result.status = SolveStatus::kBadInput;
      result.message = "arc #" + std::to_string(a) + " has an invalid capacity or cost";
      return result;
    }
  }
  const Tolerance tol = Tolerance::for_scale(scale);
  if (tol.nonzero(total)) {
    result.status = SolveStatus::kInfeasible;
    result.message = "supplies sum to " + std::to_string(total) + ", not zero";
    return result;
  }
  NetworkSimplex simplex(g, supply, tol);
  const bool bounded = simplex.run();
  result.pivots = simplex.pivots();
  if (!bounded) {
    result.status = SolveStatus::kUnbounded;
    result.message = "a negative-cost cycle has unbounded capacity";
    return result;
  }
  if (simplex.artificial_flow_left()) {
    result.status = SolveStatus::kInfeasible;
    result.message = "the supplies cannot be routed within the capacities";
    return result;
  }
  result.flow.resize(g.arc_count());
  int e = 0;
  for (int a = 0; a < g.arc_count(); ++a) {
    double x = simplex.flow(e++);
    if (g.two_way(a)) x -= simplex.flow(e++);
    result.flow[a] = x;
    result.cost += g.cost(a) * std::abs(x);
  }
  result.potential.resize(n);
  for (int v = 0; v < n; ++v) result.potential[v] = simplex.potential(v);
  result.check = check_supply_flow(g, supply, result.flow, result.cost,
                                   Tolerance(tol.epsilon() * std::max(1, g.arc_count())));
  result.status = SolveStatus::kOptimal;
  return result;
}

MinCostFlowResult min_cost_flow(const FlowGraph& g, int s, int t, double amount) {
  std::vector<double> supply(g.node_count(), 0.0);
  if (s < 0 || s >= g.node_count() || t < 0 || t >= g.node_count() || s == t) {
    MinCostFlowResult r;
    r.status = SolveStatus::kBadInput;
    r.message = "source and sink must be two different nodes of the graph";
    return r;
  }
  supply[s] = amount;
  supply[t] = -amount;
  return min_cost_flow(g, supply);
}

}  // namespace apportion
