#include "plugin/report/work_report.h"

#include <gtest/gtest.h>

#include <sstream>

namespace {

using ergpath::Segment;
using ergpath::SegmentWork;
using ergpath::WorkResult;
using ergpath::report::WorkContext;

WorkResult two_segments() {
  WorkResult r;
  r.work_J = -147.25;
  r.error_J = 2e-12;
  r.length_m = 1.5;
  r.evaluations = 465;
  SegmentWork a;
  a.edge = 3;
  a.work_J = -100.0;
  a.length_m = 1.0;
  SegmentWork b;
  b.edge = 1;
  b.reversed = true;
  b.name = "run_out";
  b.work_J = -47.25;
  b.length_m = 0.5;
  r.segments = {a, b};
  r.fields = {{"gravity", -150.0}, {"spring", 2.75}};
  r.peak.force_N = -245.2;
  r.peak.s_m = 0.75;
  r.peak.position = {100.0, 0.0, 500.0};
  r.peak.edge = 3;
  return r;
}

TEST(WorkJson, CarriesSegmentsInTravelOrderWithEdgeAndOrientation) {
  WorkContext c;
  c.model = "track.stp";
  c.selector = "edges:3,1";
  const nlohmann::json j = ergpath::report::work_json(two_segments(), c);
  ASSERT_EQ(j.at("segments").size(), 2u);
  EXPECT_EQ(j["segments"][0]["edge"], 3);
  EXPECT_EQ(j["segments"][0]["reversed"], false);
  EXPECT_TRUE(j["segments"][0]["name"].is_null());
  EXPECT_EQ(j["segments"][1]["edge"], 1);
  EXPECT_EQ(j["segments"][1]["reversed"], true);
  EXPECT_EQ(j["segments"][1]["name"], "run_out");
  EXPECT_DOUBLE_EQ(j["work_J"].get<double>(), -147.25);
  EXPECT_DOUBLE_EQ(j["error_estimate_J"].get<double>(), 2e-12);
  EXPECT_EQ(j["fields"][1]["name"], "spring");
  EXPECT_EQ(j["status"], "converged");
  EXPECT_FALSE(j.contains("circulation_J"));
}

TEST(WorkJson, ReportsPeakPositionInMillimetresWhateverTheModelUnit) {
  WorkContext c;
  c.model_unit_m = 1.0;  // a path whose coordinates are metres
  const nlohmann::json j = ergpath::report::work_json(two_segments(), c);
  EXPECT_DOUBLE_EQ(j["peak_tangential_force"]["position_mm"][0].get<double>(), 100000.0);
  EXPECT_DOUBLE_EQ(j["peak_tangential_force"]["position_mm"][2].get<double>(), 500000.0);
}

TEST(WorkJson, AClosedPathReportsItsCirculation) {
  WorkResult r = two_segments();
  r.closed = true;
  const nlohmann::json j = ergpath::report::work_json(r, WorkContext{});
  EXPECT_DOUBLE_EQ(j.at("circulation_J").get<double>(), -147.25);
}

TEST(WorkText, ShowsUnitsTotalsFieldsAndTheCaution) {
  std::ostringstream os;
  WorkContext c;
  c.model = "track.stp";
  c.selector = "all";
  c.field_length_unit = "m";
  c.rel_tol = 1e-10;
  ergpath::report::write_work_text(os, two_segments(), c, "CAUTION: test caution");
  const std::string t = os.str();
  for (const char* part : {"length [m]", "work [J]", "-147.25 J", "gravity", "spring", "reverse", "run_out",
                           "-245.2 N", "CAUTION: test caution"}) {
    EXPECT_NE(t.find(part), std::string::npos) << part << "\n" << t;
  }
}

TEST(FormatNumber, GivesShortestFormWithoutNegativeZero) {
  EXPECT_EQ(ergpath::report::format_number(-0.0), "0");
  EXPECT_EQ(ergpath::report::format_number(1.5), "1.5");
  EXPECT_EQ(ergpath::report::format_number(1.0 / 3.0, 4), "0.3333");
}

}  // namespace
