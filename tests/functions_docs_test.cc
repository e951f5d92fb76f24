// The generated listings: docs/functions.md must be what functionsMarkdown()
// makes today, the JSON must parse, and unknown names give "".
#include <catch2/catch.hpp>

#include <cctype>
#include <fstream>
#include <sstream>
#include <string>

#include "functions/function_decl.h"
#include "functions/function_docs.h"

namespace {

std::string readFile(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

// A strict JSON syntax check (RFC 8259), enough to catch escaping slips.
class JsonCheck {
 public:
  explicit JsonCheck(const std::string& s) : s_(s) {}
  bool valid() {
    ws();
    if (!value()) return false;
    ws();
    return k_ == s_.size();
  }
  int topLevelItems() const { return items_; }

 private:
  void ws() {
    while (k_ < s_.size() && (s_[k_] == ' ' || s_[k_] == '\n' || s_[k_] == '\t' || s_[k_] == '\r')) ++k_;
  }
  bool lit(const char* w) {
    const std::string word(w);
    if (s_.compare(k_, word.size(), word) != 0) return false;
    k_ += word.size();
    return true;
  }
  bool value() {
    ws();
    if (k_ >= s_.size()) return false;
    const char c = s_[k_];
    if (c == '{') return object();
    if (c == '[') return array();
    if (c == '"') return string();
    if (c == 't') return lit("true");
    if (c == 'f') return lit("false");
    if (c == 'n') return lit("null");
    return number();
  }
  bool object() {
    ++k_;
    ++depth_;
    ws();
    if (k_ < s_.size() && s_[k_] == '}') return ++k_, --depth_, true;
    for (;;) {
      ws();
      if (!string()) return false;
      ws();
      if (k_ >= s_.size() || s_[k_] != ':') return false;
      ++k_;
      if (!value()) return false;
      ws();
      if (k_ < s_.size() && s_[k_] == ',') { ++k_; continue; }
      if (k_ < s_.size() && s_[k_] == '}') return ++k_, --depth_, true;
      return false;
    }
  }
  bool array() {
    ++k_;
    const bool top = depth_ == 0;
    ++depth_;
    ws();
    if (k_ < s_.size() && s_[k_] == ']') return ++k_, --depth_, true;
    for (;;) {
      if (!value()) return false;
      if (top) ++items_;
      ws();
      if (k_ < s_.size() && s_[k_] == ',') { ++k_; continue; }
      if (k_ < s_.size() && s_[k_] == ']') return ++k_, --depth_, true;
      return false;
    }
  }
  bool string() {
    if (k_ >= s_.size() || s_[k_] != '"') return false;
    ++k_;
    while (k_ < s_.size()) {
      const unsigned char c = static_cast<unsigned char>(s_[k_]);
      if (c == '"') return ++k_, true;
      if (c < 0x20) return false;
      if (c == '\\') {
        ++k_;
        if (k_ >= s_.size()) return false;
        const char e = s_[k_];
        if (e == 'u') {
          for (int i = 1; i <= 4; ++i)
            if (k_ + i >= s_.size() || !std::isxdigit(static_cast<unsigned char>(s_[k_ + i]))) return false;
          k_ += 4;
        } else if (std::string("\"\\/bfnrt").find(e) == std::string::npos) {
          return false;
        }
      }
      ++k_;
    }
    return false;
  }
  bool number() {
    const std::size_t start = k_;
    while (k_ < s_.size() && std::string("+-0123456789.eE").find(s_[k_]) != std::string::npos) ++k_;
    return k_ > start;
  }
  const std::string& s_;
  std::size_t k_ = 0;
  int depth_ = 0;
  int items_ = 0;
};

}  // namespace

TEST_CASE("docs: docs/functions.md is generated from the declarations and up to date", "[functions][docs]") {
  const std::string path = std::string(CALCTRAIL_SOURCE_DIR) + "/docs/functions.md";
  const std::string on_disk = readFile(path);
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
    CHECK(md.find("\n### " + d.name + "\n") != std::string::npos);
    CHECK(md.find(d.source) != std::string::npos);
  }
}

TEST_CASE("docs: the text listing shows every function, one in detail, and nothing for an unknown name",
          "[functions][docs]") {
  const std::string all = calctrail::functionsText();
  for (const calctrail::FunctionDecl& d : calctrail::functionLibrary()) CHECK(all.find(d.name + "(") != std::string::npos);
  const std::string one = calctrail::functionsText("torque_raise");
  CHECK_THAT(one, Catch::StartsWith("torque_raise(F, dm, l, f, alpha) -> torque or energy"));
  CHECK_THAT(one, Catch::Contains("Formula: F*dm/2"));
  CHECK_THAT(one, Catch::Contains("length per revolution"));
  CHECK_THAT(one, Catch::Contains("Caution:"));
  CHECK_THAT(calctrail::functionsText("trap_pitch"), Catch::Contains("Method:  table lookup"));
  CHECK(calctrail::functionsText("torque_rise").empty());
}

TEST_CASE("docs: the JSON listing parses, one object per function", "[functions][docs]") {
  const std::string all = calctrail::functionsJson();
  JsonCheck check(all);
  REQUIRE(check.valid());
  CHECK(check.topLevelItems() == static_cast<int>(calctrail::functionLibrary().size()));
  for (const char* key : {"\"name\": ", "\"args\": [", "\"unit\": ", "\"dimension\": ", "\"result\": {",
                          "\"formula\": ", "\"source\": ", "\"summary\": ", "\"limits\": ", "\"caution\": "})
    CHECK(all.find(key) != std::string::npos);
  const std::string one = calctrail::functionsJson("thread_lead");
  JsonCheck check_one(one);
  REQUIRE(check_one.valid());
  CHECK(check_one.topLevelItems() == 1);
  CHECK_THAT(one, Catch::Contains("\"per_revolution\": true"));
  CHECK(calctrail::functionsJson("no_such").empty());
}
