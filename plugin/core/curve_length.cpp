#include "curve_length.h"

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include <algorithm>
#include <cmath>
#include <vector>

namespace ergpath {

LengthEstimate curve_length(const Curve& curve, double a, double b, double rel_tol) {
  a = std::max(a, curve.first());
  b = std::min(b, curve.last());
  LengthEstimate out;
  if (!(b > a)) return out;
  std::vector<double> knots{a};
  for (double t : curve.breaks()) {
    if (t > a && t < b) knots.push_back(t);
  }
  knots.push_back(b);
  auto speed = [&](double t) {
    Vec3 p, v;
    curve.d1(t, p, v);
    ++out.evaluations;
    return norm(v);
  };
  // Boost.Math's adaptive G7K15 (tolerance relative to each span's own length); max depth 30 halvings.
  constexpr unsigned kMaxDepth = 30;
  for (std::size_t i = 0; i + 1 < knots.size(); ++i) {
    double err = 0.0;
    const double len = boost::math::quadrature::gauss_kronrod<double, 15>::integrate(
        speed, knots[i], knots[i + 1], kMaxDepth, rel_tol, &err);
    out.length += len;
    out.error += err;
  }
  return out;
}

}  // namespace ergpath
