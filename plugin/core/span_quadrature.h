// Globally adaptive quadrature over the break-free parameter spans of a path (engine internal).
//
// Method (docs/method.md): Gauss-Kronrod 7/15 on every span (Kronrod 1965; nodes from Boost.Math, computed
// after Laurie 1997), then repeated bisection of the piece with the largest error relative to ONE global
// budget shared by all spans (the QUADPACK QAG strategy, Piessens et al. 1983). Error estimates: QUADPACK's
// qk15 scaling of |K15 - G7|, sharpened after a bisection by the parent-versus-children difference
// (Lyness 1969) where the rule is seen converging, floored at round-off. Three refinements:
//  - a polynomial-curve span that misses its share first tries exactness: Kronrod-15 against
//    Gauss-Legendre-12 (both of degree 23); agreement to round-off means the integrand is a polynomial of
//    degree <= 23 there, to double precision;
//  - a smooth periodic span (a whole circle or ellipse) uses the trapezoid rule, which converges
//    geometrically for periodic analytic integrands (Trefethen & Weideman 2014);
//  - a span with a sharp peak of the force magnitude (a source close to the curve) is split at the peak,
//    located by Brent's minimizer (Brent 1973), and each side is integrated in the variable v of
//    t = t* + d sinh(v), which spreads the near-singular region (Johnston & Elliott 2005).
#pragma once

#include <cstddef>
#include <functional>
#include <vector>

namespace ergpath::detail {

/// A parameter interval [a, b] of one segment's curve that contains no break.
struct Span {
  std::size_t segment = 0;
  double a = 0.0, b = 0.0;  // curve parameter, a < b
  bool periodic = false;    // the integrand is smooth and periodic with period b - a
  bool polynomial = false;  // the curve is polynomial on the span
};

/// Facts about the integrand at a node that are not integrated but steer peak search.
struct NodeInfo {
  double tangential = 0.0;  // signed quantity whose largest magnitude is sought (F . T, newtons)
  double magnitude = 0.0;   // size of the field (|F|, newtons): its sharp peaks mark near-singular spots
};

/// Fills out[0 .. components) with the integrands per unit curve parameter at t of `span`.
using Integrand = std::function<void(const Span& span, double t, double* out, NodeInfo& info)>;

/// The error of component `value` must satisfy sum <= max(rel_tol * |integral of component `scale`|, floor).
struct Control {
  std::size_t value = 0;
  std::size_t scale = 0;
  double floor = 0.0;
};

struct QuadratureOptions {
  double rel_tol = 1e-10;
  long max_evaluations = 20'000'000;
  bool split_at_peaks = true;  // near-singular handling
};

/// A final piece of a span with its integrals.
struct Piece {
  std::size_t span = 0;
  double a = 0.0, b = 0.0;    // curve parameter bounds
  std::vector<double> value;  // integral of every component
  std::vector<double> error;  // error estimate of every component
  double best_t = 0.0;        // node with the largest |tangential| and its neighbours (curve parameter)
  double best_lo = 0.0, best_hi = 0.0;
  double best_tangential = 0.0;
};

struct QuadratureResult {
  std::vector<Piece> pieces;  // ordered by span, then by parameter
  std::vector<double> value, error;
  long evaluations = 0;
  bool converged = true;
};

QuadratureResult integrate_spans(const std::vector<Span>& spans, std::size_t components,
                                 const std::vector<Control>& controls, const Integrand& f,
                                 const QuadratureOptions& options);

/// Largest |g| on [lo, hi] by Brent's method started from the bracket; returns the argument.
double maximize_abs(const std::function<double(double)>& g, double lo, double hi);

}  // namespace ergpath::detail
