#include "units.h"

#include "error.h"

namespace ergpath {

std::string canonical_length_unit(const std::string& name) {
  if (name == "m" || name == "metre" || name == "meter") return "m";
  if (name == "mm" || name == "millimetre" || name == "millimeter") return "mm";
  if (name == "cm" || name == "centimetre" || name == "centimeter") return "cm";
  if (name == "in" || name == "inch") return "in";
  if (name == "ft" || name == "foot") return "ft";
  throw Error(ErrorKind::BadOption, "unknown length unit '" + name + "' (use m, mm, cm, in or ft)");
}

double length_unit_m(const std::string& name) {
  const std::string u = canonical_length_unit(name);
  if (u == "m") return 1.0;
  if (u == "mm") return 1e-3;
  if (u == "cm") return 1e-2;
  if (u == "in") return 0.0254;
  return 0.3048;
}

}  // namespace ergpath
