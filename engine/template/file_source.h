// Where a calculation reads its templates from: the disk, or one revision of
// a git repository (engine/review/git_source.h), so that `diff REV:PATH`
// reads every template as it was at REV.
#pragma once

#include <string>

namespace calctrail {

class FileSource {
 public:
  virtual ~FileSource() = default;
  // The bytes of `path` (as the loader composed it: relative to the current
  // directory, or absolute when the main sheet was named so); false with a
  // reason in *error when it cannot be read.
  virtual bool read(const std::string& path, std::string* bytes, std::string* error) const = 0;
  // `path` with every symbolic link resolved, for the folder-tree rule;
  // false when the source has no links to follow (a git revision) or the path does not exist.
  virtual bool realPath(const std::string& path, std::string* real) const = 0;
  // Tells sources apart in a cache shared by a run: "" for the disk, "git REV" for a revision.
  virtual std::string id() const = 0;
};

// The files on disk.
const FileSource& diskSource();

}  // namespace calctrail
