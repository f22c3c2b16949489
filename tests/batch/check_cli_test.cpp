// End-to-end tests of `ergpath check` and `ergpath merge`: the built binary on the real STEP fixtures.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include <cmath>
#include <filesystem>
#include <set>

#include "run_process.h"

namespace {

using ergpath::testing::read_text;
using ergpath::testing::run_process;
using ergpath::testing::write_text;

// A fresh temp folder, removed with its contents when the test ends.
struct TempDir {
  explicit TempDir(const std::string& prefix) : path(ergpath::testing::make_temp_dir(prefix)) {}
  ~TempDir() {
    std::error_code ec;
    std::filesystem::remove_all(path, ec);
  }
  operator const std::string&() const { return path; }
  std::string operator+(const std::string& tail) const { return path + tail; }
  std::string path;
};

const std::string kCli = ERGPATH_CLI;
const std::string kFixtures = ERGPATH_FIXTURES_DIR;
const std::string kDemo = kFixtures + "/batch/mechanisms.toml";

// STEP stores coordinates with 12 significant digits (KERNEL-NOTES), and the cases integrate to 1e-9:
// a demo value matches its closed form to 1e-8 relative with room to spare.
constexpr double kDemoRel = 1e-8;
constexpr double kGn = 9.80665;  // standard gravity, m/s^2 (3rd CGPM, 1901)

nlohmann::json results_without_timing(const nlohmann::json& summary) {
  nlohmann::json a = summary.at("results");
  for (auto& r : a) {
    r.erase("elapsed_s");
    r.erase("resumed");
  }
  return a;
}

const nlohmann::json& case_named(const nlohmann::json& summary, const std::string& name) {
  for (const auto& r : summary.at("results")) {
    if (r.at("name") == name) return r;
  }
  throw std::runtime_error("no case " + name);
}

std::size_t count_lines(const std::string& text) {
  std::size_t n = 0;
  for (char c : text) n += c == '\n' ? 1 : 0;
  return n;
}

TEST(CheckCommand, DemoManifestFailsOnlyTheCaseMeantToFailAndExitsOne) {
  const auto p = run_process(kCli, {"check", kDemo, "--jobs", "2", "--format", "json"});
  ASSERT_EQ(p.exit_code, 1) << p.err;
  const nlohmann::json s = nlohmann::json::parse(p.out);
  ASSERT_EQ(s.at("results").size(), 6u);
  for (const auto& r : s.at("results")) {
    EXPECT_EQ(r.at("verdict"), r.at("name") == "magnet-latch-close" ? "FAIL" : "PASS") << r.dump();
  }
  EXPECT_EQ(s.at("passed"), 5);
  EXPECT_EQ(s.at("failed"), 1);
  EXPECT_EQ(s.at("exit_code"), 1);
}

TEST(CheckCommand, EachDemoModelFileIsParsedOnce) {
  const auto p = run_process(kCli, {"check", kDemo, "--jobs", "4", "--format", "json"});
  const nlohmann::json s = nlohmann::json::parse(p.out);
  EXPECT_EQ(s.at("model_reads"), 6);
  EXPECT_EQ(s.at("distinct_models"), 6);
}

TEST(CheckCommand, DemoValuesMatchTheirClosedForms) {
  const auto p = run_process(kCli, {"check", kDemo, "--format", "json"});
  const nlohmann::json s = nlohmann::json::parse(p.out);
  // Hatch, closing along the 600 mm arc from (0, 0, 0.6) to (0, 0.6, 0) m: weight m g h; zero-free-length
  // spring to A = (0, -0.2, 0.8): -(k/2)(|r1-A|^2 - |r0-A|^2); constant drag times arc length r pi/2.
  const double hatch = 12.0 * kGn * 0.6 - 0.5 * 100.0 * (1.28 - 0.08) - 5.0 * 0.6 * M_PI / 2;
  EXPECT_NEAR(case_named(s, "hatch-close").at("values").at("work_J").get<double>(), hatch,
              std::abs(hatch) * kDemoRel);
  // Drawer: Coulomb friction mu m g over 0.5 m; the Gaussian detent integrates to -fd wd sqrt(pi)
  // (its tails beyond the travel are below exp(-225)).
  const double drawer = -0.05 * 18.0 * kGn * 0.5 - 20.0 * 0.01 * std::sqrt(M_PI);
  EXPECT_NEAR(case_named(s, "drawer-open").at("values").at("work_J").get<double>(), drawer,
              std::abs(drawer) * kDemoRel);
  // Latch from x = 80 mm to 5 mm: magnet cm (1/(x1+g0) - 1/(x0+g0)); latch spring -(k/2) (xe - x1)^2.
  const double latch = 1.176e-3 * (1 / 0.007 - 1 / 0.082) - 0.5 * 300.0 * 0.025 * 0.025;
  EXPECT_NEAR(case_named(s, "magnet-latch-close").at("values").at("work_J").get<double>(), latch,
              std::abs(latch) * kDemoRel);
  // Lift: the weight's share is -m g dz over the 1.2 m rise (a gradient field: path-independent).
  EXPECT_NEAR(case_named(s, "lift-raise").at("values").at("field_work_J").at("gravity").get<double>(),
              -25.0 * kGn * 1.2, 25.0 * kGn * 1.2 * kDemoRel);
  // Transfer loop: stadium with 800 mm straights and 200 mm radius: 2 x 0.8 + 2 pi 0.2 m.
  EXPECT_NEAR(case_named(s, "transfer-loop-lap").at("values").at("length_m").get<double>(), 1.6 + 0.4 * M_PI,
              (1.6 + 0.4 * M_PI) * kDemoRel);
}

TEST(CheckCommand, TextSummaryListsEveryLimitAndEndsWithTheCaution) {
  const auto p = run_process(kCli, {"check", kDemo});
  ASSERT_EQ(p.exit_code, 1) << p.err;
  EXPECT_NE(p.out.find("magnet-latch-close"), std::string::npos);
  EXPECT_NE(p.out.find("FAIL"), std::string::npos);
  EXPECT_NE(p.out.find("5 PASS, 1 FAIL, 0 ERROR"), std::string::npos) << p.out;
  EXPECT_NE(p.out.find("model files read: 6"), std::string::npos) << p.out;
  EXPECT_NE(p.out.find("CAUTION:"), std::string::npos);
  EXPECT_TRUE(p.err.empty()) << "no progress bar when stderr is not a terminal: " << p.err;
}

TEST(CheckCommand, OrderIsTheManifestsWithOneOrFourJobs) {
  const auto one = run_process(kCli, {"check", kDemo, "--jobs", "1", "--format", "json"});
  const auto four = run_process(kCli, {"check", kDemo, "--jobs", "4", "--format", "json"});
  EXPECT_EQ(results_without_timing(nlohmann::json::parse(one.out)),
            results_without_timing(nlohmann::json::parse(four.out)));
}

// A manifest in a temp folder mixing good cases with broken ones, on the real fixtures.
std::string write_mixed_manifest(const std::string& dir) {
  const std::string text =
      "[defaults]\nlength_unit = \"m\"\n"
      "[[case]]\nname = \"lift-weight\"\nmodel = \"" +
      kFixtures +
      "/lift_track_mm.stp\"\n"
      "start_mm = [0, 0, 0]\n[case.forces]\nw = \"0, 0, -25*g_n\"\n"
      "[case.limits]\nwork_min_J = -300\n"
      "[[case]]\nname = \"gap\"\nmodel = \"" +
      kFixtures +
      "/lift_track_mm.stp\"\n"
      "path = \"edges:1,4\"\n[case.forces]\nw = \"0, 0, -1\"\n[case.limits]\nwork_min_J = -1\n"
      "[[case]]\nname = \"no-model\"\nmodel = \"missing.stp\"\n"
      "[case.forces]\nw = \"0, 0, -1\"\n[case.limits]\nwork_min_J = -1\n"
      "[[case]]\nname = \"typo\"\nmodel = \"" +
      kFixtures +
      "/drawer_slide.stp\"\n"
      "[case.forces]\nw = \"0, 0, -1 +* 2\"\n[case.limits]\nwork_min_J = -1\n"
      "[[case]]\nname = \"drawer-length\"\nmodel = \"" +
      kFixtures +
      "/drawer_slide.stp\"\n"
      "[case.forces]\nw = \"0, 0, -1\"\n[case.limits]\nlength_min_m = 0.49\n";
  write_text(dir + "/mixed.toml", text);
  return dir + "/mixed.toml";
}

TEST(CheckCommand, BrokenCasesAreErrorsTheOthersStillPassAndTheExitIsTwo) {
  const TempDir dir("ergpath_check_");
  const auto p = run_process(kCli, {"check", write_mixed_manifest(dir), "--format", "json"});
  ASSERT_EQ(p.exit_code, 2) << p.err;
  const nlohmann::json s = nlohmann::json::parse(p.out);
  EXPECT_EQ(case_named(s, "lift-weight").at("verdict"), "PASS");
  EXPECT_EQ(case_named(s, "drawer-length").at("verdict"), "PASS");
  EXPECT_EQ(case_named(s, "gap").at("error").at("kind"), "gap_too_large");
  EXPECT_EQ(case_named(s, "no-model").at("error").at("kind"), "unreadable_file");
  EXPECT_EQ(case_named(s, "typo").at("error").at("kind"), "bad_formula");
  EXPECT_EQ(s.at("errors"), 3);
}

TEST(CheckCommand, AllPassingManifestExitsZero) {
  const TempDir dir("ergpath_check_");
  write_text(dir + "/ok.toml",
             "[[case]]\nname = \"slide\"\nmodel = \"" + kFixtures +
                 "/drawer_slide.stp\"\nlength_unit = \"m\"\n[case.forces]\nf = \"-2, 0, 0\"\n"
                 "[case.limits]\nwork_min_J = -1.5\nwork_max_J = 0\n");
  const auto p = run_process(kCli, {"check", dir + "/ok.toml"});
  EXPECT_EQ(p.exit_code, 0) << p.out << p.err;
  EXPECT_NE(p.out.find("1 PASS, 0 FAIL, 0 ERROR"), std::string::npos) << p.out;
}

TEST(CheckCommand, UnreadableManifestIsOneLineNamingTheLineAndExitTwo) {
  const TempDir dir("ergpath_check_");
  write_text(dir + "/bad.toml", "[[case]]\nname = \"x\"\nmodel = \"m.stp\"\nspeed = 3\n");
  const auto p = run_process(kCli, {"check", dir + "/bad.toml"});
  EXPECT_EQ(p.exit_code, 2);
  EXPECT_TRUE(p.out.empty());
  EXPECT_EQ(count_lines(p.err), 1u) << p.err;
  EXPECT_NE(p.err.find("bad.toml:4: unknown key 'speed'"), std::string::npos) << p.err;
}

TEST(CheckCommand, ResumeWithoutAResultsLogIsABadOption) {
  const auto p = run_process(kCli, {"check", kDemo, "--resume"});
  EXPECT_EQ(p.exit_code, 2);
  EXPECT_NE(p.err.find("--resume needs --results"), std::string::npos) << p.err;
}

TEST(CheckCommand, ResumeAfterAnInterruptedRunLosesNothingAndRepeatsNothing) {
  const TempDir dir("ergpath_resume_");
  const std::string log = dir + "/run.jsonl";
  const auto full = run_process(kCli, {"check", kDemo, "--jobs", "2", "--results", log, "--format", "json"});
  ASSERT_EQ(full.exit_code, 1) << full.err;
  ASSERT_EQ(count_lines(read_text(log)), 6u);
  // Simulate an interruption: three finished lines survive, the fourth was being written.
  const std::string text = read_text(log);
  std::size_t cut = 0;
  for (int i = 0; i < 3; ++i) cut = text.find('\n', cut) + 1;
  write_text(log, text.substr(0, cut + 25));

  const auto again =
      run_process(kCli, {"check", kDemo, "--jobs", "2", "--results", log, "--resume", "--format", "json"});
  ASSERT_EQ(again.exit_code, 1) << again.err;
  const nlohmann::json s = nlohmann::json::parse(again.out);
  EXPECT_EQ(s.at("resumed"), 3);
  EXPECT_EQ(s.at("ran"), 3);
  EXPECT_EQ(results_without_timing(s), results_without_timing(nlohmann::json::parse(full.out)));
  // The log has each case exactly once, every line complete.
  std::set<std::string> digests;
  const std::string after = read_text(log);
  std::size_t lines = 0, b = 0;
  for (std::size_t e; (e = after.find('\n', b)) != std::string::npos; b = e + 1, ++lines) {
    digests.insert(nlohmann::json::parse(after.substr(b, e - b)).at("inputs_sha256").get<std::string>());
  }
  EXPECT_EQ(b, after.size());
  EXPECT_EQ(lines, 6u);
  EXPECT_EQ(digests.size(), 6u);
  // The summary file was replaced by the resumed run's.
  const nlohmann::json file = nlohmann::json::parse(read_text(dir + "/run.summary.json"));
  EXPECT_EQ(file.at("resumed"), 3);
  // Resuming a complete log runs nothing.
  const auto third = run_process(kCli, {"check", kDemo, "--results", log, "--resume", "--format", "json"});
  EXPECT_EQ(nlohmann::json::parse(third.out).at("ran"), 0);
  EXPECT_EQ(nlohmann::json::parse(third.out).at("model_reads"), 0);
}

TEST(MergeCommand, ShardedRunsMergedEqualOneFullRun) {
  const TempDir dir("ergpath_shards_");
  const auto full = run_process(kCli, {"check", kDemo, "--format", "json"});
  std::vector<std::string> summaries;
  for (int k = 0; k < 4; ++k) {  // four shards of six cases: two shards get one case each
    const std::string log = dir + "/shard-" + std::to_string(k) + ".jsonl";
    const auto p = run_process(kCli, {"check", kDemo, "--shard", std::to_string(k) + "/4", "--results", log});
    EXPECT_TRUE(p.exit_code == 0 || p.exit_code == 1) << p.err;
    summaries.push_back(dir + "/shard-" + std::to_string(k) + ".summary.json");
  }
  std::vector<std::string> args{"merge"};
  args.insert(args.end(), summaries.rbegin(), summaries.rend());
  args.insert(args.end(), {"--output", dir + "/merged.json", "--format", "json"});
  const auto m = run_process(kCli, args);
  ASSERT_EQ(m.exit_code, 1) << m.err;
  const nlohmann::json merged = nlohmann::json::parse(m.out);
  EXPECT_EQ(results_without_timing(merged), results_without_timing(nlohmann::json::parse(full.out)));
  EXPECT_EQ(merged.at("merged_shards"), 4);
  // The six demo cases use six different models, so no two shards share one: six reads in all.
  EXPECT_EQ(merged.at("model_reads"), 6);
  EXPECT_EQ(merged.at("distinct_models"), 6);
  EXPECT_EQ(nlohmann::json::parse(read_text(dir + "/merged.json")), merged);
}

TEST(MergeCommand, MissingShardIsAnErrorExitTwo) {
  const TempDir dir("ergpath_shards_");
  run_process(kCli, {"check", kDemo, "--shard", "0/2", "--results", dir + "/a.jsonl"});
  const auto m = run_process(kCli, {"merge", dir + "/a.summary.json"});
  EXPECT_EQ(m.exit_code, 2);
  EXPECT_NE(m.err.find("is in no summary"), std::string::npos) << m.err;
}

}  // namespace
