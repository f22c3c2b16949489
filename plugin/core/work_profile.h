// Work as a function of distance travelled: W(s) and the tangential force at chosen arc lengths.
//
// W(s_i) is integrated to tolerance on each stretch [s_(i-1), s_i] (adaptive Gauss-Kronrod, see
// work.h) and accumulated; it is not a sum over the samples. Positions come from t(s) (arc_length.h).
#pragma once

#include <cstddef>
#include <vector>

#include "field.h"
#include "path.h"
#include "work.h"

namespace ergpath {

struct ProfilePoint {
  double s_m = 0.0;                 // arc length from the path start, metres
  Vec3 position;                    // model length unit
  double tangential_force_N = 0.0;  // F . T of the total field, T = unit tangent in travel direction
  double work_J = 0.0;              // W from the path start to s_m, joules
  double error_J = 0.0;             // estimated |error| of work_J (sum of the stretch estimates)
  int edge = 0;                     // Segment::edge of the segment holding the point
  std::size_t segment = 0;          // index into Path::segments
  bool converged = true;            // every stretch up to here met its tolerance
};

/// One point per entry of s_m (metres, ascending, within [0, path length]); Error(BadOption) otherwise.
/// IntegrationOptions' window is ignored; its tolerances apply to every stretch.
std::vector<ProfilePoint> work_profile(const Path& path, const FieldSpec& field,
                                       const std::vector<double>& s_m,
                                       const IntegrationOptions& options = {});

}  // namespace ergpath
