// The work computation behind `ergpath work`, shared by the CLI and the DRAW plugin.
#pragma once

#include <iosfwd>
#include <string>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/field_options.h"
#include "plugin/core/work.h"

namespace CLI {
class App;
}

namespace ergpath::cli {

struct WorkArgs {
  PathCliOptions path;
  FieldOptions field;
  double tolerance = 1e-10;
  long max_evaluations = 20000000;
  std::string format = "text";  // text or json
};

/// Registers --path/--reverse/--start/--gap-tolerance, the field options, --tolerance and --format on `cmd`
/// (not the MODEL positional, which the CLI adds and the DRAW plugin replaces by a shape name).
void add_work_options(CLI::App& cmd, WorkArgs& args);

/// Computes the work on an already loaded model and writes the text or JSON report to `out`.
/// Throws Error for bad input, ToleranceNotMet (with the best value in the message) and NonFiniteField.
WorkResult run_work(const occt::StepModel& model, const WorkArgs& args, std::ostream& out);

}  // namespace ergpath::cli
