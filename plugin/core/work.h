// Work along a path: W = sum over segments of the integral of F(r(t)) . r'(t) dt, in joules.
//
// Each segment is split at its break points; every span is integrated by adaptive Gauss-Kronrod under
// one global error budget shared by the whole path. See docs/method.md and docs/bibliography.md.
#pragma once

#include <limits>
#include <optional>
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
  /// Distance window, metres of arc length from the path start: integrate only from `window_from_m`
  /// (default 0) to `window_to_m` (default the path length). Error(BadOption) when outside [0, L] or
  /// from > to.
  std::optional<double> window_from_m;
  std::optional<double> window_to_m;
  /// The user states the total field is conservative: on a closed path a circulation beyond tolerance
  /// is then flagged in WorkResult::loop_mismatch.
  bool assume_conservative = false;
  /// Split spans at sharp peaks of |F| (a source near the curve); off only to compare methods.
  bool split_at_peaks = true;
  /// Locate the peak tangential force (costs a few dozen evaluations per segment).
  bool find_peaks = true;
};

/// Largest magnitude of the tangential force F . T along a stretch, and where it occurs.
struct Peak {
  double force_N = 0.0;  // signed F . T at the peak (T = unit tangent in travel direction)
  double s_m = 0.0;      // arc length from the path start
  Vec3 position;         // model length unit
  int edge = 0;
  std::size_t segment = 0;  // index into Path::segments
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
  double abs_work_J = 0.0;  // integral of |F . dr|: cancellation indicator
  double length_m = 0.0;
  long evaluations = 0;
  std::vector<FieldWork> fields;  // one per named field, in FieldSpec order
  Peak peak;
};

enum class Status { Converged, ToleranceNotMet };

struct WorkResult {
  double work_J = 0.0;
  double error_J = 0.0;  // estimate of |computed - true| for work_J
  double abs_work_J = 0.0;
  double length_m = 0.0;
  double length_error_m = 0.0;
  long evaluations = 0;  // field evaluations (each evaluates every named field once)
  Status status = Status::Converged;
  bool closed = false;  // whole closed path integrated: work_J is the circulation of the total field
  std::vector<SegmentWork> segments;  // in travel order; zero for segments outside the window
  std::vector<FieldWork> fields;      // totals per named field
  Peak peak;
  double window_from_m = 0.0;  // the stretch integrated, metres of arc length from the path start
  double window_to_m = 0.0;
  /// -(U(end) - U(start)) in joules when FieldSpec::potential is set: equals work_J for a correct potential.
  std::optional<double> potential_drop_J;
  /// |work_J - potential_drop_J| exceeds ten times the error budget (plus round-off of U).
  bool potential_mismatch = false;
  /// Closed path, conservative field assumed, and |work_J| exceeds ten times the error budget.
  bool loop_mismatch = false;
};

/// Throws Error(NonFiniteField) naming the edge, t and position when the field or r'(t) is not finite;
/// Error(BadOption) for a non-positive tolerance or a bad window; formula errors from FieldEvaluator.
/// A budget that cannot be met is not thrown: the best value comes back with status ToleranceNotMet.
/// Positions reach the formulas in FieldSpec::length_unit_m; work is in joules, lengths in metres.
WorkResult compute_work(const Path& path, const FieldSpec& field, const IntegrationOptions& options = {});

}  // namespace ergpath
