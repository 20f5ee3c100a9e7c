// Number formatting and strict parsing; see number_text.h.
#include "apportion/model/number_text.h"

#include <cctype>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace apportion {

std::string format_number(double v) {
  char buf[32];
  // The shortest of %.15g .. %.17g that reads back to the same double.
  for (int precision = 15; precision <= 17; ++precision) {
    std::snprintf(buf, sizeof buf, "%.*g", precision, v);
    if (std::strtod(buf, nullptr) == v) break;
  }
  return buf;
}

std::optional<double> parse_number(const std::string& text, std::string* why) {
  auto fail = [why](const char* reason) -> std::optional<double> {
    if (why) *why = reason;
    return std::nullopt;
  };
  std::size_t b = text.find_first_not_of(" \t");
  std::size_t e = text.find_last_not_of(" \t");
  if (b == std::string::npos) return fail("is empty");
  const std::string t = text.substr(b, e - b + 1);
  for (char c : t)
    if (!(std::isdigit(static_cast<unsigned char>(c)) || c == '.' || c == '-' || c == '+' || c == 'e' || c == 'E'))
      return fail("is not a number (NaN and infinities are refused)");
  errno = 0;
  char* end = nullptr;
  const double v = std::strtod(t.c_str(), &end);
  if (end != t.c_str() + t.size()) return fail("is not a number");
  if (errno == ERANGE && !std::isfinite(v)) return fail("overflows a double");
  if (!std::isfinite(v)) return fail("is not finite");
  return v;
}

}  // namespace apportion
