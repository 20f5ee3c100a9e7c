// Terminal tables; see text_table.h.
#include "text_table.h"

#include <algorithm>
#include <cctype>

namespace apportion::cli {

namespace {
bool numeric(const std::string& s) {
  return !s.empty() && std::all_of(s.begin(), s.end(), [](unsigned char c) {
    return std::isdigit(c) || c == '.' || c == '-' || c == '+' || c == 'e' || c == '%';
  });
}
std::string printable(std::string s) {
  for (char& c : s)
    if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f) c = '?';
  return s;
}
}  // namespace

void TextTable::print(std::ostream& out) const {
  std::vector<std::size_t> width;
  for (const auto& row : rows_) {
    if (width.size() < row.size()) width.resize(row.size(), 0);
    for (std::size_t i = 0; i < row.size(); ++i) width[i] = std::max(width[i], row[i].size());
  }
  for (std::size_t r = 0; r < rows_.size(); ++r) {
    const auto& row = rows_[r];
    for (std::size_t i = 0; i < row.size(); ++i) {
      const std::string cell = printable(row[i]);
      const std::size_t pad = width[i] - cell.size();
      if (i) out << "  ";
      if (r > 0 && numeric(cell))
        out << std::string(pad, ' ') << cell;
      else
        out << cell << (i + 1 < row.size() ? std::string(pad, ' ') : "");
    }
    out << '\n';
    if (r == 0) {
      std::size_t total = 0;
      for (std::size_t w : width) total += w + 2;
      out << std::string(total > 2 ? total - 2 : 0, '-') << '\n';
    }
  }
}

}  // namespace apportion::cli
