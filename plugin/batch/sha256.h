// SHA-256 message digest, used to fingerprint the resolved inputs of a batch case.
//
// Method: FIPS PUB 180-4, Secure Hash Standard (NIST, 2015), section 6.2. Not used for security here: it
// only has to make accidental collisions between different case inputs practically impossible.
#pragma once

#include <array>
#include <cstdint>
#include <string>

namespace ergpath::batch {

/// Incremental SHA-256: feed bytes with update(), read the digest once with hex_digest().
class Sha256 {
 public:
  Sha256();
  void update(const void* data, std::size_t size);
  void update(const std::string& bytes) { update(bytes.data(), bytes.size()); }
  /// Lower-case hexadecimal digest (64 characters). Finishes the computation: call once.
  std::string hex_digest();

 private:
  void compress(const unsigned char* block);
  std::array<std::uint32_t, 8> h_;
  std::array<unsigned char, 64> buffer_{};
  std::size_t buffered_ = 0;
  std::uint64_t total_bytes_ = 0;
};

/// Digest of a whole string.
std::string sha256_hex(const std::string& bytes);

}  // namespace ergpath::batch
