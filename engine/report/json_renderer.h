// The trail as JSON: the contract's minimum (quantities with value, unit,
// si, formula, description; checks with passed; warnings) and more, with
// numbers at full double precision. Schema: docs/json.md.
#pragma once

#include <string>

#include <fmt/format.h>

#include "engine/calculation.h"
#include "engine/report/report_sink.h"
#include "engine/report/trail.h"

namespace calctrail {

constexpr const char* kJsonSchemaVersion = "calctrail-trail/1";

// Appends the JSON of `trail` to `out`. Reads the trail alone.
void renderJson(const Trail& trail, ReportSink& sink);
std::string renderJson(const Trail& trail);

// The old entry point, kept for engine/cli/report_command.cc until it moves
// to formats.h: `calc` is no longer read.
std::string renderJson(const Calculation& calc, const Trail& trail);

}  // namespace calctrail
