// Edge listing (inventory) writers: a text table and JSON.
//
// Kernel-neutral: the caller fills ListedEdge rows from whatever model it read. Coordinates are
// millimetres, lengths metres, as in the rest of ergpath's model-facing output.
#pragma once

#include <iosfwd>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "plugin/core/vec3.h"

namespace ergpath::report {

struct ListedEdge {
  int index = 0;     // 1-based model edge index
  std::string type;  // "line", "circle", ..., "bspline", "offset", "other"
  Vec3 start_mm, end_mm;
  double length_m = 0.0;
  std::optional<std::string> name;  // null in JSON when absent
  bool degenerated = false;
  bool closed = false;
  bool seam = false;                    // a face's seam: the face borders itself along it
  std::optional<int> degree;            // Bezier/B-spline degree
  std::optional<int> poles;             // Bezier/B-spline pole count
  std::optional<bool> rational;         // Bezier/B-spline
  std::optional<std::string> basis;     // an offset curve's basis type
  std::vector<int> faces;               // 1-based face indices the edge bounds
  std::vector<int> wires;               // 1-based wire indices containing the edge
  std::optional<std::string> instance;  // assembly instance path, null when not in an assembly
};

struct ListingSummary {
  std::string file;
  std::string file_unit;             // the file's own length unit ("mm", "inch", ...)
  std::string schema;                // schema identifier as written
  std::string application_protocol;  // "AP203", "AP214", "AP242" or "unknown"
  int edge_count = 0;                // edges in the model (before filters)
  int face_count = 0;
  int wire_count = 0;
  std::map<std::string, int> by_type;  // counts of the listed edges by type
  int listed = 0;
  int degenerated = 0;               // listed edges that are degenerated
  std::vector<std::string> filters;  // human-readable filters applied, empty when none
};

/// Readable table: a header line (file, schema, unit, counts), column titles with units, one row per
/// edge, and a summary line of counts by type.
void write_edge_listing_text(std::ostream& out, const std::vector<ListedEdge>& edges,
                             const ListingSummary& summary);

/// {"edges": [{"index", "type", "start_mm", "end_mm", "length_m", "name", ...}], "summary": {...}}
void write_edge_listing_json(std::ostream& out, const std::vector<ListedEdge>& edges,
                             const ListingSummary& summary);

}  // namespace ergpath::report
