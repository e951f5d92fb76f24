#include "engine/sheet/diagnostics.h"

#include <algorithm>

#include "engine/sheet/control_chars.h"
#include "engine/util/text_width.h"
#include "engine/util/utf8.h"

namespace calctrail {

namespace {
const char* severityWord(Severity s) { return s == Severity::Error ? "error" : "warning"; }
}  // namespace

std::string Diagnostic::headline() const {
  // Problems without a place (an unreadable or empty file) point at 1:1, so
  // every line keeps the FILE:LINE:COL form that editors and CI parse.
  std::string out = withoutControlChars(path);
  out += ":" + std::to_string(line > 0 ? line : 1) + ":" + std::to_string(line > 0 ? column : 1);
  out += ": ";
  out += severityWord(severity);
  out += ": " + message;
  return out;
}

std::string Diagnostic::render() const {
  std::string out = headline() + "\n";
  if (line > 0 && !source_line.empty()) {
    out += "    " + source_line + "\n";
    out += "    " + std::string(static_cast<size_t>(std::max(0, caret_column - 1)), ' ');
    out += "^" + std::string(static_cast<size_t>(std::max(0, caret_width - 1)), '~') + "\n";
  }
  return out;
}

void Diagnostics::addAt(Severity s, const SourceFile& file, uint32_t begin, uint32_t end,
                        const std::string& message, DiagnosticSite site) {
  Diagnostic d;
  d.severity = s;
  d.site = site;
  d.path = file.path();
  d.message = withoutControlChars(message);
  const SourcePos pos = file.position(begin);
  d.line = pos.line;
  d.column = pos.column;
  std::string_view text = file.lineText(pos.line);
  // Show tabs as single spaces so the caret stays under the right character.
  d.source_line.assign(text.begin(), text.end());
  // Bytes that are not UTF-8 are shown as '?', so the message itself stays valid text.
  // Each search resumes after the last byte replaced, so a line of bad bytes costs one pass.
  for (size_t from = 0, bad;
       (bad = findInvalidUtf8(std::string_view(d.source_line).substr(from))) != std::string::npos; from += bad + 1)
    d.source_line[from + bad] = '?';
  // Nor does a control character reach the terminal: the message names it.
  d.source_line = withoutControlChars(d.source_line);
  std::replace(d.source_line.begin(), d.source_line.end(), '\t', ' ');
  d.caret_column = pos.column;
  const uint32_t line_end = file.lineStart(pos.line) + static_cast<uint32_t>(text.size());
  end = std::min(std::max(end, begin + 1), std::max(line_end, begin + 1));
  if (begin < line_end) {
    d.caret_width = std::max(1, displayWidth(std::string_view(file.bytes()).substr(
                                    begin, std::min(end, line_end) - begin)));
  }
  list_.push_back(std::move(d));
}

void Diagnostics::error(const SourceFile& file, uint32_t begin, uint32_t end,
                        const std::string& message) {
  addAt(Severity::Error, file, begin, end, message);
}

void Diagnostics::warning(const SourceFile& file, uint32_t begin, uint32_t end,
                          const std::string& message, DiagnosticSite site) {
  addAt(Severity::Warning, file, begin, end, message, site);
}

void Diagnostics::error(const std::string& path, const std::string& message) {
  Diagnostic d;
  d.path = path;
  d.message = withoutControlChars(message);
  list_.push_back(std::move(d));
}

void Diagnostics::add(Diagnostic d) {
  d.message = withoutControlChars(d.message);
  d.source_line = withoutControlChars(d.source_line);
  list_.push_back(std::move(d));
}

bool Diagnostics::hasErrors() const { return errorCount() > 0; }

int Diagnostics::errorCount() const {
  return static_cast<int>(std::count_if(list_.begin(), list_.end(), [](const Diagnostic& d) {
    return d.severity == Severity::Error;
  }));
}

int Diagnostics::warningCount() const { return static_cast<int>(list_.size()) - errorCount(); }

void Diagnostics::sort() {
  std::stable_sort(list_.begin(), list_.end(), [](const Diagnostic& a, const Diagnostic& b) {
    if (a.path != b.path) return a.path < b.path;
    if (a.line != b.line) return a.line < b.line;
    return a.column < b.column;
  });
}

}  // namespace calctrail
