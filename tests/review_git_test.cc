// The review workflow in a real git repository: `calctrail diff` with REV:PATH
// sides, the textconv diff driver behind a plain `git diff`, the difftool
// recipe of docs/review.md, and the repository's own .gitattributes.
#include <catch2/catch.hpp>

#include <filesystem>

#include <cstdlib>
#include <sstream>
#include <sys/stat.h>
#include <sys/wait.h>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

const char* kRevision1 =
    "title: Test lift\n"
    "revision: A\n"
    "\n"
    "section Load\n"
    "note One screw carries the whole table.\n"
    "F = 10 kN                 # load\n"
    "stroke = 300 mm           # travel\n"
    "n_screw = 60 rpm          # screw speed\n"
    "k_dyn = 1.1               # allowance for starts\n"
    "v_max = 2 [m/min]         # fastest travel asked\n"
    "\n"
    "section Screw\n"
    "d = 24 mm                 # major diameter\n"
    "d_m = 20 mm               # mean diameter\n"
    "d_r = 16 mm               # minor diameter\n"
    "l = 4 mm                  # lead\n"
    "f = 0.10                  # thread friction\n"
    "T [N*m] = F * d_m / 2 * (l + pi * f * d_m) / (pi * d_m - f * l)  # raising torque\n"
    "eta [%] = F * l / (2 * pi * T)   # efficiency\n"
    "T_max = 20 [N*m]          # handwheel limit\n"
    "check torque: T <= T_max  # operator effort\n";

std::string quoted(const std::string& s) { return "'" + s + "'"; }

Run shellIn(const std::string& dir, const std::string& command) {
  const std::string io = tempDir();
  const std::string cmd =
      "cd " + quoted(dir) + " && (" + command + ") >" + quoted(io + "/out") + " 2>" + quoted(io + "/err") + " </dev/null";
  const int raw = std::system(cmd.c_str());
  Run r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = readFile(io + "/out");
  r.err = readFile(io + "/err");
  return r;
}

void git(const std::string& dir, const std::string& args) {
  Run r = shellIn(dir, "git " + args);
  INFO("git " << args << "\n" << r.out << r.err);
  REQUIRE(r.status == 0);
}

// Removes a temporary repository when a test is done with it.
struct Cleanup {
  std::string dir;
  ~Cleanup() {
    if (!dir.empty() && std::system(("rm -rf '" + dir + "'").c_str()) != 0) {
      // Left behind in the temporary folder: harmless.
    }
  }
};

// A fresh repository with two commits of ws/lift.calc: the second raises the
// thread friction, which moves the torque and the efficiency and fails the check.
std::string liftRepository() {
  // No system or user configuration may change what git does here.
  setenv("GIT_CONFIG_NOSYSTEM", "1", 1);
  setenv("GIT_CONFIG_GLOBAL", "/dev/null", 1);
  Run version = shellIn(".", "git --version");
  if (version.status != 0) FAIL("git is needed for the review workflow tests and was not found: " << version.err);
  const std::string repo = tempDir();
  git(repo, "init -q");
  git(repo, "config user.name 'Test Checker'");
  git(repo, "config user.email checker@example.com");
  git(repo, "config commit.gpgsign false");
  REQUIRE(mkdir((repo + "/ws").c_str(), 0755) == 0);
  writeFile(repo + "/ws/lift.calc", kRevision1);
  git(repo, "add ws/lift.calc");
  git(repo, "commit -q -m 'lift: first issue'");
  std::string rev2 = kRevision1;
  rev2.replace(rev2.find("f = 0.10 "), 9, "f = 0.20 ");
  rev2.replace(rev2.find("revision: A"), 11, "revision: B");
  writeFile(repo + "/ws/lift.calc", rev2);
  git(repo, "commit -q -a -m 'lift: dry thread'");
  return repo;
}

}  // namespace

TEST_CASE("diff HEAD~1:FILE FILE in a git repository", "[review][git]") {
  const std::string repo = liftRepository();
  Cleanup cleanup{repo};
  Run r = runCliIn(repo, "diff HEAD~1:ws/lift.calc ws/lift.calc");
  INFO(r.out << r.err);
  CHECK(r.status == 1);
  CHECK(r.err.empty());
  CHECK(r.out.rfind("calctrail diff: HEAD~1:ws/lift.calc -> ws/lift.calc\n", 0) == 0);
  CHECK(r.out.find("!! CHECK FLIPPED  torque: PASS -> FAIL") != std::string::npos);
  CHECK(r.out.find("  f  0.10  ->  0.20  +100 %") != std::string::npos);
  CHECK(r.out.find("  T    16.47 N\u00b7m  ->  26.71 N\u00b7m  +62.1 %") != std::string::npos);
  CHECK(r.out.find("  eta  ") != std::string::npos);
  CHECK(r.out.find("  revision:  A  ->  B") != std::string::npos);

  // Both revisions from git; and the same file named from a subfolder, as a
  // path relative to it, with ./, or relative to the repository root.
  for (const auto& [dir, args] : std::vector<std::pair<std::string, std::string>>{
           {repo, "diff HEAD~1:ws/lift.calc HEAD:ws/lift.calc"},
           {repo + "/ws", "diff HEAD~1:lift.calc lift.calc"},
           {repo + "/ws", "diff HEAD~1:./lift.calc lift.calc"},
           {repo + "/ws", "diff HEAD~1:ws/lift.calc lift.calc"},
           {repo, "diff HEAD~1:./ws/lift.calc ws/lift.calc"}}) {
    INFO(dir << ": " << args);
    Run s = runCliIn(dir, args);
    CHECK(s.status == 1);
    CHECK(s.out.find("!! CHECK FLIPPED  torque: PASS -> FAIL") != std::string::npos);
  }
  // The same revision on both sides: nothing moved, but HEAD's torque check
  // fails on both, which a checker must not read as "no change, all good".
  Run same = runCliIn(repo, "diff HEAD:ws/lift.calc ws/lift.calc");
  CHECK(same.status == 1);
  CHECK(same.out.find("!! STILL FAILING  torque: FAIL -> FAIL") != std::string::npos);
  CHECK(runCliIn(repo, "diff HEAD~1:ws/lift.calc HEAD~1:ws/lift.calc --format json").status == 0);
}

TEST_CASE("diff: a side git cannot give, or with worksheet errors, exits 2 with its name", "[review][git]") {
  const std::string repo = liftRepository();
  Cleanup cleanup{repo};
  Run bad_rev = runCliIn(repo, "diff HEAD~7:ws/lift.calc ws/lift.calc");
  CHECK(bad_rev.status == 2);
  CHECK(bad_rev.out.empty());
  CHECK(bad_rev.err.rfind("HEAD~7:ws/lift.calc:1:1: error: cannot read from git: ", 0) == 0);
  Run bad_path = runCliIn(repo, "diff HEAD~1:ws/nothing.calc ws/lift.calc");
  CHECK(bad_path.status == 2);
  CHECK(bad_path.err.find("HEAD~1:ws/nothing.calc:1:1: error: cannot read from git: ") != std::string::npos);
  CHECK(runCliIn(repo, "diff HEAD~1:ws ws/lift.calc").status == 2);  // a folder, not a file
  CHECK(runCliIn(repo, "diff HEAD~1: ws/lift.calc").status == 2);

  // A committed revision with an error: reported at its place, under the side's name.
  std::string broken = kRevision1;
  broken.replace(broken.find("l = 4 mm "), 9, "l = 4 qq ");
  writeFile(repo + "/ws/lift.calc", broken);
  git(repo, "commit -q -a -m 'lift: a slip'");
  Run r = runCliIn(repo, "diff HEAD:ws/lift.calc HEAD~1:ws/lift.calc");
  INFO(r.err);
  CHECK(r.status == 2);
  CHECK(r.err.rfind("HEAD:ws/lift.calc:16:7: error: unknown unit `qq`", 0) == 0);
}

TEST_CASE("git diff with the calctrail diff driver shows moved results and the flipped check", "[review][git]") {
  const std::string repo = liftRepository();
  Cleanup cleanup{repo};
  writeFile(repo + "/.gitattributes", "*.calc diff=calctrail\n");
  const std::string driver = "-c diff.calctrail.textconv=" + quoted(std::string(CALCTRAIL_BINARY) + " textconv");
  Run r = shellIn(repo, "git " + driver + " diff HEAD~1 HEAD -- ws/lift.calc");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK(r.out.find("\n-f = 0.10                  # thread friction\n+f = 0.20                  # thread friction\n") !=
        std::string::npos);
  CHECK(r.out.find("\n-#= T = 16.4711 N\u00b7m\n+#= T = 26.7062 N\u00b7m\n") != std::string::npos);
  CHECK(r.out.find("\n-#= eta = ") != std::string::npos);
  CHECK(r.out.find("\n-#= check torque: PASS  16.4711 N\u00b7m <= 20 N\u00b7m\n"
                   "+#= check torque: FAIL  26.7062 N\u00b7m <= 20 N\u00b7m\n") != std::string::npos);
  CHECK(r.out.find("\n-#= calctrail: 1 check, all PASS\n+#= calctrail: 1 check, 0 PASS, 1 FAIL (torque)\n") !=
        std::string::npos);
  // Without the driver, git shows the input line only.
  Run plain = shellIn(repo, "git diff HEAD~1 HEAD -- ws/lift.calc");
  CHECK(plain.out.find("#= T = ") == std::string::npos);
  // With a section heading as the hunk header, as docs/review.md sets it up.
  Run headed = shellIn(repo, "git " + driver + " -c diff.calctrail.xfuncname='^section .*$' diff HEAD~1 HEAD");
  CHECK(headed.out.find(" @@ section Screw\n") != std::string::npos);
}

TEST_CASE("git difftool runs calctrail diff on the two revisions", "[review][git]") {
  const std::string repo = liftRepository();
  Cleanup cleanup{repo};
  Run r = shellIn(repo, "git difftool -y -x " + quoted(std::string(CALCTRAIL_BINARY) + " diff") +
                            " HEAD~1 HEAD -- ws/lift.calc");
  INFO(r.out << r.err);
  CHECK(r.status == 0);  // difftool ignores the tool's status unless --trust-exit-code
  CHECK(r.out.find("!! CHECK FLIPPED  torque: PASS -> FAIL") != std::string::npos);
  Run trusted = shellIn(repo, "git difftool -y --trust-exit-code -x " +
                                  quoted(std::string(CALCTRAIL_BINARY) + " diff") + " HEAD~1 HEAD -- ws/lift.calc");
  // With --trust-exit-code git takes status 1 (a result moved) for a failed tool.
  CHECK(trusted.status != 0);
  CHECK(trusted.out.find("!! CHECK FLIPPED") != std::string::npos);
}

TEST_CASE("textconv of a worksheet with errors still gives git a text", "[review][git]") {
  const std::string dir = tempDir();
  writeFile(dir + "/bad.calc", "a = 1 m\nb = a + 1 s\n");
  Run r = runCliIn(dir, "textconv bad.calc");
  CHECK(r.status == 0);
  CHECK(r.out == "#= calctrail: 1 error, nothing calculated\na = 1 m\nb = a + 1 s\n#= error: cannot add time (s) to length (mm)\n");
  CHECK(runCliIn(dir, "textconv missing.calc").status == 2);
}

TEST_CASE("the repository declares the diff driver for worksheets", "[review][git]") {
  const std::string attributes = readFile(repoPath(".gitattributes"));
  CHECK(attributes.find("*.calc diff=calctrail\n") != std::string::npos);
}

TEST_CASE("textconv marks its lines with #=, and its text is still the same worksheet",
          "[review][git][hints]") {
  const std::string dir = tempDir();
  const std::string sheet = readFile(repoPath("worksheets/canal-gate-hoist.calc"));
  writeFile(dir + "/gate.calc", sheet);
  std::filesystem::create_directories(dir + "/templates");  // the templates the gate uses, beside it
  for (const char* used : {"templates/trapezoidal-screw-stage.calc", "templates/motor-choice.calc"})
    writeFile(dir + "/" + used, readFile(repoPath(std::string("worksheets/") + used)));
  Run r = runCliIn(dir, "textconv gate.calc");
  REQUIRE(r.status == 0);
  CHECK(r.out.rfind("#= calctrail: 7 checks, all PASS\n", 0) == 0);
  CHECK(r.out.find("\n#= T_bearing = 2.11784 N\u00b7m\n") != std::string::npos);
  CHECK(r.out.find("\n#= check opening_time: PASS  3.82653 min <= 5 min\n") != std::string::npos);
  CHECK(r.out.find("#>") == std::string::npos);
  // Every line textconv adds starts with the mark; the others are the worksheet's, in order.
  std::istringstream added(r.out);
  std::string line, rest;
  while (std::getline(added, line))
    if (line.rfind("#= ", 0) != 0) rest += line + "\n";
  CHECK(rest == sheet);
  // To calctrail the marked lines are comments: the text checks as the worksheet does.
  writeFile(dir + "/annotated.calc", r.out);
  Run original = runCliIn(dir, "check gate.calc");
  Run annotated = runCliIn(dir, "check annotated.calc");
  CHECK(annotated.status == original.status);
  CHECK(annotated.err == original.err);
  CHECK(annotated.out == original.out);
}
