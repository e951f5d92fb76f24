// Parses unit expressions as engineers type them: "N*m", "lbf·in", "in/min",
// "kg/m^3", "m/s^2", "N/mm²", "1/in", "rev/min", "ft*lbf/s", "W/(m*K)".
#pragma once

#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

#include "engine/units/unit.h"

namespace calctrail {

struct UnitError {
  size_t offset = 0;    // byte offset into the parsed text where the problem is
  std::string message;  // plain words, with suggestions where there are any
};

// Parses `text` into *out (with out->text in canonical spelling). On failure
// returns false and fills *err; *out is then unspecified.
// `after_number` is the number a bare unit name was written after ("5" in
// `5 Nm`): the suggested fixes are then whole literals (`5 [N*m]`, `5 mm`),
// since a compound unit written bare after a number would not parse.
bool parseUnit(std::string_view text, Unit* out, UnitError* err, std::string_view after_number = {});

// Units typed without their product sign, as products of table units: "Nm"
// gives N*m, "kNm" kN*m, "Nmm" N*mm. A split into three units is tried only
// when no split into two fits; a lone prefix letter is not split off ("mNm"
// is mN*m, not m*N*m). Empty when `word` is a known unit or no such product.
std::vector<std::string> runTogetherUnits(std::string_view word);

}  // namespace calctrail
