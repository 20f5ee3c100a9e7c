// Numbers as text, the same way in every format: shortest round-trip output ("%.17g"
// trimmed), and strict parsing that refuses trailing junk, NaN and infinities by name.
#pragma once

#include <optional>
#include <string>

namespace apportion {

std::string format_number(double v);
// The whole of `text` as a finite number; nullopt otherwise, with `why` set.
std::optional<double> parse_number(const std::string& text, std::string* why = nullptr);

}  // namespace apportion
