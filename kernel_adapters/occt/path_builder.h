// From a selector and direction rules to an ordered, oriented Path over a model's edges.
//
// Selector forms (docs/selectors.md): "all", "edge:I", "edges:I,J,K", ranges "edges:3-7", "name:NAME",
// "wire:I", "face:I" (outer boundary), "near:X,Y,Z" (mm), combined with commas.
//
// Chaining is a graph walk: end points within the gap tolerance are merged into vertices (a uniform
// grid keeps that linear in the number of edges), a vertex with three or more edge ends is a branch,
// and the single connected chain or loop is walked from a free end (Cormen et al., "Introduction to
// Algorithms", 3rd ed., sec. 21.3 for the disjoint-set forest used to merge and to find pieces).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/core/path.h"

namespace ergpath::occt {

struct PathOptions {
  bool reverse = false;            // travel the finished path the other way
  std::optional<Vec3> start_mm;    // open chain: start at the end nearest this point
  double gap_tolerance_mm = 1e-3;  // largest end-to-start gap accepted between consecutive edges
};

/// Edge indices a selector names, in selector order. Throws Error(BadSelector) when the text does not
/// parse and Error(UnknownEdge) when an index is out of range (message gives the valid range).
std::vector<int> select_edges(const StepModel& model, const std::string& selector);

/// Orders and orients the selected edges (model indices, any order) into one path of millimetre curves
/// (Path::length_unit_m = 1e-3). End points closer than gap_tolerance_mm are one vertex; the edges must
/// form a single chain or a single loop. An open chain runs so that the first selected edge follows its
/// own parameter, unless start_mm picks the other end; a loop starts at the first selected edge's
/// start (or at the vertex nearest start_mm) and runs along that edge. `reverse` is applied last.
/// Degenerated edges are skipped; a line saying so (and the chained order, when it differs from the
/// selection) goes to `notes` when given.
/// Throws Error: GapTooLarge naming the two edges with the nearest ends and the gap in mm;
/// BranchInPath naming the edges meeting at a point and where; UnknownEdge for an index out of range
/// or an empty selection; BadSelector for an edge listed twice; BadOption for a negative tolerance.
Path build_path(const StepModel& model, const std::vector<int>& edges, const PathOptions& options = {},
                std::vector<std::string>* notes = nullptr);

}  // namespace ergpath::occt
