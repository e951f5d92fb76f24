#include "engine/review/git_source.h"

#include <algorithm>
#include <cerrno>
#include <chrono>
#include <cmath>
#include <csignal>
#include <cstdlib>
#include <cstring>
#include <fcntl.h>
#include <poll.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

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

// The time limit for git: CALCTRAIL_GIT_TIMEOUT when set, else the default.
bool gitTimeout(double* seconds, std::string* error) {
  *seconds = kGitTimeoutSeconds;
  const char* env = std::getenv("CALCTRAIL_GIT_TIMEOUT");
  if (!env || !*env) return true;
  char* end = nullptr;
  const double v = std::strtod(env, &end);
  if (*end != '\0' || !std::isfinite(v) || v <= 0 || v > 86400) {
    *error = "CALCTRAIL_GIT_TIMEOUT is `" + std::string(env) +
             "`; it must be a number of seconds above 0, at most 86400";
    return false;
  }
  *seconds = v;
  return true;
}

// False with *timed_out set when git had to be stopped: trying another path
// would only wait as long again.
bool catBlob(const std::string& object, std::string* bytes, std::string* error, bool* timed_out) {
  ProcessLimits limits;
  if (!gitTimeout(&limits.timeout_seconds, error)) {
    *timed_out = true;
    return false;
  }
  limits.max_output = kMaxSourceBytes;
  const ProcessResult r = runProcess({"git", "cat-file", "blob", object}, limits);
  if (r.timed_out) {
    char seconds[32];
    std::snprintf(seconds, sizeof seconds, "%g", limits.timeout_seconds);
    *error = std::string("cannot read from git: `git cat-file` did not finish within ") + seconds +
             " s and was stopped (CALCTRAIL_GIT_TIMEOUT sets the limit, docs/limits.md)";
    *timed_out = true;
    return false;
  }
  if (r.output_too_large) {
    *error = "cannot read from git: the file is larger than " + std::to_string(kMaxSourceBytes >> 20) +
             " MiB, the limit for a worksheet (docs/limits.md)";
    *timed_out = true;  // the same blob on another path is no smaller
    return false;
  }
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

// *cwd_relative: which reading found the blob (REV:./PATH, or REV:PATH from the root).
bool readGitSide(const std::string& spec, std::string* bytes, std::string* error, bool* cwd_relative) {
  const size_t colon = spec.find(':');
  const std::string rev = spec.substr(0, colon);
  const std::string path = spec.substr(colon + 1);
  if (path.empty()) {
    *error = "`" + spec + "` names no file: write REV:PATH, as in HEAD~1:worksheets/gate.calc";
    return false;
  }
  bool stop = false;
  *cwd_relative = path.rfind('/', 0) != 0;
  if (path.rfind("./", 0) == 0 || path.rfind("../", 0) == 0 || path.rfind('/', 0) == 0)
    return catBlob(spec, bytes, error, &stop);
  if (catBlob(rev + ":./" + path, bytes, error, &stop)) return true;
  if (stop) return false;
  std::string root_error;
  *cwd_relative = false;
  if (catBlob(spec, bytes, &root_error, &stop)) return true;
  if (stop) *error = root_error;
  return false;  // otherwise the reading relative to the current directory explains best
}

using Clock = std::chrono::steady_clock;

}  // namespace

ProcessResult runProcess(const std::vector<std::string>& argv, const ProcessLimits& limits) {
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
    // A group of its own, so a timeout stops whatever the program started too.
    setpgid(0, 0);
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
  setpgid(pid, pid);  // also here, so the group exists before any kill below
  close(out_pipe[1]);
  close(err_pipe[1]);
  result.started = true;
  const bool timed = limits.timeout_seconds > 0;
  const Clock::time_point deadline =
      Clock::now() + std::chrono::duration_cast<Clock::duration>(std::chrono::duration<double>(
                         timed ? limits.timeout_seconds : 0.0));
  // Read both streams together, so a child filling one pipe never blocks.
  pollfd fds[2] = {{out_pipe[0], POLLIN, 0}, {err_pipe[0], POLLIN, 0}};
  std::string* sinks[2] = {&result.out, &result.err};
  const size_t caps[2] = {limits.max_output, limits.max_error};
  int open_streams = 2;
  bool stop = false;
  char buf[65536];
  while (open_streams > 0 && !stop) {
    int wait_ms = -1;
    if (timed) {
      const auto left =
          std::chrono::duration_cast<std::chrono::milliseconds>(deadline - Clock::now()).count();
      if (left <= 0) {
        result.timed_out = stop = true;
        break;
      }
      wait_ms = static_cast<int>(std::min<long long>(left, 1000 * 1000));
    }
    const int ready = poll(fds, 2, wait_ms);
    if (ready < 0) {
      if (errno == EINTR) continue;
      break;
    }
    for (int k = 0; k < 2 && !stop; ++k) {
      if (fds[k].fd < 0 || !(fds[k].revents & (POLLIN | POLLHUP | POLLERR))) continue;
      const ssize_t n = read(fds[k].fd, buf, sizeof buf);
      if (n > 0) {
        const size_t room = caps[k] - std::min(caps[k], sinks[k]->size());
        sinks[k]->append(buf, std::min(room, static_cast<size_t>(n)));
        if (k == 0 && static_cast<size_t>(n) > room) result.output_too_large = stop = true;
      } else if (n == 0 || errno != EINTR) {
        close(fds[k].fd);
        fds[k].fd = -1;
        --open_streams;
      }
    }
  }
  if (stop) kill(-pid, SIGKILL);
  for (const pollfd& p : fds)
    if (p.fd >= 0) close(p.fd);
  int raw = 0;
  while (waitpid(pid, &raw, 0) < 0 && errno == EINTR) {
  }
  result.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  return result;
}

ProcessResult runGit(const std::vector<std::string>& args, size_t max_output) {
  ProcessLimits limits;
  limits.max_output = max_output;
  ProcessResult r;
  if (!gitTimeout(&limits.timeout_seconds, &r.err)) return r;
  std::vector<std::string> argv = {"git"};
  argv.insert(argv.end(), args.begin(), args.end());
  return runProcess(argv, limits);
}

bool readSide(const std::string& spec, std::string* bytes, ReadError* error,
              std::unique_ptr<FileSource>* source, std::string* path) {
  struct stat st;
  if (source) source->reset();
  if (path) *path = spec;
  if (stat(spec.c_str(), &st) == 0 || spec.find(':') == std::string::npos)
    return readFile(spec, bytes, error);
  *error = {};
  bool cwd_relative = true;
  if (!readGitSide(spec, bytes, &error->message, &cwd_relative)) return false;
  const size_t colon = spec.find(':');
  if (source) *source = std::make_unique<GitRevisionSource>(spec.substr(0, colon), cwd_relative);
  if (path) *path = spec.substr(colon + 1);
  return checkSourceLimits(*bytes, "the file", error);
}

bool GitRevisionSource::read(const std::string& path, std::string* bytes, std::string* error) const {
  // A leading `/` in REV:/x is not git's; such a side names paths from the root.
  const std::string p = path.rfind('/', 0) == 0 ? path.substr(1) : path;
  bool timed_out = false;
  return catBlob(rev_ + ":" + (cwd_relative_ ? "./" : "") + p, bytes, error, &timed_out);
}

}  // namespace calctrail
