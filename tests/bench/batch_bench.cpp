// Batch benchmark: the demo manifest replicated to >= 200 cases, run with one worker and with two, in the
// same process, alternating, several rounds; prints the median wall times, their ratio (the speed-up;
// goal >= 1.8 on two cores) and how many times the model files were parsed (must equal the number of
// distinct models, 6, whatever the case count).
//
//   batch_bench [MANIFEST] [--copies N] [--rounds R]
//
// Peer: the same run_batch with jobs = 1. Model parsing is part of each timed run (a fresh cache per run),
// as in a real `ergpath check`.
#include <sys/resource.h>

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <set>
#include <string>
#include <thread>
#include <vector>

#include "plugin/batch/manifest.h"
#include "plugin/batch/runner.h"
#include "plugin/batch/step_model_source.h"

using namespace ergpath::batch;

namespace {

double median(std::vector<double> v) {
  std::sort(v.begin(), v.end());
  const std::size_t n = v.size();
  return n % 2 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
}

// CPU time does not depend on how busy the machine is: equal CPU time for jobs 1 and 2 means the
// threads do not slow each other down, so the wall-time ratio is bounded by the free cores only.
double process_cpu_seconds() {
  rusage u{};
  getrusage(RUSAGE_SELF, &u);
  return u.ru_utime.tv_sec + 1e-6 * u.ru_utime.tv_usec + u.ru_stime.tv_sec + 1e-6 * u.ru_stime.tv_usec;
}

struct Timed {
  double seconds = 0.0;
  long parses = 0;
  std::size_t threads = 0;   // distinct threads that finished a case
  double cpu_seconds = 0.0;  // user + system time of the process during the run
  BatchSummary summary;
};

Timed timed_run(const Manifest& m, int jobs) {
  std::atomic<long> parses{0};
  const ModelLoader step = step_model_loader();
  const ModelLoader counting = [&](const std::string& file) {
    ++parses;
    return step(file);
  };
  RunOptions o;
  o.jobs = jobs;
  std::set<std::thread::id> threads;
  o.on_finished = [&](const CaseResult&) { threads.insert(std::this_thread::get_id()); };  // serialised
  const double cpu0 = process_cpu_seconds();
  const auto t0 = std::chrono::steady_clock::now();
  Timed t;
  t.summary = run_batch(m, counting, o);
  t.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  t.cpu_seconds = process_cpu_seconds() - cpu0;
  t.parses = parses.load();
  t.threads = threads.size();
  return t;
}

}  // namespace

int main(int argc, char** argv) {
  std::string manifest_file = std::string(ERGPATH_FIXTURES_DIR) + "/batch/mechanisms.toml";
  int copies = 34;  // 6 demo cases x 34 = 204 cases
  int rounds = 5;
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    if (a == "--copies" && i + 1 < argc)
      copies = std::atoi(argv[++i]);
    else if (a == "--rounds" && i + 1 < argc)
      rounds = std::atoi(argv[++i]);
    else
      manifest_file = a;
  }
  const Manifest demo = read_manifest(manifest_file);
  Manifest big = demo;
  big.cases.clear();
  for (int c = 0; c < copies; ++c) {
    for (const CaseSpec& s : demo.cases) {
      CaseSpec r = s;
      r.index = big.cases.size();
      r.name = s.name + "#" + std::to_string(c);
      big.cases.push_back(std::move(r));
    }
  }
  std::printf("batch_bench: %zu cases (%zu demo cases x %d), %d rounds, alternating jobs 1 and 2\n",
              big.cases.size(), demo.cases.size(), copies, rounds);
  std::vector<double> t1, t2, c1, c2;
  long parses1 = 0, parses2 = 0;
  std::size_t threads2 = 0;
  std::size_t pass = 0, fail = 0, error = 0;
  for (int r = 0; r < rounds; ++r) {
    const Timed a = timed_run(big, 1);
    const Timed b = timed_run(big, 2);
    t1.push_back(a.seconds);
    t2.push_back(b.seconds);
    c1.push_back(a.cpu_seconds);
    c2.push_back(b.cpu_seconds);
    parses1 = std::max(parses1, a.parses);
    parses2 = std::max(parses2, b.parses);
    threads2 = std::max(threads2, b.threads);
    pass = b.summary.count(Verdict::Pass);
    fail = b.summary.count(Verdict::Fail);
    error = b.summary.count(Verdict::Error);
    std::printf("  round %d: jobs 1 %.3f s (cpu %.3f s), jobs 2 %.3f s (cpu %.3f s), ratio %.2f\n", r + 1,
                a.seconds, a.cpu_seconds, b.seconds, b.cpu_seconds, a.seconds / b.seconds);
  }
  const double m1 = median(t1), m2 = median(t2);
  std::printf("median wall time: jobs 1 %.3f s (%.2f ms/case), jobs 2 %.3f s\n", m1,
              1e3 * m1 / big.cases.size(), m2);
  std::printf("speed-up jobs 2 vs jobs 1: %.2f (goal >= 1.8)\n", m1 / m2);
  std::printf("median process CPU time: jobs 1 %.3f s, jobs 2 %.3f s (ratio %.2f; 1.00 = no contention)\n",
              median(c1), median(c2), median(c2) / median(c1));
  std::printf("model files parsed per run: %ld with jobs 1, %ld with jobs 2 (distinct models: %zu)\n",
              parses1, parses2, big.cases.empty() ? 0 : timed_run(demo, 1).summary.distinct_models);
  std::printf("threads that ran cases with jobs 2: %zu\n", threads2);
  std::printf("verdicts per run: %zu PASS, %zu FAIL, %zu ERROR\n", pass, fail, error);
  return parses1 == parses2 && error == 0 ? 0 : 1;
}
