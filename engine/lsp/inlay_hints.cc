#include "engine/lsp/inlay_hints.h"

#include "engine/lsp/hover.h"
#include "engine/lsp/protocol_json.h"
#include "engine/report/number_format.h"

namespace calctrail::lsp {

std::string quantityHint(const Analysis& a, int i) {
  return "= " + valueText(a, i);
}

std::string checkHint(const Analysis& a, int k) {
  const CheckView s = a.calc->check(k);
  const Check& c = a.calc->sheet.checks[k];
  return std::string(s.passed ? "pass" : "FAIL") + " (" + formatQuantity(s.lhs, s.display, 4, false) + " " +
         comparisonText(c.op) + " " + formatQuantity(s.rhs, s.display, 4, false) + ")";
}

nlohmann::json inlayHints(const Analysis& a, const Document& doc, int64_t first, int64_t last) {
  nlohmann::json hints = nlohmann::json::array();
  if (!a.evaluated()) return hints;
  for (const Statement& st : a.calc->sheet.statements) {
    const int64_t line = st.line - 1;
    if (line < first || line > last || st.index < 0) continue;
    std::string label;
    if (st.kind == Statement::Define) {
      const Quantity& q = a.calc->sheet.quantities[st.index];
      // A lone literal shows its value already.
      if (!q.expr || q.expr->kind == ExprKind::Number || !a.calc->ok(st.index)) continue;
      label = quantityHint(a, st.index);
    } else if (st.kind == Statement::CheckStmt) {
      if (!a.calc->checkResult(st.index).ok) continue;
      label = checkHint(a, st.index);
    } else {
      continue;
    }
    const Position at{line, utf16Length(doc.lineText(static_cast<int>(line)))};
    hints.push_back({{"position", toJson(at)}, {"label", label}, {"paddingLeft", true}});
  }
  return hints;
}

}  // namespace calctrail::lsp
