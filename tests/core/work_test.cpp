// Work along a path: classical closed forms and the invariants every line integral must keep.
#include "plugin/core/work.h"

#include <gtest/gtest.h>

#include <cmath>

#include "plugin/core/error.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::chain;
using testing::force;
using testing::make;
using testing::single;

// The engine's default target is 1e-10 relative to the integral of |F . dr|; a closed form evaluated in
// double precision is good to ~1e-15, so agreement within the target is the real test.
constexpr double kTarget = 1e-10;
// Two computations of the same physical quantity through different but equivalent inputs (units,
// parametrization) each meet the target; they agree within twice it.
constexpr double kSameQuantity = 2 * kTarget;

std::shared_ptr<const Curve> lifting_bezier_mm() {
  return make<BezierCurve>(std::vector<Vec3>{{0, 0, 0}, {200, 50, 300}, {400, -100, 100}, {600, 0, 450}});
}

TEST(WorkAlongPath, UniformGravityOnACurvedPathIsMinusWeightTimesRise) {
  // W = -m g_n dz for F = (0, 0, -m g_n): gravity is minus the gradient of m g_n z (elementary mechanics).
  const Path path = single(lifting_bezier_mm(), 1e-3);
  const double m = 12.5;
  const WorkResult r = compute_work(path, force("0, 0, -m*g_n", {{"m", m}}));
  const double exact = -m * 9.80665 * 0.450;
  EXPECT_EQ(r.status, Status::Converged);
  EXPECT_NEAR(r.work_J, exact, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - exact));
}

TEST(WorkAlongPath, UniformGravityAroundAClosedPathIsZero) {
  // Out along a Bezier curve, back along the chord: a gradient field does no work round a loop.
  const auto chord = make<LineCurve>(Vec3{0, 0, 0}, Vec3{600, 0, 450});
  const Path loop = chain({{lifting_bezier_mm(), false}, {chord, true}}, 1e-3, true);
  IntegrationOptions o;
  o.assume_conservative = true;
  const WorkResult r = compute_work(loop, force("0, 0, -m*g_n", {{"m", 3.0}}), o);
  EXPECT_TRUE(r.closed);
  EXPECT_NEAR(r.work_J, 0.0, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J));
  EXPECT_FALSE(r.loop_mismatch);
}

TEST(WorkAlongPath, LinearSpringAboutAPointGivesHalfKTimesChangeOfSquaredDistance) {
  // Hooke: F = -k (r - c) = -grad(k/2 |r - c|^2), so W = -k/2 (|r2 - c|^2 - |r1 - c|^2).
  const double k = 1500.0, scale = 0.5, t0 = 0.2, t1 = 1.3;
  const Path path = single(make<TwistedCubicCurve>(scale, t0, t1));
  const WorkResult r = compute_work(path, force("-k*(x-0.1), -k*(y-0.2), -k*z", {{"k", k}}));
  auto r2 = [&](double t) {
    const Vec3 p{scale * t - 0.1, scale * t * t - 0.2, scale * t * t * t};
    return dot(p, p);
  };
  const double exact = -0.5 * k * (r2(t1) - r2(t0));
  EXPECT_NEAR(r.work_J, exact, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - exact));
}

TEST(WorkAlongPath, RotationalFieldRoundAnEllipseIsTwiceTheEnclosedArea) {
  // Green's theorem: the circulation of F = (-y, x, 0) round a closed curve is 2 x enclosed area = 2 pi a b.
  const double a = 0.3, b = 0.1;
  Path loop = single(make<EllipseCurve>(Vec3{0.5, -0.2, 0.0}, a, b, 0.0, 2 * M_PI));
  loop.closed = true;
  const WorkResult r = compute_work(loop, force("-y, x, 0"));
  const double exact = 2 * M_PI * a * b;
  EXPECT_TRUE(r.closed);
  EXPECT_NEAR(r.work_J, exact, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - exact));
}

TEST(WorkAlongPath, ReversingThePathNegatesWorkButNotLength) {
  const Path path = single(lifting_bezier_mm(), 1e-3);
  const FieldSpec f = force("y^2 + 3, x*z - 2, sin(5*x)");
  const WorkResult fwd = compute_work(path, f);
  const WorkResult back = compute_work(reversed(path), f);
  EXPECT_NEAR(back.work_J, -fwd.work_J, kSameQuantity * fwd.abs_work_J);
  EXPECT_NEAR(back.length_m, fwd.length_m, kSameQuantity * fwd.length_m);
  EXPECT_NEAR(back.abs_work_J, fwd.abs_work_J, kSameQuantity * fwd.abs_work_J);
}

TEST(WorkAlongPath, ChangingTheFieldLengthUnitChangesNothingPhysical) {
  // The same spring seen with positions in metres and in millimetres, on a path modelled in millimetres
  // and in metres: work is a physical quantity and must not move.
  const auto mm_curve = lifting_bezier_mm();
  const auto m_curve =
      make<BezierCurve>(std::vector<Vec3>{{0, 0, 0}, {0.2, 0.05, 0.3}, {0.4, -0.1, 0.1}, {0.6, 0, 0.45}});
  const WorkResult in_m = compute_work(single(mm_curve, 1e-3), force("-k*x, -k*y^2, 7", {{"k", 40.0}}, 1.0));
  const WorkResult in_mm =
      compute_work(single(m_curve, 1.0), force("-k*x/1000, -k*(y/1000)^2, 7", {{"k", 40.0}}, 1e-3));
  EXPECT_NEAR(in_mm.work_J, in_m.work_J, kSameQuantity * in_m.abs_work_J);
  EXPECT_NEAR(in_mm.length_m, in_m.length_m, kSameQuantity * in_m.length_m);
}

TEST(WorkAlongPath, PolynomialIntegrandOnOneSpanIsExactWithOneRulePair) {
  // r = (t, 2t, 3t), F = (x^3, y^2, x y z): F . r' = 19 t^3 + 8 t^2, integral 19/4 + 8/3 = 89/12 (by hand).
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 2, 3}));
  const WorkResult r = compute_work(path, force("x^3, y^2, x*y*z"));
  EXPECT_NEAR(r.work_J, 89.0 / 12.0, 1e-14 * 89.0 / 12.0);  // round-off only: both rules are exact
  EXPECT_GE(r.error_J, std::abs(r.work_J - 89.0 / 12.0));
  // Degree 3 <= 13: Gauss-7 is exact too, |K15 - G7| is round-off and one Kronrod-15 application is
  // enough (31 evaluations recorded, with the peak search); no Gauss-12 test, no bisection.
  EXPECT_LE(r.evaluations, 15 + 20);
}

TEST(WorkAlongPath, AffineReparametrizationLeavesWorkUnchanged) {
  const auto inner = make<TwistedCubicCurve>(0.8, -0.5, 1.1);
  const auto outer = make<AffineReparametrizedCurve>(inner, 2.0, 1.0);  // t = 2u + 1
  const FieldSpec f = force("cos(3*y), x*z, exp(-x^2)");
  const WorkResult a = compute_work(single(inner), f);
  const WorkResult b = compute_work(single(outer), f);
  EXPECT_NEAR(b.work_J, a.work_J, kSameQuantity * a.abs_work_J);
  EXPECT_NEAR(b.length_m, a.length_m, kSameQuantity * a.length_m);
}

TEST(WorkAlongPath, SeveralNamedFieldsReportTheirOwnWorkAndTheTotal) {
  FieldSpec f;
  f.forces = {{"gravity", "0, 0, -2*g_n"}, {"spring", "-50*x, -50*y, -50*z"}};
  const Path path = single(lifting_bezier_mm(), 1e-3);
  const WorkResult r = compute_work(path, f);
  ASSERT_EQ(r.fields.size(), 2u);
  EXPECT_EQ(r.fields[0].name, "gravity");
  // Gravity -m g_n dz; spring -k/2 (|r2|^2 - |r1|^2) (Hooke), r1 = 0, r2 = (0.6, 0, 0.45) m.
  const double gravity = -2 * 9.80665 * 0.45, spring = -25.0 * (0.36 + 0.2025);
  EXPECT_NEAR(r.fields[0].work_J, gravity, kTarget * r.abs_work_J);
  EXPECT_NEAR(r.fields[1].work_J, spring, kTarget * r.abs_work_J);
  EXPECT_NEAR(r.work_J, r.fields[0].work_J + r.fields[1].work_J, 1e-14 * r.abs_work_J);
  ASSERT_EQ(r.segments.size(), 1u);
  EXPECT_EQ(r.segments[0].fields.size(), 2u);
}

TEST(WorkAlongPath, PerSegmentResultsAddUpToTheTotal) {
  const auto chord = make<LineCurve>(Vec3{0, 0, 0}, Vec3{600, 0, 450});
  const Path loop = chain({{lifting_bezier_mm(), false}, {chord, true}}, 1e-3, true);
  const WorkResult r = compute_work(loop, force("-y, x, z"));
  ASSERT_EQ(r.segments.size(), 2u);
  EXPECT_EQ(r.segments[1].edge, 2);
  EXPECT_TRUE(r.segments[1].reversed);
  EXPECT_DOUBLE_EQ(r.work_J, r.segments[0].work_J + r.segments[1].work_J);
  EXPECT_EQ(r.evaluations, r.segments[0].evaluations + r.segments[1].evaluations);
  EXPECT_NEAR(r.segments[1].length_m, 0.75, kTarget);  // chord length sqrt(0.6^2 + 0.45^2) = 0.75 m
}

TEST(WorkAlongPath, NonFiniteFieldIsReportedWithEdgeParameterAndPosition) {
  // 1/x blows up at x = 0, the midpoint t = 0.5, which is the centre node of the first rule.
  const Path path = single(make<LineCurve>(Vec3{-1, 0.5, 0}, Vec3{1, 0.5, 0}), 1.0, false, 7);
  try {
    compute_work(path, force("1/x, 0, 0"));
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::NonFiniteField);
    const std::string msg = e.what();
    EXPECT_NE(msg.find("edge 7"), std::string::npos) << msg;
    EXPECT_NE(msg.find("t=0.5"), std::string::npos) << msg;
    EXPECT_NE(msg.find("position (0, 0.5, 0)"), std::string::npos) << msg;
  }
}

TEST(WorkAlongPath, ExhaustedBudgetReturnsBestValueWithToleranceNotMet) {
  IntegrationOptions o;
  o.max_evaluations = 40;
  o.split_at_peaks = false;
  const Path path = single(make<LineCurve>(Vec3{-1.5, 0, 0}, Vec3{1.5, 0, 0}));
  const WorkResult r =
      compute_work(path, force("-(y-1e-3)/((x-0.2)^2+(y-1e-3)^2), (x-0.2)/((x-0.2)^2+(y-1e-3)^2), 0"), o);
  EXPECT_EQ(r.status, Status::ToleranceNotMet);
  EXPECT_TRUE(std::isfinite(r.work_J));
  EXPECT_GT(r.error_J, 0.0);
}

TEST(WorkAlongPath, NonPositiveToleranceIsABadOption) {
  IntegrationOptions o;
  o.rel_tol = 0.0;
  try {
    compute_work(single(lifting_bezier_mm(), 1e-3), force("0,0,1"), o);
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
}

TEST(WorkAlongPath, FormulaErrorsSurfaceAsBadFormula) {
  try {
    compute_work(single(lifting_bezier_mm(), 1e-3), force("0, 0, 1 +* 2"));
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadFormula);
  }
}

}  // namespace
}  // namespace ergpath
