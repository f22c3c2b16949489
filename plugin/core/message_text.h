// User text inside one-line error messages: every message ergpath prints is a single line, however hostile
// the formula, selector, file name or token it quotes.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

namespace ergpath {

/// Longest piece of user text a message quotes (characters before the cut mark).
inline constexpr std::size_t kQuotedTextMax = 40;

/// `text` made printable on one line: control characters and bytes >= 0x7F that are not part of valid
/// UTF-8 become C-style escapes (\n, \t, \r, \xNN); a backslash stays a backslash. Longer than `max`
/// characters (before escaping): cut at `max` and "..." appended. No quotes are added.
std::string printable(std::string_view text, std::size_t max = kQuotedTextMax);

/// printable(text, max) in double quotes: the form for a token, name or value inside a message.
std::string quoted(std::string_view text, std::size_t max = kQuotedTextMax);

/// `message` with every control character escaped as in printable(), never cut: for whole messages
/// built from parts that may hold user text (a last line of defence before printing).
std::string one_line(std::string_view message);

}  // namespace ergpath
