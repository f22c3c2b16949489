#include "kernel_adapters/occt/edge_distance.h"

#include <BRepBndLib.hxx>
#include <BRepBuilderAPI_MakeVertex.hxx>
#include <BRepExtrema_DistShapeShape.hxx>
#include <Bnd_Box.hxx>
#include <Standard_Failure.hxx>

#include <algorithm>
#include <cmath>
#include <limits>
#include <utility>
#include <vector>

#include "kernel_adapters/occt/step_model_impl.h"
#include "plugin/core/error.h"

namespace ergpath::occt {

namespace {

double box_distance(const Bnd_Box& box, const gp_Pnt& p) {
  if (box.IsVoid()) return 0.0;
  double x0, y0, z0, x1, y1, z1;
  box.Get(x0, y0, z0, x1, y1, z1);
  const double dx = std::max({x0 - p.X(), 0.0, p.X() - x1});
  const double dy = std::max({y0 - p.Y(), 0.0, p.Y() - y1});
  const double dz = std::max({z0 - p.Z(), 0.0, p.Z() - z1});
  return std::sqrt(dx * dx + dy * dy + dz * dz);
}

}  // namespace

double distance_to_edge(const StepModel& model, int index, const Vec3& point_mm) {
  const TopoDS_Shape& edge = model.impl().edges(index);
  const TopoDS_Vertex v = BRepBuilderAPI_MakeVertex(gp_Pnt(point_mm.x, point_mm.y, point_mm.z));
  try {
    BRepExtrema_DistShapeShape dist(v, edge);
    if (dist.IsDone()) return dist.Value();
  } catch (const Standard_Failure&) {
  }
  // Extrema failed on this curve: fall back to the nearer end point (an upper bound).
  const EdgeInfo& e = model.edge(index);
  return std::min(distance(point_mm, e.start_mm), distance(point_mm, e.end_mm));
}

int nearest_edge(const StepModel& model, const Vec3& point_mm) {
  const gp_Pnt p(point_mm.x, point_mm.y, point_mm.z);
  std::vector<std::pair<double, int>> candidates;
  for (const EdgeInfo& e : model.edges()) {
    if (e.degenerated) continue;
    Bnd_Box box;
    BRepBndLib::Add(model.impl().edges(e.index), box);
    candidates.emplace_back(box_distance(box, p), e.index);
  }
  std::sort(candidates.begin(), candidates.end());
  double best = std::numeric_limits<double>::infinity();
  int best_index = 0;
  for (const auto& [lower, index] : candidates) {
    if (lower > best) break;
    const double d = distance_to_edge(model, index, point_mm);
    if (d < best || (d == best && index < best_index)) {
      best = d;
      best_index = index;
    }
  }
  return best_index;
}

}  // namespace ergpath::occt
