// The subcommands of the calctrail program. Each returns the exit status:
// 0 all good, 1 a design check failed (or, for diff, a result moved), 2 the
// input has errors or the command line is wrong.
#pragma once

#include <string>
#include <vector>

namespace calctrail {

enum ExitStatus { kExitOk = 0, kExitCheckFailed = 1, kExitError = 2 };

struct ReportArgs {
  std::string file;
  std::string format = "text";
  std::string output;
  std::vector<std::string> sets;
  std::string case_name;  // --case: that load case alone
  int digits = 4;
};
int runReport(const ReportArgs& args);

struct CheckArgs {
  std::vector<std::string> files;
  std::vector<std::string> sets;
  std::string case_name;  // --case: that load case alone
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
  bool write = false;  // rewrite files in place (atomically)
};
int runFmt(const FmtArgs& args);

int runTextconv(const std::string& file, int digits);

// Writes `text` to `path` through a temporary file and a rename, so a reader
// never sees half a file and an interrupted write leaves the old one intact.
bool writeFileAtomically(const std::string& path, const std::string& text, std::string* error);

}  // namespace calctrail
