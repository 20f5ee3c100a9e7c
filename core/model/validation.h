// Validation of a network document before any solve.
//
// Errors (the document is not solved): duplicate ids, node references out of range,
// negative, NaN or infinite numbers where finite non-negative ones are required, a demand
// whose origin is its destination, non-positive weights, shared two-way links with a
// negative cost, ids, labels, names and units that are not UTF-8 text, and the size limits
// of size_limits.h.
// Warnings (solved anyway): self-loops, zero-capacity arcs, isolated nodes, and demands
// whose destination cannot be reached from their origin over enabled arcs. Self-loops,
// zero-capacity arcs and isolated nodes are named for the first 100 of each; the rest are
// counted in one line ("and 1999898 more isolated nodes").
#pragma once

#include <string>

#include "apportion/model/diagnostics.h"
#include "apportion/model/network.h"

namespace apportion {

Diagnostics validate(const Network& net);

// True when `text` is well-formed UTF-8 (RFC 3629: no overlong forms, no surrogates).
bool valid_utf8(const std::string& text);

}  // namespace apportion
