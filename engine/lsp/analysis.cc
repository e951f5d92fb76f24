#include "engine/lsp/analysis.h"

#include <algorithm>

#include "engine/lsp/buffer_source.h"
#include "engine/sheet/source_file.h"
#include "engine/template/template_path.h"

namespace calctrail::lsp {

Analysis::Analysis(const Document& doc, const std::string& path, const FileSource* templates_from)
    : version(doc.version()) {
  ReadError error;
  if (!checkSourceLimits(doc.text(), "the file", &error)) {
    limit_error = error.message;
    limit_line = error.line;
    return;
  }
  RecordingSource source(templates_from ? *templates_from : diskSource());
  CalcOptions options;
  options.source = &source;
  options.source_path = path;
  calc = Calculation::fromText(path, doc.text(), options);
  templates = std::move(source.reads);
  const Sheet& sheet = calc->sheet;
  for (size_t i = 0; i < sheet.quantities.size(); ++i) {
    const Quantity& q = sheet.quantities[i];
    if (q.instance >= 0) continue;  // expanded from a template: its ranges are in that file
    symbols_.push_back({Symbol::QuantityDef, q.name_begin, q.name_end, static_cast<int>(i), q.name, nullptr});
    if (q.expr) indexExpr(*q.expr);
  }
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    if (c.instance >= 0) continue;
    symbols_.push_back({Symbol::CheckDef, c.name_begin, c.name_end, static_cast<int>(k), c.name, nullptr});
    if (c.lhs) indexExpr(*c.lhs);
    if (c.rhs) indexExpr(*c.rhs);
  }
  for (size_t u = 0; u < sheet.uses.size(); ++u) {
    const Use& use = sheet.uses[u];
    const int ui = static_cast<int>(u);
    symbols_.push_back({Symbol::UsePath, use.path_begin, use.path_end, ui, use.path, nullptr, -1});
    symbols_.push_back(
        {Symbol::UseInstance, use.instance_begin, use.instance_end, ui, use.instance, nullptr, -1});
    for (size_t b = 0; b < use.bindings.size(); ++b) {
      const UseBinding& binding = use.bindings[b];
      symbols_.push_back({Symbol::UseParam, binding.name_begin, binding.name_end, ui, binding.param, nullptr,
                          static_cast<int>(b)});
      if (binding.expr) indexExpr(*binding.expr);  // written in the sheet, in its names
    }
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

int Analysis::instanceOfUse(int use_index) const {
  if (!calc) return -1;
  const std::vector<Instance>& instances = calc->sheet.instances;
  for (size_t i = 0; i < instances.size(); ++i)
    if (instances[i].parent < 0 && instances[i].use_index == use_index) return static_cast<int>(i);
  return -1;
}

int Analysis::instanceQuantity(int instance, const std::string& name) const {
  if (!calc || instance < 0) return -1;
  const int i = calc->sheet.find(calc->sheet.instances[static_cast<size_t>(instance)].name + "." + name);
  return i >= 0 && calc->sheet.quantities[static_cast<size_t>(i)].instance == instance ? i : -1;
}

std::string Analysis::templatePath(int instance) const {
  if (!calc || instance < 0) return "";
  return joinPath(parentPath(calc->path), calc->sheet.instances[static_cast<size_t>(instance)].path);
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
