// The report formats, registered once: the CLI's --format choices, its help
// text and the dispatch all come from this list. A renderer takes a Trail
// and a sink and nothing else.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include <fmt/format.h>

#include "engine/report/report_sink.h"
#include "engine/report/trail.h"

namespace calctrail {

using ReportRenderer = void (*)(const Trail& trail, ReportSink& out);

struct ReportFormat {
  const char* name;         // the --format value: "text", "md", "html", "json"
  const char* purpose;      // for --help: "terminal, git"
  ReportRenderer render;    // appends the report of a trail
};

// Every format, the default (text) first.
const std::vector<ReportFormat>& reportFormats();

// The format called `name`, or nullptr.
const ReportFormat* findReportFormat(std::string_view name);

// The names in order, for a command-line check ("text", "md", ...).
std::vector<std::string> reportFormatNames();

// "text (terminal, git), md (pull requests), ...", for --help.
std::string reportFormatHelp();

// The report of `trail` in `format`; false (and nothing written) for an
// unknown format. A sink with a writer has the report handed on as it is
// made; call its finish() after.
bool renderReport(const Trail& trail, std::string_view format, ReportSink& out);
// The same as a string; an unknown format gives the text trail (the default).
std::string renderReport(const Trail& trail, std::string_view format);

}  // namespace calctrail
