#include <gtest/gtest.h>

#include "plugin/batch/sha256.h"

namespace ergpath::batch {
namespace {

// Reference digests: the SHA-256 examples published with FIPS 180-4 by NIST (CSRC "Examples with
// intermediate values": "abc" and the 448-bit message), the empty message and one million 'a'
// (FIPS 180-2 appendix B.3); all four re-checked with Python's hashlib.
TEST(Sha256, DigestOfAbcMatchesTheStandardsExample) {
  EXPECT_EQ(sha256_hex("abc"), "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
}

TEST(Sha256, DigestOfTheEmptyMessageMatchesTheReference) {
  EXPECT_EQ(sha256_hex(""), "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}

TEST(Sha256, TwoBlockMessageMatchesTheStandardsExample) {
  EXPECT_EQ(sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq"),
            "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
}

TEST(Sha256, FedInUnevenPiecesAMillionAsGiveTheReferenceDigest) {
  Sha256 h;
  const std::string chunk(997, 'a');  // a prime size, so pieces straddle the 64-byte blocks
  std::size_t left = 1000000;
  while (left > 0) {
    const std::size_t n = std::min(left, chunk.size());
    h.update(chunk.data(), n);
    left -= n;
  }
  EXPECT_EQ(h.hex_digest(), "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
}

}  // namespace
}  // namespace ergpath::batch
