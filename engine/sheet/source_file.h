// The bytes of one worksheet and the map from byte offsets to lines and
// columns. Columns count Unicode code points from 1, as editors show them.
// Reading a worksheet is bounded (docs/limits.md), so no input, a device or an
// endless stream included, can exhaust memory or outgrow the 32-bit offsets.
#pragma once

#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

// The largest worksheet calctrail reads: a generated sheet of a million
// lines (51 MB), which the benchmarks report on in about 1 GB (under 1 KB a
// line, docs/performance.md), fits; far below the 4 GiB that byte offsets
// can address.
constexpr size_t kMaxSourceBytes = size_t{64} << 20;
// The longest line: well beyond any formula the expression parser accepts
// written with names of usual length; each diagnostic copies and prints its line.
constexpr size_t kMaxLineBytes = size_t{64} << 10;

struct SourcePos {
  int line = 0;    // 1-based
  int column = 0;  // 1-based, in code points
};

class SourceFile {
 public:
  // Throws std::length_error for bytes past kMaxSourceBytes: every reader checks
  // the limit first (readFile, checkSourceLimits), so only a caller that skips it gets here.
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

// Why a worksheet could not be read.
struct ReadError {
  std::string message;  // one line, such as "cannot read file: No such file or directory"
  int line = 0;         // the 1-based line the problem is on; 0 for the file as a whole
};

// Reads a whole file, within kMaxSourceBytes and kMaxLineBytes; false with the
// reason in *error when it cannot (a directory, a missing file, a limit passed).
bool readFile(const std::string& path, std::string* bytes, ReadError* error);
// The same, with the reason as text (a line over the limit is named in it).
bool readFile(const std::string& path, std::string* bytes, std::string* error);
// Reads standard input to its end, within the same limits.
bool readStandardInput(std::string* bytes, ReadError* error);
// Whether bytes from elsewhere (a git blob, say) keep to the same limits;
// `what` names them in the message ("the file", "standard input").
bool checkSourceLimits(std::string_view bytes, const std::string& what, ReadError* error);

}  // namespace calctrail
