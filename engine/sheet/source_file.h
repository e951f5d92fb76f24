// The bytes of one worksheet and the map from byte offsets to lines and
// columns. Columns count Unicode code points from 1, as editors show them.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

struct SourcePos {
  int line = 0;    // 1-based
  int column = 0;  // 1-based, in code points
};

class SourceFile {
 public:
  SourceFile(std::string path, std::string bytes);

  const std::string& path() const { return path_; }
  const std::string& bytes() const { return bytes_; }
  int lineCount() const { return static_cast<int>(line_starts_.size()); }

  // Offset of the first byte of `line` (1-based).
  uint32_t lineStart(int line) const { return line_starts_[line - 1]; }
  // The text of `line` without its line ending (LF, or CRLF).
  std::string_view lineText(int line) const;
  SourcePos position(uint32_t offset) const;

 private:
  std::string path_;
  std::string bytes_;
  std::vector<uint32_t> line_starts_;
};

// Reads a whole file; false with a reason in *error when it cannot.
bool readFile(const std::string& path, std::string* bytes, std::string* error);

}  // namespace calctrail
