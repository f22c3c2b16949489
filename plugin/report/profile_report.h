// Writers of a work profile W(s): JSON, CSV and a text table.
#pragma once

#include <nlohmann/json.hpp>

#include <iosfwd>
#include <string>
#include <vector>

#include "plugin/core/work_profile.h"

namespace ergpath::report {

struct ProfileContext {
  std::string model;
  std::string selector;
  double model_unit_m = 1e-3;  // metres per model length unit of ProfilePoint::position
  double length_m = 0.0;       // path length
};

/// {"model", "path", "length_m", "points": [{"s_m", "x_mm", "y_mm", "z_mm", "tangential_force_N", "work_J",
/// "edge"}]}
nlohmann::json profile_json(const std::vector<ProfilePoint>& points, const ProfileContext& context);

/// Header line then one row per point, columns as in the JSON points; full double precision.
void write_profile_csv(std::ostream& out, const std::vector<ProfilePoint>& points,
                       const ProfileContext& context);

void write_profile_text(std::ostream& out, const std::vector<ProfilePoint>& points,
                        const ProfileContext& context, const std::string& caution);

}  // namespace ergpath::report
