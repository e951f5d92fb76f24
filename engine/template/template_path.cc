#include "engine/template/template_path.h"

#include <string_view>
#include <vector>

namespace calctrail {

std::string normalizePath(const std::string& path) {
  const bool absolute = !path.empty() && path[0] == '/';
  std::vector<std::string_view> parts;  // views into `path`: no copy of a part until the result
  size_t i = 0;
  while (i <= path.size()) {
    size_t j = path.find('/', i);
    if (j == std::string::npos) j = path.size();
    const std::string_view part = std::string_view(path).substr(i, j - i);
    i = j + 1;
    if (part.empty() || part == ".") continue;
    if (part == ".." && !parts.empty() && parts.back() != "..") {
      parts.pop_back();
      continue;
    }
    if (part == ".." && absolute) continue;  // above the root is the root
    parts.push_back(part);
  }
  std::string out = absolute ? "/" : "";
  out.reserve(path.size());
  for (size_t k = 0; k < parts.size(); ++k) {
    if (k) out += '/';
    out += parts[k];
  }
  return out;
}

std::string parentPath(const std::string& path) {
  const size_t slash = path.rfind('/');
  if (slash == std::string::npos) return "";
  if (slash == 0) return "/";
  return path.substr(0, slash);
}

std::string joinPath(const std::string& dir, const std::string& rel) {
  if (dir.empty()) return normalizePath(rel);
  return normalizePath(dir + "/" + rel);
}

bool isAbsolutePath(const std::string& path) {
  if (path.empty()) return false;
  if (path[0] == '/' || path[0] == '\\' || path[0] == '~') return true;
  const bool letter = (path[0] >= 'A' && path[0] <= 'Z') || (path[0] >= 'a' && path[0] <= 'z');
  return path.size() >= 2 && letter && path[1] == ':';
}

int leadingParents(const std::string& path) {
  const std::string n = normalizePath(path);
  int count = 0;
  for (size_t i = 0; n.compare(i, 2, "..") == 0 && (i + 2 == n.size() || n[i + 2] == '/'); i += 3) ++count;
  return count;
}

bool insideFolder(const std::string& path, const std::string& folder) {
  if (folder == "/") return !path.empty() && path[0] == '/';
  if (path.compare(0, folder.size(), folder) != 0) return false;
  return path.size() == folder.size() || path[folder.size()] == '/';
}

}  // namespace calctrail
