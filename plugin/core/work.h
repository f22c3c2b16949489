// Work along a path: W = sum over segments of the integral of F(r(t)) . r'(t) dt, in joules.
//
// Each segment is split at its break points; every span is integrated by adaptive Gauss-Kronrod under
// one global error budget shared by the whole path. See docs/method.md and docs/bibliography.md.
#pragma once

#include <limits>
#include <string>
#include <vector>

#include "field.h"
#include "path.h"

namespace ergpath {

struct IntegrationOptions {
  /// Target relative error on the total work, measured against the integral of |F . dr| (so a
  /// cancelling integrand is not asked for more digits than exist).
  double rel_tol = 1e-10;
  /// Absolute floor in joules: the target error is max(rel_tol * scale, abs_tol_J).
  double abs_tol_J = 1e-12;
  /// Budget of integrand evaluations; beyond it the result has status ToleranceNotMet.
  long max_evaluations = 20'000'000;
};

/// Largest magnitude of the tangential force F . T along a stretch, and where it occurs.
struct Peak {
  double force_N = 0.0;      // signed F . T at the peak (T = unit tangent in travel direction)
  double s_m = 0.0;          // arc length from the path start
  Vec3 position;             // model length unit
  int edge = 0;
};

struct FieldWork {
  std::string name;
  double work_J = 0.0;
};

struct SegmentWork {
  int edge = 0;
  bool reversed = false;
  std::string name;
  double work_J = 0.0;
  double error_J = 0.0;
  double abs_work_J = 0.0;   // integral of |F . dr|: cancellation indicator
  double length_m = 0.0;
  long evaluations = 0;
  std::vector<FieldWork> fields;  // one per named field, in FieldSpec order
  Peak peak;
};

enum class Status { Converged, ToleranceNotMet };

struct WorkResult {
  double work_J = 0.0;
  double error_J = 0.0;       // estimate of |computed - true| for work_J
  double abs_work_J = 0.0;
  double length_m = 0.0;
  double length_error_m = 0.0;
  long evaluations = 0;       // field evaluations (each evaluates every named field once)
  Status status = Status::Converged;
  bool closed = false;        // work_J is then the circulation of the total field
  std::vector<SegmentWork> segments;  // in travel order
  std::vector<FieldWork> fields;      // totals per named field
  Peak peak;
};

/// Throws Error(NonFiniteField) naming the edge, t and position when the field or r'(t) is not finite.
/// A budget that cannot be met is not thrown: the best value comes back with status ToleranceNotMet.
WorkResult compute_work(const Path& path, const FieldSpec& field, const IntegrationOptions& options = {});

}  // namespace ergpath
