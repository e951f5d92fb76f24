// The CSV report: one row per quantity, a value column per load case, the
// unit in its own column, RFC 4180 quoting and CRLF line ends.
#include <catch2/catch.hpp>

#include "engine/report/csv_renderer.h"
#include "engine/report/formats.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

TEST_CASE("csv: fields with a comma, a quote, CR or LF are quoted, quotes doubled", "[csv]") {
  CHECK(csvField("plain text") == "plain text");
  CHECK(csvField("") == "");
  CHECK(csvField("a,b") == "\"a,b\"");
  CHECK(csvField("say \"hi\"") == "\"say \"\"hi\"\"\"");
  CHECK(csvField("two\nlines") == "\"two\nlines\"");
  CHECK(csvField("cr\rhere") == "\"cr\rhere\"");
  CHECK(csvField("N·m") == "N·m");  // UTF-8 as it is
}

TEST_CASE("csv: a column per case, the unit apart, values in it at full precision, CRLF", "[csv][cases]") {
  auto c = calc(
      "F = 10 kN           # load, \"rated\"\n"
      "f = 0.1\n"
      "T [N*m] = F * f * 20 mm / 3\n"
      "check torque: T <= 80 [N*m]\n"
      "case high: f = 0.15  # dry\n");
  REQUIRE_FALSE(c->hasErrors());
  const std::string csv = renderCsv(buildTrail(*c, 4));
  const std::string table =
      "name,unit,nominal,high,description\r\n"
      "F,kN,10,10,\"load, \"\"rated\"\"\"\r\n"
      "f,1,0.1,0.15,\r\n"
      "T,N*m,6.666666666666667,10,\r\n"
      "check torque,,pass,pass (governing),\r\n";
  CHECK(csv.substr(0, table.size()) == table);
  // After a blank record, what the numbers come from, each record as wide as the table.
  CHECK(csv.substr(table.size()).rfind(",,,,\r\nfile,sheet.calc,,,\r\nsha256," + c->sha256 + ",,,\r\n", 0) == 0);
  CHECK(csv.find("\r\nsign-off,\"The signatures below cover the worksheet with this SHA-256 only.") !=
        std::string::npos);
  CHECK(renderReport(buildTrail(*c, 4), "csv") == csv);
}

TEST_CASE("csv: a sheet without cases has one value column, and --format csv from the CLI", "[csv][cli]") {
  auto c = calc("a = 2 m\nb [mm] = a * 3\ncheck long: b > 1 m\n");
  CHECK(renderCsv(buildTrail(*c, 4)).rfind(
            "name,unit,nominal,description\r\n"
            "a,m,2,\r\n"
            "b,mm,6000,\r\n"
            "check long,,pass,\r\n"
            ",,,\r\n"
            "file,sheet.calc,,\r\n",
            0) == 0);
  Run r = runCli("report worksheets/bearing-press.calc --format csv");
  REQUIRE(r.status == 0);
  CHECK(r.out.rfind("name,unit,nominal,friction_high,friction_low,overload,description\r\n", 0) == 0);
  CHECK(r.out.find("\nF,kN,60,60,60,75,force on the screw\r\n") != std::string::npos);
  Run one = runCli("report worksheets/bearing-press.calc --format csv --case overload");
  CHECK(one.out.rfind("name,unit,overload,description\r\n", 0) == 0);
}
