// GraphML import through pugixml; see network_graphml.h.
#include "apportion/formats/network_graphml.h"

#include <algorithm>
#include <cmath>

#include <pugixml.hpp>
#include <unordered_map>

#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"
#include "apportion/model/validation.h"

namespace apportion {

namespace {

// Longitude and latitude as read (x = longitude, y = -latitude, in degrees) onto the
// equidistant cylindrical projection with the mean latitude as its standard parallel:
// x = longitude cos(mean latitude), y = -latitude (J. P. Snyder, "Map Projections: A Working
// Manual", USGS Professional Paper 1395, 1987, section 12 -- from memory), so that east-west
// distances are not stretched by 1 / cos(latitude) as raw degrees are. Then nodes without a
// position are put beside their placed neighbours (their mean, spread on a small circle),
// repeatedly, so that a few missing coordinates do not pull the drawing apart; nodes with no
// placed node near them stay for the automatic layout.
void place_geographically(Network& net, double mean_latitude, Diagnostics& d) {
  const double squeeze = std::cos(mean_latitude * 3.14159265358979323846 / 180.0);
  double lo_x = 0, hi_x = 0, lo_y = 0, hi_y = 0;
  bool first = true;
  for (Node& v : net.nodes) {
    if (!v.x || !v.y) continue;
    *v.x *= squeeze;
    lo_x = first ? *v.x : std::min(lo_x, *v.x), hi_x = first ? *v.x : std::max(hi_x, *v.x);
    lo_y = first ? *v.y : std::min(lo_y, *v.y), hi_y = first ? *v.y : std::max(hi_y, *v.y);
    first = false;
  }
  const double spread = 0.03 * std::max({hi_x - lo_x, hi_y - lo_y, 1e-6});
  std::vector<std::vector<int>> near(net.node_count());
  for (const Arc& a : net.arcs)
    if (a.from >= 0 && a.to >= 0) near[a.from].push_back(a.to), near[a.to].push_back(a.from);
  int placed_here = 0, left = 0;
  for (bool progress = true; progress;) {
    progress = false;
    std::vector<std::pair<int, std::pair<double, double>>> now;
    for (int v = 0; v < net.node_count(); ++v) {
      if (net.nodes[v].x && net.nodes[v].y) continue;
      double sx = 0, sy = 0;
      int n = 0;
      for (int u : near[v])
        if (net.nodes[u].x && net.nodes[u].y) sx += *net.nodes[u].x, sy += *net.nodes[u].y, ++n;
      if (n == 0) continue;
      // A point on a small circle, turned by the node's index, so that nodes beside the
      // same neighbours do not land on one another (golden angle: common practice, no source).
      const double turn = 2.39996322972865332 * (placed_here + static_cast<int>(now.size()) + 1);
      now.push_back({v, {sx / n + spread * std::cos(turn), sy / n + spread * std::sin(turn)}});
    }
    for (const auto& [v, xy] : now) net.nodes[v].x = xy.first, net.nodes[v].y = xy.second;
    placed_here += static_cast<int>(now.size());
    progress = !now.empty();
  }
  for (const Node& v : net.nodes) left += !(v.x && v.y);
  if (placed_here > 0)
    d.warning("file", "", "Longitude",
              std::to_string(placed_here) + " nodes have no coordinates; they are drawn beside their neighbours");
  if (left > 0)
    d.warning("file", "", "Longitude",
              std::to_string(left) + " nodes have no coordinates and no placed neighbour; the automatic layout places them");
}

}  // namespace

LoadResult read_graphml(const std::string& text, const GraphmlOptions& options) {
  LoadResult result;
  Diagnostics& d = result.diagnostics;
  if (text.size() > SizeLimits::kMaxFileBytes) {
    d.error("file", "", "", "larger than the limit of 512 MiB");
    return result;
  }
  pugi::xml_document doc;
  // No DTD or entity expansion is ever done by pugixml: no billion-laughs risk.
  pugi::xml_parse_result parsed = doc.load_buffer(text.data(), text.size(), pugi::parse_default);
  if (!parsed) {
    d.error("file", "", "", std::string("not well-formed XML: ") + parsed.description() + " at byte " +
                                std::to_string(parsed.offset));
    return result;
  }
  pugi::xml_node root = doc.child("graphml");
  pugi::xml_node graph = root.child("graph");
  if (!root || !graph) {
    d.error("file", "", "", "no <graphml><graph> element");
    return result;
  }
  // key id -> attribute name, per domain
  std::unordered_map<std::string, std::string> node_keys, edge_keys;
  for (pugi::xml_node key : root.children("key")) {
    const std::string dom = key.attribute("for").as_string("all");
    const std::string id = key.attribute("id").as_string();
    const std::string name = key.attribute("attr.name").as_string(id.c_str());
    if (dom == "node" || dom == "all") node_keys[id] = name;
    if (dom == "edge" || dom == "all") edge_keys[id] = name;
  }
  const bool undirected_default = std::string(graph.attribute("edgedefault").as_string("directed")) == "undirected";

  Network net;
  net.name = graph.attribute("id").as_string();
  std::unordered_map<std::string, int> index;
  auto read_data = [&](pugi::xml_node item, const std::unordered_map<std::string, std::string>& keys) {
    std::unordered_map<std::string, std::string> values;
    for (pugi::xml_node data : item.children("data")) {
      auto it = keys.find(data.attribute("key").as_string());
      if (it != keys.end()) values[it->second] = data.text().as_string();
    }
    return values;
  };
  auto number = [&](const std::unordered_map<std::string, std::string>& values, const char* name, const char* kind,
                    const std::string& id) -> std::optional<double> {
    auto it = values.find(name);
    if (it == values.end() || it->second.empty()) return std::nullopt;
    std::string why;
    auto v = parse_number(it->second, &why);
    if (!v) d.error(kind, id, name, "'" + it->second + "' " + why);
    return v;
  };

  int geographic = 0;  // nodes placed by Longitude and Latitude
  std::unordered_map<int, std::pair<double, double>> lon_lat;  // node -> its coordinates
  double latitude_sum = 0.0;
  for (pugi::xml_node node : graph.children("node")) {
    if (net.node_count() >= SizeLimits::kMaxNodes) {
      d.error("file", "", "nodes", "more nodes than the size limit");
      return result;
    }
    Node v;
    v.id = node.attribute("id").as_string();
    auto values = read_data(node, node_keys);
    if (auto it = values.find("label"); it != values.end())
      v.label = it->second;
    else if (auto nit = values.find("name"); nit != values.end())
      v.label = nit->second;
    v.x = number(values, "x", "node", v.id);
    v.y = number(values, "y", "node", v.id);
    if (!v.x && !v.y) {
      auto lon = number(values, "Longitude", "node", v.id);
      auto lat = number(values, "Latitude", "node", v.id);
      if (lon && lat) v.x = *lon, v.y = -*lat, ++geographic, latitude_sum += *lat, lon_lat[net.node_count()] = {*lon, *lat};
    }
    if (!v.id.empty() && !index.emplace(v.id, net.node_count()).second) {
      d.error("node", v.id, "id", "duplicate id");
      continue;
    }
    net.nodes.push_back(std::move(v));
  }
  int defaulted = 0, count = 0;
  for (pugi::xml_node edge : graph.children("edge")) {
    ++count;
    if (net.arc_count() >= SizeLimits::kMaxArcs) {
      d.error("file", "", "edges", "more edges than the size limit");
      return result;
    }
    std::string id = edge.attribute("id").as_string();
    if (id.empty()) id = "e" + std::to_string(count);
    Arc a;
    a.id = id;
    for (const char* end : {"source", "target"}) {
      const std::string ref = edge.attribute(end).as_string();
      auto it = index.find(ref);
      if (it == index.end()) {
        d.error("edge", id, end, ref.empty() ? "is missing" : "refers to unknown node '" + ref + "'");
      } else {
        (end[0] == 's' ? a.from : a.to) = it->second;
      }
    }
    auto values = read_data(edge, edge_keys);
    auto cap = number(values, options.capacity_attribute.c_str(), "edge", id);
    if (!cap) ++defaulted;
    a.capacity = cap ? *cap * options.capacity_scale : options.default_capacity;
    a.cost = number(values, "cost", "edge", id);
    a.transit = number(values, "transit", "edge", id);
    pugi::xml_attribute directed = edge.attribute("directed");
    const bool undirected = directed ? !directed.as_bool() : undirected_default;
    if (undirected && options.undirected_as_pairs) {
      Arc back = a;
      std::swap(back.from, back.to);
      back.id = id + "-rev";
      net.arcs.push_back(std::move(a));
      net.arcs.push_back(std::move(back));
    } else {
      a.shared_two_way = undirected;
      net.arcs.push_back(std::move(a));
    }
  }
  if (defaulted > 0 && options.capacity_attribute.empty())
    d.warning("file", "", "capacity",
              "no capacity attribute was chosen: all " + std::to_string(count) + " edges got the default capacity " +
                  format_number(options.default_capacity));
  else if (defaulted > 0)
    d.warning("file", "", options.capacity_attribute,
              std::to_string(defaulted) + " of " + std::to_string(count) + " edges have no '" +
                  options.capacity_attribute + "' attribute; they got the default capacity " +
                  format_number(options.default_capacity));
  if (!options.capacity_unit.empty()) net.units.capacity = options.capacity_unit;
  if (options.length_as != GraphmlOptions::Length::kNone) {
    int without = 0;
    for (Arc& a : net.arcs) {
      auto p = lon_lat.find(a.from), q = lon_lat.find(a.to);
      if (p == lon_lat.end() || q == lon_lat.end()) {
        ++without;
        continue;
      }
      const double km = great_circle_km(p->second.first, p->second.second, q->second.first, q->second.second);
      if (options.length_as == GraphmlOptions::Length::kCost) a.cost = km;
      else a.transit = km / options.speed;
    }
    if (options.length_as == GraphmlOptions::Length::kCost) net.units.cost = "km";
    if (without > 0)
      d.warning("file", "", "Longitude",
                std::to_string(without) + " of " + std::to_string(net.arc_count()) +
                    " arcs have an end without coordinates and got no length");
  }
  if (geographic > 0) place_geographically(net, latitude_sum / geographic, d);
  d.append(validate(net));
  if (!d.has_errors()) result.network = std::move(net);
  return result;
}

std::vector<GraphmlAttribute> graphml_edge_attributes(const std::string& text) {
  std::vector<GraphmlAttribute> out;
  pugi::xml_document doc;
  if (!doc.load_buffer(text.data(), text.size())) return out;
  pugi::xml_node root = doc.child("graphml");
  std::unordered_map<std::string, std::size_t> by_key;
  for (pugi::xml_node key : root.children("key")) {
    const std::string dom = key.attribute("for").as_string("all");
    if (dom != "edge" && dom != "all") continue;
    const std::string id = key.attribute("id").as_string();
    by_key[id] = out.size();
    out.push_back({key.attribute("attr.name").as_string(id.c_str()), 0});
  }
  for (pugi::xml_node edge : root.child("graph").children("edge"))
    for (pugi::xml_node data : edge.children("data")) {
      auto it = by_key.find(data.attribute("key").as_string());
      if (it != by_key.end() && *data.text().as_string()) ++out[it->second].edges_with_value;
    }
  return out;
}

double great_circle_km(double lon1, double lat1, double lon2, double lat2) {
  constexpr double kRadian = 3.14159265358979323846 / 180.0, kEarthKm = 6371.0088;
  const double dlat = (lat2 - lat1) * kRadian, dlon = (lon2 - lon1) * kRadian;
  const double h = std::sin(dlat / 2) * std::sin(dlat / 2) +
                   std::cos(lat1 * kRadian) * std::cos(lat2 * kRadian) * std::sin(dlon / 2) * std::sin(dlon / 2);
  return 2 * kEarthKm * std::asin(std::min(1.0, std::sqrt(h)));
}

double link_speed_factor(const std::string& unit) {
  if (unit == "bit/s") return 1.0;
  if (unit == "kbit/s") return 1e3;
  if (unit == "Mbit/s") return 1e6;
  if (unit == "Gbit/s") return 1e9;
  if (unit == "Tbit/s") return 1e12;
  return 0.0;
}

}  // namespace apportion
