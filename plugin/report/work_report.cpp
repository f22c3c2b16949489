#include "plugin/report/work_report.h"

#include <cmath>
#include <cstdio>
#include <iomanip>
#include <ostream>
#include <sstream>

namespace ergpath::report {

std::string format_number(double value, int digits) {
  if (value == 0.0) return "0";  // also folds -0
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*g", digits, value);
  return buf;
}

nlohmann::json position_mm_json(const Vec3& p, double model_unit_m) {
  const double k = model_unit_m * 1e3;
  return nlohmann::json::array({p.x * k, p.y * k, p.z * k});
}

namespace {

nlohmann::json peak_json(const Peak& p, double unit_m) {
  return {{"force_N", p.force_N},
          {"s_m", p.s_m},
          {"position_mm", position_mm_json(p.position, unit_m)},
          {"edge", p.edge}};
}

nlohmann::json fields_json(const std::vector<FieldWork>& fields) {
  nlohmann::json a = nlohmann::json::array();
  for (const FieldWork& f : fields) a.push_back({{"name", f.name}, {"work_J", f.work_J}});
  return a;
}

std::string pad(const std::string& s, std::size_t w, bool right = true) {
  if (s.size() >= w) return s;
  return right ? std::string(w - s.size(), ' ') + s : s + std::string(w - s.size(), ' ');
}

}  // namespace

nlohmann::json work_json(const WorkResult& r, const WorkContext& c) {
  nlohmann::json j;
  j["model"] = c.model;
  j["path"] = c.selector;
  j["work_J"] = r.work_J;
  j["error_estimate_J"] = r.error_J;
  j["abs_work_J"] = r.abs_work_J;
  j["length_m"] = r.length_m;
  j["evaluations"] = r.evaluations;
  j["status"] = r.status == Status::Converged ? "converged" : "tolerance_not_met";
  j["closed"] = r.closed;
  if (r.closed) j["circulation_J"] = r.work_J;
  j["field_length_unit"] = c.field_length_unit;
  j["tolerance"] = c.rel_tol;
  j["window_m"] = {r.window_from_m, r.window_to_m};
  if (r.potential_drop_J) {
    j["potential_drop_J"] = *r.potential_drop_J;
    j["potential_mismatch"] = r.potential_mismatch;
  }
  if (r.closed) j["loop_mismatch"] = r.loop_mismatch;
  if (c.curl) {
    j["curl_check"] = {{"applicable", c.curl->applicable},
                       {"samples", c.curl->samples},
                       {"max_curl_N_per_m", c.curl->max_curl_N_per_m},
                       {"force_scale_N", c.curl->force_scale_N},
                       {"relative", c.curl->relative},
                       {"position_mm", position_mm_json(c.curl->position, c.model_unit_m)},
                       {"s_m", c.curl->s_m}};
  }
  j["fields"] = fields_json(r.fields);
  j["peak_tangential_force"] = peak_json(r.peak, c.model_unit_m);
  nlohmann::json segs = nlohmann::json::array();
  for (const SegmentWork& s : r.segments) {
    nlohmann::json o{{"edge", s.edge},
                     {"reversed", s.reversed},
                     {"work_J", s.work_J},
                     {"error_estimate_J", s.error_J},
                     {"length_m", s.length_m},
                     {"evaluations", s.evaluations},
                     {"fields", fields_json(s.fields)},
                     {"peak_tangential_force", peak_json(s.peak, c.model_unit_m)}};
    o["name"] = s.name.empty() ? nlohmann::json() : nlohmann::json(s.name);
    segs.push_back(std::move(o));
  }
  j["segments"] = std::move(segs);
  j["notes"] = c.notes;
  return j;
}

void write_work_text(std::ostream& out, const WorkResult& r, const WorkContext& c,
                     const std::string& caution) {
  out << "Work along " << c.selector << " of " << c.model << " (" << r.segments.size() << " segment"
      << (r.segments.size() == 1 ? "" : "s") << (r.closed ? ", closed loop" : ", open") << ")\n";
  out << "Formula length unit: " << c.field_length_unit
      << "; relative tolerance: " << format_number(c.rel_tol, 3) << "\n\n";
  out << pad("#", 4) << pad("edge", 7) << "  " << pad("travel", 8, false) << pad("length [m]", 16)
      << pad("work [J]", 20) << pad("peak F.T [N]", 16) << "  name\n";
  for (std::size_t i = 0; i < r.segments.size(); ++i) {
    const SegmentWork& s = r.segments[i];
    out << pad(std::to_string(i + 1), 4) << pad(std::to_string(s.edge), 7) << "  "
        << pad(s.reversed ? "reverse" : "forward", 8, false) << pad(format_number(s.length_m), 16)
        << pad(format_number(s.work_J), 20) << pad(format_number(s.peak.force_N, 6), 16) << "  " << s.name
        << "\n";
  }
  out << "\n";
  out << (r.closed ? "Circulation (total work around the loop): " : "Total work: ") << format_number(r.work_J)
      << " J  (error estimate " << format_number(r.error_J, 2) << " J)\n";
  if (!r.closed && r.work_J < 0.0) {
    out << "The fields take " << format_number(-r.work_J, 6)
        << " J from the moving part: a drive must supply at least that much (plus what the model leaves "
           "out).\n";
  } else if (!r.closed && r.work_J > 0.0) {
    out << "The fields give " << format_number(r.work_J, 6)
        << " J to the moving part: a brake or damper must absorb it, or it becomes kinetic energy.\n";
  }
  out << "Path length: " << format_number(r.length_m) << " m";
  if (r.window_from_m > 0.0 || r.window_to_m < r.length_m) {
    out << "; integrated from s = " << format_number(r.window_from_m)
        << " m to s = " << format_number(r.window_to_m) << " m";
  }
  out << "\n";
  if (r.potential_drop_J) {
    out << "Potential check: -(U(end) - U(start)) = " << format_number(*r.potential_drop_J) << " J"
        << (r.potential_mismatch ? "  MISMATCH: the potential does not match the force field\n"
                                 : "  (agrees)\n");
  }
  if (r.closed && r.loop_mismatch) {
    out << "WARNING: the field was stated conservative but its circulation around this closed loop is not "
           "zero "
           "within tolerance.\n";
  }
  if (c.curl) {
    if (!c.curl->applicable) {
      out << "Curl check: not applicable (the field depends on s or on the travel direction)\n";
    } else {
      out << "Curl check: max |curl F| = " << format_number(c.curl->max_curl_N_per_m, 4) << " N/m over "
          << c.curl->samples << " samples (relative " << format_number(c.curl->relative, 3) << ")"
          << (c.curl->relative > 1e-6
                  ? ": the work depends on the path\n"
                  : ": no curl seen; path independence is plausible where the field is smooth\n");
    }
  }
  if (r.fields.size() > 1 || (r.fields.size() == 1 && r.fields[0].name != "F")) {
    out << "Work by field:\n";
    for (const FieldWork& f : r.fields)
      out << "  " << pad(f.name, 16, false) << format_number(f.work_J) << " J\n";
  }
  const double k = c.model_unit_m * 1e3;
  out << "Peak tangential force: " << format_number(r.peak.force_N, 6)
      << " N at s = " << format_number(r.peak.s_m, 6) << " m, (" << format_number(r.peak.position.x * k, 6)
      << ", " << format_number(r.peak.position.y * k, 6) << ", " << format_number(r.peak.position.z * k, 6)
      << ") mm on edge " << r.peak.edge << "\n";
  out << "Integrand evaluations: " << r.evaluations << "\n";
  if (r.status != Status::Converged)
    out << "WARNING: tolerance not met; the value above is the best estimate.\n";
  for (const std::string& n : c.notes) out << "Note: " << n << "\n";
  out << "\n" << caution << "\n";
}

}  // namespace ergpath::report
