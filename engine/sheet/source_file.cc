#include "engine/sheet/source_file.h"

#include <algorithm>
#include <cerrno>
#include <cstring>
#include <fstream>
#include <sstream>
#include <sys/stat.h>

namespace calctrail {

SourceFile::SourceFile(std::string path, std::string bytes)
    : path_(std::move(path)), bytes_(std::move(bytes)) {
  line_starts_.push_back(0);
  for (uint32_t i = 0; i < bytes_.size(); ++i)
    if (bytes_[i] == '\n' && i + 1 < bytes_.size()) line_starts_.push_back(i + 1);
}

std::string_view SourceFile::lineText(int line) const {
  const uint32_t begin = line_starts_[line - 1];
  uint32_t end = line < lineCount() ? line_starts_[line] : static_cast<uint32_t>(bytes_.size());
  if (end > begin && bytes_[end - 1] == '\n') --end;
  if (end > begin && bytes_[end - 1] == '\r') --end;
  return std::string_view(bytes_).substr(begin, end - begin);
}

SourcePos SourceFile::position(uint32_t offset) const {
  offset = std::min<uint32_t>(offset, static_cast<uint32_t>(bytes_.size()));
  auto it = std::upper_bound(line_starts_.begin(), line_starts_.end(), offset);
  const int line = static_cast<int>(it - line_starts_.begin());
  int column = 1;
  for (uint32_t i = line_starts_[line - 1]; i < offset; ++i) {
    // Count lead bytes only, so a multi-byte character is one column.
    if ((static_cast<unsigned char>(bytes_[i]) & 0xC0) != 0x80) ++column;
  }
  return {line, column};
}

bool readFile(const std::string& path, std::string* bytes, std::string* error) {
  struct stat st;
  if (stat(path.c_str(), &st) != 0) {
    *error = std::string("cannot read file: ") + std::strerror(errno);
    return false;
  }
  if (S_ISDIR(st.st_mode)) {
    *error = "cannot read file: it is a directory";
    return false;
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) {
    *error = std::string("cannot read file: ") + std::strerror(errno);
    return false;
  }
  std::ostringstream ss;
  ss << in.rdbuf();
  if (in.bad()) {
    *error = "cannot read file: read error";
    return false;
  }
  *bytes = ss.str();
  return true;
}

}  // namespace calctrail
