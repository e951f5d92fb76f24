#include "engine/template/template_cache.h"

#include "engine/eval/dimension_check.h"
#include "engine/model/model.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/util/sha256.h"

namespace calctrail {

const TemplateFile* TemplateCache::get(const FileSource& source, const std::string& path,
                                       std::string* error) {
  const std::string key = source.id() + '\n' + path;
  std::lock_guard<std::mutex> lock(mutex_);
  auto it = entries_.find(key);
  if (it == entries_.end()) {
    Entry entry;
    std::string bytes;
    if (source.read(path, &bytes, &entry.error)) {
      ++parses_;
      auto t = std::make_unique<TemplateFile>();
      t->path = path;
      t->sha256 = sha256Hex(bytes);
      t->sheet = parseSheet(std::make_shared<SourceFile>(path, std::move(bytes)), &t->diags);
      // A param without a unit has the dimension of its default, which reads
      // no quantity: checked here once, against an empty sheet. Its
      // problems are the Model's to report (the default is a formula of the instance).
      const Sheet none;
      const std::vector<Dimension> no_dims;
      const std::vector<char> no_known;
      t->param_dims.resize(t->sheet.quantities.size());
      for (size_t i = 0; i < t->sheet.quantities.size(); ++i) {
        const Quantity& q = t->sheet.quantities[i];
        if (!q.param || q.display || !q.expr) continue;
        Diagnostics reported_by_the_model;
        DimensionChecker checker(*t->sheet.file, &reported_by_the_model, none, no_dims, no_known);
        TreeDims dims;
        if (checker.check(*q.expr, &dims)) t->param_dims[i] = quantityDimension(dims.of(*q.expr));
      }
      entry.file = std::move(t);
    }
    it = entries_.emplace(key, std::move(entry)).first;
  }
  if (!it->second.file) *error = it->second.error;
  return it->second.file.get();
}

}  // namespace calctrail
