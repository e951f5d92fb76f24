// The scans over a whole worksheet that skip a word or a memchr at a time
// (printableAsciiPrefix, findInvalidUtf8, findControlChar, SourceFile's line
// starts, the line limit of checkSourceLimits), each compared with a plain
// byte-at-a-time reference over many texts: every byte value at every
// position of a word, runs across word boundaries, CR and LF placements.
#include <catch2/catch.hpp>

#include <cstdint>
#include <random>
#include <string>
#include <vector>

#include "engine/sheet/control_chars.h"
#include "engine/sheet/source_file.h"
#include "engine/util/utf8.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::tempDir;
using calctrail::test::writeFile;

namespace {

size_t referencePrintablePrefix(std::string_view s) {
  size_t i = 0;
  while (i < s.size() && static_cast<unsigned char>(s[i]) >= 0x20 && static_cast<unsigned char>(s[i]) <= 0x7E) ++i;
  return i;
}

size_t referenceInvalidUtf8(std::string_view s) {
  for (size_t i = 0; i < s.size();) {
    const Utf8Char c = readUtf8(s, i);
    if (!c.valid) return i;
    i += c.length;
  }
  return std::string_view::npos;
}

size_t referenceControlChar(std::string_view s, size_t* length) {
  for (size_t i = 0; i < s.size(); ++i) {
    const unsigned char c = static_cast<unsigned char>(s[i]);
    if ((c < 0x20 && c != '\t') || c == 0x7F) {
      *length = 1;
      return i;
    }
    if (c == 0xC2 && i + 1 < s.size() && static_cast<unsigned char>(s[i + 1]) >= 0x80 &&
        static_cast<unsigned char>(s[i + 1]) <= 0x9F) {
      *length = 2;
      return i;
    }
  }
  return std::string_view::npos;
}

// Every scan against its reference over `s` and each of its suffixes.
void compareScans(const std::string& s) {
  for (size_t from = 0; from <= s.size(); ++from) {
    const std::string_view v = std::string_view(s).substr(from);
    INFO("text of " << s.size() << " bytes from " << from);
    REQUIRE(printableAsciiPrefix(v) == referencePrintablePrefix(v));
    REQUIRE(findInvalidUtf8(v) == referenceInvalidUtf8(v));
    size_t fast_length = 0, reference_length = 0;
    REQUIRE(findControlChar(v, &fast_length) == referenceControlChar(v, &reference_length));
    REQUIRE(fast_length == reference_length);
  }
}

}  // namespace

TEST_CASE("the word-at-a-time scans agree with byte-at-a-time ones for every byte at every place",
          "[utf8][control][byte_scans]") {
  // One odd byte in a run of printable ASCII, at each position of two words and past them.
  for (int b = 0; b < 256; ++b) {
    for (size_t at = 0; at < 20; ++at) {
      std::string s(20, 'a');
      s[at] = static_cast<char>(b);
      compareScans(s);
    }
  }
  // The edges of the printable range next to each other, and multi-byte characters
  // (valid, cut short, C1 controls) across the boundary of a word.
  const std::vector<std::string> pieces = {" ", "~", "\x7F", "\x1F", "\t", "\xC2\x85", "\xC2\xA0", "\xC3\xA9",
                                           "\xE2\x88\x92", "\xF0\x9F\x98\x80", "\xE2\x88", "\xC2", "\x80", "\xFF",
                                           "\r", "\n", std::string(1, '\0')};
  for (const std::string& p : pieces) {
    for (const std::string& q : pieces) {
      for (size_t pad = 0; pad < 10; ++pad) compareScans(std::string(pad, 'x') + p + q + std::string(9, 'y'));
    }
  }
}

TEST_CASE("the word-at-a-time scans agree with byte-at-a-time ones on random texts", "[utf8][control][byte_scans]") {
  std::mt19937 random(20261204);
  // Mostly printable ASCII, as worksheets are, with now and then any byte at all.
  std::uniform_int_distribution<int> printable(0x20, 0x7E), any(0, 255), odds(0, 15);
  for (int round = 0; round < 300; ++round) {
    std::string s(static_cast<size_t>(round % 70), ' ');
    for (char& c : s) c = static_cast<char>(odds(random) == 0 ? any(random) : printable(random));
    compareScans(s);
  }
}

TEST_CASE("line starts found with memchr are those of a byte-at-a-time count", "[sheet][source][byte_scans]") {
  const std::vector<std::string> texts = {"", "\n", "\n\n", "a", "a\n", "a\nb", "a\r\nb\r\n", "\n\nabc\n\n\nd",
                                          std::string(100, '\n'), "x = 1\n" + std::string(70, 'y') + "\nz"};
  for (const std::string& text : texts) {
    const SourceFile file("t.calc", text);
    std::vector<uint32_t> expected = {0};
    for (uint32_t i = 0; i < text.size(); ++i)
      if (text[i] == '\n' && i + 1 < text.size()) expected.push_back(i + 1);
    REQUIRE(file.lineCount() == static_cast<int>(expected.size()));
    for (size_t k = 0; k < expected.size(); ++k) CHECK(file.lineStart(static_cast<int>(k) + 1) == expected[k]);
  }
}

TEST_CASE("the line limit counts the bytes since a line's start or its last CR, as a byte count does",
          "[sheet][source][byte_scans]") {
  // The reference: the first line (1-based, LF-numbered) whose run between LF and CR passes the limit, or 0.
  const auto referenceLongLine = [](const std::string& s) {
    int line = 1;
    size_t run = 0;
    for (char c : s) {
      if (c == '\n') {
        ++line;
        run = 0;
      } else if (c == '\r') {
        run = 0;
      } else if (++run > kMaxLineBytes) {
        return line;
      }
    }
    return 0;
  };
  const std::string at_limit(kMaxLineBytes, 'x');
  const std::vector<std::string> texts = {
      at_limit,
      at_limit + "x",
      "a\n" + at_limit + "\nb",
      "a\n" + at_limit + "x\nb",
      at_limit + "\r" + at_limit,
      at_limit + "\r" + at_limit + "x",
      at_limit + "\r\n" + at_limit + "\r\n",
      "\r" + at_limit + "x",
      std::string(kMaxLineBytes / 2, 'x') + "\r" + std::string(kMaxLineBytes / 2 + 1, 'x') + "\n" + at_limit,
      "a\nb\n\n" + std::string(kMaxLineBytes - 1, 'x') + "\r\r" + at_limit + "x",
  };
  for (const std::string& text : texts) {
    ReadError error;
    const int expected = referenceLongLine(text);
    INFO("text of " << text.size() << " bytes, the reference says line " << expected);
    CHECK(checkSourceLimits(text, "the file", &error) == (expected == 0));
    CHECK(error.line == expected);
  }
  // Read from a file, the text comes in pieces of 64 KiB: a line and a CR's run
  // go on from one piece into the next.
  const std::string dir = tempDir();
  const std::vector<std::string> across = {
      std::string(60000, 'x') + "\r" + std::string(10000, 'x') + "\n" + at_limit,
      std::string(60000, 'x') + "\r" + std::string(kMaxLineBytes, 'x') + "\n",
      std::string(60000, 'x') + "\r" + std::string(kMaxLineBytes + 1, 'x') + "\n",
      "a\n" + std::string(65530, 'x') + "\r\n" + at_limit + "x",
  };
  for (const std::string& text : across) {
    writeFile(dir + "/t.calc", text);
    std::string bytes;
    ReadError error;
    const int expected = referenceLongLine(text);
    INFO("file of " << text.size() << " bytes, the reference says line " << expected);
    CHECK(readFile(dir + "/t.calc", &bytes, &error) == (expected == 0));
    CHECK(error.line == expected);
  }
}
