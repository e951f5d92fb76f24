// The JSON writer (engine/util/json_writer.h) on its own: escaping of every
// control byte and of non-ASCII text, nesting and layout, numbers.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cfloat>
#include <cmath>
#include <random>

#include <nlohmann/json.hpp>

#include "engine/util/json_writer.h"
#include "engine/study/json_reader.h"
#include "tests/json_reader.h"

using namespace calctrail;
using namespace calctrail::test;

TEST_CASE("JSON writer: every control byte is escaped, and reads back", "[json_writer]") {
  for (int b = 0; b < 0x20; ++b) {
    const std::string s(1, static_cast<char>(b));
    const std::string e = JsonWriter::escape(s);
    INFO("byte " << b << ": " << e);
    if (b == '\n') CHECK(e == "\"\\n\"");
    else if (b == '\r') CHECK(e == "\"\\r\"");
    else if (b == '\t') CHECK(e == "\"\\t\"");
    else CHECK(e == fmt::format("\"\\u{:04x}\"", b));
    Json j;
    std::string error;
    REQUIRE(parseJson(e, &j, &error));
    CHECK(j.string == s);
  }
  CHECK(JsonWriter::escape("a\"b\\c/d") == "\"a\\\"b\\\\c/d\"");
  CHECK(JsonWriter::escape("") == "\"\"");
  CHECK(JsonWriter::escape(std::string("nul\0byte", 8)) == "\"nul\\u0000byte\"");
}

TEST_CASE("JSON writer: non-ASCII text and DEL pass through as UTF-8", "[json_writer]") {
  const std::string s = "\u03C3_vm \u00B7 N\u00B7m \u2264 20 \u00B0C \u20AC \U0001F600 \x7F";
  CHECK(JsonWriter::escape(s) == "\"" + s + "\"");
}

TEST_CASE("JSON writer: nesting, empty containers and layout", "[json_writer]") {
  JsonWriter w;
  w.beginObject();
  w.key("a").value(1);
  w.key("list").beginArray();
  w.value("x").value(true).null();
  w.beginObject().key("deep").beginArray().endArray().endObject();
  w.endArray();
  w.key("empty").beginObject().endObject();
  w.endObject();
  CHECK(w.str() ==
        "{\n"
        "  \"a\": 1,\n"
        "  \"list\": [\n"
        "    \"x\",\n"
        "    true,\n"
        "    null,\n"
        "    {\n"
        "      \"deep\": []\n"
        "    }\n"
        "  ],\n"
        "  \"empty\": {}\n"
        "}\n");
  Json j;
  std::string error;
  REQUIRE(parseJson(w.str(), &j, &error));
  CHECK(j["list"][3]["deep"].type == Json::Array);
}

TEST_CASE("JSON writer: numbers at full precision, null for what JSON cannot hold", "[json_writer]") {
  JsonWriter w;
  w.beginArray();
  const double nan = std::nan(""), inf = HUGE_VAL;
  for (double d : {0.1, 12000.0, -0.0, 1e-300, DBL_MAX, 5e-324, 26.18, nan, inf, -inf}) w.value(d);
  w.value(-7).value(false);
  w.endArray();
  CHECK(w.str() ==
        "[\n  0.1,\n  12000,\n  -0.0,\n  1e-300,\n  1.7976931348623157e+308,\n  5e-324,\n  26.18,\n"
        "  null,\n  null,\n  null,\n  -7,\n  false\n]\n");
}

TEST_CASE("JSON writer: appends to a caller's sink", "[json_writer]") {
  fmt::memory_buffer sink;
  fmt::format_to(std::back_inserter(sink), "before ");
  JsonWriter w(sink);
  w.beginObject().key("k").value("v").endObject();
  CHECK(fmt::to_string(sink) == "before {\n  \"k\": \"v\"\n}\n");
  CHECK(w.str() == fmt::to_string(sink));
}

TEST_CASE("JSON writer: -0 keeps its sign through nlohmann-json and both readers", "[json_writer]") {
  JsonWriter w;
  w.beginArray().value(-0.0).value(0.0).value(-5e-324).endArray();
  // What nlohmann does with a bare -0 (the reason the writer does not write one):
  // the integer 0, without a sign.
  const nlohmann::json bare = nlohmann::json::parse("-0");
  CHECK(bare.is_number_integer());
  CHECK_FALSE(std::signbit(bare.get<double>()));
  const nlohmann::json j = nlohmann::json::parse(w.str());
  REQUIRE(j.size() == 3);
  CHECK(j[0].is_number_float());
  CHECK(j[0].get<double>() == 0.0);
  CHECK(std::signbit(j[0].get<double>()));
  CHECK_FALSE(std::signbit(j[1].get<double>()));
  CHECK(j[2].get<double>() == -5e-324);
  // The tests' reader and sweep --merge's reader read it back the same way.
  Json t;
  std::string error;
  REQUIRE(parseJson(w.str(), &t, &error));
  CHECK(std::signbit(t[0].number));
  CHECK_FALSE(std::signbit(t[1].number));
  calctrail::JsonValue v;
  REQUIRE(calctrail::parseJsonText(w.str(), &v, &error));
  CHECK(std::signbit(v.array.at(0).number));
  CHECK_FALSE(std::signbit(v.array.at(1).number));
}

// The escaper reads eight bytes at a time; this is the plain definition it
// must agree with, a byte at a time.
static std::string escapedByteByByte(const std::string& s) {
  std::string out = "\"";
  for (const char c : s) {
    const auto byte = static_cast<unsigned char>(c);
    if (c == '"') out += "\\\"";
    else if (c == '\\') out += "\\\\";
    else if (c == '\n') out += "\\n";
    else if (c == '\r') out += "\\r";
    else if (c == '\t') out += "\\t";
    else if (byte < 0x20) out += fmt::format("\\u{:04x}", byte);
    else out += c;
  }
  return out + "\"";
}

TEST_CASE("JSON writer: the word-at-a-time escaper agrees with a byte at a time", "[json_writer]") {
  // Every byte value at every place of strings 0 to 19 bytes long: in the
  // first word, across a word's end, in the short tail.
  for (size_t length = 0; length < 20; ++length)
    for (size_t at = 0; at < std::max<size_t>(length, 1); ++at)
      for (int b = 0; b < 256; ++b) {
        std::string s(length, 'a');
        if (length > 0) s[at] = static_cast<char>(b);
        INFO("length " << length << ", byte " << b << " at " << at);
        REQUIRE(JsonWriter::escape(s) == escapedByteByByte(s));
      }
  // Random text of every byte value, and of bytes near the escaped ones
  // (0x00, 0x1F, 0x20, 0x21, 0x22, 0x5B, 0x5C, 0x5D, 0x7F, 0x80, 0xFF).
  std::mt19937 random(12345);
  const std::string near("\x00\x1f\x20\x21\x22\x5b\x5c\x5d\x7f\x80\xff", 11);
  for (int k = 0; k < 3000; ++k) {
    std::string s(random() % 70, ' ');
    for (char& c : s)
      c = k % 2 ? static_cast<char>(random() % 256) : near[random() % near.size()];
    INFO("case " << k);
    REQUIRE(JsonWriter::escape(s) == escapedByteByByte(s));
  }
}
