#include "engine/util/exact_number.h"

#include <fmt/format.h>

namespace calctrail {

// fmt's default for a double is the shortest round-trip text.
std::string formatExact(double value) { return fmt::format("{}", value); }

}  // namespace calctrail
