#include <cstdio>
#include <iostream>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/report/html_renderer.h"
#include "engine/report/json_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "engine/util/safe_write.h"

namespace calctrail {

int runReport(const ReportArgs& args) {
  CalcOptions options;
  options.sets = args.sets;
  auto calc = loadWorksheet(args.file, options);
  for (const Diagnostic& d : calc->diags.list()) std::cerr << d.render();
  if (calc->hasErrors()) {
    std::cerr << calc->diags.errorCount() << " error" << (calc->diags.errorCount() == 1 ? "" : "s")
              << "; no trail written\n";
    return kExitError;
  }
  const Trail trail = buildTrail(*calc, args.digits);
  const std::string text = args.format == "json"   ? renderJson(*calc, trail)
                           : args.format == "md"   ? renderMarkdown(trail)
                           : args.format == "html" ? renderHtml(trail)
                                                   : renderText(trail);
  if (args.output.empty() || args.output == "-") {
    std::fwrite(text.data(), 1, text.size(), stdout);
    std::fflush(stdout);
    return kExitOk;
  }
  std::string error;
  if (!writeOutputFile(args.output, text, {args.file}, &error)) {
    std::cerr << args.output << ":1:1: error: " << error << "\n";
    return kExitError;
  }
  return kExitOk;
}

}  // namespace calctrail
