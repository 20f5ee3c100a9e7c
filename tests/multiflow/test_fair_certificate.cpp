// The fairness certificate (fair_certificate.h): its bounds must hold for the exact max-min
// fair shares whatever allocation they certify, and close on an exact one. The exact shares
// come from the engine, which the property test in test_fair_multiflow.cpp holds to an
// independent arc-formulation LP; the upper bounds are held to that LP here too.
#include <catch2/catch.hpp>
#include <cmath>
#include <random>

#include "apportion/multiflow/fair_certificate.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "multiflow/arc_formulation.h"

using namespace apportion;
using Catch::Matchers::WithinAbs;

namespace {

Network line_network(int n) {
  // F. Kelly, "Charging and rate control for elastic traffic", European Transactions on
  // Telecommunications 8(1), 1997: n unit links in a row, one route across all of them and
  // one on each link; max-min fairness gives every route 1/2 (closed form, standard).
  Network net;
  for (int v = 0; v <= n; ++v) net.nodes.push_back({"n" + std::to_string(v), "", std::nullopt, std::nullopt, 0});
  for (int i = 0; i < n; ++i) {
    Arc a;
    a.id = "a" + std::to_string(i), a.from = i, a.to = i + 1, a.capacity = 1.0;
    net.arcs.push_back(a);
  }
  auto demand = [&](int o, int d) {
    Demand k;
    k.id = "d" + std::to_string(net.demands.size()), k.origin = o, k.destination = d;
    net.demands.push_back(k);
  };
  demand(0, n);
  for (int i = 0; i < n; ++i) demand(i, i + 1);
  return net;
}

Network random_network(std::mt19937_64& rng, int nodes, int arcs, int demands) {
  auto below = [&](int n) { return static_cast<int>(rng() % static_cast<unsigned>(n)); };
  Network net;
  for (int v = 0; v < nodes; ++v) net.nodes.push_back({"n" + std::to_string(v), "", std::nullopt, std::nullopt, 0});
  for (int a = 0; a < arcs; ++a) {
    Arc arc;
    arc.id = "a" + std::to_string(a);
    arc.from = a < nodes - 1 ? a : below(nodes);
    arc.to = a < nodes - 1 ? a + 1 : below(nodes);
    if (arc.to == arc.from) arc.to = (arc.from + 1) % nodes;
    arc.capacity = 1 + below(10);
    arc.shared_two_way = below(4) == 0;
    net.arcs.push_back(arc);
  }
  for (int k = 0; k < demands; ++k) {
    Demand d;
    d.id = "d" + std::to_string(k);
    d.origin = below(nodes);
    d.destination = (d.origin + 1 + below(nodes - 1)) % nodes;
    if (below(3) != 0) d.amount = 0.5 * below(13);
    d.weight = 1 + below(3);
    net.demands.push_back(d);
  }
  return net;
}

std::vector<double> shares_of(const MultiflowResult& r) {
  std::vector<double> s;
  for (const DemandShare& d : r.demands) s.push_back(d.share);
  return s;
}

}  // namespace

TEST_CASE("certificate: Kelly's line network, exact and perturbed", "[fair][certificate][reference]") {
  for (int n = 1; n <= 5; ++n) {
    INFO("n = " << n);
    const Network net = line_network(n);
    const int K = n + 1;
    // The published shares themselves: every bound closes on 1/2.
    const FairnessCertificate exact = certify_max_min(net, std::vector<double>(K, 0.5));
    REQUIRE(exact.status == SolveStatus::kOptimal);
    for (int k = 0; k < K; ++k) {
      CHECK_THAT(exact.lower[k], WithinAbs(0.5, 1e-9));
      CHECK_THAT(exact.upper[k], WithinAbs(0.5, 1e-9));
    }
    CHECK(exact.max_error < 1e-9);
    // A feasible but unfair allocation: the long route starved, the short ones at 1. The
    // bounds still hold 1/2, and the error says how far each share is from it.
    std::vector<double> unfair(K, 1.0);
    unfair[0] = 0.0;
    const FairnessCertificate c = certify_max_min(net, unfair);
    REQUIRE(c.status == SolveStatus::kOptimal);
    for (int k = 0; k < K; ++k) {
      CHECK(c.lower[k] <= 0.5 + 1e-9);
      CHECK(c.upper[k] >= 0.5 - 1e-9);
      CHECK(c.error[k] >= std::abs(unfair[k] - 0.5) - 1e-9);
    }
    CHECK(c.max_error >= 0.5 - 1e-9);
  }
}

TEST_CASE("certificate: bounds hold the exact shares, and close on them, on random networks",
          "[fair][certificate][property]") {
  std::mt19937_64 rng(5772);
  for (int i = 0; i < 40; ++i) {
    const int nodes = 3 + static_cast<int>(rng() % 6);
    const Network net = random_network(rng, nodes, nodes + 2 + static_cast<int>(rng() % 10), 1 + static_cast<int>(rng() % 12));
    INFO("instance " << i);
    const MultiflowResult r = solve_multiflow(net, FairOptions{});
    REQUIRE(r.status == SolveStatus::kOptimal);
    const std::vector<double> exact = shares_of(r);
    const int K = static_cast<int>(exact.size());
    // The exact allocation: every bound within 1e-6 of its share.
    const FairnessCertificate c = certify_max_min(net, exact);
    REQUIRE(c.status == SolveStatus::kOptimal);
    CHECK(c.max_relative_error <= 1e-6);
    for (int k = 0; k < K; ++k) {
      CHECK(c.lower[k] <= exact[k] + 1e-7);
      CHECK(c.upper[k] >= exact[k] - 1e-7);
      // The upper bound is at least what the independent LP lets the demand reach while every
      // other demand keeps its lower bound (the bound is that LP's dual, recomputed).
      CHECK(test::max_share_arc_formulation(net, k, c.lower) <= c.upper[k] + 1e-7);
    }
    // Started from the result's own paths (the faster way in): the same kind of proof.
    const FairnessCertificate seeded = certify_max_min(net, r);
    REQUIRE(seeded.status == SolveStatus::kOptimal);
    for (int k = 0; k < K; ++k) {
      CHECK(seeded.lower[k] <= exact[k] + 1e-7);
      CHECK(seeded.upper[k] >= exact[k] - 1e-7);
      CHECK(seeded.error[k] <= 1e-6 * std::max(1.0, exact[k]));
    }
    // A perturbed allocation (some shares lowered, some raised): the bounds still hold the
    // exact shares, and each demand's error is at least its distance from its exact share.
    std::vector<double> moved = exact;
    for (double& s : moved) {
      const unsigned roll = static_cast<unsigned>(rng() % 4);
      if (roll == 0) s *= 0.7;
      if (roll == 1) s = s * 1.2 + 0.1;
    }
    const FairnessCertificate m = certify_max_min(net, moved);
    REQUIRE(m.status == SolveStatus::kOptimal);
    for (int k = 0; k < K; ++k) {
      CHECK(m.lower[k] <= exact[k] + 1e-7);
      CHECK(m.upper[k] >= exact[k] - 1e-7);
      CHECK(m.error[k] >= std::abs(moved[k] - exact[k]) - 1e-7);
    }
  }
}

TEST_CASE("certificate: a unit changes nothing but the unit", "[fair][certificate][numerics]") {
  std::mt19937_64 rng(1414);
  for (int i = 0; i < 10; ++i) {
    const Network net = random_network(rng, 6, 14, 8);
    INFO("instance " << i);
    const MultiflowResult r = solve_multiflow(net, FairOptions{});
    REQUIRE(r.status == SolveStatus::kOptimal);
    const FairnessCertificate c = certify_max_min(net, shares_of(r));
    // The same network in a unit 1e9 times smaller (Gbit/s -> bit/s).
    Network bits = net;
    for (Arc& a : bits.arcs) a.capacity *= 1e9;
    for (Demand& d : bits.demands)
      if (d.amount) *d.amount *= 1e9;
    std::vector<double> shares = shares_of(r);
    for (double& s : shares) s *= 1e9;
    const FairnessCertificate b = certify_max_min(bits, shares);
    REQUIRE(c.status == SolveStatus::kOptimal);
    REQUIRE(b.status == SolveStatus::kOptimal);
    CHECK(c.max_relative_error <= 1e-6);
    CHECK(b.max_relative_error <= 1e-6);
    for (std::size_t k = 0; k < shares.size(); ++k) {
      CHECK_THAT(b.lower[k], WithinAbs(1e9 * c.lower[k], 1e-6 * std::max(1.0, b.upper[k])));
      CHECK_THAT(b.upper[k], WithinAbs(1e9 * c.upper[k], 1e-6 * std::max(1.0, b.upper[k])));
    }
  }
}

TEST_CASE("certificate: the paths allowed are part of the question", "[fair][certificate][routing]") {
  // Arcs 0-1, 1-3, 0-2, 2-3 of capacity 1; d0: 0 -> 3, d1: 1 -> 3. Derived by hand: with
  // every path both reach 1 (d0 on 0-2-3, d1 on 1-3), and d0 can grow further only through
  // 1-3, at d1's expense, so (1, 1) is max-min fair.
  Network net;
  for (int v = 0; v < 4; ++v) net.nodes.push_back({"n" + std::to_string(v), "", std::nullopt, std::nullopt, 0});
  auto arc = [&](int u, int v) {
    Arc a;
    a.id = "a" + std::to_string(net.arcs.size()), a.from = u, a.to = v, a.capacity = 1.0;
    net.arcs.push_back(a);
  };
  arc(0, 1), arc(1, 3), arc(0, 2), arc(2, 3);
  Demand d0, d1;
  d0.id = "d0", d0.origin = 0, d0.destination = 3;
  d1.id = "d1", d1.origin = 1, d1.destination = 3;
  net.demands = {d0, d1};
  const FairnessCertificate all = certify_max_min(net, {1.0, 1.0});
  REQUIRE(all.status == SolveStatus::kOptimal);
  CHECK(all.max_error < 1e-9);
  // With a hop limit of 1 d0 has no path at all, and its fair share is 0: the certificate
  // for (1, 1) under that limit must say so.
  RoutingOptions one_hop;
  one_hop.hop_limit = 1;
  const FairnessCertificate limited = certify_max_min(net, {1.0, 1.0}, one_hop);
  REQUIRE(limited.status == SolveStatus::kOptimal);
  CHECK_THAT(limited.upper[0], WithinAbs(0.0, 1e-12));
  CHECK(limited.error[0] >= 1.0 - 1e-9);
  CHECK_THAT(limited.lower[1], WithinAbs(1.0, 1e-9));
}
