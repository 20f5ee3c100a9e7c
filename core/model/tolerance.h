// Tolerance: the one owner of floating-point comparisons in Apportion's algorithms.
//
// Algorithms never compare doubles with raw `<` or `==`; they ask a Tolerance whether a
// value is "surely positive", "surely less", and so on. The epsilon is absolute and scaled
// to the instance (the largest capacity), because flows are sums and differences of
// capacities: an error relative to the largest one is what rounding can produce.
// Model: LEMON's Tolerance<double> (lemon/tolerance.h), with instance scaling added.
#pragma once

#include <algorithm>
#include <cmath>

namespace apportion {

class Tolerance {
 public:
  // Relative accuracy asked of every algorithm; 1e-12 of the largest magnitude leaves three
  // decimal digits above double rounding for sums over many arcs.
  static constexpr double kDefaultRelative = 1e-12;

  Tolerance() = default;
  explicit Tolerance(double epsilon) : eps_(epsilon) {}

  // A tolerance for an instance whose largest magnitude (capacity, supply) is `scale`.
  static Tolerance for_scale(double scale, double relative = kDefaultRelative) {
    return Tolerance(relative * std::max(1.0, std::abs(scale)));
  }

  double epsilon() const { return eps_; }

  bool positive(double a) const { return a > eps_; }          // surely > 0
  bool negative(double a) const { return a < -eps_; }         // surely < 0
  bool zero(double a) const { return std::abs(a) <= eps_; }   // neither of the above
  bool nonzero(double a) const { return !zero(a); }
  bool less(double a, double b) const { return a < b - eps_; }  // surely a < b
  bool greater(double a, double b) const { return less(b, a); }
  bool equal(double a, double b) const { return !less(a, b) && !less(b, a); }

 private:
  double eps_ = 1e-9;
};

}  // namespace apportion
