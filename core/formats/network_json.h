// The Apportion network file: versioned JSON (RFC 8259), documented in core/FORMAT.md.
// Reading checks structure and types and resolves node ids; it then runs validate(), so a
// LoadResult with a network has no errors (warnings may remain).
#pragma once

#include <string>

#include "apportion/formats/load_result.h"

namespace apportion {

constexpr int kNetworkFormatVersion = 1;

LoadResult read_network_json(const std::string& text);
std::string write_network_json(const Network& net);

}  // namespace apportion
