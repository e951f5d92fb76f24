// The study line of a worksheet (`study NAME: sweep ...`, `study NAME:
// capacity ...`): its errors at their columns, its canonical form, what the
// report shows, and the values against independent ones: a sweep point is
// the --set run of the same value bit for bit, and the capacity of the
// ball-screw demo is the move time its closed form gives.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>

#include "engine/report/trail.h"
#include "engine/review/sheet_format.h"
#include "engine/study/series.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

const char* const kSheet =
    "F = 2 kN            # load\n"
    "k = 0.5 [N*m/kN]    # torque per load\n"
    "T [N*m] = k * F     # torque\n"
    "check torque: T <= 2 [N*m]\n";

// The diagnostics of `sheet` with `line` added, as `check` prints them.
std::string errorsWith(const std::string& line) {
  const std::string dir = tempDir();
  writeFile(dir + "/s.calc", std::string(kSheet) + line + "\n");
  const Run r = runCliIn(dir, "check s.calc");
  CHECK(r.status == 2);
  return r.err;
}

Json load(const std::string& text) {
  Json j;
  std::string error;
  INFO(text);
  REQUIRE(parseJson(text, &j, &error));
  return j;
}

bool sameBits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

}  // namespace

TEST_CASE("study line: each problem an error at its column", "[study][sheet]") {
  // Line 5 is the study line; columns count from 1.
  CHECK_THAT(errorsWith("study s: sweep G = 1 kN..3 kN, show T"),
             Catch::Contains("s.calc:5:16: error: the worksheet defines no quantity `G`"));
  CHECK_THAT(errorsWith("study s: sweep T = 1 [N*m]..3 [N*m], show T"),
             Catch::Contains("s.calc:5:16: error: `T` is calculated from other quantities, not a given value"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 m..3 kN, show T"),
             Catch::Contains("s.calc:5:20: error: `F` is force (N) in the worksheet, but `1 m` is length"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..1 kN, show T"),
             Catch::Contains("s.calc:5:20: error: the range starts and ends at 1.000 kN: it has no points"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN, 1 points, show T"),
             Catch::Contains("s.calc:5:32: error: a range has no points between its ends with `1 points`"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN, 1001 points, show T"),
             Catch::Contains("s.calc:5:32: error: a study in a worksheet has at most 1000 points"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN, show U"),
             Catch::Contains("s.calc:5:37: error: the worksheet defines no quantity `U` to show"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN, show torque"),
             Catch::Contains("`torque` is a check: a sweep shows every check at every point"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN"),
             Catch::Contains("s.calc:5:29: error: the sweep `s` needs the results it shows"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN, 2 kN, 5 points, show T"),
             Catch::Contains("s.calc:5:32: error: a list of values has as many points as values"));
  CHECK_THAT(errorsWith("study s: spread F = 1 kN..3 kN, show T"),
             Catch::Contains("s.calc:5:10: error: `spread` is not a kind of study"));
  CHECK_THAT(errorsWith("study s: capacity F = 1 kN..3 kN"),
             Catch::Contains("s.calc:5:32: error: a capacity ends with `, largest` or `, smallest`"));
  CHECK_THAT(errorsWith("study s: capacity F = 3 kN..1 kN, largest"),
             Catch::Contains("s.calc:5:23: error: the bracket is empty"));
  CHECK_THAT(errorsWith("study s: sweep F = -1 kN..1 kN, 5 points log-spaced, show T"),
             Catch::Contains("s.calc:5:33: error: log-spaced points need both ends of one sign"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN, show T, T"),
             Catch::Contains("s.calc:5:40: error: the study `s` shows `T` twice"));
  CHECK_THAT(errorsWith("study s: sweep F = 1 kN..3 kN, show T\nstudy s: sweep F = 1 kN..3 kN, show T"),
             Catch::Contains("s.calc:6:7: error: the study `s` is defined twice; the first is on line 5"));
  // A quantity may still be called `study`.
  const std::string dir = tempDir();
  writeFile(dir + "/q.calc", "study = 3\nx = 2 * study\n");
  CHECK(runCliIn(dir, "check q.calc").status == 0);
}

TEST_CASE("study line: fmt writes it canonically and reads it back the same", "[study][sheet][review]") {
  Diagnostics diags;
  const std::string out = formatWorksheet(
      "s.calc",
      std::string(kSheet) +
          "study a:sweep F=1 [kN]..3 kN ,5 points   log-spaced,show T  # the sweep\n"
          "study b:   capacity F = 1 kN .. 9 kN,largest\n"
          "study c: sweep F = 1 kN,2 kN , show T,k\n"
          "study d: capacity F = 0. ..3 kN, smallest\n"
          "study e:pick F   from 3 kN,1 [kN]\n"
          "study f: pick F from   motor_outputs # a series\n",
      &diags);
  INFO((diags.list().empty() ? std::string() : diags.list().front().message));
  REQUIRE_FALSE(diags.hasErrors());
  // Descriptions are aligned in one column: each line is checked up to its description.
  for (const char* line : {"\nstudy a: sweep F = 1 kN..3 kN, 5 points log-spaced, show T  # the sweep\n",
                           "\nstudy b: capacity F = 1 kN..9 kN, largest\n",
                           "\nstudy c: sweep F = 1 kN, 2 kN, show T, k\n",
                           // The number's own dot stays apart from the range's `..`.
                           "\nstudy d: capacity F = 0. ..3 kN, smallest\n", "\nstudy e: pick F from 3 kN, 1 kN\n",
                           "\nstudy f: pick F from motor_outputs "}) {
    CHECK_THAT(out, Catch::Contains(line));
  }
  Diagnostics again;
  CHECK(formatWorksheet("s.calc", out, &again) == out);
}

TEST_CASE("study line: diff names a study changed, added or removed", "[study][sheet][review]") {
  const std::string dir = tempDir();
  writeFile(dir + "/a.calc", std::string(kSheet) + "study s: sweep F = 1 kN..3 kN, show T\n"
                                                   "study old: capacity F = 1 kN..9 kN, largest\n");
  writeFile(dir + "/b.calc", std::string(kSheet) + "study s: sweep F = 1 kN..5 kN, 9 points, show T\n");
  const Run r = runCliIn(dir, "diff a.calc b.calc");
  INFO(r.out << r.err);
  CHECK_THAT(r.out, Catch::Contains("study s\n    was  study s: sweep F = 1 kN..3 kN, show T\n"
                                    "    now  study s: sweep F = 1 kN..5 kN, 9 points, show T\n"));
  CHECK_THAT(r.out, Catch::Contains("study old\n    was  study old: capacity F = 1 kN..9 kN, largest\n"
                                    "    now  (removed)\n"));
}

TEST_CASE("study line: a sweep point of the report is the --set run of its value, bit for bit",
          "[study][sheet][report]") {
  const std::string dir = tempDir();
  writeFile(dir + "/s.calc", std::string(kSheet) + "study s: sweep F = 1 kN..5 kN, 5 points, show T\n");
  const Run r = runCliIn(dir, "report s.calc --format json");
  REQUIRE(r.status == 0);
  const Json j = load(r.out);
  const Json& points = j["studies"][0]["points"];
  REQUIRE(points.array.size() == 5);
  for (size_t p = 0; p < 5; ++p) {
    const std::string value = std::to_string(p + 1) + " kN";
    const Run one = runCliIn(dir, "report s.calc --format json --set 'F=" + value + "'");
    REQUIRE(one.status == 0);
    const Json o = load(one.out);
    double t_si = NAN;
    for (const Json& q : o["quantities"].array)
      if (q["name"].string == "T") t_si = q["si"].number;
    INFO(value);
    CHECK(sameBits(points[p]["inputs"]["F"]["si"].number, static_cast<double>(p + 1) * 1000.0));
    CHECK(sameBits(points[p]["results"]["T"]["si"].number, t_si));
    // T = 0.5 N*m per kN: the check T <= 2 N*m passes up to 4 kN.
    CHECK(points[p]["checks"]["torque"].boolean == (p + 1 <= 4));
  }
  CHECK(j["studies"][0]["summary"].string == "A check fails at 1 of 5 points: torque (1).");
  // The text trail shows the same table.
  const Run text = runCliIn(dir, "report s.calc");
  CHECK_THAT(text.out, Catch::Contains("STUDIES\n-------\n  s  sweep F = 1 kN..5 kN, 5 points, show T\n"));
  CHECK_THAT(text.out, Catch::Contains("5.000    2.500  FAIL"));
}

TEST_CASE("study line: the ball-screw demo's shortest move is the closed form's", "[study][sheet][report]") {
  const std::string display = "worksheets/ball-screw-axis.calc";
  auto calc = Calculation::fromText(display, readFile(repoPath(display)));
  REQUIRE_FALSE(calc->hasErrors());
  const Trail t = buildTrail(*calc, 4);
  REQUIRE(t.studies.size() == 2);
  const TrailStudy& fastest = t.studies[1];
  REQUIRE(fastest.solved);
  CHECK(fastest.limiting_check == "motor_speed");
  // Independently: the motor reaches its rated 3000 rpm (the check motor_speed,
  // n_motor <= n_rated) at a screw speed of 3000 rpm / i_belt = 1500 rpm = 25
  // rev/s, a top speed of 25 rev/s * 20 mm/rev = 0.5 m/s; a trapezoidal move of
  // s = 0.3 m with ramps t_acc = 0.15 s has top speed s / (t_move - t_acc)
  // (equal ramps, from its area), so t_move = 0.3 / 0.5 + 0.15 = 0.75 s.
  CHECK(fastest.value.si == Approx(0.75).epsilon(1e-9));
  CHECK(fastest.value.si >= 0.75 - 1e-12);  // the passing side of the limit
  const TrailStudy& sweep = t.studies[0];
  REQUIRE(sweep.rows.size() == 8);
  CHECK(sweep.header.front() == "t_move [s]");
  CHECK(sweep.summary == "A check fails at 3 of 8 points: motor_speed (3), life (1).");
  // The plot: one panel per shown result, its failing region shaded.
  CHECK_THAT(sweep.svg, Catch::Contains(">T_rms [N*m]<"));
  CHECK_THAT(sweep.svg, Catch::Contains("shaded: a check fails (motor_speed, life)"));
}

TEST_CASE("study line: pick from a series is the smallest size a brute force over the table finds",
          "[study][sheet][report]") {
  const std::string display = "docs/studies/screw-clamp.calc";
  const std::string text = readFile(repoPath(display)) +
                           "study screw: pick d from trapezoidal\n"
                           "study motor: pick T_motor from 3.5 [N*m], 1.2 [N*m], 2.6 [N*m], 1.8 [N*m]\n";
  auto calc = Calculation::fromText(display, text);
  REQUIRE_FALSE(calc->hasErrors());
  const Trail t = buildTrail(*calc, 4);
  REQUIRE(t.studies.size() == 2);
  const TrailStudy& screw = t.studies[0];
  CHECK(screw.kind == "pick");
  REQUIRE(screw.chosen >= 0);
  // Brute force: every size of the ISO 2904 table in turn, each calculated on
  // its own with --set, until one passes every check.
  const std::vector<double>& sizes = *findSeries("trapezoidal")->values;
  const std::string dir = tempDir();
  writeFile(dir + "/clamp.calc", readFile(repoPath(display)));
  double smallest = NAN;
  for (double d : sizes) {
    const Run r = runCliIn(dir, "check clamp.calc --set 'd=" + fmt::format("{}", d * 1000) + " mm'");
    if (r.status == 0) {
      smallest = d;
      break;
    }
  }
  CHECK(screw.value.si == smallest);
  CHECK(screw.value.si == 0.014);  // docs/studies.md, `pick`: Tr 14
  CHECK(screw.tried.size() == static_cast<size_t>(screw.chosen) + 1);
  CHECK(screw.rows.back()[1] == "passes, chosen");
  CHECK(screw.rows.front()[1] == "fails: strength, nut_pressure");
  // A list is tried in ascending order, whatever the order written.
  const TrailStudy& motor = t.studies[1];
  REQUIRE(motor.chosen == 2);
  CHECK(motor.value.si == 2.6);
  CHECK(motor.summary == "T_motor = 2.600 N·m: the smallest of the values given for which every check passes.");

  CHECK_THAT(errorsWith("study s: pick F from trapezoidal"),
             Catch::Contains("s.calc:5:22: error: `F` is force (N) in the worksheet, but the series `trapezoidal` "
                             "holds length"));
  CHECK_THAT(errorsWith("study s: pick F from bolts"),
             Catch::Contains("s.calc:5:22: error: there is no series `bolts` to pick from; the series are "
                             "`trapezoidal`, `acme`, `motor_outputs`"));
  CHECK_THAT(errorsWith("study s: pick F"), Catch::Contains("s.calc:5:15: error: expected `from SERIES`"));
}
