// Writing the files a user names without destroying any: an output that is an
// input is refused, links and special files are written through and never
// replaced, and a replaced file keeps its owner, group, mode and hard links
// (docs/limits.md, "Files calctrail writes").
#pragma once

#include <functional>
#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

// Writes `text` to `path`, the output a command was given (report -o):
//  - the same file (device and inode, through any link) as one of `inputs`
//    is refused; "-" in `inputs` stands for standard input;
//  - a symbolic link is followed, and what it leads to is written;
//  - a character device or a FIFO is written as a stream, never replaced;
//  - a regular file is replaced as by replaceFileContents; a new one is
//    created through a temporary file, with the mode the umask gives.
// False with a one-line reason in *error; then nothing has changed.
bool writeOutputFile(const std::string& path, const std::string& text, const std::vector<std::string>& inputs,
                     std::string* error);

// Hands a piece of the output on, in order; false when it could not be written.
using OutputWriter = std::function<bool(std::string_view piece)>;
// Writes the whole output through `write`, piece by piece (a large report is
// never held whole); false when a write failed.
using OutputProducer = std::function<bool(const OutputWriter& write)>;

// The same, the output made piece by piece while it is written: into the
// temporary file of a regular one (renamed only when all of it is written),
// or into the stream.
bool writeOutputFile(const std::string& path, const OutputProducer& produce, const std::vector<std::string>& inputs,
                     std::string* error);

// Replaces the contents of the existing regular file `path` (after symbolic
// links): through a temporary file made with mkstemp in the same folder, given
// the file's owner, group and mode before it is renamed over the file, so a
// reader never sees half a file and a crash leaves the old one. Refused when
// the user may not write the file (access(2)), when it has other hard links,
// and when its owner or group cannot be kept.
bool replaceFileContents(const std::string& path, const std::string& text, std::string* error);

}  // namespace calctrail
