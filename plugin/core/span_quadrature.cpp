#include "span_quadrature.h"

#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <boost/math/tools/minima.hpp>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <queue>

namespace ergpath::detail {

namespace {

constexpr double kEps = std::numeric_limits<double>::epsilon();
// Summing ~15 products per piece and a few hundred pieces loses a few dozen ulp of the absolute integral:
// an error estimate below this floor would claim more than double precision can hold.
constexpr double kRoundoff = 50 * kEps;
// A peak counts as sharp when its half-width is below this fraction of the span: wider features are
// resolved by plain bisection at no extra cost.
constexpr double kSharpFraction = 1.0 / 64.0;
// Only spans whose first estimate misses the target by this factor are searched for a peak: a span
// that is nearly resolved is not worth the ~50 evaluations of the search.
constexpr double kPeakSearchRatio = 100.0;
// QUADPACK QK15 scaling of |K - G| (Piessens et al. 1983, qk15): err = resasc min(1, (200 |K - G| /
// resasc)^1.5), resasc = integral of |f - mean f|. The constants are QUADPACK's, calibrated there.
constexpr double kQuadpackScale = 200.0;
constexpr double kQuadpackPower = 1.5;
// Bisection of a piece compares the parent's Kronrod value with the sum of its children's: that
// difference bounds the parent's error and, once the rule is in its asymptotic regime, exceeds the
// children's error by a factor ~2^24 (degree 23). It replaces the children's own estimate only when
// their |K - G| has dropped by at least this factor against the parent's, i.e. the rule is converging
// like a smooth integrand's (a kink or a jump only drops it by 1/4 or 1/2 per bisection).
constexpr double kAsymptoticDrop = 1.0 / 64.0;
// Trapezoid rule on a periodic span: start and give-up node counts. 1024 nodes resolve a smooth
// periodic integrand whose nearest complex singularity is at least ~0.03 from the real axis.
constexpr int kTrapezoidStart = 8;
constexpr int kTrapezoidMax = 1024;
// The trapezoid error model needs successive differences shrinking at least this fast to be trusted.
constexpr double kTrapezoidRate = 0.25;
// Brent's minimizer works to 2^(1 - bits) relative in t; 2^-23 places a peak far inside its half-width.
constexpr int kBrentBits = 24;
constexpr std::uintmax_t kBrentMaxIterations = 80;

struct Node {
  double x, wk, wg;  // abscissa on [-1, 1], Kronrod weight, Gauss weight (0 for Kronrod-only nodes)
};

const std::vector<Node>& kronrod_nodes() {
  static const std::vector<Node> nodes = [] {
    using K = boost::math::quadrature::gauss_kronrod<double, 15>;
    using G = boost::math::quadrature::gauss<double, 7>;
    std::vector<Node> out;
    const auto& xk = K::abscissa();
    const auto& wk = K::weights();
    const auto& xg = G::abscissa();
    const auto& wg = G::weights();
    for (std::size_t i = 0; i < xk.size(); ++i) {
      double g = 0.0;
      for (std::size_t j = 0; j < xg.size(); ++j) {
        if (std::abs(xg[j] - xk[i]) < 1e-14) g = wg[j];
      }
      out.push_back({xk[i], wk[i], g});
      if (xk[i] != 0.0) out.push_back({-xk[i], wk[i], g});
    }
    std::sort(out.begin(), out.end(), [](const Node& a, const Node& b) { return a.x < b.x; });
    return out;
  }();
  return nodes;
}

const std::vector<Node>& gauss12_nodes() {
  static const std::vector<Node> nodes = [] {
    using G = boost::math::quadrature::gauss<double, 12>;
    std::vector<Node> out;
    for (std::size_t i = 0; i < G::abscissa().size(); ++i) {
      const double x = G::abscissa()[i], w = G::weights()[i];
      out.push_back({x, 0.0, w});
      if (x != 0.0) out.push_back({-x, 0.0, w});
    }
    return out;
  }();
  return nodes;
}

// Piece variable v and curve parameter t: t = v, or t = c + d sinh(v) around a near-singular spot.
struct Map {
  bool sinh = false;
  double c = 0.0, d = 1.0;
  double t(double v) const { return sinh ? c + d * std::sinh(v) : v; }
  double jacobian(double v) const { return sinh ? d * std::cosh(v) : 1.0; }
};

struct Cell {
  std::size_t span = 0;
  Map map;
  double va = 0.0, vb = 0.0;
  std::vector<double> value, error;
  double best_t = 0.0, best_lo = 0.0, best_hi = 0.0, best_tangential = 0.0;
  double mag_t = 0.0, mag_lo = 0.0, mag_hi = 0.0, mag = -1.0;
  std::vector<double> absk;  // Kronrod integral of |f|: the round-off scale
  std::vector<double> raw;   // |K - G| per component: the unscaled Gauss error, for the two-level test
  bool refinable = true;
  bool alive = true;
  bool exactness_pending = false;  // polynomial span whose Gauss-12 exactness test has not run yet
};

class Driver {
 public:
  Driver(const std::vector<Span>& spans, std::size_t m, const std::vector<Control>& controls,
         const Integrand& f, const QuadratureOptions& o)
      : spans_(spans), m_(m), controls_(controls), f_(f), o_(o), buf_(m) {}

  QuadratureResult run();

 private:
  double clamp_t(const Span& s, double t) const { return std::min(std::max(t, s.a), s.b); }
  // Integrand in the piece variable v (times the map's Jacobian); returns the curve parameter used.
  double eval(const Cell& c, double v, double* out, NodeInfo& info) {
    const Span& s = spans_[c.span];
    const double t = clamp_t(s, c.map.t(v));
    f_(s, t, out, info);
    const double j = c.map.jacobian(v);
    for (std::size_t i = 0; i < m_; ++i) out[i] *= j;
    ++evaluations_;
    return t;
  }
  double magnitude_at(const Span& s, double t) {
    NodeInfo info;
    f_(s, t, buf_.data(), info);
    ++evaluations_;
    return info.magnitude;
  }
  void kronrod(Cell& c);
  bool exact_polynomial(Cell& c);
  void sharpen(const Cell& parent, Cell& left, Cell& right) const;
  bool trapezoid(Cell& c);
  bool split_at_peak(const Cell& c, std::vector<Cell>& out);
  double tolerance(std::size_t k) const {
    return std::max(o_.rel_tol * std::abs(total_[controls_[k].scale]), controls_[k].floor);
  }
  double priority(const Cell& c) const {
    double p = 0.0;
    for (std::size_t k = 0; k < controls_.size(); ++k) {
      const double tol = tolerance(k);
      const double e = c.error[controls_[k].value];
      p = std::max(p, tol > 0.0 ? e / tol : (e > 0.0 ? std::numeric_limits<double>::infinity() : 0.0));
    }
    return p;
  }
  bool met() const {
    for (std::size_t k = 0; k < controls_.size(); ++k) {
      if (total_error_[controls_[k].value] > tolerance(k)) return false;
    }
    return true;
  }
  void add(const Cell& c, double sign) {
    for (std::size_t i = 0; i < m_; ++i) {
      total_[i] += sign * c.value[i];
      total_error_[i] += sign * c.error[i];
    }
  }

  const std::vector<Span>& spans_;
  std::size_t m_;
  const std::vector<Control>& controls_;
  const Integrand& f_;
  QuadratureOptions o_;
  std::vector<double> buf_;
  std::vector<double> total_, total_error_;
  std::vector<double> k_, g_, absk_, asc_, t_of_, tan_, mag_, f_values_;
  long evaluations_ = 0;
};

void Driver::kronrod(Cell& c) {
  const auto& nodes = kronrod_nodes();
  const std::size_t n = nodes.size();
  const double mid = 0.5 * (c.va + c.vb), h = 0.5 * (c.vb - c.va);
  // Scratch buffers live in the driver: a few thousand pieces must not mean a few thousand allocations.
  std::vector<double>& k = k_;
  std::vector<double>& g = g_;
  std::vector<double>& absk = absk_;
  std::vector<double>& asc = asc_;
  std::vector<double>& t_of = t_of_;
  std::vector<double>& tan = tan_;
  std::vector<double>& mag = mag_;
  std::vector<double>& f = f_values_;
  k.assign(m_, 0.0);
  g.assign(m_, 0.0);
  absk.assign(m_, 0.0);
  asc.assign(m_, 0.0);
  t_of.resize(n);
  tan.resize(n);
  mag.resize(n);
  f.resize(n * m_);
  for (std::size_t i = 0; i < n; ++i) {
    NodeInfo info;
    t_of[i] = eval(c, mid + h * nodes[i].x, &f[i * m_], info);
    tan[i] = info.tangential;
    mag[i] = info.magnitude;
    for (std::size_t j = 0; j < m_; ++j) {
      const double y = f[i * m_ + j];
      k[j] += nodes[i].wk * y;
      absk[j] += nodes[i].wk * std::abs(y);
      g[j] += nodes[i].wg * y;
    }
  }
  // resasc: Kronrod integral of |f - mean|, the mean being K / 2 on [-1, 1].
  for (std::size_t i = 0; i < n; ++i) {
    for (std::size_t j = 0; j < m_; ++j) asc[j] += nodes[i].wk * std::abs(f[i * m_ + j] - 0.5 * k[j]);
  }
  c.value.assign(m_, 0.0);
  c.error.assign(m_, 0.0);
  c.raw.assign(m_, 0.0);
  c.absk.assign(m_, 0.0);
  for (std::size_t j = 0; j < m_; ++j) {
    c.value[j] = h * k[j];
    c.absk[j] = std::abs(h) * absk[j];
    const double raw = std::abs(h * (k[j] - g[j]));
    const double resasc = std::abs(h) * asc[j];
    double err = raw;
    if (resasc > 0.0 && raw > 0.0)
      err = resasc * std::min(1.0, std::pow(kQuadpackScale * raw / resasc, kQuadpackPower));
    c.raw[j] = raw;
    c.error[j] = std::max(err, kRoundoff * c.absk[j]);
  }
  const Span& s = spans_[c.span];
  const double ta = clamp_t(s, c.map.t(c.va)), tb = clamp_t(s, c.map.t(c.vb));
  auto bracket = [&](std::size_t i, double& lo, double& hi) {
    lo = i == 0 ? ta : t_of[i - 1];
    hi = i + 1 == n ? tb : t_of[i + 1];
  };
  std::size_t bt = 0, bm = 0;
  for (std::size_t i = 1; i < n; ++i) {
    if (std::abs(tan[i]) > std::abs(tan[bt])) bt = i;
    if (mag[i] > mag[bm]) bm = i;
  }
  c.best_t = t_of[bt];
  c.best_tangential = tan[bt];
  bracket(bt, c.best_lo, c.best_hi);
  c.mag_t = t_of[bm];
  c.mag = mag[bm];
  bracket(bm, c.mag_lo, c.mag_hi);
}

bool Driver::exact_polynomial(Cell& c) {
  // Kronrod-15 and Gauss-12 are both exact to degree 23 but share no node: agreement to round-off means
  // the integrand is (to double precision) a polynomial of degree <= 23 on the piece.
  const double mid = 0.5 * (c.va + c.vb), h = 0.5 * (c.vb - c.va);
  std::vector<double> q(m_, 0.0);
  for (const Node& node : gauss12_nodes()) {
    NodeInfo info;
    eval(c, mid + h * node.x, buf_.data(), info);
    for (std::size_t j = 0; j < m_; ++j) q[j] += node.wg * buf_[j];
  }
  // Only the controlled components must agree: a scale component such as |F . dr| has kinks where
  // F . dr changes sign and need not be a polynomial; it keeps its Kronrod estimate.
  std::vector<double> e = c.error;
  for (const Control& k : controls_) {
    const std::size_t j = k.value;
    const double floor = kRoundoff * c.absk[j];
    if (std::abs(c.value[j] - h * q[j]) > floor) return false;
    e[j] = floor;
  }
  c.error = e;
  c.refinable = false;
  return true;
}

void Driver::sharpen(const Cell& parent, Cell& left, Cell& right) const {
  for (std::size_t j = 0; j < m_; ++j) {
    const double own = left.error[j] + right.error[j];
    if (!(left.raw[j] + right.raw[j] <= kAsymptoticDrop * parent.raw[j])) continue;
    const double d = std::abs(parent.value[j] - (left.value[j] + right.value[j]));
    if (!(d < own)) continue;
    // Share the two-level estimate in proportion to the children's own estimates.
    const double scale = own > 0.0 ? d / own : 0.0;
    left.error[j] = std::max(left.error[j] * scale, kRoundoff * left.absk[j]);
    right.error[j] = std::max(right.error[j] * scale, kRoundoff * right.absk[j]);
  }
}

bool Driver::trapezoid(Cell& c) {
  const Span& s = spans_[c.span];
  const double w = s.b - s.a;
  std::vector<double> sum(m_, 0.0), abs_sum(m_, 0.0), prev(m_, 0.0), prev_diff(m_, -1.0), diff(m_, 0.0);
  double best_abs = -1.0;
  auto visit = [&](double t) {
    NodeInfo info;
    f_(s, t, buf_.data(), info);
    ++evaluations_;
    for (std::size_t j = 0; j < m_; ++j) {
      sum[j] += buf_[j];
      abs_sum[j] += std::abs(buf_[j]);
    }
    if (std::abs(info.tangential) > best_abs) {
      best_abs = std::abs(info.tangential);
      c.best_t = t;
      c.best_tangential = info.tangential;
    }
  };
  int n = kTrapezoidStart;
  for (int i = 0; i < n; ++i) visit(s.a + w * i / n);
  for (std::size_t j = 0; j < m_; ++j) prev[j] = w / n * sum[j];
  c.value.assign(m_, 0.0);
  c.error.assign(m_, 0.0);
  for (int level = 1; n < kTrapezoidMax; ++level) {
    for (int i = 0; i < n; ++i) visit(s.a + w * (i + 0.5) / n);
    n *= 2;
    bool ok = level >= 2;  // two differences before a convergence rate exists
    for (std::size_t j = 0; j < m_; ++j) {
      const double now = w / n * sum[j];
      diff[j] = std::abs(now - prev[j]);
      const double floor = kRoundoff * w / n * abs_sum[j];
      // Geometric convergence in n, err(n) ~ C rho^-n: the difference to the previous sum is about the
      // previous error, q = diff / previous diff is rho^(-n/4) and the newest sum's error is about
      // diff q^2. The model's prefactor is not exact (measured within 3x on the 3:1 ellipse), so
      // diff q^1.5 is reported: a margin q^-0.5 >= 2 over the model.
      double e = diff[j];
      if (prev_diff[j] >= 0.0 && diff[j] <= floor) {
        e = floor;  // two levels agree to round-off
      } else if (prev_diff[j] > 0.0 && diff[j] <= kTrapezoidRate * prev_diff[j]) {
        e = diff[j] * std::pow(diff[j] / prev_diff[j], 1.5);
      }
      c.value[j] = now;
      c.error[j] = std::max(e, floor);
      prev[j] = now;
      prev_diff[j] = diff[j];
    }
    for (const Control& k : controls_) {
      const double tol = std::max(o_.rel_tol * std::abs(c.value[k.scale]), k.floor);
      if (c.error[k.value] > tol) ok = false;
    }
    if (ok) {
      const double h = w / n;
      c.best_lo = std::max(s.a, c.best_t - h);
      c.best_hi = std::min(s.b, c.best_t + h);
      c.refinable = false;
      return true;
    }
  }
  return false;
}

bool Driver::split_at_peak(const Cell& c, std::vector<Cell>& out) {
  const Span& s = spans_[c.span];
  const double w = s.b - s.a;
  const double t_star = maximize_abs([&](double t) { return magnitude_at(s, t); }, c.mag_lo, c.mag_hi);
  const double m_star = magnitude_at(s, t_star);
  if (!(m_star > 0.0) || !std::isfinite(m_star)) return false;
  // Half-width of the peak: the largest w 2^-k at which the magnitude is still above half its maximum.
  double d = w;
  for (double side : {-1.0, 1.0}) {
    for (int k = 1; k < 52; ++k) {
      const double u = std::ldexp(w, -k);
      const double t = t_star + side * u;
      if (t < s.a || t > s.b) continue;
      if (magnitude_at(s, t) >= 0.5 * m_star) {
        d = std::min(d, u);
        break;
      }
    }
  }
  if (d > kSharpFraction * w) return false;
  Cell base;
  base.span = c.span;
  base.map = {true, t_star, d};
  if (t_star > s.a) {
    Cell left = base;
    left.va = std::asinh((s.a - t_star) / d);
    left.vb = 0.0;
    out.push_back(left);
  }
  if (t_star < s.b) {
    Cell right = base;
    right.va = 0.0;
    right.vb = std::asinh((s.b - t_star) / d);
    out.push_back(right);
  }
  return true;
}

QuadratureResult Driver::run() {
  total_.assign(m_, 0.0);
  total_error_.assign(m_, 0.0);
  std::vector<Cell> cells;
  std::vector<std::size_t> fresh;  // cells of the first pass, before any refinement
  for (std::size_t i = 0; i < spans_.size(); ++i) {
    const Span& s = spans_[i];
    Cell c;
    c.span = i;
    c.va = s.a;
    c.vb = s.b;
    if (s.periodic && trapezoid(c)) {
      cells.push_back(c);
      add(c, 1.0);
      continue;
    }
    kronrod(c);
    c.exactness_pending = s.polynomial;
    cells.push_back(c);
    add(c, 1.0);
    fresh.push_back(cells.size() - 1);
  }
  if (o_.split_at_peaks) {
    for (std::size_t idx : fresh) {
      if (priority(cells[idx]) < kPeakSearchRatio) continue;
      if (cells[idx].exactness_pending) {
        // A polynomial span is proven exact for 12 evaluations, cheaper than a peak search.
        cells[idx].exactness_pending = false;
        add(cells[idx], -1.0);
        const bool exact = exact_polynomial(cells[idx]);
        add(cells[idx], 1.0);
        if (exact) continue;
      }
      std::vector<Cell> parts;
      if (!split_at_peak(cells[idx], parts)) continue;
      add(cells[idx], -1.0);
      cells[idx].alive = false;
      for (Cell& p : parts) {
        kronrod(p);
        add(p, 1.0);
        cells.push_back(p);
      }
    }
  }
  using Entry = std::pair<double, std::size_t>;
  std::priority_queue<Entry> queue;
  for (std::size_t i = 0; i < cells.size(); ++i) {
    if (cells[i].alive && cells[i].refinable) queue.push({priority(cells[i]), i});
  }
  bool converged = true;
  while (!met()) {
    if (queue.empty() || evaluations_ >= o_.max_evaluations) {
      converged = false;
      break;
    }
    const std::size_t idx = queue.top().second;
    queue.pop();
    if (cells[idx].exactness_pending) {
      // A polynomial span that misses its share: 12 evaluations may prove it exact before bisection.
      cells[idx].exactness_pending = false;
      add(cells[idx], -1.0);
      const bool exact = exact_polynomial(cells[idx]);
      add(cells[idx], 1.0);
      if (exact) continue;
      queue.push({priority(cells[idx]), idx});
      continue;
    }
    const Cell parent = cells[idx];
    const double vm = 0.5 * (parent.va + parent.vb);
    const Span& s = spans_[parent.span];
    const double tm = parent.map.t(vm);
    if (!(vm > parent.va && vm < parent.vb) || !(tm > s.a && tm < s.b) ||
        std::abs(parent.map.t(parent.vb) - parent.map.t(parent.va)) <=
            8 * kEps * std::max(std::abs(s.a), std::abs(s.b))) {
      converged = false;  // the worst piece cannot be split further in double precision
      break;
    }
    add(parent, -1.0);
    cells[idx].alive = false;
    Cell half[2];
    for (int side = 0; side < 2; ++side) {
      Cell& child = half[side];
      child.span = parent.span;
      child.map = parent.map;
      child.va = side == 0 ? parent.va : vm;
      child.vb = side == 0 ? vm : parent.vb;
      kronrod(child);
    }
    sharpen(parent, half[0], half[1]);
    for (Cell& child : half) {
      add(child, 1.0);
      cells.push_back(child);
      queue.push({priority(cells.back()), cells.size() - 1});
    }
  }

  QuadratureResult r;
  r.value.assign(m_, 0.0);
  r.error.assign(m_, 0.0);
  for (const Cell& c : cells) {
    if (!c.alive) continue;
    const Span& s = spans_[c.span];
    Piece p;
    p.span = c.span;
    p.a = c.map.sinh ? clamp_t(s, c.map.t(c.va)) : c.va;
    p.b = c.map.sinh ? clamp_t(s, c.map.t(c.vb)) : c.vb;
    p.value = c.value;
    p.error = c.error;
    p.best_t = c.best_t;
    p.best_lo = c.best_lo;
    p.best_hi = c.best_hi;
    p.best_tangential = c.best_tangential;
    for (std::size_t j = 0; j < m_; ++j) {
      r.value[j] += c.value[j];
      r.error[j] += c.error[j];
    }
    r.pieces.push_back(std::move(p));
  }
  std::sort(r.pieces.begin(), r.pieces.end(),
            [](const Piece& x, const Piece& y) { return x.span != y.span ? x.span < y.span : x.a < y.a; });
  r.evaluations = evaluations_;
  r.converged = converged;
  return r;
}

}  // namespace

QuadratureResult integrate_spans(const std::vector<Span>& spans, std::size_t components,
                                 const std::vector<Control>& controls, const Integrand& f,
                                 const QuadratureOptions& options) {
  Driver d(spans, components, controls, f, options);
  return d.run();
}

double maximize_abs(const std::function<double(double)>& g, double lo, double hi) {
  if (!(hi > lo)) return lo;
  std::uintmax_t iterations = kBrentMaxIterations;
  const auto best = boost::math::tools::brent_find_minima([&](double t) { return -std::abs(g(t)); }, lo, hi,
                                                          kBrentBits, iterations);
  // Brent never evaluates the bracket ends; a monotone |g| peaks there.
  double t = best.first, v = -best.second;
  for (double e : {lo, hi}) {
    const double ve = std::abs(g(e));
    if (ve > v) {
      v = ve;
      t = e;
    }
  }
  return t;
}

}  // namespace ergpath::detail
