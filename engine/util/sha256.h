// SHA-256 of a byte string, as lowercase hex. OpenSSL's libcrypto does the
// hashing: a well-kept library, not a hand-written digest (docs/dependencies.md).
#pragma once

#include <string>
#include <string_view>

namespace calctrail {

std::string sha256Hex(std::string_view bytes);

}  // namespace calctrail
