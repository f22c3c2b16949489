// Runs the cases of a manifest in parallel (TBB) and gathers their results in manifest order.
//
// Concurrency model: every model file is loaded once through a ModelCache and shared read-only; each case
// builds its own Path (fresh curve objects) and compute_work builds its own FieldEvaluator, so no mutable
// state is shared between threads except the cache slots and the serialised on_finished callback.
// Cases are queued grouped by model (models in order of first use) and taken one at a time by each
// worker; with two or more jobs one task parses the models ahead of the workers, so parsing (serialised
// by the kernel adapter) overlaps with integrating the cases of models already parsed.
#pragma once

#include <functional>
#include <string>
#include <vector>

#include "plugin/batch/case_result.h"
#include "plugin/batch/manifest.h"
#include "plugin/batch/model_source.h"

namespace ergpath::batch {

/// Case i belongs to shard k of n when i % n == k (0-based case positions, 0 <= k < n).
struct Shard {
  std::size_t index = 0;
  std::size_t count = 1;
};

/// Parses "K/N" with 0 <= K < N. Throws Error(BadOption) quoting the text.
Shard parse_shard(const std::string& text);

struct RunOptions {
  int jobs = 1;  // worker threads, >= 1
  Shard shard;
  /// Results of an earlier run (--resume): a case whose inputs digest appears here is not run again.
  std::vector<CaseResult> previous;
  /// Called once per case that ran, as soon as it finishes, never concurrently (completion order).
  /// An exception thrown here stops the batch and propagates out of run_batch.
  std::function<void(const CaseResult&)> on_finished;
  /// Called once before any case runs with the number of cases that will run (after --resume skips).
  std::function<void(std::size_t)> on_planned;
};

struct BatchSummary {
  std::string manifest;  // file as given
  std::string manifest_sha256;
  std::string title;
  std::size_t cases_total = 0;  // cases in the whole manifest
  Shard shard;
  std::size_t merged_shards = 0;  // > 0 for a summary made by merge_summaries
  int jobs = 1;
  long model_reads = 0;             // model files parsed by this run (each at most once)
  std::size_t distinct_models = 0;  // distinct model files among the cases that ran
  std::size_t ran = 0;              // cases run now
  std::size_t resumed = 0;          // cases taken from `previous`
  double elapsed_s = 0.0;           // wall time of the run
  std::vector<CaseResult> results;  // this shard's cases in manifest order

  std::size_t count(Verdict v) const;
  /// 0 all pass, 1 some limit fails (and no error), 2 some case in error (docs/exit-codes.md).
  int exit_code() const;
};

/// Runs the shard's cases. Sets TBB's process-wide thread limit to `jobs` while it runs: do not call it
/// from several threads at once. Broken cases come back as Verdict::Error with the error's kind and message;
/// the others still run. Throws only Error(BadOption) for jobs < 1 or a bad shard, or what on_finished
/// throws.
BatchSummary run_batch(const Manifest& manifest, const ModelLoader& loader, const RunOptions& options);

}  // namespace ergpath::batch
