// Parses unit expressions as engineers type them: "N*m", "lbf·in", "in/min",
// "kg/m^3", "m/s^2", "N/mm²", "1/in", "rev/min", "ft*lbf/s", "W/(m*K)".
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

#include "engine/units/unit.h"

namespace calctrail {

struct UnitError {
  size_t offset = 0;    // byte offset into the parsed text where the problem is
  std::string message;  // plain words, with suggestions where there are any
};

// Parses `text` into *out (with out->text in canonical spelling). On failure
// returns false and fills *err; *out is then unspecified.
bool parseUnit(std::string_view text, Unit* out, UnitError* err);

}  // namespace calctrail
