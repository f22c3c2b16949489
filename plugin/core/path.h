// A path: an ordered list of oriented curve segments, travelled one after the other.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "curve.h"

namespace ergpath {

struct Segment {
  std::shared_ptr<const Curve> curve;
  /// true: travelled from curve->last() to curve->first(), i.e. against the curve's parameter.
  bool reversed = false;
  /// 1-based edge index in the model the segment came from; 0 when it did not come from a model.
  int edge = 0;
  /// Edge name from the model, empty when it has none.
  std::string name;
};

struct Path {
  std::vector<Segment> segments;
  /// Metres per model length unit of the curves' coordinates (1e-3 for millimetres).
  double length_unit_m = 1e-3;
  /// The end of the last segment coincides with the start of the first (within the chaining tolerance).
  bool closed = false;
};

/// Start and end point of a segment in travel direction (model length unit).
Vec3 travel_start(const Segment& s);
Vec3 travel_end(const Segment& s);

/// The same path travelled the other way: segments in reverse order, each orientation flipped.
Path reversed(const Path& path);

/// A deep copy whose curves are independent clones (for use on another thread).
Path clone(const Path& path);

}  // namespace ergpath
