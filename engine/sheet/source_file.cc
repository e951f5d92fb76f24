#include "engine/sheet/source_file.h"

#include <algorithm>
#include <cerrno>
#include <cstring>
#include <fcntl.h>
#include <stdexcept>
#include <sys/stat.h>
#include <unistd.h>

namespace calctrail {

SourceFile::SourceFile(std::string path, std::string bytes)
    : path_(std::move(path)), bytes_(std::move(bytes)) {
  // Offsets are 32-bit throughout the parser; a larger text would wrap them.
  if (bytes_.size() > kMaxSourceBytes) throw std::length_error(path_ + ": worksheet over the size limit");
  line_starts_.push_back(0);
  const char* const data = bytes_.data();
  const char* const end = data + bytes_.size();
  for (const char* p = data; (p = static_cast<const char*>(std::memchr(p, '\n', static_cast<size_t>(end - p))));) {
    if (++p < end) line_starts_.push_back(static_cast<uint32_t>(p - data));
  }
}

std::string_view SourceFile::lineText(int line) const {
  const uint32_t begin = line_starts_[line - 1];
  uint32_t end = line < lineCount() ? line_starts_[line] : static_cast<uint32_t>(bytes_.size());
  if (end > begin && bytes_[end - 1] == '\n') --end;
  if (end > begin && bytes_[end - 1] == '\r') --end;
  return std::string_view(bytes_).substr(begin, end - begin);
}

SourcePos SourceFile::position(uint32_t offset) const {
  offset = std::min<uint32_t>(offset, static_cast<uint32_t>(bytes_.size()));
  auto it = std::upper_bound(line_starts_.begin(), line_starts_.end(), offset);
  const int line = static_cast<int>(it - line_starts_.begin());
  int column = 1;
  for (uint32_t i = line_starts_[line - 1]; i < offset; ++i) {
    // Count lead bytes only, so a multi-byte character is one column.
    if ((static_cast<unsigned char>(bytes_[i]) & 0xC0) != 0x80) ++column;
  }
  return {line, column};
}

namespace {

std::string sizeText(size_t bytes) {
  return bytes >= (size_t{1} << 20) ? std::to_string(bytes >> 20) + " MiB"
                                     : std::to_string(bytes >> 10) + " KiB";
}

std::string tooLarge(const std::string& what) {
  return what + " is larger than " + sizeText(kMaxSourceBytes) +
         ", the limit for a worksheet (docs/limits.md)";
}

// Takes bytes as they arrive and stops at the first limit passed, so an endless
// stream (/dev/zero) costs at most one line's worth of memory before the error.
class LimitedText {
 public:
  LimitedText(std::string what, bool keep) : what_(std::move(what)), keep_(keep) {}

  // False, with the reason in *error, once a limit is passed.
  bool add(const char* data, size_t n, ReadError* error) {
    if (n > kMaxSourceBytes - total_) {
      *error = {tooLarge(what_), 0};
      return false;
    }
    total_ += n;
    // Lines are numbered by LF, as SourceFile numbers them; a CR also ends the
    // measured run, so a file with CR line endings is not one long line.
    // memchr finds both a word at a time.
    for (const char *p = data, *end = data + n; p < end;) {
      const char* lf = static_cast<const char*>(std::memchr(p, '\n', static_cast<size_t>(end - p)));
      const char* stop = lf ? lf : end;
      for (const char* cr; (cr = static_cast<const char*>(std::memchr(p, '\r', static_cast<size_t>(stop - p))));) {
        if (!addToRun(static_cast<size_t>(cr - p), error)) return false;
        run_ = 0;
        p = cr + 1;
      }
      if (!addToRun(static_cast<size_t>(stop - p), error)) return false;
      if (lf) {
        ++line_;
        run_ = 0;
      }
      p = lf ? lf + 1 : end;
    }
    if (keep_) text_.append(data, n);
    return true;
  }

  std::string& text() { return text_; }
  // Room for `n` bytes at once: a file's size is known, and a string grown by
  // doubling would hold up to twice the sheet for as long as the sheet lives.
  void reserve(size_t n) {
    if (keep_) text_.reserve(n);
  }

 private:
  // `n` more bytes of the run of the current line, with neither LF nor CR among them.
  bool addToRun(size_t n, ReadError* error) {
    run_ += n;
    if (run_ <= kMaxLineBytes) return true;
    *error = {"line " + std::to_string(line_) + " is longer than " + sizeText(kMaxLineBytes) +
                  ", the limit for one line (docs/limits.md)",
              line_};
    return false;
  }

  std::string what_;   // names the input in messages: "the file", "standard input"
  bool keep_;          // whether the bytes are kept, or only checked
  std::string text_;   // the bytes so far, when kept
  size_t total_ = 0;   // bytes so far
  int line_ = 1;       // the line the next byte belongs to
  size_t run_ = 0;     // bytes of that line so far, since its start or a CR
};

// Reads `fd` to its end in bounded steps; `expected`: its size when known (a regular file's), else 0.
bool readBounded(int fd, const std::string& what, std::string* bytes, ReadError* error, size_t expected = 0) {
  LimitedText text(what, true);
  text.reserve(expected);
  char buf[65536];
  for (;;) {
    const ssize_t n = read(fd, buf, sizeof buf);
    if (n < 0 && errno == EINTR) continue;
    if (n < 0) {
      *error = {std::string("cannot read file: ") + std::strerror(errno), 0};
      return false;
    }
    if (n == 0) break;
    if (!text.add(buf, static_cast<size_t>(n), error)) return false;
  }
  *bytes = std::move(text.text());
  return true;
}

}  // namespace

bool readFile(const std::string& path, std::string* bytes, ReadError* error) {
  const int fd = open(path.c_str(), O_RDONLY | O_CLOEXEC | O_NOCTTY);
  if (fd < 0) {
    *error = {std::string("cannot read file: ") + std::strerror(errno), 0};
    return false;
  }
  struct stat st;
  bool ok = fstat(fd, &st) == 0;
  if (!ok) {
    *error = {std::string("cannot read file: ") + std::strerror(errno), 0};
  } else if (S_ISDIR(st.st_mode)) {
    *error = {"cannot read file: it is a directory", 0};
    ok = false;
  } else if (S_ISREG(st.st_mode) && static_cast<uint64_t>(st.st_size) > kMaxSourceBytes) {
    // Said at once, without reading gigabytes first.
    *error = {tooLarge("the file"), 0};
    ok = false;
  } else {
    ok = readBounded(fd, "the file", bytes, error, S_ISREG(st.st_mode) ? static_cast<size_t>(st.st_size) : 0);
  }
  close(fd);
  return ok;
}

bool readFile(const std::string& path, std::string* bytes, std::string* error) {
  ReadError e;
  if (readFile(path, bytes, &e)) return true;
  *error = e.message;
  return false;
}

bool readStandardInput(std::string* bytes, ReadError* error) {
  return readBounded(STDIN_FILENO, "standard input", bytes, error);
}

bool checkSourceLimits(std::string_view bytes, const std::string& what, ReadError* error) {
  LimitedText text(what, false);
  return text.add(bytes.data(), bytes.size(), error);
}

}  // namespace calctrail
