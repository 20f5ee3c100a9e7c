// Validation of a network document; see validation.h for the rules.
#include "apportion/model/validation.h"

#include <cmath>
#include <cstdint>
#include <functional>
#include <queue>
#include <string>
#include <string_view>
#include <vector>

#include "apportion/model/size_limits.h"

namespace apportion {

namespace {

// Items whose id is empty or not text are named by their position, so that messages stay
// printable and can be written into JSON.
std::string item_name(const std::string& id, std::size_t index) {
  if (!id.empty() && valid_utf8(id)) return id;
  std::string position = "#";  // appended, not "#" + ...: g++ 12 warns falsely (-Wrestrict) on that
  position += std::to_string(index + 1);
  return position;
}

// Every text field must be UTF-8 (RFC 3629): files from elsewhere in another encoding are
// refused by name rather than written into JSON and shared links they would break.
template <class Items>
void check_text(const Items& items, const char* kind, Diagnostics& out) {
  for (std::size_t i = 0; i < items.size(); ++i) {
    if (!valid_utf8(items[i].id))
      out.error(kind, item_name(items[i].id, i), "id", "is not UTF-8 text (save the file as UTF-8)");
    if (!valid_utf8(items[i].label))
      out.error(kind, item_name(items[i].id, i), "label", "is not UTF-8 text (save the file as UTF-8)");
  }
}

// Duplicate ids by open addressing over one array of (hash bits, item index): a node-based
// hash set made one allocation per item, which dominated opening a 2-million-node DIMACS
// file; the stored hash bits spare most probes a visit to a far-away item.
template <class Items>
void check_ids(const Items& items, const char* kind, Diagnostics& out) {
  std::size_t slots = 16;
  while (slots < 2 * items.size()) slots *= 2;
  constexpr std::uint64_t kEmpty = ~std::uint64_t{0};
  std::vector<std::uint64_t> table(slots, kEmpty);
  const std::hash<std::string_view> hash;
  for (std::size_t i = 0; i < items.size(); ++i) {
    const std::string& id = items[i].id;
    if (id.empty()) {
      out.error(kind, item_name(id, i), "id", "the id is empty");
    } else {
      const std::uint64_t h = hash(id);  // 32 bits in WebAssembly, 64 natively
      const std::uint64_t tag = static_cast<std::uint64_t>(h >> 32 ^ (h & 0xFFFFFFFFu)) << 32;
      std::size_t s = static_cast<std::size_t>(h) & (slots - 1);
      while (table[s] != kEmpty && ((table[s] & ~0xFFFFFFFFull) != tag || items[table[s] & 0xFFFFFFFFu].id != id))
        s = (s + 1) & (slots - 1);
      if (table[s] == kEmpty)
        table[s] = tag | i;
      else
        out.error(kind, item_name(id, i), "id", "duplicate id");
    }
    if (id.size() > SizeLimits::kMaxStringLength)
      out.error(kind, item_name("", i), "id", "longer than " + std::to_string(SizeLimits::kMaxStringLength) + " characters");
  }
}

// What is wrong with a number that must be finite and within the magnitude limit
// (`nonnegative` also rejects values below 0); empty when nothing is.
std::string number_problem(double v, bool nonnegative) {
  if (std::isnan(v)) return "is not a number (NaN)";
  if (std::isinf(v)) return "is infinite";
  if (nonnegative && v < 0) return "is negative (" + std::to_string(v) + ")";
  if (std::abs(v) > SizeLimits::kMaxMagnitude) return "exceeds the limit of 1e15 in magnitude";
  return {};
}

// One warning that may concern millions of items (a few bytes of DIMACS declare 2 million
// isolated nodes): the first kListed are named one by one, the rest counted in one line, so
// that the list stays readable and a large file opens quickly.
class RepeatedWarning {
 public:
  static constexpr int kListed = 100;
  RepeatedWarning(const char* kind, const char* field, const char* message, const char* plural)
      : kind_(kind), field_(field), message_(message), plural_(plural) {}
  void add(Diagnostics& out, const std::string& id, std::size_t index) {
    if (listed_ < kListed) {
      out.warning(kind_, item_name(id, index), field_, message_);
      ++listed_;
    } else {
      ++more_;
    }
  }
  void finish(Diagnostics& out) const {
    if (more_ > 0) out.warning("file", "", "", "and " + std::to_string(more_) + " more " + plural_);
  }

 private:
  const char* kind_;
  const char* field_;
  const char* message_;
  const char* plural_;
  int listed_ = 0;
  long long more_ = 0;
};

}  // namespace

bool valid_utf8(const std::string& s) {
  const auto* p = reinterpret_cast<const unsigned char*>(s.data());
  const std::size_t n = s.size();
  for (std::size_t i = 0; i < n;) {
    const unsigned char c = p[i];
    std::size_t len = 0;
    unsigned min = 0;
    if (c < 0x80) len = 1;
    else if ((c & 0xE0) == 0xC0) len = 2, min = 0x80;
    else if ((c & 0xF0) == 0xE0) len = 3, min = 0x800;
    else if ((c & 0xF8) == 0xF0) len = 4, min = 0x10000;
    else return false;
    if (i + len > n) return false;
    unsigned cp = len == 1 ? c : c & (0x7F >> len);
    for (std::size_t k = 1; k < len; ++k) {
      if ((p[i + k] & 0xC0) != 0x80) return false;
      cp = (cp << 6) | (p[i + k] & 0x3F);
    }
    if (len > 1 && (cp < min || cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF))) return false;  // overlong, surrogate
    i += len;
  }
  return true;
}

Diagnostics validate(const Network& net) {
  Diagnostics out;
  const int n = net.node_count();
  if (n > SizeLimits::kMaxNodes)
    out.error("file", "", "nodes", "more than " + std::to_string(SizeLimits::kMaxNodes) + " nodes");
  if (net.arc_count() > SizeLimits::kMaxArcs)
    out.error("file", "", "arcs", "more than " + std::to_string(SizeLimits::kMaxArcs) + " arcs");
  if (net.demands.size() > static_cast<std::size_t>(SizeLimits::kMaxDemands))
    out.error("file", "", "demands", "more than " + std::to_string(SizeLimits::kMaxDemands) + " demands");

  check_ids(net.nodes, "node", out);
  check_ids(net.arcs, "arc", out);
  check_ids(net.demands, "demand", out);
  check_text(net.nodes, "node", out);
  check_text(net.demands, "demand", out);
  for (std::size_t i = 0; i < net.arcs.size(); ++i)
    if (!valid_utf8(net.arcs[i].id))
      out.error("arc", item_name(net.arcs[i].id, i), "id", "is not UTF-8 text (save the file as UTF-8)");
  const std::pair<const char*, const std::string*> texts[] = {
      {"name", &net.name}, {"units", &net.units.capacity}, {"units", &net.units.cost}, {"units", &net.units.time}};
  for (const auto& [field, text] : texts) {
    if (!valid_utf8(*text)) out.error("file", "", field, "is not UTF-8 text (save the file as UTF-8)");
    // Every importer, not only JSON's: a GraphML graph id of 1,100 characters became a
    // name that the JSON reader refused, so the network's own autosave could not be opened.
    if (text->size() > SizeLimits::kMaxStringLength)
      out.error("file", "", field, "longer than " + std::to_string(SizeLimits::kMaxStringLength) + " characters");
  }

  std::vector<int> degree(n, 0);
  for (std::size_t i = 0; i < net.nodes.size(); ++i) {
    const Node& v = net.nodes[i];
    const std::pair<const char*, const double*> numbers[] = {
        {"supply", &v.supply}, {"x", v.x ? &*v.x : nullptr}, {"y", v.y ? &*v.y : nullptr}};
    for (const auto& [field, value] : numbers)
      if (value)
        if (std::string problem = number_problem(*value, false); !problem.empty())
          out.error("node", item_name(v.id, i), field, std::move(problem));
    if (v.label.size() > SizeLimits::kMaxStringLength) out.error("node", item_name(v.id, i), "label", "label too long");
  }

  RepeatedWarning self_loops("arc", "to", "self-loop: the arc starts and ends at the same node", "self-loops");
  RepeatedWarning zero_arcs("arc", "capacity", "zero capacity: the arc carries nothing", "arcs with zero capacity");
  for (std::size_t i = 0; i < net.arcs.size(); ++i) {
    const Arc& a = net.arcs[i];
    bool ends_ok = true;
    if (a.from < 0 || a.from >= n) out.error("arc", item_name(a.id, i), "from", "refers to an unknown node"), ends_ok = false;
    if (a.to < 0 || a.to >= n) out.error("arc", item_name(a.id, i), "to", "refers to an unknown node"), ends_ok = false;
    const std::pair<const char*, std::string> numbers[] = {
        {"capacity", number_problem(a.capacity, true)},
        {"cost", a.cost ? number_problem(*a.cost, false) : std::string()},
        {"transit", a.transit ? number_problem(*a.transit, true) : std::string()}};
    for (const auto& [field, problem] : numbers)
      if (!problem.empty()) out.error("arc", item_name(a.id, i), field, problem);
    if (a.shared_two_way && a.cost && *a.cost < 0)
      out.error("arc", item_name(a.id, i), "cost",
                "a shared two-way link cannot have a negative cost (it would be a negative cycle)");
    if (ends_ok && a.from == a.to) self_loops.add(out, a.id, i);
    if (a.capacity == 0.0) zero_arcs.add(out, a.id, i);
    if (ends_ok) ++degree[a.from], ++degree[a.to];
  }
  self_loops.finish(out);
  zero_arcs.finish(out);

  bool demand_ends_ok = true;
  for (std::size_t i = 0; i < net.demands.size(); ++i) {
    const Demand& d = net.demands[i];
    const std::string id = item_name(d.id, i);
    bool ok = true;
    if (d.origin < 0 || d.origin >= n) out.error("demand", id, "origin", "refers to an unknown node"), ok = false;
    if (d.destination < 0 || d.destination >= n)
      out.error("demand", id, "destination", "refers to an unknown node"), ok = false;
    if (ok && d.origin == d.destination) out.error("demand", id, "destination", "is the same node as the origin");
    const std::pair<const char*, std::string> numbers[] = {
        {"amount", d.amount ? number_problem(*d.amount, true) : std::string()},
        {"weight", number_problem(d.weight, true)}};
    for (const auto& [field, problem] : numbers)
      if (!problem.empty()) out.error("demand", id, field, problem);
    if (std::isfinite(d.weight) && d.weight <= 0) out.error("demand", id, "weight", "must be positive");
    if (d.label.size() > SizeLimits::kMaxStringLength) out.error("demand", id, "label", "label too long");
    if (ok) ++degree[d.origin], ++degree[d.destination];
    demand_ends_ok = demand_ends_ok && ok;
  }

  RepeatedWarning isolated("node", "", "isolated: no arc or demand touches it", "isolated nodes");
  for (int v = 0; v < n; ++v)
    if (degree[v] == 0 && net.nodes[v].supply == 0.0) isolated.add(out, net.nodes[v].id, v);
  isolated.finish(out);

  if (out.has_errors() || !demand_ends_ok) return out;

  // Reachability over enabled arcs with capacity, one search per distinct origin.
  std::vector<std::vector<int>> out_adj(n);
  for (const Arc& a : net.arcs) {
    if (!a.enabled || !(a.capacity > 0)) continue;
    out_adj[a.from].push_back(a.to);
    if (a.shared_two_way) out_adj[a.to].push_back(a.from);
  }
  std::vector<std::vector<int>> demands_from(n);
  for (std::size_t i = 0; i < net.demands.size(); ++i) demands_from[net.demands[i].origin].push_back(static_cast<int>(i));
  std::vector<int> mark(n, -1);
  for (int origin = 0; origin < n; ++origin) {
    if (demands_from[origin].empty()) continue;
    std::queue<int> q;
    q.push(origin);
    mark[origin] = origin;
    while (!q.empty()) {
      int u = q.front();
      q.pop();
      for (int w : out_adj[u])
        if (mark[w] != origin) mark[w] = origin, q.push(w);
    }
    for (int i : demands_from[origin])
      if (mark[net.demands[i].destination] != origin)
        out.warning("demand", item_name(net.demands[i].id, i), "destination",
                    "cannot be reached from the origin over enabled arcs");
  }
  return out;
}

}  // namespace apportion
