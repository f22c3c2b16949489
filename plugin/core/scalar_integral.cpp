#include "scalar_integral.h"

#include <algorithm>
#include <cmath>
#include <sstream>

#include "arc_length.h"
#include "error.h"
#include "span_quadrature.h"
#include "work_integrator.h"

namespace ergpath {

ScalarResult compute_scalar(const Path& path, const ScalarFieldSpec& density,
                            const IntegrationOptions& options) {
  detail::check_options(options);
  ScalarFieldEvaluator f(density);
  const ArcLength arc(path, std::min(ArcLength::kDefaultRelTol, options.rel_tol));
  const double total = arc.total_m();
  const double from = options.window_from_m.value_or(0.0), to = options.window_to_m.value_or(total);
  if (!(from >= 0.0 && to <= total * (1 + 1e-12) && from <= to)) {
    std::ostringstream os;
    os.precision(12);
    os << "distance window [" << from << ", " << to << "] m must lie within [0, " << total << "] m";
    throw Error(ErrorKind::BadOption, os.str());
  }
  const std::vector<detail::Span> spans =
      detail::window_spans(path, arc, from, std::min(to, total), !f.uses_arc_length());
  const double to_field = path.length_unit_m / density.length_unit_m;
  const auto integrand = [&](const detail::Span& span, double t, double* out, detail::NodeInfo& info) {
    const Segment& seg = path.segments[span.segment];
    Vec3 p, v;
    seg.curve->d1(t, p, v);
    const double speed = norm(v);
    if (!is_finite(p) || !std::isfinite(speed)) {
      throw Error(ErrorKind::NonFiniteField,
                  "curve derivative is not finite on " + detail::describe_point(seg, t, p));
    }
    FieldPoint q;
    q.position = to_field * p;
    q.tangent = speed > 0.0 ? ((seg.reversed ? -1.0 : 1.0) / speed) * v : Vec3{};
    if (f.uses_arc_length()) q.s = arc.s_at(span.segment, t) / density.length_unit_m;
    const double value = f.eval(q);
    if (!std::isfinite(value)) {
      throw Error(ErrorKind::NonFiniteField, "density is not finite on " + detail::describe_point(seg, t, p));
    }
    const double ds = speed * path.length_unit_m;
    out[0] = value * ds;
    out[1] = std::abs(out[0]);
    info.tangential = value;
    info.magnitude = std::abs(value);
  };
  detail::QuadratureOptions qo;
  qo.rel_tol = options.rel_tol;
  qo.max_evaluations = options.max_evaluations;
  qo.split_at_peaks = options.split_at_peaks;
  // The length comes from the arc-length table, not from this pass.
  const auto q = detail::integrate_spans(spans, 2, {{0, 1, options.abs_tol_J}}, integrand, qo);
  ScalarResult r;
  r.value = q.value[0];
  r.error = q.error[0];
  r.abs_value = q.value[1];
  r.length_m = std::min(to, total) - from;
  r.evaluations = q.evaluations;
  r.status = q.converged ? Status::Converged : Status::ToleranceNotMet;
  r.segment_values.assign(path.segments.size(), 0.0);
  for (const auto& p : q.pieces) r.segment_values[spans[p.span].segment] += p.value[0];
  return r;
}

}  // namespace ergpath
