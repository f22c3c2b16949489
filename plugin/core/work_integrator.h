// The machinery behind compute_work and work_profile (engine internal): one compiled field, one arc-length
// table, and windowed work integrals that share them.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "arc_length.h"
#include "field.h"
#include "path.h"
#include "span_quadrature.h"
#include "work.h"

namespace ergpath::detail {

/// "edge E at t=..., position (x, y, z) model units" for error messages.
std::string describe_point(const Segment& seg, double t, const Vec3& p);

/// Checks the tolerances and the evaluation budget of `o`; throws Error(BadOption).
void check_options(const IntegrationOptions& o);

/// The break-free parameter spans of segments that lie in the travel window [from_m, to_m].
/// `periodic_ok`: a whole full-period segment may use the trapezoid rule.
std::vector<Span> window_spans(const Path& path, const ArcLength& arc, double from_m, double to_m,
                               bool periodic_ok);

class WorkIntegrator {
 public:
  WorkIntegrator(const Path& path, const FieldSpec& spec, const IntegrationOptions& options);

  /// Work from from_m to to_m (metres of arc length), with per-segment results and peaks.
  WorkResult run(double from_m, double to_m, bool find_peaks);

  /// Tangential force F . T (newtons) of the total field at parameter t of segment k; position out
  /// in model length unit. Counts as one evaluation.
  double tangential_N(std::size_t k, double t, Vec3* position = nullptr);

  const ArcLength& arc() const { return arc_; }
  long evaluations() const { return evaluations_; }

 private:
  void sample(std::size_t k, double t, double* out, NodeInfo& info);

  const Path& path_;
  FieldSpec spec_;
  IntegrationOptions options_;
  FieldEvaluator field_;
  ArcLength arc_;
  std::vector<Vec3> forces_;
  std::vector<long> per_segment_;
  double to_field_;
  long evaluations_ = 0;
};

}  // namespace ergpath::detail
