// A one-line progress bar for terminals: "[#####.....] 12/40 cases  1 FAIL  0 ERROR".
#pragma once

#include <cstddef>
#include <iosfwd>

namespace ergpath::batch {

class ProgressBar {
 public:
  /// Draws on `out` only when `enabled` (the CLI passes isatty(stderr)); `total` cases to run.
  ProgressBar(std::ostream& out, std::size_t total, bool enabled);
  /// One more case finished; redraws the line in place. Not thread-safe: call under the caller's lock.
  void step(bool failed, bool error);
  /// Clears the line so the summary that follows starts clean.
  void finish();

 private:
  void draw();
  std::ostream& out_;
  std::size_t total_, done_ = 0, failed_ = 0, errors_ = 0;
  bool enabled_;
};

}  // namespace ergpath::batch
