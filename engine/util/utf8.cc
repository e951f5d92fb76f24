#include "engine/util/utf8.h"

#include <cstdint>
#include <cstdio>
#include <cstring>

namespace calctrail {

Utf8Char readUtf8(std::string_view s, size_t i) {
  if (i >= s.size()) return {};
  const unsigned char c = static_cast<unsigned char>(s[i]);
  if (c < 0x80) return {c, 1, true};
  constexpr Utf8Char kNotUtf8{0xFFFD, 1, false};
  size_t n;
  char32_t min;
  if ((c & 0xE0) == 0xC0) {
    n = 2, min = 0x80;
  } else if ((c & 0xF0) == 0xE0) {
    n = 3, min = 0x800;
  } else if ((c & 0xF8) == 0xF0) {
    n = 4, min = 0x10000;
  } else {
    return kNotUtf8;  // a continuation byte, or 0xF8 to 0xFF
  }
  if (n > s.size() - i) return kNotUtf8;
  char32_t cp = c & (0xFFu >> (n + 1));
  for (size_t k = 1; k < n; ++k) {
    const unsigned char cc = static_cast<unsigned char>(s[i + k]);
    if ((cc & 0xC0) != 0x80) return kNotUtf8;
    cp = (cp << 6) | (cc & 0x3F);
  }
  // Overlong forms, surrogates and values past U+10FFFF are not UTF-8.
  if (cp < min || cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF)) return kNotUtf8;
  return {cp, n, true};
}

size_t printableAsciiPrefix(std::string_view s) {
  // Eight bytes a step. In each word, a byte below 0x20 sets its top bit in
  // (w - 0x20..20) & ~w, and one above 0x7E in (w + 0x01..01) | w; a borrow
  // or carry out of a byte so marked may mark the next as well, but none
  // marks a word that holds no such byte. The bytes loop finds which it is.
  constexpr uint64_t kOnes = 0x0101010101010101u, kTops = 0x8080808080808080u;
  size_t i = 0;
  for (; s.size() - i >= 8; i += 8) {
    uint64_t w;
    std::memcpy(&w, s.data() + i, 8);
    if ((((w - kOnes * 0x20) & ~w) | ((w + kOnes) | w)) & kTops) break;
  }
  while (i < s.size() && static_cast<unsigned char>(s[i]) >= 0x20 && static_cast<unsigned char>(s[i]) <= 0x7E) ++i;
  return i;
}

size_t findInvalidUtf8(std::string_view s) {
  for (size_t i = 0; i < s.size();) {
    i += printableAsciiPrefix(s.substr(i));
    if (i == s.size()) break;
    if (static_cast<unsigned char>(s[i]) < 0x80) {
      ++i;  // a TAB or another control byte: ASCII, so UTF-8
      continue;
    }
    const Utf8Char c = readUtf8(s, i);
    if (!c.valid) return i;
    i += c.length;
  }
  return std::string_view::npos;
}

std::string encodeUtf8(char32_t c) {
  std::string out;
  if (c < 0x80) {
    out += static_cast<char>(c);
  } else if (c < 0x800) {
    out += static_cast<char>(0xC0 | (c >> 6));
    out += static_cast<char>(0x80 | (c & 0x3F));
  } else if (c < 0x10000) {
    out += static_cast<char>(0xE0 | (c >> 12));
    out += static_cast<char>(0x80 | ((c >> 6) & 0x3F));
    out += static_cast<char>(0x80 | (c & 0x3F));
  } else {
    out += static_cast<char>(0xF0 | (c >> 18));
    out += static_cast<char>(0x80 | ((c >> 12) & 0x3F));
    out += static_cast<char>(0x80 | ((c >> 6) & 0x3F));
    out += static_cast<char>(0x80 | (c & 0x3F));
  }
  return out;
}

namespace {
struct LookAlike {
  char32_t cp;
  char ascii;
  const char* name;
};
const LookAlike kLookAlikes[] = {
    {0x2212, '-', "MINUS SIGN"},
    {0x2013, '-', "EN DASH"},
    {0x2014, '-', "EM DASH"},
    {0x2010, '-', "HYPHEN"},
    {0x00A0, ' ', "NO-BREAK SPACE"},
    {0x2009, ' ', "THIN SPACE"},
    {0x202F, ' ', "NARROW NO-BREAK SPACE"},
    {0x2018, '\'', "LEFT SINGLE QUOTATION MARK"},
    {0x2019, '\'', "RIGHT SINGLE QUOTATION MARK"},
    {0x201C, '"', "LEFT DOUBLE QUOTATION MARK"},
    {0x201D, '"', "RIGHT DOUBLE QUOTATION MARK"},
    {0xFF08, '(', "FULLWIDTH LEFT PARENTHESIS"},
    {0xFF09, ')', "FULLWIDTH RIGHT PARENTHESIS"},
    {0xFF1D, '=', "FULLWIDTH EQUALS SIGN"},
    {0x0430, 'a', "CYRILLIC SMALL LETTER A"},
    {0x0435, 'e', "CYRILLIC SMALL LETTER IE"},
    {0x043E, 'o', "CYRILLIC SMALL LETTER O"},
    {0x0441, 'c', "CYRILLIC SMALL LETTER ES"},
    {0x0440, 'p', "CYRILLIC SMALL LETTER ER"},
    {0x0445, 'x', "CYRILLIC SMALL LETTER HA"},
    {0x043C, 'm', "CYRILLIC SMALL LETTER EM"},
    {0x041C, 'M', "CYRILLIC CAPITAL LETTER EM"},
    {0x041D, 'H', "CYRILLIC CAPITAL LETTER EN"},
    {0x0410, 'A', "CYRILLIC CAPITAL LETTER A"},
    {0x0412, 'B', "CYRILLIC CAPITAL LETTER VE"},
    {0x0415, 'E', "CYRILLIC CAPITAL LETTER IE"},
    {0x041A, 'K', "CYRILLIC CAPITAL LETTER KA"},
    {0x041E, 'O', "CYRILLIC CAPITAL LETTER O"},
    {0x0420, 'P', "CYRILLIC CAPITAL LETTER ER"},
    {0x0421, 'C', "CYRILLIC CAPITAL LETTER ES"},
    {0x0422, 'T', "CYRILLIC CAPITAL LETTER TE"},
    {0x0425, 'X', "CYRILLIC CAPITAL LETTER HA"},
    {0x039D, 'N', "GREEK CAPITAL LETTER NU"},
    {0x039A, 'K', "GREEK CAPITAL LETTER KAPPA"},
    {0x039C, 'M', "GREEK CAPITAL LETTER MU"},
    {0x0391, 'A', "GREEK CAPITAL LETTER ALPHA"},
    {0x03BF, 'o', "GREEK SMALL LETTER OMICRON"},
};
}  // namespace

std::string describeCodePoint(char32_t c) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "U+%04X", static_cast<unsigned>(c));
  std::string out = buf;
  for (const LookAlike& l : kLookAlikes)
    if (l.cp == c) return out + " " + l.name;
  if (c == 0xFFFD) return out + " REPLACEMENT CHARACTER";  // what readUtf8 gives for bytes that are not UTF-8
  if (c >= 0xFF01 && c <= 0xFF5E) return out + " FULLWIDTH FORM";
  return out;
}

char asciiLookAlike(char32_t c) {
  for (const LookAlike& l : kLookAlikes)
    if (l.cp == c) return l.ascii;
  if (c >= 0xFF01 && c <= 0xFF5E) return static_cast<char>(c - 0xFF01 + 0x21);
  return 0;
}

bool isGreekLetter(char32_t c) {
  return (c >= 0x0391 && c <= 0x03A9 && c != 0x03A2) || (c >= 0x03B1 && c <= 0x03C9);
}

}  // namespace calctrail
