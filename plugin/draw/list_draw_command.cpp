// ergpath_list: the numbered edges of a session shape, listed by the CLI's run_list (same rows, filters
// and summary as `ergpath list`).
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <memory>
#include <sstream>
#include <string>

#include "plugin/cli/list_command.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"
#include "plugin/draw/session_shape.h"

namespace ergpath::draw {

namespace {

struct ListCommandArgs {
  std::string shape;
  cli::ListArgs list;
};

std::unique_ptr<CLI::App> list_options(ListCommandArgs& a) {
  auto app = std::make_unique<CLI::App>(
      "The edges of SHAPE, a DRAW shape taken in millimetres, numbered 1..N as ergpath numbers the same "
      "shape read from a STEP file: type, end points (mm), length (m), flags, faces, wires, name; the "
      "filters narrow the list as for `ergpath list`. Prints the table; the Tcl result is the number of "
      "edges listed, or the JSON listing (not printed) with --format json.",
      "ergpath_list");
  app->add_option("SHAPE", a.shape, "DRAW shape: an edge, a wire, a compound of edges, a solid, ...")
      ->required();
  cli::add_list_options(*app, a.list);
  return app;
}

int list_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  ListCommandArgs a;
  const auto app = list_options(a);
  return run_draw_command(di, argc, argv, *app, usage_text(*app), [&]() {
    const occt::StepModel model = session_model(a.shape);
    std::ostringstream out;
    const int listed = cli::run_list(model, a.list, out);
    if (a.list.format == "json") return CommandOutput{"", out.str()};
    return CommandOutput{out.str(), std::to_string(listed)};
  });
}

}  // namespace

void add_list_command(Draw_Interpretor& di) {
  ListCommandArgs a;
  static const std::string usage = usage_text(*list_options(a));
  di.Add("ergpath_list", usage.c_str(), __FILE__, list_command, "ergpath");
}

}  // namespace ergpath::draw
