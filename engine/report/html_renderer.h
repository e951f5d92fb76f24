// The calculation trail as one self-contained HTML file: no script, no
// network fetch, no web font. Formulas are typeset in MathML with the
// substituted values beneath; the checks summary stands first, the sign-off
// block last, and a print stylesheet gives page headers (title, calculation
// number, revision, page n of N) when printed to PDF. docs/reports.md.
#pragma once

#include <string>

#include <fmt/format.h>

#include "engine/report/report_sink.h"
#include "engine/report/trail.h"

namespace calctrail {

// `trail` must come from a Calculation that is still alive: the formulas
// are typeset from its expression trees (TrailStep::expr).
// Appends the HTML document to `out`.
void renderHtml(const Trail& trail, ReportSink& sink);
std::string renderHtml(const Trail& trail);

}  // namespace calctrail
