#include "kernel_adapters/occt/edge_curve.h"

#include <BRep_Tool.hxx>
#include <Geom_BSplineCurve.hxx>
#include <Geom_BezierCurve.hxx>
#include <Geom_Curve.hxx>
#include <Standard_Failure.hxx>
#include <TColStd_Array1OfReal.hxx>

#include <algorithm>
#include <cmath>

namespace ergpath::occt {

namespace {

// A whole circle or ellipse edge spans one period up to STEP's 12-significant-digit rounding of its
// trimming parameters (about 5e-12 relative on 2*pi); 1e-10 relative accepts that and nothing coarser.
constexpr double kFullPeriodRelTol = 1e-10;
// Breaks closer than this fraction of the parameter range to an end or to each other are dropped.
// Real files trim edges a few ulps beside a knot (NIST FTC-10: 9e-15 inside the range); such a
// sliver span carries no length worth resolving, yet a relative-tolerance quadrature on it cannot
// converge. Folding it into its neighbour changes the piece's integral by less than 1e-9 relative.
constexpr double kMinSpanRel = 1e-9;

void add_periodic_knots(const Handle(Geom_BSplineCurve) & bs, double a, double b, std::vector<double>& out) {
  const double k0 = bs->FirstParameter();
  const double period = bs->LastParameter() - k0;
  for (int i = 1; i <= bs->NbKnots(); ++i) {
    const double k = bs->Knot(i);
    // Shift each knot by whole periods to every copy that falls inside (a, b).
    const double m0 = std::floor((a - k) / period);
    for (double m = m0; k + m * period < b; m += 1.0) {
      const double t = k + m * period;
      if (t > a) out.push_back(t);
    }
  }
}

std::vector<double> knots_inside(const BRepAdaptor_Curve& c, double a, double b) {
  std::vector<double> out;
  if (c.GetType() == GeomAbs_BSplineCurve) {
    const Handle(Geom_BSplineCurve) bs = c.BSpline();
    if (bs->IsPeriodic()) {
      add_periodic_knots(bs, a, b, out);
    } else {
      for (int i = 1; i <= bs->NbKnots(); ++i) {
        const double t = bs->Knot(i);
        if (t > a && t < b) out.push_back(t);
      }
    }
  } else if (c.GetType() != GeomAbs_BezierCurve) {
    // Offset curves, curves on surfaces and others: where OCCT sees continuity drop below C3.
    const int n = c.NbIntervals(GeomAbs_C3);
    if (n > 1) {
      TColStd_Array1OfReal t(1, n + 1);
      c.Intervals(t, GeomAbs_C3);
      for (int i = 2; i <= n; ++i) {
        if (t(i) > a && t(i) < b) out.push_back(t(i));
      }
    }
  }
  std::sort(out.begin(), out.end());
  const double min_span = kMinSpanRel * (b - a);
  std::vector<double> kept;
  for (double t : out) {
    const double prev = kept.empty() ? a : kept.back();
    if (t - prev > min_span && b - t > min_span) kept.push_back(t);
  }
  return kept;
}

}  // namespace

CurveType curve_type_of(const BRepAdaptor_Curve& adaptor) {
  switch (adaptor.GetType()) {
    case GeomAbs_Line:
      return CurveType::Line;
    case GeomAbs_Circle:
      return CurveType::Circle;
    case GeomAbs_Ellipse:
      return CurveType::Ellipse;
    case GeomAbs_Hyperbola:
      return CurveType::Hyperbola;
    case GeomAbs_Parabola:
      return CurveType::Parabola;
    case GeomAbs_BezierCurve:
      return CurveType::Bezier;
    case GeomAbs_BSplineCurve:
      return CurveType::BSpline;
    case GeomAbs_OffsetCurve:
      return CurveType::Offset;
    default:
      return CurveType::Other;
  }
}

EdgeCurve::EdgeCurve(const TopoDS_Edge& edge) : edge_(edge), adaptor_(edge) {
  first_ = adaptor_.FirstParameter();
  last_ = adaptor_.LastParameter();
  structure_.type = curve_type_of(adaptor_);
  double f = 0.0, l = 0.0;
  // Structural promises only for a real 3-D curve; a curve on a surface is evaluated through the
  // surface and is neither polynomial nor of the type the adaptor reports for its 2-D part.
  const bool has_3d = !BRep_Tool::Curve(edge_, f, l).IsNull();
  try {
    breaks_ = knots_inside(adaptor_, first_, last_);
  } catch (const Standard_Failure&) {
    breaks_.clear();
  }
  if (!has_3d) {
    structure_ = CurveStructure{};
    return;
  }
  switch (adaptor_.GetType()) {
    case GeomAbs_Line:
      structure_.polynomial = true;
      structure_.degree = 1;
      break;
    case GeomAbs_BSplineCurve:
    case GeomAbs_BezierCurve: {
      const bool rational = adaptor_.IsRational();
      structure_.degree = adaptor_.Degree();
      structure_.polynomial = !rational;
      structure_.rational = rational;
      break;
    }
    case GeomAbs_Circle:
    case GeomAbs_Ellipse: {
      const double period = 2.0 * M_PI;
      structure_.full_period = std::abs((last_ - first_) - period) <= kFullPeriodRelTol * period;
      break;
    }
    default:
      break;
  }
}

EdgeCurve::EdgeCurve(const EdgeCurve& other)
    : Curve(),
      edge_(other.edge_),
      adaptor_(other.edge_),
      first_(other.first_),
      last_(other.last_),
      breaks_(other.breaks_),
      structure_(other.structure_) {}

void EdgeCurve::d1(double t, Vec3& p, Vec3& v) const {
  gp_Pnt P;
  gp_Vec V;
  adaptor_.D1(t, P, V);
  p = {P.X(), P.Y(), P.Z()};
  v = {V.X(), V.Y(), V.Z()};
}

std::unique_ptr<Curve> EdgeCurve::clone() const { return std::unique_ptr<Curve>(new EdgeCurve(*this)); }

}  // namespace ergpath::occt
