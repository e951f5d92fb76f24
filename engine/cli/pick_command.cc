#include <iostream>

#include "engine/cli/study_common.h"
#include "engine/study/pick.h"
#include "engine/study/series.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

namespace {

bool looksLikeName(const std::string& s) {
  if (s.empty()) return false;
  for (char c : s)
    if (!std::isalpha(static_cast<unsigned char>(c)) && c != '_') return false;
  return true;
}

}  // namespace

int runPickCommand(const PickArgs& args) {
  if (args.smallest && !args.by.empty()) {
    std::cerr << "calctrail: error: pick takes --smallest or --by EXPR, not both\n";
    return kExitError;
  }
  auto calc = loadStudySheet(args.study);
  if (!calc) return kExitError;
  const Model& m = *calc->model;
  Diagnostics diags;
  StudyInput input;
  const SourceFile vary_file("--vary", args.vary);
  if (!resolveStudyInput(m, *calc->inputs, vary_file, 0, static_cast<uint32_t>(args.vary.size()), &diags,
                         &input)) {
    printDiagnostics(diags);
    return kExitError;
  }
  std::vector<double> candidates;
  std::string from = "list";
  const SourceFile from_file("--from", args.from);
  if (const StudySeries* series = findSeries(args.from)) {
    from = series->name;
    const SlotInfo& info = m.slot(input.slot);
    if (info.has_dim && series->unit.dim != info.dim) {
      diags.error(from_file, 0, static_cast<uint32_t>(args.from.size()),
                  "the series `" + series->name + "` holds " + series->unit.dim.describe() + ", but `" +
                      input.name + "` is " + info.dim.describe());
    }
    candidates = *series->values;
  } else if (looksLikeName(args.from)) {
    std::vector<std::string> names;
    for (const StudySeries& s : studySeries()) names.push_back(s.name);
    diags.error(from_file, 0, static_cast<uint32_t>(args.from.size()),
                "no series is named `" + args.from + "`; the series are " + quotedList(names) +
                    " (or give the values: --from \"36 mm, 40 mm, 44 mm\")");
  } else {
    parseValueList(m, input, args.from, "--from", &diags, &candidates);
  }
  StudyExpr by;
  if (!args.by.empty())
    compileStudyExpr(m, std::make_shared<const SourceFile>("--by", args.by), 0,
                     static_cast<uint32_t>(args.by.size()), &diags, &by);
  if (diags.hasErrors()) {
    printDiagnostics(diags);
    return kExitError;
  }
  const PickOutcome out =
      runPick(m, *calc->inputs, calc->results, input, candidates, args.by.empty() ? nullptr : &by);
  PickSpec spec{input, from, args.by.empty() ? nullptr : &by};
  const StudySource src = studySource(*calc, args.study);
  const std::string text = args.study.format == "json" ? renderPickJson(src, spec, out)
                                                       : renderPickText(src, spec, out, args.study.digits);
  if (!writeStudyOutput(args.study, text)) return kExitError;
  return out.chosen >= 0 ? kExitOk : kExitCheckFailed;
}

}  // namespace calctrail
