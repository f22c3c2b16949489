// ergpath_check: a batch manifest of mechanism checks run from the DRAW shell by the CLI's run_check.
//
// The manifest names its own STEP files (relative to its folder), so no session shape is involved; the
// command exists so that a kernel-based application's scripts can gate on the same verdicts as a
// pipeline running `ergpath check`.
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <memory>
#include <sstream>
#include <string>

#include "plugin/cli/check_command.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"

namespace ergpath::draw {

namespace {

std::unique_ptr<CLI::App> check_options(cli::CheckArgs& a) {
  auto app = std::make_unique<CLI::App>(
      "Runs MANIFEST, a TOML manifest of mechanism checks, against its limits, as `ergpath check` does. "
      "Prints the summary table; the Tcl result is the verdict as the CLI's exit code gives it (0 every "
      "case passed, 1 a limit failed, 2 a case could not be computed), or the summary JSON (not printed) "
      "with --format json.",
      "ergpath_check");
  app->add_option("MANIFEST", a.manifest, "TOML manifest of cases (see docs/batch.md)")->required();
  cli::add_check_options(*app, a);
  return app;
}

int check_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  cli::CheckArgs a;
  const auto app = check_options(a);
  return run_draw_command(di, argc, argv, *app, usage_text(*app), [&]() {
    std::ostringstream out;
    const int verdict = cli::run_check(a, out);
    if (a.format == "json") return CommandOutput{"", out.str()};
    return CommandOutput{out.str(), std::to_string(verdict)};
  });
}

}  // namespace

void add_check_command(Draw_Interpretor& di) {
  cli::CheckArgs a;
  static const std::string usage = usage_text(*check_options(a));
  di.Add("ergpath_check", usage.c_str(), __FILE__, check_command, "ergpath");
}

}  // namespace ergpath::draw
