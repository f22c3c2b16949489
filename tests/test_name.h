// Names of parameterised test instances: a readable text made of [A-Za-z0-9_] only, so that a name is
// stable across builds (no byte dump of the parameter) and `ctest -R` can select it.
#pragma once

#include <cctype>
#include <string>

namespace ergpath::testing {

/// `text` with every character that GoogleTest does not allow in a test name replaced by '_'.
inline std::string test_name(std::string text) {
  for (char& c : text) {
    if (!std::isalnum(static_cast<unsigned char>(c))) c = '_';
  }
  return text.empty() ? std::string("unnamed") : text;
}

}  // namespace ergpath::testing
