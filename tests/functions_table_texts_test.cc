// The constant texts that quote a table in a declaration (functions/table_texts.h)
// are the texts built from the table itself.
#include <catch2/catch.hpp>

#include <string>
#include <string_view>

#include "functions/function_decl.h"
#include "functions/table_texts.h"

namespace {

std::string_view formulaOf(const char* name) {
  const calctrail::FunctionDecl* f = calctrail::findFunction(name);
  REQUIRE(f != nullptr);
  return f->formula;
}

bool endsWith(std::string_view s, const std::string& end) {
  return s.size() >= end.size() && s.substr(s.size() - end.size()) == end;
}

}  // namespace

TEST_CASE("a table quoted in a declaration is the table's own text", "[functions]") {
  using namespace calctrail::fn;
  CHECK(endsWith(formulaOf("acme_tpi"), ": " + acmeSeriesText()));
  CHECK(endsWith(formulaOf("trap_pitch"), ": " + trapSeriesText()));
  CHECK(endsWith(formulaOf("trap_max_pitch_dia"), "position e: " + trap7eDeviationText()));
  CHECK(endsWith(formulaOf("trap_min_pitch_dia"), "Td2 = " + trap7eToleranceText()));
  CHECK(endsWith(formulaOf("standard_motor_power"), "the series " + ratedMotorText()));
  for (const char* name : {"trap_max_pitch_dia", "trap_min_pitch_dia", "trap_min_minor_dia"}) {
    const std::string held = trap7eHeldText() + ";";
    CHECK(calctrail::findFunction(name)->limits.substr(0, held.size()) == held);
  }
}
