// The command line as the contract fixes it: report, check, --set, formats,
// exit codes (0 good, 1 a check failed, 2 errors or a wrong command line).
#include <catch2/catch.hpp>

#include <sys/stat.h>
#include <sys/wait.h>

#include <cstdlib>

#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail::test;

namespace {
std::string sheetFile(const std::string& text) {
  const std::string path = tempDir() + "/s.calc";
  writeFile(path, text);
  return path;
}
const char* kPassing = "F = 2 kN\nr = 0.1 m\nT [N*m] = F * r   # torque\ncheck t: T < 300 [N*m]\n";
const char* kFailing = "F = 2 kN\nr = 0.1 m\nT [N*m] = F * r   # torque\ncheck t: T < 100 [N*m]   # arm rating\n";
}  // namespace

TEST_CASE("the version and help options", "[cli]") {
  Run v = runCli("--version");
  CHECK(v.status == 0);
  CHECK(v.out.rfind("calctrail ", 0) == 0);
  Run h = runCli("--help");
  CHECK(h.status == 0);
  CHECK(h.out.find("report") != std::string::npos);
  CHECK(h.out.find("check") != std::string::npos);
  CHECK(h.out.find("Exit status") != std::string::npos);
  Run rh = runCli("report --help");
  CHECK(rh.status == 0);
  CHECK(rh.out.find("--set") != std::string::npos);
}

TEST_CASE("a wrong command line exits 2 with a message", "[cli]") {
  for (const char* args : {"", "frobnicate", "report", "report a.calc --format pdf", "report a.calc --digits 0",
                           "check", "report a.calc --bogus"}) {
    INFO(args);
    Run r = runCli(args);
    CHECK(r.status == 2);
    CHECK(!r.err.empty());
  }
}

TEST_CASE("report exits 0 even when a check fails, and the trail shows it", "[cli]") {
  const std::string f = sheetFile(kFailing);
  Run r = runCli("report '" + f + "'");
  CHECK(r.status == 0);
  CHECK(r.out.find("FAIL: 1 of 1 check fails: t") != std::string::npos);
  CHECK(r.out.find("FAIL  t") != std::string::npos);
  CHECK(r.err.empty());
}

TEST_CASE("check exits 1 on a failed check and prints one line for it", "[cli]") {
  const std::string pass = sheetFile(kPassing), fail = sheetFile(kFailing);
  Run ok = runCli("check '" + pass + "'");
  CHECK(ok.status == 0);
  CHECK(ok.out == "1 worksheet, 1 check: 0 failed\n");
  Run bad = runCli("check '" + pass + "' '" + fail + "'");
  CHECK(bad.status == 1);
  CHECK(bad.out == fail + ":4:7: error: check `t` fails: 200.0 N·m < 100 N·m is false (arm rating)\n" +
                       "2 worksheets, 2 checks: 1 failed\n");
  Run quiet = runCli("check -q '" + pass + "'");
  CHECK(quiet.out.empty());
}

TEST_CASE("errors exit 2, one line each, all files still checked", "[cli][diagnostics]") {
  const std::string broken = sheetFile("a = 1 m + 1 s\nb = 2 ** 2\n");
  const std::string fail = sheetFile(kFailing);
  Run r = runCli("check '" + broken + "' '" + fail + "' missing.calc");
  CHECK(r.status == 2);
  CHECK(r.err == broken + ":1:5: error: cannot add time (s) to length (mm)\n" + broken +
                     ":2:7: error: `**` is not an operator here; write `^` for a power\n" +
                     "missing.calc:1:1: error: cannot read file: No such file or directory\n");
  CHECK(r.out.find("check `t` fails") != std::string::npos);
  Run report = runCli("report '" + broken + "'");
  CHECK(report.status == 2);
  CHECK(report.out.empty());  // no trail with wrong numbers
  CHECK(report.err.find("    b = 2 ** 2\n          ^~\n") != std::string::npos);
  CHECK(runCli("report missing.calc").status == 2);
  CHECK(runCli("report worksheets").status == 2);  // a directory
}

TEST_CASE("an override with --set changes one run and never the file", "[cli][set]") {
  const std::string f = sheetFile(kPassing);
  const std::string before = readFile(f);
  Run r = runCli("check '" + f + "' --set 'r=0.2 m'");
  CHECK(r.status == 1);  // 2 kN * 0.2 m = 400 N*m > 300 N*m
  Run j = runCli("report '" + f + "' --set 'r = 0.2 m' --format json");
  CHECK(j.status == 0);
  CHECK(j.out.find("\"overridden\": true") != std::string::npos);
  CHECK(readFile(f) == before);
  Run e = runCli("report '" + f + "' --set 'rr=1'");
  CHECK(e.status == 2);
  CHECK(e.err.find("--set:1:1: error: --set: the worksheet defines no quantity `rr`; did you mean `r`?") !=
        std::string::npos);
}

TEST_CASE("the output option writes the trail to a file, and errors leave it untouched", "[cli]") {
  const std::string f = sheetFile(kPassing);
  const std::string out = tempDir() + "/trail.txt";
  Run r = runCli("report '" + f + "' -o '" + out + "'");
  CHECK(r.status == 0);
  CHECK(r.out.empty());
  CHECK(readFile(out).find("T = F · r") != std::string::npos);
  writeFile(out, "old trail\n");
  const std::string broken = sheetFile("a = (\n");
  CHECK(runCli("report '" + broken + "' -o '" + out + "'").status == 2);
  CHECK(readFile(out) == "old trail\n");
}

TEST_CASE("output that cannot be written is an error, not exit 0", "[cli]") {
  // A full disk (/dev/full) cuts the trail off: the run must say so and exit 2.
  const std::string f = sheetFile(kPassing);
  const std::string err = tempDir() + "/stderr";
  for (const char* args : {"report", "report --format json", "check", "functions"}) {
    INFO(args);
    const std::string sub = args;
    const std::string cmd = std::string("'") + CALCTRAIL_BINARY + "' " + sub +
                            (sub == "functions" ? std::string() : " '" + f + "'") + " >/dev/full 2>'" + err + "'";
    const int raw = std::system(cmd.c_str());
    REQUIRE(WIFEXITED(raw));
    CHECK(WEXITSTATUS(raw) == 2);
    CHECK(readFile(err).find("calctrail: error: cannot write standard output") != std::string::npos);
  }
  // The same runs with somewhere to write exit 0.
  CHECK(runCli("report '" + f + "'").status == 0);
}

TEST_CASE("JSON: the contract's minimum, full precision", "[cli][json]") {
  const std::string f = sheetFile("d = 1 in   # size\nA [mm^2] = pi * d^2 / 4\nn = 1450 rpm\nl = 0.2 [in/rev]\nv = n * l\ncheck a: A > 1 [mm^2]\n");
  Run r = runCli("report '" + f + "' --format json");
  REQUIRE(r.status == 0);
  Json j;
  std::string error;
  INFO(r.out);
  REQUIRE(parseJson(r.out, &j, &error));
  REQUIRE(j.has("quantities"));
  REQUIRE(j.has("checks"));
  REQUIRE(j.has("warnings"));
  CHECK(j["warnings"].type == Json::Array);
  const Json& q = j["quantities"];
  REQUIRE(q.array.size() == 5);
  CHECK(q[0]["name"].string == "d");
  CHECK(q[0]["value"].number == 1);
  CHECK(q[0]["unit"].string == "in");
  CHECK(q[0]["si"].number == 0.0254);
  CHECK(q[0]["description"].string == "size");
  CHECK(q[1]["formula"].string == "pi * d^2 / 4");
  CHECK(q[1]["unit"].string == "mm^2");
  // Full precision: pi*25.4^2/4 mm^2, derived independently.
  CHECK(q[1]["value"].number == Approx(M_PI * 25.4 * 25.4 / 4).epsilon(1e-15));
  CHECK(q[1]["si"].number == Approx(M_PI * 0.0254 * 0.0254 / 4).epsilon(1e-15));
  CHECK(q[2]["si"].number == Approx(1450 * 2 * M_PI / 60).epsilon(1e-15));  // rad/s
  CHECK(q[4]["si"].number == Approx(1450 * 0.2 * 0.0254 / 60).epsilon(1e-15));
  CHECK(j["checks"][0]["name"].string == "a");
  CHECK(j["checks"][0]["passed"].boolean == true);
  CHECK(j.has("sha256"));
  CHECK(j["sha256"].string.size() == 64);
}

TEST_CASE("the same input gives the same bytes", "[cli]") {
  const std::string path = "worksheets/canal-gate-hoist.calc";
  Run a = runCli("report " + path);
  Run b = runCli("report " + path);
  REQUIRE(a.status == 0);
  CHECK(a.out == b.out);
  Run c = runCli("report " + path + " --digits 6");
  CHECK(c.out != a.out);
}

TEST_CASE("JSON gives a declared unit as written", "[cli][json]") {
  const std::string f = sheetFile("F = 2 kN\nr = 0.1 m\nT [N\xC2\xB7m] = F * r\n");
  Run r = runCli("report '" + f + "' --format json");
  REQUIRE(r.status == 0);
  Json j;
  std::string error;
  REQUIRE(parseJson(r.out, &j, &error));
  CHECK(j["quantities"][2]["unit"].string == "N\xC2\xB7m");
  CHECK(j["quantities"][2]["value"].number == 200);
  CHECK(j["quantities"][0]["unit"].string == "kN");
}
