// The restricted master LP of the max-min rounds with the demands aggregated by origin.
//
// In a round every open demand k of origin o asks for w_k t, and every frozen one for its
// fixed share s_k: two fixed vectors per origin, (w_k) scaled by t and (s_k). A column routes
// one of them whole, one path per destination (a routing of the origin's demands); any
// splittable routing of a fixed vector is a convex combination of such routings, so the
// aggregated LP reaches every level the per-demand path LP reaches (a single-origin flow
// with fixed sink amounts decomposes into routings along trees: R. K. Ahuja, T. L. Magnanti,
// J. B. Orlin, "Network Flows", 1993, section 11.11 on tree solutions -- from memory).
//
// Model (minimisation, as LpSolver states it):
//   columns  t in [0, cap]   the level of the open demands (cost -1; 0 when tidying)
//            z_c >= 0        column c of origin o: an open routing (sends w_k z_c to each
//                            open destination) or a frozen one (sends s_k z_c)
//   rows     capacity(e):    sum_c z_c * (what c sends over arc e)        <= u(e)
//            open(o):        sum of the open routings of o  -  t           = 0
//            frozen(o):      sum of the frozen routings of o               = 1
// So an LP has one row per arc and two per origin, however many demands there are: at all
// pairs of a 149-node backbone, 684 rows where the per-demand LP has 44,490.
// Pricing: with arc lengths pi(e) = -dual(capacity(e)) >= 0, an open routing of o prices in
// when sum_k w_k dist_pi(o, d_k) < dual(open(o)), a frozen one when sum_k s_k dist_pi(o, d_k)
// < dual(frozen(o)); one shortest-path search per origin finds the best of both.
// Duals per demand: y_k = dist_pi(o_k, d_k) for an open demand is an optimal dual of its
// level row in the per-demand LP (sum_k w_k y_k = dual of t's column), so a positive
// distance proves that the demand cannot rise above w_k t in any optimum, as in
// fair_multiflow.h step 2.
// Freezing demands changes the vectors: the routings of the origins concerned are rebuilt
// from the last solution (the frozen routing from the flows the solution sends to the
// frozen destinations, the open ones without them), which keeps it feasible, and the LP is
// built anew with the columns in use.
// State (experimental, FairOptions::by_origin): the LPs are small, but each round starts
// from a slack basis, and the frozen routings carry the earlier solutions' tolerance-level
// excess (allowed up to 1e-7 of a capacity in build_lp). Measured on GtsCe (README): faster
// than the per-demand rounds at 5,000-10,000 demands in some versions, slower or falling back
// in others. Next: keep the basis across rounds (one frozen row per origin and round, so
// that no column changes), and repair frozen routings exactly instead of allowing excess.
#pragma once

#include <memory>
#include <string>
#include <unordered_set>
#include <vector>

#include "apportion/flow/flow_graph.h"
#include "apportion/multiflow/lp_solver.h"
#include "apportion/multiflow/multiflow.h"
#include "apportion/multiflow/path_master.h"
#include "apportion/multiflow/path_pricing.h"

namespace apportion {

// What one demand sends along one path, per unit of the column (or in all, in routing()).
struct OriginPiece {
  int demand = -1;
  std::vector<int> lanes;  // into OriginMaster::lanes()
  double amount = 0.0;
};

class OriginMaster {
 public:
  OriginMaster(const FlowGraph& g, const std::vector<DemandSpec>& demands, const RoutingOptions& routing,
               const std::vector<double>& route_length);

  bool reachable(int k) const { return reachable_[k]; }
  bool open(int k) const { return open_[k]; }
  const std::vector<Lane>& lanes() const { return pricer_.lanes(); }

  // Maximises t <= cap over the open demands by column generation; t is read with level().
  LpStatus raise(double cap);
  double level() const { return level_; }
  // After raise(): per open demand, its distance under the final arc prices (its dual), and
  // per arc its price (0 for an unusable arc).
  double demand_dual(int k) const { return dual_[k]; }
  double arc_price(int arc) const { return price_[arc]; }

  // Freezes `demands` at `shares` (taken from the last solution, which must route them so)
  // and rebuilds the routings of their origins.
  void freeze(const std::vector<int>& demands, const std::vector<double>& shares);

  // With every demand frozen: the routing of least total route length (route tidying).
  LpStatus tidy();

  // The flows of the last solution, per demand and path.
  std::vector<OriginPiece> routing() const;
  const MultiflowStats& stats() const { return stats_; }

 private:
  struct Column {
    int origin = -1;
    bool open = true;
    std::vector<OriginPiece> pieces;
    double value = 0.0;
  };
  void build_lp(bool route_costs);
  int add_column(Column c, bool route_costs);
  double column_cost(const Column& c) const;
  LpStatus solve_with_pricing(bool route_costs);
  double path_length(const std::vector<int>& lanes) const;
  static std::string key(const Column& c);

  const FlowGraph& g_;
  std::vector<DemandSpec> demands_;
  std::vector<double> route_length_;
  PathPricer pricer_;
  std::vector<char> usable_, reachable_, open_;
  std::vector<double> share_;  // frozen demands
  std::vector<std::vector<int>> by_origin_;
  std::vector<Column> columns_;
  std::unordered_set<std::string> known_;  // the routings priced in during this solve
  std::vector<int> lp_column_;  // per column: its LP column, -1 when not in the LP
  std::unique_ptr<LpSolver> lp_;
  std::vector<int> cap_row_, open_row_, frozen_row_;
  int level_col_ = -1;
  double cap_ = LpSolver::kInf, level_ = 0.0;
  std::vector<double> dual_, price_;
  MultiflowStats stats_;
};

}  // namespace apportion
