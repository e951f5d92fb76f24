#include "engine/cli/study_common.h"

#include <cstdio>
#include <iostream>

#include "engine/cli/worksheet_input.h"
#include "engine/util/safe_write.h"

namespace calctrail {

std::unique_ptr<Calculation> loadStudySheet(const StudyArgs& args) {
  CalcOptions options;
  options.sets = args.sets;
  options.case_name = args.case_name;
  auto calc = loadWorksheet(args.file, options);
  printDiagnostics(calc->diags);
  if (calc->hasErrors()) {
    std::cerr << calc->diags.errorCount() << " error" << (calc->diags.errorCount() == 1 ? "" : "s")
              << "; no study run\n";
    return nullptr;
  }
  return calc;
}

StudySource studySource(const Calculation& calc, const StudyArgs& args) {
  return {calc.path, calc.sha256, args.sets};
}

void printDiagnostics(const Diagnostics& diags) {
  for (const Diagnostic& d : diags.list()) std::cerr << d.render();
}

bool writeStudyOutput(const StudyArgs& args, const std::string& text) {
  if (args.output.empty() || args.output == "-") {
    std::fwrite(text.data(), 1, text.size(), stdout);
    std::fflush(stdout);
    return true;
  }
  std::string error;
  if (!writeOutputFile(args.output, text, {args.file}, &error)) {
    std::cerr << args.output << ":1:1: error: " << error << "\n";
    return false;
  }
  return true;
}

SourceFile optionSource(const std::string& option, const std::string& text) {
  return SourceFile(option, text);
}

}  // namespace calctrail
