#include <iostream>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/report/number_format.h"

namespace calctrail {

int runCheck(const CheckArgs& args) {
  int files_with_errors = 0, files_failing = 0, failed_checks = 0, total_checks = 0;
  TemplateCache templates;  // a template that many sheets use is read and parsed once per run
  for (const std::string& file : args.files) {
    CalcOptions options;
    options.sets = args.sets;
    options.templates = &templates;
    auto calc = Calculation::fromFile(file, options);
    if (calc->hasErrors()) {
      ++files_with_errors;
      for (const Diagnostic& d : calc->diags.list())
        if (d.severity == Severity::Error) std::cerr << d.headline() << "\n";
      continue;
    }
    int failed_here = 0;
    for (size_t k = 0; k < calc->checks.size(); ++k) {
      const CheckState& s = calc->checks[k];
      const Check& c = calc->sheet.checks[k];
      ++total_checks;
      if (s.passed) continue;
      ++failed_here;
      // An instance's check is written in its template.
      const SourceFile& where = calc->sheet.checkFile(k);
      const SourcePos pos = where.position(c.name_begin);
      std::cout << (c.file ? where.path() : file) << ":" << pos.line << ":" << pos.column
                << ": error: check `" << c.name
                << "` fails: " << formatQuantity(s.lhs, s.display, 4) << " " << comparisonText(c.op) << " "
                << formatQuantity(s.rhs, s.display, 4) << " is false";
      if (!c.description.empty()) std::cout << " (" << c.description << ")";
      std::cout << calc->sheet.instanceNote(c.instance) << "\n";
    }
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
