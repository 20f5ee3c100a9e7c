// The subcommands of `apportion`. Each returns the process exit code:
// 0 success, 1 the problem has no solution (e.g. infeasible supplies), 2 bad input or usage,
// 3 solved, but its proof fell short (apportion fair --certify).
#pragma once

namespace apportion::cli {

constexpr int kExitOk = 0;
constexpr int kExitNoSolution = 1;
constexpr int kExitBadInput = 2;
constexpr int kExitUnproven = 3;

int run_validate(int argc, char** argv);
int run_convert(int argc, char** argv);
int run_max_flow(int argc, char** argv);  // also "mincut": the same solve, the cut first
int run_min_cost_flow(int argc, char** argv);
int run_fair(int argc, char** argv);  // fair, throughput, concurrent, feasible, tradeoff
int run_demands(int argc, char** argv);
int run_certify(int argc, char** argv);  // a saved max-min result, proven

}  // namespace apportion::cli
