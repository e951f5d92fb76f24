#include <iostream>

#include "engine/cli/study_common.h"
#include "engine/study/sensitivity.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

int runSensitivityCommand(const SensitivityArgs& args) {
  auto calc = loadStudySheet(args.study);
  if (!calc) return kExitError;
  const Model& m = *calc->model;
  const SourceFile file("--of", args.of);
  const Slot of = m.find(args.of);
  Diagnostics diags;
  if (!of.valid()) {
    std::vector<std::string> names;
    for (const Quantity& q : m.sheet().quantities) names.push_back(q.name);
    std::string msg = "the worksheet defines no quantity `" + args.of + "`";
    const auto near = nearestWords(args.of, names);
    if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
    diags.error(file, 0, static_cast<uint32_t>(std::max<size_t>(1, args.of.size())), msg);
  } else if (calc->results.value(of) == 0) {
    diags.error(file, 0, static_cast<uint32_t>(args.of.size()),
                "`" + args.of + "` is 0 at this point: its relative change (the elasticity) is not defined");
  }
  if (diags.hasErrors()) {
    printDiagnostics(diags);
    return kExitError;
  }
  const SensitivityOutcome out = runSensitivity(m, *calc->inputs, calc->results, of);
  const StudySource src = studySource(*calc, args.study);
  const std::string text = args.study.format == "json"
                               ? renderSensitivityJson(src, m, out)
                               : renderSensitivityText(src, m, out, args.study.digits);
  if (!writeStudyOutput(args.study, text)) return kExitError;
  return calc->results.failedChecks() ? kExitCheckFailed : kExitOk;
}

}  // namespace calctrail
