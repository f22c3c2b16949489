// Fingerprint of a case's resolved inputs: what `--resume` compares to decide that a case is already done.
//
// The digest (SHA-256, FIPS 180-4) covers the model file's bytes, the case name, selector, direction rules,
// gap tolerance, integration tolerance, the resolved field (forces, constants, length unit, potential, after
// the field file and overrides are applied) and every limit. Numbers enter with 17 significant digits, so
// any change of value changes the digest. A schema tag makes digests of a future format distinct.
#pragma once

#include <string>

#include "plugin/batch/manifest.h"

namespace ergpath::batch {

/// Digest of a case. `model_sha256` is the digest of the model file's bytes (or a marker when the file
/// cannot be read); `field` is the resolved FieldSpec, or nullptr with `field_error` set when resolving
/// failed.
std::string inputs_sha256(const CaseSpec& c, const std::string& model_sha256, const FieldSpec* field,
                          const std::string& field_error);

/// Digest of a file's bytes; throws Error(UnreadableFile) naming the file when it cannot be read.
std::string file_sha256(const std::string& file);

}  // namespace ergpath::batch
