// A worked example of the kind found in calculus textbooks, recomputed by hand.
#include <gtest/gtest.h>

#include <cmath>

#include "plugin/core/analytic_curves.h"
#include "plugin/core/work.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::force;
using testing::make;
using testing::single;

// Default engine target (IntegrationOptions::rel_tol) with room for the scale: the integrand magnitudes are
// O(10) on a unit interval, so 1e-10 of the integral of |F.dr| is below 1e-9 absolute.
constexpr double kTolerance = 1e-9;

TEST(WorkedExample, FieldAlongTheTwistedCubicGivesOneJoule) {
  // From memory (a common textbook exercise): F = (8x^2 y z, 5z, -4xy) along r(t) = (t, t^2, t^3), 0 <= t
  // <= 1. Checked by hand: F(r(t)) . r'(t) = 8t^7 + 10t^4 - 12t^5, whose integral over [0, 1] is 1 + 2 - 2
  // = 1.
  const Path path = single(make<TwistedCubicCurve>(1.0, 0.0, 1.0));
  const WorkResult r = compute_work(path, force("8*x^2*y*z, 5*z, -4*x*y"));
  EXPECT_NEAR(r.work_J, 1.0, kTolerance);
  EXPECT_GE(r.error_J, std::abs(r.work_J - 1.0));  // the estimate bounds the true error
  // Travelled backwards the same field does -1 J (reversal negates work).
  const WorkResult back = compute_work(reversed(path), force("8*x^2*y*z, 5*z, -4*x*y"));
  EXPECT_NEAR(back.work_J, -1.0, kTolerance);
}

}  // namespace
}  // namespace ergpath
