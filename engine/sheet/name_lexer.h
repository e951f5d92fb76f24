// Names as a worksheet writes them (docs/format.md): an ASCII or Greek
// letter, then ASCII letters, digits, `_` or Greek letters. The one lexer
// of names that the line parser and the expression parser share.
#pragma once

#include <cstddef>
#include <string_view>

namespace calctrail {

/// A name starts at s[at]: an ASCII letter, or a Greek letter in UTF-8.
bool isNameStart(std::string_view s, size_t at);

/// The end of the name that starts at s[at], or `at` when none does. With
/// `dotted`, a `.` followed by a name start continues the name (an
/// instance's quantity, `left.T_raise`, docs/templates.md).
size_t nameEnd(std::string_view s, size_t at, bool dotted = false);

}  // namespace calctrail
