// The subcommands of the calctrail program. Each returns the exit status:
// 0 all good, 1 a design check failed (or, for diff, a result moved), 2 the
// input has errors or the command line is wrong.
#pragma once

#include <string>
#include <vector>

namespace calctrail {

enum ExitStatus { kExitOk = 0, kExitCheckFailed = 1, kExitError = 2 };

struct ReportArgs {
  std::string file;  // the worksheet; "-" reads standard input
  std::string format = "text";
  std::string output;
  std::vector<std::string> sets;
  int digits = 4;
};
int runReport(const ReportArgs& args);

struct CheckArgs {
  std::vector<std::string> files;
  std::vector<std::string> sets;
  bool quiet = false;
};
int runCheck(const CheckArgs& args);

int runFunctions(const std::string& name, const std::string& format);
int runUnits(const std::string& format);

// Review workflow (engine/review/, docs/review.md).
struct DiffArgs {
  std::string old_side, new_side;  // a file, or REV:PATH read from git
  std::string format = "text";     // text, md or json
  double rtol = 1e-9;              // a result moved when it changed by more than this, relatively
  int digits = 4;
};
int runDiff(const DiffArgs& args);

struct FmtArgs {
  std::vector<std::string> files;
  bool check = false;  // exit 1 when a file is not in canonical layout
  bool write = false;  // replace each file by its formatted text (engine/util/safe_write.h)
};
int runFmt(const FmtArgs& args);

int runTextconv(const std::string& file, int digits);

// The language server over standard input and output (engine/lsp/, docs/editors/lsp.md).
int runLsp();

// writeOutputFile (engine/util/safe_write.h) with no input to refuse; a command
// that reads worksheets passes them to writeOutputFile instead.
bool writeFileAtomically(const std::string& path, const std::string& text, std::string* error);

}  // namespace calctrail
