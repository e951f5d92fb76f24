// The fuzz invariants (tests/fuzz/invariants.h) in every ordinary test run:
// each input the fuzzers once broke (tests/fuzz/regressions/), each demo
// worksheet and each worksheet example of the docs; and the dictionary kept
// in step with the unit table and the function library. docs/fuzzing.md.
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <set>
#include <sstream>

#include "engine/eval/math_functions.h"
#include "engine/units/unit_table.h"
#include "functions/function_decl.h"
#include "tests/fuzz/invariants.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

std::vector<std::string> filesIn(const std::string& relative_dir, const std::string& extension) {
  std::vector<std::string> out;
  for (const auto& entry : std::filesystem::directory_iterator(repoPath(relative_dir)))
    if (entry.is_regular_file() && entry.path().extension() == extension)
      out.push_back(entry.path().string());
  std::sort(out.begin(), out.end());
  return out;
}

std::string baseName(const std::string& path) { return std::filesystem::path(path).filename().string(); }

void holdsEveryInvariant(const std::string& name, const std::string& bytes) {
  INFO(name);
  CHECK(fuzz::pipelineHolds(bytes) == "");
  CHECK(fuzz::formatRoundTripHolds(bytes) == "");
  CHECK(fuzz::selfDiffHolds(bytes) == "");
  CHECK(fuzz::expectationHolds(bytes) == "");
}

// The ```calc blocks of a Markdown file.
std::vector<std::string> calcBlocks(const std::string& markdown) {
  std::vector<std::string> blocks;
  std::istringstream in(markdown);
  std::string line, block;
  bool inside = false;
  while (std::getline(in, line)) {
    if (!inside && line == "```calc") {
      inside = true;
      block.clear();
    } else if (inside && line == "```") {
      inside = false;
      blocks.push_back(block);
    } else if (inside) {
      block += line + "\n";
    }
  }
  return blocks;
}

// The values of a libFuzzer dictionary: "..." per line, with \\, \" and \xNN.
std::set<std::string> dictionaryValues(const std::string& text) {
  std::set<std::string> values;
  std::istringstream in(text);
  std::string line;
  while (std::getline(in, line)) {
    const size_t open = line.find('"'), close = line.rfind('"');
    if (line.empty() || line[0] == '#' || open == std::string::npos || close <= open) continue;
    std::string v;
    for (size_t i = open + 1; i < close; ++i) {
      if (line[i] != '\\' || i + 1 >= close) {
        v += line[i];
      } else if (line[i + 1] == 'x' && i + 3 < close) {
        v += static_cast<char>(std::stoi(line.substr(i + 2, 2), nullptr, 16));
        i += 3;
      } else {
        v += line[++i];
      }
    }
    values.insert(v);
  }
  return values;
}

}  // namespace

TEST_CASE("Every fuzz regression input holds every invariant", "[fuzz]") {
  const auto sheets = filesIn("tests/fuzz/regressions", ".calc");
  // The reproducers of the hardening audit, one file each (docs/fuzzing.md).
  CHECK(sheets.size() >= 15);
  for (const std::string& path : sheets) holdsEveryInvariant(baseName(path), readFile(path));
  for (const std::string& path : filesIn("tests/fuzz/regressions", ".unit")) {
    INFO(baseName(path));
    CHECK(fuzz::unitParserHolds(readFile(path)) == "");
  }
}

TEST_CASE("Every demo worksheet and docs example holds every invariant", "[fuzz]") {
  const auto sheets = filesIn("worksheets", ".calc");
  REQUIRE(sheets.size() >= 3);
  for (const std::string& path : sheets) holdsEveryInvariant(baseName(path), readFile(path));
  for (const std::string& path : filesIn("docs", ".md")) {
    const auto blocks = calcBlocks(readFile(path));
    for (size_t i = 0; i < blocks.size(); ++i)
      holdsEveryInvariant(baseName(path) + " example " + std::to_string(i + 1), blocks[i]);
  }
}

TEST_CASE("Every unit name and alias holds the unit parser invariant", "[fuzz]") {
  for (const UnitDef& u : unitTable()) {
    for (const std::string& spelling : [&] {
           const std::string name(u.name);
           std::vector<std::string> all = {name, "1/" + name, name + "^2", name + "*s"};
           all.insert(all.end(), u.aliases.begin(), u.aliases.end());
           return all;
         }()) {
      INFO(spelling);
      CHECK(fuzz::unitParserHolds(spelling) == "");
    }
  }
  CHECK(fuzz::unitParserHolds("") == "");
  CHECK(fuzz::unitParserHolds(std::string("N\0m", 3)) == "");
  CHECK(fuzz::unitParserHolds("((((((((m))))))))^12") == "");
}

TEST_CASE("The fuzz invariants let through the words an input itself holds", "[fuzz]") {
  // A quantity may be called `inf` or `nan`; only a number the engine made
  // that way is a fault.
  const std::string sheet = "inf = 1  # nan, inf and NaN as words\nnan = inf * 2\ncheck c: nan > inf\n";
  CHECK(fuzz::pipelineHolds(sheet) == "");
  CHECK(fuzz::formatRoundTripHolds(sheet) == "");
  CHECK(fuzz::selfDiffHolds(sheet) == "");
}

TEST_CASE("The fuzz expectation line is held", "[fuzz]") {
  CHECK(fuzz::expectationHolds("x = 1\n") == "");
  CHECK(fuzz::expectationHolds("# fuzz-expect: clean\nx = 1\n") == "");
  CHECK(fuzz::expectationHolds("# fuzz-expect: error unknown\nx = y\n") == "");
  CHECK(fuzz::expectationHolds("# fuzz-expect: diagnostic\nx = y\n") == "");
  CHECK(fuzz::expectationHolds("# fuzz-expect: error\nx = 1\n") == "expected an error, got none");
  const std::string unmet_clean = fuzz::expectationHolds("# fuzz-expect: clean\nx = y\n");
  CHECK(unmet_clean.rfind("expected no error, got: fuzz.calc:2:", 0) == 0);
  const std::string unmet_text = fuzz::expectationHolds("# fuzz-expect: error no such words\nx = y\n");
  CHECK(unmet_text.find("saying \"no such words\"") != std::string::npos);
  CHECK(fuzz::expectationHolds("# fuzz-expect: maybe\nx = 1\n") == "unknown expectation `maybe`");
}

TEST_CASE("The fuzz dictionary lists every unit and function", "[fuzz]") {
  const std::set<std::string> dict = dictionaryValues(readFile(repoPath("tests/fuzz/calc.dict")));
  for (const UnitDef& u : unitTable()) {
    CHECK(dict.count(std::string(u.name)) == 1);
    for (std::string_view a : u.aliases) {
      INFO("alias of " << u.name);
      CHECK(dict.count(std::string(a)) == 1);
    }
  }
  for (const MathFunction& f : mathFunctions()) CHECK(dict.count(std::string(f.name) + "(") == 1);
  for (const FunctionDecl& f : functionLibrary()) CHECK(dict.count(std::string(f.name) + "(") == 1);
  for (const char* keyword : {"check ", "section ", "note ", "title:", "pi", "<=", ">="})
    CHECK(dict.count(keyword) == 1);
}
