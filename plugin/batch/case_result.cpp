#include "plugin/batch/case_result.h"

#include <cmath>

#include "plugin/core/error.h"

namespace ergpath::batch {

const char* to_string(Verdict v) {
  switch (v) {
    case Verdict::Pass:
      return "PASS";
    case Verdict::Fail:
      return "FAIL";
    case Verdict::Error:
      return "ERROR";
  }
  return "ERROR";
}

namespace {

Verdict verdict_from(const std::string& s) {
  if (s == "PASS") return Verdict::Pass;
  if (s == "FAIL") return Verdict::Fail;
  if (s == "ERROR") return Verdict::Error;
  throw nlohmann::json::other_error::create(501, "unknown verdict '" + s + "'", nullptr);
}

void add(std::vector<Check>& out, const char* quantity, const std::optional<double>& min,
         const std::optional<double>& max, double value, double error) {
  if (min) out.push_back({quantity, "min", *min, value, error, value - error >= *min});
  if (max) out.push_back({quantity, "max", *max, value, error, value + error <= *max});
}

}  // namespace

std::vector<Check> judge_limits(const Limits& l, const WorkResult& r) {
  double work = r.work_J;
  if (!l.work_of.empty()) {
    bool found = false;
    for (const FieldWork& f : r.fields) {
      if (f.name == l.work_of) {
        work = f.work_J;
        found = true;
      }
    }
    if (!found) {
      throw Error(ErrorKind::BadOption,
                  "limits.work_of names '" + l.work_of + "', which is not a force of this case");
    }
  }
  // The integrator reports one error estimate for the total; it also bounds each field's share only
  // approximately, which is why work_of limits use the total's estimate.
  std::vector<Check> out;
  add(out, "work_J", l.work_min_J, l.work_max_J, work, r.error_J);
  add(out, "work_magnitude_J", l.work_magnitude_min_J, l.work_magnitude_max_J, std::abs(work), r.error_J);
  // The peak is the largest |F . T| found at the quadrature nodes: no error estimate exists for it.
  add(out, "peak_force_N", std::nullopt, l.peak_force_max_N, std::abs(r.peak.force_N), 0.0);
  if (l.circulation_max_J) {
    if (!r.closed) {
      throw Error(ErrorKind::BadOption, "limits.circulation_max_J is set but the path is not closed");
    }
    add(out, "circulation_J", std::nullopt, l.circulation_max_J, std::abs(r.work_J), r.error_J);
  }
  add(out, "length_m", l.length_min_m, l.length_max_m, r.length_m, r.length_error_m);
  return out;
}

CaseValues values_of(const WorkResult& r) {
  CaseValues v;
  v.work_J = r.work_J;
  v.work_error_J = r.error_J;
  v.length_m = r.length_m;
  v.length_error_m = r.length_error_m;
  v.peak_force_N = r.peak.force_N;
  v.peak_s_m = r.peak.s_m;
  v.peak_edge = r.peak.edge;
  v.closed = r.closed;
  v.evaluations = r.evaluations;
  for (const FieldWork& f : r.fields) v.field_work_J[f.name] = f.work_J;
  return v;
}

Verdict verdict_of(const std::vector<Check>& checks) {
  for (const Check& c : checks) {
    if (!c.pass) return Verdict::Fail;
  }
  return Verdict::Pass;
}

nlohmann::json to_json(const CaseResult& r) {
  nlohmann::json j;
  j["index"] = r.index;
  j["name"] = r.name;
  j["inputs_sha256"] = r.inputs_sha256;
  j["model"] = r.model;
  j["path"] = r.selector;
  j["verdict"] = to_string(r.verdict);
  if (r.values) {
    const CaseValues& v = *r.values;
    nlohmann::json vj;
    vj["work_J"] = v.work_J;
    vj["work_error_J"] = v.work_error_J;
    vj["length_m"] = v.length_m;
    vj["length_error_m"] = v.length_error_m;
    vj["peak_force_N"] = v.peak_force_N;
    vj["peak_s_m"] = v.peak_s_m;
    vj["peak_edge"] = v.peak_edge;
    vj["closed"] = v.closed;
    vj["evaluations"] = v.evaluations;
    vj["field_work_J"] = v.field_work_J;
    j["values"] = vj;
  } else {
    j["values"] = nullptr;
  }
  nlohmann::json checks = nlohmann::json::array();
  for (const Check& c : r.checks) {
    checks.push_back({{"quantity", c.quantity},
                      {"bound", c.bound},
                      {"limit", c.limit},
                      {"value", c.value},
                      {"error", c.error},
                      {"pass", c.pass}});
  }
  j["checks"] = checks;
  if (r.verdict == Verdict::Error) {
    j["error"] = {{"kind", r.error_kind}, {"message", r.error_message}};
  } else {
    j["error"] = nullptr;
  }
  j["elapsed_s"] = r.elapsed_s;
  return j;
}

CaseResult case_result_from_json(const nlohmann::json& j) {
  CaseResult r;
  r.index = j.at("index").get<std::size_t>();
  r.name = j.at("name").get<std::string>();
  r.inputs_sha256 = j.at("inputs_sha256").get<std::string>();
  r.model = j.at("model").get<std::string>();
  r.selector = j.at("path").get<std::string>();
  r.verdict = verdict_from(j.at("verdict").get<std::string>());
  const nlohmann::json& vj = j.at("values");
  if (!vj.is_null()) {
    CaseValues v;
    v.work_J = vj.at("work_J").get<double>();
    v.work_error_J = vj.at("work_error_J").get<double>();
    v.length_m = vj.at("length_m").get<double>();
    v.length_error_m = vj.at("length_error_m").get<double>();
    v.peak_force_N = vj.at("peak_force_N").get<double>();
    v.peak_s_m = vj.at("peak_s_m").get<double>();
    v.peak_edge = vj.at("peak_edge").get<int>();
    v.closed = vj.at("closed").get<bool>();
    v.evaluations = vj.at("evaluations").get<long>();
    v.field_work_J = vj.at("field_work_J").get<std::map<std::string, double>>();
    r.values = v;
  }
  for (const nlohmann::json& c : j.at("checks")) {
    r.checks.push_back({c.at("quantity").get<std::string>(), c.at("bound").get<std::string>(),
                        c.at("limit").get<double>(), c.at("value").get<double>(), c.at("error").get<double>(),
                        c.at("pass").get<bool>()});
  }
  const nlohmann::json& e = j.at("error");
  if (!e.is_null()) {
    r.error_kind = e.at("kind").get<std::string>();
    r.error_message = e.at("message").get<std::string>();
  }
  if (r.verdict == Verdict::Error && r.error_kind.empty()) {
    throw nlohmann::json::other_error::create(501, "ERROR verdict without an error", nullptr);
  }
  r.elapsed_s = j.at("elapsed_s").get<double>();
  return r;
}

}  // namespace ergpath::batch
