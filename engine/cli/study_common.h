// What the four study commands share: loading the worksheet with --set,
// printing diagnostics, naming the source, writing the output.
#pragma once

#include <memory>
#include <string>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/sheet/diagnostics.h"
#include "engine/study/study_render.h"

namespace calctrail {

// Reads, parses, builds and evaluates args.file with its --set; prints every
// diagnostic; nullptr after printing when the worksheet has errors.
std::unique_ptr<Calculation> loadStudySheet(const StudyArgs& args);

StudySource studySource(const Calculation& calc, const StudyArgs& args);

// Every diagnostic with its source line and caret, to standard error.
void printDiagnostics(const Diagnostics& diags);

// `text` to standard output, or to -o OUT (atomically); false after printing the reason.
bool writeStudyOutput(const StudyArgs& args, const std::string& text);

// "--show" names etc.: the text of an option as a source for diagnostics.
SourceFile optionSource(const std::string& option, const std::string& text);

}  // namespace calctrail
