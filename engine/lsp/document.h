// The text of one open worksheet as the editor has it, kept in step with the
// editor's incremental edits, and the map between the protocol's positions
// (0-based line, column in UTF-16 code units) and byte offsets. calctrail's
// own columns count code points; the two differ only for characters beyond
// the Basic Multilingual Plane (an emoji in a description), which take two
// UTF-16 units. Bytes that are not UTF-8 count as one unit each.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace calctrail::lsp {

// A place in a document as the protocol gives it.
struct Position {
  /// 0-based line.
  int64_t line = 0;
  /// 0-based column in UTF-16 code units.
  int64_t character = 0;
};

// A range [start, end) as the protocol gives it.
struct Range {
  /// The first position in the range.
  Position start;
  /// The position just after the range.
  Position end;
};

class Document {
 public:
  Document(std::string uri, std::string text, int64_t version);

  const std::string& uri() const { return uri_; }
  const std::string& text() const { return text_; }
  int64_t version() const { return version_; }
  void setVersion(int64_t v) { version_ = v; }
  int lineCount() const { return static_cast<int>(line_starts_.size()); }

  // Replaces the whole text.
  void replace(std::string text);
  // Replaces `range` by `text`, as a didChange content change. Positions
  // beyond a line's end or the document's end are clamped to it, as the
  // protocol asks; false (nothing changed) when start comes after end.
  bool edit(const Range& range, std::string_view text);

  // Byte offset of `pos`; false when the line does not exist (a character
  // beyond the line's end gives the line's end).
  bool offset(const Position& pos, uint32_t* out) const;
  // The protocol position of a byte offset (clamped to the text).
  Position position(uint32_t offset) const;
  // The protocol position of a 1-based line and 1-based code-point column,
  // as calctrail's diagnostics give them.
  Position fromCodePoints(int line, int column) const;
  // The text of a 0-based line without its line ending.
  std::string_view lineText(int line) const;
  // The position just after the last character.
  Position end() const { return position(static_cast<uint32_t>(text_.size())); }

 private:
  void index();
  uint32_t clampedOffset(const Position& pos) const;

  std::string uri_;
  std::string text_;
  int64_t version_ = 0;
  std::vector<uint32_t> line_starts_;
};

// UTF-16 code units of `s`.
int64_t utf16Length(std::string_view s);
// The byte length of the prefix of `s` that is `units` UTF-16 units long (all of `s` when shorter).
size_t bytesForUtf16(std::string_view s, int64_t units);

}  // namespace calctrail::lsp
