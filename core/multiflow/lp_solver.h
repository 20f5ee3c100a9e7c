// LpSolver: Apportion's own small interface to a linear-programming solver (HiGHS 1.10,
// dual simplex), so that the flow models never include solver headers.
//
// Model: minimise c^T x subject to row_lower <= A x <= row_upper, col_lower <= x <= col_upper.
// Duals follow the usual minimisation convention: reduced cost d = c - A^T y; at an optimum
// d_j >= 0 for a column at its lower bound, y_i <= 0 for a row at its upper bound and
// y_i >= 0 for a row at its lower bound.
//
// Hot start: the solver keeps its basis between solves. Changing bounds, costs or adding
// columns and solving again starts from the previous basis (HiGHS keeps it valid under these
// changes), which is what column generation and the fairness rounds rely on.
// Single-threaded: HiGHS runs with one thread everywhere, so results are the same natively
// and in WebAssembly, where threads are not available.
#pragma once

#include <limits>
#include <memory>
#include <string>
#include <vector>

namespace apportion {

enum class LpStatus { kOptimal, kInfeasible, kUnbounded, kFailed };

const char* lp_status_name(LpStatus s);

class LpSolver {
 public:
  static constexpr double kInf = std::numeric_limits<double>::infinity();

  LpSolver();
  ~LpSolver();
  LpSolver(const LpSolver&) = delete;
  LpSolver& operator=(const LpSolver&) = delete;

  // Model building; indices count from 0 in the order of addition.
  int add_column(double cost, double lower, double upper, const std::vector<int>& rows = {},
                 const std::vector<double>& values = {});
  int add_row(double lower, double upper, const std::vector<int>& columns = {},
              const std::vector<double>& values = {});
  void set_cost(int column, double cost);
  void set_column_bounds(int column, double lower, double upper);
  void set_row_bounds(int row, double lower, double upper);
  void set_coefficient(int row, int column, double value);
  // Deletes the columns with drop[j] true (drop has one entry per column) and returns each
  // column's new index, -1 for a deleted one; the others keep their order. The basis stays
  // valid, and the next solve hot-starts from it, when no basic column is deleted. The last
  // solution is gone until the next solve.
  std::vector<int> delete_columns(const std::vector<char>& drop);
  // After an optimal solve: whether the column is in the basis.
  bool is_basic(int column) const;
  int column_count() const;
  int row_count() const;

  // Solves from the current basis. The values below are valid after kOptimal.
  LpStatus solve();
  // With hot start off, every solve starts from scratch (a slack basis); for measuring
  // what the hot start saves, never needed otherwise.
  void set_hot_start(bool on) { hot_start_ = on; }
  // Which simplex method the next solves use (default: dual). After columns were added or
  // costs changed, an optimal basis is still primal feasible and the primal simplex goes on
  // from it in a few iterations; the dual simplex would first have to regain dual
  // feasibility (its phase 1), which on large networks costs as much as a cold start. After
  // bounds that cut off the current point, the dual simplex is the right one.
  enum class Method { kDual, kPrimal };
  void set_method(Method m);
  // A solve that takes more simplex iterations than this stops with kFailed (0: no limit);
  // a guard against a simplex that stalls on an ill-conditioned model.
  void set_iteration_limit(long long limit);
  // HiGHS's primal and dual feasibility tolerances (absolute; its defaults 1e-7): how far a
  // solution may stand outside a bound or a row, or a reduced cost on the wrong side of
  // zero, and still count as feasible.
  void set_feasibility_tolerance(double tolerance);
  double objective() const;
  double value(int column) const;
  double row_value(int row) const;
  double row_dual(int row) const;
  double reduced_cost(int column) const;

  long long last_iterations() const { return last_iterations_; }
  long long total_iterations() const { return total_iterations_; }
  int solves() const { return solves_; }
  std::string last_message() const { return message_; }

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
  long long last_iterations_ = 0, total_iterations_ = 0;
  int solves_ = 0;
  bool hot_start_ = true;
  std::string message_;
};

}  // namespace apportion
