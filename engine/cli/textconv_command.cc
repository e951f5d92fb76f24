#include <cstdio>
#include <iostream>
#include <memory>

#include "engine/calculation.h"
#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/review/annotated_sheet.h"
#include "engine/review/git_source.h"
#include "engine/review/sheet_origin.h"
#include "engine/review/template_users.h"

namespace calctrail {

int runTextconv(const std::string& file, int digits) {
  std::string bytes;
  ReadError error;
  if (file == "-" ? !readStandardInput(&bytes, &error) : !readFile(file, &bytes, &error)) {
    // Unreadable: there is no text to show.
    std::cerr << readErrorDiagnostic(file == "-" ? kStdinName : file, error).headline() << "\n";
    return kExitError;
  }
  // git hands over an old revision as a temporary file: find where in the
  // repository, and when, it comes from, to read its templates there.
  const SheetOrigin origin = file == "-" ? SheetOrigin{} : locateSheet(file, bytes);
  std::unique_ptr<FileSource> revision;
  CalcOptions options;
  if (origin.kind == SheetOrigin::Revision) {
    revision = std::make_unique<GitRevisionSource>(origin.rev, false);
    options.source = revision.get();
    options.source_path = origin.path;
  }
  const auto calc = Calculation::fromText(file == "-" ? kStdinName : file, bytes, options);
  // Exit 0 even when the worksheet has errors: git stops the whole diff when a
  // text converter fails, and the errors are in the text anyway.
  std::string text = annotatedSheet(*calc, digits);
  const std::string users = templateUsersBlock(origin, bytes, digits);
  // Where the other files were read, second after the summary so a reader
  // sees it first; only when some were: elsewhere it would be a changed line
  // in every diff, saying nothing.
  if (!origin.note.empty() && (!calc->sheet.uses.empty() || !users.empty()))
    text.insert(text.find('\n') + 1, std::string(kAnnotationMark) + " " + origin.note + "\n");
  text += users;
  std::fwrite(text.data(), 1, text.size(), stdout);
  std::fflush(stdout);
  return kExitOk;
}

}  // namespace calctrail
