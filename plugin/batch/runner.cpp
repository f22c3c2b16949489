#include "plugin/batch/runner.h"

#include <tbb/global_control.h>
#include <tbb/parallel_for.h>
#include <tbb/partitioner.h>
#include <tbb/task_arena.h>
#include <tbb/task_group.h>

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cstdlib>
#include <map>
#include <mutex>
#include <unordered_map>

#include "plugin/batch/inputs_hash.h"
#include "plugin/core/error.h"
#include "plugin/core/work.h"
#include "plugin/report/work_report.h"

namespace ergpath::batch {

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t0) {
  return std::chrono::duration<double>(Clock::now() - t0).count();
}

struct PreparedCase {
  const CaseSpec* spec = nullptr;
  std::optional<FieldSpec> field;
  std::optional<Error> input_error;  // field file or model bytes could not be read
  std::string sha256;
};

CaseResult run_case(const PreparedCase& p, ModelCache& cache) {
  const CaseSpec& c = *p.spec;
  const auto t0 = Clock::now();
  CaseResult r;
  r.index = c.index;
  r.name = c.name;
  r.inputs_sha256 = p.sha256;
  r.model = c.model;
  r.selector = c.selector;
  try {
    if (p.input_error) throw *p.input_error;
    const FieldSpec& field = *p.field;
    const std::shared_ptr<const LoadedModel> model = cache.get(c.model_file);
    PathRequest req;
    req.selector = c.selector;
    req.reverse = c.reverse;
    req.start_mm = c.start_mm;
    req.gap_tolerance_mm = c.gap_tolerance_mm;
    const Path path = model->build_path(req);
    IntegrationOptions iopts;
    iopts.rel_tol = c.tolerance;
    const WorkResult w = compute_work(path, field, iopts);
    r.values = values_of(w);
    if (w.status == Status::ToleranceNotMet) {
      throw Error(ErrorKind::ToleranceNotMet, "tolerance " + report::format_number(c.tolerance, 3) +
                                                  " not met: best work " + report::format_number(w.work_J) +
                                                  " J, error estimate " +
                                                  report::format_number(w.error_J, 3) + " J after " +
                                                  std::to_string(w.evaluations) + " evaluations");
    }
    r.checks = judge_limits(c.limits, w);
    r.verdict = verdict_of(r.checks);
  } catch (const Error& e) {
    r.verdict = Verdict::Error;
    r.error_kind = to_string(e.kind());
    r.error_message = e.what();
    r.checks.clear();
  } catch (const std::bad_alloc&) {
    r.verdict = Verdict::Error;
    r.error_kind = "internal";
    r.error_message = "out of memory";
    r.checks.clear();
  } catch (const std::exception& e) {
    r.verdict = Verdict::Error;
    r.error_kind = "internal";
    r.error_message = std::string("internal: ") + e.what();
    r.checks.clear();
  }
  r.elapsed_s = seconds_since(t0);
  return r;
}

}  // namespace

Shard parse_shard(const std::string& text) {
  const auto slash = text.find('/');
  auto bad = [&]() {
    return Error(ErrorKind::BadOption, "--shard '" + text + "': expected K/N with 0 <= K < N, e.g. 0/4");
  };
  if (slash == std::string::npos || slash == 0 || slash + 1 >= text.size()) throw bad();
  const std::string ks = text.substr(0, slash), ns = text.substr(slash + 1);
  for (const std::string& s : {ks, ns}) {
    if (s.size() > 9 || s.find_first_not_of("0123456789") != std::string::npos) throw bad();
  }
  Shard s{std::stoul(ks), std::stoul(ns)};
  if (s.count == 0 || s.index >= s.count) throw bad();
  return s;
}

std::size_t BatchSummary::count(Verdict v) const {
  std::size_t n = 0;
  for (const CaseResult& r : results) n += r.verdict == v ? 1 : 0;
  return n;
}

int BatchSummary::exit_code() const {
  if (count(Verdict::Error) > 0) return 2;
  if (count(Verdict::Fail) > 0) return 1;
  return 0;
}

BatchSummary run_batch(const Manifest& manifest, const ModelLoader& loader, const RunOptions& options) {
  if (options.jobs < 1) throw Error(ErrorKind::BadOption, "--jobs must be at least 1");
  if (options.shard.count == 0 || options.shard.index >= options.shard.count) {
    throw Error(ErrorKind::BadOption, "shard index must be below the shard count");
  }
  const auto t0 = Clock::now();
  BatchSummary s;
  s.manifest = manifest.file;
  s.manifest_sha256 = manifest.sha256;
  s.title = manifest.title;
  s.cases_total = manifest.cases.size();
  s.shard = options.shard;
  s.jobs = options.jobs;

  // Resolve inputs and digests up front (cheap, sequential): each model file's bytes are hashed once.
  std::map<std::string, std::string> model_digest;
  std::vector<PreparedCase> prepared;
  for (const CaseSpec& c : manifest.cases) {
    if (c.index % options.shard.count != options.shard.index) continue;
    PreparedCase p;
    p.spec = &c;
    auto it = model_digest.find(c.model_file);
    if (it == model_digest.end()) {
      std::string digest;
      try {
        digest = file_sha256(c.model_file);
      } catch (const Error& e) {
        digest = std::string("unreadable: ") + e.what();
      }
      it = model_digest.emplace(c.model_file, digest).first;
    }
    std::string field_error;
    try {
      p.field = resolve_field(c);
    } catch (const Error& e) {
      p.input_error = e;
      field_error = e.what();
    }
    p.sha256 = inputs_sha256(c, it->second, p.field ? &*p.field : nullptr, field_error);
    prepared.push_back(std::move(p));
  }

  std::unordered_map<std::string, const CaseResult*> done_before;
  for (const CaseResult& r : options.previous) done_before.emplace(r.inputs_sha256, &r);

  s.results.resize(prepared.size());
  std::vector<std::size_t> todo;
  ModelCache cache(loader);
  std::vector<std::string> models;  // in order of first use
  for (std::size_t i = 0; i < prepared.size(); ++i) {
    auto hit = done_before.find(prepared[i].sha256);
    if (hit != done_before.end()) {
      CaseResult r = *hit->second;
      r.index = prepared[i].spec->index;  // the manifest may have been reordered since
      r.resumed = true;
      s.results[i] = std::move(r);
      ++s.resumed;
    } else {
      todo.push_back(i);
      const std::string& file = prepared[i].spec->model_file;
      if (std::find(models.begin(), models.end(), file) == models.end()) models.push_back(file);
      cache.expect(file);
    }
  }
  s.distinct_models = models.size();
  // Cases grouped by model, models in order of first use: while one thread parses the next model, the
  // others work through the cases of the models already parsed instead of waiting for it.
  std::stable_sort(todo.begin(), todo.end(), [&](std::size_t a, std::size_t b) {
    auto rank = [&](std::size_t i) {
      return std::find(models.begin(), models.end(), prepared[i].spec->model_file) - models.begin();
    };
    return rank(a) < rank(b);
  });

  if (options.on_planned) options.on_planned(todo.size());
  std::mutex finished_mutex;
  std::atomic<std::size_t> next{0};
  // Self-scheduling: each worker takes the next case in line, so a slow case never holds up a fixed chunk.
  auto worker = [&](int) {
    for (std::size_t k; (k = next++) < todo.size();) {
      const std::size_t i = todo[k];
      CaseResult r = run_case(prepared[i], cache);
      {
        std::lock_guard<std::mutex> lock(finished_mutex);
        if (options.on_finished) options.on_finished(r);
      }
      s.results[i] = std::move(r);
    }
  };
  // The global limit lets --jobs exceed the default worker count (one per core) when asked for.
  tbb::global_control threads(tbb::global_control::max_allowed_parallelism,
                              static_cast<std::size_t>(options.jobs));
  tbb::task_arena arena(options.jobs);
  arena.execute([&] {
    tbb::task_group prefetch;
    if (options.jobs > 1) {
      // Parses the models ahead of the workers; a worker that needs a model first parses it itself, and
      // the cache makes sure each file is parsed once whoever gets there first. Errors stay in the cache.
      prefetch.run([&] {
        for (const std::string& file : models) {
          try {
            cache.get(file);
          } catch (const Error&) {
          }
        }
      });
    }
    tbb::parallel_for(0, options.jobs, worker, tbb::simple_partitioner());
    prefetch.wait();
  });
  s.ran = todo.size();
  s.model_reads = cache.loads();
  s.elapsed_s = seconds_since(t0);
  return s;
}

}  // namespace ergpath::batch
