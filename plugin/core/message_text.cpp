#include "plugin/core/message_text.h"

#include <cstdio>

namespace ergpath {

namespace {

// Length of the valid UTF-8 sequence starting at text[i] (1..4), or 0 when the bytes there are not one
// (RFC 3629: no overlongs, no surrogates, nothing above U+10FFFF).
std::size_t utf8_length(std::string_view text, std::size_t i) {
  const auto b = [&](std::size_t k) { return static_cast<unsigned char>(text[i + k]); };
  const unsigned char c = b(0);
  std::size_t n = 0;
  if (c >= 0xC2 && c <= 0xDF)
    n = 2;
  else if (c >= 0xE0 && c <= 0xEF)
    n = 3;
  else if (c >= 0xF0 && c <= 0xF4)
    n = 4;
  else
    return 0;
  if (i + n > text.size()) return 0;
  for (std::size_t k = 1; k < n; ++k) {
    if ((b(k) & 0xC0) != 0x80) return 0;
  }
  if (c == 0xE0 && b(1) < 0xA0) return 0;  // overlong
  if (c == 0xED && b(1) > 0x9F) return 0;  // surrogate
  if (c == 0xF0 && b(1) < 0x90) return 0;  // overlong
  if (c == 0xF4 && b(1) > 0x8F) return 0;  // above U+10FFFF
  return n;
}

void append_escaped(std::string& out, std::string_view text) {
  for (std::size_t i = 0; i < text.size();) {
    const unsigned char c = static_cast<unsigned char>(text[i]);
    if (c >= 0x20 && c < 0x7F) {
      out += static_cast<char>(c);
      ++i;
      continue;
    }
    if (c >= 0x80) {
      if (const std::size_t n = utf8_length(text, i)) {
        out.append(text.substr(i, n));
        i += n;
        continue;
      }
    }
    switch (c) {
      case '\n':
        out += "\\n";
        break;
      case '\t':
        out += "\\t";
        break;
      case '\r':
        out += "\\r";
        break;
      default: {
        char hex[8];
        std::snprintf(hex, sizeof hex, "\\x%02X", c);
        out += hex;
      }
    }
    ++i;
  }
}

}  // namespace

std::string printable(std::string_view text, std::size_t max) {
  std::string out;
  const bool cut = text.size() > max;
  if (cut) {
    std::size_t end = max;
    // Do not split a UTF-8 sequence: back up to its first byte.
    while (end > 0 && (static_cast<unsigned char>(text[end]) & 0xC0) == 0x80) --end;
    text = text.substr(0, end);
  }
  append_escaped(out, text);
  if (cut) out += "...";
  return out;
}

std::string quoted(std::string_view text, std::size_t max) { return "\"" + printable(text, max) + "\""; }

std::string one_line(std::string_view message) {
  std::string out;
  append_escaped(out, message);
  return out;
}

}  // namespace ergpath
