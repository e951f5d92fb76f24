#include "engine/lsp/lsp_diagnostics.h"

#include "engine/lsp/protocol_json.h"

namespace calctrail::lsp {

namespace {

// DiagnosticSeverity of the protocol.
constexpr int kError = 1, kWarning = 2;

nlohmann::json diagnostic(const Range& r, int severity, const std::string& message) {
  return {{"range", toJson(r)}, {"severity", severity}, {"source", "calctrail"}, {"message", message}};
}

}  // namespace

nlohmann::json diagnosticsJson(const Analysis& a, const Document& doc) {
  nlohmann::json out = nlohmann::json::array();
  if (!a.calc) {
    const Position at = a.limit_line > 0 ? Position{a.limit_line - 1, 0} : Position{0, 0};
    out.push_back(diagnostic({at, at}, kError, a.limit_error));
    return out;
  }
  for (const Diagnostic& d : a.calc->diags.list()) {
    Range r;
    if (d.line > 0) {
      // The caret underlines caret_width code points (one column each) from the column.
      r.start = doc.fromCodePoints(d.line, d.column);
      r.end = doc.fromCodePoints(d.line, d.column + d.caret_width);
    }
    out.push_back(diagnostic(r, d.severity == Severity::Error ? kError : kWarning, d.message));
  }
  return out;
}

}  // namespace calctrail::lsp
