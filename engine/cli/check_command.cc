#include <iostream>

#include "engine/calculation.h"
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
}  // namespace

int runCheck(const CheckArgs& args) {
  int files_with_errors = 0, files_failing = 0, failed_checks = 0, total_checks = 0;
  TemplateCache templates;  // a template that many sheets use is read and parsed once per run
  for (const std::string& file : args.files) {
    CalcOptions options;
    options.sets = args.sets;
    options.case_name = args.case_name;
    options.templates = &templates;
    auto calc = loadWorksheet(file, options);
    if (calc->hasErrors()) {
      ++files_with_errors;
      for (const Diagnostic& d : calc->diags.list())
        if (d.severity == Severity::Error) std::cerr << d.headline() << "\n";
      continue;
    }
    int failed_here = 0;
    // One line per failed check in each case; a case that could not be
    // calculated is an error of the file, the other cases still checked.
    auto report = [&](const std::string& in_case, const std::vector<CheckResult>& results) {
      for (size_t k = 0; k < calc->checks.size(); ++k) {
        const CheckResult& r = results[k];
        const Check& c = calc->sheet.checks[k];
        const Unit& unit = calc->checks[k].display;
        ++total_checks;
        if (r.passed) continue;
        ++failed_here;
        // An instance's check is written in its template.
        const SourceFile& where = calc->sheet.checkFile(k);
        const SourcePos pos = where.position(c.name_begin);
        std::cout << (c.file ? where.path() : calc->path) << ":" << pos.line << ":" << pos.column
                  << ": error: check `" << c.name << "` fails"
                  << (in_case.empty() ? "" : " in case " + in_case) << ": " << side(*c.lhs, r.ok, r.lhs, unit)
                  << " " << comparisonText(c.op) << " " << side(*c.rhs, r.ok, r.rhs, unit) << " is false";
        if (!c.description.empty()) std::cout << " (" << c.description << ")";
        std::cout << calc->sheet.instanceNote(c.instance) << "\n";
      }
    };
    report(calc->shown_case, calc->results.checks);
    bool case_errors = false;
    for (const CaseRun& run : calc->cases) {
      for (const Diagnostic& d : run.errors.list())
        if (d.severity == Severity::Error) std::cerr << d.headline() << "\n";
      case_errors |= run.errors.hasErrors();
      if (run.ok()) report(run.def->name, run.results.checks);
    }
    if (case_errors) ++files_with_errors;
    failed_checks += failed_here;
    if (failed_here) ++files_failing;
  }
  if (!args.quiet) {
    const int n = static_cast<int>(args.files.size());
    std::cout << n << " worksheet" << (n == 1 ? "" : "s") << ", " << total_checks << " check"
              << (total_checks == 1 ? "" : "s") << ": " << failed_checks << " failed";
    if (files_with_errors) std::cout << "; " << files_with_errors << " worksheet" << (files_with_errors == 1 ? "" : "s") << " with errors";
    std::cout << "\n";
  }
  if (files_with_errors) return kExitError;
  return files_failing ? kExitCheckFailed : kExitOk;
}

}  // namespace calctrail
