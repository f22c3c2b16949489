// `ergpath list` through the CLI entry point: JSON keys, filters, text header, exit codes.
#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include <algorithm>
#include <sstream>

#include "occt_test_support.h"
#include "plugin/cli/app.h"

namespace {

using ergpath::occt::testing::fixture;
using json = nlohmann::json;

struct CliRun {
  int code;
  std::string out, err;
};

CliRun list(std::vector<std::string> args) {
  args.insert(args.begin(), {"ergpath", "list"});
  std::vector<char*> argv;
  for (std::string& a : args) argv.push_back(a.data());
  std::ostringstream out, err;
  const int code = ergpath::cli::run(static_cast<int>(argv.size()), argv.data(), out, err);
  return {code, out.str(), err.str()};
}

TEST(ListCommand, JsonCarriesTheAgreedKeysAndASummary) {
  const CliRun r = list({fixture("lift_track_mm.stp"), "--format", "json"});
  ASSERT_EQ(r.code, 0) << r.err;
  const json j = json::parse(r.out);
  ASSERT_EQ(j.at("edges").size(), 4u);
  for (const json& e : j.at("edges")) {
    for (const char* key : {"index", "type", "start_mm", "end_mm", "length_m", "name"})
      EXPECT_TRUE(e.contains(key)) << key;
    EXPECT_TRUE(e.at("name").is_null());
    EXPECT_EQ(e.at("start_mm").size(), 3u);
  }
  EXPECT_EQ(j.at("edges")[1].at("type"), "bspline");
  EXPECT_EQ(j.at("edges")[1].at("degree"), 3);
  EXPECT_EQ(j.at("summary").at("file_unit"), "mm");
  EXPECT_EQ(j.at("summary").at("application_protocol"), "AP214");
  EXPECT_EQ(j.at("summary").at("by_type").at("line"), 2);
  EXPECT_EQ(j.at("summary").at("edge_count"), 4);
}

TEST(ListCommand, NamesAppearAndFiltersNarrowTheList) {
  const CliRun r = list(
      {fixture("named_assembly.stp"), "--format", "json", "--name", "carrier_track", "--type", "circle"});
  ASSERT_EQ(r.code, 0) << r.err;
  const json j = json::parse(r.out);
  ASSERT_EQ(j.at("edges").size(), 2u);
  EXPECT_EQ(j.at("edges")[0].at("name"), "carrier_track");
  EXPECT_EQ(j.at("edges")[0].at("instance"), "lift_cell/carrier_1");
  EXPECT_EQ(j.at("summary").at("listed"), 2);
  EXPECT_EQ(j.at("summary").at("edge_count"), 36);
}

TEST(ListCommand, TextHasAHeaderWithUnitsAndASummaryLine) {
  const CliRun r = list({fixture("lift_track_in.stp")});
  ASSERT_EQ(r.code, 0) << r.err;
  EXPECT_NE(r.out.find("file unit inch"), std::string::npos) << r.out;
  EXPECT_NE(r.out.find("length_m"), std::string::npos);
  EXPECT_NE(r.out.find("start_mm"), std::string::npos);
  EXPECT_NE(r.out.find("summary: 4 of 4 edges listed"), std::string::npos) << r.out;
}

TEST(ListCommand, BadInputIsOneLineAndExitCodeTwo) {
  for (const std::vector<std::string>& args :
       std::vector<std::vector<std::string>>{{"no_such.stp"},
                                             {fixture("point_only.stp")},
                                             {fixture("lift_track_mm.stp"), "--type", "spiral"},
                                             {fixture("lift_track_mm.stp"), "--near", "1,2"},
                                             {fixture("lift_track_mm.stp"), "--within", "5"}}) {
    const CliRun r = list(args);
    EXPECT_EQ(r.code, 2) << args[0];
    EXPECT_TRUE(r.out.empty());
    EXPECT_EQ(std::count(r.err.begin(), r.err.end(), '\n'), 1) << r.err;
  }
}

}  // namespace
