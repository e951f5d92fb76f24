// What calctrail reads is bounded (docs/limits.md): a file or stream past the
// size limit, or a line past the line limit, is a FILE:LINE:COL error at once,
// never a hang or an exhausted memory; and a git that hangs is stopped.
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <chrono>
#include <cstdlib>
#include <fstream>

#include "engine/sheet/source_file.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

const char* const kSheet = "F = 2 kN   # load\nr = 0.1 m\nT [N*m] = F * r\n";

double secondsSince(std::chrono::steady_clock::time_point start) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

// Sets an environment variable for the life of the object.
class ScopedEnv {
 public:
  ScopedEnv(const char* name, const std::string& value) : name_(name) {
    const char* old = std::getenv(name);
    had_ = old != nullptr;
    if (had_) old_ = old;
    setenv(name, value.c_str(), 1);
  }
  ~ScopedEnv() {
    if (had_)
      setenv(name_, old_.c_str(), 1);
    else
      unsetenv(name_);
  }

 private:
  const char* name_;  // the variable
  bool had_ = false;  // whether it was set before
  std::string old_;   // its value before
};

// A folder with a fake `git` that runs `script`, to be put first on PATH.
std::string fakeGit(const std::string& script) {
  const std::string bin = tempDir();
  writeFile(bin + "/git", "#!/bin/sh\n" + script);
  REQUIRE(chmod((bin + "/git").c_str(), 0755) == 0);
  return bin;
}

// Whether process `pid` is gone (or only a zombie waiting to be reaped).
bool processGone(const std::string& pid) {
  std::ifstream stat("/proc/" + pid + "/stat");
  if (!stat) return true;
  std::string text((std::istreambuf_iterator<char>(stat)), std::istreambuf_iterator<char>());
  const size_t paren = text.rfind(')');
  return paren != std::string::npos && text.size() > paren + 2 && text[paren + 2] == 'Z';
}

}  // namespace

TEST_CASE("an endless stream as a worksheet is a line-limit error at 1:1, for every command",
          "[input-limits]") {
  const auto start = std::chrono::steady_clock::now();
  const std::string line_limit =
      ":1:1: error: line 1 is longer than 64 KiB, the limit for one line (docs/limits.md)";
  for (const char* cmd : {"report", "check", "textconv", "fmt", "fmt --check"}) {
    INFO(cmd);
    Run r = runCli(std::string(cmd) + " /dev/zero");
    CHECK(r.status == 2);
    CHECK(r.err.find("/dev/zero" + line_limit + "\n") == 0);
  }
  for (const char* cmd : {"fmt -", "report -", "check -"}) {
    INFO(cmd);
    Run r = runCliThrough(CALCTRAIL_SOURCE_DIR, "", std::string(cmd) + " </dev/zero");
    CHECK(r.status == 2);
    CHECK(r.err.find("<stdin>" + line_limit + "\n") == 0);
  }
  Run d = runCli("diff /dev/zero worksheets/leveling-jack.calc");
  CHECK(d.status == 2);
  CHECK(d.err.find("/dev/zero" + line_limit + "\n") == 0);
  CHECK(secondsSince(start) < 60);
}

TEST_CASE("a file of 4 GiB or more is a size-limit error at once", "[input-limits]") {
  const std::string dir = tempDir();
  const std::string path = dir + "/huge.calc";
  // Sparse: no disk space, but 4 GiB and one byte of size, past a 32-bit offset.
  const int fd = open(path.c_str(), O_CREAT | O_WRONLY | O_TRUNC, 0644);
  REQUIRE(fd >= 0);
  REQUIRE(ftruncate(fd, (off_t{1} << 32) + 1) == 0);
  close(fd);
  const auto start = std::chrono::steady_clock::now();
  for (const char* cmd : {"report", "check", "fmt", "textconv"}) {
    INFO(cmd);
    Run r = runCliIn(dir, std::string(cmd) + " huge.calc");
    CHECK(r.status == 2);
    CHECK(r.err.find("huge.calc:1:1: error: the file is larger than 64 MiB, the limit for a worksheet "
                     "(docs/limits.md)\n") == 0);
  }
  CHECK(secondsSince(start) < 30);
  std::remove(path.c_str());
}

TEST_CASE("standard input past the size limit is an error, read in bounded steps", "[input-limits]") {
  // Short lines without end from a pipe: only the size limit can stop them.
  Run r = runCliThrough(CALCTRAIL_SOURCE_DIR, "yes 'a = 1' |", "fmt -");
  CHECK(r.status == 2);
  CHECK(r.err ==
        "<stdin>:1:1: error: standard input is larger than 64 MiB, the limit for a worksheet "
        "(docs/limits.md)\n");
  CHECK(r.out.empty());
  Run report = runCliThrough(CALCTRAIL_SOURCE_DIR, "yes 'a = 1' |", "report -");
  CHECK(report.status == 2);
  CHECK(report.err.find("<stdin>:1:1: error: standard input is larger than 64 MiB") == 0);
}

TEST_CASE("a line past the line limit is named at FILE:LINE:1, and one at the limit is read",
          "[input-limits]") {
  const std::string dir = tempDir();
  writeFile(dir + "/long.calc", "a = 1\nb = 2\nc = 3   # " + std::string(kMaxLineBytes, 'x') + "\nd = 4\n");
  Run r = runCliIn(dir, "check long.calc");
  CHECK(r.status == 2);
  CHECK(r.err ==
        "long.calc:3:1: error: line 3 is longer than 64 KiB, the limit for one line (docs/limits.md)\n");
  Run f = runCliIn(dir, "fmt long.calc");
  CHECK(f.status == 2);
  CHECK(f.err == r.err);

  // Exactly at the limit, with a CRLF ending, the line is read (and the description kept).
  const std::string at_limit = "c = 3   # " + std::string(kMaxLineBytes - 10, 'x');
  writeFile(dir + "/ok.calc", "a = 1\r\n" + at_limit + "\r\n");
  Run ok = runCliIn(dir, "check ok.calc");
  CHECK(ok.status == 0);
  CHECK(ok.err.empty());
  // The library reader says the same as the program.
  std::string bytes;
  ReadError error;
  CHECK(!readFile(dir + "/long.calc", &bytes, &error));
  CHECK(error.line == 3);
  CHECK(readFile(dir + "/ok.calc", &bytes, &error));
  CHECK(bytes.size() == 7 + at_limit.size() + 2);
}

TEST_CASE("report - reads the worksheet from standard input", "[input-limits]") {
  const std::string dir = tempDir();
  writeFile(dir + "/x.calc", kSheet);
  Run from_file = runCliIn(dir, "report x.calc --format json");
  Run from_stdin = runCliThrough(dir, "", "report - --format json <x.calc");
  CHECK(from_stdin.status == 0);
  CHECK(from_stdin.err.empty());
  CHECK(from_stdin.out.find("\"T\"") != std::string::npos);
  CHECK(from_stdin.out.find("<stdin>") != std::string::npos);
  // The same numbers: only the file's name differs.
  std::string renamed = from_stdin.out;
  for (size_t at; (at = renamed.find("<stdin>")) != std::string::npos;) renamed.replace(at, 7, "x.calc");
  CHECK(renamed == from_file.out);
  Run broken = runCliThrough(dir, "printf 'a = (\\n' |", "report -");
  CHECK(broken.status == 2);
  CHECK(broken.err.find("<stdin>:1:") == 0);
}

TEST_CASE("diff REV:PATH: a git that hangs is stopped at the time limit, its whole process group",
          "[input-limits]") {
  const std::string dir = tempDir();
  writeFile(dir + "/x.calc", kSheet);
  // The fake git leaves a child of its own behind, as a hung git with a pager or hook would.
  const std::string bin =
      fakeGit("sleep 120 &\necho $! > '" + dir + "/child.pid'\necho $$ > '" + dir + "/git.pid'\nsleep 120\n");
  ScopedEnv path("PATH", bin + ":" + std::getenv("PATH"));
  ScopedEnv timeout("CALCTRAIL_GIT_TIMEOUT", "1");
  const auto start = std::chrono::steady_clock::now();
  Run r = runCliIn(dir, "diff HEAD:x.calc x.calc");
  const double took = secondsSince(start);
  CHECK(r.status == 2);
  CHECK(
      r.err.find("HEAD:x.calc:1:1: error: cannot read from git: `git cat-file` did not finish within 1 s and "
                 "was stopped (CALCTRAIL_GIT_TIMEOUT sets the limit, docs/limits.md)\n") == 0);
  CHECK(took < 10);  // one wait of 1 s, not one per path tried
  for (const char* name : {"/git.pid", "/child.pid"}) {
    std::string pid = readFile(dir + name);
    REQUIRE(!pid.empty());
    pid.erase(pid.find('\n'));
    INFO(name << " " << pid);
    bool gone = false;
    for (int k = 0; k < 50 && !(gone = processGone(pid)); ++k) usleep(100000);
    CHECK(gone);
  }
}

TEST_CASE("diff REV:PATH: a blob past the size limit stops git, and a bad time limit is named",
          "[input-limits]") {
  const std::string dir = tempDir();
  writeFile(dir + "/x.calc", kSheet);
  const std::string bin = fakeGit("exec yes 'a = 1'\n");
  ScopedEnv path("PATH", bin + ":" + std::getenv("PATH"));
  Run big = runCliIn(dir, "diff HEAD:x.calc x.calc");
  CHECK(big.status == 2);
  CHECK(
      big.err.find("HEAD:x.calc:1:1: error: cannot read from git: the file is larger than 64 MiB, the limit "
                   "for a worksheet (docs/limits.md)\n") == 0);
  for (const char* bad : {"0", "-1", "nan", "soon"}) {
    INFO(bad);
    ScopedEnv timeout("CALCTRAIL_GIT_TIMEOUT", bad);
    Run r = runCliIn(dir, "diff HEAD:x.calc x.calc");
    CHECK(r.status == 2);
    CHECK(r.err.find("HEAD:x.calc:1:1: error: CALCTRAIL_GIT_TIMEOUT is `" + std::string(bad) +
                     "`; it must be a number of seconds above 0, at most 86400\n") == 0);
  }
}
