// Messages about a document: errors stop a solve, warnings do not. Each names the item
// (kind and id, or its position when it has no usable id) and the field, so that the app
// can select the item and the CLI can print a line a planner can act on.
#pragma once

#include <string>
#include <vector>

namespace apportion {

enum class Severity { kError, kWarning };

struct Diagnostic {
  Severity severity = Severity::kError;
  std::string item_kind;  // "node", "arc", "demand", "file", "line", ...
  std::string item_id;    // id, or "#3" for the fourth item when it has no id
  std::string field;      // "capacity", "from", ... ; empty when it is about the whole item
  std::string message;

  std::string to_string() const;
};

struct Diagnostics {
  std::vector<Diagnostic> items;

  void error(std::string kind, std::string id, std::string field, std::string message);
  void warning(std::string kind, std::string id, std::string field, std::string message);
  bool has_errors() const;
  int error_count() const;
  int warning_count() const;
  void append(const Diagnostics& other);
};

}  // namespace apportion
