// ergpath_profile: W(s) and the tangential force at stations along a session shape, computed by the
// CLI's run_profile / run_profile_on_path.
#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>

#include <memory>
#include <optional>
#include <sstream>
#include <string>

#include "plugin/cli/profile_command.h"
#include "plugin/draw/draw_command.h"
#include "plugin/draw/draw_commands.h"
#include "plugin/draw/session_shape.h"

namespace ergpath::draw {

namespace {

struct ProfileCommandArgs {
  std::string shape;
  cli::ProfileArgs profile;
};

std::unique_ptr<CLI::App> profile_options(ProfileCommandArgs& a) {
  auto app = std::make_unique<CLI::App>(
      "Cumulative work W(s) (J) and tangential force F.T (N) at arc lengths s along SHAPE, a DRAW shape "
      "taken in millimetres; the path is chosen as for ergpath_work. Prints the table; the Tcl result is a "
      "list of {s_m work_J tangential_force_N} triples, one per station, or the JSON / CSV text (not "
      "printed) with --format json / csv.",
      "ergpath_profile");
  app->add_option("SHAPE", a.shape, "DRAW shape: an edge, a wire, a compound of edges, a solid, ...")
      ->required();
  cli::add_profile_options(*app, a.profile);
  return app;
}

std::string tcl_triples(const std::vector<ProfilePoint>& points) {
  std::string out;
  for (const ProfilePoint& p : points) {
    if (!out.empty()) out += ' ';
    out +=
        "{" + tcl_number(p.s_m) + " " + tcl_number(p.work_J) + " " + tcl_number(p.tangential_force_N) + "}";
  }
  return out;
}

int profile_command(Draw_Interpretor& di, Standard_Integer argc, const char** argv) {
  ProfileCommandArgs a;
  const auto app = profile_options(a);
  return run_draw_command(di, argc, argv, *app, usage_text(*app), [&]() {
    const occt::StepModel model = session_model(a.shape);
    cli::WorkArgs& w = a.profile.work;
    w.path.model = model.file();
    const std::optional<Path> own =
        app->get_option("--path")->count() == 0 ? own_path(model, w.path) : std::nullopt;
    std::ostringstream report;
    const std::vector<ProfilePoint> points = own ? cli::run_profile_on_path(model, *own, a.profile, report)
                                                 : cli::run_profile(model, a.profile, report);
    if (w.format != "text") return CommandOutput{"", report.str()};
    return CommandOutput{report.str(), tcl_triples(points)};
  });
}

}  // namespace

void add_profile_command(Draw_Interpretor& di) {
  ProfileCommandArgs a;
  static const std::string usage = usage_text(*profile_options(a));
  di.Add("ergpath_profile", usage.c_str(), __FILE__, profile_command, "ergpath");
}

}  // namespace ergpath::draw
