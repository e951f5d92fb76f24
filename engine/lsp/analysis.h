// One document calculated as the command line calculates it, and an index of
// every name written in it (definitions, uses, checks, function calls, the
// parts of `use` lines), for the editor features: hover, definition,
// references, rename, hints. Only the sheet's own text is indexed: the
// quantities expanded from templates point into the template files.
#pragma once

#include <cstdint>
#include <map>
#include <memory>
#include <string>
#include <vector>

#include "engine/calculation.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

// One name as written in the worksheet.
struct Symbol {
  enum Kind { QuantityDef, QuantityUse, CheckDef, FunctionCall, UsePath, UseInstance, UseParam };
  /// What the name is, where it stands.
  Kind kind = QuantityUse;
  /// Byte range of the name in the text.
  uint32_t begin = 0, end = 0;
  /// The quantity's index (QuantityDef, and QuantityUse of a defined name; -1 for an undefined
  /// one), the check's index (CheckDef), the `use` line's (into Sheet::uses: UsePath,
  /// UseInstance, UseParam); -1 for a function call.
  int index = -1;
  /// The name as written.
  std::string name;
  /// The call's expression node (FunctionCall); owned by the calculation's sheet.
  const Expr* call = nullptr;
  /// The binding's index in its `use` line (UseParam); -1 otherwise.
  int binding = -1;
};

class Analysis {
 public:
  // Calculates `doc` (named `path` in diagnostics, its templates read from
  // `templates`, the disk when null) and indexes its names.
  Analysis(const Document& doc, const std::string& path, const FileSource* templates = nullptr);

  // The calculation: diagnostics, sheet, values. Null when the text breaks
  // the input limits, with that one problem in `limit_error`.
  std::unique_ptr<Calculation> calc;
  /// The limit the text breaks ("the file has a line over 65536 bytes"), "" when none.
  std::string limit_error;
  /// The 1-based line that problem is on; 0 for the file as a whole.
  int limit_line = 0;
  /// The document version calculated.
  int64_t version = 0;
  /// Every template file the calculation read or tried to read (normalized path), with its
  /// bytes as read ("" when unreadable): the files whose edits change this analysis.
  std::map<std::string, std::string> templates;

  // The instance the sheet's `use` line `use_index` made, or -1 (its template could not be read).
  int instanceOfUse(int use_index) const;
  // The quantity of instance `instance` named `name` in the template, or -1.
  int instanceQuantity(int instance, const std::string& name) const;
  // The template file of instance `instance`, as the loader read it (relative to the sheet's path).
  std::string templatePath(int instance) const;

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
