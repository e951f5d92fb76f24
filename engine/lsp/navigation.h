// Go to definition, find references and rename, over the analysis' index of
// names: a quantity is defined once and read by name in formulas and checks.
#pragma once

#include <cstdint>
#include <string>

#include <nlohmann/json.hpp>

#include "engine/lsp/analysis.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// The Location of the definition of the quantity at `offset`, or null.
nlohmann::json definition(const Analysis& analysis, const Document& doc, uint32_t offset);

// Every Location of the quantity at `offset` (its definition too when `with_declaration`), or [].
nlohmann::json references(const Analysis& analysis, const Document& doc, uint32_t offset,
                          bool with_declaration);

// The range and current name of the quantity at `offset`, for prepareRename, or null.
nlohmann::json prepareRename(const Analysis& analysis, const Document& doc, uint32_t offset);

// The outcome of a rename: a WorkspaceEdit, or an error message for the client.
struct RenameResult {
  /// The WorkspaceEdit, or null when there is nothing to rename at the position.
  nlohmann::json edit;
  /// Why the rename is refused ("`d_m` is already defined on line 4"); "" when it is not.
  std::string error;
};
RenameResult rename(const Analysis& analysis, const Document& doc, uint32_t offset,
                    const std::string& new_name);

// Whether `name` can name a quantity: a letter (ASCII or Greek), then letters, digits or `_`.
bool isValidName(const std::string& name);

}  // namespace calctrail::lsp
