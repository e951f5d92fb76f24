#include <algorithm>
#include <atomic>
#include <cstdio>
#include <exception>
#include <iostream>
#include <thread>

#include "engine/calculation.h"
#include "engine/cli/check_report.h"
#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/report/number_format.h"
#include "engine/report/trail.h"

namespace calctrail {

namespace {

// A side of a failed check as the report shows it: a literal as written ("3",
// "20 ksi"), a calculated value to 4 significant digits in the check's unit.
std::string side(const Expr& expr, bool evaluated, double si, const Unit& unit) {
  return evaluated ? valueText(checkSideValue(expr, si, unit, 4)) : formatQuantity(si, unit, 4);
}

CheckError errorOf(const Diagnostic& d) {
  CheckError e;
  e.file = d.path;
  e.line = d.line;
  e.column = d.column;
  e.message = d.message;
  e.headline = d.headline();
  return e;
}

// Calculates one worksheet and records every check of every case. Thread-safe:
// the calculation is the file's own; only `templates` is shared (it locks).
FileCheck checkFile(const std::string& file, const CheckArgs& args, TemplateCache* templates) {
  CalcOptions options;
  options.sets = args.sets;
  options.case_name = args.case_name;
  options.templates = templates;
  auto calc = loadWorksheet(file, options);
  FileCheck f;
  f.path = calc->path;
  f.warnings = calc->diags.warningCount();
  if (calc->hasErrors()) {
    for (const Diagnostic& d : calc->diags.list())
      if (d.severity == Severity::Error) f.errors.push_back(errorOf(d));
    return f;
  }
  f.evaluated = true;
  // Each check in each case; a case that could not be calculated is an error
  // of the file, the other cases still checked.
  auto record = [&](const std::string& in_case, const std::vector<CheckResult>& results) {
    for (size_t k = 0; k < calc->checkCount(); ++k) {
      const CheckResult& r = results[k];
      const Check& c = calc->sheet.checks[k];
      CheckOutcome o;
      o.name = c.name;
      o.case_name = in_case.empty() ? "nominal" : in_case;
      o.passed = r.passed;
      // An instance's check is written in its template.
      const SourceFile& where = calc->sheet.checkFile(k);
      const SourcePos pos = where.position(c.name_begin);
      o.file = c.file ? where.path() : calc->path;
      o.line = pos.line;
      o.column = pos.column;
      if (!r.passed) {
        const Unit& unit = calc->checkDisplay(k);
        o.message = "check `" + c.name + "` fails" + (in_case.empty() ? "" : " in case " + in_case) + ": " +
                    side(*c.lhs, r.ok, r.lhs, unit) + " " + comparisonText(c.op) + " " +
                    side(*c.rhs, r.ok, r.rhs, unit) + " is false";
        if (!c.description.empty()) o.message += " (" + c.description + ")";
        o.message += calc->sheet.instanceNote(c.instance);
        o.headline = o.file + ":" + std::to_string(o.line) + ":" + std::to_string(o.column) + ": error: " + o.message;
      }
      f.checks.push_back(std::move(o));
    }
  };
  record(calc->shown_case, calc->results.checks);
  for (const CaseRun& run : calc->cases) {
    f.warnings += run.errors.warningCount();
    for (const Diagnostic& d : run.errors.list())
      if (d.severity == Severity::Error) f.errors.push_back(errorOf(d));
    if (run.ok()) record(run.def->name, run.results.checks);
  }
  return f;
}

// Checks every file on `jobs` threads; the results are in the order given,
// whatever order the threads finish in.
std::vector<FileCheck> checkFiles(const CheckArgs& args, unsigned jobs) {
  std::vector<FileCheck> results(args.files.size());
  TemplateCache templates;  // a template that many sheets use is read and parsed once per run
  std::atomic<size_t> next{0};
  std::exception_ptr failure;
  std::atomic<bool> failed{false};
  auto work = [&] {
    for (size_t i = next++; i < results.size() && !failed; i = next++) {
      try {
        results[i] = checkFile(args.files[i], args, &templates);
      } catch (...) {
        if (!failed.exchange(true)) failure = std::current_exception();
      }
    }
  };
  const size_t threads = std::min<size_t>(jobs, results.size());
  std::vector<std::thread> pool;
  for (size_t t = 1; t < threads; ++t) pool.emplace_back(work);
  work();  // the last share on this thread
  for (std::thread& th : pool) th.join();
  if (failure) std::rethrow_exception(failure);
  return results;
}

void writeOut(const std::string& text) {
  std::fwrite(text.data(), 1, text.size(), stdout);
  std::fflush(stdout);
}

}  // namespace

int runCheck(const CheckArgs& args) {
  const unsigned jobs = args.jobs > 0 ? static_cast<unsigned>(args.jobs)
                                      : std::max(1u, std::thread::hardware_concurrency());
  const std::vector<FileCheck> files = checkFiles(args, jobs);
  // Errors go to standard error in every format (the contract's diagnostics);
  // standard output carries the lines, or the one document.
  for (const FileCheck& f : files) {
    const std::string err = checkTextErr(f);
    std::fwrite(err.data(), 1, err.size(), stderr);
    if (args.format == "text") writeOut(checkTextOut(f));
  }
  std::fflush(stderr);
  if (args.format == "json") writeOut(renderCheckJson(files));
  else if (args.format == "junit") writeOut(renderCheckJunit(files));
  else if (!args.quiet) writeOut(checkSummaryLine(files));
  return checkExitStatus(files);
}

}  // namespace calctrail
