// Network document look-ups.
#include "apportion/model/network.h"

#include <algorithm>
#include <cmath>

namespace apportion {

namespace {
template <class Items>
int find_by_id(const Items& items, const std::string& id) {
  for (std::size_t i = 0; i < items.size(); ++i)
    if (items[i].id == id) return static_cast<int>(i);
  return -1;
}
}  // namespace

int Network::find_node(const std::string& id) const { return find_by_id(nodes, id); }
int Network::find_arc(const std::string& id) const { return find_by_id(arcs, id); }
int Network::find_demand(const std::string& id) const { return find_by_id(demands, id); }

double Network::magnitude() const {
  double m = 0.0;
  auto take = [&m](double v) {
    if (std::isfinite(v)) m = std::max(m, std::abs(v));
  };
  for (const Arc& a : arcs) take(a.capacity);
  for (const Node& n : nodes) take(n.supply);
  for (const Demand& d : demands)
    if (d.amount) take(*d.amount);
  return m;
}

Network::CapacityRange Network::positive_capacities() const {
  CapacityRange r;
  for (const Arc& a : arcs) {
    if (!a.enabled || !(a.capacity > 0)) continue;
    r.smallest = r.largest > 0 ? std::min(r.smallest, a.capacity) : a.capacity;
    r.largest = std::max(r.largest, a.capacity);
  }
  return r;
}

}  // namespace apportion
