// EdgeCurve on in-memory edges of every kernel curve type: exact parametrization, breaks, promises.
#include <gtest/gtest.h>

#include <BRepBuilderAPI_MakeEdge.hxx>
#include <Geom_BSplineCurve.hxx>
#include <Geom_BezierCurve.hxx>
#include <Geom_Circle.hxx>
#include <Geom_Hyperbola.hxx>
#include <Geom_OffsetCurve.hxx>
#include <Geom_Parabola.hxx>
#include <Geom_TrimmedCurve.hxx>
#include <TColStd_Array1OfInteger.hxx>
#include <TColStd_Array1OfReal.hxx>
#include <TColgp_Array1OfPnt.hxx>
#include <TopLoc_Location.hxx>
#include <TopoDS.hxx>
#include <gp_Ax2.hxx>
#include <gp_Circ.hxx>
#include <gp_Elips.hxx>
#include <gp_Trsf.hxx>

#include <cmath>
#include <thread>

#include "kernel_adapters/occt/edge_curve.h"
#include "occt_test_support.h"
#include "plugin/core/curve_length.h"

namespace ergpath::occt {
namespace {

// Positions of curves up to ~300 mm evaluated in double precision: 1e-10 mm leaves room for a few
// hundred ulps of rounding in the kernel's evaluators.
constexpr double kEvalTolMm = 1e-10;
// Our integrator at 1e-12 against GCPnts at 1e-12 (both ~1e-13 from the truth on smooth spans).
constexpr double kLengthAgreementRel = 1e-11;

const gp_Ax2 kXY(gp_Pnt(0, 0, 0), gp_Dir(0, 0, 1), gp_Dir(1, 0, 0));

Vec3 at(const Curve& c, double t) {
  Vec3 p, v;
  c.d1(t, p, v);
  return p;
}

void expect_near(const Vec3& p, double x, double y, double z, double tol = kEvalTolMm) {
  EXPECT_NEAR(p.x, x, tol);
  EXPECT_NEAR(p.y, y, tol);
  EXPECT_NEAR(p.z, z, tol);
}

TopoDS_Edge curve_edge(const Handle(Geom_Curve) & c) { return BRepBuilderAPI_MakeEdge(c); }
TopoDS_Edge curve_edge(const Handle(Geom_Curve) & c, double a, double b) {
  return BRepBuilderAPI_MakeEdge(c, a, b);
}

Handle(Geom_BSplineCurve) cubic_with_knots() {
  TColgp_Array1OfPnt p(1, 6);
  p(1) = gp_Pnt(0, 0, 0);
  p(2) = gp_Pnt(40, 60, 0);
  p(3) = gp_Pnt(80, -20, 10);
  p(4) = gp_Pnt(120, 50, 0);
  p(5) = gp_Pnt(160, 0, -10);
  p(6) = gp_Pnt(200, 30, 0);
  TColStd_Array1OfReal k(1, 4);
  k(1) = 0.0;
  k(2) = 0.3;
  k(3) = 0.65;
  k(4) = 1.0;
  TColStd_Array1OfInteger m(1, 4);
  m(1) = 4;
  m(2) = 1;
  m(3) = 1;
  m(4) = 4;
  return new Geom_BSplineCurve(p, k, m, 3);
}

TEST(EdgeCurve, CircleFollowsItsAngleParametrization) {
  const EdgeCurve c(BRepBuilderAPI_MakeEdge(gp_Circ(kXY, 50.0), 0.2, 2.0));
  EXPECT_EQ(c.structure().type, CurveType::Circle);
  // r(t) = r (cos t, sin t, 0) for a circle on the x-y axes (analytic geometry).
  expect_near(at(c, 1.1), 50.0 * std::cos(1.1), 50.0 * std::sin(1.1), 0.0);
  EXPECT_FALSE(c.structure().full_period);
  EXPECT_TRUE(EdgeCurve(BRepBuilderAPI_MakeEdge(gp_Circ(kXY, 50.0))).structure().full_period);
}

TEST(EdgeCurve, EllipseHyperbolaAndParabolaFollowTheirStandardParametrizations) {
  const EdgeCurve e(BRepBuilderAPI_MakeEdge(gp_Elips(kXY, 80.0, 30.0), 0.0, 3.0));
  const EdgeCurve h(curve_edge((new Geom_Hyperbola(kXY, 40.0, 20.0)), -1.0, 1.2));
  const EdgeCurve p(curve_edge((new Geom_Parabola(kXY, 25.0)), -40.0, 60.0));
  EXPECT_EQ(e.structure().type, CurveType::Ellipse);
  EXPECT_EQ(h.structure().type, CurveType::Hyperbola);
  EXPECT_EQ(p.structure().type, CurveType::Parabola);
  // Ellipse (a cos t, b sin t); hyperbola (a cosh t, b sinh t); parabola (t^2 / (4 f), t).
  expect_near(at(e, 0.7), 80.0 * std::cos(0.7), 30.0 * std::sin(0.7), 0.0);
  expect_near(at(h, 0.9), 40.0 * std::cosh(0.9), 20.0 * std::sinh(0.9), 0.0);
  expect_near(at(p, 30.0), 30.0 * 30.0 / (4.0 * 25.0), 30.0, 0.0);
}

TEST(EdgeCurve, BezierFollowsItsBernsteinForm) {
  TColgp_Array1OfPnt poles(1, 4);
  poles(1) = gp_Pnt(0, 0, 0);
  poles(2) = gp_Pnt(30, 60, 10);
  poles(3) = gp_Pnt(70, -60, 20);
  poles(4) = gp_Pnt(100, 0, 0);
  const EdgeCurve c(curve_edge((new Geom_BezierCurve(poles))));
  EXPECT_EQ(c.structure().type, CurveType::Bezier);
  EXPECT_TRUE(c.structure().polynomial);
  EXPECT_EQ(c.structure().degree, 3);
  EXPECT_TRUE(c.breaks().empty());
  // Cubic Bernstein basis (Farin, Curves and Surfaces for CAGD, 5th ed., sec. 4.1).
  const double t = 0.37, u = 1.0 - t;
  const double b[4] = {u * u * u, 3 * u * u * t, 3 * u * t * t, t * t * t};
  double x = 0, y = 0, z = 0;
  for (int i = 0; i < 4; ++i) {
    x += b[i] * poles(i + 1).X();
    y += b[i] * poles(i + 1).Y();
    z += b[i] * poles(i + 1).Z();
  }
  expect_near(at(c, t), x, y, z);
}

TEST(EdgeCurve, BSplineBreaksAtEveryInteriorKnot) {
  const EdgeCurve c(curve_edge((cubic_with_knots())));
  EXPECT_EQ(c.structure().type, CurveType::BSpline);
  ASSERT_EQ(c.breaks().size(), 2u);
  EXPECT_EQ(c.breaks()[0], 0.3);
  EXPECT_EQ(c.breaks()[1], 0.65);
  EXPECT_TRUE(c.structure().polynomial);
  EXPECT_EQ(c.structure().degree, 3);
}

TEST(EdgeCurve, TrimmedBSplineKeepsOnlyKnotsInsideItsRange) {
  const Handle(Geom_Curve) trimmed = new Geom_TrimmedCurve(cubic_with_knots(), 0.4, 0.9);
  const EdgeCurve c(curve_edge(trimmed));
  EXPECT_DOUBLE_EQ(c.first(), 0.4);
  EXPECT_DOUBLE_EQ(c.last(), 0.9);
  ASSERT_EQ(c.breaks().size(), 1u);
  EXPECT_EQ(c.breaks()[0], 0.65);
}

TEST(EdgeCurve, ASliverSpanBesideAKnotIsFoldedIntoItsNeighbour) {
  // Reproduces NIST FTC-10 edge 435: the edge starts 9e-15 before a knot. A break there would leave a
  // span on which no relative tolerance can be met, and adaptive quadrature would recurse to its depth
  // limit (2^30 subdivisions for the core integrator).
  const Handle(Geom_Curve) trimmed = new Geom_TrimmedCurve(cubic_with_knots(), 0.3 - 9e-15, 0.9);
  const EdgeCurve c(curve_edge(trimmed));
  ASSERT_EQ(c.breaks().size(), 1u);
  EXPECT_EQ(c.breaks()[0], 0.65);
  // Two spans of smooth cubic arc length converge in a few G7K15 levels: far below 10^4 evaluations.
  EXPECT_LT(curve_length(c).evaluations, 10000);
}

TEST(EdgeCurve, PolynomialPromiseHoldsOnEachSpan) {
  // On a span where r is a polynomial of degree d, the (d+1)-th forward difference of equally spaced
  // samples is zero (finite-difference calculus, e.g. Hildebrand, Introduction to Numerical Analysis,
  // sec. 4.3); rounding leaves ~1e-10 mm for coordinates of ~200 mm and 2^4 = 16 summed terms.
  const EdgeCurve c(curve_edge((cubic_with_knots())));
  const double a = 0.3, h = (0.65 - 0.3) / 4.0;
  Vec3 s[5];
  for (int i = 0; i < 5; ++i) s[i] = at(c, a + i * h);
  const Vec3 d4 = s[0] - 4.0 * s[1] + 6.0 * s[2] - 4.0 * s[3] + s[4];
  EXPECT_LT(norm(d4), 1e-9);
  // Across a knot the same difference is not zero: the promise is per span, so breaks matter.
  Vec3 q[5];
  for (int i = 0; i < 5; ++i) q[i] = at(c, 0.1 + i * 0.15);
  EXPECT_GT(norm(q[0] - 4.0 * q[1] + 6.0 * q[2] - 4.0 * q[3] + q[4]), 1e-3);
}

TEST(EdgeCurve, RationalBSplineIsFlaggedRationalNotPolynomial) {
  const double w = 1.0 / std::sqrt(2.0);
  TColgp_Array1OfPnt p(1, 3);
  p(1) = gp_Pnt(60, 0, 0);
  p(2) = gp_Pnt(60, 60, 0);
  p(3) = gp_Pnt(0, 60, 0);
  TColStd_Array1OfReal wt(1, 3);
  wt(1) = 1.0;
  wt(2) = w;
  wt(3) = 1.0;
  TColStd_Array1OfReal k(1, 2);
  k(1) = 0.0;
  k(2) = 1.0;
  TColStd_Array1OfInteger m(1, 2);
  m(1) = 3;
  m(2) = 3;
  const EdgeCurve c(curve_edge((new Geom_BSplineCurve(p, wt, k, m, 2))));
  EXPECT_TRUE(c.structure().rational);
  EXPECT_FALSE(c.structure().polynomial);
  // A quadratic rational arc with middle weight cos(45 deg) is an exact quarter circle of radius 60 mm
  // (Piegl & Tiller, The NURBS Book, 2nd ed., sec. 7.3): length 30 pi mm.
  EXPECT_NEAR(curve_length(c).length, 30.0 * M_PI, kLengthAgreementRel * 30.0 * M_PI);
}

TEST(EdgeCurve, OffsetCurveBreaksAtItsBasisKnots) {
  const Handle(Geom_Curve) off = new Geom_OffsetCurve(cubic_with_knots(), 10.0, gp_Dir(0, 0, 1));
  const TopoDS_Edge edge = BRepBuilderAPI_MakeEdge(off);
  const EdgeCurve c(edge);
  EXPECT_EQ(c.structure().type, CurveType::Offset);
  EXPECT_FALSE(c.structure().polynomial);
  ASSERT_EQ(c.breaks().size(), 2u);
  EXPECT_NEAR(c.breaks()[0], 0.3, 1e-15);
  const double ref = testing::gcpnts_length_mm(edge);
  EXPECT_NEAR(curve_length(c).length, ref, kLengthAgreementRel * ref);
}

TEST(EdgeCurve, LocatedEdgeIsEvaluatedInWorldCoordinates) {
  const TopoDS_Edge local = curve_edge((cubic_with_knots()));
  gp_Trsf trsf;
  trsf.SetRotation(gp_Ax1(gp_Pnt(0, 0, 0), gp_Dir(0, 0, 1)), M_PI / 3.0);
  trsf.SetTranslationPart(gp_Vec(500, -200, 75));
  const TopoDS_Edge placed = TopoDS::Edge(local.Moved(TopLoc_Location(trsf)));
  const EdgeCurve a(local), b(placed);
  for (double t : {0.0, 0.31, 0.77, 1.0}) {
    const Vec3 p = at(a, t);
    gp_Pnt q(p.x, p.y, p.z);
    q.Transform(trsf);
    expect_near(at(b, t), q.X(), q.Y(), q.Z());
  }
}

TEST(EdgeCurve, ClonesEvaluateIndependentlyOnOtherThreads) {
  const EdgeCurve c(curve_edge((cubic_with_knots())));
  constexpr int kSamples = 2000;
  std::vector<Vec3> serial(kSamples), threaded(kSamples);
  for (int i = 0; i < kSamples; ++i) serial[i] = at(c, double(i) / (kSamples - 1));
  const std::unique_ptr<Curve> c1 = c.clone(), c2 = c.clone();
  std::thread t1([&] {
    for (int i = 0; i < kSamples; i += 2) threaded[i] = at(*c1, double(i) / (kSamples - 1));
  });
  std::thread t2([&] {
    for (int i = 1; i < kSamples; i += 2) threaded[i] = at(*c2, double(i) / (kSamples - 1));
  });
  t1.join();
  t2.join();
  for (int i = 0; i < kSamples; ++i) EXPECT_EQ(distance(serial[i], threaded[i]), 0.0) << i;
  EXPECT_EQ(c1->breaks(), c.breaks());
}

TEST(EdgeCurve, OrientationOfTheEdgeIsIgnored) {
  const TopoDS_Edge e = BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(10, 0, 0));
  const EdgeCurve fwd(e), rev(TopoDS::Edge(e.Reversed()));
  expect_near(at(rev, rev.first()), 0, 0, 0);
  EXPECT_EQ(fwd.first(), rev.first());
  EXPECT_EQ(fwd.last(), rev.last());
}

}  // namespace
}  // namespace ergpath::occt
