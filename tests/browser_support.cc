#include "tests/browser_support.h"

#include <cstdlib>

namespace calctrail::test {

bool have(const std::string& program) {
  return std::system(("command -v " + program + " >/dev/null 2>&1").c_str()) == 0;
}

std::string replaceAll(std::string s, const std::string& from, const std::string& to) {
  for (size_t at = s.find(from); at != std::string::npos; at = s.find(from, at + to.size()))
    s.replace(at, from.size(), to);
  return s;
}

int printToPdf(const std::string& html, const std::string& pdf, const std::string& dir) {
  const std::string cmd =
      "timeout 180 chromium --headless --no-sandbox --disable-gpu --disable-dev-shm-usage --disable-quic "
      "--no-first-run --disable-background-networking --disable-component-update --disable-sync "
      "--user-data-dir='" +
      dir + "/profile' --no-pdf-header-footer --print-to-pdf='" + pdf + "' 'file://" + html + "' >'" + dir +
      "/chromium.log' 2>&1";
  return std::system(cmd.c_str());
}

}  // namespace calctrail::test
