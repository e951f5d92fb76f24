// The protocol's small structures (Position, Range, Location) to and from
// JSON, in one place, so every feature writes them the same way.
#pragma once

#include <string>

#include <nlohmann/json.hpp>

#include "engine/lsp/document.h"

namespace calctrail::lsp {

nlohmann::json toJson(const Position& p);
nlohmann::json toJson(const Range& r);
// The range of bytes [begin, end) of `doc`.
Range rangeOf(const Document& doc, uint32_t begin, uint32_t end);
// {"uri": uri, "range": range}
nlohmann::json location(const std::string& uri, const Range& r);

// A Position from JSON; throws nlohmann::json::exception when it is not one
// (the server answers InvalidParams).
Position positionFrom(const nlohmann::json& j);
Range rangeFrom(const nlohmann::json& j);

}  // namespace calctrail::lsp
