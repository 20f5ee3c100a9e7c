// apportion-bench: Apportion's maximum flow and min-cost flow beside LEMON 1.3.1 (Debian
// liblemon-dev: Preflow and NetworkSimplex) on the same generated instances, in one run.
// Prints one line per family and size: median times and the ratio Apportion/LEMON, and
// whether the optimal values agree. Built for WebAssembly too (without LEMON), where it
// times the same core on the same instances for the WASM/native ratio (shell/bench.sh).
//
// usage: apportion-bench [--max-arcs N] [--repeat R] [--problem maxflow|mincost]
//                        [--family grid|layered|random] [--full] [--machine]
// Min-cost flow on the grid and layered families stops at 100,000 arcs unless --full is
// given: their pivot counts grow quickly with size, and one 1M-arc solve takes minutes.
// Instances of 1M arcs or more are timed once; smaller ones R times (median).
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <string>
#include <vector>

#include "apportion/flow/max_flow.h"
#include "apportion/flow/min_cost_flow.h"
#include "instance_families.h"

#ifdef APPORTION_BENCH_WITH_LEMON
#include <lemon/network_simplex.h>
#include <lemon/preflow.h>
#include <lemon/smart_graph.h>
#endif

using namespace apportion;
using namespace apportion::bench;

namespace {

template <class F>
double median_ms(int repeat, F&& run) {
  std::vector<double> t;
  for (int i = 0; i < repeat; ++i) {
    auto start = std::chrono::steady_clock::now();
    run();
    t.push_back(std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count());
  }
  std::sort(t.begin(), t.end());
  return t[t.size() / 2];
}

FlowGraph to_graph(const Instance& in) {
  FlowGraph g(in.nodes);
  for (std::size_t a = 0; a < in.tail.size(); ++a) g.add_arc(in.tail[a], in.head[a], in.capacity[a], in.cost[a]);
  return g;
}

struct Row {
  std::string problem, family;
  int nodes, arcs;
  double ours_ms, ref_ms = NAN, ours_value, ref_value = NAN;
};

#ifdef APPORTION_BENCH_WITH_LEMON
struct LemonGraph {
  lemon::SmartDigraph g;
  std::vector<lemon::SmartDigraph::Node> nodes;
  lemon::SmartDigraph::ArcMap<double> cap{g}, cost{g};
  explicit LemonGraph(const Instance& in) {
    g.reserveNode(in.nodes);
    g.reserveArc(static_cast<int>(in.tail.size()));
    for (int v = 0; v < in.nodes; ++v) nodes.push_back(g.addNode());
    for (std::size_t a = 0; a < in.tail.size(); ++a) {
      auto arc = g.addArc(nodes[in.tail[a]], nodes[in.head[a]]);
      cap[arc] = in.capacity[a];
      cost[arc] = in.cost[a];
    }
  }
};
#endif

void print(const Row& r, bool machine) {
  if (machine) {
    std::printf("%s %s %d %d %.6f %.6f %.17g %.17g\n", r.problem.c_str(), r.family.c_str(), r.nodes, r.arcs, r.ours_ms,
                r.ref_ms, r.ours_value, r.ref_value);
  } else {
    const bool agree = std::isnan(r.ref_value) || std::abs(r.ours_value - r.ref_value) <= 1e-9 * std::max(1.0, std::abs(r.ref_value));
    std::printf("| %-8s | %-7s | %9d | %9d | %11.1f | %11.1f | %6.2f | %-5s |\n", r.problem.c_str(), r.family.c_str(),
                r.nodes, r.arcs, r.ours_ms, r.ref_ms, r.ours_ms / r.ref_ms, agree ? "yes" : "NO");
  }
  std::fflush(stdout);
}

}  // namespace

int main(int argc, char** argv) {
  int max_arcs = 1'000'000, repeat = 3;
  bool machine = false, full = false;
  std::string only_problem, only_family;
  for (int i = 1; i < argc; ++i) {
    if (!std::strcmp(argv[i], "--max-arcs") && i + 1 < argc) max_arcs = std::atoi(argv[++i]);
    else if (!std::strcmp(argv[i], "--repeat") && i + 1 < argc) repeat = std::atoi(argv[++i]);
    else if (!std::strcmp(argv[i], "--problem") && i + 1 < argc) only_problem = argv[++i];
    else if (!std::strcmp(argv[i], "--family") && i + 1 < argc) only_family = argv[++i];
    else if (!std::strcmp(argv[i], "--machine")) machine = true;
    else if (!std::strcmp(argv[i], "--full")) full = true;
    else {
      std::fprintf(stderr,
                   "usage: apportion-bench [--max-arcs N] [--repeat R] [--problem maxflow|mincost] "
                   "[--family grid|layered|random] [--full] [--machine]\n");
      return 2;
    }
  }
  if (!machine) {
    std::printf("| problem  | family  |     nodes |      arcs | Apportion ms |  LEMON ms | ratio | agree |\n");
    std::printf("|----------|---------|----------:|----------:|------------:|----------:|------:|-------|\n");
  }
  for (const char* problem : {"maxflow", "mincost"}) {
    if (!only_problem.empty() && only_problem != problem) continue;
    for (const char* family : {"grid", "layered", "random"}) {
      if (!only_family.empty() && only_family != family) continue;
      const bool slow = !full && !std::strcmp(problem, "mincost") && std::strcmp(family, "random") != 0;
      for (int arcs = 10'000; arcs <= (slow ? std::min(max_arcs, 100'000) : max_arcs); arcs *= 10) {
        const Instance in = make_instance(family, arcs, 12345 + arcs);
        const FlowGraph g = to_graph(in);
        Row row{problem, family, in.nodes, g.arc_count(), 0, NAN, 0, NAN};
        const bool max = !std::strcmp(problem, "maxflow");
        // Min-cost flow sends half the maximum flow, so the instance is feasible and costs bind.
        const double amount = max ? 0 : std::floor(max_flow(g, {in.source}, {in.sink}).value / 2);
        const int runs = g.arc_count() >= 1'000'000 ? 1 : repeat;
        row.ours_ms = median_ms(runs, [&] {
          if (max) {
            row.ours_value = max_flow(g, {in.source}, {in.sink}).value;
          } else {
            MinCostFlowResult r = min_cost_flow(g, in.source, in.sink, amount);
            row.ours_value = r.status == SolveStatus::kOptimal ? r.cost : NAN;
          }
        });
#ifdef APPORTION_BENCH_WITH_LEMON
        LemonGraph lg(in);
        row.ref_ms = median_ms(runs, [&] {
          if (max) {
            lemon::Preflow<lemon::SmartDigraph, lemon::SmartDigraph::ArcMap<double>> pf(lg.g, lg.cap, lg.nodes[in.source],
                                                                                        lg.nodes[in.sink]);
            pf.run();  // both phases: a flow, not only a preflow, like Apportion's
            row.ref_value = pf.flowValue();
          } else {
            lemon::NetworkSimplex<lemon::SmartDigraph, double, double> ns(lg.g);
            ns.upperMap(lg.cap).costMap(lg.cost).stSupply(lg.nodes[in.source], lg.nodes[in.sink], amount);
            row.ref_value = ns.run() == lemon::NetworkSimplex<lemon::SmartDigraph, double, double>::OPTIMAL
                                ? ns.totalCost()
                                : NAN;
          }
        });
#endif
        print(row, machine);
      }
    }
  }
  return 0;
}
