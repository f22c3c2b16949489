// The `ergpath` command line: subcommands registered on one CLI11 app, run with error handling.
//
// Each subcommand lives in its own <name>_command.cpp and registers itself through add_*_command().
// A runner writes its whole result to `out` only when it succeeds; failures are thrown as ergpath::Error
// and become one line on stderr plus the documented exit code (docs/exit-codes.md).
#pragma once

#include <functional>
#include <iosfwd>
#include <string>
#include <vector>

namespace CLI {
class App;
}

namespace ergpath::cli {

/// Runs the subcommand once arguments are parsed; returns the process exit code. Writes output to `out`.
using Runner = std::function<int(std::ostream& out)>;

struct Command {
  CLI::App* app = nullptr;
  Runner run;
};

void add_list_command(CLI::App& app, std::vector<Command>& commands);
void add_work_command(CLI::App& app, std::vector<Command>& commands);
void add_profile_command(CLI::App& app, std::vector<Command>& commands);
void add_scalar_command(CLI::App& app, std::vector<Command>& commands);
void add_check_command(CLI::App& app, std::vector<Command>& commands);
void add_merge_command(CLI::App& app, std::vector<Command>& commands);

/// Parses argv, runs the chosen subcommand, prints errors. stdout receives output only on success
/// (no partial output); stderr receives one line "ergpath: error: <message>" on failure.
int run(int argc, char** argv, std::ostream& out, std::ostream& err);

/// Caution printed under every text report (the safety note; see docs/cautions.md).
const std::string& caution_line();

}  // namespace ergpath::cli
