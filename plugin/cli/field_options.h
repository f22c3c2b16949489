// Command-line options shared by the commands that integrate a field along a path.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "kernel_adapters/occt/path_builder.h"
#include "plugin/core/error.h"
#include "plugin/core/field.h"
#include "plugin/core/work.h"

namespace CLI {
class App;
}

namespace ergpath::cli {

struct FieldOptions {
  std::vector<std::string> fields;     // "FX, FY, FZ" or NAME="FX, FY, FZ"
  std::vector<std::string> constants;  // NAME=VALUE
  std::string field_file;              // TOML field file, optional
  std::string length_unit;             // empty: the field file's, else "m"
  std::string potential;
};

struct PathCliOptions {
  std::string model;
  std::string selector = "all";
  bool reverse = false;
  std::string start;  // "X,Y,Z" in mm
  double gap_tolerance_mm = 1e-3;
};

void add_field_options(CLI::App& cmd, FieldOptions& o);

/// Builds the FieldSpec: field file first, then --const, --field, --field-length-unit, --potential on top.
/// Throws Error(BadConstant / BadFormula / BadOption / BadManifest) with the offending text.
FieldSpec make_field_spec(const FieldOptions& o);

/// Splits "NAME=FORMULA" when the text starts with an identifier and a single '='; else name is empty.
std::pair<std::string, std::string> split_named_field(const std::string& text);

/// Parses "X,Y,Z" (three finite numbers). Throws Error(BadOption) naming `what`.
Vec3 parse_point(const std::string& text, const std::string& what);

/// Parses a finite double; throws Error(kind) with "what: 'text' is not a number".
double parse_number(const std::string& text, const std::string& what, ErrorKind kind = ErrorKind::BadOption);

/// "0.25" (metres) or a number with a unit suffix: "250mm", "25 cm", "10in", "1ft", "0.25m".
double parse_length_m(const std::string& text, const std::string& what);

occt::PathOptions make_path_options(const PathCliOptions& o);

}  // namespace ergpath::cli
