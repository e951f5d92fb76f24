// A small streaming JSON writer: correct escaping, full-precision numbers,
// stable key order (the order they are written in), two-space indentation.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

class JsonWriter {
 public:
  JsonWriter& beginObject();
  JsonWriter& endObject();
  JsonWriter& beginArray();
  JsonWriter& endArray();
  JsonWriter& key(std::string_view k);
  JsonWriter& value(std::string_view s);
  JsonWriter& value(const char* s) { return value(std::string_view(s)); }
  JsonWriter& value(const std::string& s) { return value(std::string_view(s)); }
  JsonWriter& value(double d);  // shortest round-trip text; null for NaN/inf
  JsonWriter& value(int i);
  JsonWriter& value(bool b);
  JsonWriter& null();

  const std::string& str() const { return out_; }
  static std::string escape(std::string_view s);  // with the quotes

 private:
  void beforeValue();
  void newline();
  std::string out_;
  std::vector<bool> first_;  // per open container: no member written yet
  bool after_key_ = false;
};

}  // namespace calctrail
