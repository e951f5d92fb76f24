// engine/eval/arithmetic.cc: the parser reads the compiled text's numbers
// itself (readNumber, std::from_chars) instead of with muparser's string
// stream. Every number the compiler writes (the shortest text that round-trips,
// std::to_chars, engine/eval/program.cc; "%.17g" before) must read back as the
// same double, and as the stream reads it.
#include <catch2/catch.hpp>

#include <charconv>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <limits>
#include <locale>
#include <random>
#include <sstream>
#include <string>

#include "engine/eval/arithmetic.h"

using namespace calctrail;

namespace {

std::string written(double v) {
  char buf[40];
  const std::to_chars_result r = std::to_chars(buf, buf + sizeof buf, v);  // as program.cc writes a literal
  return std::string(buf, r.ptr);
}

// The form the compiler wrote before, which must read back the same too.
std::string written17(double v) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.17g", v);
  return buf;
}

// The value of `text` as one program over v0 = 1.
double run(const std::string& text) {
  Program p;
  p.text = text;
  p.inputs = {0};
  double one = 1;
  double* addresses[1] = {&one};
  LibraryCallStore store;
  ArithmeticParser parser;
  parser.set(p, addresses, &store);
  return parser.eval();
}

// What muparser's own reader (mu::Parser::IsVal) gives: a classic-locale stream.
double streamed(const std::string& text) {
  std::istringstream in(text);
  in.imbue(std::locale::classic());
  double v = NAN;
  in >> v;
  return v;
}

bool sameBits(double a, double b) {
  return std::memcmp(&a, &b, sizeof a) == 0;
}

}  // namespace

TEST_CASE("arithmetic: every literal the compiler writes reads back as the same double", "[arithmetic]") {
  const double edges[] = {0.0,
                          1.0,
                          0.1,
                          9.80665,
                          2.0 * 3.14159265358979323846,
                          1e-300,
                          1.7976931348623157e308,
                          std::numeric_limits<double>::min(),
                          std::numeric_limits<double>::denorm_min(),
                          4.9406564584124654e-320,
                          123456789012345678.0,
                          0.30000000000000004};
  for (double v : edges) {
    for (const std::string& text : {written(v), written17(v)}) {
      INFO(text);
      CHECK(sameBits(run("(v0*" + text + ")"), v));
      CHECK(sameBits(run("(v0*" + text + ")"), streamed(text)));
    }
  }
  std::mt19937_64 gen(20261203);
  std::uniform_int_distribution<uint64_t> bits;
  int checked = 0;
  while (checked < 2000) {
    const uint64_t b = bits(gen);
    double v;
    std::memcpy(&v, &b, sizeof v);
    if (!std::isfinite(v) || v < 0) continue;  // the compiler writes a negative as (-x): see below
    for (const std::string& text : {written(v), written17(v)}) {
      INFO(text);
      REQUIRE(sameBits(run(text + "*v0"), v));
      REQUIRE(sameBits(v, streamed(text)));
    }
    ++checked;
  }
}

TEST_CASE("arithmetic: signs, exponents and names around a literal", "[arithmetic]") {
  CHECK(run("(-2.5)*v0") == -2.5);  // a negative literal as the compiler writes it
  CHECK(run("(v0*(-1.0000000000000001e-05))") == -1.0000000000000001e-05);
  CHECK(run("2e+05*v0") == 2e5);
  CHECK(run("1.5E3*v0") == 1500);
  CHECK(run("v0+2") == 3);  // a name is no number
  CHECK(run("-v0") == -1);  // unary minus
  CHECK(run("+v0") == 1);   // unary plus
  CHECK(run("2^3*v0") == 8);
  CHECK(run("v0/4") == 0.25);
  CHECK_THROWS(run("1e*v0"));     // the stream refuses "1e" as well
  CHECK_THROWS(run("1e999*v0"));  // out of range: refused, as by the stream
}
