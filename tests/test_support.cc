#include "tests/test_support.h"

#include <catch2/catch.hpp>

#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <sys/wait.h>
#include <unistd.h>

namespace calctrail::test {

std::unique_ptr<Calculation> calc(const std::string& text, const std::vector<std::string>& sets) {
  CalcOptions o;
  o.sets = sets;
  return Calculation::fromText("sheet.calc", text, o);
}

std::string diagnostics(const Calculation& c) {
  std::string out;
  for (const Diagnostic& d : c.diags.list()) out += d.headline() + "\n";
  return out;
}

double si(const Calculation& c, const std::string& name) {
  const int i = c.sheet.find(name);
  INFO("quantity " << name << "\n" << diagnostics(c));
  REQUIRE(i >= 0);
  REQUIRE(c.ok(i));
  return c.si(i);
}

std::string repoPath(const std::string& relative) { return std::string(CALCTRAIL_SOURCE_DIR) + "/" + relative; }

std::string readFile(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

void writeFile(const std::string& path, const std::string& text) {
  std::ofstream out(path, std::ios::binary);
  out << text;
}

size_t count(const std::string& text, const std::string& part) {
  size_t n = 0;
  for (size_t at = text.find(part); at != std::string::npos; at = text.find(part, at + part.size())) ++n;
  return n;
}

std::string tempDir() {
  const char* base = std::getenv("TMPDIR");
  std::string pattern = std::string(base && *base ? base : "/tmp") + "/calctrail-test-XXXXXX";
  std::vector<char> buf(pattern.begin(), pattern.end());
  buf.push_back('\0');
  REQUIRE(mkdtemp(buf.data()) != nullptr);
  return buf.data();
}

Run runCliIn(const std::string& cwd, const std::string& args) {
  const std::string dir = tempDir();
  const std::string out = dir + "/stdout", err = dir + "/stderr";
  const std::string cmd = "cd '" + cwd + "' && '" + CALCTRAIL_BINARY + "' " + args + " >'" + out + "' 2>'" + err +
                          "' </dev/null";
  const int raw = std::system(cmd.c_str());
  Run r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = readFile(out);
  r.err = readFile(err);
  std::remove(out.c_str());
  std::remove(err.c_str());
  rmdir(dir.c_str());
  return r;
}

Run runCli(const std::string& args) { return runCliIn(CALCTRAIL_SOURCE_DIR, args); }

Run runCliThrough(const std::string& cwd, const std::string& prefix, const std::string& args) {
  const std::string dir = tempDir();
  const std::string out = dir + "/stdout", err = dir + "/stderr";
  const std::string cmd = "(cd '" + cwd + "' && " + prefix + " '" + CALCTRAIL_BINARY + "' " + args + ") >'" +
                          out + "' 2>'" + err + "' </dev/null";
  const int raw = std::system(cmd.c_str());
  Run r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = readFile(out);
  r.err = readFile(err);
  std::remove(out.c_str());
  std::remove(err.c_str());
  rmdir(dir.c_str());
  return r;
}

}  // namespace calctrail::test
