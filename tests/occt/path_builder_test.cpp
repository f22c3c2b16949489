// build_path: ordering and orienting selections into one path; gaps, branches, loops, options.
#include <gtest/gtest.h>

#include <cmath>

#include "kernel_adapters/occt/path_builder.h"
#include "occt_test_support.h"
#include "plugin/core/curve_length.h"
#include "plugin/core/error.h"
#include "plugin/core/work.h"

namespace ergpath::occt {
namespace {

using testing::fixture;
using testing::kind_of;

// Consecutive segments share an end point up to STEP's 12-significant-digit rounding of coordinates
// below 1e3 mm (5e-10 mm), well inside the default 1e-3 mm chaining tolerance.
constexpr double kJoinTolMm = 1e-9;
// Sum of per-segment lengths from the 1e-12 integrator, compared with a closed form.
constexpr double kLengthRel = 1e-11;
// Work integrals at the engine's default 1e-10 relative target, compared with a closed form.
constexpr double kWorkRel = 1e-9;

double path_length_mm(const Path& p) {
  double sum = 0.0;
  for (const Segment& s : p.segments) sum += curve_length(*s.curve).length;
  return sum;
}

void expect_continuous(const Path& p) {
  for (std::size_t i = 0; i + 1 < p.segments.size(); ++i) {
    EXPECT_LT(distance(travel_end(p.segments[i]), travel_start(p.segments[i + 1])), kJoinTolMm)
        << "after segment " << i;
  }
  if (p.closed) {
    EXPECT_LT(distance(travel_end(p.segments.back()), travel_start(p.segments.front())), kJoinTolMm);
  }
}

double work_J(const Path& p, const std::string& formula) {
  FieldSpec spec;
  spec.forces = {{"f", formula}};
  spec.length_unit_m = 1e-3;  // the formula sees x, y, z in mm
  return compute_work(p, spec).work_J;
}

TEST(BuildPath, AChainedSketchWhoseEdgesArriveUnorderedAndPartlyAgainstTravelFormsOneLoop) {
  const StepModel m = StepModel::read(fixture("sketch_unordered.stp"));
  const Path p = build_path(m, select_edges(m, "all"));
  ASSERT_EQ(p.segments.size(), 8u);
  EXPECT_TRUE(p.closed);
  expect_continuous(p);
  int reversed = 0;
  for (const Segment& s : p.segments) reversed += s.reversed ? 1 : 0;
  EXPECT_GT(reversed, 0);
  EXPECT_EQ(p.segments.front().edge, 1);
  EXPECT_FALSE(p.segments.front().reversed) << "the first selected edge runs along its own parameter";
  // Stadium perimeter: 2 * 300 mm straights + a full circle of radius 80 mm.
  EXPECT_NEAR(path_length_mm(p), 600.0 + 2.0 * M_PI * 80.0, kLengthRel * 1100.0);
}

TEST(BuildPath, CirculationAroundTheSlotIsTwiceItsArea) {
  const StepModel m = StepModel::read(fixture("sketch_unordered.stp"));
  const Path p = build_path(m, select_edges(m, "all"));
  // Green's theorem: the circulation of (-y, x) around a counter-clockwise loop is 2 x enclosed area.
  // Area = 300 x 160 mm rectangle + circle of radius 80 mm; F in N with x, y in mm and dr in m: /1000.
  const double area_mm2 = 300.0 * 160.0 + M_PI * 80.0 * 80.0;
  const double expected = 2.0 * area_mm2 * 1e-3;
  EXPECT_NEAR(work_J(p, "-y, x, 0"), expected, kWorkRel * expected);
  EXPECT_NEAR(work_J(build_path(m, select_edges(m, "all"), {true, std::nullopt, 1e-3}), "-y, x, 0"),
              -expected, kWorkRel * expected);
}

TEST(BuildPath, OpenChainInAnyOrderFollowsTheFirstSelectedEdge) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  const Path p = build_path(m, {3, 1, 4, 2});
  ASSERT_EQ(p.segments.size(), 4u);
  EXPECT_FALSE(p.closed);
  expect_continuous(p);
  for (int i = 0; i < 4; ++i) {
    EXPECT_EQ(p.segments[i].edge, i + 1);
    EXPECT_FALSE(p.segments[i].reversed);
  }
  std::vector<std::string> notes;
  build_path(m, {3, 1, 4, 2}, {}, &notes);
  ASSERT_EQ(notes.size(), 1u);
  EXPECT_NE(notes[0].find("1,2,3,4"), std::string::npos);
}

TEST(BuildPath, StartPointPicksTheNearerEndOfAnOpenChain) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  PathOptions o;
  o.start_mm = Vec3{1250, 650, 1190};
  const Path p = build_path(m, select_edges(m, "all"), o);
  EXPECT_EQ(p.segments.front().edge, 4);
  EXPECT_TRUE(p.segments.front().reversed);
  expect_continuous(p);
  // A constant force's work depends only on the end points: (0, 0, -1) N over a 1.2 m drop is +1.2 J.
  EXPECT_NEAR(work_J(p, "0, 0, -1"), 1.2, kWorkRel);
}

TEST(BuildPath, ReversingThePathNegatesWorkButNotLength) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  const Path fwd = build_path(m, select_edges(m, "all"));
  PathOptions o;
  o.reverse = true;
  const Path back = build_path(m, select_edges(m, "all"), o);
  EXPECT_EQ(back.segments.front().edge, 4);
  EXPECT_NEAR(path_length_mm(back), path_length_mm(fwd), kLengthRel * path_length_mm(fwd));
  const double w = work_J(fwd, "y, -x, 1");
  EXPECT_NEAR(work_J(back, "y, -x, 1"), -w, kWorkRel * std::abs(w));
}

TEST(BuildPath, GapLargerThanTheToleranceNamesBothEdgesAndTheGap) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  std::string msg;
  EXPECT_EQ(kind_of([&] { build_path(m, {1, 3}); }, &msg), ErrorKind::GapTooLarge);
  // Edge 1 ends at (400, 0, 0) mm, edge 3 starts at (1000, 0, 1200) mm: sqrt(600^2 + 1200^2).
  EXPECT_NE(msg.find("edge 1"), std::string::npos) << msg;
  EXPECT_NE(msg.find("edge 3"), std::string::npos) << msg;
  EXPECT_NE(msg.find("1341.64"), std::string::npos) << msg;
  EXPECT_NE(msg.find("tolerance of 0.001 mm"), std::string::npos) << msg;
}

TEST(BuildPath, ThreeEdgesMeetingAtAPointAreABranch) {
  const StepModel m = StepModel::read(fixture("named_assembly.stp"));
  std::string msg;
  EXPECT_EQ(kind_of([&] { build_path(m, select_edges(m, "all")); }, &msg), ErrorKind::BranchInPath);
  EXPECT_NE(msg.find(" mm"), std::string::npos) << msg;
}

TEST(BuildPath, DegeneratedEdgesAreSkippedWithANote) {
  const StepModel m = StepModel::read(fixture("cone_seam_apex.stp"));
  int apex = 0, circle = 0;
  for (const EdgeInfo& e : m.edges()) {
    if (e.degenerated) apex = e.index;
    if (e.type == CurveType::Circle) circle = e.index;
  }
  std::vector<std::string> notes;
  const Path p = build_path(m, {apex, circle}, {}, &notes);
  ASSERT_EQ(p.segments.size(), 1u);
  EXPECT_TRUE(p.closed);
  ASSERT_EQ(notes.size(), 1u);
  EXPECT_NE(notes[0].find("degenerated"), std::string::npos);
  EXPECT_EQ(kind_of([&] { build_path(m, {apex}); }), ErrorKind::UnknownEdge);
}

TEST(BuildPath, AFullEllipseIsAClosedPathOfOneSegment) {
  const StepModel m = StepModel::read(fixture("ellipse_300x100.stp"));
  const Path p = build_path(m, {1});
  EXPECT_TRUE(p.closed);
  // Green's theorem again: circulation of (-y, x) = 2 pi a b for the ellipse (counter-clockwise).
  const double expected = 2.0 * M_PI * 300.0 * 100.0 * 1e-3;
  EXPECT_NEAR(work_J(p, "-y, x, 0"), expected, kWorkRel * expected);
}

TEST(BuildPath, StartPointRotatesALoopWithoutChangingItsSense) {
  const StepModel m = StepModel::read(fixture("transfer_loop.stp"));
  PathOptions o;
  o.start_mm = Vec3{-400, 200, 0};
  const Path p = build_path(m, select_edges(m, "all"), o);
  EXPECT_TRUE(p.closed);
  EXPECT_LT(distance(travel_start(p.segments.front()), Vec3{-400, 200, 0}), kJoinTolMm);
  expect_continuous(p);
}

TEST(BuildPath, BadRequestsGetTheirOwnKinds) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  EXPECT_EQ(kind_of([&] { build_path(m, {1, 2, 1}); }), ErrorKind::BadSelector);
  EXPECT_EQ(kind_of([&] { build_path(m, {}); }), ErrorKind::UnknownEdge);
  EXPECT_EQ(kind_of([&] { build_path(m, {9}); }), ErrorKind::UnknownEdge);
  PathOptions o;
  o.gap_tolerance_mm = -1.0;
  EXPECT_EQ(kind_of([&] { build_path(m, {1}, o); }), ErrorKind::BadOption);
}

}  // namespace
}  // namespace ergpath::occt
