// Completion as one types: the sheet's quantity names (with their values),
// the drive functions (with their arguments and units) and the math
// functions where a formula reads names; unit names after a number or
// inside [ ]; nothing inside a comment or a description.
#pragma once

#include <cstdint>

#include <nlohmann/json.hpp>

#include "engine/lsp/analysis.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// What the text before the cursor asks for.
enum class CompletionContext { None, Names, Units };
CompletionContext completionContext(std::string_view line_before_cursor);

// The CompletionList for byte `offset` of `doc`.
nlohmann::json completion(const Analysis& analysis, const Document& doc, uint32_t offset);

}  // namespace calctrail::lsp
