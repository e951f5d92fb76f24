#include <cstdio>
#include <iostream>

#include "engine/cli/commands.h"
#include "engine/cli/worksheet_input.h"
#include "engine/review/sheet_format.h"
#include "engine/sheet/source_file.h"
#include "engine/util/safe_write.h"

namespace calctrail {

namespace {

// 1-based number of the first line where the two texts differ.
int firstDifferentLine(const std::string& a, const std::string& b) {
  int line = 1;
  for (size_t i = 0; i < a.size() && i < b.size(); ++i) {
    if (a[i] != b[i]) return line;
    if (a[i] == '\n') ++line;
  }
  return line;
}

bool readInput(const std::string& file, std::string* bytes, ReadError* error) {
  return file == "-" ? readStandardInput(bytes, error) : readFile(file, bytes, error);
}

void printError(const std::string& file, const std::string& message) {
  Diagnostics d;
  d.error(file, message);
  std::cerr << d.list().front().headline() << "\n";
}

}  // namespace

int runFmt(const FmtArgs& args) {
  if (!args.check && !args.write && args.files.size() != 1) {
    std::cerr << "calctrail: error: fmt prints one worksheet; to format several, give --write (or --check)\n";
    return kExitError;
  }
  bool errors = false, not_canonical = false;
  for (const std::string& file : args.files) {
    if (file == "-" && args.write) {
      printError(file, "--write needs a file; standard input can only be printed or checked");
      errors = true;
      continue;
    }
    const std::string name = file == "-" ? kStdinName : file;
    std::string bytes, error;
    ReadError read_error;
    if (!readInput(file, &bytes, &read_error)) {
      std::cerr << readErrorDiagnostic(name, read_error).headline() << "\n";
      errors = true;
      continue;
    }
    Diagnostics diags;
    const std::string text = formatWorksheet(name, bytes, &diags);
    if (diags.hasErrors()) {
      // Never rewrite what did not parse: the layout of a broken line is unknown.
      for (const Diagnostic& d : diags.list()) std::cerr << d.render();
      std::cerr << file << ": left unchanged (" << diags.errorCount() << " error"
                << (diags.errorCount() == 1 ? "" : "s") << ")\n";
      errors = true;
      continue;
    }
    if (!args.check && !args.write) {
      std::fwrite(text.data(), 1, text.size(), stdout);
      continue;
    }
    if (text == bytes) continue;
    if (args.check) {
      not_canonical = true;
      std::cout << file << ": not in canonical layout (first difference on line "
                << firstDifferentLine(bytes, text) << ")\n";
      continue;
    }
    if (!replaceFileContents(file, text, &error)) {
      printError(file, error + "; the file is unchanged");
      errors = true;
      continue;
    }
    std::cout << file << ": rewritten in canonical layout\n";
  }
  std::fflush(stdout);
  if (errors) return kExitError;
  return not_canonical ? kExitCheckFailed : kExitOk;
}

}  // namespace calctrail
