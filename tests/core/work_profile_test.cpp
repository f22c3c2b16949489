// Work profile W(s) along a path.
#include "plugin/core/work_profile.h"

#include <gtest/gtest.h>

#include <cmath>

#include "plugin/core/error.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::chain;
using testing::force;
using testing::make;

// Engine default relative target (IntegrationOptions::rel_tol); each stretch meets it on its own.
constexpr double kTarget = 1e-10;

TEST(WorkProfile, SpringWorkAtMiddleAndEndMatchesHooke) {
  // F = -k r about the origin: W(s) = -k/2 (|r(s)|^2 - |r(0)|^2) (Hooke). A quarter circle of radius
  // 0.2 m from (0.2, 0) keeps |r| constant (W = 0), then a radial line out to 0.5 m.
  const double k = 800.0;
  const auto arc = make<EllipseCurve>(Vec3{0, 0, 0}, 200, 200, 0.0, M_PI / 2);
  const auto line = make<LineCurve>(Vec3{0, 200, 0}, Vec3{0, 500, 0});
  const Path path = chain({{arc, false}, {line, false}}, 1e-3);
  const double quarter = M_PI / 2 * 0.2;
  const std::vector<double> s{0.0, quarter / 2, quarter, quarter + 0.15, quarter + 0.3};
  const auto p = work_profile(path, force("-k*x, -k*y, -k*z", {{"k", k}}), s);
  ASSERT_EQ(p.size(), s.size());
  EXPECT_NEAR(p[1].work_J, 0.0, 1e-12);
  EXPECT_NEAR(p[3].work_J, -0.5 * k * (0.35 * 0.35 - 0.04), kTarget * 100);
  EXPECT_NEAR(p[4].work_J, -0.5 * k * (0.25 - 0.04), kTarget * 100);
  EXPECT_NEAR(p[3].tangential_force_N, -k * 0.35, 1e-9);  // radial line: F . T = -k |r|
  EXPECT_NEAR(p[3].position.y, 350.0, 1e-9);
  EXPECT_EQ(p[3].edge, 2);
  EXPECT_EQ(p[3].segment, 1u);
  EXPECT_GE(p[4].error_J, std::abs(p[4].work_J + 0.5 * k * 0.21));
}

TEST(WorkProfile, DescendingDistancesAreABadOption) {
  const Path path = chain({{make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 0, 0}), false}}, 1.0);
  try {
    work_profile(path, force("1, 0, 0"), {0.5, 0.2});
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
}

}  // namespace
}  // namespace ergpath
