// What the editor shows on hovering a name: for a quantity its value in its
// unit, its formula, the formula with the values substituted and its
// description; for a check its condition and verdict; for a library
// function its signature, formula, validity limits and source.
#pragma once

#include <cstdint>

#include <nlohmann/json.hpp>

#include "engine/lsp/analysis.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// The Hover result for byte `offset` of `doc` (Markdown), or null when no name is there.
nlohmann::json hover(const Analysis& analysis, const Document& doc, uint32_t offset);

// A value as hover, hints and completion show it ("41.20 kN"): 4 significant digits.
std::string valueText(const Analysis& analysis, int quantity);

// "torque_raise(F [N], dm [m], l [m/rev], f, alpha [rad]) -> N*m"
std::string signature(const FunctionDecl& f);

}  // namespace calctrail::lsp
