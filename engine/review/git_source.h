// One side of a worksheet diff: a file on disk, or a revision of one read from
// the git repository of the current directory (REV:PATH).
#pragma once

#include <cstddef>
#include <cstdint>
#include <memory>
#include <string>
#include <vector>

#include "engine/sheet/source_file.h"
#include "engine/template/file_source.h"

namespace calctrail {

// How long git may take to hand over one blob before it is stopped
// (docs/limits.md); the environment variable CALCTRAIL_GIT_TIMEOUT, in seconds, overrides it.
constexpr double kGitTimeoutSeconds = 30;

// Reads `spec`. A path that exists is read as a file. Otherwise `REV:PATH` is
// read with `git cat-file blob` (the blob as committed, no conversion), in the
// current directory's repository:
//   - PATH starting with ./ or ../ is relative to the current directory;
//   - any other PATH is tried relative to the current directory first (so
//     `diff HEAD~1:x.calc x.calc` compares the same file from a subfolder),
//     then relative to the repository root, as git prints paths.
// Both kinds keep to the limits of readFile, and git to its time limit.
// False with a one-line reason in *error when the side cannot be read.
//
// With `source` and `path`: where the side's templates are to be read too:
// *source is left null for a file on disk, else set to the revision's files,
// with the sheet's path in them in *path.
bool readSide(const std::string& spec, std::string* bytes, ReadError* error,
              std::unique_ptr<FileSource>* source = nullptr, std::string* path = nullptr);

struct ProcessLimits {
  double timeout_seconds = 0;       // the child's process group is killed after this long; 0: no limit
  size_t max_output = SIZE_MAX;     // ... or once standard output passes this many bytes
  size_t max_error = size_t{1} << 16;  // bytes of standard error kept; the rest is read and dropped
};

// The files of one git revision (`git cat-file blob REV:PATH`), for the
// templates of a `REV:PATH` side: a diff reads every template as it was at
// REV, so a change to a template shows in every sheet that uses it.
class GitRevisionSource final : public FileSource {
 public:
  // `cwd_relative`: paths are relative to the current directory (read as
  // REV:./PATH), else to the repository root (REV:PATH).
  GitRevisionSource(std::string rev, bool cwd_relative) : rev_(std::move(rev)), cwd_relative_(cwd_relative) {}
  bool read(const std::string& path, std::string* bytes, std::string* error) const override;
  bool realPath(const std::string&, std::string*) const override { return false; }  // blobs, no links
  std::string id() const override { return "git " + rev_ + (cwd_relative_ ? " ./" : " /"); }

 private:
  std::string rev_;
  bool cwd_relative_;
};


struct ProcessResult {
  bool started = false;           // false: the program could not be run at all
  int status = -1;                // exit status, -1 when killed by a signal
  bool timed_out = false;         // killed at the time limit
  bool output_too_large = false;  // killed when standard output passed its limit
  std::string out, err;
};
// Runs `argv` (no shell involved) in the current directory, in a process group
// of its own, capturing both streams within `limits`.
ProcessResult runProcess(const std::vector<std::string>& argv, const ProcessLimits& limits = {});

// Runs `git ARGS` (no shell) within git's time limit (CALCTRAIL_GIT_TIMEOUT),
// keeping at most `max_output` bytes of its output. A limit that cannot be
// read gives status -1 with the reason in `err`.
ProcessResult runGit(const std::vector<std::string>& args, size_t max_output = kMaxSourceBytes);

}  // namespace calctrail
