// Ellipse perimeters against the complete elliptic integral of the second kind (Boost.Math ellint_2).
#include <gtest/gtest.h>
#include <boost/math/special_functions/ellint_2.hpp>

#include <cmath>
#include <cstdio>

#include "plugin/core/arc_length.h"
#include "plugin/core/work.h"
#include "tests/core/test_paths.h"
#include "tests/test_name.h"

namespace ergpath {
namespace {

using testing::force;
using testing::make;
using testing::single;

// DLMF 19.9.9: perimeter = 4 a E(e), e = sqrt(1 - b^2/a^2), E the complete integral of the second kind
// with modulus e (Boost's ellint_2(k) takes the modulus k).
double perimeter(double a, double b) { return 4 * a * boost::math::ellint_2(std::sqrt(1 - b * b / (a * a))); }

// Engine default relative target for lengths (IntegrationOptions::rel_tol).
constexpr double kTarget = 1e-10;

class EllipsePerimeter : public ::testing::TestWithParam<double> {};

TEST_P(EllipsePerimeter, MatchesFourATimesCompleteEllipticIntegralOfSecondKind) {
  const double a = 0.3, b = a * GetParam();
  Path path = single(make<EllipseCurve>(Vec3{0, 0, 0}, a, b, 0.0, 2 * M_PI));
  path.closed = true;
  const double exact = perimeter(a, b);
  const WorkResult r = compute_work(path, force("0, 0, 0"));
  EXPECT_NEAR(r.length_m, exact, kTarget * exact) << "b/a=" << GetParam();
  EXPECT_GE(r.length_error_m, std::abs(r.length_m - exact));
  const ArcLength arc(path);
  EXPECT_NEAR(arc.total_m(), exact, 1e-12 * exact);  // the table is built to 1e-13 relative
}

// 3:1 down to 1000:1: the trapezoid rule handles moderate eccentricity, Gauss-Kronrod the rest.
INSTANTIATE_TEST_SUITE_P(AspectRatios, EllipsePerimeter, ::testing::Values(1.0, 1.0 / 3, 0.1, 0.01, 0.001),
                         [](const ::testing::TestParamInfo<double>& i) {
                           // "b_over_a_0_333": the axis ratio, stable across builds.
                           char text[32];
                           std::snprintf(text, sizeof text, "b_over_a_%.3g", i.param);
                           return ergpath::testing::test_name(text);
                         });

TEST(EllipsePerimeterCost, ThreeToOneEllipseTakesFewEvaluations) {
  Path path = single(make<EllipseCurve>(Vec3{0, 0, 0}, 3.0, 1.0, 0.0, 2 * M_PI));
  IntegrationOptions o;
  o.find_peaks = false;
  const WorkResult r = compute_work(path, force("0, 0, 0"), o);
  // Regression guard. The length comes from the arc-length table (465 curve evaluations recorded, to
  // 1e-13 relative); the work pass stops the trapezoid rule at 32 nodes on a field that is zero.
  EXPECT_LE(r.evaluations, 32);
  EXPECT_LE(ArcLength(path).curve_evaluations(), 480);
}

}  // namespace
}  // namespace ergpath
