// A wrong option of a subcommand names the option, the nearest one the
// subcommand has, and that subcommand's help; the exit code stays the
// contract's 2 for a wrong command line (issue 11, item 2).
#include <catch2/catch.hpp>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {
struct Case {
  const char* args;        // the command line, with a misspelt option
  const char* command;     // the subcommand it names
  const char* option;      // the option as typed
  const char* suggestion;  // the option to suggest, "" for none
};

// Each subcommand with its required arguments present, so that the option is
// the only mistake on the line.
const Case kCases[] = {
    {"report x.calc --fromat json", "report", "--fromat", "--format"},
    {"report x.calc --bogus", "report", "--bogus", ""},
    {"check x.calc --quite", "check", "--quite", "--quiet"},
    {"diff a.calc b.calc --rtoll 1e-6", "diff", "--rtoll", "--rtol"},
    {"fmt x.calc --wirte", "fmt", "--wirte", "--write"},
    {"textconv x.calc --digit 4", "textconv", "--digit", "--digits"},
    {"sweep x.calc --vary d=1..2 --show T --stpes 3", "sweep", "--stpes", "--steps"},
    {"solve x.calc --vary d --between 1..2 --capacity max --sampels 9", "solve", "--sampels", "--samples"},
    {"sensitivity x.calc --of T --fo T", "sensitivity", "--fo", "--of"},
    {"pick x.calc --vary d --from acme --smalest", "pick", "--smalest", "--smallest"},
    {"functions --fromat md", "functions", "--fromat", "--format"},
    {"units --formatt md", "units", "--formatt", "--format"},
    {"lsp --stdio", "lsp", "--stdio", ""},
};
}  // namespace

TEST_CASE("an unknown option of each subcommand points at its help", "[cli][options]") {
  for (const Case& c : kCases) {
    INFO(c.args);
    Run r = runCli(c.args);
    CHECK(r.status == 2);
    CHECK(r.out.empty());
    const std::string named =
        std::string("calctrail: error: unknown option `") + c.option + "` for `calctrail " + c.command + "`";
    CHECK(r.err.find(named) != std::string::npos);
    if (*c.suggestion) CHECK(r.err.find(std::string("did you mean `") + c.suggestion + "`?") != std::string::npos);
    else CHECK(r.err.find("did you mean") == std::string::npos);
    CHECK(r.err.find(std::string("see: calctrail ") + c.command + " --help\n") != std::string::npos);
  }
}

TEST_CASE("the help a wrong option points at exists and lists the suggested option", "[cli][options]") {
  for (const Case& c : kCases) {
    INFO(c.command);
    Run help = runCli(std::string(c.command) + " --help");
    CHECK(help.status == 0);
    if (*c.suggestion) CHECK(help.out.find(c.suggestion) != std::string::npos);
  }
}

TEST_CASE("other mistakes inside a subcommand also point at its help", "[cli][options]") {
  Run r = runCli("report x.calc --format pdf");
  CHECK(r.status == 2);
  CHECK(r.err.find("see: calctrail report --help\n") != std::string::npos);
  Run top = runCli("frobnicate");
  CHECK(top.status == 2);
  CHECK(top.err.find("calctrail --help") != std::string::npos);
}
