#include "engine/lsp/buffer_source.h"

#include "engine/template/template_path.h"

namespace calctrail::lsp {

void BufferSource::open(const std::string& path, const Document* doc) {
  open_[normalizePath(path)] = doc;
}

void BufferSource::close(const std::string& path) {
  open_.erase(normalizePath(path));
}

bool BufferSource::read(const std::string& path, std::string* bytes, std::string* error) const {
  const auto it = open_.find(normalizePath(path));
  if (it == open_.end()) return diskSource().read(path, bytes, error);
  *bytes = it->second->text();
  return true;
}

bool BufferSource::realPath(const std::string& path, std::string* real) const {
  // A buffer not saved yet has no file to resolve: no links to follow.
  return diskSource().realPath(path, real);
}

bool RecordingSource::read(const std::string& path, std::string* bytes, std::string* error) const {
  const bool ok = inner_.read(path, bytes, error);
  reads[normalizePath(path)] = ok ? *bytes : std::string();
  return ok;
}

}  // namespace calctrail::lsp
