// Why a demand got 0 (zero_share_reason.h): each reason on a network small enough to check by
// hand. A path a -> b -> c of capacity 10 per arc, and c -> a out of service.
#include <catch2/catch.hpp>

#include "apportion/formats/network_json.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/zero_share_reason.h"

using namespace apportion;

namespace {

Network line(const char* demands) {
  const std::string text = std::string(R"({"format":"apportion-network","version":1,"name":"line",
    "nodes":[{"id":"a"},{"id":"b"},{"id":"c"}],
    "arcs":[{"id":"ab","from":"a","to":"b","capacity":10},{"id":"bc","from":"b","to":"c","capacity":10},
            {"id":"ca","from":"c","to":"a","capacity":10,"enabled":false}],
    "demands":)") + demands + "}";
  LoadResult r = read_network_json(text);
  REQUIRE(r.ok());
  return *r.network;
}

MultiflowResult solve(const Network& net, FairObjective o, int hop_limit = 0) {
  FairOptions opt;
  opt.objective = o;
  opt.routing.hop_limit = hop_limit;
  MultiflowResult r = solve_multiflow(net, opt);
  REQUIRE(r.status == SolveStatus::kOptimal);
  return r;
}

}  // namespace

TEST_CASE("zero share reason: max throughput leaves the long demand out", "[reason]") {
  // By hand: a->c uses both arcs; a->b and b->c one each. At most 20 in total, only with
  // a->c at 0 (any unit it takes costs a unit of each of the others).
  const Network net = line(R"([{"id":"long","origin":"a","destination":"c"},
    {"id":"first","origin":"a","destination":"b"},{"id":"second","origin":"b","destination":"c"}])");
  const MultiflowResult r = solve(net, FairObjective::kMaxThroughput);
  CHECK(r.throughput == Approx(20));
  CHECK(r.demands[0].share == Approx(0).margin(1e-9));
  CHECK(zero_share_reason(net, r, 0).find("most flow in total") != std::string::npos);
  CHECK(zero_share_reason(net, r, 1).empty());  // it got 10
}

TEST_CASE("zero share reason: asks 0, no path, as much as possible, lambda 0 (concurrent flow)", "[reason]") {
  // "back" (c -> a, out of service) cannot be served, so the common fraction lambda is 0 and
  // the demand with an amount gets 0 too.
  const Network net = line(R"([{"id":"zero","origin":"a","destination":"b","amount":0},
    {"id":"back","origin":"c","destination":"a","amount":5},
    {"id":"open","origin":"a","destination":"c"},{"id":"fixed","origin":"b","destination":"c","amount":4}])");
  const MultiflowResult r = solve(net, FairObjective::kMaxConcurrent);
  CHECK(zero_share_reason(net, r, 0) == "it asks for 0");
  CHECK(r.demands[1].share == 0);
  CHECK(zero_share_reason(net, r, 1).find("no path with capacity") != std::string::npos);
  CHECK(r.demands[2].share == 0);
  CHECK(zero_share_reason(net, r, 2).find("as much as possible") != std::string::npos);
  CHECK(r.demands[3].share == 0);
  CHECK(zero_share_reason(net, r, 3).find("lambda is 0") != std::string::npos);

  // Without "back": b -> c carries 10, so lambda = 10 / 4 = 2.5 (the rule scales every amount
  // by one factor, above 1 when capacity allows) and "fixed" gets 10, with no reason.
  const Network served = line(R"([{"id":"open","origin":"a","destination":"c"},
    {"id":"fixed","origin":"b","destination":"c","amount":4}])");
  const MultiflowResult s = solve(served, FairObjective::kMaxConcurrent);
  CHECK(s.lambda == Approx(2.5));
  CHECK(s.demands[1].share == Approx(10));
  CHECK(zero_share_reason(served, s, 1).empty());
  CHECK(zero_share_reason(served, s, 0).find("as much as possible") != std::string::npos);
}

TEST_CASE("zero share reason: the hop limit under max-min fairness", "[reason]") {
  const Network net = line(R"([{"id":"long","origin":"a","destination":"c","amount":5},
    {"id":"short","origin":"a","destination":"b","amount":5}])");
  const MultiflowResult r = solve(net, FairObjective::kMaxMinFair, /*hop_limit=*/1);
  CHECK(r.demands[0].share == 0);
  CHECK(zero_share_reason(net, r, 0).find("hop limit") != std::string::npos);
  CHECK(r.demands[1].share == Approx(5));
  CHECK(zero_share_reason(net, r, 1).empty());
}
