// End-to-end tests of the `ergpath` command on our own fixtures: JSON shape, physics, invariants, exit codes.
#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include <cmath>
#include <map>
#include <string>
#include <vector>

#include "run_process.h"
#include "tests/test_name.h"

namespace {

using ergpath::testing::ProcessResult;
using ergpath::testing::run_process;
using json = nlohmann::json;

// Standard acceleration of gravity, exact by definition (3rd CGPM, 1901).
constexpr double kGn = 9.80665;
// The engine's default relative tolerance is 1e-10 of the integral of |F.dr|; physics checks allow 1e-9 of
// the reference value so that they test the engine, not the last digits of the error budget.
constexpr double kPhysicsRel = 1e-9;
// STEP writes reals with 12 significant digits (KERNEL-NOTES): the same geometry written in another unit can
// move by ~1e-12 relative per coordinate; 1e-9 relative leaves room for the integrals' own tolerance.
constexpr double kUnitRoundTripRel = 1e-9;

std::string fixture(const std::string& name) { return std::string(ERGPATH_FIXTURES_DIR) + "/" + name; }

ProcessResult cli(const std::vector<std::string>& args) { return run_process(ERGPATH_CLI, args); }

json cli_json(std::vector<std::string> args) {
  args.push_back("--format");
  args.push_back("json");
  const ProcessResult r = cli(args);
  EXPECT_EQ(r.exit_code, 0) << r.err;
  return json::parse(r.out);
}

struct Point {
  double x, y, z;
};
Point point(const json& a) { return {a.at(0).get<double>(), a.at(1).get<double>(), a.at(2).get<double>()}; }
double dist(Point a, Point b) { return std::hypot(a.x - b.x, a.y - b.y, a.z - b.z); }

// The two ends of an open chain of edges: the end points that only one edge has (1e-3 mm chaining tolerance).
std::vector<Point> chain_ends(const json& listing) {
  std::vector<Point> pts;
  for (const json& e : listing.at("edges")) {
    pts.push_back(point(e.at("start_mm")));
    pts.push_back(point(e.at("end_mm")));
  }
  std::vector<Point> ends;
  for (std::size_t i = 0; i < pts.size(); ++i) {
    int same = 0;
    for (std::size_t j = 0; j < pts.size(); ++j) same += dist(pts[i], pts[j]) < 1e-3 ? 1 : 0;
    if (same == 1) ends.push_back(pts[i]);
  }
  return ends;
}

TEST(WorkCommand, JsonHasTheDocumentedKeys) {
  const json j = cli_json({"work", fixture("lift_track_mm.stp"), "--path", "all", "--field", "0, 0, -10"});
  for (const char* key : {"work_J", "error_estimate_J", "length_m", "evaluations", "segments", "fields"}) {
    EXPECT_TRUE(j.contains(key)) << key;
  }
  ASSERT_FALSE(j.at("segments").empty());
  for (const json& s : j.at("segments")) {
    for (const char* key : {"edge", "reversed", "work_J", "length_m"}) EXPECT_TRUE(s.contains(key)) << key;
  }
}

TEST(WorkCommand, UniformGravityOnTheLiftTrackIsMinusMgDeltaZ) {
  // Potential of a uniform field: W = -m g_n (z_end - z_start), whatever the path between the ends.
  const json listing = cli_json({"list", fixture("lift_track_mm.stp")});
  const json j = cli_json(
      {"work", fixture("lift_track_mm.stp"), "--path", "all", "--field", "0, 0, -m*g_n", "--const", "m=25"});
  const Point start = point(listing.at("edges").at(0).at("start_mm"));
  const std::vector<Point> ends = chain_ends(listing);
  ASSERT_EQ(ends.size(), 2u);
  const Point end = dist(ends[0], start) < 1e-3 ? ends[1] : ends[0];
  const double expected = -25.0 * kGn * (end.z - start.z) * 1e-3;
  EXPECT_NEAR(j.at("work_J").get<double>(), expected, kPhysicsRel * std::abs(expected));
  EXPECT_GE(j.at("error_estimate_J").get<double>(), 0.0);
}

TEST(WorkCommand, ReversingThePathNegatesWorkButNotLength) {
  const std::vector<std::string> base{"work",    fixture("lift_track_mm.stp"),
                                      "--path",  "all",
                                      "--field", "-k*(x-1), -k*y, -m*g_n",
                                      "--const", "k=40",
                                      "--const", "m=3"};
  const json fwd = cli_json(base);
  std::vector<std::string> rev = base;
  rev.push_back("--reverse");
  const json bwd = cli_json(rev);
  EXPECT_NEAR(bwd.at("work_J").get<double>(), -fwd.at("work_J").get<double>(),
              kPhysicsRel * std::abs(fwd.at("work_J").get<double>()));
  EXPECT_NEAR(bwd.at("length_m").get<double>(), fwd.at("length_m").get<double>(),
              kPhysicsRel * fwd.at("length_m").get<double>());
}

TEST(WorkCommand, SpringAboutAPointGivesTheHookePotentialDifference) {
  // Linear spring of rate k anchored at a: potential k/2 |r - a|^2, so W = -k/2 (r2^2 - r1^2) (Hooke's law).
  const json listing = cli_json({"list", fixture("lift_track_mm.stp")});
  const json j = cli_json({"work", fixture("lift_track_mm.stp"), "--path", "all", "--field",
                           "-k*(x-ax), -k*(y-ay), -k*(z-az)", "--const", "k=120", "--const", "ax=1.6",
                           "--const", "ay=0", "--const", "az=1.9"});
  const Point start = point(listing.at("edges").at(0).at("start_mm"));
  const std::vector<Point> ends = chain_ends(listing);
  ASSERT_EQ(ends.size(), 2u);
  const Point end = dist(ends[0], start) < 1e-3 ? ends[1] : ends[0];
  const Point anchor{1600, 0, 1900};
  const double r1 = dist(start, anchor) * 1e-3, r2 = dist(end, anchor) * 1e-3;
  const double expected = -0.5 * 120.0 * (r2 * r2 - r1 * r1);
  EXPECT_NEAR(j.at("work_J").get<double>(), expected, kPhysicsRel * std::abs(expected));
}

TEST(WorkCommand, TheSameTrackInMillimetresInchesAndMetresGivesTheSameJoules) {
  const std::vector<std::string> field{"--field", "-k*(x-1), -k*y, -m*g_n", "--const", "k=40", "--const",
                                       "m=3"};
  std::map<std::string, json> results;
  for (const char* f : {"lift_track_mm.stp", "lift_track_in.stp", "lift_track_m.stp"}) {
    std::vector<std::string> args{"work", fixture(f), "--path", "all"};
    args.insert(args.end(), field.begin(), field.end());
    results[f] = cli_json(args);
  }
  const double w = results["lift_track_mm.stp"].at("work_J").get<double>();
  const double l = results["lift_track_mm.stp"].at("length_m").get<double>();
  for (const char* f : {"lift_track_in.stp", "lift_track_m.stp"}) {
    EXPECT_NEAR(results[f].at("work_J").get<double>(), w, kUnitRoundTripRel * std::abs(w)) << f;
    EXPECT_NEAR(results[f].at("length_m").get<double>(), l, kUnitRoundTripRel * l) << f;
  }
}

TEST(WorkCommand, FieldLengthUnitChangesOnlyHowFormulasSeePositions) {
  // k = 120 N/m seen in metres equals k = 0.12 N/mm seen in millimetres: the same physical spring.
  const std::vector<std::string> base{"work", fixture("lift_track_mm.stp"), "--path", "all"};
  std::vector<std::string> m = base, mm = base;
  for (const char* a : {"--field", "-k*(x-1.6), -k*y, -k*(z-1.9)", "--const", "k=120"}) m.push_back(a);
  for (const char* a :
       {"--field", "-k*(x-1600), -k*y, -k*(z-1900)", "--const", "k=0.12", "--field-length-unit", "mm"}) {
    mm.push_back(a);
  }
  const double wm = cli_json(m).at("work_J").get<double>();
  const double wmm = cli_json(mm).at("work_J").get<double>();
  EXPECT_NEAR(wmm, wm, kPhysicsRel * std::abs(wm));
}

TEST(WorkCommand, AnUnorderedSketchIsChainedWithSomeEdgesTravelledAgainstTheirParameter) {
  const json listing = cli_json({"list", fixture("sketch_unordered.stp")});
  const json j = cli_json({"work", fixture("sketch_unordered.stp"), "--path", "all", "--field",
                           "0, 0, -m*g_n", "--const", "m=2"});
  ASSERT_EQ(j.at("segments").size(), listing.at("edges").size());
  int reversed = 0;
  for (const json& s : j.at("segments")) reversed += s.at("reversed").get<bool>() ? 1 : 0;
  EXPECT_GT(reversed, 0) << "the fixture stores some edges against the travel direction";
  double sum = 0.0;
  for (const json& e : listing.at("edges")) sum += e.at("length_m").get<double>();
  EXPECT_NEAR(j.at("length_m").get<double>(), sum, kPhysicsRel * sum);
}

TEST(WorkCommand, TheDemoRunsAndPrintsTheCaution) {
  const ProcessResult r =
      cli({"work", fixture("lift_track_mm.stp"), "--field-file", fixture("lift_track_loads.toml")});
  ASSERT_EQ(r.exit_code, 0) << r.err;
  EXPECT_NE(r.out.find("Total work"), std::string::npos);
  EXPECT_NE(r.out.find("CAUTION"), std::string::npos);
  EXPECT_NE(r.out.find("gravity"), std::string::npos);
}

// Bad input: exit code 2 (3 for numerical failure), one line on stderr, nothing on stdout.
struct BadCase {
  const char* what;
  std::vector<std::string> args;
  int exit_code;
  const char* message_part;
};

class BadInput : public ::testing::TestWithParam<BadCase> {};

TEST_P(BadInput, FailsWithOneLineAndTheDocumentedExitCode) {
  const BadCase& c = GetParam();
  const ProcessResult r = cli(c.args);
  EXPECT_EQ(r.exit_code, c.exit_code) << r.err;
  EXPECT_TRUE(r.out.empty()) << r.out;
  ASSERT_FALSE(r.err.empty());
  EXPECT_EQ(r.err.find('\n'), r.err.size() - 1) << "exactly one line: " << r.err;
  EXPECT_NE(r.err.find(c.message_part), std::string::npos) << r.err;
}

std::vector<BadCase> bad_cases() {
  const std::string track = fixture("lift_track_mm.stp");
  const std::string g = "0, 0, -9.8";
  return {
      {"missing file", {"work", "/nonexistent/none.stp", "--field", g}, 2, "none.stp"},
      {"not STEP", {"work", fixture("README.md"), "--field", g}, 2, "README.md"},
      {"bad selector", {"work", track, "--path", "edgez:1", "--field", g}, 2, "edgez:1"},
      {"edge out of range", {"work", track, "--path", "edge:999", "--field", g}, 2, "999"},
      {"formula syntax", {"work", track, "--field", "0, 0, -9.8*"}, 2, "character"},
      {"unknown name", {"work", track, "--field", "0, 0, -mass*g_n"}, 2, "mass"},
      {"two components", {"work", track, "--field", "0, -9.8"}, 2, "3"},
      {"bad constant", {"work", track, "--field", "0,0,-m", "--const", "m=heavy"}, 2, "heavy"},
      {"constant shadows a variable", {"work", track, "--field", "0,0,-x", "--const", "x=1"}, 2, "x"},
      {"unknown option", {"work", track, "--field", g, "--frobnicate"}, 2, "frobnicate"},
      {"bad unit", {"work", track, "--field", g, "--field-length-unit", "furlong"}, 2, "furlong"},
      {"bad tolerance", {"work", track, "--field", g, "--tolerance", "2"}, 2, "tolerance"},
      {"non-finite field", {"work", track, "--field", "0, 0, 1/(x-x)"}, 3, "edge"},
      {"tolerance not met",
       {"work", track, "--field", "sin(1e5*x), cos(1e5*y), sin(1e5*z)", "--max-evaluations", "200"},
       3,
       "tolerance"},
  };
}

INSTANTIATE_TEST_SUITE_P(WorkCommand, BadInput, ::testing::ValuesIn(bad_cases()),
                         [](const ::testing::TestParamInfo<BadCase>& i) {
                           return ergpath::testing::test_name(i.param.what);
                         });

}  // namespace

namespace {

TEST(WorkCommand, EmptyAndTruncatedFilesAreUnreadableWithExitCode2) {
  const std::string dir = ergpath::testing::make_temp_dir("ergpath-cli-");
  const std::string empty = dir + "/empty.stp", half = dir + "/half.stp";
  ergpath::testing::write_text(empty, "");
  const std::string whole = ergpath::testing::read_text(fixture("lift_track_mm.stp"));
  ASSERT_GT(whole.size(), 100u);
  ergpath::testing::write_text(half, whole.substr(0, whole.size() / 2));
  for (const std::string& f : {empty, half}) {
    const ProcessResult r = cli({"work", f, "--field", "0, 0, -1"});
    EXPECT_EQ(r.exit_code, 2) << f << ": " << r.err;
    EXPECT_TRUE(r.out.empty());
    EXPECT_NE(r.err.find(f), std::string::npos) << r.err;
  }
}

TEST(ListCommand, JsonListsEveryEdgeWithTheDocumentedKeys) {
  const json j = cli_json({"list", fixture("lift_track_mm.stp")});
  ASSERT_FALSE(j.at("edges").empty());
  int expected_index = 1;
  for (const json& e : j.at("edges")) {
    for (const char* key : {"index", "type", "start_mm", "end_mm", "length_m", "name"}) {
      EXPECT_TRUE(e.contains(key)) << key;
    }
    EXPECT_EQ(e.at("index").get<int>(), expected_index++);
    EXPECT_GT(e.at("length_m").get<double>(), 0.0);
  }
}

}  // namespace
