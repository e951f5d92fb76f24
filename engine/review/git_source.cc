#include "engine/review/git_source.h"

#include <cerrno>
#include <cstring>
#include <fcntl.h>
#include <poll.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "engine/sheet/source_file.h"

namespace calctrail {

namespace {

constexpr int kCannotExec = 127;

// The first line git printed, without its "fatal: " or "error: " prefix.
std::string gitMessage(const ProcessResult& r) {
  std::string m = r.err.substr(0, r.err.find('\n'));
  for (const char* prefix : {"fatal: ", "error: "})
    if (m.rfind(prefix, 0) == 0) m.erase(0, std::strlen(prefix));
  if (m.empty()) m = "git exited with status " + std::to_string(r.status);
  return m;
}

bool catBlob(const std::string& object, std::string* bytes, std::string* error) {
  const ProcessResult r = runProcess({"git", "cat-file", "blob", object});
  if (!r.started || r.status == kCannotExec) {
    *error = "cannot run git: " + (r.err.empty() ? std::string("not found") : gitMessage(r));
    return false;
  }
  if (r.status != 0) {
    *error = "cannot read from git: " + gitMessage(r);
    return false;
  }
  *bytes = r.out;
  return true;
}

}  // namespace

ProcessResult runProcess(const std::vector<std::string>& argv) {
  ProcessResult result;
  int out_pipe[2], err_pipe[2];
  if (pipe(out_pipe) != 0) return result;
  if (pipe(err_pipe) != 0) {
    close(out_pipe[0]);
    close(out_pipe[1]);
    return result;
  }
  const pid_t pid = fork();
  if (pid < 0) {
    for (int fd : {out_pipe[0], out_pipe[1], err_pipe[0], err_pipe[1]}) close(fd);
    return result;
  }
  if (pid == 0) {
    dup2(out_pipe[1], STDOUT_FILENO);
    dup2(err_pipe[1], STDERR_FILENO);
    for (int fd : {out_pipe[0], out_pipe[1], err_pipe[0], err_pipe[1]}) close(fd);
    const int null_in = open("/dev/null", O_RDONLY);
    if (null_in >= 0) dup2(null_in, STDIN_FILENO);
    std::vector<char*> args;
    for (const std::string& a : argv) args.push_back(const_cast<char*>(a.c_str()));
    args.push_back(nullptr);
    execvp(args[0], args.data());
    const std::string msg = std::string(strerror(errno)) + "\n";
    if (write(STDERR_FILENO, msg.data(), msg.size()) < 0) {
      // Nothing more to do: the exit status says it.
    }
    _exit(kCannotExec);
  }
  close(out_pipe[1]);
  close(err_pipe[1]);
  result.started = true;
  // Read both streams together, so a child filling one pipe never blocks.
  pollfd fds[2] = {{out_pipe[0], POLLIN, 0}, {err_pipe[0], POLLIN, 0}};
  std::string* sinks[2] = {&result.out, &result.err};
  int open_streams = 2;
  char buf[65536];
  while (open_streams > 0) {
    if (poll(fds, 2, -1) < 0) {
      if (errno == EINTR) continue;
      break;
    }
    for (int k = 0; k < 2; ++k) {
      if (fds[k].fd < 0 || !(fds[k].revents & (POLLIN | POLLHUP | POLLERR))) continue;
      const ssize_t n = read(fds[k].fd, buf, sizeof buf);
      if (n > 0) {
        sinks[k]->append(buf, static_cast<size_t>(n));
      } else if (n == 0 || errno != EINTR) {
        close(fds[k].fd);
        fds[k].fd = -1;
        --open_streams;
      }
    }
  }
  for (const pollfd& p : fds)
    if (p.fd >= 0) close(p.fd);
  int raw = 0;
  while (waitpid(pid, &raw, 0) < 0 && errno == EINTR) {
  }
  result.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  return result;
}

bool readSide(const std::string& spec, std::string* bytes, std::string* error) {
  std::unique_ptr<FileSource> source;
  std::string path;
  return readSide(spec, bytes, error, &source, &path);
}

bool readSide(const std::string& spec, std::string* bytes, std::string* error,
              std::unique_ptr<FileSource>* source, std::string* path) {
  struct stat st;
  source->reset();
  *path = spec;
  const size_t colon = spec.find(':');
  if (stat(spec.c_str(), &st) == 0 || colon == std::string::npos) return readFile(spec, bytes, error);
  const std::string rev = spec.substr(0, colon);
  *path = spec.substr(colon + 1);
  if (path->empty()) {
    *error = "`" + spec + "` names no file: write REV:PATH, as in HEAD~1:worksheets/gate.calc";
    return false;
  }
  if (path->rfind("./", 0) == 0 || path->rfind("../", 0) == 0 || path->rfind('/', 0) == 0) {
    *source = std::make_unique<GitRevisionSource>(rev, path->rfind('/', 0) != 0);
    return catBlob(spec, bytes, error);
  }
  if (catBlob(rev + ":./" + *path, bytes, error)) {
    *source = std::make_unique<GitRevisionSource>(rev, true);
    return true;
  }
  std::string root_error;
  if (catBlob(spec, bytes, &root_error)) {
    *source = std::make_unique<GitRevisionSource>(rev, false);
    return true;
  }
  return false;  // the reading relative to the current directory explains best
}

bool GitRevisionSource::read(const std::string& path, std::string* bytes, std::string* error) const {
  // A leading `/` in REV:/x is not git's; such a side names paths from the root.
  const std::string p = path.rfind('/', 0) == 0 ? path.substr(1) : path;
  return catBlob(rev_ + ":" + (cwd_relative_ ? "./" : "") + p, bytes, error);
}

}  // namespace calctrail
