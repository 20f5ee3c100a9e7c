// The restricted master LP of the max-min rounds with the demands aggregated by origin, kept
// across the rounds so that each round goes on from the last basis.
//
// Model. The level t rises in rounds; round r adds an increment d_r >= 0 to it. A group is
// a set of demands of one origin that were open together over a run of rounds; it asks
// w_k (sum of the increments of its rounds) for each of its demands k, one fixed weight
// vector (w_k) scaled by one number. Each origin has one open group (its open demands; it
// takes the increment of the current round) and closed groups (one per round in which some
// of its demands froze: the open group then closes, with its increments fixed, and a new
// one holds the demands still open). A demand's share is what its groups ask in all:
// w_k t when it froze at level t. A column routes one group's vector whole, one path per
// destination (a routing); any splittable routing of a fixed vector is a convex combination
// of such routings (a single-origin flow with fixed sink amounts decomposes into paths: flow
// decomposition, R. K. Ahuja, T. L. Magnanti, J. B. Orlin, "Network Flows", 1993, section
// 3.5 -- from memory), so the LP reaches every level the per-demand path LP reaches.
//
//   columns  d_r in [0, cap - t_(r-1)]  the increment of round r (cost -1 in its round, then
//                                        fixed at its value with cost 0)
//            z_c >= 0                   routing c of group g: sends w_k z_c to each k in g
//   rows     capacity(e):  sum_c z_c * (what c sends over arc e)            <= u(e)
//            group(g):     sum of g's routings - sum of the increments of g's rounds = 0
//
// Nothing already in the LP changes when demands freeze -- the round's increment is fixed
// by its bounds, the closed group keeps its row and its routings, a new row and a new
// increment column are added -- so the basis stays valid and the primal simplex goes on
// from it. Rows: one per arc and one per group; groups = origins + the (origin, round)
// pairs in which some demand froze.
// Pricing: with arc lengths pi(e) = -dual(capacity(e)) >= 0, a routing of group g prices in
// when sum_(k in g) w_k dist_pi(o, d_k) < dual(group(g)); one shortest-path search per
// origin serves all its groups.
// Duals per demand: y_k = dist_pi(o_k, d_k). For the open demands these are optimal duals
// of the level rows of the per-demand LP of the round (sum over the open demands of w_k y_k
// is the dual of the increment's column, 1), so a positive distance proves that a demand
// cannot rise above w_k t in any optimum, as in fair_multiflow.h step 2.
// Numerics: HiGHS's scaling stays on (off, the rounds took 2-3x the iterations); a round's
// increment below 1e-9 of the level is taken as 0 (fix_increment).
// Used from FairOptions::origin_rounds_from demands on (off by default); measured in the
// README against the per-demand rounds: 2-4x faster on GtsCe, Deltacom and UsCarrier at
// 2,000-10,000 demands, slower below 1,000 and where many tiers each cost a round (Geant2012,
// Uninett2010 with their link speeds), and no help at all pairs. Settling a run of amount
// levels in one solve was tried (fewer LPs, no faster; README).
#pragma once

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

  // Starts a round: raises the level t of the open demands as far as it goes, up to `cap`,
  // by column generation; t is read with level().
  LpStatus raise(double cap);
  double level() const { return level_; }
  // After raise(): per open demand, its distance under the final arc prices (its dual), and
  // per arc its price (0 for an unusable arc).
  double demand_dual(int k) const { return dual_[k]; }
  double arc_price(int arc) const { return price_[arc]; }

  // Freezes `demands` at the level of the last raise(): their shares are w_k t.
  void freeze(const std::vector<int>& demands);

  // With every demand frozen: the routing of least total route length (route tidying).
  LpStatus tidy();

  // The flows of the last solution, per demand and path.
  std::vector<OriginPiece> routing() const;
  const MultiflowStats& stats() const { return stats_; }

 private:
  struct Group {
    int origin = -1;
    std::vector<int> demands;
    int row = -1;
    double start = 0.0;  // the level when it opened
    bool dead = false;   // closed at the level it opened with: it routes nothing
  };
  struct Column {
    int group = -1;
    std::vector<OriginPiece> pieces;  // amount: the demand's weight
    double value = 0.0;
  };
  int add_group(int origin, std::vector<int> demands);
  int add_column(Column c, bool route_costs);
  double column_cost(const Column& c) const;
  void fix_increment();
  void drop_idle_columns();
  LpStatus solve_with_pricing(bool route_costs);
  double path_length(const std::vector<int>& lanes) const;
  static std::string key(const Column& c);

  const FlowGraph& g_;
  std::vector<DemandSpec> demands_;
  std::vector<double> route_length_;
  std::vector<char> usable_;  // before pricer_, which is built from it
  PathPricer pricer_;
  std::vector<char> reachable_, open_;
  std::vector<std::vector<int>> groups_of_origin_;
  std::vector<int> open_group_;  // per origin, -1 when none
  std::vector<Group> groups_;
  std::vector<Column> columns_;
  std::unordered_set<std::string> known_;  // the routings priced in during this solve
  std::vector<int> lp_column_;  // per column: its LP column
  LpSolver lp_;
  std::vector<int> cap_row_;
  int increment_ = -1;          // the LP column of the current round's increment
  bool increment_fixed_ = true;
  double base_ = 0.0, level_ = 0.0;  // the level before this round, and after it
  std::vector<double> dual_, price_;
  MultiflowStats stats_;
};

}  // namespace apportion
