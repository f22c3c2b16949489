// Arc-length and tangent variables, potentials, windows, peaks and near-singular fields.
#include <gtest/gtest.h>

#include <cmath>

#include "plugin/core/error.h"
#include "plugin/core/work.h"
#include "tests/core/test_paths.h"

namespace ergpath {
namespace {

using testing::chain;
using testing::force;
using testing::make;
using testing::single;

// Engine default target, relative to the integral of |F . dr| (see work.h).
constexpr double kTarget = 1e-10;

std::shared_ptr<const Curve> wavy_bezier_mm() {
  return make<BezierCurve>(
      std::vector<Vec3>{{0, 0, 0}, {150, 220, 40}, {420, -180, 90}, {600, 60, 0}, {700, 0, 30}});
}

TEST(WorkWithTangentVariables, CoulombFrictionDoesMinusMuNTimesLength) {
  // Sliding friction opposes travel: F = -mu N T, so W = -mu N L whatever the direction
  // (Coulomb friction; common practice, no source needed beyond the definition).
  const double mu = 0.3, n = 250.0;
  const Path path = single(wavy_bezier_mm(), 1e-3);
  const FieldSpec f = force("-mu*N*tx, -mu*N*ty, -mu*N*tz", {{"mu", mu}, {"N", n}});
  const WorkResult fwd = compute_work(path, f);
  const WorkResult back = compute_work(reversed(path), f);
  EXPECT_NEAR(fwd.work_J, -mu * n * fwd.length_m, kTarget * fwd.abs_work_J);
  EXPECT_NEAR(back.work_J, fwd.work_J, 2 * kTarget * fwd.abs_work_J);  // no sign change under reversal
  EXPECT_LT(fwd.work_J, 0.0);
}

TEST(WorkWithArcLengthVariable, ForceFallingLinearlyWithDistanceIntegratesExactly) {
  // F = -(F0 - c s) T: W = -(F0 L - c L^2 / 2), elementary integral of a linear function of s.
  const double f0 = 80.0, c = 30.0;
  const Path path = single(wavy_bezier_mm(), 1e-3);
  const WorkResult r =
      compute_work(path, force("-(F0-c*s)*tx, -(F0-c*s)*ty, -(F0-c*s)*tz", {{"F0", f0}, {"c", c}}));
  const double len = r.length_m;
  const double exact = -(f0 * len - 0.5 * c * len * len);
  EXPECT_NEAR(r.work_J, exact, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - exact));
}

TEST(WorkWithArcLengthVariable, ArcLengthSeenByFormulasCountsFromThePathStartInTravelDirection) {
  // Two segments, the second reversed; F = s T gives W = L^2 / 2 only if s runs on across the join.
  const auto a = make<LineCurve>(Vec3{0, 0, 0}, Vec3{300, 0, 0});
  const auto b = make<EllipseCurve>(Vec3{300, 100, 0}, 100, 100, -M_PI / 2, M_PI / 2);
  const Path path = chain({{a, false}, {b, false}}, 1e-3);
  const WorkResult r = compute_work(path, force("s*tx, s*ty, s*tz"));
  const double len = 0.3 + M_PI * 0.1;  // chord plus half circle of radius 0.1 m
  EXPECT_NEAR(r.length_m, len, kTarget * len);
  EXPECT_NEAR(r.work_J, 0.5 * len * len, kTarget * r.abs_work_J);
  // Field length unit in millimetres: s is then in millimetres too; W is unchanged.
  const WorkResult mm = compute_work(path, force("s/1000*tx, s/1000*ty, s/1000*tz", {}, 1e-3));
  EXPECT_NEAR(mm.work_J, r.work_J, 2 * kTarget * r.abs_work_J);
}

TEST(WorkWithPotential, CorrectPotentialMatchesAndAWrongOneIsFlagged) {
  // Gravity plus spring: U = m g_n z + k/2 |r|^2 (F = -grad U).
  FieldSpec f;
  f.forces = {{"gravity", "0, 0, -m*g_n"}, {"spring", "-k*x, -k*y, -k*z"}};
  f.constants = {{"m", 4.0}, {"k", 900.0}};
  f.potential = "m*g_n*z + k/2*(x^2+y^2+z^2)";
  const Path path = single(wavy_bezier_mm(), 1e-3);
  const WorkResult good = compute_work(path, f);
  ASSERT_TRUE(good.potential_drop_J.has_value());
  EXPECT_NEAR(*good.potential_drop_J, good.work_J, kTarget * good.abs_work_J);
  EXPECT_FALSE(good.potential_mismatch);
  f.potential = "m*g_n*z + k/2*(x^2+y^2)";  // forgets the z term of the spring
  const WorkResult bad = compute_work(path, f);
  EXPECT_TRUE(bad.potential_mismatch);
}

TEST(WorkOnClosedPath, NonConservativeFieldAssumedConservativeIsFlagged) {
  // F = (-y, x, 0) circulates 2 pi r^2 round a circle (Green's theorem): not zero, so flagged.
  Path loop = single(std::make_shared<NurbsCurve>(nurbs_circle({0, 0, 0}, 0.2)));
  loop.closed = true;
  IntegrationOptions o;
  o.assume_conservative = true;
  const WorkResult r = compute_work(loop, force("-y, x, 0"), o);
  EXPECT_NEAR(r.work_J, 2 * M_PI * 0.04, kTarget * r.abs_work_J);
  EXPECT_TRUE(r.loop_mismatch);
}

TEST(WorkInWindow, WorkBetweenTwoDistancesOnALine) {
  // Along x from 0 to 2 m, F = (x, 0, 0): W(a, b) = (b^2 - a^2) / 2.
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{2000, 0, 0}), 1e-3);
  IntegrationOptions o;
  o.window_from_m = 0.5;
  o.window_to_m = 1.25;
  const WorkResult r = compute_work(path, force("x, 0, 0"), o);
  EXPECT_NEAR(r.work_J, 0.5 * (1.25 * 1.25 - 0.25), kTarget * r.abs_work_J);
  EXPECT_NEAR(r.length_m, 0.75, kTarget);
}

TEST(WorkInWindow, WindowOutsideThePathIsABadOption) {
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{2000, 0, 0}), 1e-3);
  IntegrationOptions o;
  o.window_to_m = 2.5;
  try {
    compute_work(path, force("x, 0, 0"), o);
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
}

TEST(PeakTangentialForce, IsLocatedBetweenQuadratureNodes) {
  // A Gaussian bump of 42 N centred at x = 0.3711 m on a 1 m line: the peak is there, whatever the nodes.
  const Path path = single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 0, 0}), 1.0, false, 3);
  const WorkResult r = compute_work(path, force("42*exp(-((x-0.3711)/0.05)^2), 0, 0"));
  // Brent's minimizer stops at ~2^-23 relative in t; the peak value is then exact to ~1e-12 relative.
  constexpr double kPlace = 1e-6, kValue = 1e-10;
  EXPECT_NEAR(r.peak.s_m, 0.3711, kPlace);
  EXPECT_NEAR(r.peak.force_N, 42.0, 42.0 * kValue);
  EXPECT_EQ(r.peak.edge, 3);
  EXPECT_NEAR(r.peak.position.x, 0.3711, kPlace);
}

TEST(PeakTangentialForce, KeepsItsSignAndReportsPerSegment) {
  // A reversed line: travel along -x, so F = (5, 0, 0) is a tangential force of -5 N.
  const auto a = make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 0, 0});
  const auto b = make<LineCurve>(Vec3{0, 0, 0}, Vec3{0, 1, 0});
  const Path path = chain({{b, true}, {a, false}});
  const WorkResult r = compute_work(path, force("5 - 9*x, 2, 0"));
  ASSERT_EQ(r.segments.size(), 2u);
  // Segment 1 runs along -y: F . T = -2. Segment 2 runs along +x: F . T = 5 - 9x, largest |.| 5 at x = 0
  // (s = 1 m), where it beats the -4 N at x = 1.
  EXPECT_NEAR(r.segments[0].peak.force_N, -2.0, 1e-12);
  EXPECT_NEAR(r.segments[1].peak.force_N, 5.0, 1e-12);
  EXPECT_NEAR(r.peak.force_N, 5.0, 1e-12);
  EXPECT_NEAR(r.peak.s_m, 1.0, 1e-9);
  EXPECT_EQ(r.peak.segment, 1u);
}

// Near-singular fields: a source 1 mm from a 3 m straight edge.
constexpr double kGap = 1e-3, kSourceX = 0.2;

TEST(NearSingularField, VortexOneMillimetreFromTheEdgeGivesTheSweptAngle) {
  // F = (-(y - y0), x - x0, 0) / rho^2 is grad(theta) of the polar angle about (x0, y0), so W is the
  // angle swept seen from the source (vector calculus, standard).
  const Path path = single(make<LineCurve>(Vec3{-1.5, 0, 0}, Vec3{1.5, 0, 0}));
  const FieldSpec f =
      force("-(y-y0)/((x-x0)^2+(y-y0)^2), (x-x0)/((x-x0)^2+(y-y0)^2), 0", {{"x0", kSourceX}, {"y0", kGap}});
  const WorkResult r = compute_work(path, f);
  const double exact = std::atan2(-kGap, 1.5 - kSourceX) - std::atan2(-kGap, -1.5 - kSourceX);
  EXPECT_EQ(r.status, Status::Converged);
  EXPECT_NEAR(r.work_J, exact, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - exact));
  // Regression guard: 290 evaluations with the QUADPACK-scaled and two-level estimates (337 with
  // |K15 - G7| alone, 807 with plain bisection).
  EXPECT_LE(r.evaluations, 300);
}

TEST(NearSingularField, InverseSquareOneMillimetreFromTheEdgeGivesThePotentialDifference) {
  // F = k (r - r0) / |r - r0|^3 = -grad(k / |r - r0|): W = k (1/|a - r0| - 1/|b - r0|) (Coulomb/Newton form).
  const Path path = single(make<LineCurve>(Vec3{-1.5, 0, 0}, Vec3{1.5, 0, 0}));
  const FieldSpec f = force("k*(x-x0)/((x-x0)^2+(y-y0)^2)^1.5, k*(y-y0)/((x-x0)^2+(y-y0)^2)^1.5, 0",
                            {{"k", 2.0}, {"x0", kSourceX}, {"y0", kGap}});
  const WorkResult r = compute_work(path, f);
  auto inv = [](double dx) { return 1.0 / std::hypot(dx, kGap); };
  const double exact = 2.0 * (inv(-1.5 - kSourceX) - inv(1.5 - kSourceX));
  EXPECT_EQ(r.status, Status::Converged);
  EXPECT_NEAR(r.work_J, exact, kTarget * r.abs_work_J);
  EXPECT_GE(r.error_J, std::abs(r.work_J - exact));
  // Regression guard: 294 evaluations with the QUADPACK-scaled and two-level estimates (373 with
  // |K15 - G7| alone, 867 with plain bisection).
  EXPECT_LE(r.evaluations, 305);
}

}  // namespace
}  // namespace ergpath
