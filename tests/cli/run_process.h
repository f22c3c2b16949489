// Runs a program with arguments and captures its exit code, stdout and stderr (for CLI tests).
#pragma once

#include <string>
#include <vector>

namespace ergpath::testing {

struct ProcessResult {
  int exit_code = -1;  // -1 when the process did not exit normally (signal)
  std::string out;
  std::string err;
};

/// Runs `program` with `args` (no shell), optional text on stdin; waits for it.
ProcessResult run_process(const std::string& program, const std::vector<std::string>& args,
                          const std::string& input = "");

/// A fresh empty directory under the system temp directory.
std::string make_temp_dir(const std::string& prefix);

std::string read_text(const std::string& path);
void write_text(const std::string& path, const std::string& text);

}  // namespace ergpath::testing
