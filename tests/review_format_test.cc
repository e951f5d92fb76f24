// `calctrail fmt`: the canonical layout (docs/review.md), its round trip on
// every worksheet of the repository, and the promise that a file is either
// rewritten completely or left exactly as it was.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cstdlib>
#include <cstring>
#include <dirent.h>
#include <set>
#include <sstream>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>
#include <utime.h>

#include "engine/calculation.h"
#include "engine/review/sheet_format.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::string fmt(const std::string& text) {
  Diagnostics diags;
  const std::string out = formatWorksheet("sheet.calc", text, &diags);
  std::string problems;
  for (const Diagnostic& d : diags.list()) problems += d.headline() + "\n";
  INFO(problems);
  CHECK(!diags.hasErrors());
  return out;
}

// Formats `in`, expects `out`, and expects `out` to be canonical already.
void expectLayout(const std::string& in, const std::string& out) {
  INFO("input:\n" << in);
  CHECK(fmt(in) == out);
  CHECK(fmt(out) == out);
}

// The demos, and with `templates` the template library too (whose required
// parameters leave a template alone uncalculated).
std::vector<std::string> repositoryWorksheets(bool templates = false) {
  std::vector<std::string> files;
  for (const char* folder : {"worksheets", "worksheets/templates"}) {
    if (!templates && std::string(folder) != "worksheets") continue;
    DIR* dir = opendir(repoPath(folder).c_str());
    REQUIRE(dir != nullptr);
    while (dirent* e = readdir(dir)) {
      const std::string name = e->d_name;
      if (name.size() > 5 && name.compare(name.size() - 5, 5, ".calc") == 0)
        files.push_back(std::string(folder) + "/" + name);
    }
    closedir(dir);
  }
  std::sort(files.begin(), files.end());
  return files;
}

bool sameBits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

// Both calculations give bit-identical numbers and the same check states.
void expectSameNumbers(const Calculation& a, const Calculation& b) {
  REQUIRE(a.quantityCount() == b.quantityCount());
  for (size_t i = 0; i < a.quantityCount(); ++i) {
    INFO("quantity " << a.sheet.quantities[i].name);
    CHECK(a.sheet.quantities[i].name == b.sheet.quantities[i].name);
    CHECK(a.ok(i) == b.ok(i));
    CHECK(sameBits(a.si(i), b.si(i)));
    CHECK(a.display(i).text == b.display(i).text);
    CHECK(a.isInput(i) == b.isInput(i));
  }
  REQUIRE(a.checkCount() == b.checkCount());
  for (size_t k = 0; k < a.checkCount(); ++k) {
    INFO("check " << a.sheet.checks[k].name);
    CHECK(a.checkResult(k).passed == b.checkResult(k).passed);
    CHECK(sameBits(a.checkResult(k).lhs, b.checkResult(k).lhs));
    CHECK(sameBits(a.checkResult(k).rhs, b.checkResult(k).rhs));
  }
}

std::vector<std::string> directoryEntries(const std::string& path) {
  std::vector<std::string> names;
  DIR* dir = opendir(path.c_str());
  REQUIRE(dir != nullptr);
  while (dirent* e = readdir(dir))
    if (std::strcmp(e->d_name, ".") != 0 && std::strcmp(e->d_name, "..") != 0) names.push_back(e->d_name);
  closedir(dir);
  std::sort(names.begin(), names.end());
  return names;
}

// A worksheet long enough to need several write calls (over 4 KiB).
std::string longUncanonicalSheet() {
  std::string text = "title:Long sheet\n";
  for (int i = 0; i < 120; ++i)
    text += "x" + std::to_string(i) + "=" + std::to_string(i) + ".5  [mm]   # length number " + std::to_string(i) + "\n";
  return text;
}

Run shell(const std::string& command) {
  const std::string dir = tempDir();
  const std::string cmd = "(" + command + ") >'" + dir + "/out' 2>'" + dir + "/err' </dev/null";
  const int raw = std::system(cmd.c_str());
  Run r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = readFile(dir + "/out");
  r.err = readFile(dir + "/err");
  return r;
}

}  // namespace

TEST_CASE("fmt round trip on every worksheet of the repository", "[review][fmt]") {
  const std::vector<std::string> files = repositoryWorksheets();
  REQUIRE(!files.empty());
  for (const std::string& file : files) {
    INFO(file);
    const std::string original = readFile(repoPath(file));
    CalcOptions options;
    options.source_path = repoPath(file);  // its templates are read beside it, wherever the test runs
    auto before = Calculation::fromText(file, original, options);
    INFO(diagnostics(*before));
    REQUIRE(!before->hasErrors());
    const std::string once = fmt(original);
    REQUIRE(!once.empty());
    CHECK(fmt(once) == once);  // idempotent
    auto after = Calculation::fromText(file, once, options);
    INFO(diagnostics(*after));
    REQUIRE(!after->hasErrors());
    expectSameNumbers(*before, *after);
    // Every comment, description and note survives.
    CHECK(std::count(once.begin(), once.end(), '#') == std::count(original.begin(), original.end(), '#'));
    // The command line prints the same text and finds it canonical afterwards.
    Run r = runCli("fmt " + file);
    CHECK(r.status == 0);
    CHECK(r.out == once);
    const std::string copy = tempDir() + "/copy.calc";
    writeFile(copy, once);
    CHECK(runCli("fmt --check '" + copy + "'").status == 0);
  }
}

TEST_CASE("fmt: every worksheet respaced and with CRLF comes back to the same canonical text", "[review][fmt]") {
  for (const std::string& file : repositoryWorksheets()) {
    INFO(file);
    const std::string original = readFile(repoPath(file));
    // Double every space before the description of definitions and checks,
    // and end every line with CRLF: layout only, the meaning stays.
    std::string messy;
    size_t begin = 0;
    while (begin < original.size()) {
      size_t end = original.find('\n', begin);
      if (end == std::string::npos) end = original.size();
      std::string line = original.substr(begin, end - begin);
      const size_t hash = line.find('#');
      const std::string code = line.substr(0, hash);
      const bool definition = code.find('=') != std::string::npos && code.rfind("note ", 0) != 0 &&
                              code.rfind("section ", 0) != 0 && code.find(':') == std::string::npos;
      if (definition || code.rfind("check ", 0) == 0) {
        std::string spaced;
        for (char c : code) spaced += c == ' ' ? std::string("  ") : std::string(1, c);
        line = spaced + (hash == std::string::npos ? "" : line.substr(hash));
      }
      messy += line + "\r\n";
      begin = end + 1;
    }
    REQUIRE(messy != original);
    CHECK(fmt(messy) == fmt(original));
  }
}

TEST_CASE("fmt: one space around = and operators, canonical unit spelling", "[review][fmt]") {
  expectLayout("F=2   kN\n", "F = 2 kN\n");
  expectLayout("T [ N·m ]=F*r\n", "T [N*m] = F * r\n");
  expectLayout("a=b·c×d\n", "a = b * c * d\n");
  expectLayout("A = d²*pi/4\n", "A = d^2 * pi / 4\n");
  expectLayout("g = 9.81 [m/s²]\n", "g = 9.81 [m/s^2]\n");
  expectLayout("x = 3 [mm]\n", "x = 3 mm\n");
  expectLayout("t = 2 [lbf·in]\n", "t = 2 [lbf*in]\n");
  expectLayout("s = 5 µm\n", "s = 5 um\n");
  expectLayout("alpha = 15°\n", "alpha = 15 deg\n");
  expectLayout("eta = 95%\n", "eta = 95 %\n");
  expectLayout("n_t = L / p / 1 [rev]\n", "n_t = L / p / 1 rev\n");
  expectLayout("T_air = -40 degC\n", "T_air = -40 degC\n");
  expectLayout("k = 5 [ 1/in ]\n", "k = 5 [1/in]\n");
  // A unit on the base of a power keeps its brackets: `3 mm^2` would read two ways.
  expectLayout("A = 3 [mm]^2\n", "A = 3 [mm]^2\n");
  expectLayout("A = (3 [mm])^2\n", "A = (3 mm)^2\n");
  // Number literals keep their digits as written.
  expectLayout("f = 0.150\ne = 1E-3\nh = .5\n", "f = 0.150\ne = 1E-3\nh = .5\n");
  // Parentheses, unary minus, right-associative powers and calls as written.
  expectLayout("y = -(a+b)^ -2 ^ 3 + max( a ,b )\n", "y = -(a + b)^-2^3 + max(a, b)\n");
  expectLayout("check  ok :a<=  b\n", "check ok: a <= b\n");
  expectLayout("check ok: a \u2265 b\n", "check ok: a >= b\n");
  expectLayout("\u03b7 = 0.5\n", "\u03b7 = 0.5\n");
}

TEST_CASE("fmt: metadata, sections, notes and comments", "[review][fmt]") {
  expectLayout("title:Gate hoist\nchecked:   \n", "title: Gate hoist\nchecked:\n");
  expectLayout("section    Loads  and  speeds  \n", "section Loads  and  speeds\n");
  expectLayout("  note   The text # runs on.  \n", "note The text # runs on.\n");
  // Comments are kept verbatim from their `#`, trailing blanks aside.
  expectLayout("#   indented  comment \t \n   # leading blanks go\n#\n", "#   indented  comment\n# leading blanks go\n#\n");
  // `note`, `section` and `check` remain usable as quantity names.
  expectLayout("note=1\nsection [mm]=2 mm\n", "note = 1\nsection [mm] = 2 mm\n");
}

TEST_CASE("fmt: blank lines kept, line endings LF, one final newline", "[review][fmt]") {
  expectLayout("a = 1\n\n\nb = 2\n", "a = 1\n\n\nb = 2\n");
  expectLayout("a = 1\n   \t\nb = 2\n", "a = 1\n\nb = 2\n");
  expectLayout("\n\na = 1\n\n\n", "a = 1\n");
  expectLayout("a = 1", "a = 1\n");
  expectLayout("a = 1\r\n\r\n# note\r\nb=2\r\n", "a = 1\n\n# note\nb = 2\n");
  expectLayout("\xEF\xBB\xBFtitle: x\n", "title: x\n");
}

TEST_CASE("fmt: descriptions stand in one column per section", "[review][fmt]") {
  // "CODE" padded so that its `#` stands at 0-based `column`.
  auto at = [](const std::string& code, int column, const std::string& description) {
    int width = 0;
    for (char c : code) width += (static_cast<unsigned char>(c) & 0xC0) != 0x80;
    return code + std::string(static_cast<size_t>(column - width), ' ') + "# " + description + "\n";
  };
  // The column is the longest line of the section plus two, rounded up to a multiple of 8.
  expectLayout("d = 40 mm # major diameter\np = 7 mm     # pitch\nd_m [mm] = d - p / 2 # mean\n",
               at("d = 40 mm", 24, "major diameter") + at("p = 7 mm", 24, "pitch") +
                   at("d_m [mm] = d - p / 2", 24, "mean"));
  // Blank lines, comments and notes inside a section do not start a new column; checks share it.
  expectLayout("a = 1 # one\n\nlong_name_here [mm] = 2 mm # two\nnote N\ncheck c: a < 2 # three\n"
               "# c\nb = 3 # four\n",
               at("a = 1", 32, "one") + "\n" + at("long_name_here [mm] = 2 mm", 32, "two") + "note N\n" +
                   at("check c: a < 2", 32, "three") + "# c\n" + at("b = 3", 32, "four"));
  // A `section` line starts a new column; the lines before the first section have their own.
  expectLayout("a = 1 # one\nsection S\nbb = 22 # two\n\nccc_long = 333 # three\nsection T\nc = 3 # four\n",
               at("a = 1", 8, "one") + "section S\n" + at("bb = 22", 16, "two") + "\n" +
                   at("ccc_long = 333", 16, "three") + "section T\n" + at("c = 3", 8, "four"));
  // Lines without a description do not widen the column.
  expectLayout("x = a_very_long_formula_name_without_words + 1\ny = 2 # two\n",
               "x = a_very_long_formula_name_without_words + 1\n" + at("y = 2", 8, "two"));
  // A line too long for the cap gets two spaces and leaves the others of its section alone.
  const std::string longer = "T [N*m] = torque_raise(F, d_m, l, f_high, alpha) + collar(F, f_c, d_c)";
  expectLayout("f = 0.1 # friction\n\n" + longer + " # torque\n",
               at("f = 0.1", 16, "friction") + "\n" + longer + "  # torque\n");
  // Descriptions are kept as written, a `#` inside them included; empty ones vanish.
  expectLayout("x = 1 ## odd\ny = 2 #\n", at("x = 1", 8, "# odd") + "y = 2\n");
  // Width counts characters, not bytes.
  expectLayout("\u03b7 = 0.5 # efficiency\nab = 1 # x\n", at("\u03b7 = 0.5", 16, "efficiency") + at("ab = 1", 16, "x"));
}

TEST_CASE("fmt: every demo worksheet and template is canonical, one description column per section", "[review][fmt]") {
  for (const std::string& path : repositoryWorksheets(true)) {
    INFO(path);
    const std::string text = readFile(repoPath(path));
    CHECK(fmt(text) == text);  // `fmt --check` passes, as .ci/test asks of the demos and templates
    std::istringstream in(text);
    std::string line;
    std::set<size_t> columns;
    auto closeSection = [&] {
      CHECK(columns.size() <= 1);
      columns.clear();
    };
    while (std::getline(in, line)) {
      if (line.rfind("section ", 0) == 0) closeSection();
      if (line.empty() || line[0] == '#' || line.rfind("note ", 0) == 0) continue;
      const size_t hash = line.find("  # ");
      if (hash == std::string::npos) continue;
      // Past the cap a line keeps two spaces and has no column to share.
      if (hash + 2 <= static_cast<size_t>(kDescriptionColumnCap)) columns.insert(hash + 2);
    }
    closeSection();
  }
}

TEST_CASE("fmt: a fraction before a unit keeps its reading", "[review][fmt]") {
  expectLayout("a=1/8 in\n", "a = 1/8 in\n");
  expectLayout("a = 1/8 [in]\n", "a = 1/8 in\n");
  expectLayout("a = 1-1/2  in\n", "a = 1-1/2 in\n");
  expectLayout("a = -3/4 [in]^2\n", "a = -3/4 [in]^2\n");
  expectLayout("a = 2*1/8 in + x / (1/8 in)\nx = 1 in\n", "a = 2 * 1/8 in + x / (1/8 in)\nx = 1 in\n");
  expectLayout("r = 1 / (8 in)\nq = 1/8\n", "r = 1 / (8 in)\nq = 1 / 8\n");
  // Parse, format, parse: the same values, bit for bit.
  const std::string text = "a = 1/8 in\nb = 3/4 in\nc = 1-1/2 in\nd = -1/8 in\ne = 2 * 1/8 in\n"
                           "f = 1 / (8 in)\ng = 5/8 %\nh = 1/2 [in/rev]\n";
  auto before = calc(text);
  auto after = calc(fmt(text));
  REQUIRE_FALSE(before->hasErrors());
  REQUIRE_FALSE(after->hasErrors());
  expectSameNumbers(*before, *after);
  CHECK(si(*before, "a") == 0.125 * 0.0254);
  CHECK(si(*before, "b") == 0.75 * 0.0254);
  CHECK(si(*before, "c") == 1.5 * 0.0254);
  CHECK(si(*before, "d") == -0.125 * 0.0254);
  CHECK(si(*before, "f") == Approx(1 / (8 * 0.0254)).epsilon(1e-15));
  CHECK(si(*before, "g") == Approx(0.00625).epsilon(1e-15));
}

TEST_CASE("fmt: the description column never passes the cap", "[review][fmt]") {
  std::string code = "x = a";
  while (code.size() < static_cast<size_t>(kDescriptionColumnCap - 2)) code += "b";
  const std::string out = fmt(code + " # d\ny = 1 # e\n");
  CHECK(out.find(code + "  # d\n") != std::string::npos);  // exactly at the cap: two spaces
  CHECK(out.find("y = 1" + std::string(static_cast<size_t>(kDescriptionColumnCap - 5), ' ') + "# e\n") !=
        std::string::npos);
  code += "c";
  const std::string over = fmt(code + " # d\ny = 1 # e\n");
  CHECK(over == code + "  # d\ny = 1   # e\n");
}

TEST_CASE("fmt: a file that fails to parse is never rewritten", "[review][fmt]") {
  Diagnostics diags;
  CHECK(formatWorksheet("bad.calc", "a = (1 +\nb = 2\n", &diags).empty());
  CHECK(diags.hasErrors());

  const std::string dir = tempDir();
  const std::string bad = dir + "/bad.calc", good = dir + "/good.calc";
  const std::string bad_bytes = "a =   1\nb = (2 +\n";
  writeFile(bad, bad_bytes);
  writeFile(good, "c=3\n");
  Run r = runCli("fmt --write '" + bad + "' '" + good + "'");
  CHECK(r.status == 2);
  CHECK(r.err.find(bad + ":2:") != std::string::npos);
  CHECK(r.err.find(": error: ") != std::string::npos);
  CHECK(readFile(bad) == bad_bytes);
  CHECK(readFile(good) == "c = 3\n");  // the other file is still done
  CHECK(directoryEntries(dir) == std::vector<std::string>{"bad.calc", "good.calc"});

  Run printed = runCli("fmt '" + bad + "'");
  CHECK(printed.status == 2);
  CHECK(printed.out.empty());
  Run checked = runCli("fmt --check '" + bad + "'");
  CHECK(checked.status == 2);
}

TEST_CASE("fmt --check and --write", "[review][fmt]") {
  const std::string dir = tempDir();
  const std::string a = dir + "/a.calc", b = dir + "/b.calc";
  writeFile(a, "x = 1 mm\n");
  writeFile(b, "x = 1 mm\ny=x*2\n");
  Run ok = runCli("fmt --check '" + a + "'");
  CHECK(ok.status == 0);
  CHECK(ok.out.empty());
  Run not_canonical = runCli("fmt --check '" + a + "' '" + b + "'");
  CHECK(not_canonical.status == 1);
  CHECK(not_canonical.out == b + ": not in canonical layout (first difference on line 2)\n");
  CHECK(readFile(b) == "x = 1 mm\ny=x*2\n");

  // A canonical file is not written at all (its time stamp stays).
  utimbuf old_times{1000000000, 1000000000};
  REQUIRE(utime(a.c_str(), &old_times) == 0);
  chmod(b.c_str(), 0640);
  Run w = runCli("fmt --write '" + a + "' '" + b + "'");
  CHECK(w.status == 0);
  CHECK(w.out == b + ": rewritten in canonical layout\n");
  CHECK(readFile(b) == "x = 1 mm\ny = x * 2\n");
  struct stat st;
  REQUIRE(stat(a.c_str(), &st) == 0);
  CHECK(st.st_mtime == 1000000000);
  REQUIRE(stat(b.c_str(), &st) == 0);
  CHECK((st.st_mode & 0777) == 0640);  // permissions kept
  CHECK(directoryEntries(dir) == std::vector<std::string>{"a.calc", "b.calc"});
  CHECK(runCli("fmt --check '" + a + "' '" + b + "'").status == 0);

  // Several files need --check or --write; the two exclude each other.
  CHECK(runCli("fmt '" + a + "' '" + b + "'").status == 2);
  CHECK(runCli("fmt --check --write '" + a + "'").status == 2);
  CHECK(runCli("fmt '" + dir + "/missing.calc'").status == 2);
}

TEST_CASE("fmt --write through a symbolic link rewrites the target and keeps the link", "[review][fmt]") {
  const std::string dir = tempDir();
  writeFile(dir + "/real.calc", "a=1\n");
  REQUIRE(symlink("real.calc", (dir + "/link.calc").c_str()) == 0);
  CHECK(runCli("fmt --write '" + dir + "/link.calc'").status == 0);
  CHECK(readFile(dir + "/real.calc") == "a = 1\n");
  struct stat st;
  REQUIRE(lstat((dir + "/link.calc").c_str(), &st) == 0);
  CHECK(S_ISLNK(st.st_mode));
}

TEST_CASE("fmt reads standard input with -", "[review][fmt]") {
  Run r = shell("printf 'a=1\\r\\nb =a*2' | '" + std::string(CALCTRAIL_BINARY) + "' fmt -");
  CHECK(r.status == 0);
  CHECK(r.out == "a = 1\nb = a * 2\n");
  Run w = shell("printf 'a=1' | '" + std::string(CALCTRAIL_BINARY) + "' fmt --write -");
  CHECK(w.status == 2);
}

// Tests run as root, where permissions stop no write; these failures are
// ones root cannot get past either.
TEST_CASE("fmt --write: when the temporary file cannot be created, the old file stays", "[review][fmt]") {
  const std::string dir = tempDir();
  // The longest name a directory entry may have (255 bytes): the temporary
  // name, the file's name plus a suffix, is longer than any file system allows.
  const std::string name = std::string(250, 'w') + ".calc";
  const std::string path = dir + "/" + name;
  const std::string bytes = "a=1\nb =  a*2   # twice\n";
  writeFile(path, bytes);
  REQUIRE(readFile(path) == bytes);
  Run r = runCli("fmt --write '" + path + "'");
  CHECK(r.status == 2);
  CHECK(r.err.find(": error: cannot write") != std::string::npos);
  CHECK(readFile(path) == bytes);
  CHECK(directoryEntries(dir) == std::vector<std::string>{name});
}

TEST_CASE("fmt --write: a write cut off midway leaves the old file intact", "[review][fmt]") {
  const std::string dir = tempDir();
  const std::string path = dir + "/long.calc";
  const std::string bytes = longUncanonicalSheet();
  REQUIRE(bytes.size() > 4096);
  writeFile(path, bytes);
  // The file size limit applies to root too; with SIGXFSZ ignored the write
  // fails with EFBIG after the first block instead of killing the program.
  Run r = shell("trap '' XFSZ; ulimit -f 2; exec '" + std::string(CALCTRAIL_BINARY) + "' fmt --write '" + path + "'");
  CHECK(r.status == 2);
  CHECK(r.err.find(": error: cannot write") != std::string::npos);
  CHECK(readFile(path) == bytes);
  CHECK(directoryEntries(dir) == std::vector<std::string>{"long.calc"});
  // Without the limit the same command succeeds.
  CHECK(runCli("fmt --write '" + path + "'").status == 0);
  CHECK(readFile(path) != bytes);
}
