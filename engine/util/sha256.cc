#include "engine/util/sha256.h"

// The low-level SHA-256 functions, deprecated in OpenSSL 3 in favour of EVP.
// EVP (and SHA256(), which goes through it) loads openssl.cnf and the
// providers on first use: about 1 ms of a 4 ms `calctrail report`
// (docs/performance.md). These do the same hashing without that start-up.
#define OPENSSL_SUPPRESS_DEPRECATED
#include <openssl/sha.h>

namespace calctrail {

std::string sha256Hex(std::string_view bytes) {
  unsigned char digest[SHA256_DIGEST_LENGTH];
  SHA256_CTX context;
  SHA256_Init(&context);
  SHA256_Update(&context, bytes.data(), bytes.size());
  SHA256_Final(digest, &context);
  static const char* hex = "0123456789abcdef";
  std::string out(2 * SHA256_DIGEST_LENGTH, '0');
  for (int i = 0; i < SHA256_DIGEST_LENGTH; ++i) {
    out[2 * i] = hex[digest[i] >> 4];
    out[2 * i + 1] = hex[digest[i] & 15];
  }
  return out;
}

}  // namespace calctrail
