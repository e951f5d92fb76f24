#include "engine/sheet/number_literal.h"

#include <cerrno>
#include <charconv>
#include <cmath>
#include <cstdlib>
#include <string>

namespace calctrail {

double decimalValue(std::string_view literal, bool* in_range) {
  // from_chars rounds correctly, as glibc's strtod does, at a third of the
  // cost and without a copy to terminate the text. Where the two could differ
  // (zero, subnormal and out-of-range values, which strtod flags with ERANGE
  // in its own way, or text from_chars leaves unread) strtod decides.
  double value = 0.0;
  const char* const end = literal.data() + literal.size();
  const std::from_chars_result r = std::from_chars(literal.data(), end, value);
  if (r.ec == std::errc() && r.ptr == end && std::isnormal(value)) {
    *in_range = true;
    return value;
  }
  errno = 0;
  value = std::strtod(std::string(literal).c_str(), nullptr);
  *in_range = errno != ERANGE;
  return value;
}

}  // namespace calctrail
