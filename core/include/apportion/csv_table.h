// RFC 4180 comma-separated tables: fields with commas, quotes or line breaks are quoted,
// quotes doubled. The reader accepts CRLF or LF line ends and reports the line of a broken
// quote. Used by the network CSV tables and by result exports.
#pragma once

#include <string>
#include <vector>

namespace apportion {

using CsvRow = std::vector<std::string>;

struct CsvParse {
  std::vector<CsvRow> rows;
  std::string error;  // empty when the text parsed; else what broke, with its line
};

CsvParse parse_csv(const std::string& text);
std::string csv_field(const std::string& value);  // quoted when RFC 4180 needs it
std::string write_csv(const std::vector<CsvRow>& rows);

}  // namespace apportion
