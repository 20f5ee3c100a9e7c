// Reading and writing the Apportion JSON network file (core/FORMAT.md).
// nlohmann::json is used without exceptions: every access is type-checked first, so a
// hostile file produces a diagnostic, never an abort.
#include "apportion/formats/network_json.h"

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>

#include "apportion/model/size_limits.h"
#include "apportion/model/validation.h"

namespace apportion {

using nlohmann::json;

namespace {

// Type-checked field access that records a diagnostic naming the item and field.
class FieldReader {
 public:
  FieldReader(Diagnostics& d, const char* kind, std::string id) : d_(d), kind_(kind), id_(std::move(id)) {}

  std::optional<std::string> str(const json& obj, const char* key, bool required) {
    auto it = obj.find(key);
    if (it == obj.end()) {
      if (required) d_.error(kind_, id_, key, "is missing");
      return std::nullopt;
    }
    if (!it->is_string()) {
      d_.error(kind_, id_, key, "must be a string");
      return std::nullopt;
    }
    const auto& s = it->get_ref<const std::string&>();
    if (s.size() > SizeLimits::kMaxStringLength) {
      d_.error(kind_, id_, key, "longer than " + std::to_string(SizeLimits::kMaxStringLength) + " characters");
      return std::nullopt;
    }
    return s;
  }

  std::optional<double> num(const json& obj, const char* key, bool required) {
    auto it = obj.find(key);
    if (it == obj.end()) {
      if (required) d_.error(kind_, id_, key, "is missing");
      return std::nullopt;
    }
    if (!it->is_number()) {
      d_.error(kind_, id_, key, "must be a number");
      return std::nullopt;
    }
    double v = it->get<double>();
    if (!std::isfinite(v)) {
      d_.error(kind_, id_, key, "is not a finite number");
      return std::nullopt;
    }
    return v;
  }

  std::optional<bool> boolean(const json& obj, const char* key) {
    auto it = obj.find(key);
    if (it == obj.end()) return std::nullopt;
    if (!it->is_boolean()) {
      d_.error(kind_, id_, key, "must be true or false");
      return std::nullopt;
    }
    return it->get<bool>();
  }

  int node_ref(const json& obj, const char* key, const std::unordered_map<std::string, int>& index) {
    auto s = str(obj, key, true);
    if (!s) return -1;
    auto it = index.find(*s);
    if (it == index.end()) {
      d_.error(kind_, id_, key, "refers to unknown node '" + *s + "'");
      return -1;
    }
    return it->second;
  }

 private:
  Diagnostics& d_;
  const char* kind_;
  std::string id_;
};

// One SAX pass over the text before it is parsed into a document. It records
//  - why the text is not JSON, with the byte position, as a message a user can act on;
//  - the first key repeated within one object: JSON leaves duplicates undefined (RFC 8259,
//    section 4) and the parser would keep one silently; Apportion refuses such a file.
// A SAX pass is linear; nlohmann's callback parser would be quadratic on large arrays.
struct JsonChecker : nlohmann::json_sax<json> {
  std::string parse_message;
  std::string duplicate;
  std::vector<std::vector<std::string>> open;  // keys seen in each open object

  bool null() override { return true; }
  bool boolean(bool) override { return true; }
  bool number_integer(number_integer_t) override { return true; }
  bool number_unsigned(number_unsigned_t) override { return true; }
  bool number_float(number_float_t, const string_t&) override { return true; }
  bool string(string_t&) override { return true; }
  bool binary(binary_t&) override { return true; }
  bool start_object(std::size_t) override {
    open.emplace_back();
    return true;
  }
  bool key(string_t& k) override {
    auto& keys = open.back();
    if (std::find(keys.begin(), keys.end(), k) == keys.end())
      keys.push_back(k);
    else if (duplicate.empty())
      duplicate = k;
    return true;
  }
  bool end_object() override {
    open.pop_back();
    return true;
  }
  bool start_array(std::size_t) override { return true; }
  bool end_array() override { return true; }
  bool parse_error(std::size_t position, const std::string& last_token, const nlohmann::detail::exception& ex) override {
    std::string what = ex.what();
    // nlohmann's messages start with "[json.exception.parse_error.101] parse error at line 1, column 5: "
    const auto colon = what.find(": ");
    parse_message = "not valid JSON at byte " + std::to_string(position) + " (near '" + last_token.substr(0, 40) +
                    "'): " + (colon == std::string::npos ? what : what.substr(colon + 2));
    return false;
  }
};

std::string id_or_position(const json& obj, std::size_t i) {
  auto it = obj.find("id");
  if (it != obj.end() && it->is_string() && it->get_ref<const std::string&>().size() <= SizeLimits::kMaxStringLength)
    return it->get<std::string>();
  return "#" + std::to_string(i + 1);
}

const json* array_field(const json& root, const char* key, Diagnostics& d) {
  auto it = root.find(key);
  if (it == root.end()) return nullptr;
  if (!it->is_array()) {
    d.error("file", "", key, "must be an array");
    return nullptr;
  }
  return &*it;
}

}  // namespace

LoadResult read_network_json(const std::string& text) {
  LoadResult result;
  Diagnostics& d = result.diagnostics;
  if (text.size() > SizeLimits::kMaxFileBytes) {
    d.error("file", "", "", "larger than the limit of 512 MiB");
    return result;
  }
  JsonChecker checker;
  const bool well_formed =
      json::sax_parse(text, &checker, nlohmann::detail::input_format_t::json, /*strict=*/true);
  if (!well_formed) {
    d.error("file", "", "", checker.parse_message.empty() ? "not valid JSON" : checker.parse_message);
    return result;
  }
  if (!checker.duplicate.empty()) {
    d.error("file", "", checker.duplicate, "the key '" + checker.duplicate + "' appears twice in one object");
    return result;
  }
  const json root = json::parse(text, nullptr, /*allow_exceptions=*/false);
  if (!root.is_object()) {
    d.error("file", "", "", "the top level must be a JSON object");
    return result;
  }
  auto fmt = root.find("format");
  if (fmt == root.end() || !fmt->is_string() || fmt->get<std::string>() != "apportion-network") {
    d.error("file", "", "format", "must be \"apportion-network\"");
    return result;
  }
  auto ver = root.find("version");
  if (ver == root.end() || !ver->is_number_integer()) {
    d.error("file", "", "version", "must be an integer");
    return result;
  }
  if (ver->get<long long>() != kNetworkFormatVersion) {
    d.error("file", "", "version",
            "version " + std::to_string(ver->get<long long>()) + " is not supported (this build reads version " +
                std::to_string(kNetworkFormatVersion) + ")");
    return result;
  }

  Network net;
  FieldReader top(d, "file", "");
  net.name = top.str(root, "name", false).value_or("");
  if (auto it = root.find("units"); it != root.end()) {
    if (!it->is_object()) {
      d.error("file", "", "units", "must be an object");
    } else {
      FieldReader u(d, "units", "");
      net.units.capacity = u.str(*it, "capacity", false).value_or("");
      net.units.cost = u.str(*it, "cost", false).value_or("");
      net.units.time = u.str(*it, "time", false).value_or("");
    }
  }
  if (auto it = root.find("metadata"); it != root.end()) {
    if (!it->is_object())
      d.error("file", "", "metadata", "must be an object");
    else
      net.metadata_json = it->dump();
  }

  const json* nodes = array_field(root, "nodes", d);
  const json* arcs = array_field(root, "arcs", d);
  const json* demands = array_field(root, "demands", d);
  if (nodes && nodes->size() > static_cast<std::size_t>(SizeLimits::kMaxNodes)) d.error("file", "", "nodes", "too many nodes"), nodes = nullptr;
  if (arcs && arcs->size() > static_cast<std::size_t>(SizeLimits::kMaxArcs)) d.error("file", "", "arcs", "too many arcs"), arcs = nullptr;
  if (demands && demands->size() > static_cast<std::size_t>(SizeLimits::kMaxDemands)) d.error("file", "", "demands", "too many demands"), demands = nullptr;

  std::unordered_map<std::string, int> node_index;
  if (nodes) {
    for (std::size_t i = 0; i < nodes->size(); ++i) {
      const json& o = (*nodes)[i];
      const std::string name = id_or_position(o, i);
      if (!o.is_object()) {
        d.error("node", name, "", "must be an object");
        continue;
      }
      FieldReader r(d, "node", name);
      Node v;
      v.id = r.str(o, "id", true).value_or("");
      v.label = r.str(o, "label", false).value_or("");
      v.x = r.num(o, "x", false);
      v.y = r.num(o, "y", false);
      v.supply = r.num(o, "supply", false).value_or(0.0);
      if (!v.id.empty() && !node_index.emplace(v.id, static_cast<int>(net.nodes.size())).second) {
        d.error("node", v.id, "id", "duplicate id");
        continue;
      }
      net.nodes.push_back(std::move(v));
    }
  }
  if (arcs) {
    for (std::size_t i = 0; i < arcs->size(); ++i) {
      const json& o = (*arcs)[i];
      const std::string name = id_or_position(o, i);
      if (!o.is_object()) {
        d.error("arc", name, "", "must be an object");
        continue;
      }
      FieldReader r(d, "arc", name);
      Arc a;
      a.id = r.str(o, "id", true).value_or("");
      a.from = r.node_ref(o, "from", node_index);
      a.to = r.node_ref(o, "to", node_index);
      a.capacity = r.num(o, "capacity", true).value_or(0.0);
      a.cost = r.num(o, "cost", false);
      a.transit = r.num(o, "transit", false);
      a.enabled = r.boolean(o, "enabled").value_or(true);
      a.shared_two_way = r.boolean(o, "shared_two_way").value_or(false);
      net.arcs.push_back(std::move(a));
    }
  }
  if (demands) {
    for (std::size_t i = 0; i < demands->size(); ++i) {
      const json& o = (*demands)[i];
      const std::string name = id_or_position(o, i);
      if (!o.is_object()) {
        d.error("demand", name, "", "must be an object");
        continue;
      }
      FieldReader r(d, "demand", name);
      Demand k;
      k.id = r.str(o, "id", true).value_or("");
      k.label = r.str(o, "label", false).value_or("");
      k.origin = r.node_ref(o, "origin", node_index);
      k.destination = r.node_ref(o, "destination", node_index);
      auto amt = o.find("amount");
      if (amt == o.end() || (amt->is_string() && amt->get<std::string>() == "max")) {
        k.amount.reset();
      } else {
        k.amount = r.num(o, "amount", true);
        if (!k.amount) d.error("demand", name, "amount", "must be a number or \"max\"");
      }
      k.weight = r.num(o, "weight", false).value_or(1.0);
      net.demands.push_back(std::move(k));
    }
  }
  d.append(validate(net));
  if (!d.has_errors()) result.network = std::move(net);
  return result;
}

std::string write_network_json(const Network& net) {
  json root = json::object();
  root["format"] = "apportion-network";
  root["version"] = kNetworkFormatVersion;
  root["name"] = net.name;
  root["units"] = {{"capacity", net.units.capacity}, {"cost", net.units.cost}, {"time", net.units.time}};
  json nodes = json::array();
  for (const Node& v : net.nodes) {
    json o = {{"id", v.id}};
    if (!v.label.empty()) o["label"] = v.label;
    if (v.x) o["x"] = *v.x;
    if (v.y) o["y"] = *v.y;
    if (v.supply != 0.0) o["supply"] = v.supply;
    nodes.push_back(std::move(o));
  }
  json arcs = json::array();
  for (const Arc& a : net.arcs) {
    json o = {{"id", a.id}, {"from", net.nodes[a.from].id}, {"to", net.nodes[a.to].id}, {"capacity", a.capacity}};
    if (a.cost) o["cost"] = *a.cost;
    if (a.transit) o["transit"] = *a.transit;
    if (!a.enabled) o["enabled"] = false;
    if (a.shared_two_way) o["shared_two_way"] = true;
    arcs.push_back(std::move(o));
  }
  json demands = json::array();
  for (const Demand& k : net.demands) {
    json o = {{"id", k.id}, {"origin", net.nodes[k.origin].id}, {"destination", net.nodes[k.destination].id}};
    if (!k.label.empty()) o["label"] = k.label;
    if (k.amount)
      o["amount"] = *k.amount;
    else
      o["amount"] = "max";
    if (k.weight != 1.0) o["weight"] = k.weight;
    demands.push_back(std::move(o));
  }
  root["nodes"] = std::move(nodes);
  root["arcs"] = std::move(arcs);
  root["demands"] = std::move(demands);
  json meta = json::parse(net.metadata_json, nullptr, false);
  root["metadata"] = (meta.is_discarded() || !meta.is_object()) ? json::object() : meta;
  return root.dump(2, ' ', false, nlohmann::json::error_handler_t::replace) + "\n";
}

}  // namespace apportion
