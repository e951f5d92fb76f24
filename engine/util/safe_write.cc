#include "engine/util/safe_write.h"

#include <cerrno>
#include <csignal>
#include <cstdlib>
#include <cstring>
#include <string_view>
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

namespace calctrail {

namespace {

std::string cannotWrite() { return std::string("cannot write: ") + std::strerror(errno); }

bool sameFile(const struct stat& a, const struct stat& b) {
  return a.st_dev == b.st_dev && a.st_ino == b.st_ino;
}

bool writeAll(int fd, std::string_view text) {
  for (size_t done = 0; done < text.size();) {
    const ssize_t n = write(fd, text.data() + done, text.size() - done);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) return false;
    done += static_cast<size_t>(n);
  }
  return true;
}

// Writes into a character device or FIFO as a stream: no creation, no
// truncation, no rename, so the node stays what it is.
bool writeStream(const std::string& target, const struct stat& expected, const OutputProducer& produce,
                 std::string* error) {
  // Non-blocking only to open: a FIFO nobody reads is an error now, not a hang.
  const int fd = open(target.c_str(), O_WRONLY | O_NOCTTY | O_CLOEXEC | O_NONBLOCK);
  if (fd < 0) {
    *error = errno == ENXIO && S_ISFIFO(expected.st_mode) ? "cannot write: no process is reading the FIFO"
                                                           : cannotWrite();
    return false;
  }
  struct stat st;
  const bool same = fstat(fd, &st) == 0 && sameFile(st, expected) &&
                    (st.st_mode & S_IFMT) == (expected.st_mode & S_IFMT);
  if (!same) {
    close(fd);
    *error = "cannot write: the file changed while it was being opened";
    return false;
  }
  const int flags = fcntl(fd, F_GETFL);
  if (flags >= 0) fcntl(fd, F_SETFL, flags & ~O_NONBLOCK);
  // A reader that goes away is a write error (EPIPE) to report, not a signal that kills.
  struct sigaction ignore {}, old {};
  ignore.sa_handler = SIG_IGN;
  sigaction(SIGPIPE, &ignore, &old);
  bool ok = produce([fd](std::string_view piece) { return writeAll(fd, piece); });
  if (!ok) *error = cannotWrite();
  if (close(fd) != 0 && ok) {
    *error = cannotWrite();
    ok = false;
  }
  sigaction(SIGPIPE, &old, nullptr);
  return ok;
}

// Writes a regular file through a temporary in its folder and a rename.
// `original` is the file being replaced, or null for a new one.
bool writeRegular(const std::string& target, const struct stat* original, const OutputProducer& produce,
                  std::string* error) {
  if (original) {
    if (access(target.c_str(), W_OK) != 0) {
      *error = errno == EACCES || errno == EPERM || errno == EROFS
                   ? "cannot write: the file is read-only for you; calctrail leaves it as it is"
                   : cannotWrite();
      return false;
    }
    if (original->st_nlink > 1) {
      // Replacing one name would leave the others with the old text.
      *error = "cannot write: the file has " + std::to_string(original->st_nlink) +
               " hard links, and rewriting it would split them; calctrail leaves it as it is";
      return false;
    }
  }
  const size_t slash = target.rfind('/');
  const std::string folder = slash == std::string::npos ? "" : target.substr(0, slash + 1);
  const std::string name = slash == std::string::npos ? target : target.substr(slash + 1);
  // O_EXCL with a random name: no planted file or link can be opened instead.
  std::string temp = folder + "." + name + ".calctrail-XXXXXX";
  const int fd = mkostemp(&temp[0], O_CLOEXEC);
  if (fd < 0) {
    *error = cannotWrite();
    return false;
  }
  auto fail = [&](const std::string& message, bool open) {
    if (open) close(fd);
    unlink(temp.c_str());
    *error = message;
    return false;
  };
  mode_t mode;
  if (original) {
    struct stat now;
    if (fstat(fd, &now) != 0) return fail(cannotWrite(), true);
    if ((now.st_uid != original->st_uid || now.st_gid != original->st_gid) &&
        fchown(fd, original->st_uid, original->st_gid) != 0) {
      return fail("cannot write: the file belongs to user " + std::to_string(original->st_uid) + ", group " +
                      std::to_string(original->st_gid) +
                      ", which a rewritten copy cannot keep; calctrail leaves it as it is",
                  true);
    }
    mode = original->st_mode & 07777;
  } else {
    const mode_t mask = umask(0);
    umask(mask);
    mode = 0666 & ~mask;
  }
  // Before the rename: the final name never shows wider permissions.
  if (fchmod(fd, mode) != 0) return fail(cannotWrite(), true);
  bool written = false;
  try {
    written = produce([fd](std::string_view piece) { return writeAll(fd, piece); });
  } catch (...) {
    fail("", true);  // no half-made temporary left beside the file
    throw;
  }
  if (!written || fsync(fd) != 0) return fail(cannotWrite(), true);
  if (close(fd) != 0) return fail(cannotWrite(), false);
  if (rename(temp.c_str(), target.c_str()) != 0)
    return fail(std::string("cannot replace the file: ") + std::strerror(errno), false);
  // Make the rename itself durable; a failure here changes nothing already done.
  const int dir = open(folder.empty() ? "." : folder.c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC);
  if (dir >= 0) {
    fsync(dir);
    close(dir);
  }
  return true;
}

// The path a symbolic link leads to (the path itself when it is none); false
// when the link leads nowhere.
bool followLinks(const std::string& path, std::string* target, std::string* error) {
  char* real = realpath(path.c_str(), nullptr);
  if (!real) {
    *error = errno == ENOENT ? "cannot write: it is a symbolic link to a file that does not exist"
                             : cannotWrite();
    return false;
  }
  *target = real;
  std::free(real);
  return true;
}

// The whole text as one piece.
OutputProducer wholeText(const std::string& text) {
  return [&text](const OutputWriter& write) { return write(text); };
}

}  // namespace

bool writeOutputFile(const std::string& path, const std::string& text, const std::vector<std::string>& inputs,
                     std::string* error) {
  return writeOutputFile(path, wholeText(text), inputs, error);
}

bool writeOutputFile(const std::string& path, const OutputProducer& produce, const std::vector<std::string>& inputs,
                     std::string* error) {
  struct stat st;
  if (lstat(path.c_str(), &st) != 0) {
    if (errno != ENOENT) {
      *error = cannotWrite();
      return false;
    }
    return writeRegular(path, nullptr, produce, error);
  }
  std::string target = path;
  if (S_ISLNK(st.st_mode)) {
    if (!followLinks(path, &target, error)) return false;
    if (stat(target.c_str(), &st) != 0) {
      *error = cannotWrite();
      return false;
    }
  }
  for (const std::string& input : inputs) {
    struct stat in;
    const bool known = input == "-" ? fstat(STDIN_FILENO, &in) == 0 : stat(input.c_str(), &in) == 0;
    // Only a regular file is destroyed by writing over it; a terminal or /dev/null is not.
    if (known && S_ISREG(in.st_mode) && sameFile(in, st)) {
      *error = "cannot write: it is " + (input == "-" ? std::string("standard input") : "`" + input + "`") +
               ", the worksheet this command reads (the same file); give another output";
      return false;
    }
  }
  if (S_ISCHR(st.st_mode) || S_ISFIFO(st.st_mode)) return writeStream(target, st, produce, error);
  if (S_ISDIR(st.st_mode)) {
    *error = "cannot write: it is a directory";
    return false;
  }
  if (!S_ISREG(st.st_mode)) {
    *error = "cannot write: it is a block device or a socket, where calctrail writes no output";
    return false;
  }
  return writeRegular(target, &st, produce, error);
}

bool replaceFileContents(const std::string& path, const std::string& text, std::string* error) {
  std::string target;
  struct stat st;
  if (!followLinks(path, &target, error)) return false;
  if (stat(target.c_str(), &st) != 0) {
    *error = cannotWrite();
    return false;
  }
  if (!S_ISREG(st.st_mode)) {
    *error = "cannot write: it is not a regular file, so it is not rewritten";
    return false;
  }
  return writeRegular(target, &st, wholeText(text), error);
}

}  // namespace calctrail
