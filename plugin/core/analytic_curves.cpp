#include "analytic_curves.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "error.h"

namespace ergpath {

LineCurve::LineCurve(Vec3 a, Vec3 b) : a_(a), b_(b) {}

void LineCurve::d1(double t, Vec3& p, Vec3& v) const {
  v = b_ - a_;
  p = a_ + t * v;
}

CurveStructure LineCurve::structure() const {
  CurveStructure s;
  s.type = CurveType::Line;
  s.polynomial = true;
  s.degree = 1;
  return s;
}

EllipseCurve::EllipseCurve(Vec3 centre, double a, double b, double t0, double t1)
    : c_(centre), a_(a), b_(b), t0_(t0), t1_(t1) {
  if (!(a > 0.0 && b > 0.0 && t1 > t0)) {
    throw Error(ErrorKind::BadOption, "ellipse needs positive semi-axes and t1 > t0");
  }
}

void EllipseCurve::d1(double t, Vec3& p, Vec3& v) const {
  const double c = std::cos(t), s = std::sin(t);
  p = {c_.x + a_ * c, c_.y + b_ * s, c_.z};
  v = {-a_ * s, b_ * c, 0.0};
}

CurveStructure EllipseCurve::structure() const {
  CurveStructure s;
  s.type = a_ == b_ ? CurveType::Circle : CurveType::Ellipse;
  // Four ulp of 2 pi: a span typed as 2*pi or computed as t0 + 2*pi still counts as a whole turn.
  constexpr double kTurnSlack = 4 * std::numeric_limits<double>::epsilon() * 2 * M_PI;
  s.full_period = std::abs((t1_ - t0_) - 2 * M_PI) <= kTurnSlack;
  return s;
}

BezierCurve::BezierCurve(std::vector<Vec3> poles) : poles_(std::move(poles)) {
  if (poles_.size() < 2) throw Error(ErrorKind::BadOption, "a Bezier curve needs at least two poles");
}

void BezierCurve::d1(double t, Vec3& p, Vec3& v) const {
  // de Casteljau down to two points: their difference times n is the derivative.
  std::vector<Vec3> q = poles_;
  const std::size_t n = q.size() - 1;
  for (std::size_t level = n; level > 1; --level) {
    for (std::size_t i = 0; i < level; ++i) q[i] = (1.0 - t) * q[i] + t * q[i + 1];
  }
  p = (1.0 - t) * q[0] + t * q[1];
  v = static_cast<double>(n) * (q[1] - q[0]);
}

CurveStructure BezierCurve::structure() const {
  CurveStructure s;
  s.type = CurveType::Bezier;
  s.polynomial = true;
  s.degree = static_cast<int>(poles_.size()) - 1;
  return s;
}

NurbsCurve::NurbsCurve(int degree, std::vector<double> knots, std::vector<Vec3> poles,
                       std::vector<double> weights)
    : p_(degree), knots_(std::move(knots)), poles_(std::move(poles)), weights_(std::move(weights)) {
  const std::size_t n = poles_.size();
  if (p_ < 1 || n < static_cast<std::size_t>(p_) + 1 || knots_.size() != n + p_ + 1 || weights_.size() != n ||
      !std::is_sorted(knots_.begin(), knots_.end()) ||
      std::any_of(weights_.begin(), weights_.end(), [](double w) { return !(w > 0.0); })) {
    throw Error(ErrorKind::BadOption, "NURBS curve: inconsistent degree, knots, poles or weights");
  }
}

double NurbsCurve::first() const { return knots_[p_]; }
double NurbsCurve::last() const { return knots_[knots_.size() - 1 - p_]; }

void NurbsCurve::d1(double t, Vec3& p, Vec3& v) const {
  const int n = static_cast<int>(poles_.size()) - 1;
  // Knot span (Piegl & Tiller A2.1), the last span closed on the right.
  int span = n;
  if (t < knots_[n + 1]) {
    span =
        static_cast<int>(std::upper_bound(knots_.begin() + p_, knots_.begin() + n + 1, t) - knots_.begin()) -
        1;
  }
  // Basis functions and first derivatives (Piegl & Tiller A2.3 with n = 1).
  std::vector<std::vector<double>> ndu(p_ + 1, std::vector<double>(p_ + 1, 0.0));
  std::vector<double> left(p_ + 1), right(p_ + 1);
  ndu[0][0] = 1.0;
  for (int j = 1; j <= p_; ++j) {
    left[j] = t - knots_[span + 1 - j];
    right[j] = knots_[span + j] - t;
    double saved = 0.0;
    for (int r = 0; r < j; ++r) {
      ndu[j][r] = right[r + 1] + left[j - r];
      const double temp = ndu[r][j - 1] / ndu[j][r];
      ndu[r][j] = saved + right[r + 1] * temp;
      saved = left[j - r] * temp;
    }
    ndu[j][j] = saved;
  }
  std::vector<double> basis(p_ + 1), deriv(p_ + 1);
  for (int r = 0; r <= p_; ++r) {
    basis[r] = ndu[r][p_];
    // First derivative: p * (N_{r-1,p-1} / (u_{i+p} - u_i) - N_{r,p-1} / (u_{i+p+1} - u_{i+1})).
    double d = 0.0;
    if (r >= 1) d += ndu[r - 1][p_ - 1] / ndu[p_][r - 1];
    if (r <= p_ - 1) d -= ndu[r][p_ - 1] / ndu[p_][r];
    deriv[r] = p_ * d;
  }
  // Rational: C = A / w, C' = (A' - w' C) / w (Piegl & Tiller eq. 4.8).
  Vec3 a, da;
  double w = 0.0, dw = 0.0;
  for (int r = 0; r <= p_; ++r) {
    const int i = span - p_ + r;
    const double wi = weights_[i];
    a += (basis[r] * wi) * poles_[i];
    da += (deriv[r] * wi) * poles_[i];
    w += basis[r] * wi;
    dw += deriv[r] * wi;
  }
  p = (1.0 / w) * a;
  v = (1.0 / w) * (da - dw * p);
}

std::vector<double> NurbsCurve::breaks() const {
  std::vector<double> out;
  const double lo = first(), hi = last();
  for (double k : knots_) {
    if (k > lo && k < hi && (out.empty() || k > out.back())) out.push_back(k);
  }
  return out;
}

CurveStructure NurbsCurve::structure() const {
  CurveStructure s;
  s.type = CurveType::BSpline;
  s.degree = p_;
  const bool uniform_weights =
      std::all_of(weights_.begin(), weights_.end(), [&](double w) { return w == weights_.front(); });
  s.polynomial = uniform_weights;
  s.rational = !uniform_weights;
  return s;
}

NurbsCurve nurbs_circle(Vec3 c, double r) {
  const double w = std::sqrt(0.5);
  std::vector<Vec3> poles{{c.x + r, c.y, c.z},     {c.x + r, c.y + r, c.z}, {c.x, c.y + r, c.z},
                          {c.x - r, c.y + r, c.z}, {c.x - r, c.y, c.z},     {c.x - r, c.y - r, c.z},
                          {c.x, c.y - r, c.z},     {c.x + r, c.y - r, c.z}, {c.x + r, c.y, c.z}};
  std::vector<double> weights{1, w, 1, w, 1, w, 1, w, 1};
  std::vector<double> knots{0, 0, 0, 0.25, 0.25, 0.5, 0.5, 0.75, 0.75, 1, 1, 1};
  return NurbsCurve(2, knots, poles, weights);
}

TwistedCubicCurve::TwistedCubicCurve(double scale, double t0, double t1) : scale_(scale), t0_(t0), t1_(t1) {
  if (!(t1 > t0)) throw Error(ErrorKind::BadOption, "twisted cubic needs t1 > t0");
}

void TwistedCubicCurve::d1(double t, Vec3& p, Vec3& v) const {
  p = scale_ * Vec3{t, t * t, t * t * t};
  v = scale_ * Vec3{1.0, 2.0 * t, 3.0 * t * t};
}

CurveStructure TwistedCubicCurve::structure() const {
  CurveStructure s;
  s.type = CurveType::Other;
  s.polynomial = true;
  s.degree = 3;
  return s;
}

AffineReparametrizedCurve::AffineReparametrizedCurve(std::shared_ptr<const Curve> inner, double alpha,
                                                     double beta)
    : inner_(std::move(inner)), alpha_(alpha), beta_(beta) {
  if (!inner_ || !(alpha > 0.0)) throw Error(ErrorKind::BadOption, "reparametrization needs alpha > 0");
}

double AffineReparametrizedCurve::first() const { return (inner_->first() - beta_) / alpha_; }
double AffineReparametrizedCurve::last() const { return (inner_->last() - beta_) / alpha_; }

void AffineReparametrizedCurve::d1(double u, Vec3& p, Vec3& v) const {
  inner_->d1(alpha_ * u + beta_, p, v);
  v = alpha_ * v;
}

std::vector<double> AffineReparametrizedCurve::breaks() const {
  std::vector<double> out;
  for (double b : inner_->breaks()) out.push_back((b - beta_) / alpha_);
  return out;
}

CurveStructure AffineReparametrizedCurve::structure() const {
  CurveStructure s = inner_->structure();
  return s;
}

std::unique_ptr<Curve> AffineReparametrizedCurve::clone() const {
  return std::make_unique<AffineReparametrizedCurve>(std::shared_ptr<const Curve>(inner_->clone()), alpha_,
                                                     beta_);
}

}  // namespace ergpath
