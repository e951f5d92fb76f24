// docs/studies.md shows what the study commands print for its demo
// worksheet (docs/studies/screw-clamp.calc): every line of each output but
// the first (which carries the worksheet's hash, shortened on the page)
// appears in the page, indented as a code block.
#include <catch2/catch.hpp>
#include <sstream>
#include <string>

#include "tests/test_support.h"

using namespace calctrail;

TEST_CASE("docs: docs/studies.md shows what the study commands print", "[study][docs]") {
  const std::string page = test::readFile(test::repoPath("docs/studies.md"));
  const std::string sheet = "docs/studies/screw-clamp.calc";
  const char* const commands[] = {
      " --of F_clamp",
      " --vary \"f=0.08..0.20\" --steps 7 --show F_clamp,p_nut,n_yield",
      " --vary T_motor --between \"0.5 [N*m]..5 [N*m]\" --target \"F_clamp = F_needed\"",
      " --vary i_gear --between \"5..60\" --capacity max",
      " --vary d --from trapezoidal",
      " --vary T_motor --from \"1.2 [N*m], 1.8 [N*m], 2.6 [N*m], 3.5 [N*m]\"",
  };
  const char* const verbs[] = {"sensitivity", "sweep", "solve", "solve", "pick", "pick"};
  for (size_t i = 0; i < std::size(commands); ++i) {
    const std::string args = std::string(verbs[i]) + " " + sheet + commands[i];
    const test::Run r = test::runCli(args);
    INFO(args << "\n" << r.err);
    REQUIRE(r.status <= 1);
    CHECK(page.find("calctrail " + args) != std::string::npos);
    std::istringstream lines(r.out);
    std::string line;
    std::getline(lines, line);  // "Sweep of FILE (SHA-256 ...)"
    while (std::getline(lines, line)) {
      if (line.empty()) continue;
      INFO(line);
      CHECK(page.find("\n    " + line + "\n") != std::string::npos);
    }
  }
}
