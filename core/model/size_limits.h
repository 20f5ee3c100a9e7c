// Documented size limits of a network document (see core/FORMAT.md). They keep a hostile
// or mistaken file from exhausting memory in a browser tab; past them, a clear error.
#pragma once

#include <cstddef>

namespace apportion {

struct SizeLimits {
#ifdef FUZZING_BUILD_MODE_UNSAFE_FOR_PRODUCTION
  // Fuzz builds only (the macro is libFuzzer's convention; CMake sets it with APPORTION_FUZZ):
  // counts 100 times lower. A 20-byte DIMACS line may declare 2 million nodes, which takes
  // seconds under the sanitizers and explores no code that 20,000 nodes do not; the limit
  // errors themselves stay reachable. The unit tests ([limits]) check the real limits.
  static constexpr int kMaxNodes = 20'000;
  static constexpr int kMaxArcs = 100'000;
  static constexpr int kMaxDemands = 1'000;
#else
  static constexpr int kMaxNodes = 2'000'000;
  static constexpr int kMaxArcs = 10'000'000;
  static constexpr int kMaxDemands = 100'000;
#endif
  static constexpr std::size_t kMaxStringLength = 1024;             // ids, labels, units
  static constexpr std::size_t kMaxFileBytes = 512u * 1024u * 1024u;  // any one input file
  static constexpr double kMaxMagnitude = 1e15;  // capacities, costs, amounts, supplies
};

}  // namespace apportion
