// The work computation behind `ergpath work`, shared by the CLI and the DRAW plugin.
#pragma once

#include <iosfwd>
#include <string>
#include <vector>

#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/field_options.h"
#include "plugin/core/path.h"
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
  std::string from, to;         // distance window, metres or with a unit suffix; empty: path start / end
  bool conservative = false;    // the user states the total field is conservative (closed loops are checked)
  bool curl_check = false;      // sample curl F along the path and report it
  std::string format = "text";  // text or json
};

/// Registers --path/--reverse/--start/--gap-tolerance, the field options, --tolerance and --format on `cmd`
/// (not the MODEL positional, which the CLI adds and the DRAW plugin replaces by a shape name).
void add_work_options(CLI::App& cmd, WorkArgs& args);

/// Computes the work on an already loaded model and writes the text or JSON report to `out`.
/// Throws Error for bad input, ToleranceNotMet (with the best value in the message) and NonFiniteField.
WorkResult run_work(const occt::StepModel& model, const WorkArgs& args, std::ostream& out);

/// As run_work, along a path the caller has already built from `model` (e.g. a wire of a DRAW session
/// in its own order); args.path only labels the report. Same errors, except those of path building.
/// `notes` (e.g. skipped degenerated edges, a changed order) are printed under the report.
WorkResult run_work_on_path(const occt::StepModel& model, const Path& path, const WorkArgs& args,
                            std::ostream& out, const std::vector<std::string>& notes = {});

}  // namespace ergpath::cli
