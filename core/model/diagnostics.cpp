// Diagnostics: collection and formatting of document messages.
#include "apportion/model/diagnostics.h"

#include <algorithm>

namespace apportion {

std::string Diagnostic::to_string() const {
  std::string s = severity == Severity::kError ? "error: " : "warning: ";
  if (!item_kind.empty()) {
    s += item_kind;
    if (!item_id.empty()) s += " '" + item_id + "'";
    if (!field.empty()) s += ", field '" + field + "'";
    s += ": ";
  }
  return s + message;
}

void Diagnostics::error(std::string kind, std::string id, std::string field, std::string message) {
  items.push_back({Severity::kError, std::move(kind), std::move(id), std::move(field), std::move(message)});
}

void Diagnostics::warning(std::string kind, std::string id, std::string field, std::string message) {
  items.push_back({Severity::kWarning, std::move(kind), std::move(id), std::move(field), std::move(message)});
}

int Diagnostics::error_count() const {
  return static_cast<int>(std::count_if(items.begin(), items.end(),
                                        [](const Diagnostic& d) { return d.severity == Severity::kError; }));
}

int Diagnostics::warning_count() const { return static_cast<int>(items.size()) - error_count(); }

bool Diagnostics::has_errors() const { return error_count() > 0; }

void Diagnostics::append(const Diagnostics& other) {
  items.insert(items.end(), other.items.begin(), other.items.end());
}

}  // namespace apportion
