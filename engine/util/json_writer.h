// A small streaming JSON writer: correct escaping, full-precision numbers,
// stable key order (the order they are written in), two-space indentation.
// It writes into a fmt::memory_buffer: its own, or a caller's sink.
#pragma once

#include <string>
#include <string_view>

#include <fmt/format.h>

namespace calctrail {

class JsonWriter {
 public:
  JsonWriter() : out_(&own_) {}
  // Appends to `sink` instead of a buffer of its own.
  explicit JsonWriter(fmt::memory_buffer& sink) : out_(&sink) {}
  JsonWriter(const JsonWriter&) = delete;
  JsonWriter& operator=(const JsonWriter&) = delete;

  JsonWriter& beginObject();
  JsonWriter& endObject();
  JsonWriter& beginArray();
  JsonWriter& endArray();
  JsonWriter& key(std::string_view k);
  JsonWriter& value(std::string_view s);
  JsonWriter& value(const char* s) { return value(std::string_view(s)); }
  JsonWriter& value(const std::string& s) { return value(std::string_view(s)); }
  JsonWriter& value(double d);  // shortest round-trip text (formatExact), -0.0 for -0; null for NaN/inf
  JsonWriter& value(int i);
  JsonWriter& value(bool b);
  JsonWriter& null();

  // Everything written so far.
  std::string str() const { return fmt::to_string(*out_); }

  // `s` as a JSON string, with the quotes: " \ and every control byte
  // (U+0000..U+001F) escaped, everything else (UTF-8 included) as it is.
  // The one JSON escaper of the program (function docs use it too).
  static std::string escape(std::string_view s);
  static void escapeTo(fmt::memory_buffer& out, std::string_view s);

 private:
  void beforeValue();
  void newline();
  void open(char bracket);   // { or [
  void close(char bracket);  // } or ]
  fmt::memory_buffer own_;   // the output when no sink is given
  fmt::memory_buffer* out_;  // where the text goes: own_ or the caller's sink
  size_t depth_ = 0;         // containers open
  bool first_ = true;        // the innermost open container has no member yet
  bool after_key_ = false;   // a key was written: the value follows on its line
};

}  // namespace calctrail
