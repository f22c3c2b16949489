// Properties over every file of the real-world STEP corpus (../shared/corpus/step, ERGPATH_CORPUS_DIR).
#include <gtest/gtest.h>

#include <filesystem>

#include "kernel_adapters/occt/path_builder.h"
#include "occt_test_support.h"
#include "plugin/core/work.h"
#include "tests/test_name.h"

namespace ergpath::occt {
namespace {

// Required agreement of our listed length with GCPnts_AbscissaPoint::Length(adaptor, 1e-12).
constexpr double kLengthAgreementRel = 1e-9;

std::vector<std::string> corpus_files() {
  std::vector<std::string> out;
  const std::filesystem::path dir(ERGPATH_CORPUS_DIR);
  if (!std::filesystem::is_directory(dir)) return out;
  for (const auto& e : std::filesystem::directory_iterator(dir)) {
    const std::string ext = e.path().extension().string();
    if (ext == ".stp" || ext == ".step" || ext == ".STP" || ext == ".STEP") out.push_back(e.path().string());
  }
  std::sort(out.begin(), out.end());
  return out;
}

class Corpus : public ::testing::TestWithParam<std::string> {
 protected:
  void SetUp() override {
    if (GetParam().empty()) GTEST_SKIP() << "STEP corpus not found at " << ERGPATH_CORPUS_DIR;
  }
};

TEST_P(Corpus, EveryEdgeListsWithAKernelConsistentLengthAndFiniteWork) {
  const StepModel m = StepModel::read(GetParam());
  ASSERT_GT(m.edge_count(), 0);
  FieldSpec spec;
  spec.forces = {{"smooth", "y, -x, 1"}};
  spec.length_unit_m = 1e-3;
  int degenerated = 0;
  for (const EdgeInfo& e : m.edges()) {
    SCOPED_TRACE("edge " + std::to_string(e.index));
    ASSERT_EQ(e.index, &e - &m.edges()[0] + 1);
    if (e.degenerated) {
      ++degenerated;
      continue;
    }
    const double ref_m = testing::gcpnts_length_mm(testing::kernel_edge(m, e.index)) * 1e-3;
    EXPECT_NEAR(e.length_m, ref_m, kLengthAgreementRel * ref_m);
    const Path p = build_path(m, {e.index});
    const WorkResult w = compute_work(p, spec);
    EXPECT_TRUE(std::isfinite(w.work_J));
    EXPECT_EQ(w.status, Status::Converged);
  }
  RecordProperty("edges", m.edge_count());
  RecordProperty("degenerated", degenerated);
}

std::vector<std::string> params() {
  std::vector<std::string> f = corpus_files();
  if (f.empty()) f.push_back("");
  return f;
}

std::string param_name(const ::testing::TestParamInfo<std::string>& info) {
  if (info.param.empty()) return "absent";
  return ergpath::testing::test_name(std::filesystem::path(info.param).stem().string());
}

INSTANTIATE_TEST_SUITE_P(Files, Corpus, ::testing::ValuesIn(params()), param_name);

}  // namespace
}  // namespace ergpath::occt
