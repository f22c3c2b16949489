// Distance from a point to model edges, for "near:" selection and proximity filters.
//
// Exact point-curve distance by BRepExtrema_DistShapeShape (extrema on the curve plus its end points),
// with axis-aligned bounding boxes as lower bounds so only candidate edges are measured.
#pragma once

#include "kernel_adapters/occt/step_model.h"

namespace ergpath::occt {

/// Distance in mm from `point_mm` to edge `index` (1-based, not degenerated).
double distance_to_edge(const StepModel& model, int index, const Vec3& point_mm);

/// The non-degenerated edge nearest to `point_mm` (lowest index on ties); 0 when there is none.
int nearest_edge(const StepModel& model, const Vec3& point_mm);

}  // namespace ergpath::occt
