#include "engine/util/json_writer.h"

#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace calctrail {

std::string JsonWriter::escape(std::string_view s) {
  std::string out = "\"";
  for (char c : s) {
    switch (c) {
      case '"': out += "\\\""; break;
      case '\\': out += "\\\\"; break;
      case '\n': out += "\\n"; break;
      case '\r': out += "\\r"; break;
      case '\t': out += "\\t"; break;
      default:
        if (static_cast<unsigned char>(c) < 0x20) {
          char buf[8];
          std::snprintf(buf, sizeof buf, "\\u%04x", c);
          out += buf;
        } else {
          out += c;
        }
    }
  }
  return out + "\"";
}

void JsonWriter::newline() {
  out_ += '\n';
  out_ += std::string(first_.size() * 2, ' ');
}

void JsonWriter::beforeValue() {
  if (after_key_) {
    after_key_ = false;
    return;
  }
  if (!first_.empty()) {
    if (!first_.back()) out_ += ',';
    first_.back() = false;
    newline();
  }
}

JsonWriter& JsonWriter::beginObject() {
  beforeValue();
  out_ += '{';
  first_.push_back(true);
  return *this;
}

JsonWriter& JsonWriter::endObject() {
  const bool empty = first_.back();
  first_.pop_back();
  if (!empty) newline();
  out_ += '}';
  if (first_.empty()) out_ += '\n';
  return *this;
}

JsonWriter& JsonWriter::beginArray() {
  beforeValue();
  out_ += '[';
  first_.push_back(true);
  return *this;
}

JsonWriter& JsonWriter::endArray() {
  const bool empty = first_.back();
  first_.pop_back();
  if (!empty) newline();
  out_ += ']';
  if (first_.empty()) out_ += '\n';
  return *this;
}

JsonWriter& JsonWriter::key(std::string_view k) {
  beforeValue();
  out_ += escape(k);
  out_ += ": ";
  after_key_ = true;
  return *this;
}

JsonWriter& JsonWriter::value(std::string_view s) {
  beforeValue();
  out_ += escape(s);
  return *this;
}

JsonWriter& JsonWriter::value(double d) {
  beforeValue();
  if (!std::isfinite(d)) {
    out_ += "null";
    return *this;
  }
  char buf[40];
  for (int precision = 15; precision <= 17; ++precision) {
    std::snprintf(buf, sizeof buf, "%.*g", precision, d);
    if (std::strtod(buf, nullptr) == d) break;
  }
  out_ += buf;
  return *this;
}

JsonWriter& JsonWriter::value(int i) {
  beforeValue();
  out_ += std::to_string(i);
  return *this;
}

JsonWriter& JsonWriter::value(bool b) {
  beforeValue();
  out_ += b ? "true" : "false";
  return *this;
}

JsonWriter& JsonWriter::null() {
  beforeValue();
  out_ += "null";
  return *this;
}

}  // namespace calctrail
