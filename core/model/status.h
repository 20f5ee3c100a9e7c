// Outcome codes of every Apportion solver. Solvers return a status with their result and
// never throw through their API; a result whose status is not kOptimal carries no flows.
#pragma once

#include <string>

namespace apportion {

enum class SolveStatus {
  kOptimal,     // the result is optimal and verified
  kInfeasible,  // no flow satisfies the constraints (e.g. supplies that cannot be routed)
  kUnbounded,   // the objective has no bound (a negative-cost cycle of infinite capacity)
  kBadInput,    // the input breaks a precondition (unknown node, NaN capacity, ...)
  kNumericalDifficulty,  // the LP solver could not settle the problem to the tolerances
  kNotSolved,   // no solve has run yet
};

inline const char* status_name(SolveStatus s) {
  switch (s) {
    case SolveStatus::kOptimal: return "optimal";
    case SolveStatus::kInfeasible: return "infeasible";
    case SolveStatus::kUnbounded: return "unbounded";
    case SolveStatus::kBadInput: return "bad input";
    case SolveStatus::kNumericalDifficulty: return "numerical difficulty";
    case SolveStatus::kNotSolved: return "not solved";
  }
  return "unknown";
}

// The status with this name (status_name's inverse); false when there is none.
inline bool status_from_name(const std::string& name, SolveStatus& out) {
  for (SolveStatus s : {SolveStatus::kOptimal, SolveStatus::kInfeasible, SolveStatus::kUnbounded, SolveStatus::kBadInput,
                        SolveStatus::kNumericalDifficulty, SolveStatus::kNotSolved})
    if (name == status_name(s)) return out = s, true;
  return false;
}

}  // namespace apportion
