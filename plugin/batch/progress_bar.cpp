#include "plugin/batch/progress_bar.h"

#include <ostream>
#include <string>

namespace ergpath::batch {

namespace {
constexpr std::size_t kWidth = 30;  // characters of the bar itself; fits an 80-column terminal with counts
}

ProgressBar::ProgressBar(std::ostream& out, std::size_t total, bool enabled)
    : out_(out), total_(total), enabled_(enabled) {
  if (enabled_) draw();
}

void ProgressBar::step(bool failed, bool error) {
  ++done_;
  failed_ += failed ? 1 : 0;
  errors_ += error ? 1 : 0;
  if (enabled_) draw();
}

void ProgressBar::draw() {
  const std::size_t filled = total_ == 0 ? kWidth : kWidth * done_ / total_;
  out_ << "\r[" << std::string(filled, '#') << std::string(kWidth - filled, '.') << "] " << done_ << "/"
       << total_ << " cases  " << failed_ << " FAIL  " << errors_ << " ERROR" << std::flush;
}

void ProgressBar::finish() {
  if (enabled_) out_ << "\r" << std::string(kWidth + 40, ' ') << "\r" << std::flush;
}

}  // namespace ergpath::batch
