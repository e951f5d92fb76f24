// Small UTF-8 helpers: validation, decoding, and names for the characters
// that look like ASCII but are not (so an error can say what was typed).
#pragma once

#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

namespace calctrail {

// Offset of the first byte that is not part of valid UTF-8, or npos.
size_t findInvalidUtf8(std::string_view s);

// Decodes the code point at s[i] (valid UTF-8 assumed) and its byte length.
char32_t decodeUtf8(std::string_view s, size_t i, size_t* length);

std::string encodeUtf8(char32_t c);

// "U+2212 MINUS SIGN" for a few well-known look-alikes, else "U+XXXX".
std::string describeCodePoint(char32_t c);

// The ASCII character a look-alike stands for ('-' for U+2212), or 0.
char asciiLookAlike(char32_t c);

// Greek letters, usable in names as engineers write them (alpha, eta, mu).
bool isGreekLetter(char32_t c);

}  // namespace calctrail
