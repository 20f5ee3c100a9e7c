// Maximum flow by highest-label push-relabel; see max_flow.h for the model and references.
#include "apportion/flow/max_flow.h"

#include <algorithm>
#include <cmath>
#include <string>

namespace apportion {

namespace {

// The residual network in compressed rows: residual arc r runs from its row's node to
// head_[r], with residual capacity res_[r]; rev_[r] is its partner in the other direction.
// Graph arc a owns residual arc fwd_[a] (tail to head) and rev_[fwd_[a]] (head to tail).
class PushRelabel {
 public:
  PushRelabel(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks, Tolerance tol)
      : n_(g.node_count() + 2), source_(g.node_count()), sink_(g.node_count() + 1), tol_(tol) {
    // Super arcs get the total capacity at their terminal: never a bottleneck, always finite.
    std::vector<double> out_cap(g.node_count(), 0.0), in_cap(g.node_count(), 0.0);
    for (int a = 0; a < g.arc_count(); ++a) {
      out_cap[g.tail(a)] += g.capacity(a);
      in_cap[g.head(a)] += g.capacity(a);
      if (g.two_way(a)) out_cap[g.head(a)] += g.capacity(a), in_cap[g.tail(a)] += g.capacity(a);
    }
    struct Raw { int tail, head; double cap, back; };
    std::vector<Raw> raw;
    raw.reserve(g.arc_count() + sources.size() + sinks.size());
    for (int a = 0; a < g.arc_count(); ++a)
      raw.push_back({g.tail(a), g.head(a), g.capacity(a), g.two_way(a) ? g.capacity(a) : 0.0});
    for (int s : sources) raw.push_back({source_, s, out_cap[s], 0.0});
    for (int t : sinks) raw.push_back({t, sink_, in_cap[t], 0.0});

    first_.assign(n_ + 1, 0);
    for (const Raw& r : raw) ++first_[r.tail + 1], ++first_[r.head + 1];
    for (int v = 0; v < n_; ++v) first_[v + 1] += first_[v];
    const int total = first_[n_];
    head_.resize(total);
    rev_.resize(total);
    res_.resize(total);
    fwd_.resize(raw.size());
    std::vector<int> pos(first_.begin(), first_.end() - 1);
    for (std::size_t i = 0; i < raw.size(); ++i) {
      const Raw& r = raw[i];
      int f = pos[r.tail]++, b = pos[r.head]++;
      head_[f] = r.head, res_[f] = r.cap, rev_[f] = b;
      head_[b] = r.tail, res_[b] = r.back, rev_[b] = f;
      fwd_[i] = f;
    }
    excess_.assign(n_, 0.0);
    label_.assign(n_, n_);
    cur_.assign(n_, 0);
    active_.assign(n_ + 1, -1);
    next_active_.assign(n_, -1);
    bucket_first_.assign(n_ + 1, -1);
    bucket_next_.assign(n_, -1);
    bucket_prev_.assign(n_, -1);
  }

  // Phase one: a maximum preflow. Phase two: excess back to the super source.
  void run() {
    for (int r = first_[source_]; r < first_[source_ + 1]; ++r) push(source_, r, res_[r]);
    discharge_all(sink_, source_);
    discharge_all(source_, sink_);
  }

  double value() const { return excess_[sink_]; }
  double graph_flow(int a, double capacity) const { return capacity - res_[fwd_[a]]; }

  // Nodes reachable from the super source in the residual network of the final flow.
  std::vector<char> source_side() const {
    std::vector<char> seen(n_, 0);
    std::vector<int> stack{source_};
    seen[source_] = 1;
    while (!stack.empty()) {
      int u = stack.back();
      stack.pop_back();
      for (int r = first_[u]; r < first_[u + 1]; ++r)
        if (tol_.positive(res_[r]) && !seen[head_[r]]) seen[head_[r]] = 1, stack.push_back(head_[r]);
    }
    return seen;
  }

 private:
  void push(int u, int r, double amount) {
    const int w = head_[r];
    res_[r] -= amount;
    res_[rev_[r]] += amount;
    excess_[u] -= amount;
    const bool was_active = tol_.positive(excess_[w]);
    excess_[w] += amount;
    if (!was_active && w != target_ && w != blocked_ && label_[w] < n_ && tol_.positive(excess_[w])) activate(w);
  }

  void activate(int v) {
    next_active_[v] = active_[label_[v]];
    active_[label_[v]] = v;
    max_active_ = std::max(max_active_, label_[v]);
  }

  void bucket_insert(int v) {
    const int d = label_[v];
    bucket_prev_[v] = -1;
    bucket_next_[v] = bucket_first_[d];
    if (bucket_first_[d] >= 0) bucket_prev_[bucket_first_[d]] = v;
    bucket_first_[d] = v;
    max_label_ = std::max(max_label_, d);
  }

  void bucket_remove(int v) {
    const int d = label_[v];
    if (bucket_prev_[v] >= 0)
      bucket_next_[bucket_prev_[v]] = bucket_next_[v];
    else
      bucket_first_[d] = bucket_next_[v];
    if (bucket_next_[v] >= 0) bucket_prev_[bucket_next_[v]] = bucket_prev_[v];
  }

  // Exact distances to the target in the residual network (reverse breadth-first search);
  // nodes that cannot reach it get label n and drop out of this phase.
  void global_relabel() {
    std::fill(label_.begin(), label_.end(), n_);
    std::fill(active_.begin(), active_.end(), -1);
    std::fill(bucket_first_.begin(), bucket_first_.end(), -1);
    max_active_ = -1;
    max_label_ = 0;
    std::vector<int>& queue = scratch_;
    queue.clear();
    queue.push_back(target_);
    label_[target_] = 0;
    for (std::size_t i = 0; i < queue.size(); ++i) {
      const int v = queue[i];
      for (int r = first_[v]; r < first_[v + 1]; ++r) {
        const int u = head_[r];
        if (label_[u] == n_ && u != blocked_ && tol_.positive(res_[rev_[r]])) {
          label_[u] = label_[v] + 1;
          queue.push_back(u);
        }
      }
    }
    for (int v : queue) {
      if (v == target_) continue;
      cur_[v] = first_[v];
      bucket_insert(v);
      if (tol_.positive(excess_[v])) activate(v);
    }
    work_ = 0;
  }

  void relabel(int u) {
    const int old = label_[u];
    bucket_remove(u);
    work_ += first_[u + 1] - first_[u] + kRelabelWork;
    if (bucket_first_[old] < 0 && old < n_) {
      // Gap: no node is left at label `old`, so nothing above it can reach the target.
      for (int d = old + 1; d <= max_label_; ++d) {
        for (int v = bucket_first_[d]; v >= 0; v = bucket_next_[v]) label_[v] = n_;
        bucket_first_[d] = -1;
      }
      max_label_ = old - 1;
      label_[u] = n_;
      return;
    }
    int best = n_;
    for (int r = first_[u]; r < first_[u + 1]; ++r)
      if (tol_.positive(res_[r])) best = std::min(best, label_[head_[r]] + 1);
    label_[u] = std::min(best, n_);
    if (label_[u] < n_) {
      cur_[u] = first_[u];
      bucket_insert(u);
    }
  }

  void discharge(int u) {
    while (tol_.positive(excess_[u])) {
      if (cur_[u] == first_[u + 1]) {
        relabel(u);
        if (label_[u] >= n_) return;
        continue;
      }
      const int r = cur_[u];
      const int w = head_[r];
      if (tol_.positive(res_[r]) && label_[u] == label_[w] + 1)
        push(u, r, std::min(excess_[u], res_[r]));
      else
        ++cur_[u];
    }
  }

  // Moves all excess to `target`, never through `blocked`.
  void discharge_all(int target, int blocked) {
    target_ = target;
    blocked_ = blocked;
    global_relabel();
    const long long relabel_period = 6LL * n_ + static_cast<long long>(head_.size()) / 2;
    while (max_active_ >= 0) {
      const int u = active_[max_active_];
      if (u < 0) {
        --max_active_;
        continue;
      }
      active_[max_active_] = next_active_[u];
      if (label_[u] != max_active_) continue;  // stale entry left by a gap
      discharge(u);
      if (work_ > relabel_period) global_relabel();
    }
  }

  static constexpr int kRelabelWork = 12;
  int n_, source_, sink_;
  Tolerance tol_;
  int target_ = -1, blocked_ = -1;
  std::vector<int> first_, head_, rev_, fwd_;
  std::vector<double> res_, excess_;
  std::vector<int> label_, cur_;
  std::vector<int> active_, next_active_;
  std::vector<int> bucket_first_, bucket_next_, bucket_prev_;
  std::vector<int> scratch_;
  int max_active_ = -1, max_label_ = 0;
  long long work_ = 0;
};

std::string check_input(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks) {
  const int n = g.node_count();
  std::vector<char> role(n, 0);
  for (int s : sources) {
    if (s < 0 || s >= n) return "source index " + std::to_string(s) + " is out of range";
    role[s] = 1;
  }
  for (int t : sinks) {
    if (t < 0 || t >= n) return "sink index " + std::to_string(t) + " is out of range";
    if (role[t] == 1) return "node #" + std::to_string(t) + " is both a source and a sink";
    role[t] = 2;
  }
  for (int a = 0; a < g.arc_count(); ++a) {
    const double u = g.capacity(a);
    if (!std::isfinite(u) || u < 0) return "arc #" + std::to_string(a) + " has capacity " + std::to_string(u);
    if (g.tail(a) < 0 || g.tail(a) >= n || g.head(a) < 0 || g.head(a) >= n)
      return "arc #" + std::to_string(a) + " has an end out of range";
  }
  return {};
}

}  // namespace

MaxFlowResult max_flow(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks) {
  return max_flow(g, sources, sinks, Tolerance::for_scale(g.max_capacity()));
}

MaxFlowResult max_flow(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks,
                       const Tolerance& tol) {
  MaxFlowResult result;
  result.message = check_input(g, sources, sinks);
  if (!result.message.empty()) {
    result.status = SolveStatus::kBadInput;
    return result;
  }
  PushRelabel engine(g, sources, sinks, tol);
  engine.run();
  result.value = engine.value();
  result.flow.resize(g.arc_count());
  for (int a = 0; a < g.arc_count(); ++a) result.flow[a] = engine.graph_flow(a, g.capacity(a));

  std::vector<char> side = engine.source_side();
  side.resize(g.node_count());  // drop the super source and sink
  for (int s : sources) side[s] = 1;
  result.source_side = side;
  for (int a = 0; a < g.arc_count(); ++a) {
    const bool forward = side[g.tail(a)] && !side[g.head(a)];
    const bool backward = g.two_way(a) && side[g.head(a)] && !side[g.tail(a)];
    if ((forward || backward) && tol.positive(g.capacity(a))) {
      result.cut_arcs.push_back(a);
      result.cut_capacity += g.capacity(a);
    }
  }
  result.check = check_terminal_flow(g, sources, sinks, result.flow, result.value,
                                     Tolerance(tol.epsilon() * std::max(1, g.arc_count())));
  result.status = SolveStatus::kOptimal;
  return result;
}

}  // namespace apportion
