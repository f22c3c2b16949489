#include "plugin/draw/draw_command.h"

#include <CLI/CLI.hpp>
#include <Draw_Interpretor.hxx>
#include <Standard_Failure.hxx>

#include <exception>
#include <iostream>
#include <new>
#include <sstream>

#include "plugin/core/error.h"

namespace ergpath::draw {

namespace {

// DRAW prints a failing command's result as it stands; a message on several lines would be read as
// several messages by scripts that scan the output line by line.
std::string one_line(std::string text) {
  for (char& c : text) {
    if (c == '\n' || c == '\r') c = ' ';
  }
  return text;
}

int fail(Draw_Interpretor& di, const std::string& command, const std::string& kind, const std::string& what) {
  di.Reset();
  di << (command + ": error [" + kind + "]: " + one_line(what)).c_str();
  return 1;
}

}  // namespace

std::string usage_text(const CLI::App& app) { return app.help(); }

std::string tcl_number(double value) {
  std::ostringstream os;
  os.precision(17);
  os << value;
  return os.str();
}

int run_draw_command(Draw_Interpretor& di, int argc, const char** argv, CLI::App& options,
                     const std::string& usage, const CommandBody& body) {
  const std::string command = argc > 0 ? argv[0] : "ergpath";
  try {
    options.parse(argc, argv);
  } catch (const CLI::CallForHelp&) {
    di << usage.c_str();
    return 0;
  } catch (const CLI::ParseError& e) {
    const std::string msg = e.what();
    di << (command + ": " + one_line(msg.empty() ? "bad arguments" : msg) + "\n" + usage).c_str();
    return 1;
  }
  try {
    const CommandOutput out = body();
    if (!out.printed.empty()) {
      std::cout << out.printed << std::flush;
    }
    di << out.result.c_str();
    return 0;
  } catch (const Error& e) {
    return fail(di, command, to_string(e.kind()), e.what());
  } catch (const Standard_Failure& e) {
    const char* what = e.GetMessageString();
    return fail(di, command, "kernel",
                std::string(e.DynamicType()->Name()) + (what && *what ? ": " : "") + (what ? what : ""));
  } catch (const std::bad_alloc&) {
    return fail(di, command, "internal", "out of memory");
  } catch (const std::exception& e) {
    return fail(di, command, "internal", e.what());
  }
}

}  // namespace ergpath::draw
