#include "engine/report/csv_renderer.h"

#include <iterator>
#include <vector>

#include "engine/report/number_format.h"

namespace calctrail {

std::string csvField(std::string_view text) {
  if (text.find_first_of(",\"\r\n") == std::string_view::npos) return std::string(text);
  std::string out = "\"";
  for (char c : text) {
    if (c == '"') out += '"';
    out += c;
  }
  return out + "\"";
}

namespace {

// RFC 4180: fields separated by commas, every record ended by CRLF.
void appendRow(fmt::memory_buffer& out, const std::vector<std::string>& fields) {
  for (size_t i = 0; i < fields.size(); ++i)
    fmt::format_to(std::back_inserter(out), "{}{}", i ? "," : "", csvField(fields[i]));
  fmt::format_to(std::back_inserter(out), "\r\n");
}

const char* verdict(bool ok, bool passed) {
  return !ok ? "not evaluated" : passed ? "pass" : "FAIL";
}

}  // namespace

void renderCsv(const Trail& t, ReportSink& sink) {
  fmt::memory_buffer& out = sink.buffer();
  // Without cases, one column of values, named after the case shown.
  std::vector<std::string> header = {"name", "unit"};
  if (t.cases.empty()) header.push_back(t.shown_case.empty() ? kNominalCase : t.shown_case);
  for (const TrailCase& c : t.cases) header.push_back(c.name);
  header.push_back("description");
  appendRow(out, header);
  for (const TrailStep& s : t.steps.heads()) {
    sink.checkpoint();
    std::vector<std::string> row = {s.name, s.unit_written};
    if (t.cases.empty()) row.push_back(s.ok ? formatExact(s.result.value) : "");
    for (const TrailCaseValue& v : s.cases) row.push_back(v.ok ? formatExact(v.value.value) : "");
    row.push_back(s.description);
    appendRow(out, row);
  }
  for (const TrailCheck& c : t.checks) {
    std::vector<std::string> row = {"check " + c.name, ""};
    if (t.cases.empty()) row.push_back(verdict(c.ok, c.passed));
    for (size_t k = 0; k < c.cases.size(); ++k) {
      std::string cell = verdict(c.cases[k].ok, c.cases[k].passed);
      if (static_cast<int>(k) == c.governing) cell += " (governing)";
      row.push_back(cell);
    }
    row.push_back(c.description);
    appendRow(out, row);
  }
  // What the numbers come from, after the table so that a spreadsheet reads
  // the table from the first row: the file, its hash, any --set, the sign-off.
  auto identity = [&](const std::string& key, const std::string& value) {
    std::vector<std::string> row(header.size());
    row[0] = key;
    row[1] = value;
    appendRow(out, row);
  };
  appendRow(out, std::vector<std::string>(header.size()));
  identity("file", t.path);
  identity("sha256", t.sha256);
  identity("generator", t.generator);
  if (!t.modified_by.empty()) identity("modified", modifiedNotice(t));
  identity("sign-off", signOffStatement(t));
}

std::string renderCsv(const Trail& t) {
  ReportSink sink;
  renderCsv(t, sink);
  return sink.text();
}

}  // namespace calctrail
