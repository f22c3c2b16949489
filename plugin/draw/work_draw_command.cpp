// ergpath_work: the work along a session shape, computed by the CLI's run_work / run_work_on_path.
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <memory>
#include <optional>
#include <sstream>
#include <string>

#include "plugin/cli/work_command.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"
#include "plugin/draw/session_shape.h"

namespace ergpath::draw {

namespace {

struct WorkCommandArgs {
  std::string shape;
  cli::WorkArgs work;
};

std::unique_ptr<CLI::App> work_options(WorkCommandArgs& a) {
  auto app = std::make_unique<CLI::App>(
      "Work (J) of force fields along SHAPE, a DRAW shape taken in millimetres. Without --path an edge or a "
      "wire is travelled in its own order and orientation, any other shape chains all its edges; --path "
      "selects edges by the numbers ergpath_list shows. Prints the report; the Tcl result is the total work "
      "in joules, or the JSON report (not printed) with --format json.",
      "ergpath_work");
  app->add_option("SHAPE", a.shape, "DRAW shape: an edge, a wire, a compound of edges, a solid, ...")
      ->required();
  cli::add_work_options(*app, a.work);
  return app;
}

int work_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  WorkCommandArgs a;
  const auto app = work_options(a);
  return run_draw_command(di, argc, argv, *app, usage_text(*app), [&]() {
    const occt::StepModel model = session_model(a.shape);
    a.work.path.model = model.file();
    const std::optional<Path> own =
        app->get_option("--path")->count() == 0 ? own_path(model, a.work.path) : std::nullopt;
    std::ostringstream report;
    const WorkResult result =
        own ? cli::run_work_on_path(model, *own, a.work, report) : cli::run_work(model, a.work, report);
    if (a.work.format == "json") return CommandOutput{"", report.str()};
    return CommandOutput{report.str(), tcl_number(result.work_J)};
  });
}

}  // namespace

void add_work_command(Draw_Interpretor& di) {
  WorkCommandArgs a;
  static const std::string usage = usage_text(*work_options(a));
  di.Add("ergpath_work", usage.c_str(), __FILE__, work_command, "ergpath");
}

}  // namespace ergpath::draw
