// Generated benchmark instances (invented data): the grid, layered and random families
// commonly used to compare flow codes (cf. the DIMACS challenge generators; the exact
// generators here are Apportion's own). Integer capacities and costs, fixed seeds, and
// the same instance for every solver in a run.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

namespace apportion::bench {

struct Instance {
  std::string family;
  int nodes = 0;
  int source = 0, sink = 0;
  std::vector<int> tail, head;
  std::vector<double> capacity, cost;
  double amount = 0;  // for min-cost flow: what to send from source to sink
};

// Splitmix64: the same numbers natively and in WebAssembly.
class Rng {
 public:
  explicit Rng(std::uint64_t seed) : s_(seed) {}
  std::uint64_t next() {
    std::uint64_t z = (s_ += 0x9e3779b97f4a7c15ULL);
    z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
    z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
    return z ^ (z >> 31);
  }
  int below(int n) { return static_cast<int>(next() % static_cast<std::uint64_t>(n)); }

 private:
  std::uint64_t s_;
};

// `arcs` is the target arc count; families round it to their shape.
Instance make_instance(const std::string& family, int arcs, std::uint64_t seed);

}  // namespace apportion::bench
