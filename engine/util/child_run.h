// Runs a measurement in a forked child and reads its result back through a
// pipe, so every benchmark case starts cold and its peak RSS is its own.
// For the perftest programs; T must be trivially copyable.
#pragma once

#include <cstdio>
#include <sys/types.h>
#include <sys/wait.h>
#include <type_traits>
#include <unistd.h>

namespace calctrail {

// Calls fn(&result) in a child and copies the result to *out. False when the
// child could not run, failed, or sent less than a whole result.
template <typename T, typename Fn>
bool runInChild(Fn fn, T* out) {
  static_assert(std::is_trivially_copyable<T>::value, "the result crosses a pipe as bytes");
  int fds[2];
  if (pipe(fds) != 0) return false;
  std::fflush(stdout);
  std::fflush(stderr);
  const pid_t pid = fork();
  if (pid < 0) {
    close(fds[0]);
    close(fds[1]);
    return false;
  }
  if (pid == 0) {
    close(fds[0]);
    T result{};
    fn(&result);
    const char* p = reinterpret_cast<const char*>(&result);
    size_t left = sizeof result;
    while (left > 0) {
      const ssize_t w = write(fds[1], p, left);
      if (w <= 0) _exit(3);
      p += w;
      left -= static_cast<size_t>(w);
    }
    _exit(0);
  }
  close(fds[1]);
  char* p = reinterpret_cast<char*>(out);
  size_t got = 0;
  while (got < sizeof *out) {
    const ssize_t n = read(fds[0], p + got, sizeof *out - got);
    if (n <= 0) break;
    got += static_cast<size_t>(n);
  }
  close(fds[0]);
  int status = 0;
  waitpid(pid, &status, 0);
  return got == sizeof *out && WIFEXITED(status) && WEXITSTATUS(status) == 0;
}

}  // namespace calctrail
