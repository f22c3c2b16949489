#include "plugin/batch/results_log.h"

#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <filesystem>

#include "plugin/core/error.h"

namespace ergpath::batch {

ResultsLog::ResultsLog(const std::string& file, bool truncate)
    : file_(file), out_(file, truncate ? std::ios::out | std::ios::trunc : std::ios::out | std::ios::app) {
  if (!out_) throw Error(ErrorKind::OutputFailed, file + ": cannot open results log for writing");
}

void ResultsLog::append(const CaseResult& result) {
  const std::string line = to_json(result).dump() + "\n";
  std::lock_guard<std::mutex> lock(mutex_);
  out_ << line;
  out_.flush();
  if (!out_) throw Error(ErrorKind::OutputFailed, file_ + ": cannot append to results log");
}

LogContents read_results_log(const std::string& file) {
  LogContents c;
  std::ifstream in(file, std::ios::binary);
  if (!in) return c;
  std::string line;
  while (std::getline(in, line)) {
    // getline also returns a last line without '\n': such a line was cut short unless it parses.
    if (line.empty()) continue;
    try {
      c.results.push_back(case_result_from_json(nlohmann::json::parse(line)));
    } catch (const nlohmann::json::exception&) {
      ++c.dropped_lines;
    }
  }
  return c;
}

void write_file_atomically(const std::string& file, const std::string& content) {
  const std::string tmp = file + ".tmp." + std::to_string(::getpid());
  {
    std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
    out << content;
    out.flush();
    if (!out) {
      std::remove(tmp.c_str());
      throw Error(ErrorKind::OutputFailed, file + ": cannot write (temporary file " + tmp + ")");
    }
  }
  if (std::rename(tmp.c_str(), file.c_str()) != 0) {
    const std::string why = std::strerror(errno);
    std::remove(tmp.c_str());
    throw Error(ErrorKind::OutputFailed, file + ": cannot replace: " + why);
  }
}

void rewrite_results_log(const std::string& file, const std::vector<CaseResult>& results) {
  std::string text;
  for (const CaseResult& r : results) text += to_json(r).dump() + "\n";
  write_file_atomically(file, text);
}

}  // namespace ergpath::batch
