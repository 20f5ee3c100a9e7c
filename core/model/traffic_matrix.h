// Traffic matrices: demands for many origin-destination pairs at once.
//
// Model. The pairs are every ordered (i, j), i != j, with i among the chosen origins and j
// among the chosen destinations (all nodes when none are chosen). Amounts:
//   - gravity: a_ij = total * m_i m_j / sum over the pairs of m_p m_q, node masses m given
//     or drawn uniformly from [1, 10] with a seed (the gravity model of traffic matrices:
//     Y. Zhang, M. Roughan, N. Duffield, A. Greenberg, ACM SIGMETRICS 2003; M. Roughan, ACM
//     SIGCOMM CCR 35(5), 2005 -- from memory; the mass range is common practice, no source);
//   - uniform: every pair asks the same amount;
//   - max: every pair asks "as much as possible" (no amount).
// Each demand has the given weight. The new demands are added after the existing ones, or
// replace them, and get ids "<origin id>-<destination id>" (a number appended where taken).
//
// The masses are drawn with the 64-bit Mersenne Twister (fixed by the C++ standard) mapped
// to [1, 10) by its top 53 bits, so a seed gives the same matrix natively and in WebAssembly.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <unordered_map>
#include <unordered_set>
#include <vector>

#include "apportion/model/diagnostics.h"
#include "apportion/model/network.h"

namespace apportion {

enum class MatrixAmounts { kGravity, kUniform, kMax };

struct TrafficMatrixSpec {
  std::vector<int> origins, destinations;  // node indices; empty: every node
  MatrixAmounts amounts = MatrixAmounts::kGravity;
  double total = 0.0;            // gravity: the sum of all amounts
  double uniform_amount = 0.0;   // uniform: each pair's amount
  std::vector<double> masses;    // gravity: one per node (> 0); empty: drawn with `seed`
  std::uint64_t seed = 1;
  double weight = 1.0;
  bool replace = false;          // true: the new demands replace the existing ones
};

struct TrafficMatrixResult {
  bool ok = false;
  int added = 0;
  Diagnostics diagnostics;  // errors name the field of the spec ("origins", "total", ...)
};

// Adds the matrix's demands to `net` (nothing when the spec has errors). Refuses more
// demands in all than the file format allows (size_limits.h).
TrafficMatrixResult add_traffic_matrix(Network& net, const TrafficMatrixSpec& spec);

// One pair's demand for add_pair_demands: amount empty means "as much as possible".
struct PairAmount {
  int origin = -1, destination = -1;
  std::optional<double> amount;
};

// Adds one demand per pair, ids as above, each with `weight`; after the existing demands or
// in their place. The caller has checked the pairs (distinct nodes of `net`) and the limit.
void add_pair_demands(Network& net, const std::vector<PairAmount>& pairs, double weight, bool replace);

// The ids of new demands: "<origin id>-<destination id>", a number appended where taken
// (linear in the count even when many demands share a pair); an id that would pass the
// length limit (size_limits.h) becomes "d<fallback>" instead. Shared by the matrices and the
// demands tables.
class PairIds {
 public:
  explicit PairIds(std::unordered_set<std::string> taken) : taken_(std::move(taken)) {}
  std::string next(const Network& net, int origin, int destination, std::size_t fallback);

 private:
  std::unordered_set<std::string> taken_;
  std::unordered_map<std::string, int> next_suffix_;
};

// The masses a seed draws, one per node (exposed for tests and the app's preview).
std::vector<double> seeded_masses(int nodes, std::uint64_t seed);

}  // namespace apportion
