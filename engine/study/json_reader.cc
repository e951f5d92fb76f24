#include "engine/study/json_reader.h"

#include <nlohmann/json.hpp>

namespace calctrail {

const JsonValue* JsonValue::find(const std::string& key) const {
  for (const auto& [k, v] : object)
    if (k == key) return &v;
  return nullptr;
}

namespace {

// Our files nest five deep; the copy below recurses, so no input may nest
// deeper than this (nlohmann's own parser does not recurse).
constexpr int kMaxDepth = 64;

bool copy(const nlohmann::ordered_json& j, JsonValue* out, int depth, std::string* error) {
  using T = nlohmann::ordered_json::value_t;
  if (depth > kMaxDepth) {
    *error = "nesting too deep";
    return false;
  }
  switch (j.type()) {
    case T::null: out->type = JsonValue::Null; return true;
    case T::boolean:
      out->type = JsonValue::Bool;
      out->boolean = j.get<bool>();
      return true;
    case T::number_integer:
    case T::number_unsigned:
    case T::number_float:
      out->type = JsonValue::Number;
      out->number = j.get<double>();
      return true;
    case T::string:
      out->type = JsonValue::String;
      out->string = j.get<std::string>();
      return true;
    case T::array:
      out->type = JsonValue::Array;
      out->array.reserve(j.size());
      for (const auto& e : j) {
        out->array.emplace_back();
        if (!copy(e, &out->array.back(), depth + 1, error)) return false;
      }
      return true;
    case T::object:
      out->type = JsonValue::Object;
      out->object.reserve(j.size());
      for (const auto& [k, v] : j.items()) {
        out->object.emplace_back(k, JsonValue());
        if (!copy(v, &out->object.back().second, depth + 1, error)) return false;
      }
      return true;
    default:
      *error = "a value JSON text cannot hold";
      return false;
  }
}

}  // namespace

bool parseJsonText(const std::string& text, JsonValue* out, std::string* error) {
  // nlohmann-json parses (strictly, and reads numbers with strtod, so the
  // shortest round-trip text JsonWriter writes reads back exactly); the
  // ordered flavour keeps members in the order written.
  nlohmann::ordered_json j;
  try {
    j = nlohmann::ordered_json::parse(text);
  } catch (const nlohmann::json::parse_error& e) {
    // "[json.exception.parse_error.101] parse error at line 1, column 7: ..." -> from "parse error".
    const std::string what = e.what();
    const size_t at = what.find("parse error");
    *error = at == std::string::npos ? what : what.substr(at);
    return false;
  }
  *out = JsonValue();
  return copy(j, out, 0, error);
}

}  // namespace calctrail
