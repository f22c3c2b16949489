// How every ergpath DRAW command runs: parse the Tcl words with CLI11, call the library, report.
//
// Follows the kernel's own command pattern (a usage string; return 1 with a message on bad arguments),
// and keeps the CLI's rule that nothing is printed unless the command succeeds.
#pragma once

#include <functional>
#include <iosfwd>
#include <string>

class Draw_Interpretor;

namespace CLI {
class App;
}

namespace ergpath::draw {

/// What a command body produced: `printed` goes to the session's standard output (the report the CLI
/// would print; may be empty) and `result` becomes the Tcl result (e.g. the total work in joules).
struct CommandOutput {
  std::string printed;
  std::string result;
};

using CommandBody = std::function<CommandOutput()>;

/// The usage text CLI11 makes from the option definitions on `app` (the same ones that parse the
/// command, so the text cannot drift from what it accepts), under the app's description.
std::string usage_text(const CLI::App& app);

/// Parses argv[1..argc-1] with `options` (argv[0] is the command name), then runs `body`.
/// Returns 0 on success. Returns 1 with the Tcl result set to
/// - "<command>: <parse message>" plus the usage text on bad arguments (`-h`/`--help` gives the usage
///   and returns 0);
/// - "<command>: error [<kind>]: <message>" on an ergpath::Error (kind as in docs/exit-codes.md);
/// - "<command>: error [kernel]: ..." on a kernel exception, "... [internal]: ..." on any other.
int run_draw_command(Draw_Interpretor& di, int argc, const char** argv, CLI::App& options,
                     const std::string& usage, const CommandBody& body);

/// A number as Tcl reads it back without loss (17 significant digits).
std::string tcl_number(double value);

}  // namespace ergpath::draw
