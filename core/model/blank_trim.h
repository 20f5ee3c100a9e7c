// Cells and names from spreadsheets carry stray blanks around their text (" 7 ", "Berlin\t");
// every table reader trims them the same way: spaces, tabs and a carriage return.
#pragma once

#include <string>

namespace apportion {

inline std::string trimmed(const std::string& s) {
  const auto first = s.find_first_not_of(" \t\r");
  if (first == std::string::npos) return "";
  return s.substr(first, s.find_last_not_of(" \t\r") - first + 1);
}

}  // namespace apportion
