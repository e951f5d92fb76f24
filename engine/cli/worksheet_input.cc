#include "engine/cli/worksheet_input.h"

namespace calctrail {

Diagnostic readErrorDiagnostic(const std::string& path, const ReadError& error) {
  Diagnostic d;
  d.path = path;
  d.line = error.line;
  d.column = error.line > 0 ? 1 : 0;
  d.message = error.message;
  return d;
}

std::unique_ptr<Calculation> loadWorksheet(const std::string& file, const CalcOptions& options) {
  const bool from_stdin = file == "-";
  const std::string name = from_stdin ? kStdinName : file;
  std::string bytes;
  ReadError error;
  if (from_stdin ? !readStandardInput(&bytes, &error) : !readFile(file, &bytes, &error)) {
    auto calc = std::make_unique<Calculation>();
    calc->path = name;
    calc->diags.add(readErrorDiagnostic(name, error));
    return calc;
  }
  return Calculation::fromText(name, std::move(bytes), options);
}

}  // namespace calctrail
