// model_from_shape and path_of_shape (kernel_adapters/occt/shape_model.h): the DRAW plugin's view of a
// session shape must number edges as StepModel::read does and travel wires in their own order.
#include <gtest/gtest.h>
#include <BRepBuilderAPI_MakeEdge.hxx>
#include <BRepBuilderAPI_MakePolygon.hxx>
#include <BRepBuilderAPI_MakeVertex.hxx>
#include <BRepBuilderAPI_MakeWire.hxx>
#include <BRep_Builder.hxx>
#include <STEPControl_Reader.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Compound.hxx>
#include <TopoDS_Wire.hxx>
#include <gp_Ax2.hxx>
#include <gp_Circ.hxx>

#include <cmath>
#include <filesystem>
#include <string>
#include <vector>

#include "kernel_adapters/occt/shape_model.h"
#include "kernel_adapters/occt/step_model.h"
#include "plugin/core/error.h"
#include "plugin/core/field.h"
#include "plugin/core/work.h"

namespace {

using ergpath::ErrorKind;
using ergpath::occt::model_from_shape;
using ergpath::occt::path_of_shape;

// The same file read twice by the same kernel gives bit-identical geometry; 1e-9 mm only allows for
// the two transfer routes (XDE and plain) evaluating a point through different location chains.
constexpr double kSameGeometryMm = 1e-9;
// Lengths come from the same integrator at 1e-12 relative (StepModel's listing accuracy).
constexpr double kSameLengthRel = 1e-11;
// Integrals of low-degree polynomials along straight edges: exact up to round-off.
constexpr double kExactRel = 1e-12;
const double kPi = std::acos(-1.0);

// What DRAW's `testreadstep FILE NAME` puts in the session: the plain reader's one shape.
TopoDS_Shape read_like_draw(const std::string& file) {
  STEPControl_Reader reader;
  EXPECT_EQ(reader.ReadFile(file.c_str()), IFSelect_RetDone) << file;
  reader.TransferRoots();
  return reader.OneShape();
}

ergpath::FieldSpec field(const std::string& formula) {
  ergpath::FieldSpec spec;
  spec.forces.push_back({"F", formula});
  return spec;
}

template <class F>
ErrorKind kind_of(F&& f) {
  try {
    f();
  } catch (const ergpath::Error& e) {
    return e.kind();
  }
  ADD_FAILURE() << "no ergpath::Error thrown";
  return ErrorKind::OutputFailed;
}

TEST(ShapeModel, EveryFixtureIsNumberedAsStepModelReadNumbersIt) {
  int files = 0;
  for (const auto& entry : std::filesystem::directory_iterator(ERGPATH_FIXTURES_DIR)) {
    if (entry.path().extension() != ".stp" || entry.path().filename() == "point_only.stp") continue;
    const std::string file = entry.path().string();
    SCOPED_TRACE(file);
    const auto from_file = ergpath::occt::StepModel::read(file);
    const auto from_shape = model_from_shape(read_like_draw(file), "shape t");
    ASSERT_EQ(from_shape.edge_count(), from_file.edge_count());
    for (int i = 1; i <= from_file.edge_count(); ++i) {
      const auto& a = from_file.edge(i);
      const auto& b = from_shape.edge(i);
      EXPECT_EQ(b.type, a.type) << "edge " << i;
      EXPECT_EQ(b.degenerated, a.degenerated) << "edge " << i;
      EXPECT_LE(distance(a.start_mm, b.start_mm), kSameGeometryMm) << "edge " << i;
      EXPECT_LE(distance(a.end_mm, b.end_mm), kSameGeometryMm) << "edge " << i;
      EXPECT_NEAR(b.length_m, a.length_m, kSameLengthRel * a.length_m) << "edge " << i;
    }
    ++files;
  }
  EXPECT_GE(files, 10) << "the fixtures folder should hold the generated models";
}

TEST(ShapeModel, AShapeWithoutEdgesIsAnEmptyModel) {
  EXPECT_EQ(kind_of([] { model_from_shape(TopoDS_Shape(), "shape n"); }), ErrorKind::EmptyModel);
  const TopoDS_Shape v = BRepBuilderAPI_MakeVertex(gp_Pnt(1, 2, 3)).Shape();
  EXPECT_EQ(kind_of([&] { model_from_shape(v, "shape v"); }), ErrorKind::EmptyModel);
}

TEST(PathOfShape, AWireIsTravelledInItsOwnOrderAndOrientations) {
  // Square 100 mm, counter-clockwise; Green's theorem: circulation of (-y, x, 0) = 2 x 0.01 m^2.
  BRepBuilderAPI_MakePolygon poly(gp_Pnt(0, 0, 0), gp_Pnt(100, 0, 0), gp_Pnt(100, 100, 0), gp_Pnt(0, 100, 0),
                                  Standard_True);
  const auto model = model_from_shape(poly.Wire(), "shape sq");
  const auto path = path_of_shape(model);
  ASSERT_TRUE(path.has_value());
  EXPECT_TRUE(path->closed);
  ASSERT_EQ(path->segments.size(), 4u);
  const auto w = ergpath::compute_work(*path, field("-y, x, 0"));
  EXPECT_NEAR(w.work_J, 0.02, kExactRel);
  ergpath::occt::PathOptions back;
  back.reverse = true;
  EXPECT_NEAR(ergpath::compute_work(*path_of_shape(model, back), field("-y, x, 0")).work_J, -0.02, kExactRel);
}

TEST(PathOfShape, AReversedEdgeRunsAgainstItsParameter) {
  // Circle r = 50 mm: circulation of (-y, x, 0) is 2 pi r^2 counter-clockwise (Green's theorem).
  const TopoDS_Edge e = BRepBuilderAPI_MakeEdge(gp_Circ(gp_Ax2(), 50.0));
  const double area2 = 2 * kPi * 0.05 * 0.05;
  const auto fwd = path_of_shape(model_from_shape(e, "shape e"));
  const auto rev = path_of_shape(model_from_shape(e.Reversed(), "shape er"));
  ASSERT_TRUE(fwd && rev);
  EXPECT_FALSE(fwd->segments.at(0).reversed);
  EXPECT_TRUE(rev->segments.at(0).reversed);
  EXPECT_NEAR(ergpath::compute_work(*fwd, field("-y, x, 0")).work_J, area2, kExactRel);
  EXPECT_NEAR(ergpath::compute_work(*rev, field("-y, x, 0")).work_J, -area2, kExactRel);
}

TEST(PathOfShape, AnOpenWireStartsAtTheEndNearestTheStartPoint) {
  // Ramp rising 0.3 m: uniform gravity gives W = -m g_n dz (potential of a uniform field).
  BRepBuilderAPI_MakePolygon poly(gp_Pnt(0, 0, 0), gp_Pnt(300, 0, 100), gp_Pnt(600, 0, 300));
  const auto model = model_from_shape(poly.Wire(), "shape ramp");
  ergpath::occt::PathOptions from_top;
  from_top.start_mm = ergpath::Vec3{600, 0, 300};
  const auto up = path_of_shape(model);
  const auto down = path_of_shape(model, from_top);
  ASSERT_TRUE(up && down);
  EXPECT_FALSE(up->closed);
  EXPECT_NEAR(ergpath::compute_work(*up, field("0, 0, -9.80665")).work_J, -9.80665 * 0.3, kExactRel);
  EXPECT_NEAR(ergpath::compute_work(*down, field("0, 0, -9.80665")).work_J, 9.80665 * 0.3, kExactRel);
}

TEST(PathOfShape, ACompoundHasNoOwnPathAndIsLeftToChaining) {
  TopoDS_Compound c;
  BRep_Builder b;
  b.MakeCompound(c);
  b.Add(c, BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(1, 0, 0)).Edge());
  EXPECT_FALSE(path_of_shape(model_from_shape(c, "shape c")).has_value());
}

TEST(PathOfShape, AWireNotConnectedThroughVerticesIsLeftToChaining) {
  // Two edges 100 mm apart in one wire (built without a connection check): the explorer cannot walk it.
  TopoDS_Wire w;
  BRep_Builder b;
  b.MakeWire(w);
  b.Add(w, BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(100, 0, 0)).Edge());
  b.Add(w, BRepBuilderAPI_MakeEdge(gp_Pnt(200, 0, 0), gp_Pnt(300, 0, 0)).Edge());
  EXPECT_FALSE(path_of_shape(model_from_shape(w, "shape w")).has_value());
}

TEST(PathOfShape, ANegativeGapToleranceIsABadOption) {
  const TopoDS_Edge e = BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(1, 0, 0));
  const auto model = model_from_shape(e, "shape e");
  ergpath::occt::PathOptions o;
  o.gap_tolerance_mm = -1;
  EXPECT_EQ(kind_of([&] { path_of_shape(model, o); }), ErrorKind::BadOption);
}

}  // namespace
