// Scalar line integrals of f ds.
#include "plugin/core/scalar_integral.h"

#include <gtest/gtest.h>

#include <cmath>

#include "plugin/core/error.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::make;
using testing::single;

// Engine default relative target (IntegrationOptions::rel_tol).
constexpr double kTarget = 1e-10;

ScalarFieldSpec density(const std::string& f, double unit_m = 1.0) { return {f, {}, unit_m}; }

TEST(ScalarLineIntegral, SquaredOrdinateRoundACircleIsPiRCubed) {
  // Integral of y^2 ds round a circle of radius R about the origin: R^3 pi (integral of sin^2 over a turn).
  const double r = 0.2;
  const Path path = single(make<EllipseCurve>(Vec3{0, 0, 0}, r, r, 0.0, 2 * M_PI));
  const ScalarResult res = compute_scalar(path, density("y^2"));
  const double exact = M_PI * r * r * r;
  EXPECT_NEAR(res.value, exact, kTarget * res.abs_value);
  EXPECT_GE(res.error, std::abs(res.value - exact));
}

TEST(ScalarLineIntegral, ReversingThePathLeavesItUnchanged) {
  const Path path = single(make<TwistedCubicCurve>(0.5, 0.0, 1.4), 1.0);
  const ScalarResult a = compute_scalar(path, density("1 + x*z + s"));
  const ScalarResult c = compute_scalar(reversed(path), density("1 + x*z"));
  const ScalarResult d = compute_scalar(path, density("1 + x*z"));
  EXPECT_NEAR(c.value, d.value, 2 * kTarget * d.abs_value);
  // s runs from the path start: integral of s ds = L^2 / 2 either way.
  EXPECT_NEAR(a.value - d.value, 0.5 * a.length_m * a.length_m, 2 * kTarget * a.abs_value);
}

TEST(ScalarLineIntegral, TwoComponentsAreAWrongComponentCount) {
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 0, 0}));
  try {
    compute_scalar(path, density("x, y"));
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::WrongComponentCount);
  }
}

}  // namespace
}  // namespace ergpath
