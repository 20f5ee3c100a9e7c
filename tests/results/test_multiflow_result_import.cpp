// Result files read back: every objective on every demo network gives, after writing and
// reading, the same numbers to the last bit (the writer uses round-trip precision), and
// damaged or foreign files are refused with a message instead of a crash.
#include <catch2/catch.hpp>
#include <fstream>
#include <sstream>

#include "apportion/formats/network_json.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/multiflow_result_export.h"
#include "apportion/results/multiflow_result_import.h"

using namespace apportion;

namespace {

Network demo(const std::string& name) {
  std::ifstream in(std::string(APPORTION_DEMO_DIR) + "/" + name + ".json");
  std::stringstream text;
  text << in.rdbuf();
  LoadResult loaded = read_network_json(text.str());
  REQUIRE(loaded.ok());
  return *loaded.network;
}

}  // namespace

TEST_CASE("results round-trip through their JSON file", "[result-file]") {
  const auto name = GENERATE(as<std::string>{}, "harrowmere-fibre", "lowmoor-relief-roads", "pellam-campus-water");
  const auto objective = GENERATE(FairObjective::kMaxMinFair, FairObjective::kMaxConcurrent, FairObjective::kMaxThroughput,
                                  FairObjective::kTradeoff, FairObjective::kFeasibility);
  const Network net = demo(name);
  FairOptions options;
  options.objective = objective;
  int reports = 0, last_lps = 0;
  options.on_progress = [&](const SolveProgress& p) {
    ++reports;
    CHECK(p.demands == static_cast<int>(net.demands.size()));
    CHECK(p.lp_solves >= last_lps);
    last_lps = p.lp_solves;
  };
  const MultiflowResult r = solve_multiflow(net, options);
  REQUIRE(r.status == SolveStatus::kOptimal);
  // One report per master solve; each of those runs one LP or more (column generation).
  CHECK(reports >= 1);
  CHECK(reports <= r.stats.lp_solves);
  CHECK(last_lps == r.stats.lp_solves);

  std::string error;
  const auto back = read_multiflow_json(net, multiflow_json(net, r), error);
  INFO(name << " " << objective_name(objective) << " " << error);
  REQUIRE(back.has_value());
  CHECK(back->objective == r.objective);
  CHECK(back->throughput == r.throughput);
  CHECK(back->jain_index == r.jain_index);
  CHECK(back->lambda == r.lambda);
  CHECK(back->price_of_fairness == r.price_of_fairness);
  CHECK(back->all_demands_met == r.all_demands_met);
  REQUIRE(back->demands.size() == r.demands.size());
  for (std::size_t k = 0; k < r.demands.size(); ++k) {
    CHECK(back->demands[k].share == r.demands[k].share);
    CHECK(back->demands[k].tier == r.demands[k].tier);
    CHECK(back->demands[k].binding_arcs == r.demands[k].binding_arcs);
    CHECK(back->demands[k].cut_source_side == r.demands[k].cut_source_side);
    REQUIRE(back->demands[k].paths.size() == r.demands[k].paths.size());
    for (std::size_t p = 0; p < r.demands[k].paths.size(); ++p) {
      CHECK(back->demands[k].paths[p].arcs == r.demands[k].paths[p].arcs);
      CHECK(back->demands[k].paths[p].amount == r.demands[k].paths[p].amount);
    }
  }
  REQUIRE(back->arcs.size() == r.arcs.size());
  for (std::size_t a = 0; a < r.arcs.size(); ++a) {
    CHECK(back->arcs[a].load == r.arcs[a].load);
    CHECK(back->arcs[a].shadow_price == r.arcs[a].shadow_price);
    CHECK(back->arcs[a].per_demand == r.arcs[a].per_demand);
  }
  REQUIRE(back->tiers.size() == r.tiers.size());
  for (std::size_t t = 0; t < r.tiers.size(); ++t) {
    CHECK(back->tiers[t].level == r.tiers[t].level);
    CHECK(back->tiers[t].demands == r.tiers[t].demands);
  }
  // The independent checker agrees on what was read.
  CHECK(check_multiflow(net, *back).ok);
}

TEST_CASE("a fairness certificate round-trips through the result file", "[result-file][certificate]") {
  const auto name = GENERATE(as<std::string>{}, "harrowmere-fibre", "lowmoor-relief-roads", "pellam-campus-water");
  const Network net = demo(name);
  FairOptions options;
  options.certify = true;
  const MultiflowResult r = solve_multiflow(net, options);
  REQUIRE(r.status == SolveStatus::kOptimal);
  REQUIRE(r.fairness.status == SolveStatus::kOptimal);
  std::string error;
  const auto back = read_multiflow_json(net, multiflow_json(net, r), error);
  INFO(name << " " << error);
  REQUIRE(back.has_value());
  const FairnessCertificate& a = r.fairness;
  const FairnessCertificate& b = back->fairness;
  CHECK(b.status == a.status);
  CHECK(b.max_error == a.max_error);
  CHECK(b.max_relative_error == a.max_relative_error);
  CHECK(b.witness_tolerance == a.witness_tolerance);
  CHECK(b.worst_demand == a.worst_demand);
  CHECK(b.levels == a.levels);
  CHECK(b.stats.lp_solves == a.stats.lp_solves);
  CHECK(b.lower == a.lower);
  CHECK(b.upper == a.upper);
  CHECK(b.error == a.error);
  // Without the option there is no certificate, in the result or its file.
  const MultiflowResult plain = solve_multiflow(net, FairOptions{});
  CHECK(plain.fairness.status == SolveStatus::kNotSolved);
  const auto plain_back = read_multiflow_json(net, multiflow_json(net, plain), error);
  REQUIRE(plain_back.has_value());
  CHECK(plain_back->fairness.status == SolveStatus::kNotSolved);
}

TEST_CASE("max-min progress counts the settled demands", "[result-file]") {
  const Network net = demo("harrowmere-fibre");
  FairOptions options;
  int last_settled = 0;
  bool monotone = true;
  options.on_progress = [&](const SolveProgress& p) {
    if (std::string(p.stage) != "max-min fair") return;
    monotone = monotone && p.demands_settled >= last_settled;
    last_settled = p.demands_settled;
  };
  const MultiflowResult r = solve_multiflow(net, options);
  REQUIRE(r.status == SolveStatus::kOptimal);
  CHECK(monotone);
  // The last max-min report comes after the last LP of the last round, before its demands freeze.
  REQUIRE_FALSE(r.tiers.empty());
  CHECK(last_settled + static_cast<int>(r.tiers.back().demands.size()) == static_cast<int>(net.demands.size()));
}

TEST_CASE("damaged or foreign result files are refused by name", "[result-file]") {
  const Network net = demo("harrowmere-fibre");
  const MultiflowResult r = solve_multiflow(net, FairOptions{});
  REQUIRE(r.status == SolveStatus::kOptimal);
  const std::string good = multiflow_json(net, r);
  std::string error;
  CHECK_FALSE(read_multiflow_json(net, good.substr(0, good.size() / 2), error));
  CHECK(error.find("not a JSON object") != std::string::npos);
  for (const char* bad : {"[]", "{\"format\": 5}", "{\"format\": \"apportion-result\", \"problem\": \"fair-multiflow\"}",
                          "{\"format\": \"apportion-result\", \"problem\": \"fair-multiflow\", \"objective\": \"max-min-fair\", "
                          "\"status\": \"optimal\", \"totals\": 7, \"demands\": [1, 2]}"}) {
    error.clear();
    CHECK_FALSE(read_multiflow_json(net, bad, error));
    CHECK_FALSE(error.empty());
  }
  // A result of another network: ids do not match.
  const Network other = demo("lowmoor-relief-roads");
  error.clear();
  CHECK_FALSE(read_multiflow_json(other, good, error));
  CHECK_FALSE(error.empty());
  // A quote written over every 97th character: each damaged file is refused with a message or read.
  for (std::size_t cut = 0; cut < good.size(); cut += 97) {
    std::string damaged = good;
    damaged[cut] = '"';
    error.clear();
    const bool read = read_multiflow_json(net, damaged, error).has_value();
    CHECK((read || !error.empty()));
  }
}
