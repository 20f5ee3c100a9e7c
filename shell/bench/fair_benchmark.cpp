// apportion-fair-bench: times Apportion's exact weighted max-min fairness on network files,
// natively and in WebAssembly under node (the same core, the same files). Prints one line
// per file:
//   <file> <milliseconds> <lp solves> <simplex iterations> <iterations without hot start>
//   <tiers> <shares...>
// for shell/bench/fair_benchmark.py, and on standard error where the max-min rounds' time
// went (raising the level, the amount search, the saturation tests). Options:
//   --warm-up      one untimed solve first (node compiles WebAssembly in a baseline tier
//                  before its optimising tier; the first run would time the compiler)
//   --cold         also solve with every LP from scratch (else that field is -1)
//   --baseline     time the engine as it was before the scale work, the baseline: the dual
//                  simplex after every round (FairOptions::dual_rounds) and one round per
//                  amount level (FairOptions::amount_search off)
//   --no-amount-search  only the latter
//   --no-amount-floor   the amount search from the lowest amount level, without the LP that
//                  lifts the amounts first (FairOptions::amount_floor off)
//   --no-amount-ceiling  with the floor, test the levels above its prices' bound too
//                  (FairOptions::amount_ceiling off)
//   --no-purge     keep every path priced in (FairOptions::path_pool 0)
//   --pool R       the column pool at R times the rows (FairOptions::path_pool; default 0.5)
//   --by-origin    the max-min rounds on the LP with the demands aggregated by origin at
//                  every size (FairOptions::origin_rounds_from 0)
//   --per-demand   the max-min rounds on the per-demand LP at every size, the method
//                  before (origin_rounds_from kNever)
//   --certify      also certify the result (fair_certificate.h: its routing as the
//                  witness) and report on standard error: milliseconds, LPs, simplex
//                  iterations, levels and the largest error bound relative to the largest
//                  share
//   --certify-shares  the same from the shares alone (LP witnesses)
// usage: apportion-fair-bench [--warm-up] [--cold] [--baseline | --no-amount-search] [--no-amount-floor] [--no-amount-ceiling] [--no-purge | --pool R] [--by-origin | --per-demand] [--certify | --certify-shares] FILE...
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <fstream>
#include <sstream>

#include "apportion/formats/network_json.h"
#include "apportion/multiflow/fair_certificate.h"
#include "apportion/multiflow/fair_multiflow.h"

namespace {

double timed_solve(const apportion::Network& net, const apportion::FairOptions& opt, apportion::MultiflowResult& r) {
  const auto start = std::chrono::steady_clock::now();
  r = apportion::solve_multiflow(net, opt);
  return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
}

}  // namespace

int main(int argc, char** argv) {
  bool warm_up = false, cold = false, dual_rounds = false, amount_search = true, certify = false, shares_only = false;
  bool amount_floor = true, amount_ceiling = true;
  double path_pool = apportion::FairOptions{}.path_pool;
  int origin_rounds_from = apportion::FairOptions{}.origin_rounds_from;
  int first = 1;
  for (; first < argc && std::strncmp(argv[first], "--", 2) == 0; ++first) {
    if (std::strcmp(argv[first], "--warm-up") == 0) warm_up = true;
    else if (std::strcmp(argv[first], "--cold") == 0) cold = true;
    else if (std::strcmp(argv[first], "--baseline") == 0) dual_rounds = true, amount_search = false, path_pool = 0,
                                                                   origin_rounds_from = apportion::FairOptions::kNever;
    else if (std::strcmp(argv[first], "--no-amount-search") == 0) amount_search = false;
    else if (std::strcmp(argv[first], "--no-purge") == 0) path_pool = 0;
    else if (std::strcmp(argv[first], "--pool") == 0 && first + 1 < argc) path_pool = std::atof(argv[++first]);
    else if (std::strcmp(argv[first], "--no-amount-floor") == 0) amount_floor = false;
    else if (std::strcmp(argv[first], "--no-amount-ceiling") == 0) amount_ceiling = false;
    else if (std::strcmp(argv[first], "--by-origin") == 0) origin_rounds_from = 0;
    else if (std::strcmp(argv[first], "--per-demand") == 0) origin_rounds_from = apportion::FairOptions::kNever;
    else if (std::strcmp(argv[first], "--certify") == 0) certify = true;
    else if (std::strcmp(argv[first], "--certify-shares") == 0) certify = shares_only = true;
    else return std::fprintf(stderr, "unknown option %s\n", argv[first]), 2;
  }
  if (first >= argc) {
    std::fprintf(stderr,
                 "usage: apportion-fair-bench [--warm-up] [--cold] [--baseline | --no-amount-search] [--no-amount-floor] [--no-amount-ceiling] [--no-purge | --pool R] [--by-origin | --per-demand] [--certify | --certify-shares] FILE...\n");
    return 2;
  }
  for (int i = first; i < argc; ++i) {
    std::ifstream in(argv[i]);
    std::stringstream ss;
    ss << in.rdbuf();
    apportion::LoadResult loaded = apportion::read_network_json(ss.str());
    if (!loaded.ok()) {
      std::fprintf(stderr, "%s: cannot load\n", argv[i]);
      return 2;
    }
    apportion::FairOptions opt;
    opt.compare_throughput = false;
    opt.dual_rounds = dual_rounds;
    opt.amount_search = amount_search;
    opt.amount_floor = amount_floor;
    opt.amount_ceiling = amount_ceiling;
    opt.path_pool = path_pool;
    opt.origin_rounds_from = origin_rounds_from;
    apportion::MultiflowResult r;
    if (warm_up) timed_solve(*loaded.network, opt, r);
    const double ms = timed_solve(*loaded.network, opt, r);
    if (r.status != apportion::SolveStatus::kOptimal) {
      std::fprintf(stderr, "%s: %s\n", argv[i], r.message.c_str());
      return 1;
    }
    if (r.stats.retries > 0)  // said, so that a time is never taken for the method asked for
      std::fprintf(stderr, "%s: solved again another way (%d time(s)) after numerical trouble\n", argv[i], r.stats.retries);
    long long cold_iterations = -1;
    if (cold) {  // every LP from scratch: what the hot start saves
      apportion::FairOptions o = opt;
      o.hot_start = false;
      apportion::MultiflowResult other;
      timed_solve(*loaded.network, o, other);
      cold_iterations = other.stats.simplex_iterations;
    }
    if (certify) {
      apportion::FairnessCertificate c;
      if (shares_only) {
        std::vector<double> shares;
        for (const auto& d : r.demands) shares.push_back(d.share);
        c = apportion::certify_max_min(*loaded.network, shares, opt.routing);
      } else {
        c = apportion::certify_max_min(*loaded.network, r, opt.routing);
      }
      const double cms = 1000 * c.seconds;
      std::fprintf(stderr, "%s certificate: %s, %.3f ms, %d LPs, %lld iterations, %d levels, witnesses %d used %d refused (tolerance %.2g), largest error %.3g of the largest share\n",
                   argv[i], apportion::status_name(c.status), cms, c.stats.lp_solves, c.stats.simplex_iterations, c.levels,
                   c.witnesses_used, c.witnesses_refused, c.witness_tolerance, c.max_relative_error);
    }
    std::fprintf(stderr, "%s rounds: raising the level %.1f s, amount search %d LPs %.1f s, saturation tests %d LPs %.1f s\n",
                 argv[i], r.stats.seconds_raising, r.stats.amount_tests, r.stats.seconds_amount_tests,
                 r.stats.saturation_tests, r.stats.seconds_saturation_tests);
    std::printf("%s %.3f %d %lld %lld %zu", argv[i], ms, r.stats.lp_solves, r.stats.simplex_iterations,
                cold_iterations, r.tiers.size());
    for (const auto& d : r.demands) std::printf(" %.17g", d.share);
    std::printf("\n");
    std::fflush(stdout);
  }
  return 0;
}
