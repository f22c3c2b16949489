#include "arc_length.h"

#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/quadrature/gauss_kronrod.hpp>

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>

#include "error.h"

namespace ergpath {

namespace {

constexpr double kEps = std::numeric_limits<double>::epsilon();
// Sums of 15 positive products lose a few ulp; an estimate below this cannot be trusted or met.
constexpr double kRoundoff = 50 * kEps;
// locate() accepts distances this far (relative to the total) outside [0, L] and clamps them.
constexpr double kLocateSlack = 1e-12;
// Newton on s(t) stops at this relative residual (w.r.t. the total length): well inside the promised 1e-12.
constexpr double kNewtonResidual = 1e-15;
constexpr int kNewtonMaxIterations = 100;
// QUADPACK's qk15 constants (Piessens et al. 1983): err = resasc min(1, (200 |K - G| / resasc)^1.5).
constexpr double kQuadpackScale = 200.0;
constexpr double kQuadpackPower = 1.5;

std::string edge_text(const Segment& seg, double t, const Vec3& p) {
  std::ostringstream os;
  os.precision(12);
  os << "edge " << seg.edge << " at t=" << t << ", position (" << p.x << ", " << p.y << ", " << p.z
     << ") model units";
  return os.str();
}

double speed(const Segment& seg, double t, long& count) {
  Vec3 p, v;
  seg.curve->d1(t, p, v);
  ++count;
  const double sp = norm(v);
  if (!std::isfinite(sp) || !is_finite(p)) {
    throw Error(ErrorKind::NonFiniteField, "curve derivative is not finite on " + edge_text(seg, t, p));
  }
  return sp;
}

struct Estimate {
  double k = 0.0, err = 0.0;
};

Estimate kronrod(const Segment& seg, double a, double b, long& count) {
  using K = boost::math::quadrature::gauss_kronrod<double, 15>;
  using G = boost::math::quadrature::gauss<double, 7>;
  const auto& xk = K::abscissa();
  const auto& wk = K::weights();
  const auto& wg = G::weights();
  const double c = 0.5 * (a + b), h = 0.5 * (b - a);
  double k = 0.0, g = 0.0;
  double left[8], right[8];
  for (std::size_t i = 0; i < xk.size(); ++i) {
    left[i] = i == 0 ? speed(seg, c, count) : speed(seg, c - h * xk[i], count);
    right[i] = i == 0 ? 0.0 : speed(seg, c + h * xk[i], count);
    const double f = left[i] + right[i];
    k += wk[i] * f;
    // Boost lists Gauss-7 abscissae as every second Kronrod-15 abscissa, starting at the centre.
    if (i % 2 == 0) g += wg[i / 2] * f;
  }
  // QUADPACK qk15 scaling of |K - G| (Piessens et al. 1983), as in span_quadrature.cpp.
  double asc = wk[0] * std::abs(left[0] - 0.5 * k);
  for (std::size_t i = 1; i < xk.size(); ++i) {
    asc += wk[i] * (std::abs(left[i] - 0.5 * k) + std::abs(right[i] - 0.5 * k));
  }
  const double raw = h * std::abs(k - g), resasc = h * asc;
  double err = raw;
  if (resasc > 0.0 && raw > 0.0)
    err = resasc * std::min(1.0, std::pow(kQuadpackScale * raw / resasc, kQuadpackPower));
  return {h * k, std::max(err, kRoundoff * h * k)};
}

}  // namespace

ArcLength::ArcLength(const Path& path, double rel_tol) : path_(path) {
  if (!(rel_tol > 0.0)) throw Error(ErrorKind::BadOption, "arc-length tolerance must be positive");
  double start = 0.0;
  for (std::size_t k = 0; k < path_.segments.size(); ++k) {
    const Segment& seg = path_.segments[k];
    const Curve& c = *seg.curve;
    std::vector<double> knots{c.first()};
    for (double b : c.breaks()) {
      if (b > knots.back() && b < c.last()) knots.push_back(b);
    }
    knots.push_back(c.last());
    SegmentTable table;
    table.reversed = seg.reversed;
    table.t.push_back(knots.front());
    table.cum.push_back(0.0);
    double err = 0.0;
    for (std::size_t i = 0; i + 1 < knots.size(); ++i) {
      // Local adaptivity with a width-proportional share of the span's budget.
      const Estimate whole = kronrod(seg, knots[i], knots[i + 1], evaluations_);
      const double budget = rel_tol * whole.k;
      const double width = knots[i + 1] - knots[i];
      struct Job {
        double a, b;
        Estimate e;
      };
      std::vector<Job> stack{{knots[i], knots[i + 1], whole}};
      std::vector<Job> done;
      // A span whose speed is noisy at the level of the budget (or a sliver beside a knot) would otherwise
      // be bisected until every piece reaches double precision: cap the work per span and keep the
      // estimates of the unfinished pieces in the error.
      constexpr long kMaxSpanEvaluations = 200000;
      const long span_start = evaluations_;
      while (!stack.empty()) {
        Job j = stack.back();
        stack.pop_back();
        const double mid = 0.5 * (j.a + j.b);
        const bool splittable = mid > j.a && mid < j.b && evaluations_ - span_start < kMaxSpanEvaluations;
        if (j.e.err <= budget * (j.b - j.a) / width || !splittable) {
          done.push_back(j);
          continue;
        }
        // Right half pushed first so the left half is finished first: `done` stays ascending.
        stack.push_back({mid, j.b, kronrod(seg, mid, j.b, evaluations_)});
        stack.push_back({j.a, mid, kronrod(seg, j.a, mid, evaluations_)});
      }
      for (const Job& j : done) {
        table.t.push_back(j.b);
        table.cum.push_back(table.cum.back() + j.e.k);
        err += j.e.err;
      }
    }
    table.start_m = start;
    start += table.cum.back() * path_.length_unit_m;
    error_m_ += err * path_.length_unit_m;
    segments_.push_back(std::move(table));
  }
  total_m_ = start;
}

double ArcLength::segment_start_m(std::size_t k) const { return segments_.at(k).start_m; }
double ArcLength::segment_length_m(std::size_t k) const {
  return segments_.at(k).cum.back() * path_.length_unit_m;
}

double ArcLength::along_parameter(const SegmentTable& table, std::size_t k, double t) const {
  using G = boost::math::quadrature::gauss<double, 10>;
  t = std::min(std::max(t, table.t.front()), table.t.back());
  const auto it = std::upper_bound(table.t.begin(), table.t.end(), t);
  const std::size_t i = it == table.t.begin() ? 0 : static_cast<std::size_t>(it - table.t.begin()) - 1;
  if (i + 1 >= table.t.size()) return table.cum.back();
  const double a = table.t[i];
  if (t == a) return table.cum[i];
  const double c = 0.5 * (a + t), h = 0.5 * (t - a);
  const auto& x = G::abscissa();
  const auto& w = G::weights();
  const Segment& seg = path_.segments[k];
  double sum = 0.0;
  for (std::size_t n = 0; n < x.size(); ++n) {
    sum += w[n] * (x[n] == 0.0
                       ? speed(seg, c, evaluations_)
                       : speed(seg, c - h * x[n], evaluations_) + speed(seg, c + h * x[n], evaluations_));
  }
  return table.cum[i] + h * sum;
}

double ArcLength::s_at(std::size_t k, double t) const {
  const SegmentTable& table = segments_.at(k);
  const double along = along_parameter(table, k, t);
  const double travelled = table.reversed ? table.cum.back() - along : along;
  return table.start_m + travelled * path_.length_unit_m;
}

double ArcLength::t_at(std::size_t k, double s_m) const {
  const SegmentTable& table = segments_.at(k);
  const double len = table.cum.back();
  double travelled = std::min(std::max((s_m - table.start_m) / path_.length_unit_m, 0.0), len);
  const double target = table.reversed ? len - travelled : travelled;
  if (target <= 0.0) return table.t.front();
  if (target >= len) return table.t.back();
  // Piece holding the target length, then Newton inside its bracket.
  const auto it = std::upper_bound(table.cum.begin(), table.cum.end(), target);
  std::size_t i = static_cast<std::size_t>(it - table.cum.begin()) - 1;
  i = std::min(i, table.t.size() - 2);
  double lo = table.t[i], hi = table.t[i + 1];
  const double piece = table.cum[i + 1] - table.cum[i];
  double t = piece > 0.0 ? lo + (target - table.cum[i]) / piece * (hi - lo) : lo;
  const double stop = kNewtonResidual * std::max(len, std::numeric_limits<double>::min());
  const Segment& seg = path_.segments[k];
  for (int iter = 0; iter < kNewtonMaxIterations; ++iter) {
    const double g = along_parameter(table, k, t) - target;
    if (std::abs(g) <= stop) break;
    if (g < 0.0)
      lo = t;
    else
      hi = t;
    const double sp = speed(seg, t, evaluations_);
    double next = sp > 0.0 ? t - g / sp : lo - 1.0;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);  // bisection fallback
    if (next == t || hi - lo <= 2 * kEps * std::max(std::abs(lo), std::abs(hi))) {
      t = next;
      break;
    }
    t = next;
  }
  return t;
}

PathLocation ArcLength::locate(double s_m) const {
  const double slack = kLocateSlack * total_m_;
  if (!(s_m >= -slack && s_m <= total_m_ + slack) || segments_.empty()) {
    std::ostringstream os;
    os.precision(12);
    os << "distance " << s_m << " m lies outside the path, which is " << total_m_ << " m long";
    throw Error(ErrorKind::BadOption, os.str());
  }
  s_m = std::min(std::max(s_m, 0.0), total_m_);
  std::size_t k = 0;
  while (k + 1 < segments_.size() && s_m >= segments_[k + 1].start_m) ++k;
  PathLocation loc;
  loc.segment = k;
  loc.t = t_at(k, s_m);
  loc.edge = path_.segments[k].edge;
  Vec3 v;
  path_.segments[k].curve->d1(loc.t, loc.position, v);
  loc.s_m = s_at(k, loc.t);
  return loc;
}

}  // namespace ergpath
