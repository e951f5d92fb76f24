#include "engine/lsp/stdio_transport.h"

#include <poll.h>
#include <unistd.h>

#include <cerrno>
#include <string>

#include "engine/lsp/json_rpc.h"
#include "engine/lsp/lsp_server.h"

namespace calctrail::lsp {

namespace {

bool writeAll(int fd, const std::string& bytes) {
  size_t done = 0;
  while (done < bytes.size()) {
    const ssize_t n = ::write(fd, bytes.data() + done, bytes.size() - done);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) return false;
    done += static_cast<size_t>(n);
  }
  return true;
}

bool send(Server* server, int fd) {
  std::string bytes;
  for (const nlohmann::json& m : server->takeOutgoing()) bytes += frame(dump(m));
  return writeAll(fd, bytes);
}

// More input is waiting to be read right now.
bool readable(int fd) {
  pollfd p{fd, POLLIN, 0};
  for (;;) {
    const int r = ::poll(&p, 1, 0);
    if (r < 0 && errno == EINTR) continue;
    return r > 0;
  }
}

}  // namespace

int serve(int in_fd, int out_fd) {
  Server server;
  Framer framer;
  std::string buffer(size_t{1} << 16, '\0');
  for (;;) {
    Frame f;
    while (!server.exited() && framer.next(&f)) {
      if (f.kind == Frame::Body)
        server.receive(f.body);
      else
        server.receiveBroken(f.error);
      if (!send(&server, out_fd)) return 1;
    }
    if (server.exited()) return server.exitCode();
    if (server.hasPendingWork() && !readable(in_fd)) {
      server.flush();
      if (!send(&server, out_fd)) return 1;
      continue;
    }
    const ssize_t n = ::read(in_fd, &buffer[0], buffer.size());
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) return 1;  // the client went away without `exit`
    framer.feed(std::string_view(buffer.data(), static_cast<size_t>(n)));
  }
}

}  // namespace calctrail::lsp
