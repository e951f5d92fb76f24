#include "engine/lsp/protocol_json.h"

namespace calctrail::lsp {

nlohmann::json toJson(const Position& p) {
  return {{"line", p.line}, {"character", p.character}};
}

nlohmann::json toJson(const Range& r) {
  return {{"start", toJson(r.start)}, {"end", toJson(r.end)}};
}

Range rangeOf(const Document& doc, uint32_t begin, uint32_t end) {
  return {doc.position(begin), doc.position(end)};
}

nlohmann::json location(const std::string& uri, const Range& r) {
  return {{"uri", uri}, {"range", toJson(r)}};
}

Position positionFrom(const nlohmann::json& j) {
  return {j.at("line").get<int64_t>(), j.at("character").get<int64_t>()};
}

Range rangeFrom(const nlohmann::json& j) {
  return {positionFrom(j.at("start")), positionFrom(j.at("end"))};
}

}  // namespace calctrail::lsp
