// Force fields given as formulas (muParser), compiled once per thread.
//
// A force field is three comma-separated expressions "FX, FY, FZ" in newtons. Formulas see:
//   x, y, z     position, in the field length unit (FieldSpec::length_unit_m)
//   s           arc length travelled from the path start, in the field length unit
//   tx, ty, tz  unit tangent in the direction of travel (dimensionless)
//   g_n         9.80665, standard acceleration of gravity in m/s^2 (exact by definition, 3rd CGPM 1901)
//   pi          3.14159...
// plus user constants. See docs/formulas.md for operators and functions.
#pragma once

#include <memory>
#include <string>
#include <utility>
#include <vector>

#include "vec3.h"

namespace ergpath {

struct NamedField {
  std::string name;     // e.g. "gravity"; unique within a FieldSpec
  std::string formula;  // "FX, FY, FZ"
};

struct FieldSpec {
  std::vector<NamedField> forces;                         // at least one
  std::vector<std::pair<std::string, double>> constants;  // user constants, in the units the formulas expect
  double length_unit_m = 1.0;                             // metres per length unit seen by the formulas
  /// Optional scalar potential U(x, y, z) in joules for a conservative total force (F = -grad U);
  /// empty when none is given.
  std::string potential;
};

/// Where a field is evaluated. All lengths in the field length unit.
struct FieldPoint {
  Vec3 position;
  double s = 0.0;
  Vec3 tangent;  // unit tangent in the direction of travel
};

/// Compiled formulas of one FieldSpec. Not thread-safe: make one per thread (construction is cheap).
class FieldEvaluator {
 public:
  /// Throws Error: BadFormula (message carries the field name and the 1-based character position),
  /// WrongComponentCount, BadConstant (bad name, non-finite value, or a name that shadows a variable).
  explicit FieldEvaluator(const FieldSpec& spec);
  ~FieldEvaluator();
  FieldEvaluator(FieldEvaluator&&) noexcept;
  FieldEvaluator& operator=(FieldEvaluator&&) noexcept;

  std::size_t count() const;  // number of named force fields
  const std::string& name(std::size_t i) const;
  /// Force of every named field at q, newtons; `out` has count() entries. Values may be non-finite:
  /// the caller decides what that means.
  void eval(const FieldPoint& q, Vec3* out);
  bool uses_arc_length() const;  // some formula reads s
  bool uses_tangent() const;     // some formula reads tx, ty or tz
  bool has_potential() const;
  /// U at a position (field length unit), joules. Precondition: has_potential().
  double potential(const Vec3& position);

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

/// A scalar density f for integrals of f ds: one expression, same variables and constants as a force field.
struct ScalarFieldSpec {
  std::string formula;
  std::vector<std::pair<std::string, double>> constants;
  double length_unit_m = 1.0;  // metres per length unit seen by the formula
};

/// Compiled scalar formula. Not thread-safe: one per thread.
class ScalarFieldEvaluator {
 public:
  /// Throws Error: BadFormula (with the 1-based position), WrongComponentCount (not exactly one),
  /// BadConstant.
  explicit ScalarFieldEvaluator(const ScalarFieldSpec& spec);
  ~ScalarFieldEvaluator();
  ScalarFieldEvaluator(ScalarFieldEvaluator&&) noexcept;
  ScalarFieldEvaluator& operator=(ScalarFieldEvaluator&&) noexcept;
  double eval(const FieldPoint& q);  // may be non-finite: the caller decides
  bool uses_arc_length() const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace ergpath
