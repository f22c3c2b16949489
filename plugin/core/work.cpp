#include "work.h"

#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/quadrature/gauss_kronrod.hpp>

#include <algorithm>
#include <cmath>
#include <limits>
#include <queue>
#include <sstream>

#include "error.h"

namespace ergpath {

namespace {

// Gauss-Kronrod 7/15 nodes and weights from Boost.Math (Kronrod 1965; Laurie 1997 for the computation).
using Kronrod15 = boost::math::quadrature::gauss_kronrod<double, 15>;
using Gauss7 = boost::math::quadrature::gauss<double, 7>;

struct Sample {
  double work = 0.0;     // F . dr/dt, J per unit t (total of all fields)
  double length = 0.0;   // |dr/dt| in metres per unit t
};

std::string where(const Segment& seg, double t, const Vec3& p) {
  std::ostringstream os;
  os.precision(12);
  os << "edge " << seg.edge << " at t=" << t << ", position (" << p.x << ", " << p.y << ", " << p.z
     << ") model units";
  return os.str();
}

class Integrand {
 public:
  Integrand(const Path& path, const FieldSpec& spec, FieldEvaluator& field)
      : path_(path), field_(field), forces_(field.count()),
        to_field_(path.length_unit_m / spec.length_unit_m) {}

  // Evaluates the integrand of segment `k` at parameter t; per-field work density goes to `per_field`.
  Sample operator()(std::size_t k, double t, double* per_field) {
    const Segment& seg = path_.segments[k];
    Vec3 p, v;
    seg.curve->d1(t, p, v);
    const double sigma = seg.reversed ? -1.0 : 1.0;
    const double speed = norm(v);
    if (!is_finite(p) || !std::isfinite(speed)) {
      throw Error(ErrorKind::NonFiniteField, "curve derivative is not finite on " + where(seg, t, p));
    }
    FieldPoint q;
    q.position = to_field_ * p;
    q.tangent = speed > 0.0 ? (sigma / speed) * v : Vec3{};
    field_.eval(q, forces_.data());
    Sample out;
    const Vec3 dr = (sigma * path_.length_unit_m) * v;  // metres per unit t, in travel direction
    for (std::size_t i = 0; i < forces_.size(); ++i) {
      if (!is_finite(forces_[i])) {
        throw Error(ErrorKind::NonFiniteField,
                    "field '" + field_.name(i) + "' is not finite on " + where(seg, t, p));
      }
      per_field[i] = dot(forces_[i], dr);
      out.work += per_field[i];
    }
    out.length = speed * path_.length_unit_m;
    ++evaluations_;
    return out;
  }

  long evaluations() const { return evaluations_; }

 private:
  const Path& path_;
  FieldEvaluator& field_;
  std::vector<Vec3> forces_;
  double to_field_;
  long evaluations_ = 0;
};

struct Interval {
  std::size_t segment = 0;
  double a = 0.0, b = 0.0;
  double work = 0.0, work_err = 0.0, abs_work = 0.0;
  double length = 0.0, length_err = 0.0;
  std::vector<double> fields;
  double priority = 0.0;
};

struct ByPriority {
  bool operator()(const Interval& l, const Interval& r) const { return l.priority < r.priority; }
};

// One Gauss-Kronrod 7/15 application on [a, b] of segment k.
Interval apply_rule(Integrand& f, std::size_t k, double a, double b, std::size_t nfields) {
  const auto& xk = Kronrod15::abscissa();
  const auto& wk = Kronrod15::weights();
  const auto& wg = Gauss7::weights();
  const double c = 0.5 * (a + b), h = 0.5 * (b - a);
  Interval out;
  out.segment = k;
  out.a = a;
  out.b = b;
  out.fields.assign(nfields, 0.0);
  std::vector<double> pf(nfields);
  double gw = 0.0, gl = 0.0;
  for (std::size_t i = 0; i < xk.size(); ++i) {
    const int signs = i == 0 ? 1 : 2;
    for (int side = 0; side < signs; ++side) {
      const double t = side == 0 ? c + h * xk[i] : c - h * xk[i];
      const Sample s = f(k, t, pf.data());
      out.work += wk[i] * s.work;
      out.abs_work += wk[i] * std::abs(s.work);
      out.length += wk[i] * s.length;
      for (std::size_t j = 0; j < nfields; ++j) out.fields[j] += wk[i] * pf[j];
      if (i % 2 == 0) {  // Gauss-7 nodes are the even-indexed Kronrod-15 nodes (0 is the centre)
        gw += wg[i / 2] * s.work;
        gl += wg[i / 2] * s.length;
      }
    }
  }
  out.work *= h;
  out.abs_work *= h;
  out.length *= h;
  for (double& v : out.fields) v *= h;
  gw *= h;
  gl *= h;
  constexpr double kRound = 50 * std::numeric_limits<double>::epsilon();
  out.work_err = std::max(std::abs(out.work - gw), kRound * out.abs_work);
  out.length_err = std::max(std::abs(out.length - gl), kRound * out.length);
  return out;
}

}  // namespace

WorkResult compute_work(const Path& path, const FieldSpec& spec, const IntegrationOptions& options) {
  if (!(options.rel_tol > 0.0) || !(options.abs_tol_J >= 0.0)) {
    throw Error(ErrorKind::BadOption, "tolerance must be positive");
  }
  FieldEvaluator field(spec);
  if (field.uses_arc_length()) {
    throw Error(ErrorKind::BadOption, "formulas that read s are not supported by this engine build");
  }
  Integrand f(path, spec, field);
  const std::size_t nf = field.count();

  std::priority_queue<Interval, std::vector<Interval>, ByPriority> queue;
  std::vector<Interval> initial;
  for (std::size_t k = 0; k < path.segments.size(); ++k) {
    const Curve& c = *path.segments[k].curve;
    std::vector<double> knots{c.first()};
    for (double b : c.breaks()) knots.push_back(b);
    knots.push_back(c.last());
    for (std::size_t i = 0; i + 1 < knots.size(); ++i) {
      if (knots[i + 1] > knots[i]) initial.push_back(apply_rule(f, k, knots[i], knots[i + 1], nf));
    }
  }

  auto totals = [&](const std::vector<Interval>& v, double& w, double& we, double& aw, double& l, double& le) {
    w = we = aw = l = le = 0.0;
    for (const Interval& i : v) {
      w += i.work;
      we += i.work_err;
      aw += i.abs_work;
      l += i.length;
      le += i.length_err;
    }
  };
  double w, we, aw, l, le;
  totals(initial, w, we, aw, l, le);
  auto tol_work = [&](double abs_work) { return std::max(options.rel_tol * abs_work, options.abs_tol_J); };
  auto tol_len = [&](double length) { return std::max(options.rel_tol * length, 1e-15); };
  for (Interval& i : initial) {
    i.priority = std::max(i.work_err / tol_work(aw), i.length_err / tol_len(l));
    queue.push(std::move(i));
  }

  Status status = Status::Converged;
  while (we > tol_work(aw) || le > tol_len(l)) {
    if (f.evaluations() >= options.max_evaluations || queue.empty()) {
      status = Status::ToleranceNotMet;
      break;
    }
    Interval worst = queue.top();
    queue.pop();
    const double mid = 0.5 * (worst.a + worst.b);
    if (!(mid > worst.a && mid < worst.b)) {  // interval exhausted at double precision
      status = Status::ToleranceNotMet;
      queue.push(std::move(worst));
      break;
    }
    Interval left = apply_rule(f, worst.segment, worst.a, mid, nf);
    Interval right = apply_rule(f, worst.segment, mid, worst.b, nf);
    w += left.work + right.work - worst.work;
    we += left.work_err + right.work_err - worst.work_err;
    aw += left.abs_work + right.abs_work - worst.abs_work;
    l += left.length + right.length - worst.length;
    le += left.length_err + right.length_err - worst.length_err;
    for (Interval* i : {&left, &right}) {
      i->priority = std::max(i->work_err / tol_work(aw), i->length_err / tol_len(l));
      queue.push(std::move(*i));
    }
  }

  WorkResult r;
  r.status = status;
  r.closed = path.closed;
  r.evaluations = f.evaluations();
  r.segments.resize(path.segments.size());
  for (std::size_t k = 0; k < path.segments.size(); ++k) {
    SegmentWork& s = r.segments[k];
    s.edge = path.segments[k].edge;
    s.reversed = path.segments[k].reversed;
    s.name = path.segments[k].name;
    for (std::size_t j = 0; j < nf; ++j) s.fields.push_back({field.name(j), 0.0});
  }
  for (std::size_t j = 0; j < nf; ++j) r.fields.push_back({field.name(j), 0.0});
  while (!queue.empty()) {
    const Interval& i = queue.top();
    SegmentWork& s = r.segments[i.segment];
    s.work_J += i.work;
    s.error_J += i.work_err;
    s.abs_work_J += i.abs_work;
    s.length_m += i.length;
    for (std::size_t j = 0; j < nf; ++j) {
      s.fields[j].work_J += i.fields[j];
      r.fields[j].work_J += i.fields[j];
    }
    r.length_error_m += i.length_err;
    queue.pop();
  }
  for (const SegmentWork& s : r.segments) {
    r.work_J += s.work_J;
    r.error_J += s.error_J;
    r.abs_work_J += s.abs_work_J;
    r.length_m += s.length_m;
  }
  return r;
}

}  // namespace ergpath
