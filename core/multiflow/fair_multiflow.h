// The fair-multiflow engine: every objective of multiflow.h on the path formulation of
// path_master.h, exactly (to the LP tolerances) and with an independent check.
//
// Weighted max-min fairness is computed by progressive filling with LPs (D. Bertsekas,
// R. Gallager, "Data Networks", 2nd ed., 1992, section 6.5.2, for fixed routes; for routing
// as part of the problem: D. Nace, M. Pioro, IEEE Comm. Surveys & Tutorials 10(4), 2008;
// E. Danna, S. Mandal, A. Singh, IEEE INFOCOM 2012). Each round:
//   1. maximise t subject to f_k >= w_k t for the unfrozen demands, frozen shares fixed,
//      f_k <= a_k, capacities (column generation);
//   2. freeze the demands whose amount caps t (a_k / w_k = t*), and those whose constraint
//      f_k >= w_k t has a positive dual: complementary slackness makes it tight in every
//      optimal solution, so they cannot grow at level t*. "Positive" means above 1e-9 of the
//      duals' own scale (they sum to 1 / mean weight over a bottleneck), well above the
//      rounding noise of a zero dual; a smaller dual proves nothing and goes to step 3;
//   2a. a round that stopped at the smallest amount level of the open demands (t* = a_k / w_k)
//      and froze only demands at their amounts searches for the highest amount level G that
//      every open demand can reach at once, min(w_k G, a_k) for all; no bottleneck lies
//      below G, so every demand whose amount level is below G freezes at its amount, in a
//      tier of its own level, as one round each would have found. Galloping, then bisecting,
//      over the sorted levels takes about 2 log2(n) feasibility LPs (Engine::reaches) for a
//      run of n levels, where one round per level takes n rounds and n sum tests. (Lemma:
//      if every demand can have min(w_k G, a_k) at once, progressive filling meets no
//      bottleneck below G; Bertsekas and Gallager, section 6.5.2.) The search starts from a
//      floor: one LP raises the level with the open demands' amounts lifted, to t_u; that
//      routing, scaled down to the amounts, gives every demand min(w_k t_u, a_k), so every
//      level up to t_u passes untested, and the galloping starts there, near the answer.
//      That LP's capacity prices y bound the search from above too: every routing has
//      sum_k f_k d_k(y) <= sum_e c_e y_e (weak duality, d_k(y) the shortest path under y), so
//      levels G with sum_k min(w_k G, a_k) d_k(y) above the prices' budget fail untested.
//      (Measured on all pairs of GtsCe: galloping from the lowest level spent most of its
//      time in its last, farthest tests; README, Benchmark.)
//   3. settle the rest exactly: with t fixed at t*, maximise the sum of their growths
//      r_k = f_k - w_k t*, each capped at a small amount c_k. Any demand above w_k t* in
//      that optimum can grow: it stays unfrozen. If none is above, none can grow (a
//      solution raising one of them would raise the sum), and all freeze. Repeat with the
//      ones not yet decided. The caps spread the gain: the demands that can each grow
//      alone can all grow together (the average of their solutions is feasible), so with
//      caps small enough one LP finds them all; larger caps only cost another test. One LP
//      decides many demands at once, where the textbook method runs one LP per demand.
// Every LP restarts from the previous basis. A round freezes at least one demand, so there
// are at most K rounds.
// With FairOptions::origin_rounds_from (off by default), the rounds run on the LP aggregated
// by origin instead (origin_master.h): step 1 there, step 2 with the demands' distances
// under the arc prices as duals, no steps 2a and 3 -- a demand with a zero dual stays open,
// and the next round at the same level freezes more. Each round costs one row per origin
// that froze a demand, and goes on from the last basis.
#pragma once

#include "apportion/model/network.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

// Solves `options.objective` on a validated network (see validate()); kBadInput when it has
// no demands or errors. The result carries the independent checker's verdict.
MultiflowResult solve_multiflow(const Network& net, const FairOptions& options);

// The independent checker for a multiflow result: paths are real walks from origin to
// destination, shares equal the flow leaving each origin, per-demand conservation holds at
// every node, and the arcs' total loads respect the capacities.
MultiflowCheck check_multiflow(const Network& net, const MultiflowResult& result);

}  // namespace apportion
