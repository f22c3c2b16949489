// Small builders shared by the engine tests: paths of analytic curves and force-field specs.
#pragma once

#include <memory>
#include <string>
#include <utility>
#include <vector>

#include "plugin/core/analytic_curves.h"
#include "plugin/core/field.h"
#include "plugin/core/path.h"

namespace ergpath::testing {

/// One-segment path; `unit_m` metres per model length unit.
inline Path single(std::shared_ptr<const Curve> c, double unit_m = 1.0, bool reversed = false, int edge = 1) {
  Path p;
  p.length_unit_m = unit_m;
  p.segments.push_back({std::move(c), reversed, edge, ""});
  return p;
}

inline Path chain(std::vector<std::pair<std::shared_ptr<const Curve>, bool>> parts, double unit_m = 1.0,
                  bool closed = false) {
  Path p;
  p.length_unit_m = unit_m;
  p.closed = closed;
  int edge = 1;
  for (auto& [c, rev] : parts) p.segments.push_back({c, rev, edge++, ""});
  return p;
}

inline FieldSpec force(const std::string& formula, std::vector<std::pair<std::string, double>> constants = {},
                       double unit_m = 1.0) {
  FieldSpec f;
  f.forces.push_back({"force", formula});
  f.constants = std::move(constants);
  f.length_unit_m = unit_m;
  return f;
}

template <class C, class... A>
std::shared_ptr<const Curve> make(A&&... a) {
  return std::make_shared<C>(std::forward<A>(a)...);
}

}  // namespace ergpath::testing
