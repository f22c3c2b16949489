#include "curl_check.h"

#include <cmath>
#include <sstream>
#include <vector>

#include "arc_length.h"
#include "error.h"

namespace ergpath {

namespace {

// Difference step as a fraction of the path length: balances truncation (step^2) against round-off
// (eps / step) of central differences (common practice, no source).
constexpr double kStepFraction = 1e-4;

}  // namespace

CurlEstimate estimate_curl(const Path& path, const FieldSpec& spec, int samples) {
  if (samples < 1) throw Error(ErrorKind::BadOption, "curl check needs at least one sample");
  FieldEvaluator field(spec);
  CurlEstimate out;
  out.samples = samples;
  if (field.uses_arc_length() || field.uses_tangent()) {
    out.applicable = false;
    return out;
  }
  const ArcLength arc(path);
  const double total_m = arc.total_m();
  const double to_field = path.length_unit_m / spec.length_unit_m;
  const double h = kStepFraction * total_m / spec.length_unit_m;  // field length unit
  std::vector<Vec3> f(field.count());
  auto total = [&](const Vec3& x) {
    FieldPoint q;
    q.position = x;
    field.eval(q, f.data());
    Vec3 sum;
    for (const Vec3& v : f) sum += v;
    if (!is_finite(sum)) {
      std::ostringstream os;
      os.precision(12);
      os << "field is not finite at (" << x.x << ", " << x.y << ", " << x.z << ") field units near the path";
      throw Error(ErrorKind::NonFiniteField, os.str());
    }
    return sum;
  };
  if (!(h > 0.0)) return out;
  for (int i = 0; i < samples; ++i) {
    const double s = total_m * (i + 0.5) / samples;
    const PathLocation loc = arc.locate(s);
    const Vec3 x = to_field * loc.position;
    // d/dx_j of F by central differences; curl = (dFz/dy - dFy/dz, dFx/dz - dFz/dx, dFy/dx - dFx/dy).
    const Vec3 dx = (1.0 / (2 * h)) * (total(x + Vec3{h, 0, 0}) - total(x - Vec3{h, 0, 0}));
    const Vec3 dy = (1.0 / (2 * h)) * (total(x + Vec3{0, h, 0}) - total(x - Vec3{0, h, 0}));
    const Vec3 dz = (1.0 / (2 * h)) * (total(x + Vec3{0, 0, h}) - total(x - Vec3{0, 0, h}));
    const Vec3 curl{dy.z - dz.y, dz.x - dx.z, dx.y - dy.x};
    const double c = norm(curl) / spec.length_unit_m;  // N per field unit -> N per metre
    const double m = norm(total(x));
    if (c > out.max_curl_N_per_m) {
      out.max_curl_N_per_m = c;
      out.position = loc.position;
      out.s_m = loc.s_m;
    }
    out.force_scale_N = std::max(out.force_scale_N, m);
  }
  out.relative = out.force_scale_N > 0.0 ? out.max_curl_N_per_m * total_m / out.force_scale_N : 0.0;
  return out;
}

}  // namespace ergpath
