#include "engine/cli/check_report.h"

#include <fmt/format.h>

#include "engine/cli/commands.h"
#include "engine/report/xml_escape.h"
#include "engine/util/json_writer.h"

namespace calctrail {

int FileCheck::failedChecks() const {
  int n = 0;
  for (const CheckOutcome& c : checks) n += c.passed ? 0 : 1;
  return n;
}

int FileCheck::passedChecks() const { return static_cast<int>(checks.size()) - failedChecks(); }

std::string checkTextOut(const FileCheck& f) {
  std::string out;
  for (const CheckOutcome& c : f.checks)
    if (!c.passed) out += c.headline + "\n";
  return out;
}

std::string checkTextErr(const FileCheck& f) {
  std::string err;
  for (const CheckError& e : f.errors) err += e.headline + "\n";
  return err;
}

namespace {

struct Totals {
  int files = 0, files_failing = 0, files_with_errors = 0;
  int checks = 0, checks_failed = 0, errors = 0, warnings = 0;
};

Totals totalsOf(const std::vector<FileCheck>& files) {
  Totals t;
  for (const FileCheck& f : files) {
    ++t.files;
    const int failed = f.failedChecks();
    if (failed) ++t.files_failing;
    if (!f.errors.empty()) ++t.files_with_errors;
    t.checks += static_cast<int>(f.checks.size());
    t.checks_failed += failed;
    t.errors += static_cast<int>(f.errors.size());
    t.warnings += f.warnings;
  }
  return t;
}

std::string plural(int n, const char* word) { return fmt::format("{} {}{}", n, word, n == 1 ? "" : "s"); }

void writeError(JsonWriter& w, const CheckError& e) {
  w.beginObject();
  w.key("file").value(e.file);
  w.key("line").value(e.line);
  w.key("col").value(e.column);
  w.key("message").value(e.message);
  w.key("text").value(e.headline);
  w.endObject();
}

// An XML attribute's value: escapeXml covers & < > " ', and a line break
// would be normalised to a space by any XML reader, so it is written as a reference.
std::string attr(const std::string& text) {
  std::string out;
  for (char ch : escapeXml(text)) {
    if (ch == '\n') out += "&#10;";
    else if (ch == '\r') out += "&#13;";
    else if (ch == '\t') out += "&#9;";
    else out += ch;
  }
  return out;
}

}  // namespace

std::string checkSummaryLine(const std::vector<FileCheck>& files) {
  const Totals t = totalsOf(files);
  std::string line = plural(t.files, "worksheet") + ", " + plural(t.checks, "check") + ": " +
                     std::to_string(t.checks_failed) + " failed";
  if (t.files_with_errors) line += "; " + plural(t.files_with_errors, "worksheet") + " with errors";
  return line + "\n";
}

int checkExitStatus(const std::vector<FileCheck>& files) {
  const Totals t = totalsOf(files);
  if (t.files_with_errors) return kExitError;
  return t.files_failing ? kExitCheckFailed : kExitOk;
}

std::string renderCheckJson(const std::vector<FileCheck>& files) {
  JsonWriter w;
  w.beginObject();
  w.key("schema").value("calctrail-check/1");
  w.key("generator").value(std::string("calctrail ") + CALCTRAIL_VERSION);
  w.key("files").beginArray();
  for (const FileCheck& f : files) {
    w.beginObject();
    w.key("path").value(f.path);
    w.key("evaluated").value(f.evaluated);
    w.key("checks_passed").value(f.passedChecks());
    w.key("checks_failed").value(f.failedChecks());
    w.key("errors_count").value(static_cast<int>(f.errors.size()));
    w.key("warnings_count").value(f.warnings);
    w.key("errors").beginArray();
    for (const CheckError& e : f.errors) writeError(w, e);
    w.endArray();
    w.key("failed").beginArray();
    for (const CheckOutcome& c : f.checks) {
      if (c.passed) continue;
      w.beginObject();
      w.key("name").value(c.name);
      w.key("case").value(c.case_name);
      w.key("file").value(c.file);
      w.key("line").value(c.line);
      w.key("col").value(c.column);
      w.key("message").value(c.message);
      w.key("text").value(c.headline);
      w.endObject();
    }
    w.endArray();
    w.endObject();
  }
  w.endArray();
  const Totals t = totalsOf(files);
  w.key("totals").beginObject();
  w.key("files").value(t.files);
  w.key("files_failing").value(t.files_failing);
  w.key("files_with_errors").value(t.files_with_errors);
  w.key("checks_passed").value(t.checks - t.checks_failed);
  w.key("checks_failed").value(t.checks_failed);
  w.key("errors").value(t.errors);
  w.key("warnings").value(t.warnings);
  w.endObject();
  w.key("exit_status").value(checkExitStatus(files));
  w.endObject();
  return w.str() + "\n";
}

std::string renderCheckJunit(const std::vector<FileCheck>& files) {
  // A file with errors is one <testcase name="evaluate"> holding an <error>
  // with every error line: CI then shows the file as broken, not as passing.
  int tests = 0, failures = 0, errors = 0;
  for (const FileCheck& f : files) {
    tests += static_cast<int>(f.checks.size()) + (f.errors.empty() ? 0 : 1);
    failures += f.failedChecks();
    errors += f.errors.empty() ? 0 : 1;
  }
  fmt::memory_buffer out;
  fmt::format_to(std::back_inserter(out), "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
  fmt::format_to(std::back_inserter(out), "<testsuites name=\"calctrail check\" tests=\"{}\" failures=\"{}\" errors=\"{}\">\n",
                 tests, failures, errors);
  for (const FileCheck& f : files) {
    const std::string path = attr(f.path);
    const int suite_errors = f.errors.empty() ? 0 : 1;
    fmt::format_to(std::back_inserter(out),
                   "  <testsuite name=\"{}\" tests=\"{}\" failures=\"{}\" errors=\"{}\" skipped=\"0\">\n", path,
                   static_cast<int>(f.checks.size()) + suite_errors, f.failedChecks(), suite_errors);
    if (suite_errors) {
      std::string all;
      for (const CheckError& e : f.errors) all += e.headline + "\n";
      fmt::format_to(std::back_inserter(out),
                     "    <testcase name=\"evaluate\" classname=\"{}\">\n"
                     "      <error message=\"{}\" type=\"error\">{}</error>\n"
                     "    </testcase>\n",
                     path, attr(f.errors.front().headline), escapeXml(all));
    }
    for (const CheckOutcome& c : f.checks) {
      const std::string name = attr(c.name + " (case " + c.case_name + ")");
      if (c.passed) {
        fmt::format_to(std::back_inserter(out), "    <testcase name=\"{}\" classname=\"{}\"/>\n", name, path);
        continue;
      }
      fmt::format_to(std::back_inserter(out),
                     "    <testcase name=\"{}\" classname=\"{}\">\n"
                     "      <failure message=\"{}\" type=\"check\">{}</failure>\n"
                     "    </testcase>\n",
                     name, path, attr(c.message), escapeXml(c.headline + "\n"));
    }
    fmt::format_to(std::back_inserter(out), "  </testsuite>\n");
  }
  fmt::format_to(std::back_inserter(out), "</testsuites>\n");
  return fmt::to_string(out);
}

}  // namespace calctrail
