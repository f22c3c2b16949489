// `ergpath merge`: combines the summaries of sharded `check` runs into the summary of one full run.
#include <CLI/CLI.hpp>

#include <memory>
#include <ostream>

#include "plugin/batch/results_log.h"
#include "plugin/batch/summary.h"
#include "plugin/cli/app.h"

namespace ergpath::cli {

namespace {

struct MergeArgs {
  std::vector<std::string> summaries;
  std::string output;
  std::string format = "text";
};

int run_merge(const MergeArgs& a, std::ostream& out) {
  std::vector<batch::BatchSummary> shards;
  for (const std::string& f : a.summaries) shards.push_back(batch::read_summary(f));
  const batch::BatchSummary merged = batch::merge_summaries(shards);
  const nlohmann::json j = batch::summary_json(merged);
  if (!a.output.empty()) batch::write_file_atomically(a.output, j.dump(2) + "\n");
  if (a.format == "json") {
    out << j.dump(2) << "\n";
  } else {
    batch::write_summary_text(out, merged, caution_line());
  }
  return merged.exit_code();
}

}  // namespace

void add_merge_command(CLI::App& app, std::vector<Command>& commands) {
  auto args = std::make_shared<MergeArgs>();
  CLI::App* cmd =
      app.add_subcommand("merge", "Combine shard summaries of `check --shard` runs into one summary");
  cmd->add_option("SUMMARY", args->summaries, "Summary files written by check --results (one per shard)")
      ->required();
  cmd->add_option("--output", args->output, "Write the merged summary JSON to this file (atomically)");
  cmd->add_option("--format", args->format, "text or json")->check(CLI::IsMember({"text", "json"}));
  commands.push_back({cmd, [args](std::ostream& out) { return run_merge(*args, out); }});
}

}  // namespace ergpath::cli
