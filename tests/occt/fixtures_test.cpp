// The committed fixtures equal what fixtures/make_fixtures writes now (geometry, not bytes: the
// header carries a time stamp).
#include <gtest/gtest.h>

#include <cstdlib>
#include <filesystem>

#include "kernel_adapters/occt/step_model.h"
#include "occt_test_support.h"

namespace ergpath::occt {
namespace {

// Both files come from the same writer and the same shapes: the geometry text is identical, so the
// only difference allowed is the reader's own rounding, far below 1e-12 mm and relative.
constexpr double kSameGeometryTol = 1e-12;

TEST(Fixtures, RegeneratedFilesMatchTheCommittedOnes) {
  const std::filesystem::path out = std::filesystem::path(ERGPATH_BINARY_DIR) / "fixtures_regenerated";
  std::filesystem::create_directories(out);
  const std::string cmd =
      std::string("\"") + ERGPATH_MAKE_FIXTURES + "\" \"" + out.string() + "\" > /dev/null";
  ASSERT_EQ(std::system(cmd.c_str()), 0) << cmd;
  int files = 0;
  for (const auto& entry : std::filesystem::directory_iterator(out)) {
    if (entry.path().extension() != ".stp") continue;
    ++files;
    const std::string name = entry.path().filename().string();
    SCOPED_TRACE(name);
    const std::string committed = testing::fixture(name);
    ASSERT_TRUE(std::filesystem::exists(committed)) << "generated but not committed";
    if (name == "point_only.stp") continue;  // no edges: nothing to compare, read fails by design
    const StepModel a = StepModel::read(entry.path().string()), b = StepModel::read(committed);
    ASSERT_EQ(a.edge_count(), b.edge_count());
    EXPECT_EQ(a.file_unit(), b.file_unit());
    EXPECT_EQ(a.schema(), b.schema());
    for (int i = 1; i <= a.edge_count(); ++i) {
      const EdgeInfo &x = a.edge(i), &y = b.edge(i);
      EXPECT_EQ(x.type, y.type) << "edge " << i;
      EXPECT_EQ(x.name, y.name) << "edge " << i;
      EXPECT_EQ(x.degenerated, y.degenerated) << "edge " << i;
      EXPECT_LE(distance(x.start_mm, y.start_mm), kSameGeometryTol) << "edge " << i;
      EXPECT_LE(distance(x.end_mm, y.end_mm), kSameGeometryTol) << "edge " << i;
      EXPECT_NEAR(x.length_m, y.length_m, kSameGeometryTol * std::max(1.0, y.length_m)) << "edge " << i;
    }
  }
  EXPECT_GE(files, 16);
}

}  // namespace
}  // namespace ergpath::occt
