#include "engine/report/formats.h"

#include "engine/report/csv_renderer.h"
#include "engine/report/html_renderer.h"
#include "engine/report/json_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/text_renderer.h"

namespace calctrail {

const std::vector<ReportFormat>& reportFormats() {
  // Each renderer is overloaded (sink or string): name the sink form.
  static const std::vector<ReportFormat> formats = {
      {"text", "terminal, git", static_cast<ReportRenderer>(&renderText)},
      {"md", "pull requests", static_cast<ReportRenderer>(&renderMarkdown)},
      {"html", "print to PDF", static_cast<ReportRenderer>(&renderHtml)},
      {"json", "tools", static_cast<ReportRenderer>(&renderJson)},
      {"csv", "spreadsheets", static_cast<ReportRenderer>(&renderCsv)},
  };
  return formats;
}

const ReportFormat* findReportFormat(std::string_view name) {
  for (const ReportFormat& f : reportFormats())
    if (name == f.name) return &f;
  return nullptr;
}

std::vector<std::string> reportFormatNames() {
  std::vector<std::string> names;
  for (const ReportFormat& f : reportFormats()) names.emplace_back(f.name);
  return names;
}

std::string reportFormatHelp() {
  fmt::memory_buffer out;
  for (const ReportFormat& f : reportFormats())
    fmt::format_to(std::back_inserter(out), "{}{} ({})", out.size() ? ", " : "", f.name, f.purpose);
  return fmt::to_string(out);
}

bool renderReport(const Trail& trail, std::string_view format, ReportSink& out) {
  const ReportFormat* f = findReportFormat(format);
  if (!f) return false;
  f->render(trail, out);
  return true;
}

std::string renderReport(const Trail& trail, std::string_view format) {
  ReportSink out;
  if (!renderReport(trail, format, out)) reportFormats().front().render(trail, out);
  return out.text();
}

}  // namespace calctrail
