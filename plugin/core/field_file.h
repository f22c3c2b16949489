// Field files: a mechanism's loads (constants, length unit, named forces, optional potential) in TOML.
//
// Format (docs/field-file.md):
//   length_unit = "m"                 # unit of x, y, z, s in the formulas: m, mm, cm, in, ft
//   potential   = "m*g_n*z"           # optional U(x, y, z) in joules of the total force
//   [constants]
//   m = 12.5                          # numbers only
//   [forces]
//   gravity = "0, 0, -m*g_n"          # name = "FX, FY, FZ" in newtons
#pragma once

#include <string>

#include "field.h"

namespace toml {
inline namespace v3 {
class table;
}
}  // namespace toml

namespace ergpath {

/// Reads and validates a field file. Throws Error(BadManifest) with "file:line: message" for TOML syntax,
/// unknown keys and wrong types; formulas themselves are checked when a FieldEvaluator is built.
FieldSpec read_field_file(const std::string& path);

/// The same from TOML text; `origin` names the text in messages.
FieldSpec parse_field_text(const std::string& text, const std::string& origin);

/// Applies the keys of a field table (length_unit, potential, constants, forces) onto `spec`, for
/// embedding field tables in other TOML documents (batch manifests). Keys in `ignore` are skipped.
/// Later constants and forces replace earlier ones of the same name.
void apply_field_table(const toml::table& table, const std::string& origin, FieldSpec& spec,
                       const std::vector<std::string>& ignore = {});

}  // namespace ergpath
