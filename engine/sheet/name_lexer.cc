#include "engine/sheet/name_lexer.h"

#include "engine/util/utf8.h"

namespace calctrail {

namespace {

bool isAsciiLetter(char c) { return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'); }
bool isAsciiNameChar(char c) { return isAsciiLetter(c) || (c >= '0' && c <= '9') || c == '_'; }

// The byte length of the Greek letter at s[at], or 0 when there is none.
size_t greekLetterAt(std::string_view s, size_t at) {
  if (static_cast<unsigned char>(s[at]) < 0x80) return 0;
  size_t n = 0;
  return isGreekLetter(decodeUtf8(s, at, &n)) ? n : 0;
}

}  // namespace

bool isNameStart(std::string_view s, size_t at) {
  return at < s.size() && (isAsciiLetter(s[at]) || greekLetterAt(s, at) > 0);
}

size_t nameEnd(std::string_view s, size_t at, bool dotted) {
  if (!isNameStart(s, at)) return at;
  size_t p = at;
  while (p < s.size()) {
    if (isAsciiNameChar(s[p])) {
      ++p;
    } else if (dotted && s[p] == '.' && isNameStart(s, p + 1)) {
      ++p;
    } else if (const size_t n = greekLetterAt(s, p)) {
      p += n;
    } else {
      break;
    }
  }
  return p;
}

}  // namespace calctrail
