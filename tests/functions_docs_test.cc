// The generated listings: docs/functions.md must be what functionsMarkdown()
// makes today, the JSON must parse, and unknown names give "".
#include <catch2/catch.hpp>

#include <cctype>
#include <fstream>
#include <sstream>
#include <string>

#include "functions/function_decl.h"
#include "functions/function_docs.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"


TEST_CASE("docs: docs/functions.md is generated from the declarations and up to date", "[functions][docs]") {
  const std::string path = std::string(CALCTRAIL_SOURCE_DIR) + "/docs/functions.md";
  const std::string on_disk = calctrail::test::readFile(path);
  const bool fresh = on_disk == calctrail::functionsMarkdown();
  if (!fresh)
    FAIL("docs/functions.md is stale (or missing): regenerate it from the declarations with\n"
         "  build/calctrail functions --format md > docs/functions.md");
  CHECK(fresh);
}

TEST_CASE("docs: the markdown has a section per function with its formula and source", "[functions][docs]") {
  const std::string md = calctrail::functionsMarkdown();
  for (const calctrail::FunctionDecl& d : calctrail::functionLibrary()) {
    INFO(d.name);
    CHECK(md.find("\n### " + std::string(d.name) + "\n") != std::string::npos);
    CHECK(md.find(d.source) != std::string::npos);
  }
}

TEST_CASE("docs: the text listing shows every function, one in detail, and nothing for an unknown name",
          "[functions][docs]") {
  const std::string all = calctrail::functionsText();
  for (const calctrail::FunctionDecl& d : calctrail::functionLibrary()) CHECK(all.find(std::string(d.name) + "(") != std::string::npos);
  const std::string one = calctrail::functionsText("torque_raise");
  CHECK_THAT(one, Catch::StartsWith("torque_raise(F, dm, l, f, alpha) -> torque or energy"));
  CHECK_THAT(one, Catch::Contains("Formula: F*dm/2"));
  CHECK_THAT(one, Catch::Contains("length per revolution"));
  CHECK_THAT(one, Catch::Contains("Caution:"));
  CHECK_THAT(calctrail::functionsText("trap_pitch"), Catch::Contains("Method:  table lookup"));
  CHECK(calctrail::functionsText("torque_rise").empty());
}

TEST_CASE("docs: the JSON listing parses, one object per function", "[functions][docs]") {
  using calctrail::test::Json;
  const std::string all = calctrail::functionsJson();
  Json parsed;
  std::string error;
  INFO(error);
  REQUIRE(calctrail::test::parseJson(all, &parsed, &error));
  REQUIRE(parsed.type == Json::Array);
  CHECK(parsed.array.size() == calctrail::functionLibrary().size());
  for (const Json& f : parsed.array) {
    for (const char* key : {"name", "args", "result", "formula", "source", "summary", "limits", "caution"})
      CHECK(f.has(key));
    for (const Json& a : f["args"].array) {
      CHECK(a.has("name"));
      CHECK((a.has("unit") && a.has("dimension")));
    }
  }
  const std::string one = calctrail::functionsJson("thread_lead");
  Json single;
  REQUIRE(calctrail::test::parseJson(one, &single, &error));
  REQUIRE(single.array.size() == 1);
  CHECK(single[0]["args"][0]["per_revolution"].boolean);
  CHECK(calctrail::functionsJson("no_such").empty());
}
