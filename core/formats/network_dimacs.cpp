// DIMACS max-flow and min-cost-flow files; see network_dimacs.h.
#include "apportion/formats/network_dimacs.h"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <sstream>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"
#include "apportion/model/validation.h"

namespace apportion {

namespace {

struct Written {
  std::ostringstream body;
  int arcs = 0;
};

void write_arcs(const Network& net, bool with_costs, Written& w) {
  auto one = [&](const Arc& a, int from, int to) {
    ++w.arcs;
    w.body << "c arc " << w.arcs << ' ' << a.id << (a.shared_two_way ? " (shared two-way)" : "") << '\n';
    w.body << "a " << from + 1 << ' ' << to + 1 << ' ';
    if (with_costs)
      w.body << "0 " << format_number(a.capacity) << ' ' << format_number(a.cost.value_or(0.0)) << '\n';
    else
      w.body << format_number(a.capacity) << '\n';
  };
  for (const Arc& a : net.arcs) {
    if (!a.enabled) continue;
    one(a, a.from, a.to);
    if (a.shared_two_way) one(a, a.to, a.from);
  }
}

// Whitespace as the C locale's isspace() sees it.
bool is_space(char c) { return c == ' ' || c == '\t' || c == '\n' || c == '\v' || c == '\f' || c == '\r'; }

std::string_view skip_space(std::string_view s) {
  std::size_t b = 0;
  while (b < s.size() && is_space(s[b])) ++b;
  return s.substr(b);
}

// The next whitespace-separated token of `rest`, which moves past it. Lines are split by
// hand rather than by one string stream each: a stream per line made a 10-million-arc file
// slow to open.
std::string_view next_token(std::string_view& rest) {
  rest = skip_space(rest);
  std::size_t e = 0;
  while (e < rest.size() && !is_space(rest[e])) ++e;
  const std::string_view token = rest.substr(0, e);
  rest.remove_prefix(e);
  return token;
}

// A whole token as a decimal integer (an optional sign, then digits).
bool parse_count(std::string_view token, long long& out) {
  const char* first = token.data();
  const char* last = token.data() + token.size();
  if (first != last && *first == '+') ++first;
  const auto [end, ec] = std::from_chars(first, last, out);
  return ec == std::errc() && end == last && first != last;
}

std::string assemble(const Network& net, const char* kind, const std::string& node_lines, const Written& w) {
  std::ostringstream out;
  out << "c " << (net.name.empty() ? "Apportion network" : net.name) << '\n';
  out << "p " << kind << ' ' << net.node_count() << ' ' << w.arcs << '\n';
  for (int v = 0; v < net.node_count(); ++v) out << "c node " << v + 1 << ' ' << net.nodes[v].id << '\n';
  out << node_lines << w.body.str();
  return out.str();
}

}  // namespace

std::string write_dimacs_max(const Network& net, int demand) {
  const Demand& k = net.demands.at(demand);
  std::ostringstream nodes;
  nodes << "n " << k.origin + 1 << " s\n" << "n " << k.destination + 1 << " t\n";
  Written w;
  write_arcs(net, false, w);
  return assemble(net, "max", nodes.str(), w);
}

std::string write_dimacs_min(const Network& net) {
  std::ostringstream nodes;
  for (int v = 0; v < net.node_count(); ++v)
    if (net.nodes[v].supply != 0) nodes << "n " << v + 1 << ' ' << format_number(net.nodes[v].supply) << '\n';
  Written w;
  write_arcs(net, true, w);
  return assemble(net, "min", nodes.str(), w);
}

LoadResult read_dimacs(const std::string& text) {
  LoadResult result;
  Diagnostics& d = result.diagnostics;
  if (text.size() > SizeLimits::kMaxFileBytes) {
    d.error("file", "", "", "larger than the limit of 512 MiB");
    return result;
  }
  Network net;
  std::string kind;
  long long declared_arcs = 0;
  int source = -1, sink = -1;
  std::unordered_map<long long, std::string> arc_ids;
  int lineno = 0;
  auto where = [&lineno] { return std::to_string(lineno); };
  auto node_index = [&](const std::string& tok, const char* field) -> int {
    std::string why;
    auto v = parse_number(tok, &why);
    // Range first: converting a huge double to an integer is undefined behaviour.
    if (!v || *v < 1 || *v > net.node_count() || *v != std::floor(*v)) {
      d.error("line", where(), field, "'" + tok + "' is not a node number between 1 and " +
                                          std::to_string(net.node_count()));
      return -1;
    }
    return static_cast<int>(*v) - 1;
  };
  auto number = [&](const std::string& tok, const char* field) -> double {
    std::string why;
    auto v = parse_number(tok, &why);
    if (!v) d.error("line", where(), field, "'" + tok + "' " + why);
    return v.value_or(0.0);
  };

  for (std::size_t pos = 0; pos < text.size();) {
    std::size_t eol = text.find('\n', pos);
    if (eol == std::string::npos) eol = text.size();
    std::string_view rest(text.data() + pos, eol - pos);
    pos = eol + 1;
    ++lineno;
    const std::string_view tag_view = next_token(rest);
    if (tag_view.empty()) continue;
    const std::string tag(tag_view);
    if (tag == "c") {
      const std::string_view what = next_token(rest);
      long long k = 0;
      if ((what == "node" || what == "arc") && parse_count(next_token(rest), k)) {
        std::string_view id = skip_space(rest);
        if (!id.empty() && id.back() == '\r') id.remove_suffix(1);
        const std::string_view suffix = " (shared two-way)";
        if (id.size() > suffix.size() && id.substr(id.size() - suffix.size()) == suffix)
          id.remove_suffix(suffix.size());
        if (what == "node" && k >= 1 && k <= net.node_count() && !id.empty()) net.nodes[k - 1].id = std::string(id);
        if (what == "arc" && !id.empty()) arc_ids[k] = std::string(id);
      }
      continue;
    }
    if (tag == "p") {
      long long n = 0;
      if (!kind.empty()) {
        d.error("line", where(), "p", "a second problem line");
        break;
      }
      kind = std::string(next_token(rest));
      if (!parse_count(next_token(rest), n) || !parse_count(next_token(rest), declared_arcs) ||
          (kind != "max" && kind != "min")) {
        d.error("line", where(), "p", "expected 'p max N M' or 'p min N M'");
        break;
      }
      if (n < 0 || n > SizeLimits::kMaxNodes || declared_arcs < 0 || declared_arcs > SizeLimits::kMaxArcs) {
        d.error("line", where(), "p", "node or arc count outside the size limits");
        break;
      }
      net.nodes.resize(n);
      for (long long v = 0; v < n; ++v) net.nodes[v].id = std::to_string(v + 1);
      // The declared count is the file's word, not its size: a 20-byte file may declare 10
      // million arcs. Reserve no more than the text can hold (an arc line takes >= 6 bytes).
      net.arcs.reserve(static_cast<std::size_t>(std::min<long long>(declared_arcs, static_cast<long long>(text.size() / 6))));
      continue;
    }
    if (kind.empty()) {
      d.error("line", where(), tag, "comes before the problem line");
      break;
    }
    std::vector<std::string> tok;
    for (std::string_view t = next_token(rest); !t.empty() && tok.size() < 6; t = next_token(rest)) tok.emplace_back(t);
    if (tag == "n") {
      if (tok.size() != 2) {
        d.error("line", where(), "n", "expected 'n ID s|t' or 'n ID SUPPLY'");
        continue;
      }
      int v = node_index(tok[0], "n");
      if (v < 0) continue;
      if (kind == "max") {
        if (tok[1] == "s")
          source = v;
        else if (tok[1] == "t")
          sink = v;
        else
          d.error("line", where(), "n", "a max-flow node line ends in 's' or 't'");
      } else {
        net.nodes[v].supply = number(tok[1], "supply");
      }
    } else if (tag == "a") {
      const std::size_t want = kind == "max" ? 3 : 5;
      if (tok.size() != want) {
        d.error("line", where(), "a", kind == "max" ? "expected 'a U V CAP'" : "expected 'a U V LOW CAP COST'");
        continue;
      }
      if (static_cast<long long>(net.arcs.size()) >= declared_arcs) {
        d.error("line", where(), "a", "more arcs than the problem line declares");
        break;
      }
      Arc a;
      a.from = node_index(tok[0], "from");
      a.to = node_index(tok[1], "to");
      if (kind == "max") {
        a.capacity = number(tok[2], "capacity");
      } else {
        if (number(tok[2], "lower bound") != 0.0)
          d.error("line", where(), "lower bound", "lower bounds other than 0 are not supported");
        a.capacity = number(tok[3], "capacity");
        a.cost = number(tok[4], "cost");
      }
      const long long k = static_cast<long long>(net.arcs.size()) + 1;
      auto it = arc_ids.find(k);
      a.id = it != arc_ids.end() ? it->second : "a" + std::to_string(k);
      if (a.from < 0 || a.to < 0) continue;
      net.arcs.push_back(std::move(a));
    } else {
      d.error("line", where(), tag, "unknown line type '" + tag + "'");
    }
  }
  if (kind.empty() && !d.has_errors()) d.error("file", "", "p", "no problem line ('p max' or 'p min')");
  if (d.has_errors()) return result;
  if (static_cast<long long>(net.arcs.size()) != declared_arcs)
    d.warning("file", "", "p", "the problem line declares " + std::to_string(declared_arcs) + " arcs, the file has " +
                                   std::to_string(net.arcs.size()));
  // Ids written by write_dimacs_* repeat for the two lanes of a shared two-way arc: keep
  // them apart so that the document stays valid. Without "c arc" lines the ids are a1, a2,
  // ... and cannot repeat (a map of a million ids took most of the time to open such a file).
  if (!arc_ids.empty()) {
    std::unordered_map<std::string, int> seen;
    seen.reserve(net.arcs.size());
    for (Arc& a : net.arcs) {
      const int times = seen[a.id]++;
      if (times > 0) a.id.append("~").append(std::to_string(times));
    }
  }
  if (kind == "max") {
    if (source < 0 || sink < 0) {
      d.error("file", "", "n", "a max-flow file needs one 's' and one 't' node line");
      return result;
    }
    Demand k;
    k.id = "d1";
    k.origin = source;
    k.destination = sink;
    net.demands.push_back(k);
  }
  d.append(validate(net));
  if (!d.has_errors()) result.network = std::move(net);
  return result;
}

}  // namespace apportion
