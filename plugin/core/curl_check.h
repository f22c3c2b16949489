// Sampled curl of the total force field along a path: does path independence stand a chance?
//
// At points evenly spaced in arc length, curl F is estimated by central differences of the field with a
// step of 1e-4 of the path length (truncation ~1e-8 and round-off ~1e-12 of the scale |F| / L for a smooth
// field). A zero curl near the path is necessary for path independence, not sufficient (a vortex line
// off the path, a non-simply-connected region); a clearly non-zero curl says the work depends on the path.
#pragma once

#include "field.h"
#include "path.h"

namespace ergpath {

struct CurlEstimate {
  /// false when some formula reads s or the tangent: such a force depends on the motion, not only on
  /// position, and has no curl to speak of (it is path dependent by construction).
  bool applicable = true;
  int samples = 0;
  double max_curl_N_per_m = 0.0;  // largest |curl F| seen, newtons per metre
  double force_scale_N = 0.0;     // largest |F| seen, newtons
  /// max |curl F| x L / max |F| (dimensionless). Below ~1e-6: no evidence of curl at this sampling.
  double relative = 0.0;
  Vec3 position;     // where the largest curl was seen, model length unit
  double s_m = 0.0;  // its arc length from the path start, metres
};

/// `samples` >= 1 points along the whole path. Throws Error(BadOption) for samples < 1, formula errors
/// from FieldEvaluator; a non-finite field value gives Error(NonFiniteField) naming the position.
CurlEstimate estimate_curl(const Path& path, const FieldSpec& field, int samples = 64);

}  // namespace ergpath
