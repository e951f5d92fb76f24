// Review of a template change in a real git repository: two sheets use one
// template; a commit changes the template; `calctrail diff HEAD~1:a.calc
// a.calc` reads the template as it was at HEAD~1 and shows the results the
// change moved in that sheet.
#include <catch2/catch.hpp>

#include <sys/wait.h>
#include <cstdlib>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

Run shell(const std::string& dir, const std::string& command) {
  const std::string io = tempDir();
  const std::string cmd =
      "cd '" + dir + "' && (" + command + ") >'" + io + "/out' 2>'" + io + "/err' </dev/null";
  const int raw = std::system(cmd.c_str());
  Run r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = readFile(io + "/out");
  r.err = readFile(io + "/err");
  if (std::system(("rm -rf '" + io + "'").c_str()) != 0) {
    // Left behind in the temporary folder: harmless.
  }
  return r;
}

void git(const std::string& dir, const std::string& args) {
  Run r = shell(dir, "git " + args);
  INFO("git " << args << "\n" << r.out << r.err);
  REQUIRE(r.status == 0);
}

struct Repository {
  std::string dir = tempDir();
  ~Repository() {
    if (std::system(("rm -rf '" + dir + "'").c_str()) != 0) {
      // Left behind in the temporary folder: harmless.
    }
  }
};

}  // namespace

TEST_CASE("diff REV:PATH reads the templates at REV: a template change moves every sheet using it",
          "[template][review][git]") {
  setenv("GIT_CONFIG_NOSYSTEM", "1", 1);
  setenv("GIT_CONFIG_GLOBAL", "/dev/null", 1);
  Run version = shell(".", "git --version");
  if (version.status != 0) FAIL("git is needed for this test and was not found: " << version.err);
  Repository repo;
  git(repo.dir, "init -q");
  git(repo.dir, "config user.name 'Test Checker'");
  git(repo.dir, "config user.email checker@example.com");
  git(repo.dir, "config commit.gpgsign false");
  writeFile(repo.dir + "/screw.calc",
            "param F [N]\nparam f = 0.10\nd = 20 mm\nT [N*m] = F * f * d / 2\ncheck t: T < 12 [N*m]\n");
  REQUIRE(std::system(("mkdir '" + repo.dir + "/sub'").c_str()) == 0);
  writeFile(repo.dir + "/a.calc", "use screw.calc as s with F = 10 kN\nT2 [N*m] = 2 * s.T\n");
  writeFile(repo.dir + "/sub/b.calc", "use ../screw.calc as s with F = 2 kN\n");
  git(repo.dir, "add .");
  git(repo.dir, "commit -q -m 'first issue'");
  const std::string changed =
      "param F [N]\nparam f = 0.15\nd = 20 mm\nT [N*m] = F * f * d / 2\ncheck t: T < 12 [N*m]\n";
  writeFile(repo.dir + "/screw.calc", changed);
  git(repo.dir, "commit -q -a -m 'dry thread'");

  Run a = runCliIn(repo.dir, "diff HEAD~1:a.calc a.calc");
  INFO(a.out << a.err);
  CHECK(a.status == 1);
  CHECK(a.err.empty());
  CHECK(a.out.find("!! CHECK FLIPPED  s.t: PASS -> FAIL") != std::string::npos);
  CHECK(a.out.find("  s.f  0.10  ->  0.15  +50.0 %") != std::string::npos);
  CHECK(a.out.find("  s.T  10.00 N\u00b7m  ->  15.00 N\u00b7m  +50.0 %") != std::string::npos);
  CHECK(a.out.find("  T2   20.00 N\u00b7m  ->  30.00 N\u00b7m  +50.0 %") != std::string::npos);
  // The other sheet, in a subfolder, through `../`; both sides from git.
  Run b = runCliIn(repo.dir + "/sub", "diff HEAD~1:b.calc HEAD:b.calc");
  INFO(b.out << b.err);
  CHECK(b.status == 1);
  CHECK(b.out.find("  s.T  2.000 N\u00b7m  ->  3.000 N\u00b7m  +50.0 %") != std::string::npos);
  // A sheet that did not change, against its own revision, with the template
  // unchanged: nothing moved, but the check s.t fails on both sides (15 N*m > 12 N*m).
  Run same = runCliIn(repo.dir, "diff HEAD:a.calc a.calc");
  CHECK(same.status == 1);
  CHECK(same.out.find("!! STILL FAILING  s.t: FAIL -> FAIL") != std::string::npos);
  // And the hashes in the trail name the template as it is on disk.
  Run json = runCliIn(repo.dir, "report a.calc --format json");
  CHECK(json.out.find("\"path\": \"screw.calc\"") != std::string::npos);
}
