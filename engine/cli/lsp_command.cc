#include <csignal>
#include <cstdio>

#include "engine/cli/commands.h"
#include "engine/lsp/stdio_transport.h"

namespace calctrail {

int runLsp() {
  // A client that goes away makes a write fail with EPIPE, which ends the loop; no signal.
  std::signal(SIGPIPE, SIG_IGN);
  return lsp::serve(0, 1);
}

}  // namespace calctrail
