#include "engine/lsp/completion.h"

#include <cctype>

#include "engine/eval/math_functions.h"
#include "engine/lsp/hover.h"
#include "engine/units/unit_table.h"

namespace calctrail::lsp {

namespace {

// CompletionItemKind of the protocol.
enum ItemKind { kFunction = 3, kVariable = 6, kUnit = 11, kConstant = 21 };

bool isNameChar(char c) {
  return std::isalnum(static_cast<unsigned char>(c)) || c == '_' || (c & 0x80);
}

nlohmann::json item(const std::string& label, int kind, const std::string& detail, const std::string& doc) {
  nlohmann::json j = {{"label", label}, {"kind", kind}};
  if (!detail.empty()) j["detail"] = detail;
  if (!doc.empty()) j["documentation"] = {{"kind", "markdown"}, {"value", doc}};
  return j;
}

}  // namespace

CompletionContext completionContext(std::string_view line) {
  if (line.find('#') != std::string_view::npos) return CompletionContext::None;  // comment or description
  const size_t open = line.rfind('['), close = line.rfind(']');
  if (open != std::string_view::npos && (close == std::string_view::npos || close < open))
    return CompletionContext::Units;
  // Skip the word being typed, then the blanks before it: a number there takes a unit.
  size_t i = line.size();
  while (i > 0 && isNameChar(line[i - 1])) --i;
  const size_t word = i;
  while (i > 0 && (line[i - 1] == ' ' || line[i - 1] == '\t')) --i;
  if (i < word && i > 0 && (std::isdigit(static_cast<unsigned char>(line[i - 1])) || line[i - 1] == '.')) {
    // The token before the blanks is a number only when it is not the tail of a name (x2).
    size_t t = i;
    while (t > 0 && (isNameChar(line[t - 1]) || line[t - 1] == '.')) --t;
    if (std::isdigit(static_cast<unsigned char>(line[t]))) return CompletionContext::Units;
  }
  return CompletionContext::Names;
}

nlohmann::json completion(const Analysis& a, const Document& doc, uint32_t offset) {
  nlohmann::json items = nlohmann::json::array();
  const Position pos = doc.position(offset);
  const std::string_view line = doc.lineText(static_cast<int>(pos.line));
  const size_t in_line = bytesForUtf16(line, pos.character);
  const CompletionContext context = completionContext(line.substr(0, in_line));
  if (context == CompletionContext::Units) {
    for (const UnitDef& u : unitTable())
      items.push_back(item(std::string(u.name), kUnit, std::string(u.quantity), std::string(u.definition)));
  } else if (context == CompletionContext::Names) {
    if (a.calc) {
      const Sheet& sheet = a.calc->sheet;
      for (size_t i = 0; i < sheet.quantities.size(); ++i) {
        const Quantity& q = sheet.quantities[i];
        std::string detail;
        if (a.evaluated() && i < a.calc->quantityCount() && a.calc->ok(i))
          detail = "= " + valueText(a, static_cast<int>(i));
        else if (!q.unit_written.empty())
          detail = "[" + q.unit_written + "]";
        items.push_back(item(q.name, kVariable, detail, q.description));
      }
    }
    for (const FunctionDecl& f : functionLibrary()) {
      std::string doc_text(f.summary);
      for (const FunctionArg& arg : f.args) doc_text += "\n- `" + std::string(arg.name) + "`: " + std::string(arg.description);
      items.push_back(item(std::string(f.name), kFunction, signature(f), doc_text));
    }
    for (const MathFunction& m : mathFunctions()) items.push_back(item(m.name, kFunction, m.summary, ""));
    items.push_back(item("pi", kConstant, "3.14159...", ""));
  }
  return {{"isIncomplete", false}, {"items", items}};
}

}  // namespace calctrail::lsp
