#include "curve_length.h"

#include <algorithm>

#include "arc_length.h"

namespace ergpath {

LengthEstimate curve_length(const Curve& curve, double a, double b, double rel_tol) {
  a = std::max(a, curve.first());
  b = std::min(b, curve.last());
  LengthEstimate out;
  if (!(b > a)) return out;
  // One quadrature for lengths in the whole engine: the arc-length table of a one-segment path. The
  // segment borrows `curve` (aliasing shared_ptr with no owner); the table does not outlive this call.
  Path path;
  path.length_unit_m = 1.0;
  path.segments.push_back(
      {std::shared_ptr<const Curve>(std::shared_ptr<const Curve>(), &curve), false, 0, ""});
  const ArcLength arc(path, rel_tol);
  out.length = arc.s_at(0, b) - arc.s_at(0, a);
  out.error = arc.error_m();
  out.evaluations = arc.curve_evaluations();
  return out;
}

}  // namespace ergpath
