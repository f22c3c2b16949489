// Kernel-free curves with closed forms: lines, circular and elliptic arcs, Bezier and NURBS curves,
// the twisted cubic, and an affine reparametrization wrapper.
//
// They serve as test and demo geometry, and as exact references for the engine (no CAD kernel needed).
// Every position is in the model length unit of the path that holds the curve; the caller chooses it.
// NURBS evaluation follows Piegl & Tiller, The NURBS Book, 2nd ed. (1997): basis functions and their
// derivatives by algorithm A2.3, rational derivatives by eq. (4.8); the circle of example 7.1 / fig. 7.15.
#pragma once

#include <memory>
#include <vector>

#include "curve.h"

namespace ergpath {

/// Straight segment r(t) = a + t (b - a), t in [0, 1].
class LineCurve : public Curve {
 public:
  LineCurve(Vec3 a, Vec3 b);
  double first() const override { return 0.0; }
  double last() const override { return 1.0; }
  void d1(double t, Vec3& p, Vec3& v) const override;
  CurveStructure structure() const override;
  std::unique_ptr<Curve> clone() const override { return std::make_unique<LineCurve>(*this); }

 private:
  Vec3 a_, b_;
};

/// Ellipse arc in the plane z = centre.z: r(t) = centre + (a cos t, b sin t, 0), t in [t0, t1] (radians).
/// A circle is a = b. A span of exactly 2 pi (to 4 ulp) is reported as full_period.
class EllipseCurve : public Curve {
 public:
  EllipseCurve(Vec3 centre, double a, double b, double t0, double t1);
  double first() const override { return t0_; }
  double last() const override { return t1_; }
  void d1(double t, Vec3& p, Vec3& v) const override;
  CurveStructure structure() const override;
  std::unique_ptr<Curve> clone() const override { return std::make_unique<EllipseCurve>(*this); }

 private:
  Vec3 c_;
  double a_, b_, t0_, t1_;
};

/// Bezier curve of degree n = poles.size() - 1 on t in [0, 1] (de Casteljau evaluation).
class BezierCurve : public Curve {
 public:
  explicit BezierCurve(std::vector<Vec3> poles);  // at least two poles
  double first() const override { return 0.0; }
  double last() const override { return 1.0; }
  void d1(double t, Vec3& p, Vec3& v) const override;
  CurveStructure structure() const override;
  std::unique_ptr<Curve> clone() const override { return std::make_unique<BezierCurve>(*this); }

 private:
  std::vector<Vec3> poles_;
};

/// Non-uniform rational B-spline: degree p, clamped knot vector (size poles + p + 1), positive weights.
/// breaks() are the distinct interior knots, where derivatives may jump.
class NurbsCurve : public Curve {
 public:
  NurbsCurve(int degree, std::vector<double> knots, std::vector<Vec3> poles, std::vector<double> weights);
  double first() const override;
  double last() const override;
  void d1(double t, Vec3& p, Vec3& v) const override;
  std::vector<double> breaks() const override;
  CurveStructure structure() const override;
  std::unique_ptr<Curve> clone() const override { return std::make_unique<NurbsCurve>(*this); }

 private:
  int p_;
  std::vector<double> knots_;
  std::vector<Vec3> poles_;
  std::vector<double> weights_;
};

/// Full circle of the given radius about centre in the plane z = centre.z as a rational quadratic NURBS
/// with nine poles (Piegl & Tiller 1997, fig. 7.15): knots {0,0,0,1/4,1/4,1/2,1/2,3/4,3/4,1,1,1},
/// weights 1 and sqrt(2)/2 alternating. Counter-clockwise seen from +z, starting at centre + (radius, 0, 0).
NurbsCurve nurbs_circle(Vec3 centre, double radius);

/// Twisted cubic r(t) = scale * (t, t^2, t^3), t in [t0, t1].
class TwistedCubicCurve : public Curve {
 public:
  TwistedCubicCurve(double scale, double t0, double t1);
  double first() const override { return t0_; }
  double last() const override { return t1_; }
  void d1(double t, Vec3& p, Vec3& v) const override;
  CurveStructure structure() const override;
  std::unique_ptr<Curve> clone() const override { return std::make_unique<TwistedCubicCurve>(*this); }

 private:
  double scale_, t0_, t1_;
};

/// The same point set as `inner` with parameter u, where t = alpha * u + beta (alpha > 0).
/// Integrals along it must equal those along `inner`: a check of parametrization independence.
class AffineReparametrizedCurve : public Curve {
 public:
  AffineReparametrizedCurve(std::shared_ptr<const Curve> inner, double alpha, double beta);
  double first() const override;
  double last() const override;
  void d1(double u, Vec3& p, Vec3& v) const override;
  std::vector<double> breaks() const override;
  CurveStructure structure() const override;
  std::unique_ptr<Curve> clone() const override;

 private:
  std::shared_ptr<const Curve> inner_;
  double alpha_, beta_;
};

}  // namespace ergpath
