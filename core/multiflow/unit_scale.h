// Unit scaling of the fair-multiflow engine: the same network in bit/s or in Gbit/s gives the
// same answer in its own unit.
//
// The LP solver's tolerances are absolute (HiGHS: 1e-7 primal and dual feasibility), so an
// LP whose capacities are 1e10 (bit/s) is judged 1e17 times more finely, relative to its
// data, than the same LP in Gbit/s, and fails where the Gbit/s one solves. The engine
// therefore solves in an internal unit: every capacity and amount divided by a power of two
// s, chosen from the ratios of the data alone, so that the answer does not depend on the
// unit. The smallest positive capacity goes into [1, 2), well above the tolerances, unless
// the largest would then pass 2^30 (about 1e9, the largest value the engine's numerical
// stress suite solves reliably); then the largest goes into [2^29, 2^30), and the smallest
// is as far below 1 as the span demands. Dividing by a power of two is exact in binary
// floating point, so the scaled network holds the same mantissas, and scaling back is exact.
//
// What carries the unit, and is scaled back (multiplied by s): shares, path amounts, arc
// loads, tier levels, throughputs, shortfall, cut capacity and demand. Dual lengths of the
// feasibility certificate are per unit of flow (divided by s). Ratios (utilisation,
// lambda, Jain's index, price of fairness) and duals of objectives measured in flow per
// unit of capacity (shadow prices) carry none.
// Reference: scaling to make an LP's tolerances meaningful is common practice in LP
// solvers (e.g. HiGHS scales rows and columns by powers of two for the same reason); the
// choice of a single factor for the whole network is Apportion's.
#pragma once

#include "apportion/model/network.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

// The power of two s described above, from the positive capacities of the arcs in
// service; 1 when there is none.
constexpr int kLargestExponent = 30;
double unit_scale(const Network& net);

// The network with every capacity, finite demand amount and node supply divided by s.
Network scaled_network(const Network& net, double s);

// A result solved on scaled_network(net, s), in the units of net.
void unscale_result(MultiflowResult& r, double s);

}  // namespace apportion
