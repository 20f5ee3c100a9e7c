// LpSolver over HiGHS; see lp_solver.h. The only file of the core that includes HiGHS.
#include "apportion/multiflow/lp_solver.h"

#include <limits>

#include <Highs.h>

namespace apportion {

struct LpSolver::Impl {
  Highs highs;
};

const char* lp_status_name(LpStatus s) {
  switch (s) {
    case LpStatus::kOptimal: return "optimal";
    case LpStatus::kInfeasible: return "infeasible";
    case LpStatus::kUnbounded: return "unbounded";
    case LpStatus::kFailed: return "failed";
  }
  return "unknown";
}

LpSolver::LpSolver() : impl_(std::make_unique<Impl>()) {
  Highs& h = impl_->highs;
  h.setOptionValue("output_flag", false);
  h.setOptionValue("threads", 1);
  h.setOptionValue("solver", "simplex");
  h.setOptionValue("presolve", "off");  // presolve would discard the basis between solves
  h.setOptionValue("random_seed", 0);
}

LpSolver::~LpSolver() = default;

int LpSolver::add_column(double cost, double lower, double upper, const std::vector<int>& rows,
                         const std::vector<double>& values) {
  impl_->highs.addCol(cost, lower, upper, static_cast<HighsInt>(rows.size()), rows.data(), values.data());
  return column_count() - 1;
}

int LpSolver::add_row(double lower, double upper, const std::vector<int>& columns, const std::vector<double>& values) {
  impl_->highs.addRow(lower, upper, static_cast<HighsInt>(columns.size()), columns.data(), values.data());
  return row_count() - 1;
}

void LpSolver::set_method(Method m) {
  impl_->highs.setOptionValue("simplex_strategy", m == Method::kPrimal ? kSimplexStrategyPrimal : kSimplexStrategyDual);
}

void LpSolver::set_iteration_limit(long long limit) {
  impl_->highs.setOptionValue("simplex_iteration_limit",
                              static_cast<HighsInt>(limit > 0 ? limit : std::numeric_limits<HighsInt>::max()));
}

void LpSolver::set_feasibility_tolerance(double tolerance) {
  impl_->highs.setOptionValue("primal_feasibility_tolerance", tolerance);
  impl_->highs.setOptionValue("dual_feasibility_tolerance", tolerance);
}

void LpSolver::set_cost(int column, double cost) { impl_->highs.changeColCost(column, cost); }
void LpSolver::set_column_bounds(int column, double lower, double upper) {
  impl_->highs.changeColBounds(column, lower, upper);
}
void LpSolver::set_row_bounds(int row, double lower, double upper) { impl_->highs.changeRowBounds(row, lower, upper); }
void LpSolver::set_coefficient(int row, int column, double value) { impl_->highs.changeCoeff(row, column, value); }
std::vector<int> LpSolver::delete_columns(const std::vector<char>& drop) {
  std::vector<HighsInt> mask(drop.begin(), drop.end());
  impl_->highs.deleteCols(mask.data());  // on return: the new index, or -1
  return std::vector<int>(mask.begin(), mask.end());
}
bool LpSolver::is_basic(int column) const {
  const HighsBasis& b = impl_->highs.getBasis();
  return b.valid && b.col_status[column] == HighsBasisStatus::kBasic;
}
int LpSolver::column_count() const { return static_cast<int>(impl_->highs.getNumCol()); }
int LpSolver::row_count() const { return static_cast<int>(impl_->highs.getNumRow()); }

LpStatus LpSolver::solve() {
  Highs& h = impl_->highs;
  if (!hot_start_) h.clearSolver();
  const HighsStatus run = h.run();
  ++solves_;
  last_iterations_ = h.getInfo().simplex_iteration_count;
  total_iterations_ += last_iterations_;
  const HighsModelStatus ms = h.getModelStatus();
  message_ = h.modelStatusToString(ms);
  if (run == HighsStatus::kError) return LpStatus::kFailed;
  switch (ms) {
    case HighsModelStatus::kOptimal: return LpStatus::kOptimal;
    case HighsModelStatus::kInfeasible: return LpStatus::kInfeasible;
    case HighsModelStatus::kUnbounded:
    case HighsModelStatus::kUnboundedOrInfeasible: return LpStatus::kUnbounded;
    default: return LpStatus::kFailed;
  }
}

double LpSolver::objective() const { return impl_->highs.getInfo().objective_function_value; }
double LpSolver::value(int column) const { return impl_->highs.getSolution().col_value[column]; }
double LpSolver::row_value(int row) const { return impl_->highs.getSolution().row_value[row]; }
double LpSolver::row_dual(int row) const { return impl_->highs.getSolution().row_dual[row]; }
double LpSolver::reduced_cost(int column) const { return impl_->highs.getSolution().col_dual[column]; }

}  // namespace apportion
