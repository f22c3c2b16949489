// The batch run behind `ergpath check`, shared by the CLI and the DRAW plugin.
#pragma once

#include <iosfwd>
#include <string>

namespace CLI {
class App;
}

namespace ergpath::cli {

struct CheckArgs {
  std::string manifest;         // TOML manifest; model paths in it are relative to its folder
  int jobs = 0;                 // cases run at once; 0: one per hardware thread
  std::string results;          // JSON Lines log; empty: none
  bool resume = false;          // skip cases already in the results log
  std::string shard;            // "K/N"; empty: every case
  std::string format = "text";  // text or json
};

/// Registers --jobs, --results, --resume, --shard and --format on `cmd` (not the MANIFEST positional).
void add_check_options(CLI::App& cmd, CheckArgs& args);

/// Runs the manifest's cases against their limits and writes the summary (text table or JSON) to `out`;
/// with --results, appends one log line per finished case and writes FILE.summary.json. A progress bar
/// goes to standard error when it is a terminal. Returns 0 when every case passed, 1 when a limit
/// failed, 2 when a case could not be computed (docs/batch.md). Throws Error(BadOption) for --resume
/// without --results or a malformed --shard, Error(BadManifest) / Error(UnreadableFile) for the manifest.
int run_check(const CheckArgs& args, std::ostream& out);

}  // namespace ergpath::cli
