#include "field.h"

#include <muParser.h>

#include <cmath>
#include <set>

#include "error.h"

namespace ergpath {

namespace {

// Standard acceleration of gravity, m/s^2: exact by definition (3rd CGPM, 1901).
constexpr double kStandardGravity = 9.80665;

const std::set<std::string>& reserved_names() {
  static const std::set<std::string> names{"x", "y", "z", "s", "tx", "ty", "tz", "g_n", "pi", "_e"};
  return names;
}

struct Variables {
  double x = 0, y = 0, z = 0, s = 0, tx = 0, ty = 0, tz = 0;
  void set(const FieldPoint& q) {
    x = q.position.x;
    y = q.position.y;
    z = q.position.z;
    s = q.s;
    tx = q.tangent.x;
    ty = q.tangent.y;
    tz = q.tangent.z;
  }
};

void bind(mu::Parser& p, Variables& v, const FieldSpec& spec) {
  p.DefineVar("x", &v.x);
  p.DefineVar("y", &v.y);
  p.DefineVar("z", &v.z);
  p.DefineVar("s", &v.s);
  p.DefineVar("tx", &v.tx);
  p.DefineVar("ty", &v.ty);
  p.DefineVar("tz", &v.tz);
  p.DefineConst("g_n", kStandardGravity);
  p.DefineConst("pi", M_PI);
  for (const auto& [name, value] : spec.constants) {
    if (reserved_names().count(name)) {
      throw Error(ErrorKind::BadConstant, "constant '" + name + "' shadows a built-in name");
    }
    if (!std::isfinite(value)) {
      throw Error(ErrorKind::BadConstant, "constant '" + name + "' is not a finite number");
    }
    try {
      p.DefineConst(name, value);
    } catch (const mu::Parser::exception_type& e) {
      throw Error(ErrorKind::BadConstant, "constant '" + name + "' has an invalid name: " + e.GetMsg());
    }
  }
}

// Parses now (muParser parses lazily) so that syntax errors surface at construction with a position.
void compile(mu::Parser& p, const std::string& what, const std::string& formula, int expected) {
  try {
    p.SetExpr(formula);
    p.Eval();
  } catch (const mu::Parser::exception_type& e) {
    std::string msg = what + ": formula error at character " + std::to_string(e.GetPos() + 1);
    if (!e.GetToken().empty()) msg += " ('" + e.GetToken() + "')";
    msg += ": " + e.GetMsg() + " in \"" + formula + "\"";
    throw Error(ErrorKind::BadFormula, msg);
  }
  if (p.GetNumResults() != expected) {
    throw Error(ErrorKind::WrongComponentCount,
                what + ": expected " + std::to_string(expected) + " comma-separated component" +
                    (expected == 1 ? "" : "s") + ", got " + std::to_string(p.GetNumResults()) + " in \"" +
                    formula + "\"");
  }
}

}  // namespace

struct FieldEvaluator::Impl {
  Variables vars;
  std::vector<mu::Parser> forces;
  std::vector<std::string> names;
  mu::Parser potential;
  bool has_potential = false;
  bool uses_s = false;
  bool uses_t = false;
};

FieldEvaluator::FieldEvaluator(const FieldSpec& spec) : impl_(std::make_unique<Impl>()) {
  if (spec.forces.empty()) throw Error(ErrorKind::BadFormula, "no force field given");
  if (!(spec.length_unit_m > 0.0) || !std::isfinite(spec.length_unit_m)) {
    throw Error(ErrorKind::BadOption, "field length unit must be a positive number of metres");
  }
  std::set<std::string> seen;
  impl_->forces.resize(spec.forces.size());  // parsers hold pointers into impl_->vars: no reallocation
  for (std::size_t i = 0; i < spec.forces.size(); ++i) {
    const NamedField& f = spec.forces[i];
    if (!seen.insert(f.name).second) {
      throw Error(ErrorKind::BadFormula, "field name '" + f.name + "' is given twice");
    }
    mu::Parser& p = impl_->forces[i];
    bind(p, impl_->vars, spec);
    compile(p, "field '" + f.name + "'", f.formula, 3);
    for (const auto& [name, ptr] : p.GetUsedVar()) {
      (void)ptr;
      if (name == "s") impl_->uses_s = true;
      if (name == "tx" || name == "ty" || name == "tz") impl_->uses_t = true;
    }
    impl_->names.push_back(f.name);
  }
  if (!spec.potential.empty()) {
    bind(impl_->potential, impl_->vars, spec);
    compile(impl_->potential, "potential", spec.potential, 1);
    for (const auto& [name, ptr] : impl_->potential.GetUsedVar()) {
      (void)ptr;
      if (name == "s" || name == "tx" || name == "ty" || name == "tz") {
        throw Error(ErrorKind::BadFormula, "potential: may depend on x, y, z only, not on '" + name + "'");
      }
    }
    impl_->has_potential = true;
  }
}

FieldEvaluator::~FieldEvaluator() = default;
FieldEvaluator::FieldEvaluator(FieldEvaluator&&) noexcept = default;
FieldEvaluator& FieldEvaluator::operator=(FieldEvaluator&&) noexcept = default;

std::size_t FieldEvaluator::count() const { return impl_->forces.size(); }
const std::string& FieldEvaluator::name(std::size_t i) const { return impl_->names.at(i); }
bool FieldEvaluator::uses_arc_length() const { return impl_->uses_s; }
bool FieldEvaluator::uses_tangent() const { return impl_->uses_t; }
bool FieldEvaluator::has_potential() const { return impl_->has_potential; }

void FieldEvaluator::eval(const FieldPoint& q, Vec3* out) {
  impl_->vars.set(q);
  for (std::size_t i = 0; i < impl_->forces.size(); ++i) {
    int n = 0;
    const double* r = impl_->forces[i].Eval(n);
    out[i] = {r[0], r[1], r[2]};
  }
}

double FieldEvaluator::potential(const Vec3& position) {
  Variables& v = impl_->vars;
  v.x = position.x;
  v.y = position.y;
  v.z = position.z;
  return impl_->potential.Eval();
}

struct ScalarFieldEvaluator::Impl {
  Variables vars;
  mu::Parser parser;
  bool uses_s = false;
};

ScalarFieldEvaluator::ScalarFieldEvaluator(const ScalarFieldSpec& spec) : impl_(std::make_unique<Impl>()) {
  if (!(spec.length_unit_m > 0.0) || !std::isfinite(spec.length_unit_m)) {
    throw Error(ErrorKind::BadOption, "field length unit must be a positive number of metres");
  }
  FieldSpec constants_only;
  constants_only.constants = spec.constants;
  bind(impl_->parser, impl_->vars, constants_only);
  compile(impl_->parser, "density", spec.formula, 1);
  for (const auto& [name, ptr] : impl_->parser.GetUsedVar()) {
    (void)ptr;
    if (name == "s") impl_->uses_s = true;
  }
}

ScalarFieldEvaluator::~ScalarFieldEvaluator() = default;
ScalarFieldEvaluator::ScalarFieldEvaluator(ScalarFieldEvaluator&&) noexcept = default;
ScalarFieldEvaluator& ScalarFieldEvaluator::operator=(ScalarFieldEvaluator&&) noexcept = default;
bool ScalarFieldEvaluator::uses_arc_length() const { return impl_->uses_s; }

double ScalarFieldEvaluator::eval(const FieldPoint& q) {
  impl_->vars.set(q);
  return impl_->parser.Eval();
}

}  // namespace ergpath
