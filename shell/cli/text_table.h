// Plain-text tables for the terminal: columns padded to their widest cell, numbers right-
// aligned. Cells are printed as given (control characters replaced by '?').
#pragma once

#include <ostream>
#include <string>
#include <vector>

namespace apportion::cli {

class TextTable {
 public:
  explicit TextTable(std::vector<std::string> header) : rows_{std::move(header)} {}
  void add(std::vector<std::string> row) { rows_.push_back(std::move(row)); }
  void print(std::ostream& out) const;

 private:
  std::vector<std::vector<std::string>> rows_;
};

}  // namespace apportion::cli
