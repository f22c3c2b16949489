// Edge inventory: per-edge curve details and topology (faces, wires, assembly instance), and filters.
//
// Kernel-free header. Face and wire numbers are 1-based in the kernel's unique-shape map order
// (TopExp::MapShapes), the same numbering "face:I" and "wire:I" selectors use.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"

namespace ergpath::occt {

struct EdgeDetails {
  int index = 0;                        // the model edge (see StepModel::edge for type, ends, length, name)
  std::optional<int> degree;            // Bezier/B-spline degree
  std::optional<int> poles;             // Bezier/B-spline pole count
  std::optional<bool> rational;         // Bezier/B-spline: weights present
  std::optional<CurveType> basis;       // offset curve: the type of its basis curve
  bool seam = false;                    // bounds one of its faces twice (closed surface's seam)
  std::vector<int> faces;               // faces bounded by the edge, ascending
  std::vector<int> wires;               // wires containing the edge, ascending
  std::optional<std::string> instance;  // assembly instance path, e.g. "lift_cell/carrier_2"
};

struct Inventory {
  std::vector<EdgeDetails> edges;  // one per model edge, index order
  int face_count = 0;
  int wire_count = 0;
};

/// Details of every edge of the model.
Inventory edge_inventory(const StepModel& model);

struct EdgeFilter {
  std::vector<CurveType> types;  // empty: any type
  std::string name_pattern;      // glob ('*' any run, '?' one character); empty: any; set: named only
  std::optional<double> min_length_m, max_length_m;
  std::optional<Vec3> near_mm;  // with within_mm: edges at most that far; alone: the nearest edge
  std::optional<double> within_mm;
};

/// Parses a listing type name ("line", "circle", ..., "bspline", "offset", "other").
/// Throws Error(BadOption) naming the accepted names.
CurveType parse_curve_type(const std::string& name);

/// Glob match of `text` against `pattern` ('*' and '?').
bool glob_match(const std::string& pattern, const std::string& text);

/// Indices of the edges passing every filter, ascending. Throws Error(BadOption) for a negative or
/// non-finite length or distance, or within_mm without near_mm.
std::vector<int> filter_edges(const StepModel& model, const EdgeFilter& filter);

}  // namespace ergpath::occt
