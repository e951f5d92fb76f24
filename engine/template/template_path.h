// The path rules of `use PATH as INSTANCE` (docs/templates.md): PATH is
// relative to the file that writes the line; an absolute path is refused (a
// sheet must build on a colleague's checkout); a path leaves the folder of
// the using file only through its own leading `../`, never through a
// symbolic link.
#pragma once

#include <string>

namespace calctrail {

// `a/./b/../c` as `a/c`; leading `..` kept; "" for the current folder. An
// absolute path keeps its leading `/`.
std::string normalizePath(const std::string& path);

// The folder part of a path ("" for a bare file name).
std::string parentPath(const std::string& path);

// `rel` appended to the folder `dir`, normalized.
std::string joinPath(const std::string& dir, const std::string& rel);

// The path names its file from the root of a file system or a drive
// (`/x`, `\x`, `C:/x`, `C:\x`), or from a home folder (`~/x`).
bool isAbsolutePath(const std::string& path);

// How many folders the normalized path climbs before it descends (`../../x`: 2).
int leadingParents(const std::string& path);

// `path` equals `folder` or lies inside it (both absolute and normalized).
bool insideFolder(const std::string& path, const std::string& folder);

}  // namespace calctrail
