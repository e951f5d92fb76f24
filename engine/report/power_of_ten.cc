#include "engine/report/power_of_ten.h"

#include <cctype>

namespace calctrail {

namespace {
bool digit(char c) { return std::isdigit(static_cast<unsigned char>(c)) != 0; }
bool wordChar(char c) { return std::isalnum(static_cast<unsigned char>(c)) != 0 || c == '_'; }

const char* superscript(char c) {
  static const char* const digits[] = {"\u2070", "\u00B9", "\u00B2", "\u00B3", "\u2074",
                                       "\u2075", "\u2076", "\u2077", "\u2078", "\u2079"};
  return digits[c - '0'];
}
}  // namespace

std::string superscriptExponent(std::string_view exponent) {
  std::string out;
  size_t d = 0;
  if (d < exponent.size() && (exponent[d] == '-' || exponent[d] == '+')) {
    if (exponent[d] == '-') out += "\u207B";
    ++d;
  }
  while (d + 1 < exponent.size() && exponent[d] == '0') ++d;  // 1e-03 is 10⁻³
  for (; d < exponent.size(); ++d)
    if (digit(exponent[d])) out += superscript(exponent[d]);
  return out;
}

std::string timesTenPowers(const std::string& text) {
  std::string out;
  size_t i = 0;
  while (i < text.size()) {
    // A mantissa starts at a digit that does not continue a word or a number.
    const bool starts = digit(text[i]) && (i == 0 || (!wordChar(text[i - 1]) && text[i - 1] != '.'));
    if (!starts) {
      out += text[i++];
      continue;
    }
    size_t j = i;
    while (j < text.size() && digit(text[j])) ++j;
    if (j < text.size() && text[j] == '.') {
      ++j;
      while (j < text.size() && digit(text[j])) ++j;
    }
    size_t k = j;
    if (k < text.size() && (text[k] == 'e' || text[k] == 'E')) {
      ++k;
      const bool negative = k < text.size() && text[k] == '-';
      if (k < text.size() && (text[k] == '-' || text[k] == '+')) ++k;
      const size_t exp_begin = k;
      while (k < text.size() && digit(text[k])) ++k;
      if (k > exp_begin && (k == text.size() || !wordChar(text[k]))) {
        out.append(text, i, j - i);
        out += " \u00D7 10";
        if (negative) out += "\u207B";
        out += superscriptExponent(std::string_view(text).substr(exp_begin, k - exp_begin));
        i = k;
        continue;
      }
    }
    // Not e-notation: copy the whole number so its digits are not rescanned.
    out.append(text, i, j - i);
    i = j;
  }
  return out;
}

}  // namespace calctrail
