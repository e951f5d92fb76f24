// One side of a worksheet diff: a file on disk, or a revision of one read from
// the git repository of the current directory (REV:PATH).
#pragma once

#include <string>
#include <vector>

namespace calctrail {

// Reads `spec`. A path that exists is read as a file. Otherwise `REV:PATH` is
// read with `git cat-file blob` (the blob as committed, no conversion), in the
// current directory's repository:
//   - PATH starting with ./ or ../ is relative to the current directory;
//   - any other PATH is tried relative to the current directory first (so
//     `diff HEAD~1:x.calc x.calc` compares the same file from a subfolder),
//     then relative to the repository root, as git prints paths.
// False with a one-line reason in *error when the side cannot be read.
bool readSide(const std::string& spec, std::string* bytes, std::string* error);

struct ProcessResult {
  bool started = false;  // false: the program could not be run at all
  int status = -1;       // exit status, -1 when killed by a signal
  std::string out, err;
};
// Runs `argv` (no shell involved) in the current directory, capturing both streams.
ProcessResult runProcess(const std::vector<std::string>& argv);

}  // namespace calctrail
