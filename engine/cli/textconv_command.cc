#include <cstdio>
#include <iostream>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/review/annotated_sheet.h"

namespace calctrail {

int runTextconv(const std::string& file, int digits) {
  auto calc = loadWorksheet(file);
  if (!calc->sheet.file) {  // unreadable: there is no text to show
    for (const Diagnostic& d : calc->diags.list()) std::cerr << d.headline() << "\n";
    return kExitError;
  }
  // Exit 0 even when the worksheet has errors: git stops the whole diff when a
  // text converter fails, and the errors are in the text anyway.
  const std::string text = annotatedSheet(*calc, digits);
  std::fwrite(text.data(), 1, text.size(), stdout);
  std::fflush(stdout);
  return kExitOk;
}

}  // namespace calctrail
