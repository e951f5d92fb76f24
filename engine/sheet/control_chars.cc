#include "engine/sheet/control_chars.h"

#include <cstdio>

#include "engine/util/utf8.h"

namespace calctrail {

namespace {

// The ASCII abbreviations of the C0 controls, as terminals and editors show them.
const char* const kC0Names[32] = {"NUL", "SOH", "STX", "ETX", "EOT", "ENQ", "ACK", "BEL",
                                  "BS",  "HT",  "LF",  "VT",  "FF",  "CR",  "SO",  "SI",
                                  "DLE", "DC1", "DC2", "DC3", "DC4", "NAK", "SYN", "ETB",
                                  "CAN", "EM",  "SUB", "ESC", "FS",  "GS",  "RS",  "US"};

// Length of the forbidden control character at s[i], or 0.
size_t controlAt(std::string_view s, size_t i) {
  const unsigned char c = static_cast<unsigned char>(s[i]);
  if ((c < 0x20 && c != '\t') || c == 0x7F) return 1;
  // C1 controls U+0080..U+009F are C2 80..C2 9F in UTF-8.
  if (c == 0xC2 && i + 1 < s.size()) {
    const unsigned char d = static_cast<unsigned char>(s[i + 1]);
    if (d >= 0x80 && d <= 0x9F) return 2;
  }
  return 0;
}

}  // namespace

bool isForbiddenControl(char32_t c) { return (c < 0x20 && c != '\t') || (c >= 0x7F && c <= 0x9F); }

size_t findControlChar(std::string_view s, size_t* length) {
  for (size_t i = 0; i < s.size(); ++i) {
    i += printableAsciiPrefix(s.substr(i));  // printable ASCII holds no control character
    if (i == s.size()) break;
    if (const size_t n = controlAt(s, i)) {
      *length = n;
      return i;
    }
  }
  return std::string_view::npos;
}

std::string controlCharMessage(std::string_view s, size_t at) {
  const unsigned char c = static_cast<unsigned char>(s[at]);
  char code[16];
  std::string name;
  if (c < 0x20) {
    std::snprintf(code, sizeof code, "0x%02X", c);
    name = std::string(kC0Names[c]) + ", " + code;
  } else if (c == 0x7F) {
    name = "DEL, 0x7F";
  } else {
    std::snprintf(code, sizeof code, "U+%04X", static_cast<unsigned char>(s[at + 1]));
    name = code;
  }
  if (c == '\r') {
    // A CR that ends a line is taken with its LF; any other is an error, so
    // that every reader of the file agrees on where its lines end.
    return "a control character (CR, 0x0D) that does not end a line: a line ends with LF or CRLF; "
           "delete it or end the line there";
  }
  return "a control character (" + name +
         ") is not allowed in worksheet text: it would reach terminals and reports as it is; delete it "
         "(a TAB is the only one allowed)";
}

std::string withoutControlChars(std::string_view s) {
  std::string out;
  out.reserve(s.size());
  for (size_t i = 0; i < s.size();) {
    if (const size_t n = controlAt(s, i)) {
      out += '?';
      i += n;
    } else {
      out += s[i++];
    }
  }
  return out;
}

}  // namespace calctrail
