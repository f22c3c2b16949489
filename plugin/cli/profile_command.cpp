// `ergpath profile`: cumulative work W(s) and tangential force F.T at stations along a path.
#include "plugin/cli/profile_command.h"

#include <CLI/CLI.hpp>

#include <cctype>
#include <cmath>
#include <memory>
#include <ostream>

#include "kernel_adapters/occt/path_builder.h"
#include "plugin/cli/app.h"
#include "plugin/core/arc_length.h"
#include "plugin/core/error.h"
#include "plugin/core/units.h"
#include "plugin/report/profile_report.h"
#include "plugin/report/work_report.h"

namespace ergpath::cli {

void add_profile_options(CLI::App& cmd, ProfileArgs& args) {
  add_work_options(cmd, args.work);
  cmd.get_option("--format")->check(CLI::IsMember({"text", "json", "csv"}));
  cmd.add_option("--at", args.at, "Arc lengths from the path start: metres, or with a unit (250mm)")
      ->delimiter(',');
  cmd.add_option("--spacing", args.spacing, "Sample every D along the path (metres or with a unit)");
  cmd.add_option("--samples", args.samples, "N evenly spaced samples including both ends (N >= 2)");
}

std::vector<double> profile_stations(const ProfileArgs& a, double length_m) {
  const int given = (a.at.empty() ? 0 : 1) + (a.spacing.empty() ? 0 : 1) + (a.samples != 0 ? 1 : 0);
  if (given != 1) throw Error(ErrorKind::BadOption, "give exactly one of --at, --spacing, --samples");
  // Stations a hair beyond the end (rounding of a typed length) are clamped; further ones are errors.
  constexpr double kEndSlack = 1e-9;
  std::vector<double> s;
  if (!a.at.empty()) {
    for (const std::string& t : a.at) {
      double v = parse_length_m(t, "--at");
      if (v < 0.0 || v > length_m * (1 + kEndSlack)) {
        throw Error(ErrorKind::BadOption,
                    "--at " + t + " lies outside the path [0, " + report::format_number(length_m) + "] m");
      }
      s.push_back(std::min(v, length_m));
    }
  } else if (!a.spacing.empty()) {
    const double d = parse_length_m(a.spacing, "--spacing");
    if (!(d > 0.0)) throw Error(ErrorKind::BadOption, "--spacing must be positive");
    constexpr double kMaxStations = 1e6;
    if (length_m / d > kMaxStations)
      throw Error(ErrorKind::BadOption, "--spacing gives more than 1e6 stations");
    for (long i = 0; i * d < length_m * (1 - kEndSlack); ++i) s.push_back(i * d);
    s.push_back(length_m);
  } else {
    if (a.samples < 2 || a.samples > 1000000) {
      throw Error(ErrorKind::BadOption, "--samples must be between 2 and 1000000");
    }
    for (int i = 0; i < a.samples; ++i) s.push_back(length_m * i / (a.samples - 1));
  }
  return s;
}

namespace {

FieldSpec checked_field_spec(const WorkArgs& w) {
  if (!(w.tolerance > 0.0 && w.tolerance < 1.0)) {
    throw Error(ErrorKind::BadOption, "--tolerance must be a relative tolerance in (0, 1)");
  }
  FieldSpec spec = make_field_spec(w.field);
  FieldEvaluator check(spec);
  return spec;
}

}  // namespace

std::vector<ProfilePoint> run_profile(const occt::StepModel& model, const ProfileArgs& a, std::ostream& out) {
  const WorkArgs& w = a.work;
  checked_field_spec(w);
  const Path path =
      occt::build_path(model, occt::select_edges(model, w.path.selector), make_path_options(w.path));
  return run_profile_on_path(model, path, a, out);
}

std::vector<ProfilePoint> run_profile_on_path(const occt::StepModel& model, const Path& path,
                                              const ProfileArgs& a, std::ostream& out) {
  const WorkArgs& w = a.work;
  const FieldSpec spec = checked_field_spec(w);
  const ArcLength arc(path);
  const std::vector<double> stations = profile_stations(a, arc.total_m());
  IntegrationOptions iopts;
  iopts.rel_tol = w.tolerance;
  iopts.max_evaluations = w.max_evaluations;
  const std::vector<ProfilePoint> points = work_profile(path, spec, stations, iopts);
  for (const ProfilePoint& p : points) {
    if (!p.converged) {
      throw Error(ErrorKind::ToleranceNotMet, "tolerance " + report::format_number(w.tolerance, 3) +
                                                  " not met up to s = " + report::format_number(p.s_m) +
                                                  " m: best W(s) " + report::format_number(p.work_J) + " J");
    }
  }
  report::ProfileContext ctx{model.file(), w.path.selector, path.length_unit_m, arc.total_m()};
  if (w.format == "json") {
    out << report::profile_json(points, ctx).dump(2) << "\n";
  } else if (w.format == "csv") {
    report::write_profile_csv(out, points, ctx);
  } else {
    report::write_profile_text(out, points, ctx, caution_line());
  }
  return points;
}

void add_profile_command(CLI::App& app, std::vector<Command>& commands) {
  auto args = std::make_shared<ProfileArgs>();
  CLI::App* cmd =
      app.add_subcommand("profile", "Cumulative work W(s) and tangential force at stations along a path");
  cmd->add_option("MODEL", args->work.path.model, "STEP file (AP203/AP214/AP242)")->required();
  add_profile_options(*cmd, *args);
  commands.push_back({cmd, [args](std::ostream& out) {
                        const occt::StepModel model = occt::StepModel::read(args->work.path.model);
                        run_profile(model, *args, out);
                        return 0;
                      }});
}

}  // namespace ergpath::cli
