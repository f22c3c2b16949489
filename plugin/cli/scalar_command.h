// The scalar line integral behind `ergpath scalar`, shared by the CLI and the DRAW plugin.
#pragma once

#include <iosfwd>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/field_options.h"
#include "plugin/core/path.h"
#include "plugin/core/scalar_integral.h"

namespace CLI {
class App;
}

namespace ergpath::cli {

struct ScalarArgs {
  PathCliOptions path;
  std::string integrand;               // f(x, y, z, s, tx, ty, tz), e.g. a linear density in kg/m
  std::vector<std::string> constants;  // NAME=VALUE
  std::string length_unit = "m";       // unit of x, y, z, s in the formula
  std::string from, to;                // distance window, metres or with a unit suffix; empty: path ends
  double tolerance = 1e-10;            // relative error target
  long max_evaluations = 20000000;
  std::string format = "text";  // text or json
};

/// Registers --path/--reverse/--start/--gap-tolerance, --integrand, --const, --field-length-unit,
/// --from/--to, --tolerance, --max-evaluations and --format on `cmd` (not the MODEL positional, which
/// the CLI adds and the DRAW plugin replaces by a shape name).
void add_scalar_options(CLI::App& cmd, ScalarArgs& args);

/// Integrates f ds (value in (unit of f) x metres) along the edges args.path selects on an already
/// loaded model, and writes the text or JSON report (integral, error estimate, mean of f) to `out`.
/// Throws Error for bad input (BadOption, BadConstant, BadFormula, selector and path errors) and
/// ToleranceNotMet with the best value in the message.
ScalarResult run_scalar(const occt::StepModel& model, const ScalarArgs& args, std::ostream& out);

/// As run_scalar, along a path the caller has already built from `model` (e.g. a wire of a DRAW
/// session in its own order); args.path only labels the report. Same errors, except those of path
/// building.
ScalarResult run_scalar_on_path(const occt::StepModel& model, const Path& path, const ScalarArgs& args,
                                std::ostream& out);

}  // namespace ergpath::cli
