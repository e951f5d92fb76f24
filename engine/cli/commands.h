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

// Writes `text` to `path` through a temporary file and a rename, so a reader
// never sees half a file and an interrupted write leaves the old one intact.
bool writeFileAtomically(const std::string& path, const std::string& text, std::string* error);

}  // namespace calctrail
