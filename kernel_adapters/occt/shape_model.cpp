#include "kernel_adapters/occt/shape_model.h"

#include <BRepTools_WireExplorer.hxx>
#include <BRep_Tool.hxx>
#include <Standard_Failure.hxx>
#include <TopExp_Explorer.hxx>
#include <TopTools_IndexedMapOfShape.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Edge.hxx>
#include <TopoDS_Wire.hxx>

#include <algorithm>
#include <cmath>
#include <memory>
#include <sstream>
#include <utility>
#include <vector>

#include "kernel_adapters/occt/length_text.h"
#include "kernel_adapters/occt/step_model_impl.h"
#include "plugin/core/error.h"

namespace ergpath::occt {

namespace {

Segment segment_of(const StepModel& model, int index, bool reversed) {
  Segment s;
  s.curve = std::shared_ptr<const Curve>(model.make_curve(index));
  s.reversed = reversed;
  s.edge = index;
  s.name = model.edge(index).name.value_or("");
  return s;
}

// Edges of the wire in the explorer's order with their orientation in the wire; false when the explorer
// stops before it has met every edge (it walks only through shared vertices).
bool walk_wire(const StepModel& model, const TopoDS_Wire& wire, std::vector<std::pair<int, bool>>& walk) {
  const TopTools_IndexedMapOfShape& edges = model.impl().edges;
  TopTools_IndexedMapOfShape met;
  for (BRepTools_WireExplorer ex(wire); ex.More(); ex.Next()) {
    const int index = edges.FindIndex(ex.Current());
    if (index == 0) return false;
    met.Add(ex.Current());
    walk.emplace_back(index, ex.Orientation() == TopAbs_REVERSED);
  }
  TopTools_IndexedMapOfShape all;
  for (TopExp_Explorer ex(wire, TopAbs_EDGE); ex.More(); ex.Next()) all.Add(ex.Current());
  return !walk.empty() && met.Extent() == all.Extent();
}

void flip(Path& path) { path = reversed(path); }

}  // namespace

StepModel model_from_shape(const TopoDS_Shape& shape, const std::string& label) {
  if (shape.IsNull()) throw Error(ErrorKind::EmptyModel, label + ": the shape is null (it holds no edges)");
  auto impl = std::make_unique<StepModel::Impl>();
  impl->file = label;
  impl->file_unit = "mm";
  impl->schema = "none";
  impl->protocol = "none";
  impl->shape = shape;
  return StepModel::from_impl(std::move(impl));
}

std::optional<Path> path_of_shape(const StepModel& model, const PathOptions& options) {
  if (!std::isfinite(options.gap_tolerance_mm) || options.gap_tolerance_mm < 0.0) {
    throw Error(ErrorKind::BadOption,
                "gap tolerance must be a finite length >= 0 mm, got " + mm_text(options.gap_tolerance_mm));
  }
  if (options.start_mm && !is_finite(*options.start_mm)) {
    throw Error(ErrorKind::BadOption, "start point must have finite coordinates (mm)");
  }
  const TopoDS_Shape& shape = model.impl().shape;
  std::vector<std::pair<int, bool>> walk;
  if (shape.ShapeType() == TopAbs_EDGE) {
    walk.emplace_back(model.impl().edges.FindIndex(shape), shape.Orientation() == TopAbs_REVERSED);
  } else if (shape.ShapeType() == TopAbs_WIRE) {
    try {
      if (!walk_wire(model, TopoDS::Wire(shape), walk)) return std::nullopt;
    } catch (const Standard_Failure&) {
      return std::nullopt;
    }
  } else {
    return std::nullopt;
  }

  Path path;
  path.length_unit_m = kMetresPerMillimetre;
  for (const auto& [index, rev] : walk) {
    if (model.edge(index).degenerated) continue;
    path.segments.push_back(segment_of(model, index, rev));
  }
  if (path.segments.empty())
    throw Error(ErrorKind::UnknownEdge, model.file() + ": every edge is degenerated");
  for (std::size_t i = 1; i < path.segments.size(); ++i) {
    const double gap = distance(travel_end(path.segments[i - 1]), travel_start(path.segments[i]));
    if (gap > options.gap_tolerance_mm) {
      throw Error(ErrorKind::GapTooLarge, model.file() + ": gap of " + mm_text(gap) + " mm between edge " +
                                              std::to_string(path.segments[i - 1].edge) + " and edge " +
                                              std::to_string(path.segments[i].edge) +
                                              " exceeds the chaining tolerance of " +
                                              mm_text(options.gap_tolerance_mm) + " mm");
    }
  }
  path.closed = distance(travel_end(path.segments.back()), travel_start(path.segments.front())) <=
                options.gap_tolerance_mm;

  if (options.start_mm) {
    const Vec3& p = *options.start_mm;
    if (!path.closed) {
      if (distance(p, travel_end(path.segments.back())) < distance(p, travel_start(path.segments.front()))) {
        flip(path);
      }
    } else {
      std::size_t best = 0;
      for (std::size_t i = 1; i < path.segments.size(); ++i) {
        if (distance(p, travel_start(path.segments[i])) < distance(p, travel_start(path.segments[best])))
          best = i;
      }
      std::rotate(path.segments.begin(), path.segments.begin() + static_cast<std::ptrdiff_t>(best),
                  path.segments.end());
    }
  }
  if (options.reverse) flip(path);
  return path;
}

}  // namespace ergpath::occt
