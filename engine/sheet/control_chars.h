// Control characters in worksheet text. A worksheet is read by people in
// terminals, editors and HTML reports, so no control character may pass
// through it raw: ESC starts terminal escape sequences, NUL cuts C strings,
// a lone CR moves the cursor back over what was printed. TAB is the only
// one allowed; a line ends with LF or CRLF (docs/format.md, "Lines").
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

namespace calctrail {

// Whether the code point is a control character a worksheet may not hold:
// C0 other than TAB, DEL, and the C1 range U+0080 to U+009F.
bool isForbiddenControl(char32_t c);

// Offset of the first forbidden control character in `s`, or npos; *length
// is its length in bytes (2 for C1 in UTF-8). Bytes that are not UTF-8 are
// skipped, not misread.
size_t findControlChar(std::string_view s, size_t* length);

// The error message for the control character that starts at s[at]:
// "a control character (ESC, 0x1B) ...", with the fix.
std::string controlCharMessage(std::string_view s, size_t at);

// `s` with every forbidden control character replaced by `?` (TAB stays),
// so that text quoting a worksheet can go to a terminal safely. One code
// point becomes one, so columns computed on `s` stay right.
std::string withoutControlChars(std::string_view s);

}  // namespace calctrail
