// Reading the worksheet a command names, a file or standard input ("-"),
// within the limits of docs/limits.md, with one form of error for both.
#pragma once

#include <memory>
#include <string>

#include "engine/calculation.h"

namespace calctrail {

// The name diagnostics and reports give standard input.
constexpr const char* kStdinName = "<stdin>";

// The diagnostic for a worksheet that could not be read: FILE:LINE:1 when the
// problem is on one line (a line over the limit), FILE:1:1 otherwise.
Diagnostic readErrorDiagnostic(const std::string& path, const ReadError& error);

// Reads FILE ("-" reads standard input, named <stdin>) and calculates it. A
// worksheet that cannot be read gives a calculation with no sheet file and that one error.
std::unique_ptr<Calculation> loadWorksheet(const std::string& file, const CalcOptions& options = {});

}  // namespace calctrail
