// The outcome of one batch case: values, limit checks, verdict, or the error that stopped it.
//
// A limit is judged against the value moved by its error estimate towards the limit (value + error for a
// maximum, value - error for a minimum), so a PASS holds for every value the integrator cannot rule out.
#pragma once

#include <nlohmann/json.hpp>

#include <map>
#include <optional>
#include <string>
#include <vector>

#include "plugin/batch/manifest.h"
#include "plugin/core/work.h"

namespace ergpath::batch {

enum class Verdict { Pass, Fail, Error };

/// "PASS", "FAIL", "ERROR".
const char* to_string(Verdict v);

struct Check {
  std::string quantity;  // "work_J", "work_magnitude_J", "peak_force_N", "circulation_J", "length_m"
  std::string bound;     // "min" or "max"
  double limit = 0.0;    // joules, newtons or metres as the quantity says
  double value = 0.0;    // same unit
  double error = 0.0;    // error estimate of value, same unit (0 when the quantity has none)
  bool pass = false;
};

/// Values reported for a case that ran (joules, metres, newtons).
struct CaseValues {
  double work_J = 0.0, work_error_J = 0.0;
  double length_m = 0.0, length_error_m = 0.0;
  double peak_force_N = 0.0;  // signed F . T where |F . T| is largest
  double peak_s_m = 0.0;      // arc length from the path start to the peak
  int peak_edge = 0;
  bool closed = false;
  long evaluations = 0;
  std::map<std::string, double> field_work_J;  // per named field
};

struct CaseResult {
  std::size_t index = 0;  // position in the manifest
  std::string name;
  std::string inputs_sha256;
  std::string model;  // as written in the manifest
  std::string selector;
  Verdict verdict = Verdict::Error;
  std::optional<CaseValues> values;  // absent when the case stopped before integrating
  std::vector<Check> checks;
  std::string error_kind;  // ErrorKind identifier ("gap_too_large", ...) or "internal"; empty unless ERROR
  std::string error_message;
  double elapsed_s = 0.0;  // wall time of this case
  bool resumed = false;    // taken from an earlier results log instead of being run
};

/// Judges `limits` on a finished integration. Throws Error(BadOption) when a circulation limit is set on
/// an open path or `work_of` names no force field of the case.
std::vector<Check> judge_limits(const Limits& limits, const WorkResult& r);

/// Copies the reported values out of a work result.
CaseValues values_of(const WorkResult& r);

/// Verdict of a list of checks: Pass when all pass (the list is never empty for a valid manifest).
Verdict verdict_of(const std::vector<Check>& checks);

/// JSON object with stable keys (one line of the results log; see docs/batch.md). `resumed` is not written.
nlohmann::json to_json(const CaseResult& r);

/// Inverse of to_json. Throws nlohmann::json::exception on a malformed object.
CaseResult case_result_from_json(const nlohmann::json& j);

}  // namespace ergpath::batch
