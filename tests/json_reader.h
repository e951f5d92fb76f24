// The JSON a test reads, parsed by nlohmann-json (strict) and copied into a
// plain tree whose fields the tests check by name and type.
#pragma once

#include <map>
#include <memory>
#include <string>
#include <vector>

namespace calctrail::test {

struct Json {
  enum Type { Null, Bool, Number, String, Array, Object } type = Null;
  bool boolean = false;
  double number = 0;
  std::string string;
  std::vector<Json> array;
  std::map<std::string, Json> object;

  bool has(const std::string& key) const { return type == Object && object.count(key) > 0; }
  const Json& operator[](const std::string& key) const { return object.at(key); }
  const Json& operator[](size_t i) const { return array.at(i); }
};

// Parses `text`; false with a reason (and byte offset) in *error.
bool parseJson(const std::string& text, Json* out, std::string* error);

}  // namespace calctrail::test
