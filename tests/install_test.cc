// `cmake --install` of this build into a temporary prefix lays calctrail out
// as a Debian tool: program, manual page, bash completion, worksheets, docs and
// editor files; and the installed program runs an installed worksheet.
#include <catch2/catch.hpp>

#include <sys/wait.h>
#include <cstdlib>
#include <filesystem>

#include "tests/test_support.h"

using namespace calctrail::test;
namespace fs = std::filesystem;

namespace {
int shell(const std::string& cmd) {
  const int raw = std::system(cmd.c_str());
  return WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
}
}  // namespace

TEST_CASE("install: cmake --install lays out the program, its page, completion, worksheets and docs",
          "[package]") {
  const std::string build_dir = fs::path(CALCTRAIL_BINARY).parent_path().string();
  const std::string prefix = tempDir();
  const std::string log = prefix + ".log";
  INFO(readFile(log));
  REQUIRE(shell("cmake --install '" + build_dir + "' --prefix '" + prefix + "' >'" + log + "' 2>&1") == 0);
  std::remove(log.c_str());

  const fs::path p(prefix);
  const fs::path bin = p / "bin/calctrail";
  REQUIRE(fs::is_regular_file(bin));
  CHECK((fs::status(bin).permissions() & fs::perms::owner_exec) != fs::perms::none);
  CHECK(fs::is_regular_file(p / "share/man/man1/calctrail.1.gz"));
  CHECK(fs::is_regular_file(p / "share/bash-completion/completions/calctrail"));
  CHECK(fs::is_regular_file(p / "share/calctrail/worksheets/canal-gate-hoist.calc"));
  CHECK(fs::is_regular_file(p / "share/doc/calctrail/README.md"));
  CHECK(fs::is_regular_file(p / "share/doc/calctrail/docs/format.md"));
  CHECK(fs::is_regular_file(p / "share/doc/calctrail/docs/editors/calc.tmLanguage.json"));
  CHECK(fs::is_regular_file(p / "share/vim/vimfiles/syntax/calc.vim"));
  CHECK(fs::is_regular_file(p / "share/vim/vimfiles/ftdetect/calc.vim"));
  CHECK(fs::is_regular_file(p / "share/nvim/site/syntax/calc.vim"));
  // Every demo worksheet comes along.
  for (const auto& e : fs::directory_iterator(repoPath("worksheets"))) {
    CHECK(fs::exists(p / "share/calctrail/worksheets" / e.path().filename()));
  }

  // The manual page is the program's help, with a section per command.
  const std::string page = prefix + "/page.txt";
  REQUIRE(shell("gzip -dc '" + (p / "share/man/man1/calctrail.1.gz").string() + "' >'" + page + "'") == 0);
  const std::string roff = readFile(page);
  CHECK(roff.find(".TH CALCTRAIL \"1\"") != std::string::npos);
  CHECK(roff.find("calctrail 0.") != std::string::npos);
  for (const char* cmd : {"report", "check", "diff", "fmt", "textconv", "functions", "units"}) {
    INFO(cmd);
    CHECK(roff.find(std::string(".SS \"calctrail ") + cmd + "\"") != std::string::npos);
  }
  CHECK(roff.find("text,md,html,json") != std::string::npos);

  const std::string out = prefix + "/trail.txt";
  const int status =
      shell("'" + bin.string() + "' report '" +
            (p / "share/calctrail/worksheets/leveling-jack.calc").string() + "' >'" + out + "'");
  CHECK(status == 0);
  CHECK(readFile(out).find("Machine leveling jack") != std::string::npos);
  fs::remove_all(p);
}
