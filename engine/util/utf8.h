// Small UTF-8 helpers: validation, decoding, and names for the characters
// that look like ASCII but are not (so an error can say what was typed).
#pragma once

#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

namespace calctrail {

/// One character read from UTF-8 text by readUtf8.
struct Utf8Char {
  /// The code point; U+FFFD REPLACEMENT CHARACTER where the bytes are not UTF-8.
  char32_t cp = 0;
  /// The bytes it takes, 1 to 4; 1 where the bytes are not UTF-8, so that a
  /// reader steps over one bad byte at a time and never over good text after it.
  size_t length = 0;
  /// False for a byte that starts no UTF-8 sequence: a lone continuation byte,
  /// 0xF8 to 0xFF, a sequence cut short (by the end of the text or by a byte
  /// that does not continue it), an overlong form, a surrogate (U+D800 to
  /// U+DFFF), or a value past U+10FFFF.
  bool valid = false;
};

/// The one UTF-8 decoder: the character at s[i]. Past the end of s, cp 0,
/// length 0 and not valid. Every reader of UTF-8 text calls it (or the two
/// helpers below), so all of them agree on what is UTF-8 and what is not.
Utf8Char readUtf8(std::string_view s, size_t i);

/// Offset of the first byte that is not part of valid UTF-8, or npos.
size_t findInvalidUtf8(std::string_view s);

/// The length of the run of printable ASCII (0x20 to 0x7E) at the start of
/// `s`: most of any worksheet, and text with nothing in it to reject, so the
/// scans over whole files (this one's, the control characters') skip it a
/// word at a time.
size_t printableAsciiPrefix(std::string_view s);

/// readUtf8's code point at s[i], its byte length in *length.
inline char32_t decodeUtf8(std::string_view s, size_t i, size_t* length) {
  const Utf8Char c = readUtf8(s, i);
  *length = c.length;
  return c.cp;
}

std::string encodeUtf8(char32_t c);

// "U+2212 MINUS SIGN" for a few well-known look-alikes and for U+FFFD, else "U+XXXX".
std::string describeCodePoint(char32_t c);

// The ASCII character a look-alike stands for ('-' for U+2212), or 0.
char asciiLookAlike(char32_t c);

// Greek letters, usable in names as engineers write them (alpha, eta, mu).
bool isGreekLetter(char32_t c);

}  // namespace calctrail
