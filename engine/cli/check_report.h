// What `calctrail check` found in each worksheet, as plain data, and the
// documents it prints from it: the text lines (one per failed check and per
// error), JSON (docs/check.schema.json) and JUnit XML for CI (docs/json.md,
// "check --format json|junit").
#pragma once

#include <string>
#include <vector>

namespace calctrail {

/// A problem as the diagnostics print it: FILE:LINE:COL: error: MESSAGE.
struct CheckError {
  std::string file;
  int line = 0;
  int column = 0;
  std::string message;
  /// The whole headline, as standard error shows it.
  std::string headline;
};

/// One check evaluated in one load case.
struct CheckOutcome {
  /// The check's name, dotted for an instance's check (`heavy.buckling`).
  std::string name;
  /// The load case: `nominal` for the worksheet as written (or the --case given).
  std::string case_name;
  bool passed = false;
  /// Where the check is written (a template's file for an instance's check).
  std::string file;
  int line = 0;
  int column = 0;
  /// For a failed check: what fails, with both sides' values ("check `x` fails: ... is false").
  std::string message;
  /// For a failed check: the whole line the text output prints.
  std::string headline;
};

/// Everything `check` found in one worksheet.
struct FileCheck {
  /// The path as given on the command line (`<stdin>` for "-").
  std::string path;
  /// False when the worksheet as written could not be calculated: no check was evaluated.
  bool evaluated = false;
  /// The errors of the worksheet and of its load cases, in the order printed.
  std::vector<CheckError> errors;
  /// Every check in every case that was calculated, nominal first, in file order.
  std::vector<CheckOutcome> checks;
  int warnings = 0;

  int failedChecks() const;
  int passedChecks() const;
};

// The text the classic output prints: the failed-check lines (standard
// output) and the error headlines (standard error) of one file.
std::string checkTextOut(const FileCheck& f);
std::string checkTextErr(const FileCheck& f);
// "3 worksheets, 41 checks: 1 failed; 1 worksheet with errors\n".
std::string checkSummaryLine(const std::vector<FileCheck>& files);

// The exit status of the run: 2 when a file has errors, 1 when a check failed, else 0.
int checkExitStatus(const std::vector<FileCheck>& files);

// One JSON document (schema calctrail-check/1) for the whole run.
std::string renderCheckJson(const std::vector<FileCheck>& files);
// JUnit XML: a <testsuite> per file, a <testcase> per check per case.
std::string renderCheckJunit(const std::vector<FileCheck>& files);

}  // namespace calctrail
