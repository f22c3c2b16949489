#include "plugin/core/message_text.h"

#include <gtest/gtest.h>

#include <string>

namespace ergpath {
namespace {

TEST(MessageText, ControlCharactersBecomeEscapesSoAMessageStaysOneLine) {
  EXPECT_EQ(printable("a\nb\tc\rd"), "a\\nb\\tc\\rd");
  EXPECT_EQ(printable(std::string("x\0y", 3)), "x\\x00y");
  EXPECT_EQ(printable("\x1b[31m"), "\\x1B[31m");
  EXPECT_EQ(one_line("edge 3:\nbad"), "edge 3:\\nbad");
}

TEST(MessageText, LongTextIsCutAtTheLimitWithAMark) {
  const std::string long_text(5000, 'k');
  const std::string p = printable(long_text);
  EXPECT_EQ(p, std::string(kQuotedTextMax, 'k') + "...");
  EXPECT_EQ(quoted("abc"), "\"abc\"");
  EXPECT_EQ(printable("abcdef", 3), "abc...");
}

TEST(MessageText, ValidUtf8PassesAndInvalidBytesAreEscaped) {
  EXPECT_EQ(printable("\xCE\xBC=0.02"), "\xCE\xBC=0.02");  // mu, U+03BC
  EXPECT_EQ(printable("\xFF\xFE"), "\\xFF\\xFE");
  EXPECT_EQ(printable("\xC0\xAF"), "\\xC0\\xAF");  // overlong '/' (RFC 3629 forbids it)
}

TEST(MessageText, CuttingNeverSplitsAUtf8Character) {
  // 39 ASCII characters then a 2-byte character straddling the 40-character limit.
  const std::string text = std::string(39, 'a') + "\xCE\xBC" + "tail";
  EXPECT_EQ(printable(text), std::string(39, 'a') + "...");
}

}  // namespace
}  // namespace ergpath
