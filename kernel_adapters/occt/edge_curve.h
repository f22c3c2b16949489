// An ergpath::Curve over the exact 3-D geometry of one OCCT edge, in world coordinates (millimetres).
//
// Evaluation goes through BRepAdaptor_Curve, which applies the edge's location to points and vectors
// and keeps the stored parameter, so a placed instance is evaluated where it sits in the assembly.
// Edge orientation is deliberately ignored (the path's Segment::reversed carries the travel sense).
//
// Break points are every distinct knot of a B-spline inside the edge range, not only its C2 interval
// ends: a cubic with simple knots is C2 everywhere but its third derivative jumps at each knot, and
// adaptive Gauss-Kronrod over such a knot loses digits (Piessens et al., QUADPACK, 1983, ch. 2).
// Other curves break where OCCT reports a drop below C3 (offset and trimmed curves inherit their
// basis curve's knots this way).
#pragma once

#include <BRepAdaptor_Curve.hxx>
#include <TopoDS_Edge.hxx>

#include <memory>
#include <vector>

#include "plugin/core/curve.h"

namespace ergpath::occt {

/// Kernel curve type of an edge's 3-D geometry as the listing names it.
CurveType curve_type_of(const BRepAdaptor_Curve& adaptor);

class EdgeCurve final : public Curve {
 public:
  /// Precondition: the edge is not degenerated (it has a 3-D curve or a curve on a surface).
  explicit EdgeCurve(const TopoDS_Edge& edge);

  double first() const override { return first_; }
  double last() const override { return last_; }
  void d1(double t, Vec3& p, Vec3& v) const override;
  std::vector<double> breaks() const override { return breaks_; }
  CurveStructure structure() const override { return structure_; }
  std::unique_ptr<Curve> clone() const override;

  const BRepAdaptor_Curve& adaptor() const { return adaptor_; }

 private:
  EdgeCurve(const EdgeCurve& other);

  TopoDS_Edge edge_;
  BRepAdaptor_Curve adaptor_;
  double first_ = 0.0, last_ = 0.0;
  std::vector<double> breaks_;
  CurveStructure structure_;
};

}  // namespace ergpath::occt
