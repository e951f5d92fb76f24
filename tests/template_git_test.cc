// Review of a template change in a real git repository: two sheets use one
// template; a commit changes the template; `calctrail diff HEAD~1:a.calc
// a.calc` reads the template as it was at HEAD~1 and shows the results the
// change moved in that sheet, and `git diff` through `calctrail textconv`
// shows them in the diff of the template itself.
//
// The numbers are worked by hand from the sheets: T = F * f * d / 2 with
// d = 20 mm: a.calc (F = 10 kN) 10 N*m at f = 0.10, 15 at 0.15, 20 at 0.20,
// 5 at 0.05; sub/b.calc (F = 2 kN) a fifth of those.
#include <catch2/catch.hpp>

#include <sys/wait.h>
#include <cstdlib>

#include "engine/review/sheet_origin.h"
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

const char* kScrewTemplate =
    "param F [N]\nparam f = 0.10\nd = 20 mm\nT [N*m] = F * f * d / 2\ncheck t: T < 12 [N*m]\n";

std::string withFriction(const std::string& f) {
  std::string t = kScrewTemplate;
  return t.replace(t.find("0.10"), 4, f);
}

// Two commits: the template with f = 0.10 used by a.calc and sub/b.calc, then f = 0.15.
void screwRepository(const Repository& repo) {
  setenv("GIT_CONFIG_NOSYSTEM", "1", 1);
  setenv("GIT_CONFIG_GLOBAL", "/dev/null", 1);
  Run version = shell(".", "git --version");
  if (version.status != 0) FAIL("git is needed for this test and was not found: " << version.err);
  git(repo.dir, "init -q");
  git(repo.dir, "config user.name 'Test Checker'");
  git(repo.dir, "config user.email checker@example.com");
  git(repo.dir, "config commit.gpgsign false");
  writeFile(repo.dir + "/screw.calc", kScrewTemplate);
  REQUIRE(std::system(("mkdir '" + repo.dir + "/sub'").c_str()) == 0);
  writeFile(repo.dir + "/a.calc", "use screw.calc as s with F = 10 kN\nT2 [N*m] = 2 * s.T\n");
  writeFile(repo.dir + "/sub/b.calc", "use ../screw.calc as s with F = 2 kN\n");
  writeFile(repo.dir + "/.gitattributes", "*.calc diff=calctrail\n");
  git(repo.dir, "add .");
  git(repo.dir, "commit -q -m 'first issue'");
  writeFile(repo.dir + "/screw.calc", withFriction("0.15"));
  git(repo.dir, "commit -q -a -m 'dry thread'");
}

std::string driver() { return "git -c diff.calctrail.textconv='" + std::string(CALCTRAIL_BINARY) + " textconv' "; }

// The first 7 characters of the commit id, as textconv names a commit.
std::string shortId(const std::string& dir, const std::string& rev) {
  Run r = shell(dir, "git rev-parse " + rev);
  REQUIRE(r.status == 0);
  return r.out.substr(0, 7);
}

bool has(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("diff REV:PATH reads the templates at REV: a template change moves every sheet using it",
          "[template][review][git]") {
  Repository repo;
  screwRepository(repo);

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

TEST_CASE("git diff of a template alone shows the results it moved in every sheet using it",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  Run r = shell(repo.dir, driver() + "diff HEAD~1 HEAD");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  // Only the template changed, so git converts only the template...
  CHECK(has(r.out, "diff --git a/screw.calc b/screw.calc"));
  CHECK_FALSE(has(r.out, "diff --git a/a.calc"));
  // ...and its text carries both sheets' results, each side through its own version.
  CHECK(has(r.out, "\n-#= a.calc: s.T = 10 N\u00b7m\n-#= a.calc: T2 = 20 N\u00b7m\n"
                   "-#= a.calc: check s.t: PASS  10 N\u00b7m < 12 N\u00b7m\n"));
  CHECK(has(r.out, "\n+#= a.calc: s.T = 15 N\u00b7m\n+#= a.calc: T2 = 30 N\u00b7m\n"
                   "+#= a.calc: check s.t: FAIL  15 N\u00b7m < 12 N\u00b7m\n"));
  CHECK(has(r.out, "\n-#= sub/b.calc: s.T = 2 N\u00b7m\n"));
  CHECK(has(r.out, "\n+#= sub/b.calc: s.T = 3 N\u00b7m\n"));
  CHECK(has(r.out, " #= calctrail: used by 2 sheets; their results with this version of screw.calc:\n"));
  // The old side says where it read the sheets: at the commit before the change.
  CHECK(has(r.out, "\n-#= templates and using sheets read at commit " + shortId(repo.dir, "HEAD~1") +
                       " (screw.calc)\n"));
}

TEST_CASE("git diff of a sheet whose template changed too computes the old side with the old template",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  writeFile(repo.dir + "/a.calc", "use screw.calc as s with F = 10 kN\nT2 [N*m] = 3 * s.T\n");
  writeFile(repo.dir + "/screw.calc", withFriction("0.20"));
  git(repo.dir, "commit -q -a -m 'three of them, and a drier thread'");
  Run r = shell(repo.dir, driver() + "diff HEAD~1 HEAD -- a.calc");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  // Old: 2 * 15 N*m (f = 0.15 at HEAD~1), never 2 * 20 (today's template); new: 3 * 20. The
  // instance's lines after the use line moved too, so git puts them between.
  CHECK(has(r.out, "\n-#= s.f = 0.15\n+#= s.f = 0.2\n"));
  CHECK(has(r.out, "\n-#= s.T = 15 N\u00b7m\n-#= check s.t: FAIL  15 N\u00b7m < 12 N\u00b7m\n"
                   "-T2 [N*m] = 2 * s.T\n-#= T2 = 30 N\u00b7m\n"
                   "+#= s.T = 20 N\u00b7m\n+#= check s.t: FAIL  20 N\u00b7m < 12 N\u00b7m\n"
                   "+T2 [N*m] = 3 * s.T\n+#= T2 = 60 N\u00b7m\n"));
  CHECK_FALSE(has(r.out, "T2 = 40"));
  CHECK(has(r.out, "\n-#= templates and using sheets read at commit " + shortId(repo.dir, "HEAD~1") +
                       " (a.calc)\n"));
  CHECK_FALSE(has(r.out, "error"));
}

TEST_CASE("git diff of a sheet whose binding changed shows the instance's results move after the use line",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  // Back to f = 0.10, then the load on the screw from 10 kN to 12 kN in the sheet alone:
  // T = F * 0.10 * 20 mm / 2 goes from 10 to 12 N*m, over the 12 N*m the check allows.
  writeFile(repo.dir + "/screw.calc", kScrewTemplate);
  git(repo.dir, "commit -q -a -m 'lubricated thread'");
  writeFile(repo.dir + "/a.calc", "use screw.calc as s with F = 12 kN\nT2 [N*m] = 2 * s.T\n");
  git(repo.dir, "commit -q -a -m 'heavier load'");
  Run r = shell(repo.dir, driver() + "diff HEAD~1 HEAD");
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK(has(r.out, "diff --git a/a.calc b/a.calc"));
  // Each side says where it read the template (a line above the use line that differs too).
  CHECK(has(r.out, "\n-use screw.calc as s with F = 10 kN\n-#= s.F = 10000 N\n"));
  CHECK(has(r.out, "\n+use screw.calc as s with F = 12 kN\n+#= s.F = 12000 N\n"));
  CHECK(has(r.out, "\n-#= s.T = 10 N\u00b7m\n-#= check s.t: PASS  10 N\u00b7m < 12 N\u00b7m\n"
                   "+#= s.T = 12 N\u00b7m\n+#= check s.t: FAIL  12 N\u00b7m < 12 N\u00b7m\n"));
  CHECK(has(r.out, "\n-#= T2 = 20 N\u00b7m\n+#= T2 = 24 N\u00b7m\n"));
  CHECK(has(r.out, "\n-#= calctrail: 1 check, all PASS\n"));
  CHECK(has(r.out, "\n+#= calctrail: 1 check, 0 PASS, 1 FAIL (s.t)\n"));
  // The template's given values did not move: they are context, not changed lines.
  CHECK(has(r.out, "\n #= s.f = 0.1\n #= s.d = 20 mm\n"));
  CHECK_FALSE(has(r.out, "error"));
}

TEST_CASE("git diff of a template in the work tree and in the index", "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  // The work tree side is the file itself: its sheets are read from the work tree.
  writeFile(repo.dir + "/screw.calc", withFriction("0.05"));
  Run worktree = shell(repo.dir, driver() + "diff");
  INFO(worktree.out << worktree.err);
  CHECK(has(worktree.out, "\n-#= a.calc: s.T = 15 N\u00b7m\n"));
  CHECK(has(worktree.out, "\n+#= a.calc: s.T = 5 N\u00b7m\n"));
  CHECK(has(worktree.out, "\n-#= templates and using sheets read at commit " + shortId(repo.dir, "HEAD") +
                              " (screw.calc)\n"));
  // A staged version is in no commit: read at the index, with the sheets as staged.
  git(repo.dir, "add screw.calc");
  writeFile(repo.dir + "/sub/b.calc", "use ../screw.calc as s with F = 4 kN\n");
  git(repo.dir, "add sub/b.calc");
  writeFile(repo.dir + "/screw.calc", withFriction("0.30"));  // the work tree differs from the index
  Run staged = shell(repo.dir, driver() + "diff --cached -- screw.calc");
  INFO(staged.out << staged.err);
  CHECK(has(staged.out, "\n+#= templates and using sheets read at the index (screw.calc)\n"));
  CHECK(has(staged.out, "\n+#= sub/b.calc: s.T = 2 N\u00b7m\n"));  // 4 kN at f = 0.05
  CHECK(has(staged.out, "\n-#= sub/b.calc: s.T = 3 N\u00b7m\n"));  // 2 kN at f = 0.15, as committed
}

TEST_CASE("textconv of a file git wrote finds its revision by content, or says it did not",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  const std::string outside = tempDir();
  // git before 2.25 names the file XXXXXX_<basename>; later ones git-blob-XXXXXX/<basename>.
  REQUIRE(std::system(("mkdir '" + outside + "/git-blob-Ab12Cd'").c_str()) == 0);
  const std::string old_a = "use screw.calc as s with F = 10 kN\nT2 [N*m] = 2 * s.T\n";
  writeFile(outside + "/Xy34Zw_a.calc", old_a);
  writeFile(outside + "/git-blob-Ab12Cd/a.calc", old_a);
  for (const char* name : {"/Xy34Zw_a.calc", "/git-blob-Ab12Cd/a.calc"}) {
    Run r = runCliIn(repo.dir, "textconv '" + outside + name + "'");
    INFO(name << "\n" << r.out << r.err);
    CHECK(r.status == 0);
    // a.calc never changed: this is HEAD's version, and the template is read at HEAD.
    CHECK(has(r.out, "#= calctrail: 1 check, 0 PASS, 1 FAIL (s.t)\n#= templates and using sheets read at commit " +
                         shortId(repo.dir, "HEAD") + " (a.calc)\n"));
    CHECK(has(r.out, "\n#= T2 = 30 N\u00b7m\n"));
  }
  // The blob as checked out with CRLF line ends (`eol=crlf`): found all the same.
  REQUIRE(std::system(("mkdir '" + outside + "/git-blob-Qq11Ww'").c_str()) == 0);
  writeFile(outside + "/git-blob-Qq11Ww/a.calc",
            "use screw.calc as s with F = 10 kN\r\nT2 [N*m] = 2 * s.T\r\n");
  Run crlf = runCliIn(repo.dir, "textconv '" + outside + "/git-blob-Qq11Ww/a.calc'");
  CHECK(has(crlf.out, "\n#= templates and using sheets read at commit " + shortId(repo.dir, "HEAD") + " (a.calc)\n"));
  // A temporary folder inside the work tree (TMPDIR there): git's untracked file stands for a.calc too.
  REQUIRE(std::system(("mkdir -p '" + repo.dir + "/tmp/git-blob-Rr22Ss'").c_str()) == 0);
  writeFile(repo.dir + "/tmp/git-blob-Rr22Ss/a.calc", old_a);
  Run inside = runCliIn(repo.dir, "textconv tmp/git-blob-Rr22Ss/a.calc");
  CHECK(has(inside.out, "\n#= templates and using sheets read at commit " + shortId(repo.dir, "HEAD") + " (a.calc)\n"));
  CHECK(has(inside.out, "\n#= T2 = 30 N\u00b7m\n"));
  // A version in no history: today's reading beside the file, and the line says so.
  writeFile(outside + "/git-blob-Ab12Cd/a.calc", "use screw.calc as s with F = 1 kN\n");
  Run lost = runCliIn(repo.dir, "textconv '" + outside + "/git-blob-Ab12Cd/a.calc'");
  CHECK(lost.status == 0);
  CHECK(has(lost.out, "\n#= templates read beside the file: this version of a.calc is in no tracked file's "
                      "history\n"));
  CHECK(has(lost.out, "#= error: cannot read the template `screw.calc`"));
  // git's time limit cannot be read: the line names the variable, and no git runs.
  Run bad = runCliThrough(repo.dir, "CALCTRAIL_GIT_TIMEOUT=soon", "textconv '" + outside + "/Xy34Zw_a.calc'");
  CHECK(bad.status == 0);
  CHECK(has(bad.out, "\n#= templates read beside the file: CALCTRAIL_GIT_TIMEOUT is `soon`; it must be a number"));
  // A file of another name, outside the work tree, reads as before: no line.
  writeFile(outside + "/plain.calc", old_a);
  Run plain = runCliIn(repo.dir, "textconv '" + outside + "/plain.calc'");
  CHECK_FALSE(has(plain.out, "read at"));
  CHECK_FALSE(has(plain.out, "read beside"));
  // And a sheet of the work tree gets no such line: its instance's results (f = 0.15 at HEAD) and its own.
  Run here = runCliIn(repo.dir, "textconv a.calc");
  CHECK(here.out == "#= calctrail: 1 check, 0 PASS, 1 FAIL (s.t)\nuse screw.calc as s with F = 10 kN\n"
                    "#= s.F = 10000 N\n#= s.f = 0.15\n#= s.d = 20 mm\n#= s.T = 15 N\u00b7m\n"
                    "#= check s.t: FAIL  15 N\u00b7m < 12 N\u00b7m\n"
                    "T2 [N*m] = 2 * s.T\n#= T2 = 30 N\u00b7m\n");
  REQUIRE(std::system(("rm -rf '" + outside + "'").c_str()) == 0);
}

TEST_CASE("textconv of a template lists a sheet that uses it through another template",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  writeFile(repo.dir + "/mid.calc", "param F_mid [N]\nuse screw.calc as s with F = F_mid\n");
  writeFile(repo.dir + "/c.calc", "use mid.calc as m with F_mid = 1 kN\nT_c [N*m] = m.s.T\n");
  git(repo.dir, "add .");
  git(repo.dir, "commit -q -m 'a sheet through a template'");
  Run r = runCliIn(repo.dir, "textconv screw.calc");
  INFO(r.out << r.err);
  CHECK(r.status == 0);
  // 1 kN at f = 0.15: 1.5 N*m, through mid.calc's instance.
  CHECK(has(r.out, "\n#= c.calc: m.s.T = 1.5 N\u00b7m\n#= c.calc: T_c = 1.5 N\u00b7m\n"));
  CHECK(has(r.out, "\n#= mid.calc: a template with required parameters, through the sheets using it\n"));
  CHECK(has(r.out, "#= calctrail: used by 4 sheets; their results with this version of screw.calc:\n"
                   "#= a.calc: s.T = 15 N\u00b7m\n"));
  CHECK_FALSE(has(r.out, "read at"));  // a work tree file: no line on where
}

TEST_CASE("the git blob id of a text is git's own", "[review][git][textconv]") {
  // Well-known ids (from memory), checked against `git hash-object` below too.
  CHECK(calctrail::gitBlobId("") == "e69de29bb2d1d6434b8b29ae775ad8c2e48c5391");
  CHECK(calctrail::gitBlobId("hello\n") == "ce013625030ba8dba906f756967f9e9ca394464a");
  const std::string dir = tempDir();
  const std::string text = "param F [N]\r\nT = F * 2 mm\n\xc2\xb5\n";
  writeFile(dir + "/x.calc", text);
  Run git_id = shell(dir, "git hash-object --no-filters x.calc");
  REQUIRE(git_id.status == 0);
  CHECK(calctrail::gitBlobId(text) + "\n" == git_id.out);
  REQUIRE(std::system(("rm -rf '" + dir + "'").c_str()) == 0);
}

TEST_CASE("textconv of a template never prints a control character from a sheet's name",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  writeFile(repo.dir + "/red\x1b[31m.calc", "use screw.calc as s with F = 1 kN\n");
  git(repo.dir, "add .");
  git(repo.dir, "commit -q -m 'a sheet with an escape in its name'");
  Run r = runCliIn(repo.dir, "textconv screw.calc");
  INFO(r.out << r.err);
  CHECK(has(r.out, "\n#= red?[31m.calc: s.T = 1.5 N\u00b7m\n"));
  CHECK_FALSE(has(r.out, "\x1b"));
}

TEST_CASE("textconv of a template lists 20 using sheets, sorted, and counts the rest",
          "[template][review][git][textconv]") {
  Repository repo;
  screwRepository(repo);
  for (int k = 10; k < 32; ++k)
    writeFile(repo.dir + "/u" + std::to_string(k) + ".calc", "use screw.calc as s with F = 1 kN\n");
  git(repo.dir, "add .");
  git(repo.dir, "commit -q -m 'many users'");
  Run r = runCliIn(repo.dir, "textconv screw.calc");
  INFO(r.out << r.err);
  // 24 sheets in byte order: a.calc, sub/b.calc, u10 to u27 listed; u28 to u31 counted.
  CHECK(has(r.out, "#= calctrail: used by 24 sheets;"));
  CHECK(has(r.out, "\n#= a.calc: s.T = 15 N\u00b7m\n"));
  CHECK(has(r.out, "\n#= sub/b.calc: s.T = 3 N\u00b7m\n"));
  CHECK(has(r.out, "\n#= u27.calc: s.T = 1.5 N\u00b7m\n"));
  CHECK_FALSE(has(r.out, "u28.calc"));
  CHECK(has(r.out, "#= u27.calc: check s.t: PASS  1.5 N\u00b7m < 12 N\u00b7m\n#= and 4 more sheets\n"));
  CHECK(r.out.find("#= a.calc:") < r.out.find("#= sub/b.calc:"));
  CHECK(r.out.find("#= sub/b.calc:") < r.out.find("#= u10.calc:"));
}
