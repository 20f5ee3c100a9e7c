// Documented size limits of a network document (see core/FORMAT.md). They keep a hostile
// or mistaken file from exhausting memory in a browser tab; past them, a clear error.
#pragma once

#include <cstddef>

namespace apportion {

struct SizeLimits {
  static constexpr int kMaxNodes = 2'000'000;
  static constexpr int kMaxArcs = 10'000'000;
  static constexpr int kMaxDemands = 100'000;
  static constexpr std::size_t kMaxStringLength = 1024;             // ids, labels, units
  static constexpr std::size_t kMaxFileBytes = 512u * 1024u * 1024u;  // any one input file
  static constexpr double kMaxMagnitude = 1e15;  // capacities, costs, amounts, supplies
};

}  // namespace apportion
