// Reads a fair-multiflow result file (core/FORMAT.md, "Fair-multiflow result files") back
// into a MultiflowResult for the network it was solved on: the inverse of multiflow_json.
// Items are matched by id, so the network must be the one the result names. Numbers are
// written with round-trip precision, so reading gives the same doubles.
//
// The browser app uses it to take results from its solver worker; a planner can also
// reopen a result next to its network.
#pragma once

#include <optional>
#include <string>

#include "apportion/model/network.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

// nullopt with `error` set when the text is not a result of this network.
std::optional<MultiflowResult> read_multiflow_json(const Network& net, const std::string& text, std::string& error);

}  // namespace apportion
