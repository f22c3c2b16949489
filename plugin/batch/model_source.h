// Where the runner gets paths from: a loaded model that builds fresh Paths, and a cache that loads each
// model file once and shares it read-only between all cases (and threads) that use it.
#pragma once

#include <atomic>
#include <functional>
#include <map>
#include <memory>
#include <mutex>
#include <optional>
#include <string>

#include "plugin/core/error.h"
#include "plugin/core/path.h"
#include "plugin/core/vec3.h"

namespace ergpath::batch {

struct PathRequest {
  std::string selector = "all";
  bool reverse = false;
  std::optional<Vec3> start_mm;    // millimetres
  double gap_tolerance_mm = 1e-3;  // millimetres
};

/// A model read once. build_path must be safe to call from several threads at once and must return a
/// Path whose curves belong to the caller alone (curves are not thread-safe).
class LoadedModel {
 public:
  virtual ~LoadedModel() = default;
  /// Throws Error (BadSelector, UnknownEdge, GapTooLarge, BranchInPath, ...) naming the selector or edges.
  virtual Path build_path(const PathRequest& request) const = 0;
};

/// Reads a model file. Throws Error (UnreadableFile, EmptyModel) naming the file.
using ModelLoader = std::function<std::shared_ptr<const LoadedModel>(const std::string& file)>;

/// Loads each file at most once, on first use, and hands the same object to every later caller; a failed
/// load is remembered and rethrown to every case of that file. Loads are serialised (CAD readers keep
/// global settings); cases of already loaded models go on meanwhile.
class ModelCache {
 public:
  explicit ModelCache(ModelLoader loader) : loader_(std::move(loader)) {}
  /// Registers the files that will be asked for; must be called before concurrent use of get().
  void expect(const std::string& file);
  /// The loaded model. Thread-safe for files registered with expect(). Throws the load's Error.
  std::shared_ptr<const LoadedModel> get(const std::string& file);
  /// Number of loader calls made so far (each file once at most).
  long loads() const { return loads_.load(); }

 private:
  struct Slot {
    std::mutex mutex;
    bool done = false;
    std::shared_ptr<const LoadedModel> model;
    std::optional<Error> error;
  };
  ModelLoader loader_;
  std::map<std::string, std::unique_ptr<Slot>> slots_;
  std::mutex load_mutex_;
  std::atomic<long> loads_{0};
};

}  // namespace ergpath::batch
