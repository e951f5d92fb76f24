#include "tests/json_reader.h"

#include <nlohmann/json.hpp>

namespace calctrail::test {

namespace {
// nlohmann does the parsing (strict RFC 8259); this only copies its tree
// into the plain struct the tests read fields from.
Json convert(const nlohmann::json& j) {
  Json out;
  switch (j.type()) {
    case nlohmann::json::value_t::null: out.type = Json::Null; break;
    case nlohmann::json::value_t::boolean:
      out.type = Json::Bool;
      out.boolean = j.get<bool>();
      break;
    case nlohmann::json::value_t::number_integer:
    case nlohmann::json::value_t::number_unsigned:
    case nlohmann::json::value_t::number_float:
      out.type = Json::Number;
      out.number = j.get<double>();
      break;
    case nlohmann::json::value_t::string:
      out.type = Json::String;
      out.string = j.get<std::string>();
      break;
    case nlohmann::json::value_t::array:
      out.type = Json::Array;
      for (const nlohmann::json& e : j) out.array.push_back(convert(e));
      break;
    case nlohmann::json::value_t::object:
      out.type = Json::Object;
      for (const auto& [k, v] : j.items()) out.object.emplace(k, convert(v));
      break;
    default: break;  // binary values and discarded: never produced by parse()
  }
  return out;
}
}  // namespace

bool parseJson(const std::string& text, Json* out, std::string* error) {
  try {
    // Numbers: nlohmann keeps integers exact and reads floats with strtod,
    // so a double written with its shortest round-trip text reads back the same.
    *out = convert(nlohmann::json::parse(text));
    return true;
  } catch (const nlohmann::json::parse_error& e) {
    *error = e.what();
    return false;
  }
}

}  // namespace calctrail::test
