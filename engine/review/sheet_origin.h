// Where in a git repository the file `calctrail textconv` was given comes
// from. git hands a text converter the old side of a diff as a temporary
// file (`git-blob-XXXXXX/<basename>` in the temporary folder, or
// `XXXXXX_<basename>` before git 2.25), and says nothing else; the `use`
// lines of that file name templates relative to where the sheet lives in the
// repository, at the revision it was taken from. This finds both from the
// file's content (docs/review.md, "Templates in a `git diff`").
#pragma once

#include <string>

namespace calctrail {

struct SheetOrigin {
  enum Kind {
    Outside,   // not in a git work tree, or not a file git wrote: read as any file
    WorkTree,  // a file of the current work tree
    Revision,  // a version of a tracked file, located at `rev`
    NotFound,  // a file git wrote whose version is in no tracked file's history
  };
  Kind kind = Outside;
  /// The work tree's top folder, absolute (WorkTree, Revision, NotFound).
  std::string top;
  /// The file's path from the top of the work tree (WorkTree, Revision).
  std::string path;
  /// Revision: the full commit id, or "" for the index (a staged version).
  std::string rev;
  /// The one marked line that says where the templates were read (Revision,
  /// NotFound), without the mark; "" for the other kinds.
  std::string note;
};

// `file` as named on the command line and `bytes` its content. Only a file
// outside the work tree whose name has git's temporary form is looked up in
// the history; every git call keeps to git's time limit.
SheetOrigin locateSheet(const std::string& file, const std::string& bytes);

// The git blob id of `bytes` (SHA-1 of "blob <size>\0" and the bytes), in hex.
std::string gitBlobId(const std::string& bytes);

}  // namespace calctrail
