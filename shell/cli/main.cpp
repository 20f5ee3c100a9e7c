// apportion: the command line over Apportion's core. A thin client: it reads files, calls
// the core, prints tables and writes result files. See `apportion --help`.
#include <cstring>
#include <iostream>
#include <string>

#include "commands.h"

namespace {

const char* kUsage = R"(apportion - fair sharing of network capacity (command line)

Usage: apportion <command> [options]

Commands:
  validate   check a network file and list its errors and warnings
  convert    convert a network between JSON, CSV tables and DIMACS
  maxflow    maximum flow from origins to destinations, with a minimum cut
  mincut     the minimum cut that limits a maximum flow
  mincost    minimum-cost flow for an amount or for node supplies
  demands    add many demands at once: all pairs, gravity model, a matrix CSV, a table

Sharing capacity among all demands of a file:
  fair       weighted max-min fair shares, exact, with tiers and binding arcs
  throughput the most total flow
  concurrent the largest common fraction of every amount
  feasible   can every amount be met? if not, by how much, with a certificate
  tradeoff   the most total flow keeping each share near its fair share
  certify    prove a saved max-min result: how far each share can be from its fair share

Run 'apportion <command> --help' for the options and an example of each.
Exit codes: 0 success, 1 no solution (e.g. infeasible supplies), 2 bad input or usage,
3 solved or read but not proven (fair --certify, certify).
)";

}  // namespace

int main(int argc, char** argv) {
  using namespace apportion::cli;
  if (argc < 2 || !std::strcmp(argv[1], "--help") || !std::strcmp(argv[1], "-h") || !std::strcmp(argv[1], "help")) {
    std::cout << kUsage;
    return argc < 2 ? kExitBadInput : kExitOk;
  }
  const std::string cmd = argv[1];
  if (cmd == "validate") return run_validate(argc, argv);
  if (cmd == "convert") return run_convert(argc, argv);
  if (cmd == "maxflow" || cmd == "mincut") return run_max_flow(argc, argv);
  if (cmd == "mincost") return run_min_cost_flow(argc, argv);
  if (cmd == "demands") return run_demands(argc, argv);
  if (cmd == "certify") return run_certify(argc, argv);
  if (cmd == "fair" || cmd == "throughput" || cmd == "concurrent" || cmd == "feasible" || cmd == "tradeoff")
    return run_fair(argc, argv);
  std::cerr << "apportion: unknown command '" << cmd << "'\n" << kUsage;
  return kExitBadInput;
}
