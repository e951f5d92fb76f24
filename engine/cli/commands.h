// The subcommands of the calctrail program. Each returns the exit status:
// 0 all good, 1 a design check failed (or, for diff, a result moved), 2 the
// input has errors or the command line is wrong.
#pragma once

#include <memory>
#include <string>
#include <vector>

namespace calctrail {

enum ExitStatus { kExitOk = 0, kExitCheckFailed = 1, kExitError = 2 };

// Keeps `object` alive until the process ends. main ends it without freeing
// what the system takes back in one piece anyway (docs/performance.md,
// startup_perftest); a sanitizer build frees everything, for LeakSanitizer.
void keepUntilExit(std::shared_ptr<const void> object);

struct ReportArgs {
  std::string file;  // the worksheet; "-" reads standard input
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
  std::string format = "text";  // text (a line per problem), json or junit (docs/json.md)
  int jobs = 0;                 // worksheets checked at once; 0: one per core
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
  std::vector<std::string> sets;   // "NAME=VALUE" from --set, applied to both sides
};
int runDiff(const DiffArgs& args);

struct FmtArgs {
  std::vector<std::string> files;
  bool check = false;  // exit 1 when a file is not in canonical layout
  bool write = false;  // replace each file by its formatted text (engine/util/safe_write.h)
};
int runFmt(const FmtArgs& args);

int runTextconv(const std::string& file, int digits);

// Design studies (engine/study/, docs/studies.md): what every study takes.
struct StudyArgs {
  std::string file;
  std::vector<std::string> sets;  // "NAME=VALUE" from --set, in order
  std::string case_name;          // --case: the load case studied ("": the worksheet as written)
  std::string format = "text";
  std::string output;             // -o: a file instead of standard output
  int digits = 4;                 // significant digits in text output
};

struct SweepArgs {
  StudyArgs study;
  std::vector<std::string> vary;   // "NAME=FROM..TO" or "NAME=V1, V2, ..."; one or two
  int steps = 11;                  // points of a range, both ends included
  bool log = false;                // logarithmic steps
  std::vector<std::string> show;   // results to record ("a,b" or repeated)
  std::string shard;               // "K/N": this run computes every N-th point from the K-th
  unsigned jobs = 0;               // threads; 0: one per core
  std::vector<std::string> merge;  // shard JSON files to merge instead of running
};
int runSweepCommand(const SweepArgs& args);

struct SolveArgs {
  StudyArgs study;
  std::string vary;      // the input solved for
  std::string between;   // "LO..HI"
  std::string target;    // "EXPR = EXPR"
  std::string capacity;  // "max" or "min"
  int samples = 41;      // points the bracket is sampled at first
};
int runSolveCommand(const SolveArgs& args);

struct SensitivityArgs {
  StudyArgs study;
  std::string of;  // the quantity studied
};
int runSensitivityCommand(const SensitivityArgs& args);

struct PickArgs {
  StudyArgs study;
  std::string vary;  // the input picked for
  std::string from;  // a series name or "V1, V2, ..."
  bool smallest = false;
  std::string by;    // an expression to minimise instead
};
int runPickCommand(const PickArgs& args);

// The language server over standard input and output (engine/lsp/, docs/editors/lsp.md).
int runLsp();

// writeOutputFile (engine/util/safe_write.h) with no input to refuse; a command
// that reads worksheets passes them to writeOutputFile instead.
bool writeFileAtomically(const std::string& path, const std::string& text, std::string* error);

}  // namespace calctrail
