// One document calculated as the command line calculates it, and an index of
// every name written in it (definitions, uses, checks, function calls), for
// the editor features: hover, definition, references, rename, hints.
#pragma once

#include <cstdint>
#include <memory>
#include <string>
#include <vector>

#include "engine/calculation.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// One name as written in the worksheet.
struct Symbol {
  enum Kind { QuantityDef, QuantityUse, CheckDef, FunctionCall };
  /// What the name is, where it stands.
  Kind kind = QuantityUse;
  /// Byte range of the name in the text.
  uint32_t begin = 0, end = 0;
  /// The quantity's index (QuantityDef, and QuantityUse of a defined name; -1 for an undefined
  /// one), or the check's index (CheckDef); -1 for a function call.
  int index = -1;
  /// The name as written.
  std::string name;
  /// The call's expression node (FunctionCall); owned by the calculation's sheet.
  const Expr* call = nullptr;
};

class Analysis {
 public:
  // Calculates `doc` (named `path` in diagnostics) and indexes its names.
  Analysis(const Document& doc, const std::string& path);

  // The calculation: diagnostics, sheet, values. Null when the text breaks
  // the input limits, with that one problem in `limit_error`.
  std::unique_ptr<Calculation> calc;
  /// The limit the text breaks ("the file has a line over 65536 bytes"), "" when none.
  std::string limit_error;
  /// The 1-based line that problem is on; 0 for the file as a whole.
  int limit_line = 0;
  /// The document version calculated.
  int64_t version = 0;

  // The name at byte `offset` (its first byte to just after its last), or nullptr.
  const Symbol* at(uint32_t offset) const;
  // Every definition and use of the quantity `index`, in text order.
  std::vector<const Symbol*> occurrences(int index) const;
  // Every symbol, in text order.
  const std::vector<Symbol>& symbols() const { return symbols_; }

  // The sheet calculated without errors: values and check results can be shown.
  bool evaluated() const { return calc && !calc->hasErrors() && !calc->results.values.empty(); }

 private:
  void indexExpr(const Expr& e);

  std::vector<Symbol> symbols_;  // sorted by begin
};

}  // namespace calctrail::lsp
