// The trail as CSV (RFC 4180) for a spreadsheet: one row per quantity with
// a value column per load case, then one row per check with its result per
// case. Values are in the unit shown (its own column) at full precision.
#pragma once

#include <string>
#include <string_view>

#include <fmt/format.h>

#include "engine/report/report_sink.h"
#include "engine/report/trail.h"

namespace calctrail {

// Appends the CSV of `trail` to `out`. Reads the trail alone.
void renderCsv(const Trail& trail, ReportSink& sink);
std::string renderCsv(const Trail& trail);

// One field as RFC 4180 writes it: in double quotes, each quote doubled,
// when it holds a comma, a quote, CR or LF; else as it is.
std::string csvField(std::string_view text);

}  // namespace calctrail
