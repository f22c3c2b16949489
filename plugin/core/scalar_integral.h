// Scalar line integral of a density f along a path: I = integral of f ds, in (unit of f) x metres.
//
// Same quadrature as work (span_quadrature.h): adaptive Gauss-Kronrod under one global budget relative to
// the integral of |f| ds. f sees x, y, z, s (field length unit) and tx, ty, tz like a force field.
// Reversing the path leaves I unchanged (ds > 0 either way).
#pragma once

#include <vector>

#include "field.h"
#include "path.h"
#include "work.h"

namespace ergpath {

struct ScalarResult {
  double value = 0.0;      // integral of f ds, (unit of f) x metres
  double error = 0.0;      // estimate of |computed - true|
  double abs_value = 0.0;  // integral of |f| ds: cancellation indicator
  double length_m = 0.0;
  long evaluations = 0;
  Status status = Status::Converged;
  std::vector<double> segment_values;  // per segment, travel order
};

/// Uses rel_tol, abs_tol_J (as the absolute floor, in the unit of the result), max_evaluations and the
/// window of `options`. Throws Error(NonFiniteField) naming edge, t and position; formula errors from
/// ScalarFieldEvaluator; Error(BadOption) for bad tolerances or window.
ScalarResult compute_scalar(const Path& path, const ScalarFieldSpec& density,
                            const IntegrationOptions& options = {});

}  // namespace ergpath
