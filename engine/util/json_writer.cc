#include "engine/util/json_writer.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <cstring>

#include "engine/util/exact_number.h"

namespace calctrail {

namespace {

// A run of bytes: the buffer grown once and one memcpy (fewer instructions
// than fmt's buffer::append, by callgrind).
void append(fmt::memory_buffer& out, std::string_view s) {
  const size_t at = out.size();
  out.resize(at + s.size());
  if (!s.empty()) std::memcpy(out.data() + at, s.data(), s.size());
}

// Whether JSON needs a byte escaped: the quote, the backslash and the control
// bytes. A table, for the bytes read one at a time: a load instead of three tests.
constexpr std::array<bool, 256> kNeedsEscape = [] {
  std::array<bool, 256> table{};
  for (size_t byte = 0; byte < table.size(); ++byte) table[byte] = byte < 0x20 || byte == '"' || byte == '\\';
  return table;
}();

// Whether one of the eight bytes at `eight`, read as the word x, needs
// escaping, by the bit tests of "Bit Twiddling Hacks": with 0x01 in every
// byte (`ones`), (x - ones) & ~x has a byte's high bit set for some byte of
// x exactly when a byte of x is 0 (x ^ '"' is 0 where a byte is '"'), and
// (x - 0x20 * ones) & ~x exactly when a byte is below 0x20.
bool wordNeedsEscape(const char* eight) {
  constexpr uint64_t ones = 0x0101010101010101u, high_bits = 0x80 * ones;
  uint64_t x;
  std::memcpy(&x, eight, 8);
  const uint64_t quote = x ^ ('"' * ones), backslash = x ^ ('\\' * ones);
  const uint64_t hits = ((quote - ones) & ~quote) | ((backslash - ones) & ~backslash) | ((x - 0x20 * ones) & ~x);
  return (hits & high_bits) != 0;
}

// Where the first byte that needs escaping is in `s`, or s.size(): eight
// bytes at a time, the last ones short of a word as the last eight of `s`
// (read again in part); a word with a hit is then read a byte at a time.
size_t firstEscaped(std::string_view s) {
  size_t i = 0;
  while (i + 8 <= s.size() && !wordNeedsEscape(s.data() + i)) i += 8;
  if (i + 8 > s.size() && s.size() >= 8 && i < s.size() && !wordNeedsEscape(s.data() + s.size() - 8))
    return s.size();
  while (i < s.size() && !kNeedsEscape[static_cast<unsigned char>(s[i])]) ++i;
  return i;
}

}  // namespace

void JsonWriter::escapeTo(fmt::memory_buffer& out, std::string_view s) {
  out.push_back('"');
  // Runs of bytes written as they are go in at once, between the escapes.
  for (size_t run = 0;;) {
    const size_t i = run + firstEscaped(s.substr(run));
    append(out, s.substr(run, i - run));
    if (i == s.size()) break;
    run = i + 1;
    const char c = s[i];
    switch (c) {
      case '"': append(out, "\\\""); break;
      case '\\': append(out, "\\\\"); break;
      case '\n': append(out, "\\n"); break;
      case '\r': append(out, "\\r"); break;
      case '\t': append(out, "\\t"); break;
      default: fmt::format_to(fmt::appender(out), "\\u{:04x}", static_cast<unsigned char>(c));
    }
  }
  out.push_back('"');
}

std::string JsonWriter::escape(std::string_view s) {
  fmt::memory_buffer out;
  escapeTo(out, s);
  return fmt::to_string(out);
}

void JsonWriter::newline() {
  const size_t at = out_->size(), n = depth_ * 2;  // two spaces a level
  out_->resize(at + 1 + n);
  out_->data()[at] = '\n';
  std::memset(out_->data() + at + 1, ' ', n);
}

void JsonWriter::beforeValue() {
  if (after_key_) {
    after_key_ = false;
    return;
  }
  if (depth_ > 0) {
    if (!first_) out_->push_back(',');
    first_ = false;
    newline();
  }
}

void JsonWriter::open(char bracket) {
  beforeValue();
  out_->push_back(bracket);
  ++depth_;
  first_ = true;
}

void JsonWriter::close(char bracket) {
  const bool empty = first_;
  --depth_;
  first_ = false;  // the container just closed is a member of the one around it
  if (!empty) newline();
  out_->push_back(bracket);
  if (depth_ == 0) out_->push_back('\n');
}

JsonWriter& JsonWriter::beginObject() {
  open('{');
  return *this;
}

JsonWriter& JsonWriter::endObject() {
  close('}');
  return *this;
}

JsonWriter& JsonWriter::beginArray() {
  open('[');
  return *this;
}

JsonWriter& JsonWriter::endArray() {
  close(']');
  return *this;
}

JsonWriter& JsonWriter::key(std::string_view k) {
  beforeValue();
  escapeTo(*out_, k);
  append(*out_, ": ");
  after_key_ = true;
  return *this;
}

JsonWriter& JsonWriter::value(std::string_view s) {
  beforeValue();
  escapeTo(*out_, s);
  return *this;
}

JsonWriter& JsonWriter::value(double d) {
  beforeValue();
  // Negative zero as -0.0: JSON readers (nlohmann-json among them) read a
  // bare -0 as the integer 0 and lose the sign; -0.0 is read as the double.
  const bool negative_zero = d == 0 && std::signbit(d);
  append(*out_, negative_zero ? "-0.0" : std::isfinite(d) ? formatExact(d) : "null");
  return *this;
}

JsonWriter& JsonWriter::value(int i) {
  beforeValue();
  const fmt::format_int text(i);
  append(*out_, std::string_view(text.data(), text.size()));
  return *this;
}

JsonWriter& JsonWriter::value(bool b) {
  beforeValue();
  append(*out_, b ? "true" : "false");
  return *this;
}

JsonWriter& JsonWriter::null() {
  beforeValue();
  append(*out_, "null");
  return *this;
}

}  // namespace calctrail
