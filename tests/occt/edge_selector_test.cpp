// select_edges: the selector grammar of docs/selectors.md and its error kinds.
#include <gtest/gtest.h>

#include "kernel_adapters/occt/path_builder.h"
#include "occt_test_support.h"
#include "plugin/core/error.h"

namespace ergpath::occt {
namespace {

using testing::fixture;
using testing::kind_of;
using V = std::vector<int>;

class LiftTrack : public ::testing::Test {
 protected:
  static void SetUpTestSuite() { model_ = new StepModel(StepModel::read(fixture("lift_track_mm.stp"))); }
  static void TearDownTestSuite() { delete model_; }
  static const StepModel& m() { return *model_; }
  static StepModel* model_;
};
StepModel* LiftTrack::model_ = nullptr;

TEST_F(LiftTrack, AllSelectsEveryEdgeInListOrder) { EXPECT_EQ(select_edges(m(), "all"), (V{1, 2, 3, 4})); }

TEST_F(LiftTrack, IndicesListsAndRangesKeepTheGivenOrder) {
  EXPECT_EQ(select_edges(m(), "edge:3"), (V{3}));
  EXPECT_EQ(select_edges(m(), "edges:4,2,1"), (V{4, 2, 1}));
  EXPECT_EQ(select_edges(m(), "edges:2-4"), (V{2, 3, 4}));
  EXPECT_EQ(select_edges(m(), "edges:4-2"), (V{4, 3, 2}));
  EXPECT_EQ(select_edges(m(), " edges: 1 , 3-4 "), (V{1, 3, 4}));
}

TEST_F(LiftTrack, CombinedItemsMergeRepeatsKeepingTheFirst) {
  EXPECT_EQ(select_edges(m(), "edge:2,edges:1-3,near:1250,400,1200"), (V{2, 1, 3, 4}));
}

TEST_F(LiftTrack, NearPicksTheEdgeClosestToThePoint) {
  EXPECT_EQ(select_edges(m(), "near:1250,400,1200"), (V{4}));
  EXPECT_EQ(select_edges(m(), "near:200,5,-3"), (V{1}));
  // A point beside the arc's middle (radius 250 mm about (1000, 250, 1200)).
  EXPECT_EQ(select_edges(m(), "near:1180,70,1200"), (V{3}));
}

TEST_F(LiftTrack, OutOfRangeIndicesSayTheValidRange) {
  std::string msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "edge:5"); }, &msg), ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("1..4"), std::string::npos) << msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "edge:0"); }), ErrorKind::UnknownEdge);
  EXPECT_EQ(kind_of([&] { select_edges(m(), "edge:99999999999999999999"); }, &msg), ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("1..4"), std::string::npos) << msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "edges:2-99999999999"); }), ErrorKind::UnknownEdge);
}

TEST_F(LiftTrack, TextThatDoesNotParseIsABadSelector) {
  for (const char* s : {"", "edge:", "edge:abc", "edge:-1", "edges:1,,2", "bogus:1", "3", "near:1,2",
                        "near:1,2,x", "all,4", "name:\"open", "edge:1.5", "near:1e999,0,0"}) {
    EXPECT_EQ(kind_of([&] { select_edges(m(), s); }), ErrorKind::BadSelector) << "'" << s << "'";
  }
}

TEST_F(LiftTrack, NamesInAFileWithoutNamesSaySo) {
  std::string msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "name:track"); }, &msg), ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("no edge names"), std::string::npos) << msg;
}

class Assembly : public ::testing::Test {
 protected:
  static void SetUpTestSuite() { model_ = new StepModel(StepModel::read(fixture("named_assembly.stp"))); }
  static void TearDownTestSuite() { delete model_; }
  static const StepModel& m() { return *model_; }
  static StepModel* model_;
};
StepModel* Assembly::model_ = nullptr;

TEST_F(Assembly, NameSelectsEveryEdgeWithThatName) {
  const V tracks = select_edges(m(), "name:carrier_track");
  ASSERT_EQ(tracks.size(), 2u);
  for (int e : tracks) EXPECT_EQ(m().edge(e).name, std::optional<std::string>("carrier_track"));
}

TEST_F(Assembly, UnknownNamesSuggestTheClosestNames) {
  std::string msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "name:carier_trak"); }, &msg), ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("'carrier_track'"), std::string::npos) << msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "name:\"odd, name; with * and \\\"quotes\\\"\""); }, &msg),
            ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("odd, name; with * and \"quotes\""), std::string::npos) << msg;
}

TEST_F(Assembly, FaceSelectsItsOuterBoundaryAsALoop) {
  const V edges = select_edges(m(), "face:1");
  EXPECT_GE(edges.size(), 3u);
  EXPECT_TRUE(build_path(m(), edges).closed);
}

TEST_F(Assembly, WireSelectsItsEdgesAndListsContinue) {
  const V one = select_edges(m(), "wire:1");
  EXPECT_GE(one.size(), 3u);
  EXPECT_TRUE(build_path(m(), one).closed);
  const V two = select_edges(m(), "wire:1,2");
  EXPECT_GT(two.size(), one.size());
}

TEST_F(Assembly, FaceAndWireIndicesOutOfRangeSayTheValidRange) {
  std::string msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "face:1000"); }, &msg), ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("valid: 1.."), std::string::npos) << msg;
  EXPECT_EQ(kind_of([&] { select_edges(m(), "wire:0"); }), ErrorKind::UnknownEdge);
}

TEST(EdgeSelector, FacesOfAFileWithoutFacesAreOutOfRange) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  std::string msg;
  EXPECT_EQ(kind_of([&] { select_edges(m, "face:1"); }, &msg), ErrorKind::UnknownEdge);
  EXPECT_NE(msg.find("none"), std::string::npos) << msg;
}

TEST(EdgeSelector, AFaceBoundaryAlongASeamIsRefusedWithAHint) {
  const StepModel m = StepModel::read(fixture("cone_seam_apex.stp"));
  // Face 1 or 2 is the conical face whose boundary runs up and down the seam.
  bool refused = false;
  for (const char* s : {"face:1", "face:2"}) {
    try {
      select_edges(m, s);
    } catch (const Error& e) {
      EXPECT_EQ(e.kind(), ErrorKind::BadSelector);
      EXPECT_NE(std::string(e.what()).find("seam"), std::string::npos) << e.what();
      refused = true;
    }
  }
  EXPECT_TRUE(refused);
}

}  // namespace
}  // namespace ergpath::occt
