// Length units by name, as metres per unit.
#pragma once

#include <string>

namespace ergpath {

/// Metres per unit for "m", "mm", "cm", "in"/"inch", "ft"/"foot". The inch is 0.0254 m and the foot 0.3048 m
/// exactly (international yard and pound agreement, 1959). Throws Error(BadOption) for any other name,
/// listing the accepted ones.
double length_unit_m(const std::string& name);

/// Canonical short name ("m", "mm", "cm", "in", "ft") of an accepted unit name.
std::string canonical_length_unit(const std::string& name);

}  // namespace ergpath
