// A parametric curve r(t) on [first, last] with its first derivative and break points.
//
// This is the only view of geometry the engine has: it never sees a CAD kernel. Positions are in the
// *model length unit* of the path that holds the curve (millimetres for curves made by the OCCT adapter;
// see Path::length_unit_m). Derivatives are in model length unit per unit of t.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "vec3.h"

namespace ergpath {

enum class CurveType { Line, Circle, Ellipse, Hyperbola, Parabola, Bezier, BSpline, Offset, Other };

/// Lower-case identifier used in listings and JSON ("line", "circle", ..., "bspline", "offset", "other").
const char* to_string(CurveType type);

/// What the engine may exploit about r(t). Every field is a promise: a wrong promise gives wrong integrals.
struct CurveStructure {
  CurveType type = CurveType::Other;
  /// r(t) is a polynomial of degree `degree` in t on each span between consecutive breaks.
  bool polynomial = false;
  int degree = -1;
  /// r(t) is a ratio of polynomials of degree `degree` on each span (rational Bezier/B-spline).
  bool rational = false;
  /// r is smooth and periodic with period exactly (last - first): a whole circle or ellipse.
  bool full_period = false;
};

class Curve {
 public:
  virtual ~Curve() = default;
  /// Parameter range, first < last.
  virtual double first() const = 0;
  virtual double last() const = 0;
  /// Position p (model length unit) and derivative v = dr/dt at t in [first, last].
  /// Implementations need not be thread-safe: use one Curve object per thread.
  virtual void d1(double t, Vec3& p, Vec3& v) const = 0;
  /// Parameters strictly inside (first, last), ascending, where some derivative of r may jump
  /// (B-spline knots, joins). Quadrature never integrates across one.
  virtual std::vector<double> breaks() const { return {}; }
  virtual CurveStructure structure() const { return {}; }
  /// A fresh independent copy for use on another thread.
  virtual std::unique_ptr<Curve> clone() const = 0;
};

}  // namespace ergpath
