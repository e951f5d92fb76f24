// JSON read back for what calctrail itself wrote: a sweep shard read back
// to be merged (sweep_merge.h). nlohmann-json parses; this keeps the
// members of an object in the order written, in a plain tree the merge
// walks. Numbers are read back exactly (strtod of the shortest round-trip
// text JsonWriter writes); negative zero keeps its sign because JsonWriter
// writes it as -0.0, which nlohmann reads as a double (a bare -0 would be
// the integer 0).
#pragma once

#include <string>
#include <utility>
#include <vector>

namespace calctrail {

struct JsonValue {
  enum Type { Null, Bool, Number, String, Array, Object };
  /// What the value is; the members below that do not apply stay empty.
  Type type = Null;
  bool boolean = false;
  double number = 0;
  std::string string;
  std::vector<JsonValue> array;
  /// An object's members, in the order written.
  std::vector<std::pair<std::string, JsonValue>> object;

  // The member `key` of an object, or nullptr (also when this is not an object).
  const JsonValue* find(const std::string& key) const;
};

// Parses `text` whole into *out; false with a reason and a byte offset in *error.
bool parseJsonText(const std::string& text, JsonValue* out, std::string* error);

}  // namespace calctrail
