// `calctrail check` for CI: JUnit XML checked against the structure CI
// systems read (the JUnit schema's required elements and attributes), and
// `-j N` giving the serial output byte for byte. No XML library is a
// dependency, so a small well-formedness parser below reads the document.
#include <catch2/catch.hpp>

#include <glob.h>

#include <map>
#include <memory>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

struct XmlElement {
  std::string name;
  std::map<std::string, std::string> attributes;
  std::vector<std::unique_ptr<XmlElement>> children;
  std::string text;  // character data directly inside, entities decoded

  const std::string& attr(const std::string& key) const { return attributes.at(key); }
};

// Strict enough for the test: the declaration, elements, attributes in
// double quotes, the five named entities and numeric references, nothing
// else (no comments, CDATA or DTD, which calctrail does not write).
class XmlParser {
 public:
  explicit XmlParser(const std::string& text) : s_(text) {}

  std::unique_ptr<XmlElement> document(std::string* error) {
    if (s_.compare(0, 5, "<?xml") == 0) {
      const size_t end = s_.find("?>");
      if (end == std::string::npos) return fail(error, "unterminated declaration");
      i_ = end + 2;
    }
    skipSpace();
    auto root = element(error);
    if (!root) return nullptr;
    skipSpace();
    if (i_ != s_.size()) return fail(error, "text after the root element");
    return root;
  }

 private:
  std::unique_ptr<XmlElement> fail(std::string* error, const std::string& why) {
    if (error->empty()) *error = why + " at byte " + std::to_string(i_);
    return nullptr;
  }
  void skipSpace() {
    while (i_ < s_.size() && std::isspace(static_cast<unsigned char>(s_[i_]))) ++i_;
  }
  std::string name() {
    const size_t start = i_;
    while (i_ < s_.size() && (std::isalnum(static_cast<unsigned char>(s_[i_])) || s_[i_] == '_' || s_[i_] == '-' ||
                              s_[i_] == ':' || s_[i_] == '.'))
      ++i_;
    return s_.substr(start, i_ - start);
  }
  // Decodes the text up to `stop`; false on a bare & or < or an unknown entity.
  bool chars(char stop, std::string* out) {
    while (i_ < s_.size() && s_[i_] != stop) {
      if (s_[i_] == '<') return false;
      if (s_[i_] != '&') {
        *out += s_[i_++];
        continue;
      }
      const size_t semi = s_.find(';', i_);
      if (semi == std::string::npos) return false;
      const std::string ent = s_.substr(i_ + 1, semi - i_ - 1);
      static const std::map<std::string, char> named = {
          {"amp", '&'}, {"lt", '<'}, {"gt", '>'}, {"quot", '"'}, {"apos", '\''}};
      if (named.count(ent)) *out += named.at(ent);
      else if (ent.size() > 1 && ent[0] == '#' && ent.find_first_not_of("0123456789", 1) == std::string::npos)
        *out += static_cast<char>(std::stoi(ent.substr(1)));
      else return false;
      i_ = semi + 1;
    }
    return true;
  }
  std::unique_ptr<XmlElement> element(std::string* error) {
    if (i_ >= s_.size() || s_[i_] != '<') return fail(error, "expected an element");
    ++i_;
    auto e = std::make_unique<XmlElement>();
    e->name = name();
    if (e->name.empty()) return fail(error, "an element without a name");
    for (;;) {
      skipSpace();
      if (s_.compare(i_, 2, "/>") == 0) {
        i_ += 2;
        return e;
      }
      if (i_ < s_.size() && s_[i_] == '>') {
        ++i_;
        break;
      }
      const std::string key = name();
      if (key.empty() || s_.compare(i_, 2, "=\"") != 0) return fail(error, "a malformed attribute");
      i_ += 2;
      std::string value;
      if (!chars('"', &value) || i_ >= s_.size()) return fail(error, "a malformed attribute value");
      ++i_;
      if (!e->attributes.emplace(key, value).second) return fail(error, "attribute `" + key + "` twice");
    }
    for (;;) {
      if (!chars('<', &e->text) || i_ >= s_.size()) return fail(error, "unterminated <" + e->name + ">");
      if (s_.compare(i_, 2, "</") == 0) {
        i_ += 2;
        if (name() != e->name || i_ >= s_.size() || s_[i_] != '>') return fail(error, "mismatched end tag");
        ++i_;
        return e;
      }
      auto child = element(error);
      if (!child) return nullptr;
      e->children.push_back(std::move(child));
    }
  }

  const std::string& s_;
  size_t i_ = 0;
};

std::unique_ptr<XmlElement> parseXml(const std::string& text) {
  std::string error;
  auto root = XmlParser(text).document(&error);
  INFO(error << "\n" << text);
  REQUIRE(root);
  return root;
}

int number(const XmlElement& e, const std::string& key) {
  const std::string& v = e.attr(key);
  REQUIRE(!v.empty());
  REQUIRE(v.find_first_not_of("0123456789") == std::string::npos);
  return std::stoi(v);
}

// The structure of the JUnit schema CI reads, checked on every element:
// what the failures and errors are, the counts equal to the children.
void checkJunitStructure(const XmlElement& root) {
  REQUIRE(root.name == "testsuites");
  int tests = 0, failures = 0, errors = 0;
  for (const auto& suite : root.children) {
    REQUIRE(suite->name == "testsuite");
    INFO(suite->attr("name"));
    CHECK_FALSE(suite->attr("name").empty());
    int suite_failures = 0, suite_errors = 0;
    for (const auto& tc : suite->children) {
      REQUIRE(tc->name == "testcase");
      CHECK_FALSE(tc->attr("name").empty());
      CHECK(tc->attr("classname") == suite->attr("name"));
      CHECK(tc->children.size() <= 1);
      for (const auto& outcome : tc->children) {
        REQUIRE((outcome->name == "failure" || outcome->name == "error"));
        CHECK(outcome->children.empty());
        CHECK_FALSE(outcome->attr("message").empty());
        (outcome->name == "failure" ? suite_failures : suite_errors)++;
      }
    }
    CHECK(number(*suite, "tests") == static_cast<int>(suite->children.size()));
    CHECK(number(*suite, "failures") == suite_failures);
    CHECK(number(*suite, "errors") == suite_errors);
    CHECK(number(*suite, "skipped") == 0);
    tests += number(*suite, "tests");
    failures += suite_failures;
    errors += suite_errors;
  }
  CHECK(number(root, "tests") == tests);
  CHECK(number(root, "failures") == failures);
  CHECK(number(root, "errors") == errors);
}

std::vector<std::string> globRepo(const std::string& pattern) {
  glob_t g;
  std::vector<std::string> out;
  if (glob(repoPath(pattern).c_str(), 0, nullptr, &g) == 0)
    for (size_t i = 0; i < g.gl_pathc; ++i) out.push_back(g.gl_pathv[i]);
  globfree(&g);
  return out;
}

}  // namespace

TEST_CASE("check --format junit writes the JUnit structure CI reads", "[check][junit]") {
  const std::string dir = tempDir();
  // A parse error, and a description with every character XML must escape.
  writeFile(dir + "/broken.calc", "a = 1 +\n");
  writeFile(dir + "/marks.calc", "x [mm] = 12 mm\ncheck fit: x < 10 mm  # a <tag> & \"quotes\" 'too'\n");
  const std::string files = "worksheets/canal-gate-hoist.calc worksheets/press-overload-fails.calc '" + dir +
                            "/broken.calc' worksheets/bearing-press.calc worksheets/platform-lift.calc '" + dir +
                            "/marks.calc'";
  Run r = runCli("check " + files + " --format junit");
  INFO(r.out << r.err);
  CHECK(r.status == 2);
  const auto root = parseXml(r.out);
  checkJunitStructure(*root);
  REQUIRE(root->children.size() == 6);

  const XmlElement& fails = *root->children[1];
  CHECK(fails.attr("name") == "worksheets/press-overload-fails.calc");
  CHECK(number(fails, "failures") == 1);
  int failing = 0;
  for (const auto& tc : fails.children) {
    if (tc->children.empty()) continue;
    ++failing;
    CHECK(tc->attr("name") == "nut_pressure (case nominal)");
    CHECK(tc->children[0]->name == "failure");
    // The message is the check's failure text, the body the line the text format prints.
    CHECK(tc->children[0]->attr("message").rfind("check `nut_pressure` fails: 20.73 MPa <= 10.00 MPa is false", 0) == 0);
    CHECK(tc->children[0]->text ==
          runCli("check worksheets/press-overload-fails.calc -q").out);
  }
  CHECK(failing == 1);

  const XmlElement& broken = *root->children[2];
  REQUIRE(broken.children.size() == 1);
  CHECK(broken.children[0]->attr("name") == "evaluate");
  REQUIRE(broken.children[0]->children.size() == 1);
  CHECK(broken.children[0]->children[0]->name == "error");
  CHECK(broken.children[0]->children[0]->attr("message").find("broken.calc:1:") != std::string::npos);

  // Load cases: one testcase per check per case (5 checks, nominal and 3 cases).
  const XmlElement& cases = *root->children[3];
  CHECK(cases.children.size() == 20);
  CHECK(cases.children[5]->attr("name") == "self_locking (case friction_high)");
  // Templates: instance checks keep their dotted names.
  bool dotted = false;
  for (const auto& tc : root->children[4]->children) dotted |= tc->attr("name").rfind("heavy.", 0) == 0;
  CHECK(dotted);

  // Escaped on the way out, read back as written.
  const XmlElement& marks = *root->children[5];
  REQUIRE(marks.children.size() == 1);
  REQUIRE(marks.children[0]->children.size() == 1);
  CHECK(marks.children[0]->children[0]->attr("message").find("(a <tag> & \"quotes\" 'too')") != std::string::npos);
}

TEST_CASE("the JUnit structure checker rejects what it should", "[check][junit]") {
  std::string error;
  CHECK_FALSE(XmlParser("<a><b></a>").document(&error));
  error.clear();
  CHECK_FALSE(XmlParser("<a x=\"1 & 2\"/>").document(&error));
  error.clear();
  CHECK_FALSE(XmlParser("<a/><b/>").document(&error));
  error.clear();
  auto ok = XmlParser("<?xml version=\"1.0\"?>\n<a x=\"&lt;&#10;\">t&amp;<b/></a>\n").document(&error);
  REQUIRE(ok);
  CHECK(ok->attr("x") == "<\n");
  CHECK(ok->text == "t&");
  CHECK(ok->children.size() == 1);
}

TEST_CASE("check -j N prints what a serial run prints, byte for byte", "[check][jobs]") {
  std::string files;
  for (const char* pattern : {"worksheets/*.calc", "worksheets/templates/*.calc"})
    for (const std::string& f : globRepo(pattern)) files += " '" + f + "'";
  REQUIRE(files.size() > 100);
  for (const char* format : {"text", "json", "junit"}) {
    INFO(format);
    const Run serial = runCli("check" + files + " -j 1 --format " + format);
    const Run parallel = runCli("check" + files + " -j 4 --format " + format);
    CHECK(serial.status == 2);  // templates with required parameters do not run alone
    CHECK(parallel.status == serial.status);
    CHECK(parallel.out == serial.out);
    CHECK(parallel.err == serial.err);
    CHECK_FALSE(serial.err.empty());
  }
  // The default (one per core) too.
  const Run serial = runCli("check" + files + " -j 1");
  const Run all_cores = runCli("check" + files);
  CHECK(all_cores.out == serial.out);
  CHECK(all_cores.err == serial.err);
  CHECK(all_cores.status == serial.status);
}

TEST_CASE("check -j takes a whole number from 1 to 1024", "[check][jobs][options]") {
  for (const char* bad : {"0", "-1", "1025", "x", "2.5", "0x4", "99999999999"}) {
    INFO(bad);
    const Run r = runCli(std::string("check worksheets/canal-gate-hoist.calc -j ") + bad);
    CHECK(r.status == 2);
    CHECK(r.err.find("calctrail: error: --jobs: ") != std::string::npos);
    CHECK(r.out.empty());
  }
  CHECK(runCli("check worksheets/canal-gate-hoist.calc -j 1024").status == 0);
}
