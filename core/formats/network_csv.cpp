// The network as three CSV tables; see network_csv.h.
#include "apportion/formats/network_csv.h"

#include <algorithm>
#include <unordered_map>

#include "apportion/formats/csv_table.h"
#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"
#include "apportion/model/validation.h"

namespace apportion {

namespace {

std::string opt_number(const std::optional<double>& v) { return v ? format_number(*v) : std::string(); }

// One table: header lookup and typed cells, with diagnostics naming table, row and column.
class Table {
 public:
  Table(const char* kind, const std::string& text, Diagnostics& d, const std::vector<std::string>& known)
      : kind_(kind), d_(d) {
    if (text.size() > SizeLimits::kMaxFileBytes) {
      d.error(kind, "", "", "table larger than the limit of 512 MiB");
      return;
    }
    CsvParse p = parse_csv(text);
    if (!p.error.empty()) {
      d.error(kind, "", "", p.error);
      return;
    }
    if (p.rows.empty()) return;
    for (std::size_t i = 0; i < p.rows[0].size(); ++i) {
      const std::string& h = p.rows[0][i];
      if (std::find(known.begin(), known.end(), h) == known.end())
        d.warning(kind, "", h, "unknown column, ignored");
      else
        column_[h] = i;
    }
    rows_.assign(p.rows.begin() + 1, p.rows.end());
    ok_ = true;
  }

  bool ok() const { return ok_; }
  bool has(const char* col) const { return column_.count(col) > 0; }
  std::size_t size() const { return rows_.size(); }

  std::string text(std::size_t row, const char* col) const {
    auto it = column_.find(col);
    if (it == column_.end() || it->second >= rows_[row].size()) return {};
    return rows_[row][it->second];
  }

  std::string name(std::size_t row) const {
    std::string id = text(row, "id");
    return id.empty() ? "row " + std::to_string(row + 2) : id;
  }

  std::optional<double> number(std::size_t row, const char* col) const {
    std::string t = text(row, col);
    if (t.empty()) return std::nullopt;
    std::string why;
    auto v = parse_number(t, &why);
    if (!v) d_.error(kind_, name(row), col, "'" + t + "' " + why);
    return v;
  }

  std::optional<bool> flag(std::size_t row, const char* col) const {
    std::string t = text(row, col);
    std::transform(t.begin(), t.end(), t.begin(), [](unsigned char c) { return std::tolower(c); });
    if (t.empty()) return std::nullopt;
    if (t == "true" || t == "1" || t == "yes") return true;
    if (t == "false" || t == "0" || t == "no") return false;
    d_.error(kind_, name(row), col, "'" + t + "' is not true or false");
    return std::nullopt;
  }

  int node(std::size_t row, const char* col, const std::unordered_map<std::string, int>& index) const {
    std::string t = text(row, col);
    auto it = index.find(t);
    if (it == index.end()) {
      d_.error(kind_, name(row), col, t.empty() ? "is missing" : "refers to unknown node '" + t + "'");
      return -1;
    }
    return it->second;
  }

 private:
  const char* kind_;
  Diagnostics& d_;
  std::unordered_map<std::string, std::size_t> column_;
  std::vector<CsvRow> rows_;
  bool ok_ = false;
};

}  // namespace

NetworkCsv write_network_csv(const Network& net) {
  NetworkCsv out;
  std::vector<CsvRow> rows{{"id", "label", "x", "y", "supply"}};
  for (const Node& v : net.nodes)
    rows.push_back({v.id, v.label, opt_number(v.x), opt_number(v.y), v.supply != 0 ? format_number(v.supply) : ""});
  out.nodes = write_csv(rows);
  rows = {{"id", "from", "to", "capacity", "cost", "transit", "enabled", "shared_two_way"}};
  for (const Arc& a : net.arcs)
    rows.push_back({a.id, net.nodes[a.from].id, net.nodes[a.to].id, format_number(a.capacity), opt_number(a.cost),
                    opt_number(a.transit), a.enabled ? "true" : "false", a.shared_two_way ? "true" : "false"});
  out.arcs = write_csv(rows);
  rows = {{"id", "label", "origin", "destination", "amount", "weight"}};
  for (const Demand& k : net.demands)
    rows.push_back({k.id, k.label, net.nodes[k.origin].id, net.nodes[k.destination].id,
                    k.amount ? format_number(*k.amount) : "max", format_number(k.weight)});
  out.demands = write_csv(rows);
  return out;
}

LoadResult read_network_csv(const NetworkCsv& tables) {
  LoadResult result;
  Diagnostics& d = result.diagnostics;
  Table nodes("nodes table", tables.nodes, d, {"id", "label", "x", "y", "supply"});
  Table arcs("arcs table", tables.arcs, d,
             {"id", "from", "to", "capacity", "cost", "transit", "enabled", "shared_two_way"});
  Table demands("demands table", tables.demands, d, {"id", "label", "origin", "destination", "amount", "weight"});
  if (d.has_errors()) return result;
  if (!nodes.ok() || !nodes.has("id")) {
    d.error("nodes table", "", "id", "the nodes table needs a header row with an 'id' column");
    return result;
  }
  if (!arcs.ok() || !arcs.has("from") || !arcs.has("to") || !arcs.has("capacity")) {
    d.error("arcs table", "", "", "the arcs table needs 'from', 'to' and 'capacity' columns");
    return result;
  }
  if (nodes.size() > static_cast<std::size_t>(SizeLimits::kMaxNodes) ||
      arcs.size() > static_cast<std::size_t>(SizeLimits::kMaxArcs) ||
      demands.size() > static_cast<std::size_t>(SizeLimits::kMaxDemands)) {
    d.error("file", "", "", "the tables exceed the size limits");
    return result;
  }

  Network net;
  std::unordered_map<std::string, int> index;
  for (std::size_t r = 0; r < nodes.size(); ++r) {
    Node v;
    v.id = nodes.text(r, "id");
    v.label = nodes.text(r, "label");
    v.x = nodes.number(r, "x");
    v.y = nodes.number(r, "y");
    v.supply = nodes.number(r, "supply").value_or(0.0);
    if (!v.id.empty() && !index.emplace(v.id, net.node_count()).second) {
      d.error("node", v.id, "id", "duplicate id");
      continue;
    }
    net.nodes.push_back(std::move(v));
  }
  for (std::size_t r = 0; r < arcs.size(); ++r) {
    Arc a;
    a.id = arcs.text(r, "id");
    if (a.id.empty()) a.id = "a" + std::to_string(r + 1);
    a.from = arcs.node(r, "from", index);
    a.to = arcs.node(r, "to", index);
    auto cap = arcs.number(r, "capacity");
    if (!cap) d.error("arc", a.id, "capacity", "is missing");
    a.capacity = cap.value_or(0.0);
    a.cost = arcs.number(r, "cost");
    a.transit = arcs.number(r, "transit");
    a.enabled = arcs.flag(r, "enabled").value_or(true);
    a.shared_two_way = arcs.flag(r, "shared_two_way").value_or(false);
    net.arcs.push_back(std::move(a));
  }
  for (std::size_t r = 0; demands.ok() && r < demands.size(); ++r) {
    Demand k;
    k.id = demands.text(r, "id");
    if (k.id.empty()) k.id = "d" + std::to_string(r + 1);
    k.label = demands.text(r, "label");
    k.origin = demands.node(r, "origin", index);
    k.destination = demands.node(r, "destination", index);
    const std::string amount = demands.text(r, "amount");
    if (!amount.empty() && amount != "max") k.amount = demands.number(r, "amount");
    k.weight = demands.number(r, "weight").value_or(1.0);
    net.demands.push_back(std::move(k));
  }
  d.append(validate(net));
  if (!d.has_errors()) result.network = std::move(net);
  return result;
}

}  // namespace apportion
