// Long tables (40,000 demands): which rows show, in what order. A text filter and a sort by
// one column, recomputed only when the data, the filter or the sort changed -- sorting tens
// of thousands of rows takes milliseconds, too long to repeat every frame -- and drawn with
// ImGui's list clipper, so only the visible rows cost anything.
#pragma once

#include <imgui.h>

#include <algorithm>
#include <cctype>
#include <string>
#include <utility>
#include <vector>

#include "app/app_state.h"
#include "app/appearance.h"

namespace apportion::web {

inline std::string lowered(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

// An arc as the canvas names it: by its ends' shown names, "A \u2192 B" (or "A \u2194 B"
// when both directions share it).
inline std::string arc_name(const Network& net, int e) {
  const Arc& a = net.arcs[e];
  return shown_name(net.nodes[a.from]) + (a.shared_two_way ? " \u2194 " : " \u2192 ") + shown_name(net.nodes[a.to]);
}

// Whether demand k's id, label, origin or destination id contains the lower-case needle.
inline bool demand_matches(const Network& net, int k, const std::string& needle) {
  const Demand& d = net.demands[k];
  for (const std::string* s : {&d.id, &d.label, &net.nodes[d.origin].id, &net.nodes[d.destination].id})
    if (lowered(*s).find(needle) != std::string::npos) return true;
  return false;
}

class RowOrder {
 public:
  // `data`: counters that change with what the rows show. `match(k, needle)`: row k contains the lower-case needle; `less(a, b, column)`: the order
  // of two rows by a column. Ties keep the document's order.
  template <class Match, class Less>
  const std::vector<int>& update(std::pair<long long, long long> data, int count, const TableView& v, Match match,
                                 Less less) {
    if (data == data_ && count == count_ && v.filter == filter_ && v.column == column_ && v.descending == descending_)
      return rows_;
    data_ = data, count_ = count, filter_ = v.filter, column_ = v.column, descending_ = v.descending;
    const std::string needle = lowered(filter_);
    rows_.clear();
    for (int k = 0; k < count; ++k)
      if (needle.empty() || match(k, needle)) rows_.push_back(k);
    if (column_ >= 0)
      std::stable_sort(rows_.begin(), rows_.end(), [&](int a, int b) {
        return descending_ ? less(b, a, column_) : less(a, b, column_);
      });
    return rows_;
  }

 private:
  std::pair<long long, long long> data_{-1, -1};
  int count_ = -1, column_ = -2;
  bool descending_ = false;
  std::string filter_ = "\x01";  // never a typed filter: the first update computes
  std::vector<int> rows_;
};

// A click on a column header (ImGui's sort specs) becomes the view's sort.
inline void take_sort_specs(TableView& v) {
  ImGuiTableSortSpecs* specs = ImGui::TableGetSortSpecs();
  if (!specs || !specs->SpecsDirty) return;
  if (specs->SpecsCount > 0) {
    v.column = specs->Specs[0].ColumnIndex;
    v.descending = specs->Specs[0].SortDirection == ImGuiSortDirection_Descending;
  } else {
    v.column = -1;
  }
  specs->SpecsDirty = false;
}

// The filter box above a table.
inline void filter_box(const char* id, TableView& v, const char* hint) {
  char buf[128];
  std::snprintf(buf, sizeof buf, "%s", v.filter.c_str());
  ImGui::SetNextItemWidth(240 * ui_scale());
  if (ImGui::InputTextWithHint(id, hint, buf, sizeof buf)) v.filter = buf;
}

}  // namespace apportion::web
