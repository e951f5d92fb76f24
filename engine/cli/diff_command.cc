#include <cstdio>
#include <iostream>
#include <memory>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/review/diff_render.h"
#include "engine/review/git_source.h"
#include "engine/review/sheet_diff.h"

namespace calctrail {

namespace {
// A side that cannot be read becomes a calculation holding that one error,
// named as the user wrote the side, so both kinds of failure print alike.
// A REV:PATH side reads its templates at REV too.
std::unique_ptr<Calculation> loadSide(const std::string& spec, const std::vector<std::string>& sets) {
  std::string bytes, path;
  ReadError error;
  std::unique_ptr<FileSource> source;
  if (!readSide(spec, &bytes, &error, &source, &path)) {
    auto calc = std::make_unique<Calculation>();
    calc->path = spec;
    calc->diags.add(readErrorDiagnostic(spec, error));
    return calc;
  }
  CalcOptions options;
  options.source = source.get();
  options.source_path = path;
  options.sets = sets;
  return Calculation::fromText(spec, std::move(bytes), options);
}
}  // namespace

int runDiff(const DiffArgs& args) {
  std::unique_ptr<Calculation> sides[2] = {loadSide(args.old_side, args.sets), loadSide(args.new_side, args.sets)};
  int errors = 0;
  for (const auto& calc : sides) {
    if (!calc->hasErrors()) continue;
    for (const Diagnostic& d : calc->diags.list())
      if (d.severity == Severity::Error) std::cerr << d.render();
    errors += calc->diags.errorCount();
  }
  if (errors) {
    std::cerr << errors << " error" << (errors == 1 ? "" : "s") << "; no comparison made\n";
    return kExitError;
  }
  SheetDiff d = diffCalculations(sides[0].get(), sides[1].get(), args.rtol);
  d.modified_by = args.sets;
  std::string text;
  if (args.format == "json") text = renderDiffJson(d);
  else if (args.format == "md") text = renderDiffMarkdown(d, args.digits);
  else text = renderDiffText(d, args.digits);
  std::fwrite(text.data(), 1, text.size(), stdout);
  std::fflush(stdout);
  // A check failing on the new side fails the diff as it fails `check`, changed or not.
  return d.somethingMoved() || d.checksFail() ? kExitCheckFailed : kExitOk;
}

}  // namespace calctrail
