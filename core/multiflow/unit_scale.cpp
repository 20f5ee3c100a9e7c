// Unit scaling of the fair-multiflow engine; see unit_scale.h.
#include "apportion/multiflow/unit_scale.h"

#include <cmath>

namespace apportion {

double unit_scale(const Network& net) {
  const auto [smallest, largest] = net.positive_capacities();
  if (!(smallest > 0) || !std::isfinite(largest)) return 1.0;
  int low = 0, high = 0;
  std::frexp(smallest, &low);  // smallest = m 2^low, m in [0.5, 1)
  std::frexp(largest, &high);
  // The smallest capacity into [1, 2), unless the largest would then pass 2^30.
  return std::ldexp(1.0, std::max(low - 1, high - kLargestExponent));
}

Network scaled_network(const Network& net, double s) {
  Network scaled = net;
  for (Arc& a : scaled.arcs) a.capacity /= s;
  for (Node& v : scaled.nodes) v.supply /= s;
  for (Demand& d : scaled.demands)
    if (d.amount) *d.amount /= s;
  return scaled;
}

void unscale_result(MultiflowResult& r, double s) {
  for (DemandShare& d : r.demands) {
    d.share *= s;
    d.normalised *= s;
    for (PathShare& p : d.paths) p.amount *= s;
  }
  for (ArcLoad& a : r.arcs) {
    a.load *= s;
    for (auto& [demand, flow] : a.per_demand) flow *= s;
  }
  for (Tier& t : r.tiers) t.level *= s;
  r.throughput *= s;
  r.min_normalised_share *= s;
  if (r.max_throughput >= 0) r.max_throughput *= s;
  r.shortfall *= s;
  for (double& l : r.dual_lengths) l /= s;
  r.overloaded_cut_capacity *= s;
  r.overloaded_cut_demand *= s;
}

}  // namespace apportion
