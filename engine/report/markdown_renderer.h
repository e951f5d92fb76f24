// The calculation trail as Markdown (CommonMark with GitHub tables), for
// pasting into a pull request or a wiki: the text trail's content in its
// order, with headings, tables, and formulas in code spans. docs/reports.md.
#pragma once

#include <string>

#include <fmt/format.h>

#include "engine/report/report_sink.h"
#include "engine/report/trail.h"

namespace calctrail {

// Appends the Markdown trail to `out`.
void renderMarkdown(const Trail& trail, ReportSink& sink);
std::string renderMarkdown(const Trail& trail);

}  // namespace calctrail
