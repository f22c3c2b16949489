// A non-conservative field does different work along different paths between the same end points.
#include <gtest/gtest.h>

#include <cmath>

#include "plugin/core/work.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::force;
using testing::make;
using testing::single;

// Exact values by SymPy, tests/reference/path_dependence_reference.py: F = (y z, x^2, x y z) from (0,0,0)
// to (1,1,1); twisted cubic (t, t^2, t^3): W = 1; straight segment (t, t, t): W = 11/12.
constexpr double kCubicWork = 1.0, kLineWork = 11.0 / 12.0;
// Both integrands are polynomials in t of degree <= 8: the engine is exact up to round-off.
constexpr double kRoundoff = 1e-14;

TEST(PathDependence, TwistedCubicAndStraightSegmentGiveTheSymPyValues) {
  const FieldSpec f = force("y*z, x^2, x*y*z");
  const WorkResult cubic = compute_work(single(make<TwistedCubicCurve>(1.0, 0.0, 1.0)), f);
  const WorkResult line = compute_work(single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 1, 1})), f);
  EXPECT_NEAR(cubic.work_J, kCubicWork, kRoundoff);
  EXPECT_NEAR(line.work_J, kLineWork, kRoundoff);
  EXPECT_GE(cubic.error_J, std::abs(cubic.work_J - kCubicWork));
  EXPECT_GE(line.error_J, std::abs(line.work_J - kLineWork));
}

TEST(RationalCircle, NurbsCircleHasCircumferenceTwoPiR) {
  // Piegl & Tiller 1997, fig. 7.15 nine-point circle: an exact circle, so L = 2 pi R and the
  // circulation of (-y, x, 0) is 2 pi R^2 (Green's theorem: 2 x area).
  const double radius = 0.4;
  const WorkResult r = compute_work(single(std::make_shared<NurbsCurve>(nurbs_circle({1, 1, 0}, radius))),
                                    force("-(y-1), x-1, 0"));
  EXPECT_NEAR(r.length_m, 2 * M_PI * radius, 1e-10 * 2 * M_PI * radius);
  EXPECT_NEAR(r.work_J, 2 * M_PI * radius * radius, 1e-10 * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - 2 * M_PI * radius * radius));
  EXPECT_GE(r.length_error_m, std::abs(r.length_m - 2 * M_PI * radius));
}

}  // namespace
}  // namespace ergpath
