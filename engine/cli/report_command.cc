#include <cstdio>
#include <iostream>
#include <memory>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/report/formats.h"
#include "engine/report/trail.h"
#include "engine/template/template_cache.h"
#include "engine/util/safe_write.h"

namespace calctrail {

int runReport(const ReportArgs& args) {
  CalcOptions options;
  options.sets = args.sets;
  options.case_name = args.case_name;
  // Kept until exit with the calculation: tearing the templates' parsed
  // sheets down one node at a time was about 1 % of a report (callgrind).
  const auto templates = std::make_shared<TemplateCache>();
  keepUntilExit(templates);
  options.templates = templates.get();
  const std::shared_ptr<const Calculation> calc = loadWorksheet(args.file, options);
  keepUntilExit(calc);
  for (const Diagnostic& d : calc->diags.list()) std::cerr << d.render();
  if (calc->hasErrors()) {
    std::cerr << calc->diags.errorCount() << " error" << (calc->diags.errorCount() == 1 ? "" : "s")
              << "; no trail written\n";
    return kExitError;
  }
  // A load case that cannot be calculated is a worksheet error (exit 2), but
  // the trail is still written: it shows the nominal and the other cases, and
  // marks that case as not calculated (docs/cases.md).
  for (const CaseRun& run : calc->cases)
    for (const Diagnostic& d : run.errors.list()) std::cerr << d.render();
  const int status = calc->caseErrors() ? kExitError : kExitOk;
  // The Calculation lives to the end, so the trail may build each step when
  // a renderer reaches it rather than keep them all: each step is explained
  // once (the tables read only heads), and the demo's report touches 46 fewer
  // heap pages (docs/performance.md, "Start-up, round 5").
  const auto trail = std::make_shared<const Trail>(buildTrail(*calc, args.digits, TrailKeep::None));
  keepUntilExit(trail);
  // Written as it is made: a report of a large sheet is never held whole.
  const auto render = [&](const ReportSink::Writer& write) {
    ReportSink sink(write);
    if (!renderReport(*trail, args.format, sink)) reportFormats().front().render(*trail, sink);
    return sink.finish();
  };
  if (args.output.empty() || args.output == "-") {
    // A failed write shows in the stream's error state, which the exit reports (main.cc).
    render([](std::string_view piece) { return std::fwrite(piece.data(), 1, piece.size(), stdout) == piece.size(); });
    std::fflush(stdout);
    return status;
  }
  std::string error;
  if (!writeOutputFile(args.output, render, {args.file}, &error)) {
    std::cerr << args.output << ":1:1: error: " << error << "\n";
    return kExitError;
  }
  return status;
}

}  // namespace calctrail
