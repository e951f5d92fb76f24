// engine/util/utf8: validation, decoding and encoding at every length, and
// the names of the look-alike characters an error message shows. readUtf8 is
// the one decoder (the unit parser, the HTML renderer and the name lexer call
// it); its verdicts are checked against the well-formed byte sequences of the
// Unicode Standard, chapter 3, Table 3-7 (from memory), written out
// independently below, and against the examples of Markus Kuhn's UTF-8 decoder
// capability and stress test (from memory).
#include "engine/util/utf8.h"

#include <catch2/catch.hpp>
#include <ostream>
#include <string>
#include <vector>

#include "tests/test_support.h"

using namespace calctrail;

namespace {

// Table 3-7 of the Unicode Standard, row by row: the length of the
// well-formed sequence at the start of b[0..n), or 0 when it is ill-formed.
size_t wellFormedLength(const unsigned char* b, size_t n) {
  const auto in = [&](size_t k, unsigned lo, unsigned hi) { return k < n && b[k] >= lo && b[k] <= hi; };
  if (in(0, 0x00, 0x7F)) return 1;
  if (in(0, 0xC2, 0xDF)) return in(1, 0x80, 0xBF) ? 2 : 0;
  if (in(0, 0xE0, 0xE0)) return in(1, 0xA0, 0xBF) && in(2, 0x80, 0xBF) ? 3 : 0;
  if (in(0, 0xE1, 0xEC) || in(0, 0xEE, 0xEF)) return in(1, 0x80, 0xBF) && in(2, 0x80, 0xBF) ? 3 : 0;
  if (in(0, 0xED, 0xED)) return in(1, 0x80, 0x9F) && in(2, 0x80, 0xBF) ? 3 : 0;
  if (in(0, 0xF0, 0xF0)) return in(1, 0x90, 0xBF) && in(2, 0x80, 0xBF) && in(3, 0x80, 0xBF) ? 4 : 0;
  if (in(0, 0xF1, 0xF3)) return in(1, 0x80, 0xBF) && in(2, 0x80, 0xBF) && in(3, 0x80, 0xBF) ? 4 : 0;
  if (in(0, 0xF4, 0xF4)) return in(1, 0x80, 0x8F) && in(2, 0x80, 0xBF) && in(3, 0x80, 0xBF) ? 4 : 0;
  return 0;
}

struct Read {
  char32_t cp;
  size_t length;
  bool valid;
};

Read read(const std::string& s, size_t i = 0) {
  const Utf8Char c = readUtf8(s, i);
  return {c.cp, c.length, c.valid};
}

bool operator==(const Read& a, const Read& b) { return a.cp == b.cp && a.length == b.length && a.valid == b.valid; }

std::ostream& operator<<(std::ostream& os, const Read& r) {
  return os << "{U+" << std::hex << static_cast<unsigned>(r.cp) << std::dec << ", " << r.length << ", "
            << (r.valid ? "valid" : "not UTF-8") << "}";
}

const Read kBad{0xFFFD, 1, false};

}  // namespace

TEST_CASE("utf8: readUtf8 reads the first and last code point of every length", "[utf8]") {
  CHECK(read(std::string(1, '\0')) == Read{0x0000, 1, true});
  CHECK(read("\x7F") == Read{0x007F, 1, true});
  CHECK(read("\xC2\x80") == Read{0x0080, 2, true});
  CHECK(read("\xDF\xBF") == Read{0x07FF, 2, true});
  CHECK(read("\xE0\xA0\x80") == Read{0x0800, 3, true});
  CHECK(read("\xED\x9F\xBF") == Read{0xD7FF, 3, true});  // the last before the surrogates
  CHECK(read("\xEE\x80\x80") == Read{0xE000, 3, true});  // the first after them
  CHECK(read("\xEF\xBF\xBD") == Read{0xFFFD, 3, true});  // a real U+FFFD is valid
  CHECK(read("\xEF\xBF\xBF") == Read{0xFFFF, 3, true});
  CHECK(read("\xF0\x90\x80\x80") == Read{0x10000, 4, true});
  CHECK(read("\xF4\x8F\xBF\xBF") == Read{0x10FFFF, 4, true});
  CHECK(read("d\xCE\xBC=", 1) == Read{0x03BC, 2, true});  // mu, inside a text
}

TEST_CASE("utf8: overlong forms, surrogates and values past U+10FFFF are one bad byte each", "[utf8]") {
  for (const char* bytes : {"\xC0\xAF", "\xC1\xBF", "\xE0\x80\xAF", "\xE0\x9F\xBF",  // overlong
                            "\xF0\x80\x80\xAF", "\xF0\x8F\xBF\xBF"}) {
    INFO(bytes);
    CHECK(read(bytes) == kBad);
    CHECK(findInvalidUtf8(bytes) == 0);
  }
  for (const char* bytes : {"\xED\xA0\x80", "\xED\xAD\xBF", "\xED\xB0\x80", "\xED\xBF\xBF"}) {  // surrogates
    INFO(bytes);
    CHECK(read(bytes) == kBad);
  }
  for (const char* bytes : {"\xF4\x90\x80\x80", "\xF7\xBF\xBF\xBF",  // U+110000, U+1FFFFF
                            "\xF8\x88\x80\x80\x80", "\xFC\x84\x80\x80\x80\x80",   // the old 5- and 6-byte forms
                            "\xFE", "\xFF"}) {
    INFO(bytes);
    CHECK(read(bytes) == kBad);
  }
}

TEST_CASE("utf8: a cut-short sequence or a wrong continuation byte is one bad byte", "[utf8]") {
  // Truncated by the end of the text, at every length.
  for (const char* bytes : {"\xC3", "\xE2\x88", "\xE2", "\xF0\x9F\x94", "\xF0\x9F", "\xF0"}) {
    INFO(bytes);
    CHECK(read(bytes) == kBad);
  }
  // A byte that does not continue the sequence: the reader steps over the
  // lead byte alone, and reads what follows as itself.
  CHECK(read("\xC3(") == kBad);
  CHECK(read("\xC3(", 1) == Read{'(', 1, true});
  CHECK(read("\xE2(\xA1") == kBad);
  CHECK(read("\xE2\x82(") == kBad);
  CHECK(read("\xF0(\x8C\xBC") == kBad);
  CHECK(read("\xF0\x90(\xBC") == kBad);
  CHECK(read("\xF0\x90\x8C(") == kBad);
  CHECK(read("\xC3\xC3\xA9") == kBad);  // a lead byte where a continuation belongs
  CHECK(read("\xC3\xC3\xA9", 1) == Read{0xE9, 2, true});
  // Lone continuation bytes.
  CHECK(read("\x80") == kBad);
  CHECK(read("\xBF") == kBad);
  // Past the end: nothing, and no step.
  CHECK(read("ab", 2) == Read{0, 0, false});
  CHECK(read("", 0) == Read{0, 0, false});
}

TEST_CASE("utf8: readUtf8 agrees with Table 3-7 on every lead and second byte", "[utf8]") {
  // Every first and second byte, with third and fourth bytes at the edges of
  // the continuation range and just outside it: 2.4M sequences.
  const unsigned char edges[] = {0x00, 0x7F, 0x80, 0x8F, 0x90, 0x9F, 0xA0, 0xBF, 0xC0, 0xFF};
  size_t checked = 0, valid = 0, mismatches = 0;
  for (unsigned first = 0; first < 256; ++first) {
    for (unsigned second = 0; second < 256; ++second) {
      for (unsigned char third : edges) {
        for (unsigned char fourth : edges) {
          const unsigned char b[4] = {static_cast<unsigned char>(first), static_cast<unsigned char>(second), third,
                                      fourth};
          const std::string s(reinterpret_cast<const char*>(b), 4);
          const size_t want = wellFormedLength(b, 4);
          const Utf8Char got = readUtf8(s, 0);
          ++checked;
          bool ok = got.valid == (want > 0) && got.length == (want > 0 ? want : 1);
          if (ok && got.valid) {
            ++valid;
            ok = encodeUtf8(got.cp) == s.substr(0, want);  // the code point encodes back to the same bytes
          } else if (ok) {
            ok = got.cp == 0xFFFD;
          }
          ok = ok && (findInvalidUtf8(s.substr(0, got.valid ? want : 4)) == (got.valid ? std::string::npos : 0));
          if (!ok && ++mismatches <= 5) FAIL_CHECK("bytes " << first << " " << second << " " << int(third));
        }
      }
    }
  }
  CHECK(checked == 256u * 256u * 100u);
  CHECK(mismatches == 0);
  CHECK(valid > 0);
}

TEST_CASE("utf8: a reader that steps by readUtf8's length sees every byte once", "[utf8]") {
  // Kuhn's stress test shows that a decoder must not swallow the good text
  // after a bad byte: here an ASCII `(` after a lead byte, and a whole
  // character after a lone continuation byte.
  const std::string text = "a\xC3(\x80\xCE\xB1\xF0\x9F\x94";
  std::vector<char32_t> seen;
  for (size_t i = 0; i < text.size();) {
    const Utf8Char c = readUtf8(text, i);
    REQUIRE(c.length >= 1);
    seen.push_back(c.cp);
    i += c.length;
  }
  CHECK(seen == std::vector<char32_t>{U'a', 0xFFFD, U'(', 0xFFFD, 0x03B1, 0xFFFD, 0xFFFD, 0xFFFD});
  size_t length = 0;
  CHECK(decodeUtf8(text, 1, &length) == 0xFFFD);  // the same reading through the helper
  CHECK(length == 1);
  CHECK(decodeUtf8(text, 4, &length) == 0x03B1);
  CHECK(length == 2);
}

TEST_CASE("utf8: bytes that are not UTF-8 in a --set value are named, in valid UTF-8", "[utf8][set]") {
  // The expression parser reads --set text, which no file check has seen;
  // through readUtf8 a bad byte is U+FFFD, never a character made up of it
  // and the bytes after it.
  const std::string sheet = "F = 2 kN\nr = 0.1 m\nT [N*m] = F * r\n";
  for (const std::string& value : {std::string("\xC3( kN"), std::string("\xED\xA0\x80"),
                                   std::string("\xF8" "abc"), std::string("\xCE" "1")}) {
    INFO(value);
    const std::string d = test::diagnostics(*test::calc(sheet, {"F=" + value}));
    CHECK(d.find("error: unexpected character \xEF\xBF\xBD (U+FFFD REPLACEMENT CHARACTER)") !=
          std::string::npos);
    CHECK(findInvalidUtf8(d) == std::string::npos);
  }
  // A Greek letter is still a name there.
  CHECK(test::diagnostics(*test::calc(sheet, {"F=2*\xCE\xB1x"})).find("unknown name `\xCE\xB1x`") !=
        std::string::npos);
}

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
  CHECK(describeCodePoint(0xFFFD) == "U+FFFD REPLACEMENT CHARACTER");
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
