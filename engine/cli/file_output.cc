#include <cerrno>
#include <cstdio>
#include <cstring>
#include <unistd.h>

#include "engine/cli/commands.h"

namespace calctrail {

bool writeFileAtomically(const std::string& path, const std::string& text, std::string* error) {
  const std::string temp = path + ".calctrail-tmp-" + std::to_string(getpid());
  FILE* f = std::fopen(temp.c_str(), "wb");
  if (!f) {
    *error = std::string("cannot write: ") + std::strerror(errno);
    return false;
  }
  const bool written = std::fwrite(text.data(), 1, text.size(), f) == text.size();
  const bool flushed = std::fflush(f) == 0 && fsync(fileno(f)) == 0;
  const bool closed = std::fclose(f) == 0;
  if (!written || !flushed || !closed) {
    *error = std::string("cannot write: ") + std::strerror(errno);
    std::remove(temp.c_str());
    return false;
  }
  if (std::rename(temp.c_str(), path.c_str()) != 0) {
    *error = std::string("cannot replace the file: ") + std::strerror(errno);
    std::remove(temp.c_str());
    return false;
  }
  return true;
}

}  // namespace calctrail
