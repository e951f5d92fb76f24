// Inlay hints: the computed value at the end of each definition line and the
// pass/FAIL state of each check, so the sheet reads like its trail while one
// types. A worksheet with errors shows no values, as on the command line.
#pragma once

#include <nlohmann/json.hpp>

#include "engine/lsp/analysis.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// The InlayHint[] for the 0-based lines first..last of `doc`.
nlohmann::json inlayHints(const Analysis& analysis, const Document& doc, int64_t first, int64_t last);

// A hint's text: "= 41.20 kN" for a quantity; "pass (2.1 >= 2)" or "FAIL (...)" for a check.
std::string quantityHint(const Analysis& analysis, int quantity);
std::string checkHint(const Analysis& analysis, int check);

}  // namespace calctrail::lsp
