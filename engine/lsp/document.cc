#include "engine/lsp/document.h"

#include <algorithm>

#include "engine/util/utf8.h"

namespace calctrail::lsp {

namespace {

// Byte length of the character at s[i] and its UTF-16 units, by the one UTF-8
// decoder: a byte that starts no valid sequence is one byte and one unit, as
// an editor shows it (one U+FFFD a byte).
void step(std::string_view s, size_t i, size_t* bytes, int* units) {
  const Utf8Char c = readUtf8(s, i);
  *bytes = c.length;
  *units = c.cp >= 0x10000 ? 2 : 1;
}

}  // namespace

int64_t utf16Length(std::string_view s) {
  int64_t units = 0;
  for (size_t i = 0; i < s.size();) {
    size_t n;
    int u;
    step(s, i, &n, &u);
    i += n;
    units += u;
  }
  return units;
}

size_t bytesForUtf16(std::string_view s, int64_t units) {
  size_t i = 0;
  while (i < s.size() && units > 0) {
    size_t n;
    int u;
    step(s, i, &n, &u);
    i += n;
    units -= u;  // a position inside a surrogate pair lands after the pair
  }
  return i;
}

Document::Document(std::string uri, std::string text, int64_t version)
    : uri_(std::move(uri)), text_(std::move(text)), version_(version) {
  index();
}

void Document::index() {
  line_starts_.assign(1, 0);
  for (size_t i = 0; i < text_.size(); ++i)
    if (text_[i] == '\n') line_starts_.push_back(static_cast<uint32_t>(i + 1));
}

void Document::replace(std::string text) {
  text_ = std::move(text);
  index();
}

std::string_view Document::lineText(int line) const {
  if (line < 0 || line >= lineCount()) return {};
  const size_t begin = line_starts_[line];
  size_t end = line + 1 < lineCount() ? line_starts_[line + 1] - 1 : text_.size();
  if (end > begin && text_[end - 1] == '\r') --end;
  return std::string_view(text_).substr(begin, end - begin);
}

bool Document::offset(const Position& pos, uint32_t* out) const {
  if (pos.line < 0 || pos.line >= lineCount() || pos.character < 0) return false;
  *out = clampedOffset(pos);
  return true;
}

uint32_t Document::clampedOffset(const Position& pos) const {
  if (pos.line < 0) return 0;
  if (pos.line >= lineCount()) return static_cast<uint32_t>(text_.size());
  const int line = static_cast<int>(pos.line);
  const std::string_view text = lineText(line);
  return line_starts_[line] + static_cast<uint32_t>(bytesForUtf16(text, std::max<int64_t>(0, pos.character)));
}

Position Document::position(uint32_t offset) const {
  offset = std::min<uint32_t>(offset, static_cast<uint32_t>(text_.size()));
  const auto it = std::upper_bound(line_starts_.begin(), line_starts_.end(), offset);
  const int line = static_cast<int>(it - line_starts_.begin()) - 1;
  const std::string_view text = lineText(line);
  const size_t in_line = std::min<size_t>(offset - line_starts_[line], text.size());
  return {line, utf16Length(text.substr(0, in_line))};
}

Position Document::fromCodePoints(int line, int column) const {
  if (line < 1) return {0, 0};
  if (line > lineCount()) return end();
  const std::string_view text = lineText(line - 1);
  size_t i = 0;
  int64_t units = 0;
  for (int cp = 1; cp < column && i < text.size(); ++cp) {
    size_t n;
    int u;
    step(text, i, &n, &u);
    i += n;
    units += u;
  }
  return {line - 1, units};
}

bool Document::edit(const Range& range, std::string_view text) {
  const uint32_t begin = clampedOffset(range.start), end = clampedOffset(range.end);
  if (begin > end) return false;
  text_.replace(begin, end - begin, text.data(), text.size());
  index();
  return true;
}

}  // namespace calctrail::lsp
