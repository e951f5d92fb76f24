// The plain-text calculation trail: for terminals, files and `git diff`.
// Stable: the same worksheet and options give the same bytes.
#pragma once

#include <string>

#include <fmt/format.h>

#include "engine/report/report_sink.h"
#include "engine/report/trail.h"

namespace calctrail {

// Appends the text trail to `out`.
void renderText(const Trail& trail, ReportSink& sink);
std::string renderText(const Trail& trail);

}  // namespace calctrail
