#include <gtest/gtest.h>

#include <filesystem>

#include "plugin/batch/results_log.h"
#include "plugin/core/error.h"
#include "text_models.h"

namespace ergpath::batch {
namespace {

CaseResult record(std::size_t i) {
  CaseResult r;
  r.index = i;
  r.name = "case-" + std::to_string(i);
  r.inputs_sha256 = std::string(64, static_cast<char>('a' + i));
  r.verdict = Verdict::Error;
  r.error_kind = "bad_formula";
  r.error_message = "formula error at character 3";
  return r;
}

TEST(ResultsLog, AppendedLinesReadBackInOrder) {
  const std::string file = testing::fresh_dir("ergpath_log_") + "/r.jsonl";
  {
    ResultsLog log(file, true);
    for (std::size_t i = 0; i < 3; ++i) log.append(record(i));
  }
  const LogContents c = read_results_log(file);
  ASSERT_EQ(c.results.size(), 3u);
  EXPECT_EQ(c.dropped_lines, 0u);
  EXPECT_EQ(c.results[2].name, "case-2");
}

TEST(ResultsLog, EachLineIsOnDiskAsSoonAsItIsAppended) {
  const std::string file = testing::fresh_dir("ergpath_log_") + "/r.jsonl";
  ResultsLog log(file, true);
  log.append(record(0));
  EXPECT_EQ(read_results_log(file).results.size(), 1u);  // read while the log is still open
}

TEST(ResultsLog, HalfWrittenLastLineIsDroppedAndTheRestKept) {
  const std::string file = testing::fresh_dir("ergpath_log_") + "/r.jsonl";
  {
    ResultsLog log(file, true);
    log.append(record(0));
    log.append(record(1));
  }
  const std::string text = testing::read_file(file);
  const std::string second_line = to_json(record(1)).dump();
  testing::write_file(file, text.substr(0, text.size() - second_line.size() / 2));
  const LogContents c = read_results_log(file);
  ASSERT_EQ(c.results.size(), 1u);
  EXPECT_EQ(c.dropped_lines, 1u);
  rewrite_results_log(file, c.results);
  EXPECT_EQ(testing::read_file(file), to_json(record(0)).dump() + "\n");
}

TEST(ResultsLog, MissingLogReadsAsEmpty) {
  EXPECT_TRUE(read_results_log("no/such/log.jsonl").results.empty());
}

TEST(ResultsLog, UnwritableLogIsAnOutputFailure) {
  try {
    ResultsLog log("no/such/dir/r.jsonl", true);
    FAIL() << "opened";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::OutputFailed);
  }
}

TEST(AtomicWrite, ReplacesTheFileAndLeavesNoTemporary) {
  const std::string dir = testing::fresh_dir("ergpath_atomic_");
  const std::string file = dir + "/s.json";
  testing::write_file(file, "old");
  write_file_atomically(file, "new");
  EXPECT_EQ(testing::read_file(file), "new");
  std::size_t entries = 0;
  for (const auto& e : std::filesystem::directory_iterator(dir)) entries += e.is_regular_file() ? 1 : 0;
  EXPECT_EQ(entries, 1u);
}

TEST(AtomicWrite, UnwritableFolderIsAnOutputFailure) {
  try {
    write_file_atomically("no/such/dir/s.json", "x");
    FAIL() << "written";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::OutputFailed);
  }
}

}  // namespace
}  // namespace ergpath::batch
