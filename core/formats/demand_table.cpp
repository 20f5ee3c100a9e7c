// Demands tables from CSV files and spreadsheets; see demand_table.h.
#include "apportion/formats/demand_table.h"

#include <algorithm>
#include <cctype>
#include <unordered_set>

#include "apportion/formats/csv_table.h"
#include "apportion/model/blank_trim.h"
#include "apportion/model/node_names.h"
#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"
#include "apportion/model/traffic_matrix.h"
#include "apportion/model/validation.h"

namespace apportion {

namespace {

std::string lowered(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

char delimiter_of(const std::string& text) {
  std::size_t start = text.find_first_not_of("\r\n");
  if (start == std::string::npos) return ',';
  const std::string first = text.substr(start, text.find('\n', start) - start);
  if (first.find('\t') != std::string::npos) return '\t';
  if (first.find(';') != std::string::npos && first.find(',') == std::string::npos) return ';';
  return ',';
}

enum Column { kOrigin, kDestination, kAmount, kWeight, kId, kLabel, kColumns };
const char* const kColumnNames[kColumns] = {"origin", "destination", "amount", "weight", "id", "label"};

int column_of(const std::string& header) {
  const std::string h = lowered(trimmed(header));
  if (h == "origin" || h == "from" || h == "source") return kOrigin;
  if (h == "destination" || h == "to" || h == "target") return kDestination;
  for (int c = kAmount; c < kColumns; ++c)
    if (h == kColumnNames[c]) return c;
  return -1;
}

// Which table column holds each of ours (-1: absent).
std::vector<int> header_columns(const CsvRow& head) {
  std::vector<int> at(kColumns, -1);
  for (std::size_t c = 0; c < head.size(); ++c)
    if (const int k = column_of(head[c]); k >= 0 && at[k] < 0) at[k] = static_cast<int>(c);
  return at;
}

}  // namespace

bool looks_like_demand_table(const std::string& text) {
  const CsvParse csv = parse_csv(text.substr(0, text.find('\n')), delimiter_of(text));
  if (csv.rows.empty()) return false;
  const std::vector<int> at = header_columns(csv.rows[0]);
  return at[kOrigin] >= 0 && at[kDestination] >= 0;
}

DemandTableRead read_demand_table(const Network& net, const std::string& text, bool replace) {
  DemandTableRead out;
  Diagnostics& d = out.diagnostics;
  out.delimiter = delimiter_of(text);
  const CsvParse csv = parse_csv(text, out.delimiter);
  if (!csv.error.empty()) {
    d.error("file", "", "", csv.error);
    return out;
  }
  if (csv.rows.empty()) {
    d.error("file", "", "", "the table is empty");
    return out;
  }
  const CsvRow& head = csv.rows[0];
  const std::vector<int> at = header_columns(head);
  for (std::size_t c = 0; c < head.size(); ++c) {
    const int k = column_of(head[c]);
    const std::string where = "column " + std::to_string(c + 1) + " (" + trimmed(head[c]) + ")";
    if (k >= 0 && at[k] != static_cast<int>(c))
      d.error("row", "1", where, std::string("a second ") + kColumnNames[k] + " column");
    else if (k < 0 && !trimmed(head[c]).empty())
      d.warning("row", "1", where, "not a demands column (origin, destination, amount, weight, id, label); ignored");
  }
  if (at[kOrigin] < 0 || at[kDestination] < 0) {
    d.error("row", "1", "", "the first row must name the columns, with at least origin and destination (also: "
                            "amount, weight, id, label)");
    return out;
  }
  const NodeNames names(net);
  std::unordered_set<std::string> taken;
  if (!replace)
    for (const Demand& k : net.demands) taken.insert(k.id);
  std::unordered_set<std::string> given_ids;  // ids written in the table, checked before generating
  constexpr int kListed = 20;
  int errors = 0;
  auto fail = [&](std::size_t r, int col, const std::string& message) {
    if (++errors > kListed) return;
    const std::string where = "column " + std::to_string(at[col] + 1) + " (" + trimmed(head[at[col]]) + ")";
    d.error("row", std::to_string(r + 1), where, message);
  };
  std::vector<std::size_t> rows_without_id;
  for (std::size_t r = 1; r < csv.rows.size(); ++r) {
    const CsvRow& row = csv.rows[r];
    if (std::all_of(row.begin(), row.end(), [](const std::string& s) { return trimmed(s).empty(); })) continue;
    auto cell = [&](int col) { return at[col] >= 0 && at[col] < static_cast<int>(row.size()) ? trimmed(row[at[col]]) : ""; };
    Demand k;
    bool good = true;
    for (int col : {kOrigin, kDestination}) {
      const std::string name = cell(col);
      const int v = name.empty() ? NodeNames::kNone : names.find(name);
      if (v < 0) {
        fail(r, col, name.empty() ? std::string("no ") + kColumnNames[col] + " given" : NodeNames::why_not(v) + std::string(" ('") + name + "')");
        good = false;
      }
      (col == kOrigin ? k.origin : k.destination) = v;
    }
    if (good && k.origin == k.destination) fail(r, kDestination, "the same node as the origin"), good = false;
    if (const std::string a = cell(kAmount); !a.empty() && lowered(a) != "max") {
      const std::optional<double> v = parse_number(a);
      if (!v || *v < 0 || *v > SizeLimits::kMaxMagnitude)
        fail(r, kAmount, "'" + a + "' is not an amount: a number from 0 to 1e15, or empty or max for as much as possible"), good = false;
      else
        k.amount = *v;
    }
    if (const std::string w = cell(kWeight); !w.empty()) {
      const std::optional<double> v = parse_number(w);
      if (!v || !(*v > 0) || *v > SizeLimits::kMaxMagnitude)
        fail(r, kWeight, "'" + w + "' is not a weight: a number > 0 (default 1)"), good = false;
      else
        k.weight = *v;
    }
    k.id = cell(kId);
    k.label = cell(kLabel);
    if (!valid_utf8(k.id) || !valid_utf8(k.label))  // fuzzing finding: an id "k\xb0"
      fail(r, valid_utf8(k.id) ? kLabel : kId, "is not UTF-8 text (save the file as UTF-8)"), good = false;
    else if (k.id.size() > SizeLimits::kMaxStringLength || k.label.size() > SizeLimits::kMaxStringLength)
      fail(r, k.id.size() > SizeLimits::kMaxStringLength ? kId : kLabel, "longer than " + std::to_string(SizeLimits::kMaxStringLength) + " characters"), good = false;
    else if (!k.id.empty() && taken.count(k.id))
      fail(r, kId, "'" + k.id + "': " + (given_ids.count(k.id) ? "an earlier row has this id" : "the network has a demand with this id")), good = false;
    if (!k.id.empty()) taken.insert(k.id), given_ids.insert(k.id);
    if (!good) continue;
    if (k.id.empty()) rows_without_id.push_back(out.demands.size());
    out.demands.push_back(std::move(k));
  }
  if (errors > kListed) d.error("file", "", "", "and " + std::to_string(errors - kListed) + " more rows with errors");
  const std::size_t kept = replace ? 0 : net.demands.size();
  if (errors == 0 && kept + out.demands.size() > static_cast<std::size_t>(SizeLimits::kMaxDemands))
    d.error("file", "", "", "the table's " + std::to_string(out.demands.size()) + " demands would make more than the limit of " +
                                std::to_string(SizeLimits::kMaxDemands));
  if (errors == 0 && out.demands.empty()) d.error("file", "", "", "the table has no demand rows below its first row");
  // Ids for the rows without one, after every written id is known: a written id is never
  // renamed for a generated one.
  PairIds ids(std::move(taken));
  for (std::size_t i : rows_without_id) {
    Demand& k = out.demands[i];
    k.id = ids.next(net, k.origin, k.destination, i + 1);
  }
  out.generated_ids = static_cast<int>(rows_without_id.size());
  if (!out.ok()) out.demands.clear();
  return out;
}

int add_demand_table(Network& net, DemandTableRead table, bool replace) {
  if (!table.ok()) return 0;
  if (replace) net.demands.clear();
  const int added = static_cast<int>(table.demands.size());
  net.demands.reserve(net.demands.size() + table.demands.size());
  for (Demand& k : table.demands) net.demands.push_back(std::move(k));
  return added;
}

}  // namespace apportion
