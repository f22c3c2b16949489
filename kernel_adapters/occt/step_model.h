// A STEP model read with OCCT: its edges numbered 1..N, their geometry, names and units.
//
// This header is kernel-free (pimpl) so that the CLI and reports compile without OCCT headers.
// Coordinates are millimetres (the reader's default length unit), lengths metres.
#pragma once

#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "plugin/core/curve.h"
#include "plugin/core/vec3.h"

namespace ergpath::occt {

struct EdgeInfo {
  int index = 0;  // 1-based, the kernel's unique-edge map order (stable per file)
  CurveType type = CurveType::Other;
  Vec3 start_mm, end_mm;  // at the edge's first and last parameter
  double length_m = 0.0;
  std::optional<std::string> name;  // STEP name, when the file carries one
  bool degenerated = false;         // no 3-D curve; skipped when integrating
  bool closed = false;              // start and end coincide (same vertex, or within 1e-7 mm)
};

class StepModel {
 public:
  /// Reads a STEP file (AP203/AP214/AP242). Throws Error(UnreadableFile) for a missing, empty,
  /// truncated or non-STEP file and Error(EmptyModel) when it holds no edge; messages name the file.
  /// Names come through XDE (with sub-shape names); a file XDE cannot transfer is read again without
  /// names. Reads are serialized internally (the kernel's reader settings are process-wide).
  static StepModel read(const std::string& file);

  ~StepModel();
  StepModel(StepModel&&) noexcept;
  StepModel& operator=(StepModel&&) noexcept;

  const std::string& file() const;
  /// The file's own length unit as written ("mm", "inch", "m", ...), and its schema name.
  const std::string& file_unit() const;
  const std::string& schema() const;
  /// The application protocol the schema belongs to: "AP203", "AP214", "AP242" or "unknown".
  const std::string& application_protocol() const;

  int edge_count() const;
  /// Precondition 1 <= index <= edge_count().
  const EdgeInfo& edge(int index) const;
  const std::vector<EdgeInfo>& edges() const;

  /// A new curve object for the edge's exact 3-D geometry in millimetres, parametrized as the kernel
  /// stores it (orientation of the edge ignored: the Segment's `reversed` flag says the travel sense).
  /// Each call returns an independent object, safe to use on its own thread.
  /// Throws Error(UnknownEdge) for a degenerated edge.
  std::unique_ptr<Curve> make_curve(int index) const;

  /// Opaque kernel handle for adapter-internal code (selection by face/wire, DRAW plugin).
  struct Impl;
  const Impl& impl() const { return *impl_; }

  /// Adapter-internal factory behind model_from_shape (shape_model.h): numbers and describes the edges
  /// of impl->shape exactly as read() does. Throws Error(EmptyModel) naming impl->file when it has none.
  static StepModel from_impl(std::unique_ptr<Impl> impl);

 private:
  StepModel();
  std::unique_ptr<Impl> impl_;
};

}  // namespace ergpath::occt
