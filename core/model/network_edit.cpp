// Consistent edits of a network document; see network_edit.h.
#include "apportion/model/network_edit.h"

#include <algorithm>
#include <unordered_set>

namespace apportion {

namespace {

template <class Items>
std::string fresh_id(const Items& items, const std::string& prefix) {
  std::unordered_set<std::string> taken;
  for (const auto& item : items) taken.insert(item.id);
  for (std::size_t i = items.size() + 1;; ++i) {  // the count + 1 is free unless ids were renamed
    std::string id = prefix + std::to_string(i);
    if (!taken.count(id)) return id;
  }
}

// New index of each kept item, -1 for removed ones.
std::vector<int> renumber(const std::vector<char>& removed) {
  std::vector<int> to(removed.size(), -1);
  int next = 0;
  for (std::size_t i = 0; i < removed.size(); ++i)
    if (!removed[i]) to[i] = next++;
  return to;
}

template <class Items>
void erase_removed(Items& items, const std::vector<char>& removed) {
  std::size_t out = 0;
  for (std::size_t i = 0; i < items.size(); ++i)
    if (!removed[i]) {
      if (out != i) items[out] = std::move(items[i]);  // never self-move: it empties strings
      ++out;
    }
  items.resize(out);
}

}  // namespace

std::string fresh_node_id(const Network& net, const std::string& prefix) { return fresh_id(net.nodes, prefix); }
std::string fresh_arc_id(const Network& net, const std::string& prefix) { return fresh_id(net.arcs, prefix); }
std::string fresh_demand_id(const Network& net, const std::string& prefix) { return fresh_id(net.demands, prefix); }

int add_node(Network& net, double x, double y) {
  Node n;
  n.id = fresh_node_id(net);
  n.x = x;
  n.y = y;
  net.nodes.push_back(std::move(n));
  return net.node_count() - 1;
}

int add_arc(Network& net, int from, int to) {
  std::vector<double> caps;
  for (const Arc& a : net.arcs) caps.push_back(a.capacity);
  Arc a;
  a.id = fresh_arc_id(net);
  a.from = from;
  a.to = to;
  if (caps.empty()) {
    a.capacity = 1.0;
  } else {
    std::nth_element(caps.begin(), caps.begin() + caps.size() / 2, caps.end());
    a.capacity = caps[caps.size() / 2];
  }
  net.arcs.push_back(std::move(a));
  return net.arc_count() - 1;
}

int add_demand(Network& net, int origin, int destination) {
  Demand d;
  d.id = fresh_demand_id(net);
  d.origin = origin;
  d.destination = destination;
  net.demands.push_back(std::move(d));
  return static_cast<int>(net.demands.size()) - 1;
}

int remove_items(Network& net, const Selection& sel) {
  std::vector<char> node_gone(net.nodes.size(), 0), arc_gone(net.arcs.size(), 0), demand_gone(net.demands.size(), 0);
  for (int v : sel.nodes)
    if (v >= 0 && v < net.node_count()) node_gone[v] = 1;
  for (int a : sel.arcs)
    if (a >= 0 && a < net.arc_count()) arc_gone[a] = 1;
  for (int k : sel.demands)
    if (k >= 0 && k < static_cast<int>(net.demands.size())) demand_gone[k] = 1;
  auto gone_node = [&](int v) { return v < 0 || v >= net.node_count() || node_gone[v]; };
  for (std::size_t a = 0; a < net.arcs.size(); ++a)
    if (gone_node(net.arcs[a].from) || gone_node(net.arcs[a].to)) arc_gone[a] = 1;
  for (std::size_t k = 0; k < net.demands.size(); ++k)
    if (gone_node(net.demands[k].origin) || gone_node(net.demands[k].destination)) demand_gone[k] = 1;

  const std::vector<int> to = renumber(node_gone);
  int removed = 0;
  for (char c : node_gone) removed += c;
  for (char c : arc_gone) removed += c;
  for (char c : demand_gone) removed += c;
  erase_removed(net.nodes, node_gone);
  erase_removed(net.arcs, arc_gone);
  erase_removed(net.demands, demand_gone);
  for (Arc& a : net.arcs) a.from = to[a.from], a.to = to[a.to];
  for (Demand& d : net.demands) d.origin = to[d.origin], d.destination = to[d.destination];
  return removed;
}

}  // namespace apportion
