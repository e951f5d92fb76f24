#include "engine/lsp/analysis.h"

#include <algorithm>

#include "engine/sheet/source_file.h"

namespace calctrail::lsp {

Analysis::Analysis(const Document& doc, const std::string& path) : version(doc.version()) {
  ReadError error;
  if (!checkSourceLimits(doc.text(), "the file", &error)) {
    limit_error = error.message;
    limit_line = error.line;
    return;
  }
  calc = Calculation::fromText(path, doc.text());
  const Sheet& sheet = calc->sheet;
  for (size_t i = 0; i < sheet.quantities.size(); ++i) {
    const Quantity& q = sheet.quantities[i];
    symbols_.push_back({Symbol::QuantityDef, q.name_begin, q.name_end, static_cast<int>(i), q.name, nullptr});
    if (q.expr) indexExpr(*q.expr);
  }
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    symbols_.push_back({Symbol::CheckDef, c.name_begin, c.name_end, static_cast<int>(k), c.name, nullptr});
    if (c.lhs) indexExpr(*c.lhs);
    if (c.rhs) indexExpr(*c.rhs);
  }
  std::sort(symbols_.begin(), symbols_.end(),
            [](const Symbol& a, const Symbol& b) { return a.begin < b.begin; });
}

// Iterative, as every walk over a tree in the engine is.
void Analysis::indexExpr(const Expr& root) {
  std::vector<const Expr*> stack = {&root};
  while (!stack.empty()) {
    const Expr* e = stack.back();
    stack.pop_back();
    if (e->kind == ExprKind::Name) {
      symbols_.push_back(
          {Symbol::QuantityUse, e->begin, e->end, calc->sheet.find(e->text), e->text, nullptr});
    } else if (e->kind == ExprKind::Call) {
      const uint32_t end = e->begin + static_cast<uint32_t>(e->text.size());
      symbols_.push_back({Symbol::FunctionCall, e->begin, end, -1, e->text, e});
    }
    for (const ExprPtr& a : e->args)
      if (a) stack.push_back(a.get());
  }
}

const Symbol* Analysis::at(uint32_t offset) const {
  // The last symbol that begins at or before offset; a cursor just after a name is on it.
  auto it = std::upper_bound(symbols_.begin(), symbols_.end(), offset,
                             [](uint32_t o, const Symbol& s) { return o < s.begin; });
  if (it == symbols_.begin()) return nullptr;
  --it;
  return offset <= it->end ? &*it : nullptr;
}

std::vector<const Symbol*> Analysis::occurrences(int index) const {
  std::vector<const Symbol*> out;
  if (index < 0) return out;
  for (const Symbol& s : symbols_)
    if ((s.kind == Symbol::QuantityDef || s.kind == Symbol::QuantityUse) && s.index == index)
      out.push_back(&s);
  return out;
}

}  // namespace calctrail::lsp
