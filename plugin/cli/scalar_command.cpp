// `ergpath scalar`: the scalar line integral of f ds along a path (e.g. a cable's mass from its linear
// density) and the mean of f over the path.
#include <CLI/CLI.hpp>

#include <memory>
#include <ostream>

#include "kernel_adapters/occt/path_builder.h"
#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/app.h"
#include "plugin/cli/field_options.h"
#include "plugin/cli/scalar_command.h"
#include "plugin/core/error.h"
#include "plugin/core/scalar_integral.h"
#include "plugin/core/units.h"
#include "plugin/report/work_report.h"

namespace ergpath::cli {

namespace {

// Tolerance and formula errors surface before any model is read or path built.
ScalarFieldSpec checked_spec(const ScalarArgs& a) {
  if (!(a.tolerance > 0.0 && a.tolerance < 1.0)) {
    throw Error(ErrorKind::BadOption, "--tolerance must be a relative tolerance in (0, 1)");
  }
  FieldOptions fo;
  fo.constants = a.constants;
  fo.fields = {"0, 0, 0"};  // only to reuse the constant parsing of make_field_spec
  ScalarFieldSpec spec;
  spec.formula = a.integrand;
  spec.constants = make_field_spec(fo).constants;
  spec.length_unit_m = length_unit_m(a.length_unit);
  ScalarFieldEvaluator check(spec);
  return spec;
}

Path selected_path(const occt::StepModel& model, const ScalarArgs& a) {
  return occt::build_path(model, occt::select_edges(model, a.path.selector), make_path_options(a.path));
}

}  // namespace

ScalarResult run_scalar(const occt::StepModel& model, const ScalarArgs& a, std::ostream& out) {
  checked_spec(a);
  return run_scalar_on_path(model, selected_path(model, a), a, out);
}

ScalarResult run_scalar_on_path(const occt::StepModel&, const Path& path, const ScalarArgs& a,
                                std::ostream& out) {
  const ScalarFieldSpec spec = checked_spec(a);
  IntegrationOptions o;
  o.rel_tol = a.tolerance;
  o.max_evaluations = a.max_evaluations;
  if (!a.from.empty()) o.window_from_m = parse_length_m(a.from, "--from");
  if (!a.to.empty()) o.window_to_m = parse_length_m(a.to, "--to");
  const ScalarResult r = compute_scalar(path, spec, o);
  if (r.status != Status::Converged) {
    throw Error(ErrorKind::ToleranceNotMet, "tolerance not met: best integral " +
                                                report::format_number(r.value) + ", error estimate " +
                                                report::format_number(r.error, 3));
  }
  const double from = o.window_from_m.value_or(0.0);
  const double to = o.window_to_m.value_or(r.length_m);
  const double span = to - from;
  const double mean = span > 0.0 ? r.value / span : 0.0;
  if (a.format == "json") {
    nlohmann::json j{{"model", a.path.model},
                     {"path", a.path.selector},
                     {"integrand", a.integrand},
                     {"integral", r.value},
                     {"error_estimate", r.error},
                     {"abs_integral", r.abs_value},
                     {"mean", mean},
                     {"length_m", r.length_m},
                     {"window_m", {from, to}},
                     {"evaluations", r.evaluations},
                     {"segments", r.segment_values}};
    out << j.dump(2) << "\n";
  } else {
    out << "Integral of f ds along " << a.path.selector << " of " << a.path.model << "\n";
    out << "f = " << a.integrand << "\n\n";
    out << "Integral: " << report::format_number(r.value) << " (unit of f) x m  (error estimate "
        << report::format_number(r.error, 2) << ")\n";
    out << "Mean of f over " << report::format_number(span) << " m: " << report::format_number(mean) << "\n";
    out << "Integrand evaluations: " << r.evaluations << "\n\n" << caution_line() << "\n";
  }
  return r;
}

void add_scalar_options(CLI::App& cmd, ScalarArgs& a) {
  cmd.add_option("--path", a.path.selector, "Edges to travel (optional; default all): see docs/selectors.md")
      ->option_text("SEL [all]");
  cmd.add_flag("--reverse", a.path.reverse, "Travel the whole path the other way");
  cmd.add_option("--start", a.path.start, "X,Y,Z in mm: start an open chain at its end nearest this point");
  cmd.add_option("--gap-tolerance", a.path.gap_tolerance_mm, "Largest gap between consecutive edges, mm");
  cmd.add_option("--integrand", a.integrand, "f(x, y, z, s, tx, ty, tz), e.g. a linear density in kg/m")
      ->required();
  cmd.add_option("--const", a.constants, "Constant NAME=VALUE; repeatable");
  cmd.add_option("--field-length-unit", a.length_unit, "Unit of x, y, z, s in the formula (default m)");
  cmd.add_option("--from", a.from, "Integrate from this arc length (metres, or with a unit)");
  cmd.add_option("--to", a.to, "Integrate up to this arc length (metres, or with a unit)");
  cmd.add_option("--tolerance", a.tolerance, "Relative error target (default 1e-10)");
  cmd.add_option("--max-evaluations", a.max_evaluations, "Budget of evaluations")->check(CLI::PositiveNumber);
  cmd.add_option("--format", a.format, "text or json")->check(CLI::IsMember({"text", "json"}));
}

void add_scalar_command(CLI::App& app, std::vector<Command>& commands) {
  auto a = std::make_shared<ScalarArgs>();
  CLI::App* cmd =
      app.add_subcommand("scalar", "Scalar line integral of f ds along a path, and the mean of f");
  cmd->add_option("MODEL", a->path.model, "STEP file (AP203/AP214/AP242)")->required();
  add_scalar_options(*cmd, *a);
  commands.push_back({cmd, [a](std::ostream& out) {
                        checked_spec(*a);
                        run_scalar(occt::StepModel::read(a->path.model), *a, out);
                        return 0;
                      }});
}

}  // namespace ergpath::cli
