// Templates as read and parsed, kept for a whole run: a template that many
// sheets use (`calctrail check worksheets/*.calc`), or one sheet uses many
// times, is read and parsed once. Instances copy what they need out of it.
#pragma once

#include <map>
#include <memory>
#include <mutex>
#include <optional>
#include <string>
#include <vector>

#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/template/file_source.h"
#include "engine/units/dimension.h"

namespace calctrail {

struct TemplateFile {
  /// The path it was read from (relative to the current directory, as diagnostics name it).
  std::string path;
  /// SHA-256 of its bytes as read, in hex.
  std::string sha256;
  /// The template parsed on its own; its `file` is shared by every instance's quantities.
  Sheet sheet;
  /// The problems of the template's text on its own (parse errors).
  Diagnostics diags;
  /// Per quantity: for a `param NAME = EXPR` (no unit), the dimension of its default (none when it fails).
  std::vector<std::optional<Dimension>> param_dims;
};

class TemplateCache {
 public:
  // The template at `path` of `source`, read and parsed on the first call;
  // nullptr with the reason in *error when it cannot be read. Safe to call
  // from several threads (`check -j`): one lock over the lookup and the
  // parse, so a template is still parsed once however many sheets wait for it.
  const TemplateFile* get(const FileSource& source, const std::string& path, std::string* error);
  // How many files were read and parsed so far (one per distinct template).
  size_t parses() const {
    std::lock_guard<std::mutex> lock(mutex_);
    return parses_;
  }

 private:
  struct Entry {
    std::unique_ptr<TemplateFile> file;  // null when it could not be read
    std::string error;
  };
  std::map<std::string, Entry> entries_;  // by source id and path
  size_t parses_ = 0;
  mutable std::mutex mutex_;  // guards entries_ and parses_; entries never move once made
};

}  // namespace calctrail
