// Arc length s(t) and its inverse t(s).
#include "plugin/core/arc_length.h"

#include <gtest/gtest.h>

#include <boost/math/special_functions/ellint_2.hpp>

#include <cmath>

#include "plugin/core/error.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::chain;
using testing::make;
using testing::single;

// The promise of ArcLength::locate: |s(t(s)) - s| <= 1e-12 L.
constexpr double kRoundTrip = 1e-12;
// Stored lengths are resolved to 1e-13 relative (ArcLength::kDefaultRelTol); a check allows twice that.
constexpr double kLength = 2e-13;

TEST(ArcLength, CircleArcLengthIsRadiusTimesAngleAtEveryParameter) {
  // s = R (t - t0) on a circle (definition of the radian).
  const double r = 0.25;
  const Path path = single(make<EllipseCurve>(Vec3{1, 2, 3}, r, r, 0.3, 5.0));
  const ArcLength arc(path);
  EXPECT_NEAR(arc.total_m(), r * 4.7, kLength * r * 4.7);
  for (double t : {0.3, 0.31, 1.0, 2.2, 3.9, 4.99, 5.0}) {
    EXPECT_NEAR(arc.s_at(0, t), r * (t - 0.3), kLength * arc.total_m()) << "t=" << t;
  }
}

TEST(ArcLength, ReversedSegmentCountsFromItsTravelStart) {
  const double r = 0.25;
  const Path path = single(make<EllipseCurve>(Vec3{0, 0, 0}, r, r, 0.0, 2.0), 1.0, true);
  const ArcLength arc(path);
  EXPECT_NEAR(arc.s_at(0, 2.0), 0.0, kLength);
  EXPECT_NEAR(arc.s_at(0, 0.5), r * 1.5, kLength);
}

TEST(ArcLength, TwistedCubicLengthMatchesHighPrecisionQuadrature) {
  // mpmath quad at 30 digits (tests/reference/path_dependence_reference.py): 1.86302298251225139437...
  const Path path = single(make<TwistedCubicCurve>(1.0, 0.0, 1.0));
  const ArcLength arc(path);
  EXPECT_NEAR(arc.total_m(), 1.86302298251225139437, kLength * 1.863);
  EXPECT_GE(arc.error_m(), 0.0);
}

TEST(ArcLength, LocateInvertsArcLengthEverywhereOnAMultiSegmentPath) {
  const auto a = make<TwistedCubicCurve>(300.0, -1.0, 0.7);
  const auto b = std::make_shared<NurbsCurve>(nurbs_circle({0, 0, 0}, 120.0));
  const auto c = make<BezierCurve>(std::vector<Vec3>{{0, 0, 0}, {10, 0, 0}, {10, 0, 0}, {20, 40, 0}});
  const Path path = chain({{a, false}, {b, true}, {c, false}}, 1e-3);
  const ArcLength arc(path);
  const double total = arc.total_m();
  for (int i = 0; i <= 200; ++i) {
    const double s = total * i / 200.0;
    const PathLocation loc = arc.locate(s);
    EXPECT_NEAR(arc.s_at(loc.segment, loc.t), s, kRoundTrip * total) << "s=" << s;
    EXPECT_NEAR(loc.s_m, s, kRoundTrip * total);
  }
  // Segment boundaries: the second segment starts where the first ends.
  EXPECT_NEAR(arc.segment_start_m(1), arc.segment_length_m(0), kRoundTrip * total);
  EXPECT_NEAR(arc.segment_length_m(1), 2 * M_PI * 0.12, kLength * total);
}

TEST(ArcLength, LocateFindsParametersWhereTheSpeedVanishes) {
  // x(t) = (2t - 1)^3 as a cubic Bezier (poles -1, 1, -1, 1 from P1 = P0 + x'(0)/3, P2 = P3 - x'(1)/3):
  // monotone, length 2, and r'(1/2) = 0, where Newton needs its bisection fallback.
  const Path path =
      single(make<BezierCurve>(std::vector<Vec3>{{-1, 0, 0}, {1, 0, 0}, {-1, 0, 0}, {1, 0, 0}}));
  const ArcLength arc(path);
  EXPECT_NEAR(arc.total_m(), 2.0, kLength * 2);
  const PathLocation mid = arc.locate(1.0);
  EXPECT_NEAR(mid.position.x, 0.0, 1e-12);
  EXPECT_NEAR(arc.s_at(0, mid.t), 1.0, kRoundTrip * 2);
  const PathLocation near = arc.locate(1.0 + 1e-9);
  EXPECT_NEAR(near.position.x, 1e-9, 1e-12);
}

TEST(ArcLength, DistanceOutsideThePathIsABadOption) {
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 0, 0}));
  const ArcLength arc(path);
  try {
    arc.locate(1.5);
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
}

TEST(ArcLength, ArcLengthInsidePiecesOfAnEllipseMatchesTheIncompleteEllipticIntegral) {
  // x = a cos t, y = b sin t: s(t) = a (E(e) - E(pi/2 - t, e)), e^2 = 1 - b^2/a^2 (DLMF 19.2.5 with
  // u = pi/2 - v), evaluated by Boost.Math ellint_2. Parameters off any piece end test the Gauss-10
  // integral from the piece start, not only the stored table.
  const double a = 0.3, b = 0.1, e = std::sqrt(1 - b * b / (a * a));
  const ArcLength arc(single(make<EllipseCurve>(Vec3{0, 0, 0}, a, b, 0.0, 2 * M_PI)));
  const double total = arc.total_m();
  EXPECT_NEAR(total, 4 * a * boost::math::ellint_2(e), kLength * total);
  for (int i = 1; i < 400; ++i) {
    const double t = 2 * M_PI * (i + 0.37) / 401;
    const double exact = a * (boost::math::ellint_2(e) - boost::math::ellint_2(e, M_PI / 2 - t));
    EXPECT_NEAR(arc.s_at(0, t), exact, kLength * total) << "t=" << t;
  }
}

}  // namespace
}  // namespace ergpath
