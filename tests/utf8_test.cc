// engine/util/utf8: validation, decoding and encoding at every length, and
// the names of the look-alike characters an error message shows.
#include "engine/util/utf8.h"

#include <catch2/catch.hpp>
#include <string>

using namespace calctrail;

TEST_CASE("utf8: valid text of every sequence length passes", "[utf8]") {
  CHECK(findInvalidUtf8("") == std::string::npos);
  CHECK(findInvalidUtf8("F = 20 kN") == std::string::npos);
  CHECK(findInvalidUtf8("\xCE\xB1 = 1") == std::string::npos);      // U+03B1 alpha, 2 bytes
  CHECK(findInvalidUtf8("a \xE2\x88\x92 b") == std::string::npos);  // U+2212 minus, 3 bytes
  CHECK(findInvalidUtf8("\xF0\x9F\x94\xA9") == std::string::npos);  // U+1F529, 4 bytes
  CHECK(findInvalidUtf8("\xF4\x8F\xBF\xBF") == std::string::npos);  // U+10FFFF, the last
}

TEST_CASE("utf8: the offset of the first invalid byte", "[utf8]") {
  CHECK(findInvalidUtf8("ab\x80") == 2);            // a lone continuation byte
  CHECK(findInvalidUtf8("ab\xC3") == 2);            // truncated at the end
  CHECK(findInvalidUtf8("x\xC3(") == 1);            // continuation missing
  CHECK(findInvalidUtf8("\xC0\xAF") == 0);          // overlong '/'
  CHECK(findInvalidUtf8("\xE0\x80\xAF") == 0);      // overlong, 3 bytes
  CHECK(findInvalidUtf8("ok\xED\xA0\x80") == 2);    // U+D800, a surrogate
  CHECK(findInvalidUtf8("\xF4\x90\x80\x80") == 0);  // above U+10FFFF
  CHECK(findInvalidUtf8("\xFF") == 0);              // never valid
}

TEST_CASE("utf8: decode and encode are inverse at every length", "[utf8]") {
  for (char32_t c : {U'A', U'\u00B0', U'\u03B1', U'\u2212', U'\uFF1D', U'\U0001F529', U'\U0010FFFF'}) {
    const std::string bytes = encodeUtf8(c);
    INFO("U+" << std::hex << static_cast<unsigned>(c));
    CHECK(bytes.size() == (c < 0x80 ? 1u : c < 0x800 ? 2u : c < 0x10000 ? 3u : 4u));
    CHECK(findInvalidUtf8(bytes) == std::string::npos);
    size_t length = 0;
    CHECK(decodeUtf8(bytes, 0, &length) == c);
    CHECK(length == bytes.size());
  }
  size_t length = 0;
  const std::string text = "d\xCE\xBC=";
  CHECK(decodeUtf8(text, 1, &length) == U'\u03BC');
  CHECK(length == 2);
}

TEST_CASE("utf8: look-alikes are named and mapped to the ASCII they stand for", "[utf8]") {
  CHECK(describeCodePoint(0x2212) == "U+2212 MINUS SIGN");
  CHECK(describeCodePoint(0x00A0) == "U+00A0 NO-BREAK SPACE");
  CHECK(describeCodePoint(0xFF0B) == "U+FF0B FULLWIDTH FORM");
  CHECK(describeCodePoint(0x20AC) == "U+20AC");
  CHECK(asciiLookAlike(0x2212) == '-');
  CHECK(asciiLookAlike(0x0441) == 'c');
  CHECK(asciiLookAlike(0xFF0B) == '+');  // fullwidth plus
  CHECK(asciiLookAlike(0x20AC) == 0);
}

TEST_CASE("utf8: Greek letters, and only they, may stand in names", "[utf8]") {
  CHECK(isGreekLetter(U'\u03B1'));        // alpha
  CHECK(isGreekLetter(U'\u03C9'));        // omega
  CHECK(isGreekLetter(U'\u0394'));        // capital delta
  CHECK_FALSE(isGreekLetter(U'\u03A2'));  // unassigned between rho and sigma
  CHECK_FALSE(isGreekLetter(U'\u00B5'));  // the micro sign is not mu
  CHECK_FALSE(isGreekLetter(U'a'));
}
