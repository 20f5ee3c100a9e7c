// Fairness certificate: for any allocation of shares, per-demand bounds L_k <= f*_k <= U_k
// on the exact weighted max-min fair share f*_k, each proved by an LP witness or an LP dual
// and recomputed here from first principles, so that "how far can this share be from the
// fair one" has an answer that does not rest on the engine that produced the shares.
//
// Model: P is the set of share vectors routable within the capacities (splittable, over the
// same paths the engine may use: hop limit, k shortest paths) with 0 <= f_k <= a_k; f* is the
// weighted max-min fair point of P (multiflow.h). Two facts give the bounds.
//   Lower (a witness): if some f in P gives every demand j that is not yet known to be at or
//     above level tau (L_j < w_j tau) at least min(w_j tau, U_j), then f*_k >= min(w_k tau, U_k)
//     for every k. Otherwise some k has f*_k below it; moving f* a little towards f raises k
//     and lowers only demands whose normalised share is above tau > f*_k / w_k, which
//     contradicts max-min fairness (the characterisation of D. Bertsekas, R. Gallager, "Data
//     Networks", 2nd ed., 1992, section 6.5.2: a fair point admits no raise of a demand
//     paid for only by demands with a larger normalised share).
//   Upper (a dual): for arc lengths y >= 0 and d_k(y) the shortest allowed path of k under
//     them, every f in P has sum_k f_k d_k(y) <= sum_e c_e y_e (each unit of flow of k uses
//     a path at least d_k long; weak LP duality of the path formulation, R. Ahuja,
//     T. Magnanti, J. Orlin, "Network Flows", 1993, ch. 17). With f* >= L elsewhere:
//       f*_k <= L_k + G / d_k(y),   G = sum_e c_e y_e - sum_j L_j d_j(y),   for d_k(y) > 0.
// Method: the allocation's own levels guide the LPs. Its demands below their amounts are
// grouped by normalised share into levels tau_1 < tau_2 < ...; for each, in order:
//   (a) lower bounds from a witness at the level. When the allocation comes with its routing
//       (a solved result), it is its own witness: every demand of the level and above has at
//       least w_k tau, and every demand below has its share, which is its upper bound once
//       the levels below are proven (to the tolerance below). Otherwise, or when it misses
//       by more than that, a witness LP gives every demand whose upper bound lies below tau
//       its upper bound and raises the rest to the highest common level theta they can
//       reach; its capacity duals are one y;
//   (b) upper bounds for the level's demands not yet bounded tightly: the duals of an LP that
//       maximises their sum with every demand at or above its lower bound.
// A last witness covers the demands at their amounts above the top level. For an exact
// allocation every bound closes to the LP tolerances, in one LP per level when the routing
// is given; for an approximate one the bounds say how far each share can be from the fair
// one.
// The LPs are the engine's path master (path_master.h); what they prove is recomputed here:
// the witness's shares and loads from its path flows, and every upper bound from y by
// shortest paths (path_pricing.h), so an LP answer that is wrong makes the bounds looser or
// the certificate fail, never wrong beyond the stated tolerance. The witness's first step
// minimises the largest shortfall per unit of weight rather than the sum, so that the little
// the upper bounds together ask beyond the capacities is shared out.
// Tolerance: the LPs run in a unit where the largest share is in [1, 2), with a feasibility
// tolerance of 1e-9. A witness meets its targets and the capacities to about that (measured:
// 1e-10 to 2e-9 relative); what it misses by is reported as `witness_tolerance`, and the
// bounds hold to it. A witness that misses by more than 1e-6 proves nothing and is not used
// (the bounds above it stay looser). Upper bounds carry a margin for the rounding of their
// sums, and ignore prices below 1e-9 of the largest (rounding noise of a zero, which would
// give tiny distances d_k and magnify every error in G by 1 / d_k).
#pragma once

#include <functional>
#include <string>
#include <vector>

#include "apportion/model/network.h"
#include "apportion/model/status.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

// Bounds for `shares` (one per demand of `net`, in its unit) as a weighted max-min fair
// allocation on `net` with `routing`. The shares need not be feasible or fair; the bounds hold
// for the exact fair shares either way, and `error` measures how far these shares can be
// from them. kBadInput when the sizes disagree or the network has no demands;
// kNumericalDifficulty when an LP fails (the bounds found so far are kept, and still hold).
// `on_progress`, when given, hears after every level: stage "proving fairness", the level as
// the round, the demands whose interval has closed (to 1e-9) as settled, and the LPs so far.
FairnessCertificate certify_max_min(const Network& net, const std::vector<double>& shares,
                                    const RoutingOptions& routing = {},
                                    const std::function<void(const SolveProgress&)>& on_progress = {});
// The same for a solved result, whose paths start the certificate's LPs (faster; the bounds
// are the same kind of proof, on the result's shares).
FairnessCertificate certify_max_min(const Network& net, const MultiflowResult& result,
                                    const RoutingOptions& routing = {},
                                    const std::function<void(const SolveProgress&)>& on_progress = {});

}  // namespace apportion
