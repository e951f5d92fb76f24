#include "engine/util/text_width.h"

#include <algorithm>

namespace calctrail {

int displayWidth(std::string_view s) {
  int n = 0;
  for (char c : s)
    if ((static_cast<unsigned char>(c) & 0xC0) != 0x80) ++n;  // count lead bytes only
  return n;
}

std::string padRight(const std::string& s, int width) {
  return s + std::string(static_cast<size_t>(std::max(0, width - displayWidth(s))), ' ');
}

}  // namespace calctrail
