// A StepModel over a shape already in memory (a DRAW session, a kernel-based application), and the path
// such a shape describes by itself.
//
// Edges are numbered exactly as StepModel::read numbers the same shape read from a file (the kernel's
// unique-edge map, TopExp::MapShapes), so an index seen in a listing means the same edge in both doors.
// A wire is travelled in its own order (BRepTools_WireExplorer) and orientations; an edge in its
// orientation. This header includes OCCT: it is adapter code, for the adapter and the DRAW plugin only.
#pragma once

#include <TopoDS_Shape.hxx>

#include <optional>
#include <string>

#include "kernel_adapters/occt/path_builder.h"
#include "kernel_adapters/occt/step_model.h"
#include "plugin/core/path.h"

namespace ergpath::occt {

/// A model whose geometry is `shape`, coordinates taken as millimetres (the unit the kernel's STEP
/// reader converts to). `label` stands in for the file name in messages and reports; file_unit() is
/// "mm", schema() and application_protocol() are "none". Throws Error(EmptyModel) for a null shape or
/// one without edges, naming label.
StepModel model_from_shape(const TopoDS_Shape& shape, const std::string& label);

/// The path the model's shape describes by itself, or nullopt when it is neither an edge nor a wire
/// (then select edges and chain them with select_edges/build_path):
/// - an edge: one segment, travelled against its parameter when the edge is REVERSED;
/// - a wire: its edges in BRepTools_WireExplorer order, each in its orientation within the wire,
///   degenerated edges skipped; nullopt when the explorer cannot walk every edge (the wire is not
///   connected through shared vertices), so the caller falls back to chaining by end points.
/// Options: an open path runs from the end nearest start_mm (when given); a closed one starts at the
/// segment start nearest start_mm; reverse is applied last. Path coordinates are millimetres.
/// Throws Error(GapTooLarge) when consecutive segments are further apart than gap_tolerance_mm,
/// Error(BadOption) for a negative or non-finite gap tolerance.
std::optional<Path> path_of_shape(const StepModel& model, const PathOptions& options = {});

}  // namespace ergpath::occt
