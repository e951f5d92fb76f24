// Column widths of UTF-8 text, for aligned plain-text output: one column per
// code point (the trail's symbols, · ² µ °, are all one column wide).
#pragma once

#include <string>
#include <string_view>

namespace calctrail {

int displayWidth(std::string_view s);

// `s` followed by spaces up to `width` columns.
std::string padRight(const std::string& s, int width);

}  // namespace calctrail
