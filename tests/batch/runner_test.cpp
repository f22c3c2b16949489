#include <gtest/gtest.h>

#include <atomic>
#include <cmath>
#include <set>

#include "plugin/batch/results_log.h"
#include "plugin/batch/runner.h"
#include "plugin/batch/summary.h"
#include "plugin/core/error.h"
#include "text_models.h"

namespace ergpath::batch {
namespace {

// Work and circulation of these cases are integrated to a relative 1e-12; comparing to the closed forms
// at 1e-9 leaves room for the integrator's error estimate and round-off of the ~100 nodes summed.
constexpr double kClosedFormRel = 1e-9;

// Two models: a 2 m straight edge along +x, and a full circle of radius 0.5 m about the origin.
struct Fixture {
  std::string dir;
  Manifest manifest;
};

const char* kCases = R"(
[defaults]
tolerance = 1e-12
length_unit = "m"

[[case]]
name = "push"
model = "line.txt"
[case.forces]
f = "10, 0, 0"
[case.limits]
work_max_J = 25.0

[[case]]
name = "push-too-hard"
model = "line.txt"
[case.forces]
f = "30, 0, 0"
[case.limits]
work_max_J = 25.0

[[case]]
name = "swirl"
model = "circle.txt"
[case.forces]
f = "-y, x, 0"
[case.limits]
circulation_max_J = 1.6

[[case]]
name = "broken-selector"
model = "line.txt"
path = "edge:9"
[case.forces]
f = "1, 0, 0"
[case.limits]
work_max_J = 1.0

[[case]]
name = "bad-formula"
model = "line.txt"
[case.forces]
f = "10*, 0, 0"
[case.limits]
work_max_J = 1.0

[[case]]
name = "missing-model"
model = "nowhere.txt"
[case.forces]
f = "1, 0, 0"
[case.limits]
work_max_J = 1.0

[[case]]
name = "conservative-loop"
model = "circle.txt"
[case.forces]
f = "-3*x, -3*y, -9.5"
[case.limits]
circulation_max_J = 1e-9
length_min_m = 3.14
)";

Fixture make_fixture(const std::string& extra_cases = "") {
  Fixture f;
  f.dir = testing::fresh_dir("ergpath_runner_");
  testing::write_file(f.dir + "/line.txt", "line 0 0 0 2000 0 0\n");
  testing::write_file(f.dir + "/circle.txt", "circle 0 0 500\n");
  testing::write_file(f.dir + "/batch.toml", std::string(kCases) + extra_cases);
  f.manifest = read_manifest(f.dir + "/batch.toml");
  return f;
}

// `count` more passing cases alternating between the two models, for ordering and sharing tests.
std::string many_cases(int count) {
  std::string s;
  for (int i = 0; i < count; ++i) {
    const bool line = i % 2 == 0;
    s += "[[case]]\nname = \"extra-" + std::to_string(i) + "\"\nmodel = \"" +
         (line ? "line.txt" : "circle.txt") + "\"\n[case.constants]\nk = " + std::to_string(i + 1) +
         "\n[case.forces]\nf = \"k, -k*y, 0\"\n"
         "[case.limits]\nwork_magnitude_max_J = 1000.0\n";
  }
  return s;
}

// A result without the fields that legitimately differ between runs (wall time, resumed flag).
nlohmann::json stable(const CaseResult& r) {
  nlohmann::json j = to_json(r);
  j.erase("elapsed_s");
  return j;
}

nlohmann::json stable(const BatchSummary& s) {
  nlohmann::json a = nlohmann::json::array();
  for (const CaseResult& r : s.results) a.push_back(stable(r));
  return a;
}

BatchSummary run(const Manifest& m, int jobs, std::atomic<int>* loads = nullptr, RunOptions o = {}) {
  o.jobs = jobs;
  return run_batch(m, testing::text_model_loader(loads), o);
}

TEST(RunBatch, VerdictsAndValuesFollowTheClosedForms) {
  const Fixture f = make_fixture();
  const BatchSummary s = run(f.manifest, 2);
  ASSERT_EQ(s.results.size(), 7u);
  // Constant force: W = F . (r1 - r0) = 10 N x 2 m (elementary mechanics).
  EXPECT_EQ(s.results[0].verdict, Verdict::Pass);
  EXPECT_NEAR(s.results[0].values->work_J, 20.0, 20.0 * kClosedFormRel);
  EXPECT_EQ(s.results[1].verdict, Verdict::Fail);
  EXPECT_NEAR(s.results[1].values->work_J, 60.0, 60.0 * kClosedFormRel);
  // Green's theorem: the circulation of (-y, x) round a circle is 2 x enclosed area = 2 pi R^2, R = 0.5 m.
  EXPECT_EQ(s.results[2].verdict, Verdict::Pass);
  EXPECT_NEAR(s.results[2].values->work_J, 2 * M_PI * 0.25, 2 * M_PI * 0.25 * kClosedFormRel);
  EXPECT_TRUE(s.results[2].values->closed);
  // A gradient field (U = 1.5 (x^2 + y^2) + 9.5 z) nets zero round a loop; circle length 2 pi R.
  EXPECT_EQ(s.results[6].verdict, Verdict::Pass);
  EXPECT_NEAR(s.results[6].values->length_m, M_PI, M_PI * kClosedFormRel);
  EXPECT_EQ(s.exit_code(), 2);
}

TEST(RunBatch, BrokenCasesAreErrorsOfTheirOwnKindAndTheOthersStillRun) {
  const Fixture f = make_fixture();
  const BatchSummary s = run(f.manifest, 2);
  EXPECT_EQ(s.results[3].verdict, Verdict::Error);
  EXPECT_EQ(s.results[3].error_kind, "bad_selector");
  EXPECT_EQ(s.results[4].verdict, Verdict::Error);
  EXPECT_EQ(s.results[4].error_kind, "bad_formula");
  EXPECT_NE(s.results[4].error_message.find("character"), std::string::npos) << s.results[4].error_message;
  EXPECT_EQ(s.results[5].verdict, Verdict::Error);
  EXPECT_EQ(s.results[5].error_kind, "unreadable_file");
  EXPECT_EQ(s.count(Verdict::Pass), 3u);
  EXPECT_EQ(s.count(Verdict::Fail), 1u);
  EXPECT_EQ(s.count(Verdict::Error), 3u);
}

TEST(RunBatch, ExitCodeIsZeroOneOrTwo) {
  const Fixture f = make_fixture();
  Manifest pass = f.manifest, fail = f.manifest;
  pass.cases = {f.manifest.cases[0], f.manifest.cases[2]};
  fail.cases = {f.manifest.cases[0], f.manifest.cases[1]};
  EXPECT_EQ(run(pass, 1).exit_code(), 0);
  EXPECT_EQ(run(fail, 1).exit_code(), 1);
  EXPECT_EQ(run(f.manifest, 1).exit_code(), 2);  // an error outranks a failed limit
}

TEST(RunBatch, ResultsComeInManifestOrderWithOneOrFourJobs) {
  const Fixture f = make_fixture(many_cases(40));
  const BatchSummary one = run(f.manifest, 1);
  const BatchSummary four = run(f.manifest, 4);
  ASSERT_EQ(one.results.size(), 47u);
  for (std::size_t i = 0; i < one.results.size(); ++i) {
    EXPECT_EQ(one.results[i].index, i);
    EXPECT_EQ(one.results[i].name, f.manifest.cases[i].name);
  }
  EXPECT_EQ(stable(one), stable(four));
  EXPECT_EQ(four.jobs, 4);
}

TEST(RunBatch, EachModelFileIsLoadedOnceAndSharedByAllItsCases) {
  const Fixture f = make_fixture(many_cases(40));
  std::atomic<int> loads{0};
  const BatchSummary s = run(f.manifest, 4, &loads);
  // line.txt, circle.txt and the missing nowhere.txt: one attempt each, whatever the case count.
  EXPECT_EQ(loads.load(), 3);
  EXPECT_EQ(s.model_reads, 3);
  EXPECT_EQ(s.distinct_models, 3u);
}

TEST(RunBatch, FinishedCasesAreReportedOneAtATimeAsTheyFinish) {
  const Fixture f = make_fixture(many_cases(20));
  RunOptions o;
  std::set<std::size_t> seen;
  std::size_t planned = 0;
  o.on_planned = [&](std::size_t n) { planned = n; };
  o.on_finished = [&](const CaseResult& r) { EXPECT_TRUE(seen.insert(r.index).second); };
  run(f.manifest, 4, nullptr, o);
  EXPECT_EQ(planned, 27u);
  EXPECT_EQ(seen.size(), 27u);
}

TEST(RunBatch, ResumeAfterAnInterruptionLosesNothingAndRepeatsNothing) {
  const Fixture f = make_fixture(many_cases(10));
  const std::string log_file = f.dir + "/r.jsonl";
  BatchSummary full;
  {
    ResultsLog log(log_file, true);
    RunOptions o;
    o.on_finished = [&](const CaseResult& r) { log.append(r); };
    full = run(f.manifest, 1, nullptr, o);
  }
  // Interrupt after k finished cases, in the middle of writing case k + 1.
  const std::size_t k = 6;
  const std::string text = testing::read_file(log_file);
  std::size_t cut = 0;
  for (std::size_t i = 0; i < k; ++i) cut = text.find('\n', cut) + 1;
  testing::write_file(log_file, text.substr(0, cut + 40));

  LogContents previous = read_results_log(log_file);
  ASSERT_EQ(previous.results.size(), k);
  std::set<std::size_t> kept;
  for (const CaseResult& r : previous.results) kept.insert(r.index);
  EXPECT_EQ(previous.dropped_lines, 1u);
  rewrite_results_log(log_file, previous.results);
  std::vector<std::size_t> ran_now;
  BatchSummary resumed;
  {
    ResultsLog log(log_file, false);
    RunOptions o;
    o.previous = previous.results;
    o.on_finished = [&](const CaseResult& r) {
      ran_now.push_back(r.index);
      log.append(r);
    };
    resumed = run(f.manifest, 4, nullptr, o);
  }
  EXPECT_EQ(resumed.resumed, k);
  EXPECT_EQ(resumed.ran, full.results.size() - k);
  for (std::size_t i : ran_now) EXPECT_EQ(kept.count(i), 0u) << "case " << i << " was run twice";
  EXPECT_EQ(stable(resumed), stable(full));
  // The log holds every case exactly once.
  const LogContents after = read_results_log(log_file);
  EXPECT_EQ(after.dropped_lines, 0u);
  std::set<std::string> digests;
  for (const CaseResult& r : after.results) EXPECT_TRUE(digests.insert(r.inputs_sha256).second) << r.name;
  EXPECT_EQ(digests.size(), full.results.size());
}

TEST(RunBatch, ResumeRunsAgainTheCasesWhoseModelBytesChanged) {
  const Fixture f = make_fixture();
  const BatchSummary first = run(f.manifest, 2);
  testing::write_file(f.dir + "/circle.txt", "circle 0 0 500\n# revised\n");
  RunOptions o;
  o.previous = first.results;
  const BatchSummary again = run(f.manifest, 2, nullptr, o);
  EXPECT_EQ(again.ran, 2u);  // swirl and conservative-loop use the circle
  EXPECT_FALSE(again.results[2].resumed);
  EXPECT_TRUE(again.results[0].resumed);
  EXPECT_NE(again.results[2].inputs_sha256, first.results[2].inputs_sha256);
}

TEST(RunBatch, ResumeRunsAgainACaseWhoseLimitChanged) {
  const Fixture f = make_fixture();
  const BatchSummary first = run(f.manifest, 1);
  Manifest edited = f.manifest;
  edited.cases[1].limits.work_max_J = 70.0;
  RunOptions o;
  o.previous = first.results;
  const BatchSummary again = run(edited, 1, nullptr, o);
  EXPECT_EQ(again.ran, 1u);
  EXPECT_EQ(again.results[1].verdict, Verdict::Pass);
}

TEST(RunBatch, ShardsPartitionTheManifestByCasePosition) {
  const Fixture f = make_fixture(many_cases(8));
  std::set<std::size_t> all;
  for (std::size_t k = 0; k < 3; ++k) {
    RunOptions o;
    o.shard = {k, 3};
    for (const CaseResult& r : run(f.manifest, 2, nullptr, o).results) {
      EXPECT_EQ(r.index % 3, k);
      EXPECT_TRUE(all.insert(r.index).second);
    }
  }
  EXPECT_EQ(all.size(), f.manifest.cases.size());
}

TEST(RunBatch, ShardSummariesMergedEqualOneFullRun) {
  const Fixture f = make_fixture(many_cases(8));
  const BatchSummary full = run(f.manifest, 2);
  std::vector<BatchSummary> shards;
  for (std::size_t k : {2u, 0u, 1u}) {  // merge must not depend on the order shards are given in
    RunOptions o;
    o.shard = {k, 3};
    // Through the JSON file form, as the merge command reads them.
    shards.push_back(summary_from_json(
        nlohmann::json::parse(summary_json(run(f.manifest, 1, nullptr, o)).dump()), "shard"));
  }
  const BatchSummary merged = merge_summaries(shards);
  EXPECT_EQ(stable(merged), stable(full));
  EXPECT_EQ(merged.exit_code(), full.exit_code());
  EXPECT_EQ(merged.merged_shards, 3u);
  EXPECT_EQ(merged.cases_total, full.cases_total);
}

TEST(RunBatch, AnErrorThrownWhileRecordingAResultStopsTheBatch) {
  const Fixture f = make_fixture();
  RunOptions o;
  o.on_finished = [](const CaseResult&) { throw Error(ErrorKind::OutputFailed, "disk full"); };
  try {
    run(f.manifest, 2, nullptr, o);
    FAIL() << "batch went on";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::OutputFailed);
  }
}

TEST(RunBatch, NonPositiveJobCountIsABadOption) {
  const Fixture f = make_fixture();
  try {
    run(f.manifest, 0);
    FAIL() << "accepted";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
}

TEST(ParseShard, AcceptsKOverNWithKBelowN) {
  const Shard s = parse_shard("2/5");
  EXPECT_EQ(s.index, 2u);
  EXPECT_EQ(s.count, 5u);
}

TEST(ParseShard, RejectsMalformedOrOutOfRangeText) {
  for (const char* bad : {"5/5", "1", "/3", "1/", "a/b", "-1/2", "1/0", "1/2/3", " 1/2"}) {
    try {
      parse_shard(bad);
      ADD_FAILURE() << "accepted '" << bad << "'";
    } catch (const Error& e) {
      EXPECT_EQ(e.kind(), ErrorKind::BadOption) << bad;
    }
  }
}

}  // namespace
}  // namespace ergpath::batch
