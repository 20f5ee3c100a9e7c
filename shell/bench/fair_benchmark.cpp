// apportion-fair-bench: times Apportion's exact weighted max-min fairness on network files,
// natively and in WebAssembly under node (the same core, the same files). Prints one line
// per file: "<file> <milliseconds> <lp solves> <simplex iterations> <iterations without hot
// start> <shares...>" for
// shell/bench/fair_benchmark.py, which compares with the textbook baseline.
//
// usage: apportion-fair-bench FILE...
#include <chrono>
#include <cstdio>
#include <fstream>
#include <sstream>

#include "apportion/formats/network_json.h"
#include "apportion/multiflow/fair_multiflow.h"

int main(int argc, char** argv) {
  if (argc < 2) {
    std::fprintf(stderr, "usage: apportion-fair-bench FILE...\n");
    return 2;
  }
  for (int i = 1; i < argc; ++i) {
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
    // One untimed solve first: node compiles WebAssembly in a baseline tier before its
    // optimising tier, and the first run would time the compiler, not the engine.
    apportion::solve_multiflow(*loaded.network, opt);
    const auto start = std::chrono::steady_clock::now();
    const apportion::MultiflowResult r = apportion::solve_multiflow(*loaded.network, opt);
    const double ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
    if (r.status != apportion::SolveStatus::kOptimal) {
      std::fprintf(stderr, "%s: %s\n", argv[i], r.message.c_str());
      return 1;
    }
    // The same solve again, every LP from scratch: what the hot start saves.
    opt.hot_start = false;
    const apportion::MultiflowResult cold = apportion::solve_multiflow(*loaded.network, opt);
    std::printf("%s %.3f %d %lld %lld", argv[i], ms, r.stats.lp_solves, r.stats.simplex_iterations,
                cold.stats.simplex_iterations);
    for (const auto& d : r.demands) std::printf(" %.17g", d.share);
    std::printf("\n");
    std::fflush(stdout);
  }
  return 0;
}
