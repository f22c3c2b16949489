// `ergpath check`: runs a batch manifest of mechanism checks; the exit code gates a pipeline.
#include <unistd.h>
#include <CLI/CLI.hpp>

#include <iostream>
#include <memory>
#include <ostream>
#include <thread>

#include "plugin/batch/manifest.h"
#include "plugin/batch/progress_bar.h"
#include "plugin/batch/results_log.h"
#include "plugin/batch/runner.h"
#include "plugin/batch/step_model_source.h"
#include "plugin/batch/summary.h"
#include "plugin/cli/app.h"
#include "plugin/cli/check_command.h"
#include "plugin/core/error.h"

namespace ergpath::cli {

int run_check(const CheckArgs& a, std::ostream& out) {
  if (a.resume && a.results.empty()) {
    throw Error(ErrorKind::BadOption, "--resume needs --results FILE (the log of the run to resume)");
  }
  const batch::Manifest manifest = batch::read_manifest(a.manifest);
  batch::RunOptions opts;
  opts.jobs = a.jobs > 0 ? a.jobs : static_cast<int>(std::max(1u, std::thread::hardware_concurrency()));
  if (!a.shard.empty()) opts.shard = batch::parse_shard(a.shard);

  std::unique_ptr<batch::ResultsLog> log;
  if (!a.results.empty()) {
    if (a.resume) {
      batch::LogContents previous = batch::read_results_log(a.results);
      // A line cut short by the interruption must go before new lines are appended after it.
      if (previous.dropped_lines > 0) batch::rewrite_results_log(a.results, previous.results);
      opts.previous = std::move(previous.results);
    }
    log = std::make_unique<batch::ResultsLog>(a.results, !a.resume);
  }
  std::unique_ptr<batch::ProgressBar> bar;
  const bool tty = ::isatty(STDERR_FILENO) == 1;
  opts.on_planned = [&](std::size_t n) { bar = std::make_unique<batch::ProgressBar>(std::cerr, n, tty); };
  opts.on_finished = [&](const batch::CaseResult& r) {
    if (log) log->append(r);
    bar->step(r.verdict == batch::Verdict::Fail, r.verdict == batch::Verdict::Error);
  };
  const batch::BatchSummary summary = batch::run_batch(manifest, batch::step_model_loader(), opts);
  if (bar) bar->finish();
  const nlohmann::json j = batch::summary_json(summary);
  if (!a.results.empty()) batch::write_file_atomically(batch::summary_path_for(a.results), j.dump(2) + "\n");
  if (a.format == "json") {
    out << j.dump(2) << "\n";
  } else {
    batch::write_summary_text(out, summary, caution_line());
  }
  return summary.exit_code();
}

void add_check_options(CLI::App& cmd, CheckArgs& a) {
  cmd.add_option("--jobs", a.jobs, "Cases run at once (default: one per hardware thread)")
      ->check(CLI::PositiveNumber);
  cmd.add_option("--results", a.results,
                 "JSON Lines log, one case per line as it finishes; the summary goes to FILE.summary.json");
  cmd.add_flag("--resume", a.resume, "Skip cases whose inputs digest is already in the --results log");
  cmd.add_option("--shard", a.shard, "K/N: run cases K, K+N, K+2N, ... (0 <= K < N)");
  cmd.add_option("--format", a.format, "text or json")->check(CLI::IsMember({"text", "json"}));
}

void add_check_command(CLI::App& app, std::vector<Command>& commands) {
  auto args = std::make_shared<CheckArgs>();
  CLI::App* cmd = app.add_subcommand(
      "check",
      "Run a manifest of mechanism checks against their limits (exit 0 pass, 1 limit failed, 2 error)");
  cmd->add_option("MANIFEST", args->manifest, "TOML manifest of cases (see docs/batch.md)")->required();
  add_check_options(*cmd, *args);
  commands.push_back({cmd, [args](std::ostream& out) { return run_check(*args, out); }});
}

}  // namespace ergpath::cli
