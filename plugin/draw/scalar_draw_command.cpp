// ergpath_scalar: the integral of f ds along a session shape, computed by the CLI's run_scalar /
// run_scalar_on_path.
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <memory>
#include <optional>
#include <sstream>
#include <string>

#include "plugin/cli/scalar_command.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"
#include "plugin/draw/session_shape.h"

namespace ergpath::draw {

namespace {

struct ScalarCommandArgs {
  std::string shape;
  cli::ScalarArgs scalar;
};

std::unique_ptr<CLI::App> scalar_options(ScalarCommandArgs& a) {
  auto app = std::make_unique<CLI::App>(
      "Integral of f ds along SHAPE, a DRAW shape taken in millimetres (e.g. a cable's mass in kg from its "
      "linear density in kg/m), and the mean of f; the path is chosen as for ergpath_work. Prints the "
      "report; the Tcl result is the integral in (unit of f) x metres, or the JSON report (not printed) "
      "with --format json.",
      "ergpath_scalar");
  app->add_option("SHAPE", a.shape, "DRAW shape: an edge, a wire, a compound of edges, a solid, ...")
      ->required();
  cli::add_scalar_options(*app, a.scalar);
  return app;
}

int scalar_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  ScalarCommandArgs a;
  const auto app = scalar_options(a);
  return run_draw_command(di, argc, argv, *app, usage_text(*app), [&]() {
    const occt::StepModel model = session_model(a.shape);
    a.scalar.path.model = model.file();
    const std::optional<Path> own =
        app->get_option("--path")->count() == 0 ? own_path(model, a.scalar.path) : std::nullopt;
    std::ostringstream report;
    const ScalarResult r = own ? cli::run_scalar_on_path(model, *own, a.scalar, report)
                               : cli::run_scalar(model, a.scalar, report);
    if (a.scalar.format == "json") return CommandOutput{"", report.str()};
    return CommandOutput{report.str(), tcl_number(r.value)};
  });
}

}  // namespace

void add_scalar_command(Draw_Interpretor& di) {
  ScalarCommandArgs a;
  static const std::string usage = usage_text(*scalar_options(a));
  di.Add("ergpath_scalar", usage.c_str(), __FILE__, scalar_command, "ergpath");
}

}  // namespace ergpath::draw
