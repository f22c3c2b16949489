#include "plugin/cli/app.h"

#include <CLI/CLI.hpp>

#include <exception>
#include <iostream>
#include <sstream>

#include "plugin/core/error.h"

namespace ergpath::cli {

const std::string& caution_line() {
  static const std::string text =
      "CAUTION: computed values only. Springs, drives and brakes sized from them can injure people: verify "
      "by "
      "test, mind stored spring energy and pinch points, follow lifting-equipment rules and local codes, and "
      "have the design reviewed by a licensed engineer.";
  return text;
}

int run(int argc, char** argv, std::ostream& out, std::ostream& err) {
  CLI::App app{
      "ergpath: work, circulation and arc length along exact CAD paths (STEP) in formula force fields"};
  app.require_subcommand(1);
  app.set_version_flag("--version", "ergpath 0.1.0");
  std::vector<Command> commands;
  add_list_command(app, commands);
  add_work_command(app, commands);
  add_profile_command(app, commands);
  add_scalar_command(app, commands);
  add_check_command(app, commands);
  add_merge_command(app, commands);
  try {
    app.parse(argc, argv);
  } catch (const CLI::CallForHelp& e) {
    out << app.help();
    return 0;
  } catch (const CLI::CallForAllHelp& e) {
    out << app.help("", CLI::AppFormatMode::All);
    return 0;
  } catch (const CLI::CallForVersion& e) {
    out << e.what() << "\n";
    return 0;
  } catch (const CLI::ParseError& e) {
    std::string msg = e.what();
    err << "ergpath: error: " << (msg.empty() ? "bad arguments" : msg) << " (see ergpath --help)\n";
    return 2;
  }
  for (const Command& c : commands) {
    if (!c.app->parsed()) continue;
    std::ostringstream buffer;
    try {
      const int code = c.run(buffer);
      out << buffer.str();
      out.flush();
      return code;
    } catch (const Error& e) {
      err << "ergpath: error: " << e.what() << "\n";
      return exit_code(e.kind());
    } catch (const std::bad_alloc&) {
      err << "ergpath: error: internal: out of memory\n";
      return exit_code(ErrorKind::Internal);
    } catch (const std::exception& e) {
      err << "ergpath: error: internal: " << e.what() << "\n";
      return exit_code(ErrorKind::Internal);
    }
  }
  err << "ergpath: error: no command given (see ergpath --help)\n";
  return 2;
}

}  // namespace ergpath::cli
