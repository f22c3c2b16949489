// The edge listing behind `ergpath list`, shared by the CLI and the DRAW plugin.
#pragma once

#include <iosfwd>
#include <optional>
#include <string>

#include "kernel_adapters/occt/step_model.h"

namespace CLI {
class App;
}

namespace ergpath::cli {

struct ListArgs {
  std::string model;            // STEP file (the CLI's positional; DRAW names a shape instead)
  std::string format = "text";  // text or json
  std::string types;            // comma-separated type names
  std::string name;             // glob ('*', '?')
  std::optional<double> min_length_m, max_length_m;  // metres
  std::optional<double> within_mm;                   // millimetres, with `near`
  std::string near;                                  // "X,Y,Z" in millimetres
};

/// Registers --format, --type, --name, --min-length, --max-length, --near and --within on `cmd`
/// (not the MODEL positional, which the CLI adds and the DRAW plugin replaces by a shape name).
void add_list_options(CLI::App& cmd, ListArgs& args);

/// Writes the text table or JSON listing of the edges of `model` that pass the filters of `args`: per
/// edge its index, type, ends (model length unit, millimetres), length (metres), name, flags, faces,
/// wires, assembly instance and spline degree; then the summary. Returns the number of edges listed.
/// Throws Error(BadOption) for an unknown type name, a malformed --near point, a negative or non-finite
/// length or distance, or --within without --near.
int run_list(const occt::StepModel& model, const ListArgs& args, std::ostream& out);

}  // namespace ergpath::cli
