// `calctrail lsp` over a pair of file descriptors (standard input and
// output): frames in, frames out. Every message already waiting is handled
// before a changed document is recalculated, so a newer didChange
// supersedes an older one not yet processed.
#pragma once

namespace calctrail::lsp {

// Serves until `exit` (returns 0 after shutdown, 1 without) or until the
// input ends or the output fails (returns 1).
int serve(int in_fd, int out_fd);

}  // namespace calctrail::lsp
