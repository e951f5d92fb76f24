// engine/study/sweep and the sweep command: a point is bit for bit the --set
// run of its value, the table is the same for any number of threads and any
// sharding (shards run as separate processes by GNU parallel, merged back),
// ranges and lists with units, the outputs, and every bad sweep an error.
#include "engine/study/sweep.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <cstring>
#include <map>
#include <string>

#include "engine/model/evaluate.h"
#include "engine/study/study_render.h"
#include "engine/study/sweep_merge.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using calctrail::test::Json;

namespace {

const char* const kTwin = "worksheets/twin-screw-lift.calc";

Json parsed(const std::string& text) {
  Json j;
  std::string error;
  INFO(text.substr(0, 2000));
  REQUIRE(test::parseJson(text, &j, &error));
  return j;
}

// SI values of every quantity of a `report --format json` run.
std::map<std::string, double> reportValues(const std::string& set) {
  const test::Run r = test::runCli(std::string("report ") + kTwin + " --format json --set '" + set + "'");
  REQUIRE(r.status == 0);
  std::map<std::string, double> out;
  const Json j = parsed(r.out);
  for (const Json& q : j["quantities"].array) out[q["name"].string] = q["si"].number;
  return out;
}

bool sameBits(double a, double b) {
  return std::memcmp(&a, &b, sizeof a) == 0;
}

StudyRange range(const Calculation& c, const std::string& text, int steps = 11, bool log = false) {
  Diagnostics diags;
  StudyRange r;
  const bool ok = parseVary(*c.model, *c.inputs, text, steps, log, &diags, &r);
  std::string msgs;
  for (const Diagnostic& d : diags.list()) msgs += d.headline() + "\n";
  INFO(msgs);
  REQUIRE(ok);
  return r;
}

}  // namespace

TEST_CASE("sweep: a point equals the --set run of the same value, bit for bit", "[study][sweep]") {
  const std::string show =
      "F,screw.T_raise,motor.T_motor,motor.P_motor,motor.P_rated,screw.n_yield,screw.n_buckle,screw.pv,t_lift";
  const test::Run r =
      test::runCli(std::string("sweep ") + kTwin + " --vary 'm_load=3600 kg, 4200 kg, 5100 kg' --show " +
                   show + " --format json");
  INFO(r.err);
  REQUIRE(r.status == 0);
  const Json j = parsed(r.out);
  REQUIRE(j["points"].array.size() == 3);
  const char* const sets[] = {"m_load=3600 kg", "m_load=4200 kg", "m_load=5100 kg"};
  for (size_t p = 0; p < 3; ++p) {
    const std::map<std::string, double> ref = reportValues(sets[p]);
    const Json& point = j["points"][p];
    CHECK(sameBits(point["inputs"]["m_load"]["si"].number, ref.at("m_load")));
    for (const auto& [name, q] : point["results"].object) {
      INFO(sets[p] << ": " << name);
      CHECK(sameBits(q["si"].number, ref.at(name)));
    }
  }
  // The ends of a range are the values as written: the --set runs of them.
  const test::Run e = test::runCli(std::string("sweep ") + kTwin +
                                   " --vary 'L_col=500 mm..800 mm' --steps 4 --show screw.n_buckle --format json");
  REQUIRE(e.status == 0);
  const Json ej = parsed(e.out);
  CHECK(sameBits(ej["points"][0]["results"]["screw.n_buckle"]["si"].number,
                 reportValues("L_col=500 mm").at("screw.n_buckle")));
  CHECK(sameBits(ej["points"][3]["results"]["screw.n_buckle"]["si"].number,
                 reportValues("L_col=800 mm").at("screw.n_buckle")));
}

TEST_CASE("sweep: every point equals a whole evaluation, for any number of threads", "[study][sweep]") {
  auto c = Calculation::fromFile(test::repoPath(kTwin));
  REQUIRE_FALSE(c->hasErrors());
  const Model& m = *c->model;
  SweepSpec spec;
  spec.vary.push_back(range(*c, "m_load=2000 kg..9000 kg", 301));
  for (uint32_t i = 0; i < m.slotCount(); ++i) spec.show.push_back(Slot(i));
  spec.jobs = 1;
  const SweepTable serial = runSweep(m, *c->inputs, c->results, spec);
  spec.jobs = 3;
  const SweepTable threaded = runSweep(m, *c->inputs, c->results, spec);
  REQUIRE(serial.size() == 301);
  REQUIRE(threaded.results.size() == serial.results.size());
  CHECK(std::memcmp(threaded.results.data(), serial.results.data(), serial.results.size() * sizeof(double)) ==
        0);
  CHECK(threaded.check_states == serial.check_states);
  // Against evaluate() of a fresh Inputs layer binding the same SI value.
  for (size_t p = 0; p < serial.size(); p += 37) {
    Inputs point(m, c->inputs.get());
    point.bind(m.find("m_load"), serial.input(p, 0));
    const Results whole = evaluate(m, point);
    for (uint32_t i = 0; i < m.slotCount(); ++i) {
      INFO("point " << p << ", " << m.quantity(Slot(i)).name);
      CHECK(sameBits(serial.result(p, i), whole.values[i]));
    }
    for (size_t k = 0; k < m.checks().size(); ++k)
      CHECK(serial.check(p, k) == (whole.checks[k].passed ? 1 : 0));
  }
}

TEST_CASE("sweep: ranges, lists and grids with units", "[study][sweep]") {
  auto c = test::calc("F = 2 kN\nL = 1 m\nn = 100 rpm\nW [J] = F * L\ncheck c: W <= 3 [kN*m]\n");
  REQUIRE_FALSE(c->hasErrors());
  const StudyRange lin = range(*c, "L=0.5 m..1.5 m", 5);
  REQUIRE(lin.values.size() == 5);
  CHECK(lin.values.front() == 0.5);
  CHECK(lin.values.back() == 1.5);
  CHECK(lin.values[2] == Approx(1.0).epsilon(1e-15));
  const StudyRange lg = range(*c, "L=10 mm..1000 mm", 3, true);
  CHECK(lg.values[0] == 0.01);
  CHECK(lg.values[1] == Approx(0.1).epsilon(1e-14));
  CHECK(lg.values[2] == 1.0);
  const StudyRange list = range(*c, "F=1 kN, 2500 N, 0.5 kN");
  CHECK(list.values == std::vector<double>{1000, 2500, 500});  // in the order written
  const StudyRange speed = range(*c, "n = 60 rpm..120 rpm", 2);
  CHECK(speed.values[0] == Approx(2 * 3.141592653589793).epsilon(1e-15));

  // A grid: the first input varies slowest; the check's state at every point.
  SweepSpec spec;
  spec.vary = {list, lin};
  spec.show = {c->model->find("W")};
  const SweepTable t = runSweep(*c->model, *c->inputs, c->results, spec);
  REQUIRE(t.size() == 15);
  for (size_t p = 0; p < t.size(); ++p) {
    const double w = t.input(p, 0) * t.input(p, 1);
    CHECK(t.result(p, 0) == Approx(w).epsilon(1e-15));
    CHECK(t.check(p, 0) == (w <= 3000 ? 1 : 0));
  }
  CHECK(t.input(1, 0) == 1000);
  CHECK(t.input(1, 1) == lin.values[1]);
  CHECK(t.input(5, 0) == 2500);
}

TEST_CASE("sweep: text, CSV and SVG show the values, the units and the failing checks", "[study][sweep]") {
  const std::string dir = test::tempDir();
  test::writeFile(dir + "/s.calc", "F = 2 kN\nL = 1 m\nW [J] = F * L\ncheck limit: W <= 3 [kN*m]\n");
  const std::string base = "sweep '" + dir + "/s.calc' --vary 'L=1 m..2 m' --steps 5 --show W";
  const test::Run text = test::runCli(base);
  REQUIRE(text.status == 0);
  CHECK(text.out.find("L [m]") != std::string::npos);
  CHECK(text.out.find("W [J]") != std::string::npos);
  CHECK(text.out.find("A check fails at 2 of 5 points: limit (2).") != std::string::npos);
  const test::Run csv = test::runCli(base + " --format csv");
  REQUIRE(csv.status == 0);
  CHECK(csv.out ==
        "L [m],W "
        "[J],limit,error\n1,2000,pass,\n1.25,2500,pass,\n1.5,3000,pass,\n1.75,3500,fail,\n2,4000,fail,\n");
  const test::Run svg = test::runCli(base + " --format svg");
  REQUIRE(svg.status == 0);
  CHECK(svg.out.rfind("<svg ", 0) == 0);
  CHECK(svg.out.find(">L [m]</text>") != std::string::npos);
  CHECK(svg.out.find(">W [J]</text>") != std::string::npos);
  CHECK(svg.out.find("fill-opacity=\"0.15\"") != std::string::npos);  // the failing region, shaded
  CHECK(svg.out.find("a check fails (limit)") != std::string::npos);
  CHECK(svg.out.find("</svg>\n") == svg.out.size() - 7);
  // Two inputs: one line per value of the second, named in the legend.
  const test::Run grid =
      test::runCli("sweep '" + dir + "/s.calc' --vary 'L=1 m..2 m' --vary 'F=1 kN, 2 kN' --show W -f svg");
  REQUIRE(grid.status == 0);
  CHECK(grid.out.find(">F = 1.000 kN</text>") != std::string::npos);
  CHECK(grid.out.find(">F = 2.000 kN</text>") != std::string::npos);
}

TEST_CASE("sweep: shards run by GNU parallel merge into the table one run gives", "[study][sweep][shard]") {
  REQUIRE(std::system("parallel --version >/dev/null 2>&1") == 0);  // Debian package `parallel`
  const std::string dir = test::tempDir();
  const std::string sweep =
      std::string("sweep ") + test::repoPath(kTwin) +
      " --vary 'm_load=2000 kg..9000 kg' --vary 'L_col=500 mm, 650 mm, 900 mm' --steps 15"
      " --show motor.P_motor,screw.n_buckle";
  const test::Run whole = test::runCli(sweep + " --format json -o '" + dir + "/whole.json'");
  REQUIRE(whole.status == 0);
  const std::string cmd = "cd '" + dir + "' && parallel --halt now,fail=1 \"'" +
                          std::string(CALCTRAIL_BINARY) + "' " + sweep +
                          " --format json --shard {}/4 -o shard{}.json\" ::: 1 2 3 4";
  REQUIRE(std::system(cmd.c_str()) == 0);
  const std::string shards =
      dir + "/shard1.json " + dir + "/shard2.json " + dir + "/shard3.json " + dir + "/shard4.json";
  const Json one = parsed(test::readFile(dir + "/shard3.json"));
  CHECK(one["points"].array.size() == 11);  // 45 points, every 4th from the 3rd
  CHECK(one["points"][0]["index"].number == 2);
  const test::Run merged = test::runCli("sweep --merge " + shards + " --format json");
  REQUIRE(merged.status == 0);
  CHECK(merged.out == test::readFile(dir + "/whole.json"));
  const test::Run text = test::runCli("sweep --merge " + shards);
  CHECK(text.out == test::runCli(sweep).out);
  // A shard missing, or given twice: an error, no table.
  const test::Run missing = test::runCli("sweep --merge " + dir + "/shard1.json " + dir + "/shard2.json");
  CHECK(missing.status == 2);
  CHECK(missing.err.find("shard 3/4 is missing") != std::string::npos);
  const test::Run twice = test::runCli("sweep --merge " + dir + "/shard1.json " + dir + "/shard1.json");
  CHECK(twice.err.find("shard 1/4 is given twice") != std::string::npos);
  const test::Run bad = test::runCli("sweep --merge " + test::repoPath("tests/golden/twin-screw-lift.json"));
  CHECK(bad.status == 2);
  CHECK(bad.err.find("not the JSON of a sweep") != std::string::npos);
}

TEST_CASE("sweep: a point that cannot be calculated is shown and named, exit 2", "[study][sweep]") {
  const test::Run r =
      test::runCli(std::string("sweep ") + kTwin + " --vary 'd=40 mm..50 mm' --steps 3 --show screw.p,screw.n_buckle");
  CHECK(r.status == 2);
  CHECK(r.err.find(
            "templates/trapezoidal-screw-stage.calc:19:21: error: at d = 45.00 mm: `screw.p` cannot be calculated: "
            "`trap_pitch`") !=
        std::string::npos);
  CHECK(r.out.find("At d = 45.00 mm: error:") != std::string::npos);
  const test::Run j =
      test::runCli(std::string("sweep ") + kTwin + " --vary 'd=40 mm..50 mm' --steps 3 --show screw.p -f json");
  const Json doc = parsed(j.out);
  CHECK(doc["points"][1]["results"]["screw.p"]["si"].type == Json::Null);
  CHECK(doc["points"][1]["checks"]["screw.buckling"].type == Json::Null);
  CHECK(doc["points"][1]["error"].string.find("not a size of the ISO 2904") != std::string::npos);
  CHECK(doc["points"][0]["checks"]["screw.buckling"].boolean == false);
  CHECK(doc["points"][2]["checks"]["screw.buckling"].boolean == true);
}

TEST_CASE("sweep: bad studies are errors, exit 2", "[study][sweep][diagnostics]") {
  const std::string w = std::string("sweep ") + kTwin;
  struct Case {
    std::string args, message;
  };
  const Case cases[] = {
      {" --vary 'F=1 kN..2 kN' --show motor.P_motor",
       "--vary:1:1: error: `F` is calculated from other quantities, not a given value"},
      {" --vary 'm_lod=1 kg..2 kg' --show motor.P_motor", "no quantity `m_lod`; did you mean `m_load`?"},
      {" --vary 'm_load=1 kN..2 kN' --show motor.P_motor",
       "`m_load` is mass (kg) in the worksheet, but `1 kN` is force (N)"},
      {" --vary 'm_load=2 kg..2 kg' --show motor.P_motor", "it holds one value"},
      {" --vary 'm_load=1 kg..2 kg' --steps 1 --show motor.P_motor", "a range needs 2 points or more"},
      {" --vary 'm_load=1 kg..' --show motor.P_motor", "a range needs a value at both ends"},
      {" --vary 'm_load=1 kg, ' --show motor.P_motor", "an empty value in the list"},
      {" --vary 'm_load=0 kg..2 kg' --log --show motor.P_motor", "--log steps need both ends of one sign"},
      {" --vary 'm_load=L_col' --show motor.P_motor", "not a formula reading `L_col`"},
      {" --vary 'm_load=1 kg..2 kg' --show motor.P_motr", "did you mean `motor.P_motor`"},
      {" --vary 'm_load=1 kg..2 kg'", "sweep needs --show"},
      {" --vary 'm_load=1 kg..2 kg' --show motor.P_motor --shard 3/2", "--shard takes K/N"},
      {" --vary 'm_load=1 kg..2 kg' --vary 'm_load=1 kg, 3 kg' --show motor.P_motor", "`m_load` is varied twice"},
      {" --vary 'm_load=1 kg..2 kg' --show motor.P_motor --format html", "html not in"},
      {" --vary 'm_load=1 kg..2 kg' --vary 'L_col=1 m..2 m' --steps 10000000 --show motor.P_motor",
       "at most 10000000 points a run"},
  };
  for (const Case& c : cases) {
    const test::Run r = test::runCli(w + c.args);
    INFO(c.args << "\n" << r.err);
    CHECK(r.status == 2);
    CHECK(r.err.find(c.message) != std::string::npos);
    CHECK(r.out.empty());
  }
}
