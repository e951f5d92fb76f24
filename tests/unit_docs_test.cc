// docs/units.md is generated from the unit table; this fails when it is stale.
#include <catch2/catch.hpp>

#include <fstream>
#include <sstream>
#include <string>

#include "engine/units/unit_table.h"

using namespace calctrail;

TEST_CASE("unit docs: docs/units.md is generated from the table", "[units][docs]") {
  const std::string path = std::string(CALCTRAIL_SOURCE_DIR) + "/docs/units.md";
  const char* const regenerate =
      "docs/units.md is stale: regenerate it with "
      "`build/calctrail units --format md > docs/units.md` and commit it";
  std::ifstream in(path, std::ios::binary);
  INFO(regenerate);
  REQUIRE(in.good());
  std::ostringstream buf;
  buf << in.rdbuf();
  const std::string file = buf.str();
  const std::string expected = unitTableMarkdown();
  if (file == expected) return;
  // Name the first line that differs, to make a stale table obvious.
  std::istringstream a(file), b(expected);
  std::string la, lb;
  int line = 0;
  for (;;) {
    ++line;
    const bool more_a = static_cast<bool>(std::getline(a, la));
    const bool more_b = static_cast<bool>(std::getline(b, lb));
    if (!more_a && !more_b) break;
    if (la != lb || more_a != more_b) break;
  }
  FAIL(regenerate << "\nfirst difference at line " << line << ":\n  file:      " << la
                  << "\n  generated: " << lb);
}

TEST_CASE("unit docs: the generated page lists every unit", "[units][docs]") {
  const std::string md = unitTableMarkdown();
  CHECK(md.find("build/calctrail units --format md > docs/units.md") != std::string::npos);
  for (const UnitDef& d : unitTable()) {
    INFO(d.name);
    CHECK(md.find("| `" + std::string(d.name) + "` |") != std::string::npos);
  }
}
