// RFC 4180 reading and writing; see csv_table.h.
#include "apportion/formats/csv_table.h"

#include "apportion/model/number_text.h"

namespace apportion {

namespace {
bool formula_start(char c) { return c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r'; }
// Apostrophes, then a formula character: the fields that carry (or need) the text mark.
bool marked_shape(const std::string& s) {
  std::size_t i = 0;
  while (i < s.size() && s[i] == '\'') ++i;
  return i < s.size() && formula_start(s[i]);
}
}  // namespace

CsvParse parse_csv(const std::string& text, char delimiter) {
  CsvParse out;
  CsvRow row;
  std::string field;
  bool quoted = false, field_started = false;
  int line = 1, quote_line = 0;
  auto end_field = [&] {
    if (!field.empty() && field[0] == '\'' && marked_shape(field)) field.erase(0, 1);  // see csv_table.h
    row.push_back(std::move(field));
    field.clear();
    field_started = false;
  };
  auto end_row = [&] {
    end_field();
    if (!(row.size() == 1 && row[0].empty())) out.rows.push_back(std::move(row));  // skip blank lines
    row.clear();
  };
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (quoted) {
      if (c == '"') {
        if (i + 1 < text.size() && text[i + 1] == '"') {
          field += '"';
          ++i;
        } else {
          quoted = false;
        }
      } else {
        if (c == '\n') ++line;
        field += c;
      }
      continue;
    }
    if (c == '"') {
      if (field_started) {
        out.error = "line " + std::to_string(line) + ": a quote inside an unquoted field";
        return out;
      }
      quoted = true;
      field_started = true;
      quote_line = line;
    } else if (c == delimiter) {
      end_field();
    } else if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') {
      // CRLF: the \n ends the row
    } else if (c == '\n') {
      end_row();
      ++line;
    } else {
      field += c;
      field_started = true;
    }
  }
  if (quoted) {
    out.error = "line " + std::to_string(quote_line) + ": a quoted field is not closed";
    return out;
  }
  if (field_started || !row.empty()) end_row();
  return out;
}

std::string csv_field(const std::string& raw) {
  // A text that a spreadsheet would run as a formula gets an apostrophe (csv_table.h); so
  // does a text that already starts with one, so that reading gives it back unchanged.
  const bool mark = marked_shape(raw) && !(raw[0] != '\'' && parse_number(raw));
  const std::string value = mark ? "'" + raw : raw;
  if (value.find_first_of(",\"\r\n") == std::string::npos) return value;
  std::string q = "\"";
  for (char c : value) {
    if (c == '"') q += '"';
    q += c;
  }
  return q + '"';
}

std::string write_csv(const std::vector<CsvRow>& rows) {
  std::string out;
  for (const CsvRow& row : rows) {
    for (std::size_t i = 0; i < row.size(); ++i) {
      if (i) out += ',';
      out += csv_field(row[i]);
    }
    out += "\r\n";
  }
  return out;
}

}  // namespace apportion
