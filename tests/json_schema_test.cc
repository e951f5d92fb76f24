// The report's JSON against its documented schema (docs/trail.schema.json),
// for every demo worksheet. The validator below covers the keywords that
// schema uses: type, const, enum, required, properties,
// additionalProperties (false, or a schema for every other key: the load
// cases by name), items, minLength and pattern; a type may be a list.
#include <catch2/catch.hpp>

#include <regex>

#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

bool hasType(const Json& v, const std::string& type) {
  if (type == "object") return v.type == Json::Object;
  if (type == "array") return v.type == Json::Array;
  if (type == "string") return v.type == Json::String;
  if (type == "boolean") return v.type == Json::Bool;
  if (type == "number") return v.type == Json::Number;
  if (type == "integer")
    return v.type == Json::Number && v.number == static_cast<double>(static_cast<long long>(v.number));
  if (type == "null") return v.type == Json::Null;
  return false;
}

bool equal(const Json& a, const Json& b) {
  if (a.type != b.type) return false;
  switch (a.type) {
    case Json::Null: return true;
    case Json::Bool: return a.boolean == b.boolean;
    case Json::Number: return a.number == b.number;
    case Json::String: return a.string == b.string;
    default: return false;  // the schema compares scalars only
  }
}

void validate(const Json& schema, const Json& v, const std::string& path, std::vector<std::string>* errors) {
  static const std::vector<std::string> known = {"$schema",  "$id",        "title",
                                                 "type",     "const",      "enum",
                                                 "required", "properties", "additionalProperties",
                                                 "items",    "minLength",  "pattern"};
  for (const auto& [key, value] : schema.object) {
    (void)value;
    if (std::find(known.begin(), known.end(), key) == known.end())
      errors->push_back(path + ": the schema uses `" + key + "`, which this validator does not know");
  }
  if (schema.has("type")) {
    // One type, or a list of them ("utilisation": ["number", "null"]).
    const Json& type = schema["type"];
    bool any = type.type == Json::String && hasType(v, type.string);
    std::string names = type.type == Json::String ? type.string : "";
    for (const Json& t : type.array) {
      any |= hasType(v, t.string);
      names += (names.empty() ? "" : " or ") + t.string;
    }
    if (!any) {
      errors->push_back(path + ": expected " + names);
      return;
    }
  }
  if (schema.has("const") && !equal(schema["const"], v)) errors->push_back(path + ": not the constant");
  if (schema.has("enum")) {
    bool any = false;
    for (const Json& e : schema["enum"].array) any |= equal(e, v);
    if (!any) errors->push_back(path + ": not one of the enumerated values");
  }
  if (v.type == Json::String) {
    if (schema.has("minLength") && v.string.size() < static_cast<size_t>(schema["minLength"].number))
      errors->push_back(path + ": too short");
    if (schema.has("pattern") && !std::regex_search(v.string, std::regex(schema["pattern"].string)))
      errors->push_back(path + ": does not match " + schema["pattern"].string + ": " + v.string);
  }
  if (v.type == Json::Object) {
    if (schema.has("required"))
      for (const Json& r : schema["required"].array)
        if (!v.has(r.string)) errors->push_back(path + ": missing `" + r.string + "`");
    for (const auto& [key, value] : v.object) {
      if (schema.has("properties") && schema["properties"].has(key)) {
        validate(schema["properties"][key], value, path + "." + key, errors);
      } else if (schema.has("additionalProperties") && schema["additionalProperties"].type == Json::Object) {
        validate(schema["additionalProperties"], value, path + "." + key, errors);
      } else if (schema.has("additionalProperties") && !schema["additionalProperties"].boolean) {
        errors->push_back(path + ": `" + key + "` is not in the schema");
      }
    }
  }
  if (v.type == Json::Array && schema.has("items"))
    for (size_t i = 0; i < v.array.size(); ++i)
      validate(schema["items"], v.array[i], path + "[" + std::to_string(i) + "]", errors);
}

Json load(const std::string& text) {
  Json j;
  std::string error;
  INFO(error);
  REQUIRE(parseJson(text, &j, &error));
  return j;
}

}  // namespace

TEST_CASE("the JSON of every demo worksheet follows docs/trail.schema.json", "[json][schema]") {
  const Json schema = load(readFile(repoPath("docs/trail.schema.json")));
  for (const char* sheet : {"canal-gate-hoist", "leveling-jack", "twin-screw-lift", "bearing-press", "ball-screw-axis"}) {
    const std::string path = std::string("worksheets/") + sheet + ".calc";
    Run r = runCli("report " + path + " --format json");
    INFO(path << "\n" << r.err);
    REQUIRE(r.status == 0);
    const Json out = load(r.out);
    std::vector<std::string> errors;
    validate(schema, out, "$", &errors);
    std::string all;
    for (const auto& e : errors) all += e + "\n";
    INFO(all);
    CHECK(errors.empty());
    CHECK(out["quantities"].array.size() > 10);
  }
}

TEST_CASE("the schema validator itself rejects what it should", "[json][schema]") {
  const Json schema = load(R"({"type":"object","additionalProperties":false,"required":["a"],
    "properties":{"a":{"type":"integer"},"b":{"enum":["x","y"]},
    "c":{"type":"string","pattern":"^[0-9a-f]{4}$"}}})");
  std::vector<std::string> errors;
  validate(schema, load(R"({"a":1,"b":"x","c":"00ff"})"), "$", &errors);
  CHECK(errors.empty());
  validate(schema, load(R"({"a":1.5,"b":"z","c":"zz","d":0})"), "$", &errors);
  CHECK(errors.size() == 4);
  errors.clear();
  validate(schema, load(R"({"b":"x"})"), "$", &errors);
  CHECK(errors == std::vector<std::string>{"$: missing `a`"});
  errors.clear();
  const Json either = load(R"({"type":["number","null"]})");
  validate(either, load("null"), "$", &errors);
  validate(either, load("0.5"), "$", &errors);
  CHECK(errors.empty());
  validate(either, load(R"("0.5")"), "$", &errors);
  CHECK(errors == std::vector<std::string>{"$: expected number or null"});
}

TEST_CASE("a --set run's JSON follows the schema and lists every replacement", "[json][schema]") {
  const Json schema = load(readFile(repoPath("docs/trail.schema.json")));
  Run r =
      runCli("report worksheets/twin-screw-lift.calc --format json --set \"f_run=0.10\" --set \"d=52 mm\"");
  INFO(r.err);
  REQUIRE(r.status == 0);
  const Json out = load(r.out);
  std::vector<std::string> errors;
  validate(schema, out, "$", &errors);
  std::string all;
  for (const auto& e : errors) all += e + "\n";
  INFO(all);
  CHECK(errors.empty());
  // In worksheet order, each as typed after `=`.
  REQUIRE(out["modified_by"].array.size() == 2);
  CHECK(out["modified_by"][0]["name"].string == "d");
  CHECK(out["modified_by"][0]["value"].string == "52 mm");
  CHECK(out["modified_by"][1]["name"].string == "f_run");
  CHECK(out["modified_by"][1]["value"].string == "0.10");
  CHECK(out["modified_notice"].string.rfind("MODIFIED: ", 0) == 0);
  CHECK(out["sign_off"].string.find("AS MODIFIED by --set d=52 mm, --set f_run=0.10") != std::string::npos);
  // Utilisation per check: demand over capacity, null where a side is not above zero.
  for (const Json& c : out["checks"].array) {
    INFO(c["name"].string);
    if (c["name"].string == "screw.self_locking") CHECK(c["utilisation"].type == Json::Null);
    else CHECK(c["utilisation"].type == Json::Number);
  }
}

TEST_CASE("JSON numbers are the calculation's doubles, bit for bit", "[json][schema]") {
  for (const char* sheet : {"canal-gate-hoist", "leveling-jack", "twin-screw-lift", "bearing-press", "ball-screw-axis"}) {
    const std::string path = std::string("worksheets/") + sheet + ".calc";
    calctrail::CalcOptions options;
    options.source_path = repoPath(path);  // its templates are found beside it, from any folder
    auto c = calctrail::Calculation::fromText(path, readFile(repoPath(path)), options);
    REQUIRE_FALSE(c->hasErrors());
    Run r = runCli("report " + path + " --format json");
    REQUIRE(r.status == 0);
    const Json out = load(r.out);
    REQUIRE(out["quantities"].array.size() == c->quantityCount());
    for (size_t i = 0; i < c->quantityCount(); ++i) {
      INFO(path << ": " << out["quantities"][i]["name"].string);
      CHECK(out["quantities"][i]["si"].number == c->si(i));
      CHECK(out["quantities"][i]["value"].number == c->display(i).fromSI(c->si(i)));
    }
    for (size_t k = 0; k < c->checkCount(); ++k) {
      CHECK(out["checks"][k]["lhs_si"].number == c->checkResult(k).lhs);
      CHECK(out["checks"][k]["rhs_si"].number == c->checkResult(k).rhs);
    }
  }
}

TEST_CASE("check --format json follows docs/check.schema.json", "[json][schema][check]") {
  const Json schema = load(readFile(repoPath("docs/check.schema.json")));
  const std::string dir = tempDir();
  writeFile(dir + "/broken.calc", "a = 1 +\nb [mm] = 2 kg\ncheck c: b < 1 mm\n");
  // Passing, failing on purpose, a parse error, load cases, templates.
  const std::string files = "worksheets/canal-gate-hoist.calc worksheets/press-overload-fails.calc '" + dir +
                            "/broken.calc' worksheets/bearing-press.calc worksheets/platform-lift.calc";
  Run r = runCli("check " + files + " --format json");
  INFO(r.out << r.err);
  CHECK(r.status == 2);
  const Json out = load(r.out);
  std::vector<std::string> errors;
  validate(schema, out, "$", &errors);
  std::string all;
  for (const auto& e : errors) all += e + "\n";
  INFO(all);
  CHECK(errors.empty());
  REQUIRE(out["files"].array.size() == 5);
  const Json& fails = out["files"][1];
  CHECK(fails["path"].string == "worksheets/press-overload-fails.calc");
  REQUIRE(fails["failed"].array.size() == 1);
  CHECK(fails["failed"][0]["name"].string == "nut_pressure");
  CHECK(fails["failed"][0]["case"].string == "nominal");
  CHECK(fails["failed"][0]["line"].number == 28);
  CHECK(fails["failed"][0]["col"].number == 7);
  // The text is the line the text format prints.
  const Run text = runCli("check worksheets/press-overload-fails.calc -q");
  CHECK(text.out == fails["failed"][0]["text"].string + "\n");
  const Json& broken = out["files"][2];
  CHECK_FALSE(broken["evaluated"].boolean);
  REQUIRE(broken["errors"].array.size() == 2);
  CHECK(broken["errors"][0]["line"].number == 1);
  CHECK(broken["errors"][0]["col"].number == 7);
  CHECK(broken["errors"][1]["message"].string.find("length (mm)") != std::string::npos);
  CHECK(broken["errors_count"].number == 2);
  // bearing-press: 5 checks in the nominal and 3 cases, every one passing.
  CHECK(out["files"][3]["checks_passed"].number == 20);
  CHECK(out["files"][3]["checks_failed"].number == 0);
  CHECK(out["files"][4]["evaluated"].boolean);
  // The totals are the sums of the files.
  double passed = 0, failed = 0, errs = 0;
  for (const Json& f : out["files"].array) {
    passed += f["checks_passed"].number;
    failed += f["checks_failed"].number;
    errs += f["errors_count"].number;
    CHECK(f["checks_failed"].number == static_cast<double>(f["failed"].array.size()));
  }
  CHECK(out["totals"]["checks_passed"].number == passed);
  CHECK(out["totals"]["checks_failed"].number == failed);
  CHECK(out["totals"]["errors"].number == errs);
  CHECK(out["totals"]["files"].number == 5);
  CHECK(out["totals"]["files_with_errors"].number == 1);
  CHECK(out["exit_status"].number == 2);
  // The errors still go to standard error, as the contract's diagnostics.
  CHECK(r.err.find("broken.calc:1:7: error: ") != std::string::npos);
}

TEST_CASE("check --format json of a failing case names the case", "[json][schema][check]") {
  const Json schema = load(readFile(repoPath("docs/check.schema.json")));
  // 30 % over the rated force: only the motor in the high-friction case is overloaded.
  Run r = runCli("check worksheets/bearing-press.calc --set \"k_load=1.3\" --format json");
  INFO(r.out << r.err);
  REQUIRE(r.status == 1);
  const Json out = load(r.out);
  std::vector<std::string> errors;
  validate(schema, out, "$", &errors);
  CHECK(errors.empty());
  REQUIRE(out["files"][0]["failed"].array.size() == 1);
  const Json& motor = out["files"][0]["failed"][0];
  CHECK(motor["name"].string == "motor");
  CHECK(motor["case"].string == "friction_high");
  CHECK(motor["message"].string.find("fails in case friction_high: ") != std::string::npos);
  CHECK(out["files"][0]["checks_passed"].number == 19);
}
