// Engine benchmark: integrand evaluations and time, ours against peers measured in the same run.
//
// Peers: Boost.Math gauss_kronrod<double, 15>::integrate (adaptive, recursive bisection) on the same
// integrand (same muParser field, same curve, split at the same breaks), and a polyline of N chords with
// forces at chord midpoints. "Equal achieved accuracy": Boost is run at requested tolerances 1e-2 ... 1e-15
// and the loosest one whose true error is within 1e-10 of the scale (integral of |integrand|) is counted;
// ours runs at its default 1e-10. The polyline doubles N until its error is within 1e-6 of the scale.
// Exact values are closed forms (named per case). Lengths against OCCT's GCPnts_AbscissaPoint belong to
// the adapter benchmarks (the engine never sees OCCT).
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <boost/math/special_functions/ellint_2.hpp>

#include <chrono>
#include <cmath>
#include <cstdio>
#include <functional>
#include <memory>
#include <string>
#include <vector>

#include "plugin/core/analytic_curves.h"
#include "plugin/core/field.h"
#include "plugin/core/work.h"

using namespace ergpath;

namespace {

struct Case {
  std::string name;
  Path path;
  FieldSpec field;
  bool length_only = false;  // integrate |r'| (the perimeter) instead of F . dr
  double exact = 0.0;
};

Path one(std::shared_ptr<const Curve> c, double unit) {
  Path p;
  p.length_unit_m = unit;
  p.segments.push_back({std::move(c), false, 1, ""});
  return p;
}

FieldSpec spec(const std::string& f, std::vector<std::pair<std::string, double>> c = {}) {
  FieldSpec s;
  s.forces.push_back({"f", f});
  s.constants = std::move(c);
  return s;
}

// The integrand per unit t of one curve, through the same FieldEvaluator the engine uses.
struct Integrand {
  const Case& c;
  FieldEvaluator field;
  std::vector<Vec3> out;
  long count = 0;
  explicit Integrand(const Case& k) : c(k), field(k.field), out(field.count()) {}
  double operator()(double t) {
    ++count;
    const Curve& curve = *c.path.segments[0].curve;
    Vec3 p, v;
    curve.d1(t, p, v);
    const double u = c.path.length_unit_m;
    if (c.length_only) return norm(v) * u;
    FieldPoint q;
    q.position = (u / c.field.length_unit_m) * p;
    const double sp = norm(v);
    q.tangent = sp > 0 ? (1.0 / sp) * v : Vec3{};
    field.eval(q, out.data());
    Vec3 f;
    for (const Vec3& x : out) f += x;
    return dot(f, u * v);
  }
};

std::vector<double> knots(const Curve& c) {
  std::vector<double> k{c.first()};
  for (double b : c.breaks()) k.push_back(b);
  k.push_back(c.last());
  return k;
}

double boost_run(Integrand& f, double tol, double* abs_integral) {
  using GK = boost::math::quadrature::gauss_kronrod<double, 15>;
  const std::vector<double> k = knots(*f.c.path.segments[0].curve);
  double sum = 0.0, l1 = 0.0;
  for (std::size_t i = 0; i + 1 < k.size(); ++i) {
    double err = 0.0, l1i = 0.0;
    sum += GK::integrate(std::ref(f), k[i], k[i + 1], 30, tol, &err, &l1i);
    l1 += l1i;
  }
  if (abs_integral) *abs_integral = l1;
  return sum;
}

double polyline(Integrand& f, long n) {
  const Curve& c = *f.c.path.segments[0].curve;
  const double u = f.c.path.length_unit_m;
  double sum = 0.0;
  Vec3 prev, v;
  c.d1(c.first(), prev, v);
  for (long i = 1; i <= n; ++i) {
    Vec3 p;
    c.d1(c.first() + (c.last() - c.first()) * i / n, p, v);
    const Vec3 chord = p - prev;
    if (f.c.length_only) {
      sum += norm(chord) * u;
    } else {
      FieldPoint q;
      q.position = (0.5 * u / f.c.field.length_unit_m) * (p + prev);
      q.tangent = (1.0 / norm(chord)) * chord;
      f.field.eval(q, f.out.data());
      ++f.count;
      Vec3 force;
      for (const Vec3& x : f.out) force += x;
      sum += dot(force, u * chord);
    }
    prev = p;
  }
  return sum;
}

template <class F>
double seconds_per_call(F&& fn) {
  using clock = std::chrono::steady_clock;
  int reps = 1;
  for (;;) {
    const auto t0 = clock::now();
    for (int i = 0; i < reps; ++i) fn();
    const double dt = std::chrono::duration<double>(clock::now() - t0).count();
    if (dt > 0.05) return dt / reps;
    reps *= 4;
  }
}

}  // namespace

int main() {
  // Closed forms: DLMF 19.9.9 (perimeter 4 a E(e)); polar-angle gradient (vortex: swept angle);
  // -grad(1/rho) (inverse square: potential difference); Green's theorem for the circle (2 pi R^2).
  constexpr double gap = 1e-3, x0 = 0.2;
  std::vector<Case> cases;
  cases.push_back({"ellipse 3:1 perimeter", one(std::make_shared<EllipseCurve>(Vec3{}, 3.0, 1.0, 0.0, 2 * M_PI), 1.0),
                   spec("0,0,0"), true, 4 * 3.0 * boost::math::ellint_2(std::sqrt(1 - 1.0 / 9))});
  const auto edge = std::make_shared<LineCurve>(Vec3{-1.5, 0, 0}, Vec3{1.5, 0, 0});
  cases.push_back({"vortex 1 mm from 3 m edge", one(edge, 1.0),
                   spec("-(y-y0)/((x-x0)^2+(y-y0)^2), (x-x0)/((x-x0)^2+(y-y0)^2), 0", {{"x0", x0}, {"y0", gap}}),
                   false, std::atan2(-gap, 1.5 - x0) - std::atan2(-gap, -1.5 - x0)});
  cases.push_back({"inverse square 1 mm from 3 m edge", one(edge, 1.0),
                   spec("(x-x0)/((x-x0)^2+(y-y0)^2)^1.5, (y-y0)/((x-x0)^2+(y-y0)^2)^1.5, 0", {{"x0", x0}, {"y0", gap}}),
                   false, 1.0 / std::hypot(1.5 + x0, gap) - 1.0 / std::hypot(1.5 - x0, gap)});
  const auto bez = std::make_shared<BezierCurve>(std::vector<Vec3>{{0, 0, 0}, {0.2, 0.3, 0.1}, {0.5, -0.2, 0.3}, {0.8, 0.1, 0.2}});
  // Bezier: F = grad(sin(2x + y) z) so W = U(end) - U(start) (gradient theorem), U = sin(2x + y) z.
  cases.push_back({"cubic Bezier, gradient field", one(bez, 1.0),
                   spec("2*cos(2*x+y)*z, cos(2*x+y)*z, sin(2*x+y)"), false, std::sin(1.7) * 0.2});
  cases.push_back({"rational NURBS circle, (-y, x-0.1, 0)", one(std::make_shared<NurbsCurve>(nurbs_circle({0.1, 0, 0}, 0.5)), 1.0),
                   spec("-y, x-0.1, 0"), false, 2 * M_PI * 0.25});

  std::printf("%-38s %8s %8s %8s %7s %8s %7s %10s %9s %9s %9s\n", "case", "ours", "boost", "ratio", "boost@",
              "ours*", "ours@", "polyline", "our err", "t ours", "t ratio");
  for (const Case& c : cases) {
    IntegrationOptions o;
    o.find_peaks = false;
    const WorkResult r = compute_work(c.path, c.field, o);
    const double ours = c.length_only ? r.length_m : r.work_J;
    const double scale = c.length_only ? r.length_m : r.abs_work_J;
    const double our_err = std::abs(ours - c.exact) / scale;

    long boost_evals = -1;
    double boost_tol = 0.0, boost_value = 0.0;
    for (double tol = 1e-2; tol >= 1e-15; tol /= 10) {
      Integrand f(c);
      const double v = boost_run(f, tol, nullptr);
      if (std::abs(v - c.exact) <= 1e-10 * scale) {
        boost_evals = f.count;
        boost_tol = tol;
        boost_value = v;
        break;
      }
    }
    long chords = -1;
    for (long n = 4; n <= (1L << 22); n *= 2) {
      Integrand f(c);
      if (std::abs(polyline(f, n) - c.exact) <= 1e-6 * scale) {
        chords = n;
        break;
      }
    }
    // The same tolerance scan for ours, so that neither side profits from a pessimistic estimate.
    long scanned = -1;
    double scanned_tol = 0.0;
    for (double tol = 1e-2; tol >= 1e-15; tol /= 10) {
      IntegrationOptions so = o;
      so.rel_tol = tol;
      const WorkResult sr = compute_work(c.path, c.field, so);
      if (std::abs((c.length_only ? sr.length_m : sr.work_J) - c.exact) <= 1e-10 * scale) {
        scanned = sr.evaluations;
        scanned_tol = tol;
        break;
      }
    }
    const double t_ours = seconds_per_call([&] { compute_work(c.path, c.field, o); });
    const double t_boost = boost_evals > 0 ? seconds_per_call([&] {
      Integrand f(c);
      boost_run(f, boost_tol, nullptr);
    }) : 0.0;
    (void)boost_value;
    std::printf("%-38s %8ld %8ld %8.3f %7.0e %8ld %7.0e %10ld %9.1e %8.1fus %9.3f\n", c.name.c_str(), r.evaluations,
                boost_evals, boost_evals > 0 ? double(r.evaluations) / boost_evals : 0.0, boost_tol, scanned,
                scanned_tol, chords, our_err, t_ours * 1e6,
                t_boost > 0 ? t_ours / t_boost : 0.0);
  }
  std::printf("ratio = our evaluations / Boost evaluations at equal achieved accuracy 1e-10 (lower is better);\n"
              "boost@ = loosest Boost tolerance reaching it; ours*/ours@ = the same scan for ours; polyline = chords for 1e-6; t ratio = time ours / Boost.\n");
  return 0;
}
