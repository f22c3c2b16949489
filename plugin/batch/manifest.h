// A batch manifest: the cases a pipeline checks after each model revision, read from TOML (toml++).
//
// Format and a complete example: docs/batch.md. Structure only is checked here (TOML syntax, unknown keys,
// types, required keys, limits present); field files and formulas are resolved per case when the case runs,
// so one broken case does not stop the others.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "plugin/core/field.h"
#include "plugin/core/vec3.h"

namespace ergpath::batch {

/// Limits on a case's results. Each bound is optional; a case needs at least one.
struct Limits {
  std::optional<double> work_min_J, work_max_J;                      // signed work W, joules
  std::optional<double> work_magnitude_min_J, work_magnitude_max_J;  // |W|, joules
  std::optional<double> peak_force_max_N;                            // max |F . T| along the path, newtons
  std::optional<double> circulation_max_J;                           // |W| of a closed path, joules
  std::optional<double> length_min_m, length_max_m;                  // path length, metres
  /// Name of one force field whose work the work limits apply to; empty: the total of all fields.
  std::string work_of;
  bool empty() const;
};

/// Field keys written inline in a case or in [defaults], kept apart so that they can be laid over a
/// field file when the case is resolved.
struct FieldOverlay {
  std::vector<NamedField> forces;                         // replace same-named forces, else appended
  std::vector<std::pair<std::string, double>> constants;  // replace same-named constants, else appended
  std::optional<double> length_unit_m;                    // metres per formula length unit
  std::optional<std::string> potential;                   // joules
};

struct CaseSpec {
  std::size_t index = 0;         // 0-based position in the manifest
  int line = 0;                  // manifest line of the case table
  std::string name;              // unique within the manifest
  std::string model;             // as written (relative to the manifest)
  std::string model_file;        // resolved against the manifest's folder
  std::string selector = "all";  // path selector (docs/selectors.md)
  bool reverse = false;
  std::optional<Vec3> start_mm;  // open chain: start at the end nearest this point, millimetres
  double gap_tolerance_mm = 1e-3;
  double tolerance = 1e-10;      // relative error target on the work
  std::string field_file;        // resolved path, empty when none
  FieldOverlay defaults_fields;  // from [defaults], applied over the field file
  FieldOverlay case_fields;      // from the case itself, applied last
  Limits limits;
};

struct Manifest {
  std::string file;             // as given
  std::string title;            // optional
  std::string sha256;           // digest of the manifest's bytes (ties shard summaries together)
  std::vector<CaseSpec> cases;  // in manifest order
};

/// Reads a manifest. Throws Error(BadManifest) "file:line: message" for unreadable files, TOML syntax,
/// unknown keys, wrong types, missing name/model, duplicate names, bad values and cases without limits.
Manifest read_manifest(const std::string& file);

/// The same from text; relative file names resolve against `base_dir` ("" = current directory).
Manifest parse_manifest_text(const std::string& text, const std::string& origin, const std::string& base_dir);

/// The case's FieldSpec: field file (if any), then the [defaults] keys, then the case's own keys.
/// Throws Error(BadManifest) for an unreadable or wrong field file, Error(BadFormula) when no force is given.
FieldSpec resolve_field(const CaseSpec& c);

}  // namespace ergpath::batch
