#include <gtest/gtest.h>

#include <sstream>

#include "plugin/batch/progress_bar.h"

namespace ergpath::batch {
namespace {

TEST(ProgressBar, DisabledBarWritesNothing) {
  std::ostringstream out;
  ProgressBar bar(out, 3, false);
  bar.step(false, false);
  bar.finish();
  EXPECT_TRUE(out.str().empty());
}

TEST(ProgressBar, EnabledBarRedrawsOneLineWithCounts) {
  std::ostringstream out;
  ProgressBar bar(out, 2, true);
  bar.step(true, false);
  EXPECT_NE(out.str().find("1/2 cases  1 FAIL  0 ERROR"), std::string::npos) << out.str();
  bar.step(false, true);
  EXPECT_NE(out.str().find("[##############################] 2/2 cases  1 FAIL  1 ERROR"), std::string::npos);
  EXPECT_EQ(out.str().find('\n'), std::string::npos);  // redrawn in place with carriage returns
  bar.finish();
  EXPECT_EQ(out.str().back(), '\r');
}

}  // namespace
}  // namespace ergpath::batch
