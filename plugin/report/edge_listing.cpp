#include "plugin/report/edge_listing.h"

#include <nlohmann/json.hpp>

#include <cstdio>
#include <ostream>
#include <sstream>

namespace ergpath::report {

namespace {

// Coordinates to 1e-6 mm and lengths to 1e-12 m: the digits a STEP file's 12 significant digits carry
// for parts up to a few metres.
std::string coords(const Vec3& p) {
  char buf[128];
  std::snprintf(buf, sizeof buf, "(%.6f, %.6f, %.6f)", p.x, p.y, p.z);
  return buf;
}

std::string type_detail(const ListedEdge& e) {
  std::string t = e.type;
  if (e.degree) t += " d" + std::to_string(*e.degree);
  if (e.poles) t += " p" + std::to_string(*e.poles);
  if (e.rational && *e.rational) t += " rational";
  if (e.basis) t += " of " + *e.basis;
  return t;
}

std::string index_list(const std::vector<int>& v) {
  if (v.empty()) return "-";
  std::string s;
  for (std::size_t i = 0; i < v.size(); ++i) s += (i ? "," : "") + std::to_string(v[i]);
  return s;
}

std::string counts(const std::map<std::string, int>& by_type) {
  std::string s;
  for (const auto& [type, n] : by_type) s += (s.empty() ? "" : ", ") + type + " " + std::to_string(n);
  return s.empty() ? "none" : s;
}

}  // namespace

void write_edge_listing_text(std::ostream& out, const std::vector<ListedEdge>& edges,
                             const ListingSummary& s) {
  out << "edges of " << s.file << " (schema " << s.schema << ", " << s.application_protocol << "; file unit "
      << s.file_unit << "; coordinates in mm, lengths in m)\n";
  for (const std::string& f : s.filters) out << "filter: " << f << "\n";
  char line[512];
  std::snprintf(line, sizeof line, "%6s  %-22s %-38s %-38s %16s  %-5s %-9s %-9s %-20s %s\n", "index", "type",
                "start_mm (x, y, z)", "end_mm (x, y, z)", "length_m", "flags", "faces", "wires", "instance",
                "name");
  out << line;
  for (const ListedEdge& e : edges) {
    std::string flags;
    if (e.degenerated) flags += 'D';
    if (e.closed) flags += 'C';
    if (e.seam) flags += 'S';
    if (flags.empty()) flags = "-";
    std::snprintf(line, sizeof line, "%6d  %-22s %-38s %-38s %16.12f  %-5s %-9s %-9s %-20s %s\n", e.index,
                  type_detail(e).c_str(), coords(e.start_mm).c_str(), coords(e.end_mm).c_str(), e.length_m,
                  flags.c_str(), index_list(e.faces).c_str(), index_list(e.wires).c_str(),
                  e.instance ? e.instance->c_str() : "-", e.name ? e.name->c_str() : "-");
    out << line;
  }
  out << "flags: D degenerated (no 3-D curve), C closed, S seam\n";
  out << "summary: " << s.listed << " of " << s.edge_count << " edges listed (" << counts(s.by_type) << "); "
      << s.degenerated << " degenerated; " << s.face_count << " faces, " << s.wire_count
      << " wires; file unit " << s.file_unit << "; schema " << s.schema << " (" << s.application_protocol
      << ")\n";
}

void write_edge_listing_json(std::ostream& out, const std::vector<ListedEdge>& edges,
                             const ListingSummary& s) {
  using nlohmann::json;
  auto vec = [](const Vec3& p) { return json::array({p.x, p.y, p.z}); };
  auto opt = [](const auto& v) { return v ? json(*v) : json(nullptr); };
  json list = json::array();
  for (const ListedEdge& e : edges) {
    list.push_back({{"index", e.index},
                    {"type", e.type},
                    {"start_mm", vec(e.start_mm)},
                    {"end_mm", vec(e.end_mm)},
                    {"length_m", e.length_m},
                    {"name", opt(e.name)},
                    {"degenerated", e.degenerated},
                    {"closed", e.closed},
                    {"seam", e.seam},
                    {"degree", opt(e.degree)},
                    {"poles", opt(e.poles)},
                    {"rational", opt(e.rational)},
                    {"basis", opt(e.basis)},
                    {"faces", e.faces},
                    {"wires", e.wires},
                    {"instance", opt(e.instance)}});
  }
  json summary = {{"file", s.file},
                  {"file_unit", s.file_unit},
                  {"schema", s.schema},
                  {"application_protocol", s.application_protocol},
                  {"edge_count", s.edge_count},
                  {"face_count", s.face_count},
                  {"wire_count", s.wire_count},
                  {"listed", s.listed},
                  {"degenerated", s.degenerated},
                  {"by_type", s.by_type},
                  {"filters", s.filters},
                  {"length_unit", "m"},
                  {"coordinate_unit", "mm"}};
  out << json{{"edges", list}, {"summary", summary}}.dump(2) << "\n";
}

}  // namespace ergpath::report
