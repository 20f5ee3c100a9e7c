// The network document: what a planner edits, saves and shares.
//
// Nodes, arcs and demands keep their string ids; algorithms work on dense indices, which
// are positions in the vectors below. An arc is directed from `from` to `to`, unless it is
// a shared two-way link: then flow may go either way and the two directions together use
// at most `capacity` (a half-duplex link, or a road whose lanes can be reversed). Two
// independent directions are simply two arcs.
//
// A demand asks for `amount` units from origin to destination, or as much as possible when
// `amount` is empty; `weight` scales its fair share in the fairness rules. Node `supply`
// (positive: source, negative: sink) feeds min-cost flow with given supplies.
//
// The JSON file format for this model is documented in core/FORMAT.md.
#pragma once

#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

namespace apportion {

struct Node {
  std::string id;
  std::string label;
  std::optional<double> x, y;  // drawing position; absent for imported topologies
  double supply = 0.0;         // > 0 supplies, < 0 consumes (min-cost flow with supplies)
};

struct Arc {
  std::string id;
  int from = -1;  // node index
  int to = -1;    // node index
  double capacity = 0.0;
  std::optional<double> cost;     // per unit of flow
  std::optional<double> transit;  // travel time per unit, for flows over time
  bool enabled = true;            // a disabled arc is kept in the file but carries nothing
  bool shared_two_way = false;    // both directions draw on `capacity` together
};

struct Demand {
  std::string id;
  std::string label;
  int origin = -1;                // node index
  int destination = -1;           // node index
  std::optional<double> amount;   // empty: as much as possible
  double weight = 1.0;
};

// The name a person reads, on the canvas, in tables and pictures: the label, or the id when
// there is none.
inline const std::string& shown_name(const Node& v) { return v.label.empty() ? v.id : v.label; }
inline const std::string& shown_name(const Demand& d) { return d.label.empty() ? d.id : d.label; }

struct Units {
  std::string capacity;  // e.g. "Gbit/s", "t/day"
  std::string cost;      // e.g. "EUR/Gbit"
  std::string time;      // e.g. "h"
};

struct Network {
  std::string name;
  Units units;
  std::vector<Node> nodes;
  std::vector<Arc> arcs;
  std::vector<Demand> demands;
  std::string metadata_json = "{}";  // free-form, kept verbatim as a JSON object

  int node_count() const { return static_cast<int>(nodes.size()); }
  int arc_count() const { return static_cast<int>(arcs.size()); }

  // Index of the node with this id, or -1.
  int find_node(const std::string& id) const;
  int find_arc(const std::string& id) const;
  int find_demand(const std::string& id) const;
  // The largest arc capacity or |supply| or finite demand amount; scales the tolerance.
  double magnitude() const;
  // The smallest and largest capacity of the arcs in service with a positive capacity; both
  // 0 when there is none. The fair engine and its checker judge small numbers against these.
  struct CapacityRange {
    double smallest = 0.0, largest = 0.0;
  };
  CapacityRange positive_capacities() const;
};

}  // namespace apportion
