// The error estimate must bound the true error: error_J >= |W - exact| for every kind of integrand the
// estimates were sharpened for (smooth, polynomial, oscillatory, near-singular, kinks inside a span and
// at knots), at loose and tight tolerances, with and without peak splitting.
//
// Every field is a gradient, F = grad U, so the exact work is U(end) - U(start) (gradient theorem);
// on a closed path it is zero.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <functional>
#include <limits>
#include <string>
#include <vector>

#include "plugin/core/work.h"
#include "tests/core/test_paths.h"
#include "tests/test_name.h"

namespace ergpath {
namespace {

using testing::force;
using testing::make;
using testing::single;

// U(end) - U(start) computed in double carries a few ulp of |U(start)| + |U(end)|; the comparison
// allows this much beyond the estimate.
constexpr double kExactRoundoff = 8 * std::numeric_limits<double>::epsilon();

struct Scenario {
  std::string name;
  std::function<Path()> path;
  std::string field;
  std::function<double(const Vec3&)> potential;  // U, with positions in metres
};

Vec3 start_of(const Path& p) {
  const Segment& s = p.segments.front();
  Vec3 x, v;
  s.curve->d1(s.reversed ? s.curve->last() : s.curve->first(), x, v);
  return p.length_unit_m * x;
}

Vec3 end_of(const Path& p) {
  const Segment& s = p.segments.back();
  Vec3 x, v;
  s.curve->d1(s.reversed ? s.curve->first() : s.curve->last(), x, v);
  return p.length_unit_m * x;
}

std::shared_ptr<const Curve> bezier() {
  return make<BezierCurve>(std::vector<Vec3>{{0, 0, 0}, {0.2, 0.3, 0.1}, {0.5, -0.2, 0.3}, {0.8, 0.1, 0.2}});
}

// A cubic B-spline with a triple interior knot at 0.5: a corner (C0) there, smooth elsewhere.
std::shared_ptr<const Curve> cornered_spline() {
  return make<NurbsCurve>(3, std::vector<double>{0, 0, 0, 0, 0.5, 0.5, 0.5, 1, 1, 1, 1},
                          std::vector<Vec3>{{0, 0, 0},
                                            {0.1, 0.2, 0},
                                            {0.3, 0.3, 0.1},
                                            {0.4, 0.1, 0.1},
                                            {0.6, 0.3, 0.0},
                                            {0.7, 0.5, 0.2},
                                            {0.9, 0.4, 0.3}},
                          std::vector<double>(7, 1.0));
}

std::vector<Scenario> scenarios() {
  std::vector<Scenario> s;
  s.push_back({"smooth exp-sin on a twisted cubic",
               [] { return single(make<TwistedCubicCurve>(0.7, -0.4, 1.2)); },
               "exp(x)*sin(2*y), 2*exp(x)*cos(2*y), 2*z",
               [](const Vec3& p) { return std::exp(p.x) * std::sin(2 * p.y) + p.z * p.z; }});
  s.push_back({"smooth field round a rational circle (closed: zero)",
               [] {
                 return single(make<NurbsCurve>(nurbs_circle({0.1, -0.2, 0.0}, 0.4)));
               },
               "3*cos(3*x)*cosh(y), sin(3*x)*sinh(y), 0",
               [](const Vec3& p) { return std::sin(3 * p.x) * std::cosh(p.y); }});
  s.push_back({"degree-17 polynomial integrand on a cubic", [] { return single(bezier()); },
               "3*x^2*y^2*z, 2*x^3*y*z, x^3*y^2",
               [](const Vec3& p) { return p.x * p.x * p.x * p.y * p.y * p.z; }});
  for (double k : {20.0, 80.0, 300.0}) {
    s.push_back({"oscillatory k=" + std::to_string(int(k)), [] { return single(bezier()); },
                 std::to_string(k) + "*cos(" + std::to_string(k) + "*x)*cos(y), -sin(" + std::to_string(k) +
                     "*x)*sin(y), 0",
                 [k](const Vec3& p) { return std::sin(k * p.x) * std::cos(p.y); }});
  }
  for (double gap : {1e-1, 1e-2, 1e-3, 1e-4}) {
    const std::string g = std::to_string(gap);
    auto line = [] { return single(make<LineCurve>(Vec3{-1.5, 0, 0}, Vec3{1.5, 0, 0})); };
    // Polar angle about (0.2, gap): no branch cut is crossed, the line stays below the source.
    s.push_back({"vortex at gap " + g, line,
                 "-(y-" + g + ")/((x-0.2)^2+(y-" + g + ")^2), (x-0.2)/((x-0.2)^2+(y-" + g + ")^2), 0",
                 [gap](const Vec3& p) { return std::atan2(p.y - gap, p.x - 0.2); }});
    s.push_back({"inverse square at gap " + g, line,
                 "(x-0.2)/((x-0.2)^2+(y-" + g + ")^2)^1.5, (y-" + g + ")/((x-0.2)^2+(y-" + g + ")^2)^1.5, 0",
                 [gap](const Vec3& p) { return -1.0 / std::hypot(p.x - 0.2, p.y - gap); }});
  }
  // U = (x - c)|x - c|: F = (2|x - c|, 0, 0) has a kink inside a span, away from every break.
  s.push_back({"kink inside a span of a line",
               [] {
                 return single(make<LineCurve>(Vec3{0, 0, 0}, Vec3{1, 0.5, 0.2}));
               },
               "2*abs(x-0.3137), 0, 0",
               [](const Vec3& p) { return (p.x - 0.3137) * std::abs(p.x - 0.3137); }});
  s.push_back({"kink inside a span of a cubic", [] { return single(bezier()); }, "2*abs(x-0.3137), 0, 0",
               [](const Vec3& p) { return (p.x - 0.3137) * std::abs(p.x - 0.3137); }});
  s.push_back({"corner at a knot of a cubic B-spline", [] { return single(cornered_spline()); },
               "exp(x+y)*z, exp(x+y)*z, exp(x+y)", [](const Vec3& p) { return std::exp(p.x + p.y) * p.z; }});
  return s;
}

struct Setting {
  double rel_tol;
  bool split_at_peaks;
};

class ErrorEstimateBoundsTrueError : public ::testing::TestWithParam<Setting> {};

TEST_P(ErrorEstimateBoundsTrueError, ForEveryKindOfIntegrand) {
  const Setting setting = GetParam();
  for (const Scenario& sc : scenarios()) {
    const Path path = sc.path();
    IntegrationOptions o;
    o.rel_tol = setting.rel_tol;
    o.split_at_peaks = setting.split_at_peaks;
    o.find_peaks = false;
    const WorkResult r = compute_work(path, force(sc.field), o);
    const double ua = sc.potential(start_of(path)), ub = sc.potential(end_of(path));
    const double exact = ub - ua;
    EXPECT_GE(r.error_J + kExactRoundoff * (std::abs(ua) + std::abs(ub)), std::abs(r.work_J - exact))
        << sc.name << " at rel_tol " << setting.rel_tol << ": W=" << r.work_J << " exact=" << exact
        << " evaluations=" << r.evaluations;
  }
}

INSTANTIATE_TEST_SUITE_P(Tolerances, ErrorEstimateBoundsTrueError,
                         ::testing::Values(Setting{1e-4, true}, Setting{1e-7, true}, Setting{1e-10, true},
                                           Setting{1e-12, true}, Setting{1e-7, false}, Setting{1e-10, false}),
                         [](const ::testing::TestParamInfo<Setting>& i) {
                           // "rel_tol_1e_10_peaks_split": stable across builds, usable with ctest -R.
                           char tol[16];
                           std::snprintf(tol, sizeof tol, "%.0e", i.param.rel_tol);
                           return ergpath::testing::test_name(
                               std::string("rel_tol_") + tol +
                               (i.param.split_at_peaks ? "_peaks_split" : "_no_peak_split"));
                         });

}  // namespace
}  // namespace ergpath
