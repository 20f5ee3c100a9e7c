// Unit invariance of the fair-multiflow engine (unit_scale.h): multiplying every capacity and
// amount by 10^k, k from -6 to 12, multiplies the shares, loads and levels by 10^k and
// changes nothing else -- tiers, binding arcs, cuts, lambda, the check. A planner's file in
// bit/s must give the answer of the same file in Gbit/s.
#include <catch2/catch.hpp>
#include <cmath>
#include <fstream>
#include <sstream>
#include <string>

#include "apportion/formats/network_graphml.h"
#include "apportion/formats/network_json.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/multiflow/unit_scale.h"

using namespace apportion;

namespace {

std::string read_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::stringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

Network times(const Network& net, double f) {
  Network n = net;
  for (Arc& a : n.arcs) a.capacity *= f;
  for (Node& v : n.nodes) v.supply *= f;
  for (Demand& d : n.demands)
    if (d.amount) *d.amount *= f;
  return n;
}

// Seeded demands on a topology without traffic: every `step`-th ordered pair, amounts from a
// gravity-like product of node masses (common practice, no source), some "as much as
// possible", some weighted. No std:: distributions, so native and WebAssembly agree.
void add_demands(Network& net, int count, double capacity_scale) {
  unsigned long long state = 0x9e3779b97f4a7c15ULL;
  auto next = [&]() { return state = state * 6364136223846793005ULL + 1442695040888963407ULL, state >> 33; };
  const int n = net.node_count();
  std::vector<double> mass(n);
  for (int v = 0; v < n; ++v) mass[v] = 1.0 + static_cast<double>(next() % 1000) / 111.0;
  for (int k = 0; k < count; ++k) {
    const int o = static_cast<int>(next() % static_cast<unsigned>(n));
    const int d = (o + 1 + static_cast<int>(next() % static_cast<unsigned>(n - 1))) % n;
    Demand dem;
    dem.id = "d" + std::to_string(k);
    dem.origin = o, dem.destination = d;
    const unsigned kind = next() % 5;
    if (kind != 0) dem.amount = capacity_scale * mass[o] * mass[d] / 50.0;
    dem.weight = kind == 4 ? 2.0 : 1.0;
    net.demands.push_back(dem);
  }
}

// The answer for `net` times 10^k against the answer for `net`. Binding arcs are the arcs
// with a positive dual in one optimal dual solution; where the LP is degenerate (many equal
// capacities) several such sets are equally valid, and the internal unit, another power of
// two for each k, may pick another. `unique_duals` asks for the same arcs too.
void require_same_answer_in_other_units(const Network& net, FairObjective objective, int k, bool unique_duals = true) {
  const double f = std::pow(10.0, k);
  FairOptions opt;
  opt.objective = objective;
  const MultiflowResult base = solve_multiflow(net, opt);
  const Network big = times(net, f);
  const MultiflowResult scaled = solve_multiflow(big, opt);
  INFO("objective " << objective_name(objective) << ", times 1e" << k);
  REQUIRE(base.status == SolveStatus::kOptimal);
  REQUIRE(scaled.status == SolveStatus::kOptimal);
  REQUIRE(scaled.check.ok);
  const double smallest = net.positive_capacities().smallest;
  // Each share is judged at its own scale, as the engine does (README, Numerical accuracy).
  auto same = [&](double unscaled, double value) {
    return std::abs(value - f * unscaled) <= 1e-9 * f * std::max(std::abs(unscaled), smallest);
  };
  if (objective == FairObjective::kMaxMinFair) {
    REQUIRE(scaled.tiers.size() == base.tiers.size());
    for (std::size_t t = 0; t < base.tiers.size(); ++t) {
      CHECK(scaled.tiers[t].demands == base.tiers[t].demands);
      if (unique_duals) CHECK(scaled.tiers[t].binding_arcs == base.tiers[t].binding_arcs);
      // Either way the binding arcs are full: a positive dual in the proof of a tier means
      // its demands' shares use the arc's whole capacity (complementary slackness).
      for (int a : scaled.tiers[t].binding_arcs)
        CHECK(scaled.arcs[a].load >= (1 - 1e-9) * big.arcs[a].capacity);
      CHECK(same(base.tiers[t].level, scaled.tiers[t].level));
    }
    for (std::size_t d = 0; d < base.demands.size(); ++d) {
      INFO("demand " << net.demands[d].id);
      CHECK(same(base.demands[d].share, scaled.demands[d].share));
      CHECK(scaled.demands[d].tier == base.demands[d].tier);
      CHECK(scaled.demands[d].limited_by_amount == base.demands[d].limited_by_amount);
      if (unique_duals) {
        CHECK(scaled.demands[d].binding_arcs == base.demands[d].binding_arcs);
        CHECK(scaled.demands[d].binding_arcs_form_cut == base.demands[d].binding_arcs_form_cut);
      }
    }
  } else {
    CHECK(std::abs(scaled.lambda - base.lambda) <= 1e-9 * std::max(1.0, base.lambda));
    CHECK(scaled.all_demands_met == base.all_demands_met);
    CHECK(same(base.throughput, scaled.throughput));
  }
}

}  // namespace

TEST_CASE("unit scaling: the internal unit is a power of two from the span of the capacities", "[fair][units]") {
  Network net;
  net.nodes.resize(2);
  net.nodes[0].id = "a", net.nodes[1].id = "b";
  auto arc = [&](double capacity) {
    Arc a;
    a.id = "x" + std::to_string(net.arcs.size()), a.from = 0, a.to = 1, a.capacity = capacity;
    net.arcs.push_back(a);
  };
  arc(1e10);   // 10 Gbit/s in bit/s
  arc(1.55e8); // 155 Mbit/s
  double s = unit_scale(net);
  CHECK(s == std::ldexp(1.0, 27));  // the smallest into [1, 2): 2^27 = 1.34e8 <= 1.55e8 < 2^28
  CHECK(scaled_network(net, s).arcs[0].capacity * s == 1e10);  // exact: a power of two
  arc(0.001);  // now 13 orders of magnitude: the largest into (2^29, 2^30]
  s = unit_scale(net);
  CHECK(s == std::ldexp(1.0, 4));   // 1e10 / 2^4 = 6.25e8
  for (Arc& a : net.arcs) a.enabled = false;
  CHECK(unit_scale(net) == 1.0);  // nothing in service: no scaling
}

TEST_CASE("unit scaling: the demos give the same answer in every unit from 1e-6 to 1e12", "[fair][units]") {
  const char* demo = GENERATE("harrowmere-fibre", "lowmoor-relief-roads", "pellam-campus-water");
  const LoadResult loaded = read_network_json(read_text(std::string(APPORTION_DEMO_DIR) + "/" + demo + ".json"));
  REQUIRE(loaded.ok());
  INFO(demo);
  for (int k = -6; k <= 12; ++k)
    for (FairObjective o : {FairObjective::kMaxMinFair, FairObjective::kMaxConcurrent, FairObjective::kFeasibility,
                            FairObjective::kMaxThroughput})
      require_same_answer_in_other_units(*loaded.network, o, k);
}

// The real topologies of the Internet Topology Zoo (S. Knight et al., IEEE JSAC 29(9), 2011),
// read from the workplace's shared data folder (never copied into the repository).
TEST_CASE("unit scaling: real backbones give the same answer in every unit", "[fair][units][topology-zoo]") {
  const std::string dir = APPORTION_SHARED_DATA_DIR "/topology-zoo/";
  const char* name = GENERATE("Abilene", "Geant2012", "Uninett2010", "Deltacom", "GtsCe", "UsCarrier");
  const std::string text = read_text(dir + name + ".graphml");
  if (text.empty()) {
    WARN("not run: " << dir << name << ".graphml is missing (the shared data folder is not beside this checkout)");
    return;
  }
  INFO(name);
  GraphmlOptions opt;
  opt.undirected_as_pairs = true;
  // Link speeds where the file has them (bit/s), else 1 Gbit/s; the others 10 per link, so
  // that their LPs are degenerate and only the primal answer is unique (see above).
  const bool speeds = std::string(name) == "Geant2012" || std::string(name) == "Uninett2010";
  if (speeds) opt.capacity_attribute = "LinkSpeedRaw", opt.default_capacity = 1e9;
  else opt.default_capacity = 10;
  LoadResult loaded = read_graphml(text, opt);
  REQUIRE(loaded.ok());
  Network net = *loaded.network;
  add_demands(net, 40, speeds ? 1e8 : 1.0);
  for (int k : {-6, -3, 3, 6, 9, 12}) require_same_answer_in_other_units(net, FairObjective::kMaxMinFair, k, speeds);
  require_same_answer_in_other_units(net, FairObjective::kMaxConcurrent, 9);
}

TEST_CASE("unit scaling: Geant2012 in bit/s gives the shares of Gbit/s times 1e9", "[fair][units][topology-zoo]") {
  // The file's own link speeds (LinkSpeedRaw, 1.55e8 to 1e10 bit/s), 1 Gbit/s where missing.
  const std::string path = APPORTION_SHARED_DATA_DIR "/topology-zoo/Geant2012.graphml";
  const std::string text = read_text(path);
  if (text.empty()) {
    WARN("not run: " << path << " is missing (the shared data folder is not beside this checkout)");
    return;
  }
  GraphmlOptions opt;
  opt.undirected_as_pairs = true;
  opt.capacity_attribute = "LinkSpeedRaw";
  opt.default_capacity = 1e9;
  LoadResult loaded = read_graphml(text, opt);
  REQUIRE(loaded.ok());
  Network bits = *loaded.network;
  add_demands(bits, 100, 1e8);
  const MultiflowResult in_bits = solve_multiflow(bits, FairOptions{});
  const MultiflowResult in_gbits = solve_multiflow(times(bits, 1e-9), FairOptions{});
  REQUIRE(in_bits.status == SolveStatus::kOptimal);
  REQUIRE(in_gbits.status == SolveStatus::kOptimal);
  REQUIRE(in_bits.tiers.size() == in_gbits.tiers.size());
  for (std::size_t d = 0; d < bits.demands.size(); ++d) {
    CHECK(in_bits.demands[d].tier == in_gbits.demands[d].tier);
    CHECK(std::abs(in_bits.demands[d].share - 1e9 * in_gbits.demands[d].share) <=
          1e-9 * std::max(in_bits.demands[d].share, 1.55e8));
  }
}
