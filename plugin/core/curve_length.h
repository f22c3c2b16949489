// Arc length of a curve piece by adaptive Gauss-Kronrod 7/15, split at the curve's break points.
#pragma once

#include "curve.h"

namespace ergpath {

struct LengthEstimate {
  double length = 0.0;   // model length unit
  double error = 0.0;    // estimate of |length - true length|, model length unit
  long evaluations = 0;  // calls of Curve::d1
};

/// Length of `curve` between parameters a <= b (clamped to [first, last]), to relative accuracy rel_tol.
LengthEstimate curve_length(const Curve& curve, double a, double b, double rel_tol = 1e-12);

/// Length of the whole curve.
inline LengthEstimate curve_length(const Curve& curve, double rel_tol = 1e-12) {
  return curve_length(curve, curve.first(), curve.last(), rel_tol);
}

}  // namespace ergpath
