// From a selector and direction rules to an ordered, oriented Path over a model's edges.
//
// Selector forms (docs/selectors.md): "all", "edge:I", "edges:I,J,K" (chained in the given order).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/core/path.h"

namespace ergpath::occt {

struct PathOptions {
  bool reverse = false;               // travel the finished path the other way
  std::optional<Vec3> start_mm;       // open chain: start at the end nearest this point
  double gap_tolerance_mm = 1e-3;     // largest end-to-start gap accepted between consecutive edges
};

/// Edge indices a selector names, in selector order. Throws Error(BadSelector) when the text does not
/// parse and Error(UnknownEdge) when an index is out of range (message gives the valid range).
std::vector<int> select_edges(const StepModel& model, const std::string& selector);

/// Orders and orients the selected edges into one path. The first edge runs along its own parameter
/// unless start/reverse say otherwise; each next edge continues from the previous end point.
/// Throws Error(GapTooLarge) naming both edges and the gap in mm.
Path build_path(const StepModel& model, const std::vector<int>& edges, const PathOptions& options = {});

}  // namespace ergpath::occt
