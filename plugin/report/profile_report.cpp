#include "plugin/report/profile_report.h"

#include <cstdio>
#include <ostream>

#include "plugin/report/work_report.h"

namespace ergpath::report {

nlohmann::json profile_json(const std::vector<ProfilePoint>& points, const ProfileContext& c) {
  nlohmann::json a = nlohmann::json::array();
  const double k = c.model_unit_m * 1e3;
  for (const ProfilePoint& p : points) {
    a.push_back({{"s_m", p.s_m},
                 {"x_mm", p.position.x * k},
                 {"y_mm", p.position.y * k},
                 {"z_mm", p.position.z * k},
                 {"tangential_force_N", p.tangential_force_N},
                 {"work_J", p.work_J},
                 {"edge", p.edge}});
  }
  return {{"model", c.model}, {"path", c.selector}, {"length_m", c.length_m}, {"points", std::move(a)}};
}

void write_profile_csv(std::ostream& out, const std::vector<ProfilePoint>& points, const ProfileContext& c) {
  out << "s_m,x_mm,y_mm,z_mm,tangential_force_N,work_J,edge\n";
  const double k = c.model_unit_m * 1e3;
  char buf[256];
  for (const ProfilePoint& p : points) {
    std::snprintf(buf, sizeof buf, "%.17g,%.17g,%.17g,%.17g,%.17g,%.17g,%d\n", p.s_m, p.position.x * k,
                  p.position.y * k, p.position.z * k, p.tangential_force_N, p.work_J, p.edge);
    out << buf;
  }
}

void write_profile_text(std::ostream& out, const std::vector<ProfilePoint>& points, const ProfileContext& c,
                        const std::string& caution) {
  out << "Work profile along " << c.selector << " of " << c.model << " (length " << format_number(c.length_m)
      << " m)\n\n";
  char buf[256];
  std::snprintf(buf, sizeof buf, "%14s %12s %12s %12s %16s %18s %6s\n", "s [m]", "x [mm]", "y [mm]", "z [mm]",
                "F.T [N]", "W(s) [J]", "edge");
  out << buf;
  const double k = c.model_unit_m * 1e3;
  for (const ProfilePoint& p : points) {
    std::snprintf(buf, sizeof buf, "%14s %12s %12s %12s %16s %18s %6d\n", format_number(p.s_m, 9).c_str(),
                  format_number(p.position.x * k, 7).c_str(), format_number(p.position.y * k, 7).c_str(),
                  format_number(p.position.z * k, 7).c_str(), format_number(p.tangential_force_N, 8).c_str(),
                  format_number(p.work_J, 10).c_str(), p.edge);
    out << buf;
  }
  out << "\n" << caution << "\n";
}

}  // namespace ergpath::report
