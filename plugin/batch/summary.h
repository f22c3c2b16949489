// The summary of a batch run: JSON file (written atomically), merge of shard summaries, text table.
#pragma once

#include <nlohmann/json.hpp>

#include <iosfwd>
#include <string>
#include <vector>

#include "plugin/batch/runner.h"

namespace ergpath::batch {

/// JSON object with stable keys: format, manifest, manifest_sha256, title, cases_total, shard {index, count},
/// merged_shards, jobs, model_reads, distinct_models, ran, resumed, passed, failed, errors, exit_code,
/// elapsed_s, results [case objects as in the results log, plus "resumed"].
nlohmann::json summary_json(const BatchSummary& s);

/// Inverse of summary_json. Throws Error(BadManifest) naming `origin` for a file that is not a summary.
BatchSummary summary_from_json(const nlohmann::json& j, const std::string& origin);

/// Reads a summary file written by `check --results`. Throws Error(UnreadableFile / BadManifest).
BatchSummary read_summary(const std::string& file);

/// Combines shard summaries of one manifest into the summary of a full run. Throws Error(BadManifest)
/// when they come from different manifests (digest or case count differ) or shard counts, when a case is
/// missing or appears twice, or when no summary is given. model_reads adds up the shards' reads (a model
/// used by several shards is read once in each); distinct_models counts the models of the merged cases.
BatchSummary merge_summaries(const std::vector<BatchSummary>& shards);

/// Where `check --results FILE` puts the summary: FILE with ".jsonl" replaced by ".summary.json"
/// (or ".summary.json" appended).
std::string summary_path_for(const std::string& results_file);

/// Table "case | quantity | value | limit | verdict" (one row per limit, one per error), totals, model
/// reads, and the caution line last.
void write_summary_text(std::ostream& out, const BatchSummary& s, const std::string& caution);

}  // namespace ergpath::batch
