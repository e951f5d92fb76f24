// The Vim syntax file docs/editors/vim/ loads in headless Neovim without an
// error, detects a .calc file, and gives each kind of token of a demo
// worksheet its syntax group.
#include <catch2/catch.hpp>

#include <sys/wait.h>
#include <cstdlib>
#include <filesystem>
#include <sstream>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

// A place in a file, found by the text that starts there.
struct Probe {
  std::string line_start;  ///< the text the line starts with (its first match in the file)
  std::string token;       ///< the token on that line whose group is asked
  std::string group;       ///< the syntax group expected at the token's first byte
};

// Line and byte column (1-based) of `p` in `text`.
std::pair<int, int> locate(const std::string& text, const Probe& p) {
  std::istringstream in(text);
  std::string line;
  for (int n = 1; std::getline(in, line); ++n) {
    if (line.rfind(p.line_start, 0) != 0) continue;
    const size_t col = line.find(p.token);
    if (col != std::string::npos) return {n, static_cast<int>(col) + 1};
  }
  FAIL("no line starting with `" << p.line_start << "` holds `" << p.token << "`");
  return {0, 0};
}

// Opens `sheet` (relative to the repository) in headless Neovim with the
// syntax file, runs the Vim script `calls` that adds to the list g:out, and
// returns that list a line each; Neovim must exit cleanly with nothing on
// its standard error.
std::vector<std::string> probeInNeovim(const std::string& sheet, const std::string& calls) {
  const std::string dir = tempDir();
  const std::string script = dir + "/probe.vim", out = dir + "/out", err = dir + "/err";
  writeFile(script, "let g:out = []\n" + calls + "\ncall writefile(g:out, '" + out + "')\n");
  const std::string cmd = "cd '" + repoPath("") + "' && nvim --headless -u NONE -i NONE -n" +
                          " --cmd 'set rtp^=docs/editors/vim' -c 'filetype on' -c 'syntax on' -c 'edit " +
                          sheet + "' -c 'source " + script + "' -c 'qa!' </dev/null >/dev/null 2>'" + err +
                          "'";
  const int raw = std::system(cmd.c_str());
  REQUIRE(WIFEXITED(raw));
  CHECK(WEXITSTATUS(raw) == 0);
  CHECK(readFile(err) == "");
  std::istringstream in(readFile(out));
  std::vector<std::string> got;
  for (std::string line; std::getline(in, line);) got.push_back(line);
  std::filesystem::remove_all(dir);
  return got;
}

}  // namespace

TEST_CASE("vim: the syntax file loads in Neovim and names every kind of token", "[editors][vim]") {
  const int has_nvim = std::system("command -v nvim >/dev/null 2>&1");
  INFO("Neovim is needed for this test: apt-get install neovim (.ci/install-deps)");
  REQUIRE(has_nvim == 0);

  const std::string sheet = "worksheets/canal-gate-hoist.calc";
  const std::string text = readFile(repoPath(sheet));
  const std::vector<Probe> probes = {
      {"# Demo", "#", "calcComment"},
      {"title:", "title", "calcMetaKey"},
      {"title:", "Irrigation", "calcMeta"},
      {"section Loads", "section", "calcSectionKey"},
      {"section Loads", "Loads", "calcSection"},
      {"note The leaf", "note", "calcNoteKey"},
      {"m_leaf =", "m_leaf", "calcDefinition"},
      {"m_leaf =", "950", "calcNumber"},
      {"m_leaf =", "kg", "calcUnit"},
      {"m_leaf =", "# mass", "calcDescription"},
      {"g_n =", "[m/s^2]", "calcBracketUnit"},
      {"W_leaf [kN]", "[kN]", "calcBracketUnit"},
      {"W_leaf [kN]", "*", "calcOperator"},
      {"W_leaf [kN]", "g_n", "calcVariable"},
      {"T_bearing [N*m]", "thrust_bearing_torque", "calcFunction"},
      {"check opening_time", "check", "calcCheckKey"},
      {"check opening_time", "opening_time", "calcCheckName"},
      {"check opening_time", "<=", "calcOperator"},
  };
  std::string calls;
  for (const Probe& p : probes) {
    const auto [line, col] = locate(text, p);
    calls += "call add(g:out, synIDattr(synID(" + std::to_string(line) + ", " + std::to_string(col) +
             ", 1), 'name'))|";
  }
  // A keyword's group links, through calcKeyword, to the standard Keyword group.
  for (const char* group : {"calcCheckKey", "calcKeyword"}) {
    calls +=
        std::string("call add(g:out, matchstr(execute('highlight ") + group + "'), 'links to \\zs\\S\\+'))|";
  }
  const std::vector<std::string> got =
      probeInNeovim(sheet, calls + "\ncall add(g:out, 'filetype=' . &filetype)\n" +
                               "call add(g:out, 'errmsg=' . v:errmsg)");
  REQUIRE(got.size() == probes.size() + 4);
  for (size_t i = 0; i < probes.size(); ++i) {
    INFO(probes[i].line_start << " ... " << probes[i].token);
    CHECK(got[i] == probes[i].group);
  }
  CHECK(got[probes.size()] == "calcKeyword");
  CHECK(got[probes.size() + 1] == "Keyword");
  CHECK(got[probes.size() + 2] == "filetype=calc");
  CHECK(got[probes.size() + 3] == "errmsg=");
}

TEST_CASE("vim: a study line's words, its name and the count of its points", "[editors][vim]") {
  REQUIRE(std::system("command -v nvim >/dev/null 2>&1") == 0);
  const std::string sheet = "worksheets/ball-screw-axis.calc";
  const std::string text = readFile(repoPath(sheet));
  const std::vector<Probe> probes = {
      {"study move_time", "study", "calcStudyKey"},   {"study move_time", "move_time", "calcStudyName"},
      {"study move_time", "sweep", "calcStudyWord"},  {"study move_time", "t_move", "calcVariable"},
      {"study move_time", "0.5", "calcNumber"},       {"study move_time", "8 ", "calcStudyPoints"},
      {"study move_time", "points", "calcStudyWord"}, {"study move_time", "show", "calcStudyWord"},
      {"study move_time", "T_rms", "calcVariable"},   {"study fastest_move", "capacity", "calcStudyWord"},
      {"study fastest_move", "smallest", "calcStudyWord"},
  };
  std::string calls;
  for (const Probe& p : probes) {
    const auto [line, col] = locate(text, p);
    calls += "call add(g:out, synIDattr(synID(" + std::to_string(line) + ", " + std::to_string(col) +
             ", 1), 'name'))|";
  }
  const std::vector<std::string> got = probeInNeovim(sheet, calls);
  REQUIRE(got.size() == probes.size());
  for (size_t i = 0; i < probes.size(); ++i) {
    INFO(probes[i].line_start << " ... " << probes[i].token);
    CHECK(got[i] == probes[i].group);
  }
}
