// The output of the four studies: text for people, JSON for tools (the
// contract's minimum fields and more, docs/studies.md has the schema), CSV
// and SVG for sweeps. Every format names the worksheet with its SHA-256 and
// says prominently when --set changed the run.
#pragma once

#include <string>
#include <vector>

#include "engine/model/model.h"
#include "engine/study/pick.h"
#include "engine/study/sensitivity.h"
#include "engine/study/solve.h"
#include "engine/study/svg_plot.h"
#include "engine/study/sweep.h"
#include "engine/util/json_writer.h"

namespace calctrail {

struct StudySource {
  /// The worksheet as named on the command line, and the SHA-256 of its bytes.
  std::string path, sha256;
  /// The --set replacements of the run, as given.
  std::vector<std::string> sets;
};

std::string renderSweepText(const SweepTable& t, int digits);
std::string renderSweepCsv(const SweepTable& t);
std::string renderSweepJson(const SweepTable& t);
std::string renderSweepSvg(const SweepTable& t);
// The plot renderSweepSvg draws (one panel per shown result, failing points shaded), for a caller
// that titles it itself (the report's studies).
LinePlot sweepPlot(const SweepTable& t);

std::string renderSolveText(const StudySource& src, const Model& m, const SolveSpec& spec,
                            const SolveOutcome& out, int digits);
std::string renderSolveJson(const StudySource& src, const Model& m, const SolveSpec& spec,
                            const SolveOutcome& out);

std::string renderSensitivityText(const StudySource& src, const Model& m, const SensitivityOutcome& out,
                                  int digits);
std::string renderSensitivityJson(const StudySource& src, const Model& m, const SensitivityOutcome& out);

struct PickSpec {
  /// The input picked for.
  StudyInput input;
  /// The series name, or "list" for values given.
  std::string from;
  /// The --by expression, or null for the smallest passing value.
  const StudyExpr* by = nullptr;
};
std::string renderPickText(const StudySource& src, const PickSpec& spec, const PickOutcome& out, int digits);
std::string renderPickJson(const StudySource& src, const PickSpec& spec, const PickOutcome& out);

// The JSON pieces the study commands write, shared with the report's
// "studies" part so that both say the same: {"value", "unit", "si"}; a sweep
// point's "inputs", "results", "checks" and "error" members; a pick
// candidate's "value" ... "error" members (the caller opens and closes the object).
void writeStudyQuantity(JsonWriter& w, double si, const Unit& u);
void writeSweepPointMembers(JsonWriter& w, const SweepTable& t, size_t p);
void writePickCandidateMembers(JsonWriter& w, const PickCandidate& c, const Unit& u);

// "twin-screw-lift.calc (SHA-256 ab12...)" and, after --set, the line that says so.
std::string sourceLines(const StudySource& src);

}  // namespace calctrail
