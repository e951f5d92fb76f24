// engine/study/sensitivity and the sensitivity command: the elasticity of a
// power law is its exponent, ranked by magnitude with the direction that
// raises the result, the checks that flip within +-10 %, and the inputs it
// cannot be taken for.
#include "engine/study/sensitivity.h"

#include <catch2/catch.hpp>
#include <string>

#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::Json;

namespace {

const InputSensitivity& of(const SensitivityOutcome& o, const std::string& name) {
  for (const InputSensitivity& s : o.inputs)
    if (s.name == name) return s;
  FAIL("no input " << name);
  return o.inputs.front();
}

SensitivityOutcome run(const Calculation& c, const std::string& name) {
  return runSensitivity(*c.model, *c.inputs, c.results, c.model->find(name));
}

}  // namespace

TEST_CASE("sensitivity: the elasticity of a power law is its exponent", "[study][sensitivity]") {
  auto c = test::calc(
      "k = 0.2\nF = 3 kN\nl = 8 mm\nT [N*m] = k * F^1 * l^1\n"
      "T2 [N^2*m^2] = k * F^2 * l * l\nR = 5 / F^3 * 1 [kN^3]\nunused = 4\n");
  REQUIRE_FALSE(c->hasErrors());
  const SensitivityOutcome t = run(*c, "T");
  REQUIRE(t.inputs.size() == 3);  // k, F, l: not `unused`
  for (const char* n : {"k", "F", "l"}) {
    INFO(n);
    REQUIRE(of(t, n).ok);
    CHECK(of(t, n).elasticity == Approx(1.0).epsilon(1e-9));
    CHECK(of(t, n).flips.empty());
  }
  const SensitivityOutcome t2 = run(*c, "T2");
  CHECK(of(t2, "F").elasticity == Approx(2.0).epsilon(1e-9));
  CHECK(of(t2, "l").elasticity == Approx(2.0).epsilon(1e-9));
  CHECK(t2.inputs[2].name == "k");  // largest magnitude first
  const SensitivityOutcome r = run(*c, "R");
  REQUIRE(r.inputs.size() == 1);
  CHECK(r.inputs[0].elasticity == Approx(-3.0).epsilon(1e-9));
}

TEST_CASE("sensitivity: ranking, direction and the checks that flip within 10 %", "[study][sensitivity]") {
  const std::string path = test::tempDir() + "/s.calc";
  test::writeFile(path,
                  "F = 10 kN\nA = 100 [mm^2]\nf = 0.1\nS = 105 MPa\nsigma [MPa] = F / A * (1 + f)\n"
                  "check strength: sigma <= S\ncheck low: sigma >= 90 MPa\n");
  const test::Run run = test::runCli("sensitivity '" + path + "' --of sigma --format json");
  INFO(run.err);
  REQUIRE(run.status == 1);  // a check fails at the nominal point: sigma = 110 MPa > 105 MPa
  Json j;
  std::string error;
  REQUIRE(test::parseJson(run.out, &j, &error));
  CHECK(j["of"].string == "sigma");
  REQUIRE(j["inputs"].array.size() == 3);
  CHECK(j["inputs"][0]["name"].string == "F");  // |+1| and |-1| before f's 0.0909
  CHECK(j["inputs"][0]["elasticity"].number == Approx(1).epsilon(1e-9));
  CHECK(j["inputs"][0]["raises"].string == "increase");
  CHECK(j["inputs"][1]["name"].string == "A");
  CHECK(j["inputs"][1]["elasticity"].number == Approx(-1).epsilon(1e-9));
  CHECK(j["inputs"][1]["raises"].string == "decrease");
  CHECK(j["inputs"][2]["elasticity"].number == Approx(0.1 / 1.1).epsilon(1e-8));
  // strength passes once sigma <= 105 MPa: F 5 % lower (sampled at 1 % steps).
  const Json& flipsF = j["inputs"][0]["flips"];
  REQUIRE(flipsF.array.size() == 1);
  CHECK(flipsF[0]["check"].string == "strength");
  CHECK(flipsF[0]["change"].number == Approx(-0.05));
  CHECK(flipsF[0]["passes"].boolean);
  // A 5 % larger area (sigma 104.8 MPa) makes it pass too; no flip for f within 10 %.
  CHECK(j["inputs"][1]["flips"][0]["change"].number == Approx(0.05));
  CHECK(j["inputs"][2]["flips"].array.empty());
  const test::Run text = test::runCli("sensitivity '" + path + "' --of sigma");
  CHECK(text.out.find("increase F") != std::string::npos);
  CHECK(text.out.find("strength passes at -5 %") != std::string::npos);
}

TEST_CASE("sensitivity: inputs it cannot be taken for, and bad studies", "[study][sensitivity]") {
  auto c = test::calc("n = 2\nz = 0 mm\nx = 3 mm\ny [mm] = x * n + z\n");
  REQUIRE_FALSE(c->hasErrors());
  const SensitivityOutcome o = run(*c, "y");
  CHECK(of(o, "x").ok);
  CHECK_FALSE(of(o, "z").ok);
  CHECK(of(o, "z").error.find("`z` is 0") != std::string::npos);
  CHECK(o.inputs.back().name == "z");  // those without an elasticity last
  const std::string path = test::tempDir() + "/s.calc";
  test::writeFile(path, "x = 3 mm\nz = 0 mm\ny [mm] = x + z\nw [mm] = z * 2\n");
  const test::Run unknown = test::runCli("sensitivity '" + path + "' --of yy");
  CHECK(unknown.status == 2);
  CHECK(unknown.err.find("--of:1:1: error: the worksheet defines no quantity `yy`; did you mean `y`?") !=
        std::string::npos);
  const test::Run zero = test::runCli("sensitivity '" + path + "' --of w");
  CHECK(zero.status == 2);
  CHECK(zero.err.find("`w` is 0 at this point") != std::string::npos);
}
