#include "plugin/batch/summary.h"

#include <algorithm>
#include <fstream>
#include <ostream>
#include <set>
#include <sstream>

#include "plugin/core/error.h"
#include "plugin/report/work_report.h"

namespace ergpath::batch {

namespace {

constexpr const char* kFormat = "ergpath-batch-summary-1";
// Significant digits of values in the text table: enough to see a limit margin of 1e-6 relative.
constexpr int kTableDigits = 7;

std::string pad(const std::string& s, std::size_t w) {
  return s.size() >= w ? s : s + std::string(w - s.size(), ' ');
}

std::string unit_of(const std::string& quantity) {
  const auto u = quantity.rfind('_');
  return u == std::string::npos ? "" : quantity.substr(u + 1);
}

}  // namespace

nlohmann::json summary_json(const BatchSummary& s) {
  nlohmann::json j;
  j["format"] = kFormat;
  j["manifest"] = s.manifest;
  j["manifest_sha256"] = s.manifest_sha256;
  j["title"] = s.title;
  j["cases_total"] = s.cases_total;
  j["shard"] = {{"index", s.shard.index}, {"count", s.shard.count}};
  j["merged_shards"] = s.merged_shards;
  j["jobs"] = s.jobs;
  j["model_reads"] = s.model_reads;
  j["distinct_models"] = s.distinct_models;
  j["ran"] = s.ran;
  j["resumed"] = s.resumed;
  j["passed"] = s.count(Verdict::Pass);
  j["failed"] = s.count(Verdict::Fail);
  j["errors"] = s.count(Verdict::Error);
  j["exit_code"] = s.exit_code();
  j["elapsed_s"] = s.elapsed_s;
  nlohmann::json results = nlohmann::json::array();
  for (const CaseResult& r : s.results) {
    nlohmann::json rj = to_json(r);
    rj["resumed"] = r.resumed;
    results.push_back(std::move(rj));
  }
  j["results"] = std::move(results);
  return j;
}

BatchSummary summary_from_json(const nlohmann::json& j, const std::string& origin) {
  try {
    if (j.at("format").get<std::string>() != kFormat) {
      throw Error(ErrorKind::BadManifest, origin + ": not an ergpath batch summary (format differs)");
    }
    BatchSummary s;
    s.manifest = j.at("manifest").get<std::string>();
    s.manifest_sha256 = j.at("manifest_sha256").get<std::string>();
    s.title = j.at("title").get<std::string>();
    s.cases_total = j.at("cases_total").get<std::size_t>();
    s.shard = {j.at("shard").at("index").get<std::size_t>(), j.at("shard").at("count").get<std::size_t>()};
    s.merged_shards = j.at("merged_shards").get<std::size_t>();
    s.jobs = j.at("jobs").get<int>();
    s.model_reads = j.at("model_reads").get<long>();
    s.distinct_models = j.at("distinct_models").get<std::size_t>();
    s.ran = j.at("ran").get<std::size_t>();
    s.resumed = j.at("resumed").get<std::size_t>();
    s.elapsed_s = j.at("elapsed_s").get<double>();
    for (const nlohmann::json& rj : j.at("results")) {
      CaseResult r = case_result_from_json(rj);
      r.resumed = rj.value("resumed", false);
      s.results.push_back(std::move(r));
    }
    return s;
  } catch (const nlohmann::json::exception& e) {
    throw Error(ErrorKind::BadManifest, origin + ": not a valid batch summary: " + e.what());
  }
}

BatchSummary read_summary(const std::string& file) {
  std::ifstream in(file, std::ios::binary);
  if (!in) throw Error(ErrorKind::UnreadableFile, file + ": cannot open summary");
  nlohmann::json j;
  try {
    j = nlohmann::json::parse(in);
  } catch (const nlohmann::json::exception& e) {
    throw Error(ErrorKind::BadManifest, file + ": not JSON: " + e.what());
  }
  return summary_from_json(j, file);
}

BatchSummary merge_summaries(const std::vector<BatchSummary>& shards) {
  if (shards.empty()) throw Error(ErrorKind::BadManifest, "merge: no summary given");
  const BatchSummary& first = shards.front();
  BatchSummary m;
  m.manifest = first.manifest;
  m.manifest_sha256 = first.manifest_sha256;
  m.title = first.title;
  m.cases_total = first.cases_total;
  m.shard = {0, 1};
  m.merged_shards = shards.size();
  std::vector<const CaseResult*> by_index(m.cases_total, nullptr);
  std::vector<bool> shard_seen(first.shard.count, false);
  for (const BatchSummary& s : shards) {
    if (s.manifest_sha256 != first.manifest_sha256 || s.cases_total != first.cases_total) {
      throw Error(ErrorKind::BadManifest, "merge: summaries of different manifests (" + first.manifest +
                                              " and " + s.manifest + " differ in content)");
    }
    if (s.shard.count != first.shard.count) {
      throw Error(ErrorKind::BadManifest, "merge: shard counts differ (" + std::to_string(first.shard.count) +
                                              " and " + std::to_string(s.shard.count) + ")");
    }
    if (s.shard.index >= s.shard.count) {
      throw Error(ErrorKind::BadManifest, "merge: summary of " + s.manifest + " has an invalid shard");
    }
    if (shard_seen[s.shard.index]) {
      throw Error(ErrorKind::BadManifest, "merge: shard " + std::to_string(s.shard.index) + "/" +
                                              std::to_string(s.shard.count) + " given twice");
    }
    shard_seen[s.shard.index] = true;
    for (const CaseResult& r : s.results) {
      if (r.index >= m.cases_total || by_index[r.index]) {
        throw Error(ErrorKind::BadManifest, "merge: case " + std::to_string(r.index) + " ('" + r.name +
                                                "') is out of range or appears twice");
      }
      by_index[r.index] = &r;
    }
    m.jobs = std::max(m.jobs, s.jobs);
    m.model_reads += s.model_reads;
    m.ran += s.ran;
    m.resumed += s.resumed;
    m.elapsed_s = std::max(m.elapsed_s, s.elapsed_s);
  }
  for (std::size_t i = 0; i < by_index.size(); ++i) {
    if (!by_index[i]) {
      throw Error(ErrorKind::BadManifest, "merge: case " + std::to_string(i) + " of " + first.manifest +
                                              " is in no summary (is a shard missing?)");
    }
    m.results.push_back(*by_index[i]);
  }
  // Shards may share models, so their counts do not add up: count the files of the cases that ran.
  std::set<std::string> models;
  for (const CaseResult& r : m.results) {
    if (!r.resumed) models.insert(r.model);
  }
  m.distinct_models = models.size();
  return m;
}

std::string summary_path_for(const std::string& results_file) {
  const std::string ext = ".jsonl";
  if (results_file.size() > ext.size() &&
      results_file.compare(results_file.size() - ext.size(), ext.size(), ext) == 0) {
    return results_file.substr(0, results_file.size() - ext.size()) + ".summary.json";
  }
  return results_file + ".summary.json";
}

void write_summary_text(std::ostream& out, const BatchSummary& s, const std::string& caution) {
  std::size_t wname = 4;
  for (const CaseResult& r : s.results) wname = std::max(wname, r.name.size());
  wname += 2;
  constexpr std::size_t wq = 18, wv = 16, wl = 18;
  out << pad("case", wname) << pad("quantity", wq) << pad("value", wv) << pad("limit", wl) << "verdict\n";
  for (const CaseResult& r : s.results) {
    const std::string tag = r.resumed ? " (resumed)" : "";
    if (r.verdict == Verdict::Error) {
      out << pad(r.name, wname) << pad("-", wq) << pad("-", wv) << pad("-", wl) << "ERROR " << r.error_kind
          << ": " << r.error_message << tag << "\n";
      continue;
    }
    for (const Check& c : r.checks) {
      const std::string unit = unit_of(c.quantity);
      std::string value = report::format_number(c.value, kTableDigits) + " " + unit;
      std::string limit = std::string(c.bound == "max" ? "<= " : ">= ") +
                          report::format_number(c.limit, kTableDigits) + " " + unit;
      out << pad(r.name, wname) << pad(c.quantity.substr(0, c.quantity.rfind('_')), wq) << pad(value, wv)
          << pad(limit, wl) << (c.pass ? "PASS" : "FAIL") << tag << "\n";
    }
  }
  out << "\n" << s.results.size() << " case" << (s.results.size() == 1 ? "" : "s");
  if (s.shard.count > 1)
    out << " (shard " << s.shard.index << "/" << s.shard.count << " of " << s.cases_total << ")";
  if (s.merged_shards > 0) out << " (merged from " << s.merged_shards << " shard summaries)";
  out << ": " << s.count(Verdict::Pass) << " PASS, " << s.count(Verdict::Fail) << " FAIL, "
      << s.count(Verdict::Error) << " ERROR; ran " << s.ran << ", resumed " << s.resumed << "\n";
  out << "model files read: " << s.model_reads << " (distinct models needed: " << s.distinct_models << ")\n";
  out << caution << "\n";
}

}  // namespace ergpath::batch
