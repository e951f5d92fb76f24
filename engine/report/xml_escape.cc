#include "engine/report/xml_escape.h"

namespace calctrail {

std::string escapeXml(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  size_t run = 0;  // the bytes before it are written
  for (size_t i = 0; i < text.size(); ++i) {
    // All five are below '@': letters and UTF-8 are passed over with one test.
    if (static_cast<unsigned char>(text[i]) >= '@') continue;
    const char* entity = nullptr;
    switch (text[i]) {
      case '&': entity = "&amp;"; break;
      case '<': entity = "&lt;"; break;
      case '>': entity = "&gt;"; break;
      case '"': entity = "&quot;"; break;
      case '\'': entity = "&#39;"; break;
      default: continue;
    }
    out.append(text.data() + run, i - run);
    out += entity;
    run = i + 1;
  }
  out.append(text.data() + run, text.size() - run);
  return out;
}

}  // namespace calctrail
