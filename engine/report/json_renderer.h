// The trail as JSON: the contract's minimum (quantities with value, unit,
// si, formula, description; checks with passed; warnings) and more, with
// numbers at full double precision. Schema: docs/json.md.
#pragma once

#include <string>

#include "engine/calculation.h"
#include "engine/report/trail.h"

namespace calctrail {

constexpr const char* kJsonSchemaVersion = "calctrail-trail/1";

std::string renderJson(const Calculation& calc, const Trail& trail);

}  // namespace calctrail
