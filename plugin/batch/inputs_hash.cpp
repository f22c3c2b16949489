#include "plugin/batch/inputs_hash.h"

#include <cstdio>
#include <fstream>

#include "plugin/batch/sha256.h"
#include "plugin/core/error.h"

namespace ergpath::batch {

namespace {

constexpr const char* kSchema = "ergpath-batch-inputs-1";

// Length-prefixed fields keep "ab"+"c" and "a"+"bc" apart.
void put(Sha256& h, const std::string& tag, const std::string& value) {
  const std::string rec = tag + ":" + std::to_string(value.size()) + ":" + value + ";";
  h.update(rec);
}

void put(Sha256& h, const std::string& tag, double v) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.17g", v);
  put(h, tag, std::string(buf));
}

void put(Sha256& h, const std::string& tag, const std::optional<double>& v) {
  if (v)
    put(h, tag, *v);
  else
    put(h, tag, std::string("none"));
}

}  // namespace

std::string file_sha256(const std::string& file) {
  std::ifstream in(file, std::ios::binary);
  if (!in) throw Error(ErrorKind::UnreadableFile, file + ": cannot open model file");
  Sha256 h;
  char buf[1 << 16];
  while (in) {
    in.read(buf, sizeof buf);
    h.update(buf, static_cast<std::size_t>(in.gcount()));
  }
  if (in.bad()) throw Error(ErrorKind::UnreadableFile, file + ": read error");
  return h.hex_digest();
}

std::string inputs_sha256(const CaseSpec& c, const std::string& model_sha256, const FieldSpec* field,
                          const std::string& field_error) {
  Sha256 h;
  put(h, "schema", std::string(kSchema));
  put(h, "name", c.name);
  put(h, "model", c.model);
  put(h, "model_sha256", model_sha256);
  put(h, "path", c.selector);
  put(h, "reverse", std::string(c.reverse ? "1" : "0"));
  if (c.start_mm) {
    put(h, "start_x", c.start_mm->x);
    put(h, "start_y", c.start_mm->y);
    put(h, "start_z", c.start_mm->z);
  } else {
    put(h, "start", std::string("none"));
  }
  put(h, "gap_tolerance_mm", c.gap_tolerance_mm);
  put(h, "tolerance", c.tolerance);
  if (field) {
    put(h, "length_unit_m", field->length_unit_m);
    for (const NamedField& f : field->forces) put(h, "force:" + f.name, f.formula);
    for (const auto& [name, value] : field->constants) put(h, "const:" + name, value);
    put(h, "potential", field->potential);
  } else {
    put(h, "field_error", field_error);
  }
  const Limits& l = c.limits;
  put(h, "work_min_J", l.work_min_J);
  put(h, "work_max_J", l.work_max_J);
  put(h, "work_magnitude_min_J", l.work_magnitude_min_J);
  put(h, "work_magnitude_max_J", l.work_magnitude_max_J);
  put(h, "peak_force_max_N", l.peak_force_max_N);
  put(h, "circulation_max_J", l.circulation_max_J);
  put(h, "length_min_m", l.length_min_m);
  put(h, "length_max_m", l.length_max_m);
  put(h, "work_of", l.work_of);
  return h.hex_digest();
}

}  // namespace ergpath::batch
