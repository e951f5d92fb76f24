#include <algorithm>
#include <iostream>

#include "engine/cli/study_common.h"
#include "engine/report/number_format.h"
#include "engine/study/solve.h"
#include "engine/study/upstream.h"

namespace calctrail {

namespace {

// The varied input must be upstream of some quantity the target reads.
bool dependsOn(const Model& m, const Inputs& inputs, const StudyExpr& e, Slot input) {
  bool found = false;
  forEachName(*e.expr, [&](const Expr& x) {
    if (found) return;
    const std::vector<Slot> up = upstreamInputs(m, inputs, m.find(x.text));
    found = std::find(up.begin(), up.end(), input) != up.end();
  });
  return found;
}

}  // namespace

int runSolveCommand(const SolveArgs& args) {
  if (args.target.empty() == args.capacity.empty()) {
    std::cerr << "calctrail: error: solve takes either --target \"EXPR = EXPR\" or --capacity max|min\n";
    return kExitError;
  }
  auto calc = loadStudySheet(args.study);
  if (!calc) return kExitError;
  const Model& m = *calc->model;
  const Inputs& base = *calc->inputs;
  Diagnostics diags;
  SolveSpec spec;
  spec.samples = args.samples;
  spec.mode = args.capacity == "max"   ? SolveMode::CapacityMax
              : args.capacity == "min" ? SolveMode::CapacityMin
                                       : SolveMode::Target;
  const SourceFile vary_file("--vary", args.vary);
  bool ok =
      resolveStudyInput(m, base, vary_file, 0, static_cast<uint32_t>(args.vary.size()), &diags, &spec.input);
  if (ok) ok = parseBracket(m, spec.input, args.between, "--between", &diags, &spec.lo, &spec.hi);
  if (spec.mode == SolveMode::Target) {
    auto file = std::make_shared<const SourceFile>("--target", args.target);
    const size_t eq = args.target.find('=');
    if (eq == std::string::npos || args.target.find('=', eq + 1) != std::string::npos) {
      diags.error(*file, 0, static_cast<uint32_t>(std::max<size_t>(1, args.target.size())),
                  "--target takes one equation EXPR = EXPR, as in --target \"T_motor = 12 [N*m]\"");
      ok = false;
    } else {
      const uint32_t e = static_cast<uint32_t>(eq);
      const bool l = compileStudyExpr(m, file, 0, e, &diags, &spec.lhs);
      const bool r =
          compileStudyExpr(m, file, e + 1, static_cast<uint32_t>(args.target.size()), &diags, &spec.rhs);
      if (l && r && spec.lhs.dim != spec.rhs.dim) {
        diags.error(*file, spec.lhs.expr->begin, spec.rhs.expr->end,
                    "the target compares `" + spec.lhs.text + "`, " + spec.lhs.dim.describe() + ", with `" +
                        spec.rhs.text + "`, " + spec.rhs.dim.describe());
        ok = false;
      } else if (l && r && ok && !dependsOn(m, base, spec.lhs, spec.input.slot) &&
                 !dependsOn(m, base, spec.rhs, spec.input.slot)) {
        diags.error(*file, 0, static_cast<uint32_t>(args.target.size()),
                    "the target does not depend on `" + spec.input.name + "`: no value of it can meet it");
        ok = false;
      }
      ok = ok && l && r;
    }
  }
  if (!ok || diags.hasErrors()) {
    printDiagnostics(diags);
    return kExitError;
  }
  const SolveOutcome out = runSolve(m, base, calc->results, spec);
  if (out.status == SolveStatus::EvalFailed) {
    Diagnostics faults;
    const std::string at =
        "at " + spec.input.name + " = " + formatQuantity(out.fault_at, spec.input.unit, 6) + ": ";
    if (out.fault.file)
      faults.error(*out.fault.file, out.fault.begin, out.fault.end, at + out.fault.message);
    else
      faults.error(args.study.file, at + out.fault.message);
    printDiagnostics(faults);
    std::cerr << "solve: the worksheet cannot be calculated everywhere in the bracket; narrow --between\n";
    return kExitError;
  }
  // Text output says it in place; for JSON, people read it here.
  if (args.study.format != "text")
    for (const std::string& w : out.warnings) std::cerr << args.study.file << ": warning: " << w << "\n";
  const StudySource src = studySource(*calc, args.study);
  const std::string text = args.study.format == "json"
                               ? renderSolveJson(src, m, spec, out)
                               : renderSolveText(src, m, spec, out, args.study.digits);
  if (!writeStudyOutput(args.study, text)) return kExitError;
  if (out.status == SolveStatus::NotReached) return kExitCheckFailed;
  return out.results.failedChecks() ? kExitCheckFailed : kExitOk;
}

}  // namespace calctrail
