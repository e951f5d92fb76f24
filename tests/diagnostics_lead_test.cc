// rpm times a computed plain length: the hint fits a computed quantity (issue 11).
#include <catch2/catch.hpp>

#include "tests/test_support.h"

using calctrail::test::calc;
using calctrail::test::diagnostics;

TEST_CASE("rpm times a computed plain length: divide by 1 [rev] or compute a lead", "[diagnostics][lead]") {
  auto c = calc("n = 1450 rpm\nP = 4 mm\np = 2 * P\nv = n * p\nw = n * 5 mm\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find(":4:1: warning: `v` is a rotational speed times a plain length") != std::string::npos);
  CHECK(d.find("`p` is computed") != std::string::npos);
  CHECK(d.find("`p / 1 [rev]`") != std::string::npos);
  CHECK(d.find("thread_lead(pitch, starts)") != std::string::npos);
  // A literal length keeps the literal's fix.
  CHECK(d.find(":5:1: warning: `w` is a rotational speed times a plain length") != std::string::npos);
  CHECK(d.find("as in `5 [mm/rev]`") != std::string::npos);
}

// The same hint where the quantity declares its unit: the declared-unit
// mismatch (fitsDeclaredUnit) names the computed lead and both fixes.
TEST_CASE("a declared speed of rpm times a computed plain length gets the lead hint", "[diagnostics][lead]") {
  auto c = calc("n = 1450 rpm\nP = 4 mm\np = 2 * P\nv [mm/s] = n * p\nw [mm/s] = n * 5 mm\n");
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find(":4:4: error: `v` is declared in [mm/s]") != std::string::npos);
  CHECK(d.find("off by 2*pi; if `p` is a lead") != std::string::npos);
  CHECK(d.find("`p` is computed") != std::string::npos);
  CHECK(d.find("`p / 1 [rev]`") != std::string::npos);
  CHECK(d.find("thread_lead(pitch, starts)") != std::string::npos);
  // A literal length keeps the literal's fix.
  CHECK(d.find(":5:4: error: `w` is declared in [mm/s]") != std::string::npos);
  CHECK(d.find("as in `5 [mm/rev]`") != std::string::npos);
  CHECK(calctrail::test::count(d, "`p` is computed") == 1);
}

TEST_CASE("a --set giving a declared speed as rpm times a computed length gets the lead hint",
          "[diagnostics][lead][set]") {
  auto c = calc("n = 1450 rpm\nP = 4 mm\np = 2 * P\nv [mm/s] = 10 [mm/s]\n", {"v=n * p"});
  const std::string d = diagnostics(*c);
  INFO(d);
  CHECK(d.find("error:") != std::string::npos);
  CHECK(d.find("`p` is computed") != std::string::npos);
  CHECK(d.find("`p / 1 [rev]`") != std::string::npos);
}
