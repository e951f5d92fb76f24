// calctrail's diagnostics as the protocol publishes them: the same messages
// and severities as the command line, at the same places, with the line and
// code-point column turned into a 0-based line and UTF-16 columns, and the
// caret's width into the range's end.
#pragma once

#include <nlohmann/json.hpp>

#include "engine/lsp/analysis.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// The Diagnostic[] of an analysis of `doc`.
nlohmann::json diagnosticsJson(const Analysis& analysis, const Document& doc);

}  // namespace calctrail::lsp
