#include "engine/util/json_writer.h"

#include <algorithm>
#include <cmath>
#include <iterator>

#include "engine/util/exact_number.h"

namespace calctrail {

namespace {
void append(fmt::memory_buffer& out, std::string_view s) { out.append(s.data(), s.data() + s.size()); }
}  // namespace

void JsonWriter::escapeTo(fmt::memory_buffer& out, std::string_view s) {
  out.push_back('"');
  // Runs of bytes written as they are go in at once, between the escapes.
  size_t run = 0;
  for (size_t i = 0; i < s.size(); ++i) {
    const char c = s[i];
    const auto byte = static_cast<unsigned char>(c);
    if (c != '"' && c != '\\' && byte >= 0x20) continue;
    append(out, s.substr(run, i - run));
    run = i + 1;
    switch (c) {
      case '"': append(out, "\\\""); break;
      case '\\': append(out, "\\\\"); break;
      case '\n': append(out, "\\n"); break;
      case '\r': append(out, "\\r"); break;
      case '\t': append(out, "\\t"); break;
      default: fmt::format_to(std::back_inserter(out), "\\u{:04x}", byte);
    }
  }
  append(out, s.substr(run));
  out.push_back('"');
}

std::string JsonWriter::escape(std::string_view s) {
  fmt::memory_buffer out;
  escapeTo(out, s);
  return fmt::to_string(out);
}

void JsonWriter::newline() {
  out_->push_back('\n');
  const size_t at = out_->size(), n = first_.size() * 2;  // two spaces a level
  out_->resize(at + n);
  std::fill_n(out_->data() + at, n, ' ');
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
  fmt::format_to(std::back_inserter(*out_), "{}", i);
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
