// RFC 4180 comma-separated tables: fields with commas, quotes or line breaks are quoted,
// quotes doubled. The reader accepts CRLF or LF line ends and reports the line of a broken
// quote. Used by the network CSV tables and by result exports.
//
// Spreadsheet formulas: a text field starting with '=', '+', '-', '@', a tab or a carriage
// return would run as a formula when a spreadsheet opens the file (the "CSV injection" of
// the OWASP guidance). Writing prefixes such a field with an apostrophe, which spreadsheets
// show as text; numbers ("-5", "+1e3") are left alone. Reading removes the apostrophe again,
// so Apportion's own tables round-trip exactly.
#pragma once

#include <string>
#include <vector>

namespace apportion {

using CsvRow = std::vector<std::string>;

struct CsvParse {
  std::vector<CsvRow> rows;
  std::string error;  // empty when the text parsed; else what broke, with its line
};

// `delimiter`: ',' by the RFC; a spreadsheet's copied cells arrive with tabs, and some
// locales save with ';'. Quoting works the same with each.
CsvParse parse_csv(const std::string& text, char delimiter = ',');
std::string csv_field(const std::string& value);  // quoted when RFC 4180 needs it
std::string write_csv(const std::vector<CsvRow>& rows);

}  // namespace apportion
