// Writers of a work result: JSON (stable keys relied on by scripts) and a readable text table.
#pragma once

#include <nlohmann/json.hpp>

#include <iosfwd>
#include <optional>
#include <string>
#include <vector>

#include "plugin/core/curl_check.h"
#include "plugin/core/work.h"

namespace ergpath::report {

/// What the result was computed from, echoed in reports.
struct WorkContext {
  std::string model;              // file as given by the user
  std::string selector;           // path selector text
  double model_unit_m = 1e-3;     // metres per model length unit of positions in the result
  std::string field_length_unit;  // "m", "mm", ... as seen by the formulas
  double rel_tol = 0.0;
  std::vector<std::string> notes;    // e.g. skipped degenerated edges
  std::optional<CurlEstimate> curl;  // when a curl check was asked for
};

/// JSON object: work_J, error_estimate_J, length_m, evaluations, status, closed, segments[{edge, reversed,
/// work_J, length_m, ...}], fields[{name, work_J}], peak_tangential_force {force_N, s_m, position_mm, edge}.
nlohmann::json work_json(const WorkResult& result, const WorkContext& context);

/// Text table with units, per-field totals, the peak, notes and the caution line.
void write_work_text(std::ostream& out, const WorkResult& result, const WorkContext& context,
                     const std::string& caution);

/// Position in millimetres from model units.
nlohmann::json position_mm_json(const Vec3& p, double model_unit_m);

/// Formats a double with `digits` significant digits, no trailing noise ("-147.0986").
std::string format_number(double value, int digits = 10);

}  // namespace ergpath::report
