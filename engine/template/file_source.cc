#include "engine/template/file_source.h"

#include <climits>
#include <cstdlib>
#include <memory>

#include "engine/sheet/source_file.h"

namespace calctrail {

namespace {

class DiskSource final : public FileSource {
 public:
  bool read(const std::string& path, std::string* bytes, std::string* error) const override {
    return readFile(path, bytes, error);
  }
  bool realPath(const std::string& path, std::string* real) const override {
    std::unique_ptr<char, decltype(&std::free)> resolved(::realpath(path.c_str(), nullptr), &std::free);
    if (!resolved) return false;
    *real = resolved.get();
    return true;
  }
  std::string id() const override { return ""; }
};

}  // namespace

const FileSource& diskSource() {
  static const DiskSource source;
  return source;
}

}  // namespace calctrail
