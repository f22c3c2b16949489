#include "work_profile.h"

#include <algorithm>
#include <sstream>

#include "error.h"
#include "work_integrator.h"

namespace ergpath {

std::vector<ProfilePoint> work_profile(const Path& path, const FieldSpec& field,
                                       const std::vector<double>& s_m, const IntegrationOptions& options) {
  detail::WorkIntegrator integrator(path, field, options);
  const double total = integrator.arc().total_m();
  const double slack = 1e-12 * total;
  for (std::size_t i = 0; i < s_m.size(); ++i) {
    const bool ordered = i == 0 || s_m[i] >= s_m[i - 1];
    if (!(s_m[i] >= -slack && s_m[i] <= total + slack) || !ordered) {
      std::ostringstream os;
      os.precision(12);
      os << "profile distance #" << i + 1 << " (" << s_m[i] << " m) must be ascending and within [0, "
         << total << "] m";
      throw Error(ErrorKind::BadOption, os.str());
    }
  }
  std::vector<ProfilePoint> out;
  out.reserve(s_m.size());
  double from = 0.0, work = 0.0, error = 0.0;
  bool converged = true;
  for (double s : s_m) {
    s = std::min(std::max(s, 0.0), total);
    if (s > from) {
      const WorkResult r = integrator.run(from, s, false);
      work += r.work_J;
      error += r.error_J;
      converged = converged && r.status == Status::Converged;
      from = s;
    }
    const PathLocation loc = integrator.arc().locate(s);
    ProfilePoint p;
    p.s_m = s;
    p.position = loc.position;
    p.tangential_force_N = integrator.tangential_N(loc.segment, loc.t);
    p.work_J = work;
    p.error_J = error;
    p.edge = loc.edge;
    p.segment = loc.segment;
    p.converged = converged;
    out.push_back(p);
  }
  return out;
}

}  // namespace ergpath
