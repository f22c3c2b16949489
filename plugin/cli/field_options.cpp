#include "plugin/cli/field_options.h"

#include <CLI/CLI.hpp>

#include <cctype>
#include <cmath>
#include <cstdlib>

#include "plugin/core/error.h"
#include "plugin/core/field_file.h"
#include "plugin/core/units.h"

namespace ergpath::cli {

void add_field_options(CLI::App& cmd, FieldOptions& o) {
  cmd.add_option(
      "--field", o.fields,
      "Force field \"FX, FY, FZ\" in newtons, or NAME=\"FX, FY, FZ\"; repeat for several named fields");
  cmd.add_option("--const", o.constants, "Constant NAME=VALUE seen by the formulas; repeatable");
  cmd.add_option("--field-file", o.field_file,
                 "TOML file with length_unit, [constants], [forces], potential");
  cmd.add_option("--field-length-unit", o.length_unit,
                 "Unit of x, y, z, s in the formulas: m (default), mm, cm, in, ft");
  cmd.add_option("--potential", o.potential,
                 "U(x, y, z) in joules of the total force, for a potential check");
}

double parse_number(const std::string& text, const std::string& what, ErrorKind kind) {
  const char* b = text.c_str();
  char* end = nullptr;
  const double v = std::strtod(b, &end);
  while (end && std::isspace(static_cast<unsigned char>(*end))) ++end;
  if (end == b || !end || *end != '\0' || !std::isfinite(v)) {
    throw Error(kind, what + ": '" + text + "' is not a finite number");
  }
  return v;
}

Vec3 parse_point(const std::string& text, const std::string& what) {
  std::vector<std::string> parts;
  std::string cur;
  for (char ch : text) {
    if (ch == ',') {
      parts.push_back(cur);
      cur.clear();
    } else {
      cur += ch;
    }
  }
  parts.push_back(cur);
  if (parts.size() != 3) throw Error(ErrorKind::BadOption, what + ": expected X,Y,Z, got '" + text + "'");
  return {parse_number(parts[0], what), parse_number(parts[1], what), parse_number(parts[2], what)};
}

std::pair<std::string, std::string> split_named_field(const std::string& text) {
  std::size_t i = 0;
  while (i < text.size() && std::isspace(static_cast<unsigned char>(text[i]))) ++i;
  const std::size_t b = i;
  if (i < text.size() && (std::isalpha(static_cast<unsigned char>(text[i])) || text[i] == '_')) {
    while (i < text.size() && (std::isalnum(static_cast<unsigned char>(text[i])) || text[i] == '_')) ++i;
    const std::size_t e = i;
    while (i < text.size() && std::isspace(static_cast<unsigned char>(text[i]))) ++i;
    if (i < text.size() && text[i] == '=' && (i + 1 >= text.size() || text[i + 1] != '=')) {
      return {text.substr(b, e - b), text.substr(i + 1)};
    }
  }
  return {"", text};
}

FieldSpec make_field_spec(const FieldOptions& o) {
  FieldSpec spec;
  if (!o.field_file.empty()) spec = read_field_file(o.field_file);
  for (const std::string& c : o.constants) {
    const auto eq = c.find('=');
    if (eq == std::string::npos || eq == 0) {
      throw Error(ErrorKind::BadConstant, "--const '" + c + "': expected NAME=VALUE");
    }
    std::string name = c.substr(0, eq);
    while (!name.empty() && std::isspace(static_cast<unsigned char>(name.back()))) name.pop_back();
    const double value = parse_number(c.substr(eq + 1), "--const " + name, ErrorKind::BadConstant);
    bool replaced = false;
    for (auto& [n, v] : spec.constants) {
      if (n == name) {
        v = value;
        replaced = true;
      }
    }
    if (!replaced) spec.constants.emplace_back(name, value);
  }
  int unnamed = 0;
  for (const std::string& f : o.fields) unnamed += split_named_field(f).first.empty() ? 1 : 0;
  int k = 0;
  for (const std::string& f : o.fields) {
    auto [name, formula] = split_named_field(f);
    if (name.empty()) name = unnamed == 1 ? "F" : "F" + std::to_string(++k);
    spec.forces.push_back({name, formula});
  }
  if (spec.forces.empty()) {
    throw Error(ErrorKind::BadFormula, "no force field: give --field \"FX, FY, FZ\" or --field-file FILE");
  }
  if (!o.length_unit.empty()) spec.length_unit_m = length_unit_m(o.length_unit);
  if (!o.potential.empty()) spec.potential = o.potential;
  return spec;
}

double parse_length_m(const std::string& text, const std::string& what) {
  std::size_t end = text.size();
  while (end > 0 && std::isalpha(static_cast<unsigned char>(text[end - 1]))) --end;
  const std::string unit = text.substr(end);
  std::string number = text.substr(0, end);
  while (!number.empty() && std::isspace(static_cast<unsigned char>(number.back()))) number.pop_back();
  const double scale = unit.empty() ? 1.0 : length_unit_m(unit);
  return parse_number(number, what) * scale;
}

occt::PathOptions make_path_options(const PathCliOptions& o) {
  occt::PathOptions p;
  p.reverse = o.reverse;
  if (!o.start.empty()) p.start_mm = parse_point(o.start, "--start");
  if (!(o.gap_tolerance_mm >= 0.0) || !std::isfinite(o.gap_tolerance_mm)) {
    throw Error(ErrorKind::BadOption, "--gap-tolerance must be a non-negative number of mm");
  }
  p.gap_tolerance_mm = o.gap_tolerance_mm;
  return p;
}

}  // namespace ergpath::cli
