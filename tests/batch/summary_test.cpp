#include <gtest/gtest.h>

#include <sstream>

#include "plugin/batch/summary.h"
#include "plugin/core/error.h"

namespace ergpath::batch {
namespace {

CaseResult passed(std::size_t i) {
  CaseResult r;
  r.index = i;
  r.name = "c" + std::to_string(i);
  r.verdict = Verdict::Pass;
  r.checks = {{"work_J", "max", 10.0, 1.0, 0.0, true}};
  return r;
}

BatchSummary shard(std::size_t k, std::size_t n, std::size_t total) {
  BatchSummary s;
  s.manifest = "m.toml";
  s.manifest_sha256 = std::string(64, '0');
  s.cases_total = total;
  s.shard = {k, n};
  s.model_reads = 2;
  for (std::size_t i = k; i < total; i += n) s.results.push_back(passed(i));
  return s;
}

Error merge_error(const std::vector<BatchSummary>& v) {
  try {
    merge_summaries(v);
  } catch (const Error& e) {
    return e;
  }
  ADD_FAILURE() << "merged";
  return Error(ErrorKind::OutputFailed, "");
}

TEST(MergeSummaries, MissingShardIsABadManifest) {
  EXPECT_EQ(merge_error({shard(0, 3, 9), shard(2, 3, 9)}).kind(), ErrorKind::BadManifest);
}

TEST(MergeSummaries, ShardGivenTwiceIsABadManifest) {
  EXPECT_EQ(merge_error({shard(0, 2, 4), shard(0, 2, 4), shard(1, 2, 4)}).kind(), ErrorKind::BadManifest);
}

TEST(MergeSummaries, SummariesOfDifferentManifestsAreRefused) {
  BatchSummary other = shard(1, 2, 4);
  other.manifest_sha256 = std::string(64, '1');
  const Error e = merge_error({shard(0, 2, 4), other});
  EXPECT_EQ(e.kind(), ErrorKind::BadManifest);
  EXPECT_NE(std::string(e.what()).find("different manifests"), std::string::npos);
}

TEST(MergeSummaries, NothingToMergeIsABadManifest) {
  EXPECT_EQ(merge_error({}).kind(), ErrorKind::BadManifest);
}

TEST(MergeSummaries, ModelReadsOfTheShardsAddUp) {
  const BatchSummary m = merge_summaries({shard(0, 2, 4), shard(1, 2, 4)});
  EXPECT_EQ(m.model_reads, 4);
  ASSERT_EQ(m.results.size(), 4u);
  for (std::size_t i = 0; i < 4; ++i) EXPECT_EQ(m.results[i].index, i);
}

TEST(SummaryFile, NotASummaryIsABadManifest) {
  try {
    summary_from_json(nlohmann::json{{"format", "something-else"}}, "x.json");
    FAIL() << "accepted";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadManifest);
    EXPECT_NE(std::string(e.what()).find("x.json"), std::string::npos);
  }
}

TEST(SummaryFile, PathForAResultsLogReplacesTheJsonlExtension) {
  EXPECT_EQ(summary_path_for("out/shard-3.jsonl"), "out/shard-3.summary.json");
  EXPECT_EQ(summary_path_for("out/results"), "out/results.summary.json");
}

TEST(SummaryText, TableEndsWithTheCautionLine) {
  BatchSummary s = shard(0, 1, 2);
  s.results[1].verdict = Verdict::Error;
  s.results[1].error_kind = "gap_too_large";
  s.results[1].error_message = "edges 3 and 4 are 2.5 mm apart";
  std::ostringstream out;
  write_summary_text(out, s, "CAUTION: test caution");
  const std::string text = out.str();
  EXPECT_NE(text.find("c0"), std::string::npos);
  EXPECT_NE(text.find("PASS"), std::string::npos);
  EXPECT_NE(text.find("ERROR gap_too_large: edges 3 and 4 are 2.5 mm apart"), std::string::npos) << text;
  EXPECT_NE(text.find("1 PASS, 0 FAIL, 1 ERROR"), std::string::npos) << text;
  EXPECT_EQ(text.substr(text.size() - 22), "CAUTION: test caution\n");
}

}  // namespace
}  // namespace ergpath::batch
