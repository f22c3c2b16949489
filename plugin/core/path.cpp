#include "path.h"

#include <algorithm>

namespace ergpath {

const char* to_string(CurveType type) {
  switch (type) {
    case CurveType::Line:
      return "line";
    case CurveType::Circle:
      return "circle";
    case CurveType::Ellipse:
      return "ellipse";
    case CurveType::Hyperbola:
      return "hyperbola";
    case CurveType::Parabola:
      return "parabola";
    case CurveType::Bezier:
      return "bezier";
    case CurveType::BSpline:
      return "bspline";
    case CurveType::Offset:
      return "offset";
    case CurveType::Other:
      return "other";
  }
  return "other";
}

namespace {
Vec3 point_at(const Curve& c, double t) {
  Vec3 p, v;
  c.d1(t, p, v);
  return p;
}
}  // namespace

Vec3 travel_start(const Segment& s) {
  return point_at(*s.curve, s.reversed ? s.curve->last() : s.curve->first());
}

Vec3 travel_end(const Segment& s) {
  return point_at(*s.curve, s.reversed ? s.curve->first() : s.curve->last());
}

Path reversed(const Path& path) {
  Path out = path;
  std::reverse(out.segments.begin(), out.segments.end());
  for (Segment& s : out.segments) s.reversed = !s.reversed;
  return out;
}

Path clone(const Path& path) {
  Path out = path;
  for (Segment& s : out.segments) s.curve = std::shared_ptr<const Curve>(s.curve->clone());
  return out;
}

}  // namespace ergpath
