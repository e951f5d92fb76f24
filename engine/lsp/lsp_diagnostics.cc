#include "engine/lsp/lsp_diagnostics.h"

#include "engine/lsp/lsp_server.h"
#include "engine/lsp/protocol_json.h"
#include "engine/template/template_path.h"

namespace calctrail::lsp {

namespace {

// DiagnosticSeverity of the protocol.
constexpr int kError = 1, kWarning = 2;

nlohmann::json diagnostic(const Range& r, int severity, const std::string& message) {
  return {{"range", toJson(r)}, {"severity", severity}, {"source", "calctrail"}, {"message", message}};
}

// The protocol range of a diagnostic's caret in `doc`.
Range caretRange(const Diagnostic& d, const Document& doc) {
  Range r;
  if (d.line > 0) {
    // The caret underlines caret_width code points (one column each) from the column.
    r.start = doc.fromCodePoints(d.line, d.column);
    r.end = doc.fromCodePoints(d.line, d.column + d.caret_width);
  }
  return r;
}

// The sheet's `use` line that brought in the template where `d` happened: the
// top-level instance whose context ("in the instance `left` used at
// FILE:LINE:COL") ends the diagnostic's note; null when none does.
const Use* useLineOf(const Analysis& a, const Diagnostic& d) {
  const Sheet& sheet = a.calc->sheet;
  for (const Instance& in : sheet.instances) {
    if (in.parent >= 0 || in.use_index < 0) continue;
    if (d.message.find(in.context + ")") != std::string::npos)
      return &sheet.uses[static_cast<size_t>(in.use_index)];
  }
  return nullptr;
}

// A problem inside a used template, shown at the `use` line that brought it
// in, with the place in the template as related information.
nlohmann::json templateDiagnostic(const Analysis& a, const Document& doc, const Diagnostic& d, int severity) {
  const Use* use = useLineOf(a, d);
  Range r;
  if (use) {
    const int line = use->line - 1;
    r = {{line, 0}, {line, utf16Length(doc.lineText(line))}};
  }
  // The template as the sheet's folder names it, as the command line run there would.
  // The paths as the sheet's folder names them, as the command line run there would.
  const std::string folder = parentPath(a.calc->path) + "/";
  auto relative = [&](std::string text) {
    if (folder.size() < 2) return text;
    for (size_t at = text.find(folder); at != std::string::npos; at = text.find(folder, at))
      text.erase(at, folder.size());
    return text;
  };
  std::string where = relative(d.path);
  if (d.line > 0) where += ":" + std::to_string(d.line) + ":" + std::to_string(d.column);
  nlohmann::json out = diagnostic(r, severity, "in template " + where + ": " + relative(d.message));
  const std::string uri = uriFromPath(d.path);
  const auto text = a.templates.find(normalizePath(d.path));
  const Document tdoc(uri, text == a.templates.end() ? std::string() : text->second, 0);
  out["relatedInformation"] =
      nlohmann::json::array({{{"location", location(uri, caretRange(d, tdoc))}, {"message", d.message}}});
  return out;
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
    const int severity = d.severity == Severity::Error ? kError : kWarning;
    if (d.path != a.calc->path && !d.path.empty())
      out.push_back(templateDiagnostic(a, doc, d, severity));
    else
      out.push_back(diagnostic(caretRange(d, doc), severity, d.message));
  }
  return out;
}

}  // namespace calctrail::lsp
