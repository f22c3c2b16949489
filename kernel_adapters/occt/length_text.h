// Adapter-internal: how lengths appear in messages (millimetres, 6 significant digits) and the unit factor.
#pragma once

#include <sstream>
#include <string>

namespace ergpath::occt {

/// Model coordinates inside the adapter are millimetres (the STEP reader's default unit).
constexpr double kMetresPerMillimetre = 1e-3;

/// A length in mm for an error message: 6 significant digits, no unit.
inline std::string mm_text(double v) {
  std::ostringstream os;
  os.precision(6);
  os << v;
  return os.str();
}

}  // namespace ergpath::occt
