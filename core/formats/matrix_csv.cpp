// Traffic matrices as CSV; see matrix_csv.h.
#include "apportion/formats/matrix_csv.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <unordered_map>

#include "apportion/formats/csv_table.h"
#include "apportion/model/blank_trim.h"
#include "apportion/model/node_names.h"
#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"

namespace apportion {

MatrixCsvRead read_matrix_csv(const Network& net, const std::string& text) {
  MatrixCsvRead out;
  Diagnostics& d = out.diagnostics;
  const CsvParse csv = parse_csv(text);
  if (!csv.error.empty()) {
    d.error("file", "", "", csv.error);
    return out;
  }
  if (csv.rows.size() < 2 || csv.rows[0].size() < 2) {
    d.error("file", "", "", "a matrix needs a first row of destinations and at least one row per origin");
    return out;
  }
  const NodeNames names(net);
  auto line = [](std::size_t r) { return std::to_string(r + 1); };
  auto column = [](std::size_t c, const std::string& name) {
    return "column " + std::to_string(c + 1) + " (" + name + ")";
  };
  // Names that match no node are listed up to a point (a matrix of another network would
  // name every row and column), then counted.
  constexpr int kListed = 20;
  int unmatched = 0;
  auto node_of = [&](const std::string& raw, std::size_t r, std::size_t c, const char* role) {
    const std::string name = trimmed(raw);
    const int v = names.find(name);
    if (v < 0 && ++unmatched <= kListed)
      d.error("line", line(r), column(c, name),
              std::string(NodeNames::why_not(v)) + " (" + role + ")");
    return v;
  };
  const CsvRow& head = csv.rows[0];
  std::vector<int> dest(head.size(), -1);
  for (std::size_t c = 1; c < head.size(); ++c) {
    if (trimmed(head[c]).empty()) continue;  // a trailing empty column of a spreadsheet
    dest[c] = node_of(head[c], 0, c, "destination");
  }
  long long zeros = 0;
  std::map<std::pair<int, int>, std::size_t> seen;  // pair -> line that gave it
  for (std::size_t r = 1; r < csv.rows.size(); ++r) {
    const CsvRow& row = csv.rows[r];
    if (std::all_of(row.begin(), row.end(), [](const std::string& s) { return trimmed(s).empty(); })) continue;
    const int origin = node_of(row[0], r, 0, "origin");
    if (row.size() > head.size())
      d.error("line", line(r), "", "has " + std::to_string(row.size()) + " cells, the first row " +
                                       std::to_string(head.size()));
    for (std::size_t c = 1; c < row.size() && c < head.size(); ++c) {
      const std::string cell = trimmed(row[c]);
      if (cell.empty()) continue;
      const std::string where = column(c, trimmed(head[c]));
      std::optional<double> amount;
      if (cell != "max") {
        std::string why;
        amount = parse_number(cell, &why);
        if (!amount) {
          d.error("line", line(r), where, "'" + cell + "' is not a number or \"max\" (" + why + ")");
          continue;
        }
        if (*amount < 0 || *amount > SizeLimits::kMaxMagnitude) {
          d.error("line", line(r), where, "an amount must be >= 0 and at most 1e15");
          continue;
        }
      }
      if (trimmed(head[c]).empty()) {
        d.error("line", line(r), where, "a value under a column with no destination");
        continue;
      }
      if (origin < 0 || dest[c] < 0) continue;
      if (amount && *amount == 0) {  // a spreadsheet's "nothing flows": exact zero only
        zeros += origin != dest[c];
        continue;
      }
      if (origin == dest[c]) {
        d.error("line", line(r), where, "origin and destination are the same node");
        continue;
      }
      const auto [it, fresh] = seen.emplace(std::make_pair(origin, dest[c]), r);
      if (!fresh) {
        d.error("line", line(r), where, "this pair was given before, on line " + line(it->second));
        continue;
      }
      out.pairs.push_back({origin, dest[c], amount});
    }
  }
  if (unmatched > kListed)
    d.error("file", "", "", std::to_string(unmatched - kListed) + " more origins and destinations match no node");
  if (out.pairs.size() > static_cast<std::size_t>(SizeLimits::kMaxDemands))
    d.error("file", "", "", std::to_string(out.pairs.size()) + " demands, more than the limit of " +
                                std::to_string(SizeLimits::kMaxDemands));
  if (zeros > 0) d.warning("file", "", "", std::to_string(zeros) + " cells of 0 made no demand");
  if (out.pairs.empty() && !d.has_errors()) d.warning("file", "", "", "the matrix holds no demand");
  if (d.has_errors()) out.pairs.clear();
  return out;
}

MatrixCsvWrite write_matrix_csv(const Network& net) {
  MatrixCsvWrite out;
  const int n = net.node_count();
  // Per pair: the summed amount, or "max" (nullopt), and how many demands gave it.
  std::map<std::pair<int, int>, std::pair<std::optional<double>, int>> cell;
  for (const Demand& k : net.demands) {
    if (k.origin < 0 || k.origin >= n || k.destination < 0 || k.destination >= n) continue;
    auto [it, fresh] = cell.emplace(std::make_pair(k.origin, k.destination), std::make_pair(k.amount, 1));
    if (fresh) continue;
    auto& [amount, count] = it->second;
    amount = amount && k.amount ? std::optional<double>(*amount + *k.amount) : std::nullopt;
    ++count;
  }
  std::vector<CsvRow> rows;
  CsvRow head{"origin \\ destination"};
  for (const Node& v : net.nodes) head.push_back(v.id);
  rows.push_back(head);
  std::vector<std::string> cells(n);
  int summed = 0;
  auto it = cell.begin();
  for (int i = 0; i < n; ++i) {
    CsvRow row{net.nodes[i].id};
    std::fill(cells.begin(), cells.end(), std::string());
    for (; it != cell.end() && it->first.first == i; ++it) {
      const auto& [amount, count] = it->second;
      cells[it->first.second] = amount ? format_number(*amount) : "max";
      summed += count > 1;
    }
    row.insert(row.end(), cells.begin(), cells.end());
    rows.push_back(std::move(row));
  }
  if (summed > 0)
    out.diagnostics.warning("file", "", "", std::to_string(summed) +
                                                " pairs have several demands: their amounts are summed in one cell");
  out.text = write_csv(rows);
  return out;
}

}  // namespace apportion
