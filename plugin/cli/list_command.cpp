// `ergpath list`: the edge inventory of a STEP model, with filters, as a text table or JSON.
#include <CLI/CLI.hpp>

#include <memory>
#include <ostream>
#include <sstream>

#include "kernel_adapters/occt/edge_inventory.h"
#include "kernel_adapters/occt/step_model.h"
#include "plugin/cli/app.h"
#include "plugin/cli/field_options.h"
#include "plugin/cli/list_command.h"
#include "plugin/core/error.h"
#include "plugin/report/edge_listing.h"

namespace ergpath::cli {

namespace {

std::string number(double v) {
  std::ostringstream os;
  os.precision(12);
  os << v;
  return os.str();
}

// The adapter's filter for `a`, and the descriptions the listing summary shows; parsing comes before the
// model is read, so a mistyped option is reported whatever the file.
occt::EdgeFilter make_filter(const ListArgs& a, report::ListingSummary& summary) {
  occt::EdgeFilter filter;
  if (!a.types.empty()) {
    std::stringstream ss(a.types);
    for (std::string t; std::getline(ss, t, ',');) filter.types.push_back(occt::parse_curve_type(t));
    summary.filters.push_back("type in " + a.types);
  }
  if (!a.name.empty()) {
    filter.name_pattern = a.name;
    summary.filters.push_back("name matches '" + a.name + "'");
  }
  filter.min_length_m = a.min_length_m;
  filter.max_length_m = a.max_length_m;
  if (a.min_length_m) summary.filters.push_back("length >= " + number(*a.min_length_m) + " m");
  if (a.max_length_m) summary.filters.push_back("length <= " + number(*a.max_length_m) + " m");
  if (!a.near.empty()) {
    filter.near_mm = parse_point(a.near, "--near");
    summary.filters.push_back(a.within_mm ? "within " + number(*a.within_mm) + " mm of (" + a.near + ") mm"
                                          : "nearest to (" + a.near + ") mm");
  }
  filter.within_mm = a.within_mm;

  return filter;
}

}  // namespace

int run_list(const occt::StepModel& model, const ListArgs& a, std::ostream& out) {
  report::ListingSummary summary;
  const occt::EdgeFilter filter = make_filter(a, summary);
  const std::vector<int> picked = occt::filter_edges(model, filter);
  const occt::Inventory inv = occt::edge_inventory(model);

  std::vector<report::ListedEdge> rows;
  for (int i : picked) {
    const occt::EdgeInfo& e = model.edge(i);
    const occt::EdgeDetails& d = inv.edges[static_cast<std::size_t>(i - 1)];
    report::ListedEdge r;
    r.index = i;
    r.type = to_string(e.type);
    r.start_mm = e.start_mm;
    r.end_mm = e.end_mm;
    r.length_m = e.length_m;
    r.name = e.name;
    r.degenerated = e.degenerated;
    r.closed = e.closed;
    r.seam = d.seam;
    r.degree = d.degree;
    r.poles = d.poles;
    r.rational = d.rational;
    if (d.basis) r.basis = to_string(*d.basis);
    r.faces = d.faces;
    r.wires = d.wires;
    r.instance = d.instance;
    ++summary.by_type[r.type];
    summary.degenerated += e.degenerated ? 1 : 0;
    rows.push_back(std::move(r));
  }
  summary.file = model.file();
  summary.file_unit = model.file_unit();
  summary.schema = model.schema();
  summary.application_protocol = model.application_protocol();
  summary.edge_count = model.edge_count();
  summary.face_count = inv.face_count;
  summary.wire_count = inv.wire_count;
  summary.listed = static_cast<int>(rows.size());
  if (a.format == "json") {
    report::write_edge_listing_json(out, rows, summary);
  } else {
    report::write_edge_listing_text(out, rows, summary);
  }
  return summary.listed;
}

void add_list_options(CLI::App& cmd, ListArgs& a) {
  cmd.add_option("--format", a.format, "text or json")->check(CLI::IsMember({"text", "json"}));
  cmd.add_option("--type", a.types, "Only these types, comma-separated (line, circle, ..., bspline, offset)");
  cmd.add_option("--name", a.name, "Only edges whose name matches this pattern ('*' and '?' wildcards)");
  cmd.add_option("--min-length", a.min_length_m, "Only edges at least this long, m");
  cmd.add_option("--max-length", a.max_length_m, "Only edges at most this long, m");
  cmd.add_option("--near", a.near,
                 "X,Y,Z in mm: the edge nearest this point (with --within: all edges that close)");
  cmd.add_option("--within", a.within_mm, "With --near: every edge within this distance, mm");
}

void add_list_command(CLI::App& app, std::vector<Command>& commands) {
  auto args = std::make_shared<ListArgs>();
  CLI::App* cmd =
      app.add_subcommand("list", "List a STEP model's edges: index, type, ends, length, name, topology");
  cmd->add_option("MODEL", args->model, "STEP file (AP203/AP214/AP242)")->required();
  add_list_options(*cmd, *args);
  commands.push_back({cmd, [args](std::ostream& out) {
                        report::ListingSummary ignored;
                        make_filter(*args, ignored);
                        run_list(occt::StepModel::read(args->model), *args, out);
                        return 0;
                      }});
}

}  // namespace ergpath::cli
