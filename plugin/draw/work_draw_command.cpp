// ergpath_work: the work along a session shape, computed by the CLI's run_work / run_work_on_path.
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <sstream>
#include <string>

#include "kernel_adapters/occt/shape_model.h"
#include "kernel_adapters/occt/step_model_impl.h"
#include "plugin/cli/field_options.h"
#include "plugin/cli/work_command.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"
#include "plugin/draw/session_shape.h"

namespace ergpath::draw {

namespace {

const char* const kUsage =
    "ergpath_work SHAPE [--path SEL] [--reverse] [--start X,Y,Z] [--gap-tolerance MM]\n"
    "             --field \"FX, FY, FZ\" | --field NAME=\"FX, FY, FZ\" ... [--const NAME=VALUE]...\n"
    "             [--field-file FILE] [--field-length-unit m|mm|cm|in|ft] [--potential EXPR]\n"
    "             [--tolerance REL] [--max-evaluations N] [--format text|json]\n"
    "  Work (J) of the force fields along SHAPE, a DRAW shape in millimetres. Without --path an edge or\n"
    "  a wire is travelled in its own order and orientation; other shapes chain all their edges. With\n"
    "  --path the selector picks edges by the numbers ergpath_list shows. Prints the report; the result\n"
    "  is the total work in joules (with --format json: the JSON report instead, not printed).";

int work_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  cli::WorkArgs args;
  std::string shape;
  CLI::App app{"work along a DRAW shape", "ergpath_work"};
  app.add_option("SHAPE", shape, "DRAW shape name")->required();
  cli::add_work_options(app, args);
  return run_draw_command(di, argc, argv, app, kUsage, [&]() {
    const occt::StepModel model = session_model(shape);
    args.path.model = model.file();
    std::ostringstream report;
    WorkResult result;
    std::optional<Path> own;
    if (app.get_option("--path")->count() == 0) {
      own = occt::path_of_shape(model, cli::make_path_options(args.path));
    }
    if (own) {
      args.path.selector = model.impl().shape.ShapeType() == TopAbs_WIRE ? "the wire" : "the edge";
      result = cli::run_work_on_path(model, *own, args, report);
    } else {
      result = cli::run_work(model, args, report);
    }
    if (args.format == "json") return CommandOutput{"", report.str()};
    return CommandOutput{report.str(), tcl_number(result.work_J)};
  });
}

}  // namespace

void add_work_command(Draw_Interpretor& di) {
  di.Add("ergpath_work", kUsage, __FILE__, work_command, "ergpath");
}

}  // namespace ergpath::draw
