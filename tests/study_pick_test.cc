// engine/study/pick, the series and the pick command: the size chosen is the
// one a brute force over the table finds, every candidate tried is listed
// with the checks that rejected it, --by, and the bad studies.
#include "engine/study/pick.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "engine/study/series.h"
#include "functions/series_tables.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::Json;

namespace {

Json parsed(const std::string& text) {
  Json j;
  std::string error;
  INFO(text);
  REQUIRE(test::parseJson(text, &j, &error));
  return j;
}

}  // namespace

TEST_CASE("series: the tables of the drive library, read through its functions", "[study][pick][series]") {
  // ISO 2904 lists 8 to 300 mm (the library's table: 55 sizes); ASME B1.5 1/4 to 5 in (23 sizes);
  // IEC 60072-1 outputs 0.06 to 1000 kW as the table holds them (41 sizes).
  const std::vector<double>& tr = fn::trapezoidalDiameters();
  REQUIRE(tr.size() == 55);
  CHECK(tr.front() == 8 * 1e-3);
  CHECK(tr[8] == 20 * 1e-3);
  CHECK(tr[25] == 55 * 1e-3);
  CHECK(tr.back() == 300 * 1e-3);
  const std::vector<double>& acme = fn::acmeDiameters();
  REQUIRE(acme.size() == 23);
  CHECK(acme.front() == 0.25 * 0.0254);
  CHECK(acme[1] == 0.3125 * 0.0254);
  CHECK(acme.back() == 5 * 0.0254);
  const std::vector<double>& kw = fn::ratedMotorOutputs();
  REQUIRE(kw.size() == 41);
  CHECK(kw.front() == 60);
  CHECK(kw[8] == 1100);
  CHECK(kw[28] == 200000);
  CHECK(kw.back() == 1000000);
  for (size_t i = 1; i < kw.size(); ++i) CHECK(kw[i] > kw[i - 1]);
  REQUIRE(findSeries("trapezoidal"));
  CHECK(findSeries("trapezoidal")->unit.text == "mm");
  CHECK(findSeries("motor_outputs")->values == &kw);
  CHECK_FALSE(findSeries("metric"));
}

TEST_CASE("pick: the smallest trapezoidal size equals a brute force over the table", "[study][pick]") {
  // Brute force: every size of the table through a --set run of its own, in order.
  double expected = 0;
  for (double d : fn::trapezoidalDiameters()) {
    CalcOptions o;
    o.sets = {"d=" + std::to_string(static_cast<int>(std::lround(d * 1000))) + " mm"};
    auto c = Calculation::fromFile(test::repoPath("worksheets/twin-screw-lift.calc"), o);
    if (c->hasErrors() || !c->allChecksPass()) continue;
    expected = d;
    break;
  }
  REQUIRE(expected > 0);
  const test::Run r =
      test::runCli("pick worksheets/twin-screw-lift.calc --vary d --from trapezoidal -f json");
  INFO(r.err);
  REQUIRE(r.status == 0);
  const Json j = parsed(r.out);
  CHECK(j["vary"].string == "d");
  CHECK(j["chosen"]["si"].number == expected);
  CHECK(j["chosen"]["unit"].string == "mm");
  // Every size below it tried and rejected, with the checks that rejected it.
  const auto& tried = j["tried"].array;
  REQUIRE(tried.size() >= 2);
  CHECK(tried.back()["passed"].boolean);
  for (size_t i = 0; i + 1 < tried.size(); ++i) {
    CHECK_FALSE(tried[i]["passed"].boolean);
    CHECK_FALSE(tried[i]["failed"].array.empty());
  }
  CHECK(tried[tried.size() - 2]["failed"][0].string == "screw.buckling");
}

TEST_CASE("pick: from a list, by an expression, and nothing passing", "[study][pick]") {
  const std::string path = test::tempDir() + "/s.calc";
  test::writeFile(path,
                  "F = 10 kN\nd = 20 mm\nA [mm^2] = pi / 4 * d^2\nsigma [MPa] = F / A\n"
                  "cost = d / 1 mm + (30 mm - d) / 1 mm * 2\n"  // cheapest at the largest size
                  "check strength: sigma <= 25 MPa\n");
  const std::string base = "pick '" + path + "' --vary d";
  const test::Run list = test::runCli(base + " --from '30 mm, 20 mm, 25 mm' -f json");
  REQUIRE(list.status == 0);
  const Json lj = parsed(list.out);
  CHECK(lj["from"].string == "list");
  CHECK(lj["chosen"]["value"].number == 25);  // sigma = 20.4 MPa; 20 mm gives 31.8 MPa
  REQUIRE(lj["tried"].array.size() == 2);     // ascending, stopping at the first that passes
  CHECK(lj["tried"][0]["failed"][0].string == "strength");
  const test::Run by = test::runCli(base + " --from '30 mm, 20 mm, 25 mm' --by cost -f json");
  REQUIRE(by.status == 0);
  const Json bj = parsed(by.out);
  CHECK(bj["chosen"]["value"].number == 30);
  CHECK(bj["tried"].array.size() == 3);
  CHECK(bj["tried"][1]["by"]["si"].number == Approx(35));
  const test::Run none = test::runCli(base + " --from '10 mm, 12 mm' -f json");
  CHECK(none.status == 1);
  CHECK(parsed(none.out)["chosen"].type == Json::Null);
  const test::Run text = test::runCli(base + " --from '30 mm, 20 mm, 25 mm'");
  CHECK(text.out.find("chosen: d = 25.00 mm") != std::string::npos);
  CHECK(text.out.find("fails: strength") != std::string::npos);
}

TEST_CASE("pick: bad studies are errors, exit 2", "[study][pick][diagnostics]") {
  const std::string w = "pick worksheets/twin-screw-lift.calc";
  struct Case {
    std::string args, message;
  };
  const Case cases[] = {
      {" --vary d --from trapezoidl", "no series is named `trapezoidl`"},
      {" --vary d --from motor_outputs", "the series `motor_outputs` holds power (W), but `d` is length"},
      {" --vary d --from '40 mm, 4 kg'", "`d` is length (mm) in the worksheet, but `4 kg` is mass (kg)"},
      {" --vary screw.p --from trapezoidal", "`screw.p` is calculated from other quantities"},
      {" --vary d --from trapezoidal --by motor.P_motr", "did you mean `motor.P_motor`"},
      {" --vary d --from trapezoidal --by motor.P_motor --smallest", "not both"},
  };
  for (const Case& c : cases) {
    const test::Run r = test::runCli(w + c.args);
    INFO(c.args << "\n" << r.err);
    CHECK(r.status == 2);
    CHECK(r.err.find(c.message) != std::string::npos);
  }
}
