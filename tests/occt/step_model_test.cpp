// StepModel: reading, units, schema, names, instances, degenerated edges and bad files.
#include <gtest/gtest.h>

#include <boost/math/special_functions/ellint_2.hpp>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <unistd.h>

#include "kernel_adapters/occt/step_model.h"
#include "occt_test_support.h"
#include "plugin/core/error.h"

namespace ergpath::occt {
namespace {

using testing::fixture;
using testing::gcpnts_length_mm;
using testing::kernel_edge;
using testing::kind_of;

// STEP writes reals with 12 significant digits, so a coordinate near 1000 mm carries up to ~5e-10 mm
// of rounding; 1e-9 mm is the resulting bound for points of our fixtures (all within 2 m of the origin).
constexpr double kStepPointTolMm = 1e-9;
// Lengths from our integrator (1e-12 target) against GCPnts at 1e-12: both within ~1e-13 of the truth.
constexpr double kLengthAgreementRel = 1e-11;
// The same geometry written in another unit is rounded to 12 significant digits in that unit: up to
// 5e-12 relative per coordinate, which bounds the relative change of a length by about 1e-11.
constexpr double kUnitRoundingRel = 1e-11;

void expect_point(const Vec3& p, double x, double y, double z) {
  EXPECT_NEAR(p.x, x, kStepPointTolMm);
  EXPECT_NEAR(p.y, y, kStepPointTolMm);
  EXPECT_NEAR(p.z, z, kStepPointTolMm);
}

std::string message_of(const std::string& file) {
  try {
    StepModel::read(file);
  } catch (const Error& e) {
    return e.what();
  }
  return "";
}

struct TempDir {
  std::filesystem::path dir;
  TempDir() {
    dir = std::filesystem::temp_directory_path() / ("ergpath_step_" + std::to_string(::getpid()));
    std::filesystem::create_directories(dir);
  }
  ~TempDir() { std::filesystem::remove_all(dir); }
  std::string write(const std::string& name, const std::string& text) const {
    const std::string p = (dir / name).string();
    std::ofstream(p, std::ios::binary) << text;
    return p;
  }
};

std::string read_all(const std::string& file) {
  std::ifstream in(file, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

TEST(StepModel, ReadsTheLiftTrackAsFourEdgesInMillimetres) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  ASSERT_EQ(m.edge_count(), 4);
  EXPECT_EQ(m.file_unit(), "mm");
  // Construction values of the fixture (fixtures/make_fixtures.cpp).
  EXPECT_EQ(m.edge(1).type, CurveType::Line);
  EXPECT_EQ(m.edge(2).type, CurveType::BSpline);
  EXPECT_EQ(m.edge(3).type, CurveType::Circle);
  EXPECT_EQ(m.edge(4).type, CurveType::Line);
  expect_point(m.edge(1).start_mm, 0, 0, 0);
  expect_point(m.edge(2).end_mm, 1000, 0, 1200);
  expect_point(m.edge(4).end_mm, 1250, 650, 1200);
  for (const EdgeInfo& e : m.edges()) {
    EXPECT_EQ(e.index, &e - &m.edges()[0] + 1);
    EXPECT_FALSE(e.degenerated);
    EXPECT_FALSE(e.closed);
    EXPECT_FALSE(e.name.has_value()) << "free edges carry no names in STEP";
  }
}

TEST(StepModel, EdgeLengthsAgreeWithTheKernelsOwnArcLength) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  for (const EdgeInfo& e : m.edges()) {
    const double ref_m = gcpnts_length_mm(kernel_edge(m, e.index)) * 1e-3;
    EXPECT_NEAR(e.length_m, ref_m, kLengthAgreementRel * ref_m) << "edge " << e.index;
  }
}

TEST(StepModel, ArcAndLineLengthsMatchClosedForms) {
  const StepModel m = StepModel::read(fixture("lift_track_mm.stp"));
  // Circular arc: s = r * theta (r = 250 mm, theta = pi/2).
  EXPECT_NEAR(m.edge(3).length_m, 0.250 * M_PI / 2.0, kLengthAgreementRel);
  // Straight line: the distance of its end points, 400 mm.
  EXPECT_NEAR(m.edge(1).length_m, 0.400, kLengthAgreementRel);
}

TEST(StepModel, FileUnitsAreReportedAndDoNotChangeLengths) {
  const StepModel ref = StepModel::read(fixture("lift_track_mm.stp"));
  const std::pair<const char*, const char*> files[] = {{"lift_track_in.stp", "inch"},
                                                       {"lift_track_m.stp", "m"},
                                                       {"lift_track_cm.stp", "cm"},
                                                       {"lift_track_ft.stp", "ft"}};
  for (const auto& [file, unit] : files) {
    const StepModel m = StepModel::read(fixture(file));
    EXPECT_EQ(m.file_unit(), unit) << file;
    ASSERT_EQ(m.edge_count(), ref.edge_count()) << file;
    for (int i = 1; i <= m.edge_count(); ++i) {
      EXPECT_NEAR(m.edge(i).length_m, ref.edge(i).length_m, kUnitRoundingRel * ref.edge(i).length_m)
          << file << " edge " << i;
      EXPECT_NEAR(m.edge(i).end_mm.z, ref.edge(i).end_mm.z, 1e-11 * 1200.0) << file << " edge " << i;
    }
  }
}

TEST(StepModel, SchemaAndApplicationProtocolAreReported) {
  EXPECT_EQ(StepModel::read(fixture("ellipse_300x100.stp")).application_protocol(), "AP203");
  EXPECT_EQ(StepModel::read(fixture("ellipse_300x100.stp")).schema(), "CONFIG_CONTROL_DESIGN");
  EXPECT_EQ(StepModel::read(fixture("lift_track_mm.stp")).application_protocol(), "AP214");
  EXPECT_EQ(StepModel::read(fixture("lift_track_mm.stp")).schema(), "AUTOMOTIVE_DESIGN");
  EXPECT_EQ(StepModel::read(fixture("named_assembly.stp")).application_protocol(), "AP242");
}

TEST(StepModel, EllipsePerimeterMatchesTheCompleteEllipticIntegral) {
  const StepModel m = StepModel::read(fixture("ellipse_300x100.stp"));
  ASSERT_EQ(m.edge_count(), 1);
  // DLMF 19.9.9: perimeter = 4 a E(k), k^2 = 1 - b^2/a^2; E by Boost.Math comp_ellint_2.
  const double a = 300.0, b = 100.0;
  const double perimeter_mm = 4.0 * a * boost::math::ellint_2(std::sqrt(1.0 - b * b / (a * a)));
  EXPECT_NEAR(m.edge(1).length_m, perimeter_mm * 1e-3, kLengthAgreementRel * perimeter_mm * 1e-3);
  EXPECT_TRUE(m.edge(1).closed);
  EXPECT_EQ(m.edge(1).type, CurveType::Ellipse);
  EXPECT_TRUE(m.make_curve(1)->structure().full_period);
}

TEST(StepModel, SubShapeNamesAndInstancesSurviveTheRoundTrip) {
  const StepModel m = StepModel::read(fixture("named_assembly.stp"));
  EXPECT_EQ(m.edge_count(), 36);  // two carriers (12 edges each) and a block (12 edges)
  std::vector<const EdgeInfo*> tracks;
  for (const EdgeInfo& e : m.edges())
    if (e.name == std::optional<std::string>("carrier_track")) tracks.push_back(&e);
  ASSERT_EQ(tracks.size(), 2u);
  // Instance 2 is placed by a 30-degree turn about +z and a shift (100, 600, 250) mm.
  const Vec3 p = tracks[0]->start_mm;
  const double c = std::cos(M_PI / 6.0), s = std::sin(M_PI / 6.0);
  expect_point(tracks[1]->start_mm, c * p.x - s * p.y + 100.0, s * p.x + c * p.y + 600.0, p.z + 250.0);
  EXPECT_NEAR(tracks[0]->length_m, tracks[1]->length_m, kLengthAgreementRel);
}

TEST(StepModel, DegeneratedEdgesAreNumberedButHaveNoCurve) {
  const StepModel m = StepModel::read(fixture("cone_seam_apex.stp"));
  ASSERT_EQ(m.edge_count(), 3);
  int degenerated = 0;
  for (const EdgeInfo& e : m.edges()) {
    if (!e.degenerated) continue;
    ++degenerated;
    EXPECT_EQ(e.length_m, 0.0);
    EXPECT_EQ(kind_of([&] { m.make_curve(e.index); }), ErrorKind::UnknownEdge);
  }
  EXPECT_EQ(degenerated, 1);  // the apex
}

TEST(StepModel, MissingFileIsUnreadableAndNamed) {
  EXPECT_EQ(kind_of([] { StepModel::read("no/such/model.stp"); }), ErrorKind::UnreadableFile);
  EXPECT_NE(message_of("no/such/model.stp").find("no/such/model.stp"), std::string::npos);
}

TEST(StepModel, EmptyFileIsUnreadable) {
  TempDir t;
  const std::string f = t.write("empty.stp", "");
  EXPECT_EQ(kind_of([&] { StepModel::read(f); }), ErrorKind::UnreadableFile);
}

TEST(StepModel, TruncatedFileIsUnreadable) {
  TempDir t;
  const std::string text = read_all(fixture("lift_track_mm.stp"));
  const std::string f = t.write("cut.stp", text.substr(0, text.size() / 2));
  EXPECT_EQ(kind_of([&] { StepModel::read(f); }), ErrorKind::UnreadableFile);
  EXPECT_NE(message_of(f).find("truncated"), std::string::npos);
}

TEST(StepModel, TextThatIsNotStepIsUnreadable) {
  TempDir t;
  const std::string f = t.write("notes.stp", "solid cube\n  facet normal 0 0 1\nendsolid\n");
  EXPECT_EQ(kind_of([&] { StepModel::read(f); }), ErrorKind::UnreadableFile);
  const std::string bin = t.write("binary.stp", std::string("\x7f"
                                                            "ELF\x02\x01\x01\0\0\0",
                                                            10));
  EXPECT_EQ(kind_of([&] { StepModel::read(bin); }), ErrorKind::UnreadableFile);
  EXPECT_EQ(kind_of([&] { StepModel::read(t.dir.string()); }), ErrorKind::UnreadableFile);
}

TEST(StepModel, MalformedDataSectionIsUnreadable) {
  TempDir t;
  const std::string f =
      t.write("bad.stp",
              "ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((''),'2;1');\nFILE_NAME('','',(''),(''),'','','');\n"
              "FILE_SCHEMA(('AUTOMOTIVE_DESIGN'));\nENDSEC;\nDATA;\n#1 = CARTESIAN_POINT('',(0.,0.,;\n"
              "#2 = ((( ;\nENDSEC;\nEND-ISO-10303-21;\n");
  EXPECT_EQ(kind_of([&] { StepModel::read(f); }), ErrorKind::UnreadableFile);
}

TEST(StepModel, FileWithoutEdgesIsAnEmptyModel) {
  EXPECT_EQ(kind_of([] { StepModel::read(fixture("point_only.stp")); }), ErrorKind::EmptyModel);
  EXPECT_NE(message_of(fixture("point_only.stp")).find("point_only.stp"), std::string::npos);
}

}  // namespace
}  // namespace ergpath::occt
