#include "engine/lsp/navigation.h"

#include "engine/lsp/lsp_server.h"
#include "engine/lsp/protocol_json.h"
#include "engine/sheet/name_lexer.h"

namespace calctrail::lsp {

namespace {

// The quantity named at `offset`: a definition or a use of a defined name.
const Symbol* quantityAt(const Analysis& a, uint32_t offset) {
  if (!a.calc) return nullptr;
  const Symbol* s = a.at(offset);
  if (!s || (s->kind != Symbol::QuantityDef && s->kind != Symbol::QuantityUse) || s->index < 0)
    return nullptr;
  return s;
}

// Words a statement starts with, and the constant: never a quantity's name.
bool isReserved(const std::string& name) {
  for (const char* w : {"pi", "check", "section", "note", "param", "use", "case"})
    if (name == w) return true;
  return false;
}

}  // namespace

bool isValidName(const std::string& name) {
  return !name.empty() && nameEnd(name, 0) == name.size();  // the worksheet's own name lexer
}

// The Location of bytes [begin, end) of a template file, its columns counted in its own text.
nlohmann::json templateLocation(const SourceFile& file, uint32_t begin, uint32_t end) {
  const std::string uri = uriFromPath(file.path());
  const Document text(uri, file.bytes(), 0);
  return location(uri, rangeOf(text, begin, end));
}

// The definition of quantity `i`: in the sheet, or in the template an instance's comes from.
nlohmann::json quantityDefinition(const Analysis& a, const Document& doc, int i) {
  const Quantity& q = a.calc->sheet.quantities[static_cast<size_t>(i)];
  if (q.file) return templateLocation(*q.file, q.name_begin, q.name_end);
  return location(doc.uri(), rangeOf(doc, q.name_begin, q.name_end));
}

nlohmann::json definition(const Analysis& a, const Document& doc, uint32_t offset) {
  if (!a.calc) return nullptr;
  const Symbol* s = a.at(offset);
  if (!s) return nullptr;
  switch (s->kind) {
    case Symbol::QuantityDef:
    case Symbol::QuantityUse: return s->index >= 0 ? quantityDefinition(a, doc, s->index) : nullptr;
    case Symbol::UsePath:
    case Symbol::UseInstance: {
      // The start of the template file; only when the loader could read it.
      const int inst = a.instanceOfUse(s->index);
      if (inst < 0) return nullptr;
      const Position start{0, 0};
      return location(uriFromPath(a.templatePath(inst)), Range{start, start});
    }
    case Symbol::UseParam: {
      const int q = a.instanceQuantity(a.instanceOfUse(s->index), s->name);
      if (q < 0 || !a.calc->sheet.quantities[static_cast<size_t>(q)].param) return nullptr;
      return quantityDefinition(a, doc, q);
    }
    case Symbol::CheckDef:
    case Symbol::FunctionCall: return nullptr;
  }
  return nullptr;
}

nlohmann::json references(const Analysis& a, const Document& doc, uint32_t offset, bool with_declaration) {
  nlohmann::json out = nlohmann::json::array();
  const Symbol* s = quantityAt(a, offset);
  if (!s) return out;
  for (const Symbol* use : a.occurrences(s->index)) {
    if (use->kind == Symbol::QuantityDef && !with_declaration) continue;
    out.push_back(location(doc.uri(), rangeOf(doc, use->begin, use->end)));
  }
  return out;
}

nlohmann::json prepareRename(const Analysis& a, const Document& doc, uint32_t offset) {
  const Symbol* s = quantityAt(a, offset);
  // An instance's quantity is renamed in its template, where the other instances read it too.
  if (!s || a.calc->sheet.quantities[static_cast<size_t>(s->index)].instance >= 0) return nullptr;
  return {{"range", toJson(rangeOf(doc, s->begin, s->end))}, {"placeholder", s->name}};
}

RenameResult rename(const Analysis& a, const Document& doc, uint32_t offset, const std::string& new_name) {
  RenameResult r;
  const Symbol* s = quantityAt(a, offset);
  if (!s) return r;
  const Quantity& q = a.calc->sheet.quantities[static_cast<size_t>(s->index)];
  if (q.instance >= 0) {
    r.error = "`" + q.name + "` is defined in the template " + q.file->path() +
              "; rename it there, in the template's own names";
    return r;
  }
  if (!isValidName(new_name)) {
    r.error = "`" + new_name + "` is not a name: a letter, then letters, digits or `_`";
    return r;
  }
  if (isReserved(new_name)) {
    r.error = "`" + new_name + "` is a reserved word of the worksheet format";
    return r;
  }
  const int other = a.calc->sheet.find(new_name);
  if (other >= 0 && other != s->index) {
    r.error = "`" + new_name + "` is already defined on line " +
              std::to_string(a.calc->sheet.quantities[other].line);
    return r;
  }
  if (findFunction(new_name)) {
    r.error = "`" + new_name + "` is the name of a library function";
    return r;
  }
  nlohmann::json edits = nlohmann::json::array();
  for (const Symbol* use : a.occurrences(s->index))
    edits.push_back({{"range", toJson(rangeOf(doc, use->begin, use->end))}, {"newText", new_name}});
  r.edit = {{"changes", {{doc.uri(), edits}}}};
  return r;
}

}  // namespace calctrail::lsp
