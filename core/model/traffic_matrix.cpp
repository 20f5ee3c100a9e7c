// Traffic matrices; see traffic_matrix.h.
#include "apportion/model/traffic_matrix.h"

#include <cmath>
#include <random>
#include <unordered_set>

#include "apportion/model/size_limits.h"

namespace apportion {

std::vector<double> seeded_masses(int nodes, std::uint64_t seed) {
  std::mt19937_64 rng(seed);
  std::vector<double> m(nodes > 0 ? nodes : 0);
  // Top 53 bits to [0, 1): the standard distributions differ between standard libraries.
  for (double& x : m) x = 1.0 + 9.0 * static_cast<double>(rng() >> 11) * 0x1.0p-53;
  return m;
}

TrafficMatrixResult add_traffic_matrix(Network& net, const TrafficMatrixSpec& spec) {
  TrafficMatrixResult r;
  Diagnostics& d = r.diagnostics;
  const int n = net.node_count();
  auto chosen = [n, &d](const std::vector<int>& given, const char* field) {
    std::vector<char> in(n, given.empty() ? 1 : 0);
    for (int v : given) {
      if (v < 0 || v >= n)
        d.error("matrix", "", field, "node index " + std::to_string(v) + " is not in the network");
      else
        in[v] = 1;
    }
    return in;
  };
  const std::vector<char> from = chosen(spec.origins, "origins"), to = chosen(spec.destinations, "destinations");
  if (!(spec.weight > 0) || !std::isfinite(spec.weight)) d.error("matrix", "", "weight", "must be a number > 0");
  const double limit = SizeLimits::kMaxMagnitude;
  if (spec.amounts == MatrixAmounts::kGravity && !(spec.total > 0 && spec.total <= limit))
    d.error("matrix", "", "total", "the gravity model needs a total amount > 0 and at most 1e15");
  if (spec.amounts == MatrixAmounts::kUniform && !(spec.uniform_amount >= 0 && spec.uniform_amount <= limit))
    d.error("matrix", "", "amount", "each pair's amount must be a number >= 0 and at most 1e15");
  std::vector<double> mass = spec.masses.empty() ? seeded_masses(n, spec.seed) : spec.masses;
  if (spec.amounts == MatrixAmounts::kGravity) {
    if (static_cast<int>(mass.size()) != n)
      d.error("matrix", "", "masses", "needs one mass per node: " + std::to_string(mass.size()) + " for " +
                                          std::to_string(n) + " nodes");
    for (int v = 0; v < static_cast<int>(mass.size()) && v < n; ++v)
      if (!(mass[v] > 0) || !std::isfinite(mass[v]))
        d.error("node", net.nodes[v].id, "mass", "the gravity model needs a mass > 0");
  }
  // The pairs, in node order (origins, then destinations).
  std::vector<std::pair<int, int>> pairs;
  long long count = 0;
  for (int i = 0; i < n; ++i)
    if (from[i])
      for (int j = 0; j < n; ++j) count += to[j] && j != i;
  const long long kept = spec.replace ? 0 : static_cast<long long>(net.demands.size());
  if (count == 0) d.error("matrix", "", "origins", "the chosen origins and destinations form no pair of distinct nodes");
  if (count + kept > SizeLimits::kMaxDemands)
    d.error("matrix", "", "origins",
            std::to_string(count) + " pairs would make " + std::to_string(count + kept) +
                " demands, more than the limit of " + std::to_string(SizeLimits::kMaxDemands));
  if (d.has_errors()) return r;
  pairs.reserve(static_cast<std::size_t>(count));
  for (int i = 0; i < n; ++i)
    if (from[i])
      for (int j = 0; j < n; ++j)
        if (to[j] && j != i) pairs.push_back({i, j});

  double mass_sum = 0.0;
  if (spec.amounts == MatrixAmounts::kGravity)
    for (const auto& [i, j] : pairs) mass_sum += mass[i] * mass[j];
  std::vector<PairAmount> amounts;
  amounts.reserve(pairs.size());
  for (const auto& [i, j] : pairs) {
    PairAmount p{i, j, std::nullopt};
    if (spec.amounts == MatrixAmounts::kGravity) p.amount = spec.total * (mass[i] * mass[j] / mass_sum);
    if (spec.amounts == MatrixAmounts::kUniform) p.amount = spec.uniform_amount;
    amounts.push_back(p);
  }
  add_pair_demands(net, amounts, spec.weight, spec.replace);
  r.added = static_cast<int>(pairs.size());
  r.ok = true;
  return r;
}

std::string PairIds::next(const Network& net, int origin, int destination, std::size_t fallback) {
  std::string base = net.nodes[origin].id + "-" + net.nodes[destination].id;
  if (base.size() + 12 > SizeLimits::kMaxStringLength) base = "d" + std::to_string(fallback);
  int& s = next_suffix_.emplace(base, 1).first->second;
  std::string id = s == 1 ? base : base + "-" + std::to_string(s);
  while (!taken_.insert(id).second) id = base + "-" + std::to_string(++s);
  ++s;
  return id;
}

void add_pair_demands(Network& net, const std::vector<PairAmount>& pairs, double weight, bool replace) {
  if (replace) net.demands.clear();
  std::unordered_set<std::string> taken;
  for (const Demand& k : net.demands) taken.insert(k.id);
  PairIds ids(std::move(taken));
  net.demands.reserve(net.demands.size() + pairs.size());
  for (const PairAmount& p : pairs) {
    Demand k;
    k.id = ids.next(net, p.origin, p.destination, net.demands.size() + 1);
    k.origin = p.origin, k.destination = p.destination, k.weight = weight, k.amount = p.amount;
    net.demands.push_back(std::move(k));
  }
}

}  // namespace apportion
