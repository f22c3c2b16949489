// `ergpath work`: work (or circulation) of formula force fields along a path of a STEP model's edges.
#include <CLI/CLI.hpp>

#include <memory>
#include <ostream>

#include "kernel_adapters/occt/path_builder.h"
#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/app.h"
#include "plugin/cli/field_options.h"
#include "plugin/cli/work_command.h"
#include "plugin/core/curl_check.h"
#include "plugin/core/error.h"
#include "plugin/core/units.h"
#include "plugin/core/work.h"
#include "plugin/report/work_report.h"

namespace ergpath::cli {

namespace {

std::string unit_name(double metres) {
  for (const char* u : {"m", "mm", "cm", "in", "ft"}) {
    if (length_unit_m(u) == metres) return u;
  }
  return report::format_number(metres) + " m";
}

FieldSpec checked_field_spec(const WorkArgs& a) {
  if (!(a.tolerance > 0.0 && a.tolerance < 1.0)) {
    throw Error(ErrorKind::BadOption, "--tolerance must be a relative tolerance in (0, 1)");
  }
  FieldSpec spec = make_field_spec(a.field);
  FieldEvaluator check(spec);  // formula errors surface before the path is built
  return spec;
}

}  // namespace

WorkResult run_work(const occt::StepModel& model, const WorkArgs& a, std::ostream& out) {
  checked_field_spec(a);
  const occt::PathOptions popts = make_path_options(a.path);
  const std::vector<int> edges = occt::select_edges(model, a.path.selector);
  std::vector<std::string> notes;
  const Path path = occt::build_path(model, edges, popts, &notes);
  return run_work_on_path(model, path, a, out, notes);
}

WorkResult run_work_on_path(const occt::StepModel& model, const Path& path, const WorkArgs& a,
                            std::ostream& out, const std::vector<std::string>& notes) {
  const FieldSpec spec = checked_field_spec(a);
  IntegrationOptions iopts;
  iopts.rel_tol = a.tolerance;
  iopts.max_evaluations = a.max_evaluations;
  if (!a.from.empty()) iopts.window_from_m = parse_length_m(a.from, "--from");
  if (!a.to.empty()) iopts.window_to_m = parse_length_m(a.to, "--to");
  iopts.assume_conservative = a.conservative;
  const WorkResult r = compute_work(path, spec, iopts);
  if (r.status == Status::ToleranceNotMet) {
    throw Error(ErrorKind::ToleranceNotMet, "tolerance " + report::format_number(a.tolerance, 3) +
                                                " not met on " + a.path.model + " path " + a.path.selector +
                                                ": best work " + report::format_number(r.work_J) +
                                                " J, error estimate " + report::format_number(r.error_J, 3) +
                                                " J after " + std::to_string(r.evaluations) + " evaluations");
  }
  report::WorkContext ctx;
  ctx.model = model.file();
  ctx.selector = a.path.selector;
  ctx.model_unit_m = path.length_unit_m;
  ctx.field_length_unit = unit_name(spec.length_unit_m);
  ctx.rel_tol = a.tolerance;
  ctx.notes = notes;
  if (a.curl_check) ctx.curl = estimate_curl(path, spec);
  if (a.format == "json") {
    out << report::work_json(r, ctx).dump(2) << "\n";
  } else {
    report::write_work_text(out, r, ctx, caution_line());
  }
  return r;
}

void add_work_options(CLI::App& cmd, WorkArgs& args) {
  cmd.add_option("--path", args.path.selector,
                 "Edges to travel (optional; default all): all, edge:I, edges:I,J,K (see docs/selectors.md)")
      ->option_text("SEL [all]");
  cmd.add_flag("--reverse", args.path.reverse, "Travel the whole path the other way");
  cmd.add_option("--start", args.path.start,
                 "X,Y,Z in mm: start an open chain at its end nearest this point");
  cmd.add_option("--gap-tolerance", args.path.gap_tolerance_mm,
                 "Largest gap between consecutive edges, mm (default 0.001)");
  add_field_options(cmd, args.field);
  cmd.add_option("--tolerance", args.tolerance, "Relative error target on the work (default 1e-10)");
  cmd.add_option("--from", args.from, "Integrate from this arc length (metres, or with a unit: 250mm)");
  cmd.add_option("--to", args.to, "Integrate up to this arc length (metres, or with a unit)");
  cmd.add_flag(
      "--conservative", args.conservative,
      "State that the total field is conservative: a closed loop's circulation beyond tolerance is flagged");
  cmd.add_flag("--curl-check", args.curl_check,
               "Sample curl F along the path: can path independence be expected?");
  cmd.add_option("--max-evaluations", args.max_evaluations,
                 "Budget of field evaluations before giving up with exit code 3 (default 20000000)")
      ->check(CLI::PositiveNumber);
  cmd.add_option("--format", args.format, "text or json")->check(CLI::IsMember({"text", "json"}));
}

void add_work_command(CLI::App& app, std::vector<Command>& commands) {
  auto args = std::make_shared<WorkArgs>();
  CLI::App* cmd =
      app.add_subcommand("work", "Work of force fields along a path of edges (circulation if closed)");
  cmd->add_option("MODEL", args->path.model, "STEP file (AP203/AP214/AP242)")->required();
  add_work_options(*cmd, *args);
  commands.push_back({cmd, [args](std::ostream& out) {
                        const occt::StepModel model = occt::StepModel::read(args->path.model);
                        run_work(model, *args, out);
                        return 0;
                      }});
}

}  // namespace ergpath::cli
