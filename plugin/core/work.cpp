#include "work.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>

#include "error.h"
#include "work_integrator.h"

namespace ergpath {

namespace detail {

namespace {

constexpr double kEps = std::numeric_limits<double>::epsilon();
// A potential or loop check fails when the discrepancy exceeds this multiple of the error budget: the
// estimates are deliberately pessimistic, so a factor 10 flags real mismatches, not noise.
constexpr double kCheckSafety = 10.0;
// Round-off of a potential difference U(b) - U(a), relative to |U(a)| + |U(b)|: muParser evaluates in
// double precision with a few dozen operations at most.
constexpr double kPotentialRoundoff = 1000 * kEps;

// Lengths are not integrated here: they come from the arc-length table, which every WorkIntegrator
// builds anyway (to ArcLength::kDefaultRelTol or the requested tolerance, whichever is tighter).
enum Component : std::size_t { kWork = 0, kAbsWork = 1, kFirstField = 2 };

}  // namespace

std::string describe_point(const Segment& seg, double t, const Vec3& p) {
  std::ostringstream os;
  os.precision(12);
  os << "edge " << seg.edge << " at t=" << t << ", position (" << p.x << ", " << p.y << ", " << p.z
     << ") model units";
  return os.str();
}

void check_options(const IntegrationOptions& o) {
  if (!(o.rel_tol > 0.0 && o.rel_tol < 1.0)) {
    throw Error(ErrorKind::BadOption, "relative tolerance must lie in (0, 1)");
  }
  if (!(o.abs_tol_J >= 0.0) || !std::isfinite(o.abs_tol_J)) {
    throw Error(ErrorKind::BadOption, "absolute tolerance must be a finite number >= 0");
  }
  if (o.max_evaluations <= 0) throw Error(ErrorKind::BadOption, "evaluation budget must be positive");
}

std::vector<Span> window_spans(const Path& path, const ArcLength& arc, double from_m, double to_m,
                               bool periodic_ok) {
  std::vector<Span> spans;
  if (path.segments.empty() || !(to_m > from_m)) return spans;
  const PathLocation a = arc.locate(from_m), b = arc.locate(to_m);
  for (std::size_t k = a.segment; k <= b.segment; ++k) {
    const Segment& seg = path.segments[k];
    const Curve& c = *seg.curve;
    double lo = c.first(), hi = c.last();
    // Travel runs lo -> hi on a forward segment and hi -> lo on a reversed one.
    if (k == a.segment) (seg.reversed ? hi : lo) = a.t;
    if (k == b.segment) (seg.reversed ? lo : hi) = b.t;
    if (!(hi > lo)) continue;
    const CurveStructure st = c.structure();
    const std::vector<double> breaks = c.breaks();
    const bool whole = lo == c.first() && hi == c.last();
    double left = lo;
    for (double br : breaks) {
      if (br <= left || br >= hi) continue;
      spans.push_back({k, left, br, false, st.polynomial && !st.rational});
      left = br;
    }
    const bool periodic = periodic_ok && whole && breaks.empty() && st.full_period;
    spans.push_back({k, left, hi, periodic, st.polynomial && !st.rational});
  }
  return spans;
}

WorkIntegrator::WorkIntegrator(const Path& path, const FieldSpec& spec, const IntegrationOptions& options)
    : path_(path),
      spec_(spec),
      options_(options),
      field_(spec),
      arc_(path, std::min(ArcLength::kDefaultRelTol, options.rel_tol)),
      forces_(field_.count()),
      per_segment_(path.segments.size(), 0),
      to_field_(path.length_unit_m / spec.length_unit_m) {
  check_options(options);
  if (!(path.length_unit_m > 0.0) || !std::isfinite(path.length_unit_m)) {
    throw Error(ErrorKind::BadOption, "path length unit must be a positive number of metres");
  }
}

void WorkIntegrator::sample(std::size_t k, double t, double* out, NodeInfo& info) {
  const Segment& seg = path_.segments[k];
  Vec3 p, v;
  seg.curve->d1(t, p, v);
  const double sigma = seg.reversed ? -1.0 : 1.0;
  const double speed = norm(v);
  if (!is_finite(p) || !std::isfinite(speed)) {
    throw Error(ErrorKind::NonFiniteField, "curve derivative is not finite on " + describe_point(seg, t, p));
  }
  FieldPoint q;
  q.position = to_field_ * p;
  q.tangent = speed > 0.0 ? (sigma / speed) * v : Vec3{};
  if (field_.uses_arc_length()) q.s = arc_.s_at(k, t) / spec_.length_unit_m;
  field_.eval(q, forces_.data());
  ++evaluations_;
  ++per_segment_[k];
  const Vec3 dr = (sigma * path_.length_unit_m) * v;  // metres per unit t, in travel direction
  Vec3 total;
  for (std::size_t i = 0; i < forces_.size(); ++i) {
    if (!is_finite(forces_[i])) {
      throw Error(ErrorKind::NonFiniteField,
                  "field '" + field_.name(i) + "' is not finite on " + describe_point(seg, t, p));
    }
    total += forces_[i];
    if (out) out[kFirstField + i] = dot(forces_[i], dr);
  }
  if (out) {
    out[kWork] = dot(total, dr);
    out[kAbsWork] = std::abs(out[kWork]);
  }
  info.tangential = dot(total, q.tangent);
  info.magnitude = norm(total);
}

double WorkIntegrator::tangential_N(std::size_t k, double t, Vec3* position) {
  NodeInfo info;
  sample(k, t, nullptr, info);
  if (position) {
    Vec3 v;
    path_.segments[k].curve->d1(t, *position, v);
  }
  return info.tangential;
}

WorkResult WorkIntegrator::run(double from_m, double to_m, bool find_peaks) {
  const std::size_t nf = field_.count();
  const std::vector<Span> spans = window_spans(path_, arc_, from_m, to_m, !field_.uses_arc_length());
  const std::vector<Control> controls{{kWork, kAbsWork, options_.abs_tol_J}};
  QuadratureOptions qo;
  qo.rel_tol = options_.rel_tol;
  qo.max_evaluations = std::max(1L, options_.max_evaluations - evaluations_);
  qo.split_at_peaks = options_.split_at_peaks;
  const long before = evaluations_;
  const std::vector<long> before_seg = per_segment_;
  const QuadratureResult q = integrate_spans(
      spans, kFirstField + nf, controls,
      [&](const Span& s, double t, double* out, NodeInfo& info) { sample(s.segment, t, out, info); }, qo);

  WorkResult r;
  r.status = q.converged ? Status::Converged : Status::ToleranceNotMet;
  r.window_from_m = from_m;
  r.window_to_m = to_m;
  const double total = arc_.total_m();
  r.closed = path_.closed && from_m <= 0.0 && to_m >= total;
  r.segments.resize(path_.segments.size());
  std::vector<double> best(path_.segments.size(), -1.0);
  std::vector<const Piece*> best_piece(path_.segments.size(), nullptr);
  for (std::size_t k = 0; k < path_.segments.size(); ++k) {
    SegmentWork& s = r.segments[k];
    s.edge = path_.segments[k].edge;
    s.reversed = path_.segments[k].reversed;
    s.name = path_.segments[k].name;
    for (std::size_t j = 0; j < nf; ++j) s.fields.push_back({field_.name(j), 0.0});
  }
  for (std::size_t j = 0; j < nf; ++j) r.fields.push_back({field_.name(j), 0.0});
  for (const Piece& p : q.pieces) {
    const std::size_t k = spans[p.span].segment;
    SegmentWork& s = r.segments[k];
    s.work_J += p.value[kWork];
    s.error_J += p.error[kWork];
    s.abs_work_J += p.value[kAbsWork];
    for (std::size_t j = 0; j < nf; ++j) {
      s.fields[j].work_J += p.value[kFirstField + j];
      r.fields[j].work_J += p.value[kFirstField + j];
    }
    if (std::abs(p.best_tangential) > best[k]) {
      best[k] = std::abs(p.best_tangential);
      best_piece[k] = &p;
    }
  }
  if (find_peaks) {
    double overall = -1.0;
    for (std::size_t k = 0; k < path_.segments.size(); ++k) {
      if (!best_piece[k]) continue;
      const Piece& p = *best_piece[k];
      const double t = maximize_abs([&](double u) { return tangential_N(k, u); }, p.best_lo, p.best_hi);
      Peak peak;
      peak.force_N = tangential_N(k, t, &peak.position);
      if (std::abs(peak.force_N) < std::abs(p.best_tangential)) {  // the node itself was the best seen
        peak.force_N = tangential_N(k, p.best_t, &peak.position);
        peak.s_m = arc_.s_at(k, p.best_t);
      } else {
        peak.s_m = arc_.s_at(k, t);
      }
      peak.edge = path_.segments[k].edge;
      peak.segment = k;
      r.segments[k].peak = peak;
      if (std::abs(peak.force_N) > overall) {
        overall = std::abs(peak.force_N);
        r.peak = peak;
      }
    }
  }
  for (std::size_t k = 0; k < path_.segments.size(); ++k) {
    SegmentWork& s = r.segments[k];
    const double start = arc_.segment_start_m(k), end = start + arc_.segment_length_m(k);
    s.length_m = std::max(0.0, std::min(to_m, end) - std::max(from_m, start));
    s.evaluations = per_segment_[k] - before_seg[k];
    r.work_J += s.work_J;
    r.error_J += s.error_J;
    r.abs_work_J += s.abs_work_J;
    r.length_m += s.length_m;
  }
  r.evaluations = evaluations_ - before;
  r.length_error_m = arc_.error_m();  // of the whole table: a bound for any window

  const double target = std::max(options_.rel_tol * r.abs_work_J, options_.abs_tol_J);
  if (field_.has_potential() && !path_.segments.empty()) {
    const PathLocation a = arc_.locate(from_m), b = arc_.locate(to_m);
    const double ua = field_.potential(to_field_ * a.position);
    const double ub = field_.potential(to_field_ * b.position);
    r.potential_drop_J = -(ub - ua);
    const double allowed =
        kCheckSafety * std::max(r.error_J, target) + kPotentialRoundoff * (std::abs(ua) + std::abs(ub));
    r.potential_mismatch = !(std::abs(r.work_J - *r.potential_drop_J) <= allowed);
  }
  if (r.closed && options_.assume_conservative) {
    r.loop_mismatch = !(std::abs(r.work_J) <= kCheckSafety * std::max(r.error_J, target));
  }
  return r;
}

}  // namespace detail

WorkResult compute_work(const Path& path, const FieldSpec& field, const IntegrationOptions& options) {
  detail::WorkIntegrator integrator(path, field, options);
  const double total = integrator.arc().total_m();
  const double from = options.window_from_m.value_or(0.0);
  const double to = options.window_to_m.value_or(total);
  const double slack = 1e-12 * total;
  if (!(from >= -slack && to <= total + slack && from <= to)) {
    std::ostringstream os;
    os.precision(12);
    os << "distance window [" << from << ", " << to << "] m must satisfy 0 <= from <= to <= " << total
       << " m (the path length)";
    throw Error(ErrorKind::BadOption, os.str());
  }
  return integrator.run(std::max(from, 0.0), std::min(to, total), options.find_peaks);
}

}  // namespace ergpath
