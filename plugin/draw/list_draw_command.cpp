// ergpath_list: the numbered edges of a session shape, written by the report's edge-listing writers.
//
// The rows carry what StepModel knows of each edge (index, type, ends, length, name, flags); the face
// and wire columns stay empty until the CLI's `list` exposes its own row builder to share.
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <memory>
#include <sstream>
#include <string>
#include <vector>

#include "plugin/core/curve.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"
#include "plugin/draw/session_shape.h"
#include "plugin/report/edge_listing.h"

namespace ergpath::draw {

namespace {

struct ListCommandArgs {
  std::string shape;
  std::string format = "text";
};

std::unique_ptr<CLI::App> list_options(ListCommandArgs& a) {
  auto app = std::make_unique<CLI::App>(
      "The edges of SHAPE, a DRAW shape taken in millimetres, numbered 1..N as ergpath numbers the same "
      "shape "
      "read from a STEP file: type, end points (mm), length (m), name. Prints the table; the Tcl result is "
      "the "
      "number of edges, or the JSON listing (not printed) with --format json.",
      "ergpath_list");
  app->add_option("SHAPE", a.shape, "DRAW shape: an edge, a wire, a compound of edges, a solid, ...")
      ->required();
  app->add_option("--format", a.format, "text or json")->check(CLI::IsMember({"text", "json"}));
  return app;
}

int list_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  ListCommandArgs a;
  const auto app = list_options(a);
  return run_draw_command(di, argc, argv, *app, usage_text(*app), [&]() {
    const occt::StepModel model = session_model(a.shape);
    std::vector<report::ListedEdge> rows;
    report::ListingSummary summary;
    summary.file = model.file();
    summary.file_unit = model.file_unit();
    summary.schema = model.schema();
    summary.application_protocol = model.application_protocol();
    summary.edge_count = model.edge_count();
    for (const occt::EdgeInfo& e : model.edges()) {
      report::ListedEdge row;
      row.index = e.index;
      row.type = to_string(e.type);
      row.start_mm = e.start_mm;
      row.end_mm = e.end_mm;
      row.length_m = e.length_m;
      row.name = e.name;
      row.degenerated = e.degenerated;
      row.closed = e.closed;
      ++summary.by_type[row.type];
      summary.degenerated += e.degenerated ? 1 : 0;
      rows.push_back(std::move(row));
    }
    summary.listed = static_cast<int>(rows.size());
    std::ostringstream out;
    if (a.format == "json") {
      report::write_edge_listing_json(out, rows, summary);
      return CommandOutput{"", out.str()};
    }
    report::write_edge_listing_text(out, rows, summary);
    return CommandOutput{out.str(), std::to_string(model.edge_count())};
  });
}

}  // namespace

void add_list_command(Draw_Interpretor& di) {
  ListCommandArgs a;
  static const std::string usage = usage_text(*list_options(a));
  di.Add("ergpath_list", usage.c_str(), __FILE__, list_command, "ergpath");
}

}  // namespace ergpath::draw
