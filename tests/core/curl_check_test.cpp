// Sampled curl along a path.
#include "plugin/core/curl_check.h"

#include <gtest/gtest.h>

#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::force;
using testing::make;
using testing::single;

// Central differences with step 1e-4 L: a smooth gradient field shows a relative curl ~1e-8 at most.
constexpr double kNoCurl = 1e-6;

TEST(CurlCheck, GradientFieldShowsNoCurl) {
  // F = -grad(x^2 y + sin z) has zero curl (curl grad = 0).
  const Path path = single(make<TwistedCubicCurve>(0.7, -1.0, 1.0));
  const CurlEstimate c = estimate_curl(path, force("-2*x*y, -x^2, -cos(z)"));
  EXPECT_TRUE(c.applicable);
  EXPECT_LT(c.relative, kNoCurl);
}

TEST(CurlCheck, RotationalFieldShowsCurlTwo) {
  // curl (-y, x, 0) = (0, 0, 2) everywhere (by hand).
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 1, 0}));
  const CurlEstimate c = estimate_curl(path, force("-y, x, 0"));
  EXPECT_NEAR(c.max_curl_N_per_m, 2.0, 1e-9);
  EXPECT_GT(c.relative, 1.0);
}

TEST(CurlCheck, MotionDependentForceIsNotApplicable) {
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 1, 0}));
  EXPECT_FALSE(estimate_curl(path, force("-tx, -ty, -tz")).applicable);
}

}  // namespace
}  // namespace ergpath
