#include "plugin/batch/manifest.h"

#include <toml++/toml.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include "plugin/batch/sha256.h"
#include "plugin/core/error.h"
#include "plugin/core/field_file.h"
#include "plugin/core/units.h"

namespace ergpath::batch {

namespace fs = std::filesystem;

bool Limits::empty() const {
  return !work_min_J && !work_max_J && !work_magnitude_min_J && !work_magnitude_max_J && !peak_force_max_N &&
         !circulation_max_J && !length_min_m && !length_max_m;
}

namespace {

const std::vector<std::string>& case_keys() {
  static const std::vector<std::string> keys{"name",      "model",      "path",
                                             "reverse",   "start_mm",   "gap_tolerance_mm",
                                             "tolerance", "field_file", "limits"};
  return keys;
}

const std::vector<std::string>& field_keys() {
  static const std::vector<std::string> keys{"length_unit", "potential", "constants", "forces"};
  return keys;
}

bool contains(const std::vector<std::string>& v, const std::string& s) {
  return std::find(v.begin(), v.end(), s) != v.end();
}

std::string at(const std::string& origin, const toml::node& node) {
  return origin + ":" + std::to_string(node.source().begin.line);
}

[[noreturn]] void fail(const std::string& where, const std::string& what) {
  throw Error(ErrorKind::BadManifest, where + ": " + what);
}

double number(const toml::node& node, const std::string& origin, const std::string& key) {
  if (node.is_number()) {
    const double v = *node.value<double>();
    if (std::isfinite(v)) return v;
  }
  fail(at(origin, node), "'" + key + "' must be a finite number");
}

std::string text(const toml::node& node, const std::string& origin, const std::string& key) {
  if (auto v = node.value_exact<std::string>()) return *v;
  fail(at(origin, node), "'" + key + "' must be a string");
}

bool boolean(const toml::node& node, const std::string& origin, const std::string& key) {
  if (auto v = node.value_exact<bool>()) return *v;
  fail(at(origin, node), "'" + key + "' must be true or false");
}

std::string resolve(const std::string& base_dir, const std::string& file) {
  const fs::path p(file);
  if (p.is_absolute() || base_dir.empty()) return p.lexically_normal().string();
  return (fs::path(base_dir) / p).lexically_normal().string();
}

void parse_limits(const toml::table& t, const std::string& origin, Limits& l) {
  struct Bound {
    const char* key;
    std::optional<double> Limits::*member;
  };
  static const Bound bounds[] = {{"work_min_J", &Limits::work_min_J},
                                 {"work_max_J", &Limits::work_max_J},
                                 {"work_magnitude_min_J", &Limits::work_magnitude_min_J},
                                 {"work_magnitude_max_J", &Limits::work_magnitude_max_J},
                                 {"peak_force_max_N", &Limits::peak_force_max_N},
                                 {"circulation_max_J", &Limits::circulation_max_J},
                                 {"length_min_m", &Limits::length_min_m},
                                 {"length_max_m", &Limits::length_max_m}};
  for (const auto& [k, node] : t) {
    const std::string key(k.str());
    if (key == "work_of") {
      l.work_of = text(node, origin, key);
      if (l.work_of.empty()) fail(at(origin, node), "'work_of' must name a force field");
      continue;
    }
    const Bound* b =
        std::find_if(std::begin(bounds), std::end(bounds), [&](const Bound& x) { return key == x.key; });
    if (b == std::end(bounds)) {
      fail(at(origin, node),
           "unknown limit '" + key +
               "' (expected work_min_J, work_max_J, work_magnitude_min_J, work_magnitude_max_J, "
               "peak_force_max_N, circulation_max_J, length_min_m, length_max_m, work_of)");
    }
    const double v = number(node, origin, key);
    const bool non_negative = key != "work_min_J" && key != "work_max_J";
    if (non_negative && v < 0.0) fail(at(origin, node), "'" + key + "' must not be negative");
    l.*(b->member) = v;
  }
}

// Reads the keys of a case table (or of [defaults]) onto `c`, its field keys onto `overlay`.
void parse_case_keys(const toml::table& t, const std::string& origin, const std::string& base_dir,
                     bool is_defaults, CaseSpec& c, FieldOverlay& overlay) {
  for (const auto& [k, node] : t) {
    const std::string key(k.str());
    if (!contains(case_keys(), key) && !contains(field_keys(), key)) {
      fail(at(origin, node),
           "unknown key '" + key +
               "' (expected name, model, path, reverse, start_mm, gap_tolerance_mm, tolerance, "
               "field_file, limits, length_unit, potential, constants or forces)");
    }
    if (key == "name") {
      if (is_defaults) fail(at(origin, node), "'name' belongs to a case, not to [defaults]");
      c.name = text(node, origin, key);
    } else if (key == "model") {
      c.model = text(node, origin, key);
      c.model_file = resolve(base_dir, c.model);
    } else if (key == "path") {
      c.selector = text(node, origin, key);
    } else if (key == "reverse") {
      c.reverse = boolean(node, origin, key);
    } else if (key == "start_mm") {
      const toml::array* a = node.as_array();
      if (!a || a->size() != 3)
        fail(at(origin, node), "'start_mm' must be an array of three numbers [x, y, z]");
      c.start_mm =
          Vec3{number((*a)[0], origin, key), number((*a)[1], origin, key), number((*a)[2], origin, key)};
    } else if (key == "gap_tolerance_mm") {
      c.gap_tolerance_mm = number(node, origin, key);
      if (c.gap_tolerance_mm < 0.0) fail(at(origin, node), "'gap_tolerance_mm' must not be negative");
    } else if (key == "tolerance") {
      c.tolerance = number(node, origin, key);
      if (!(c.tolerance > 0.0 && c.tolerance < 1.0)) {
        fail(at(origin, node), "'tolerance' must be a relative tolerance in (0, 1)");
      }
    } else if (key == "field_file") {
      c.field_file = resolve(base_dir, text(node, origin, key));
    } else if (key == "limits") {
      const toml::table* lt = node.as_table();
      if (!lt) fail(at(origin, node), "'limits' must be a table");
      parse_limits(*lt, origin, c.limits);
    } else if (key == "length_unit") {
      try {
        overlay.length_unit_m = length_unit_m(text(node, origin, key));
      } catch (const Error& e) {
        if (e.kind() == ErrorKind::BadManifest) throw;
        fail(at(origin, node), e.what());
      }
    }
  }
  // Types of potential, constants and forces are checked by the field-file reader itself.
  FieldSpec inline_fields;
  std::vector<std::string> ignore = case_keys();
  ignore.push_back("length_unit");
  apply_field_table(t, origin, inline_fields, ignore);
  for (auto& c2 : inline_fields.constants) {
    auto it = std::find_if(overlay.constants.begin(), overlay.constants.end(),
                           [&](const auto& x) { return x.first == c2.first; });
    if (it != overlay.constants.end())
      it->second = c2.second;
    else
      overlay.constants.push_back(c2);
  }
  for (auto& f : inline_fields.forces) {
    auto it = std::find_if(overlay.forces.begin(), overlay.forces.end(),
                           [&](const NamedField& x) { return x.name == f.name; });
    if (it != overlay.forces.end())
      it->formula = f.formula;
    else
      overlay.forces.push_back(f);
  }
  if (t.contains("potential")) overlay.potential = inline_fields.potential;
}

void check_limits(const CaseSpec& c, const std::string& where) {
  const Limits& l = c.limits;
  if (l.empty()) {
    fail(where, "case '" + c.name + "' has no limit to check (give a [limits] table, see docs/batch.md)");
  }
  auto ordered = [&](const std::optional<double>& lo, const std::optional<double>& hi, const char* what) {
    if (lo && hi && *lo > *hi)
      fail(where, std::string("case '") + c.name + "': " + what + " minimum exceeds maximum");
  };
  ordered(l.work_min_J, l.work_max_J, "work");
  ordered(l.work_magnitude_min_J, l.work_magnitude_max_J, "work magnitude");
  ordered(l.length_min_m, l.length_max_m, "length");
}

void lay_over(FieldSpec& spec, const FieldOverlay& o) {
  for (const auto& [name, value] : o.constants) {
    auto it = std::find_if(spec.constants.begin(), spec.constants.end(),
                           [&](const auto& x) { return x.first == name; });
    if (it != spec.constants.end())
      it->second = value;
    else
      spec.constants.emplace_back(name, value);
  }
  for (const NamedField& f : o.forces) {
    auto it = std::find_if(spec.forces.begin(), spec.forces.end(),
                           [&](const NamedField& x) { return x.name == f.name; });
    if (it != spec.forces.end())
      it->formula = f.formula;
    else
      spec.forces.push_back(f);
  }
  if (o.length_unit_m) spec.length_unit_m = *o.length_unit_m;
  if (o.potential) spec.potential = *o.potential;
}

}  // namespace

Manifest parse_manifest_text(const std::string& text_in, const std::string& origin,
                             const std::string& base_dir) {
  toml::table root;
  try {
    root = toml::parse(text_in, origin);
  } catch (const toml::parse_error& e) {
    throw Error(ErrorKind::BadManifest,
                origin + ":" + std::to_string(e.source().begin.line) + ": " + std::string(e.description()));
  }
  Manifest m;
  m.file = origin;
  m.sha256 = sha256_hex(text_in);
  CaseSpec defaults;
  FieldOverlay default_fields;
  const toml::array* cases = nullptr;
  for (const auto& [k, node] : root) {
    const std::string key(k.str());
    if (key == "title") {
      m.title = text(node, origin, key);
    } else if (key == "defaults") {
      const toml::table* t = node.as_table();
      if (!t) fail(at(origin, node), "'defaults' must be a table");
      parse_case_keys(*t, origin, base_dir, true, defaults, default_fields);
    } else if (key == "case") {
      cases = node.as_array();
      if (!cases || !cases->is_array_of_tables()) {
        fail(at(origin, node), "'case' must be an array of tables, written [[case]]");
      }
    } else {
      fail(at(origin, node), "unknown top-level key '" + key + "' (expected title, [defaults] or [[case]])");
    }
  }
  if (!cases || cases->empty()) fail(origin, "no [[case]] given");
  std::set<std::string> names;
  for (const toml::node& node : *cases) {
    const toml::table& t = *node.as_table();
    CaseSpec c = defaults;
    c.defaults_fields = default_fields;
    c.index = m.cases.size();
    c.line = static_cast<int>(t.source().begin.line);
    const std::string where = origin + ":" + std::to_string(c.line);
    parse_case_keys(t, origin, base_dir, false, c, c.case_fields);
    if (c.name.empty()) fail(where, "case without a 'name'");
    if (!names.insert(c.name).second) fail(where, "case name '" + c.name + "' is used twice");
    if (c.model.empty())
      fail(where, "case '" + c.name + "' has no 'model' (give it in the case or in [defaults])");
    check_limits(c, where);
    m.cases.push_back(std::move(c));
  }
  return m;
}

Manifest read_manifest(const std::string& file) {
  std::ifstream in(file, std::ios::binary);
  if (!in) throw Error(ErrorKind::BadManifest, file + ": cannot open manifest");
  std::ostringstream ss;
  ss << in.rdbuf();
  if (!in.good() && !in.eof()) throw Error(ErrorKind::BadManifest, file + ": cannot read manifest");
  return parse_manifest_text(ss.str(), file, fs::path(file).parent_path().string());
}

FieldSpec resolve_field(const CaseSpec& c) {
  FieldSpec spec;
  if (!c.field_file.empty()) spec = read_field_file(c.field_file);
  lay_over(spec, c.defaults_fields);
  lay_over(spec, c.case_fields);
  if (spec.forces.empty()) {
    throw Error(ErrorKind::BadFormula, "case '" + c.name + "': no force field (give [forces] or field_file)");
  }
  return spec;
}

}  // namespace ergpath::batch
