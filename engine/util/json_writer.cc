#include "engine/util/json_writer.h"

#include <cmath>
#include <iterator>

#include "engine/util/exact_number.h"

namespace calctrail {

void JsonWriter::escapeTo(fmt::memory_buffer& out, std::string_view s) {
  auto it = std::back_inserter(out);
  out.push_back('"');
  for (char c : s) {
    switch (c) {
      case '"': fmt::format_to(it, "\\\""); break;
      case '\\': fmt::format_to(it, "\\\\"); break;
      case '\n': fmt::format_to(it, "\\n"); break;
      case '\r': fmt::format_to(it, "\\r"); break;
      case '\t': fmt::format_to(it, "\\t"); break;
      default: {
        const auto byte = static_cast<unsigned char>(c);
        if (byte < 0x20) fmt::format_to(it, "\\u{:04x}", byte);
        else out.push_back(c);
      }
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
  out_->push_back('\n');
  fmt::format_to(std::back_inserter(*out_), "{:{}}", "", first_.size() * 2);
}

void JsonWriter::beforeValue() {
  if (after_key_) {
    after_key_ = false;
    return;
  }
  if (!first_.empty()) {
    if (!first_.back()) out_->push_back(',');
    first_.back() = false;
    newline();
  }
}

JsonWriter& JsonWriter::beginObject() {
  beforeValue();
  out_->push_back('{');
  first_.push_back(true);
  return *this;
}

JsonWriter& JsonWriter::endObject() {
  const bool empty = first_.back();
  first_.pop_back();
  if (!empty) newline();
  out_->push_back('}');
  if (first_.empty()) out_->push_back('\n');
  return *this;
}

JsonWriter& JsonWriter::beginArray() {
  beforeValue();
  out_->push_back('[');
  first_.push_back(true);
  return *this;
}

JsonWriter& JsonWriter::endArray() {
  const bool empty = first_.back();
  first_.pop_back();
  if (!empty) newline();
  out_->push_back(']');
  if (first_.empty()) out_->push_back('\n');
  return *this;
}

JsonWriter& JsonWriter::key(std::string_view k) {
  beforeValue();
  escapeTo(*out_, k);
  fmt::format_to(std::back_inserter(*out_), ": ");
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
  fmt::format_to(std::back_inserter(*out_), "{}",
                 negative_zero ? "-0.0" : std::isfinite(d) ? formatExact(d) : "null");
  return *this;
}

JsonWriter& JsonWriter::value(int i) {
  beforeValue();
  fmt::format_to(std::back_inserter(*out_), "{}", i);
  return *this;
}

JsonWriter& JsonWriter::value(bool b) {
  beforeValue();
  fmt::format_to(std::back_inserter(*out_), "{}", b ? "true" : "false");
  return *this;
}

JsonWriter& JsonWriter::null() {
  beforeValue();
  fmt::format_to(std::back_inserter(*out_), "null");
  return *this;
}

}  // namespace calctrail
