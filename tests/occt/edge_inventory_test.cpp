// Edge inventory: curve details, topology, instances, filters.
#include <gtest/gtest.h>

#include <map>

#include "kernel_adapters/occt/edge_inventory.h"
#include "occt_test_support.h"
#include "plugin/core/error.h"

namespace ergpath::occt {
namespace {

using testing::fixture;
using testing::kind_of;

// STEP writes the weight 1/sqrt(2) with 12 significant digits, so the stored curve is a circle only to
// ~1e-12 relative; its length (Piegl & Tiller, The NURBS Book, sec. 7.5: exact for the true weight) agrees
// to that order.
constexpr double kRoundedWeightRel = 1e-11;

TEST(EdgeInventory, TheZooHasOneEdgeOfEachKernelCurveKind) {
  const StepModel m = StepModel::read(fixture("shapes_zoo.stp"));
  ASSERT_EQ(m.edge_count(), 10);
  std::map<CurveType, int> count;
  for (const EdgeInfo& e : m.edges()) ++count[e.type];
  for (CurveType t : {CurveType::Line, CurveType::Circle, CurveType::Ellipse, CurveType::Hyperbola,
                      CurveType::Parabola, CurveType::Offset}) {
    EXPECT_EQ(count[t], 1) << to_string(t);
  }
  // Bezier (written as a B-spline), B-spline, rational B-spline and trimmed B-spline.
  EXPECT_EQ(count[CurveType::BSpline], 4);
}

TEST(EdgeInventory, SplineDetailsGiveDegreePolesAndRationalFlag) {
  const StepModel m = StepModel::read(fixture("shapes_zoo.stp"));
  const Inventory inv = edge_inventory(m);
  int rational = 0, offsets = 0;
  for (const EdgeDetails& d : inv.edges) {
    const EdgeInfo& e = m.edge(d.index);
    if (e.type == CurveType::BSpline) {
      ASSERT_TRUE(d.degree && d.poles && d.rational);
      EXPECT_GT(*d.poles, *d.degree);
      rational += *d.rational ? 1 : 0;
      // The rational one is the semicircle: degree 2, 5 poles, exact length 60 pi mm.
      if (*d.rational) {
        EXPECT_EQ(*d.degree, 2);
        EXPECT_EQ(*d.poles, 5);
        EXPECT_NEAR(e.length_m, 0.060 * M_PI, kRoundedWeightRel * 0.060 * M_PI);
      }
    } else {
      EXPECT_FALSE(d.degree.has_value());
    }
    if (e.type == CurveType::Offset) {
      ++offsets;
      EXPECT_EQ(d.basis, std::optional<CurveType>(CurveType::BSpline));
    }
  }
  EXPECT_EQ(rational, 1);
  EXPECT_EQ(offsets, 1);
}

TEST(EdgeInventory, SolidEdgesBoundTwoFacesAndBelongToTheirInstance) {
  const StepModel m = StepModel::read(fixture("named_assembly.stp"));
  const Inventory inv = edge_inventory(m);
  EXPECT_EQ(inv.face_count, 18);  // three solids of six faces
  EXPECT_EQ(inv.wire_count, 18);
  std::map<std::string, int> per_instance;
  for (const EdgeDetails& d : inv.edges) {
    EXPECT_EQ(d.faces.size(), 2u) << "edge " << d.index;
    EXPECT_FALSE(d.seam);
    ASSERT_TRUE(d.instance.has_value()) << "edge " << d.index;
    ++per_instance[*d.instance];
  }
  EXPECT_EQ(per_instance["lift_cell/carrier_1"], 12);
  EXPECT_EQ(per_instance["lift_cell/carrier_2"], 12);
  EXPECT_EQ(per_instance["lift_cell/base"], 12);
}

TEST(EdgeInventory, TheConesSeamIsFlaggedAndItsApexIsDegenerated) {
  const StepModel m = StepModel::read(fixture("cone_seam_apex.stp"));
  const Inventory inv = edge_inventory(m);
  int seams = 0;
  for (const EdgeDetails& d : inv.edges) {
    if (!d.seam) continue;
    ++seams;
    EXPECT_EQ(m.edge(d.index).type, CurveType::Line);
    EXPECT_EQ(d.faces.size(), 1u) << "a seam bounds one face, twice";
  }
  EXPECT_EQ(seams, 1);
}

TEST(EdgeFilters, TypeNameLengthAndProximityFiltersCombine) {
  const StepModel m = StepModel::read(fixture("named_assembly.stp"));
  EdgeFilter f;
  f.types = {CurveType::Circle};
  EXPECT_EQ(filter_edges(m, f).size(), 4u);
  f.name_pattern = "carrier_track";
  EXPECT_EQ(filter_edges(m, f).size(), 2u);
  f = {};
  f.name_pattern = "carrier_*";
  EXPECT_EQ(filter_edges(m, f).size(), 6u);
  f = {};
  f.min_length_m = 0.5;  // the block's 800 mm sides only (4 of them)
  EXPECT_EQ(filter_edges(m, f).size(), 4u);
  f.max_length_m = 0.7;
  EXPECT_TRUE(filter_edges(m, f).empty());
  f = {};
  f.near_mm = Vec3{200, 0, 161};  // just above the first carrier's arch top (200, 0, 160)
  const std::vector<int> nearest = filter_edges(m, f);
  ASSERT_EQ(nearest.size(), 1u);
  EXPECT_EQ(m.edge(nearest[0]).name, std::optional<std::string>("carrier_track"));
  f.within_mm = 1.5;
  EXPECT_EQ(filter_edges(m, f), nearest);
}

TEST(EdgeFilters, BadFilterValuesAreBadOptions) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  EdgeFilter f;
  f.min_length_m = -1.0;
  EXPECT_EQ(kind_of([&] { filter_edges(m, f); }), ErrorKind::BadOption);
  f = {};
  f.within_mm = 3.0;
  EXPECT_EQ(kind_of([&] { filter_edges(m, f); }), ErrorKind::BadOption);
  EXPECT_EQ(kind_of([] { parse_curve_type("spline"); }), ErrorKind::BadOption);
  EXPECT_EQ(parse_curve_type("bspline"), CurveType::BSpline);
}

TEST(EdgeFilters, GlobPatternsMatchWholeNames) {
  EXPECT_TRUE(glob_match("carrier_*", "carrier_track"));
  EXPECT_TRUE(glob_match("*track*", "carrier_track_rear"));
  EXPECT_TRUE(glob_match("c?rrier", "carrier"));
  EXPECT_FALSE(glob_match("carrier", "carrier_track"));
  EXPECT_FALSE(glob_match("*rear", "carrier_track"));
  EXPECT_TRUE(glob_match("*", ""));
}

}  // namespace
}  // namespace ergpath::occt
