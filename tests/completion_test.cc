// The bash completion engine/cli/completion.bash, sourced in bash and called
// as bash calls it (COMP_WORDS, COMP_CWORD), against the built program.
#include <catch2/catch.hpp>

#include <sys/wait.h>
#include <cstdlib>
#include <filesystem>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

// What the completion offers for the words `line` (the last one is under the
// cursor), run in `dir`: one candidate per line, in the order given.
std::string complete(const std::string& line, const std::string& dir = "") {
  const std::string tmp = tempDir();
  const std::string script = tmp + "/run.sh", out = tmp + "/out";
  writeFile(script, "source '" + repoPath("engine/cli/completion.bash") + "'\n" + "COMP_WORDS=('" +
                        CALCTRAIL_BINARY + "' " + line + ")\n" +
                        "COMP_CWORD=$(( ${#COMP_WORDS[@]} - 1 ))\n"
                        "_calctrail \"${COMP_WORDS[0]}\" \"${COMP_WORDS[COMP_CWORD]}\" "
                        "\"${COMP_WORDS[COMP_CWORD-1]}\"\n"
                        "printf '%s\\n' \"${COMPREPLY[@]}\"\n");
  const std::string cmd = "cd '" + (dir.empty() ? repoPath("") : dir) + "' && bash --norc --noprofile '" +
                          script + "' >'" + out + "' 2>&1 </dev/null";
  const int raw = std::system(cmd.c_str());
  std::string got = readFile(out);
  std::filesystem::remove_all(tmp);
  INFO(got);
  REQUIRE(WIFEXITED(raw));
  REQUIRE(WEXITSTATUS(raw) == 0);
  return got;
}

}  // namespace

TEST_CASE("completion: commands, from the program's own help", "[completion]") {
  CHECK(complete("''") == "report\ncheck\nfunctions\nunits\ndiff\nfmt\ntextconv\nsweep\nsolve\nsensitivity\npick\nlsp\n");
  CHECK(complete("rep") == "report\n");
  CHECK(complete("t") == "textconv\n");
  CHECK(complete("-") == "--help\n--version\n");
}

TEST_CASE("completion: options and the values of --format", "[completion]") {
  CHECK(complete("report --fo") == "--format\n");
  CHECK(complete("report gate.calc --format ''") == "text\nmd\nhtml\njson\ncsv\n");
  CHECK(complete("report -f h") == "html\n");
  CHECK(complete("diff a.calc b.calc --format ''") == "text\nmd\njson\n");
  CHECK(complete("units --format ''") == "text\nmd\n");
  CHECK(complete("fmt --") == "--help\n--check\n--write\n");
  CHECK(complete("check -") == "-h\n--help\n--set\n--case\n-q\n--quiet\n-f\n--format\n-j\n--jobs\n");
  CHECK(complete("check a.calc --format ''") == "text\njson\njunit\n");
  CHECK(complete("check a.calc -f j") == "json\njunit\n");
  CHECK(complete("check a.calc -j ''") == "\n");  // a number: nothing to offer
  // A number or NAME=VALUE has nothing to offer.
  CHECK(complete("report gate.calc --digits ''") == "\n");
  CHECK(complete("functions trap_pitch") == "trap_pitch\ntrap_pitch_dia\n");
}

TEST_CASE("completion: worksheets and folders for FILE", "[completion]") {
  const std::string dir = tempDir();
  writeFile(dir + "/gate.calc", "x = 1\n");
  writeFile(dir + "/notes.txt", "not a worksheet\n");
  std::filesystem::create_directory(dir + "/sub");
  CHECK(complete("report ''", dir) == "sub\ngate.calc\n");
  CHECK(complete("check g", dir) == "gate.calc\n");
  CHECK(complete("report gate.calc -o n", dir) == "notes.txt\n");
  std::filesystem::remove_all(dir);
}
