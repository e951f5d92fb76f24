// The XML escaper (engine/report/xml_escape.h): it writes runs of bytes at
// once; this is the plain definition it must agree with, a byte at a time.
#include <catch2/catch.hpp>

#include <random>
#include <string>

#include "engine/report/xml_escape.h"

using namespace calctrail;

static std::string escapedByteByByte(const std::string& s) {
  std::string out;
  for (const char c : s) {
    if (c == '&') out += "&amp;";
    else if (c == '<') out += "&lt;";
    else if (c == '>') out += "&gt;";
    else if (c == '"') out += "&quot;";
    else if (c == '\'') out += "&#39;";
    else out += c;
  }
  return out;
}

TEST_CASE("XML escaper: the five characters, and every other byte as it is", "[xml_escape]") {
  CHECK(escapeXml("") == "");
  CHECK(escapeXml("a<b & c>'d'\"") == "a&lt;b &amp; c&gt;&#39;d&#39;&quot;");
  CHECK(escapeXml("\u03C3 \u2264 20 \u00B0C") == "\u03C3 \u2264 20 \u00B0C");
  // Every byte value at the start, the middle and the end of a string.
  for (int b = 0; b < 256; ++b)
    for (const size_t at : {0, 3, 6}) {
      std::string s = "abc@de?";
      s[at] = static_cast<char>(b);
      INFO("byte " << b << " at " << at);
      REQUIRE(escapeXml(s) == escapedByteByByte(s));
    }
  std::mt19937 random(2024);
  for (int k = 0; k < 2000; ++k) {
    std::string s(random() % 60, ' ');
    for (char& c : s) c = static_cast<char>(random() % 256);
    INFO("case " << k);
    REQUIRE(escapeXml(s) == escapedByteByByte(s));
  }
}
