#include "engine/util/find_worksheets.h"

#include <climits>
#include <sys/stat.h>
#include <unistd.h>

namespace calctrail {

namespace {

bool isFile(const std::string& path) {
  struct stat st;
  return stat(path.c_str(), &st) == 0 && S_ISREG(st.st_mode);
}

std::string currentDirectory() {
  char buf[PATH_MAX];
  return getcwd(buf, sizeof buf) ? std::string(buf) : std::string();
}

std::string programDirectory() {
  char buf[PATH_MAX];
  const ssize_t n = readlink("/proc/self/exe", buf, sizeof buf - 1);
  if (n <= 0) return "";
  const std::string exe(buf, static_cast<size_t>(n));
  const size_t slash = exe.rfind('/');
  return slash == std::string::npos ? std::string() : slash == 0 ? "/" : exe.substr(0, slash);
}

// "/a/b" -> "/a", "/a" -> "/", "/" -> "".
std::string parent(const std::string& dir) {
  if (dir.empty() || dir == "/") return "";
  const size_t slash = dir.rfind('/');
  if (slash == std::string::npos) return "";
  return slash == 0 ? "/" : dir.substr(0, slash);
}

std::string join(const std::string& dir, const std::string& name) {
  return dir.empty() || dir.back() == '/' ? dir + name : dir + "/" + name;
}

}  // namespace

std::vector<std::string> worksheetSearchStarts() { return {currentDirectory(), programDirectory()}; }

std::string findWorksheets(const std::string& marker, const std::vector<std::string>& starts) {
  const std::string cwd = currentDirectory();
  for (const std::string& start : starts) {
    if (start.empty()) continue;
    std::string up;  // the same folder relative to the current directory, while it is above it
    bool relative = !cwd.empty() && start == cwd;
    for (std::string dir = start; !dir.empty(); dir = parent(dir)) {
      const std::string found = join(dir, "worksheets");
      if (isFile(join(found, marker))) return relative ? up + "worksheets" : found;
      up += "../";
    }
  }
  return "";
}

std::string findWorksheets(const std::string& marker) { return findWorksheets(marker, worksheetSearchStarts()); }

std::string worksheetsNotFound(const std::string& program, const std::string& marker, const std::string& option) {
  const std::string exe = programDirectory();
  return program + ": found no worksheets/" + marker + " in the current directory or the program's (" +
         (exe.empty() ? std::string("unknown") : exe) + ") or their parents; pass " + option;
}

}  // namespace calctrail
