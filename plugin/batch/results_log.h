// The results log (JSON Lines, one case per line, appended as cases finish) and atomic file writes.
//
// Each line is flushed as soon as its case finishes, so an interrupted run loses no finished case; a last
// line cut short by the interruption is recognised as incomplete and dropped when the log is read back.
#pragma once

#include <fstream>
#include <mutex>
#include <string>
#include <vector>

#include "plugin/batch/case_result.h"

namespace ergpath::batch {

class ResultsLog {
 public:
  /// Opens `file` for appending (truncating it first when `truncate`). Throws Error(OutputFailed).
  ResultsLog(const std::string& file, bool truncate);
  /// Appends one line and flushes it to the operating system. Thread-safe. Throws Error(OutputFailed).
  void append(const CaseResult& result);
  const std::string& file() const { return file_; }

 private:
  std::string file_;
  std::ofstream out_;
  std::mutex mutex_;
};

struct LogContents {
  std::vector<CaseResult> results;  // in file order
  std::size_t dropped_lines = 0;    // incomplete or malformed lines that were skipped
};

/// Reads a results log; a missing file reads as empty. Lines that do not parse as a complete case record
/// (e.g. the half-written last line of an interrupted run) are counted in dropped_lines and skipped.
LogContents read_results_log(const std::string& file);

/// Writes `content` to `file` through a temporary file in the same folder and a rename, so readers see
/// the old file or the new one, never a part. Throws Error(OutputFailed) naming the file.
void write_file_atomically(const std::string& file, const std::string& content);

/// Rewrites a log with only the given records, atomically (used by --resume to drop a broken last line
/// before appending).
void rewrite_results_log(const std::string& file, const std::vector<CaseResult>& results);

}  // namespace ergpath::batch
