// The files a language-server calculation reads its templates from: the
// editor's open documents as the editor has them (unsaved edits included),
// and every other file from the disk. An unsaved edit of a template thus
// shows up at once in the sheets that use it.
#pragma once

#include <map>
#include <string>

#include "engine/lsp/document.h"
#include "engine/template/file_source.h"

namespace calctrail::lsp {

class BufferSource final : public FileSource {
 public:
  // `doc` (which must outlive its entry) is served for `path` in place of the disk.
  void open(const std::string& path, const Document* doc);
  void close(const std::string& path);

  bool read(const std::string& path, std::string* bytes, std::string* error) const override;
  bool realPath(const std::string& path, std::string* real) const override;
  std::string id() const override { return "editor buffers"; }

 private:
  std::map<std::string, const Document*> open_;  // by normalized path
};

// Records every file a calculation reads through it (templates, and tries of
// missing ones), so that the server knows which open documents a sheet depends on.
class RecordingSource final : public FileSource {
 public:
  explicit RecordingSource(const FileSource& inner) : inner_(inner) {}

  bool read(const std::string& path, std::string* bytes, std::string* error) const override;
  bool realPath(const std::string& path, std::string* real) const override {
    return inner_.realPath(path, real);
  }
  std::string id() const override { return inner_.id(); }

  /// Each path read (normalized), with its bytes ("" when it could not be read);
  /// mutable because the loader reads through a const source.
  mutable std::map<std::string, std::string> reads;

 private:
  const FileSource& inner_;
};

}  // namespace calctrail::lsp
