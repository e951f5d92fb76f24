// The TextMate grammar docs/editors/calc.tmLanguage.json, run on every demo
// worksheet by a small tokenizer of its own: TextMate's rule for `match`
// patterns (the earliest match wins, ties go to the first pattern; captures
// with `patterns` are tokenized again inside the capture) on std::wregex.
// The grammar keeps to the regex syntax that Oniguruma and ECMAScript share,
// so the regexes tested are the ones an editor runs (docs/editors/README.md).
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <map>
#include <regex>
#include <sstream>

#include "engine/util/utf8.h"
#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// Code points in a wstring (wchar_t is 32 bits on Linux), so that Greek and
// unit-sign ranges in character classes compare code points.
std::wstring wide(const std::string& utf8) {
  std::wstring out;
  for (size_t i = 0; i < utf8.size();) {
    size_t n = 1;
    out.push_back(static_cast<wchar_t>(decodeUtf8(utf8, i, &n)));
    i += std::max<size_t>(n, 1);
  }
  return out;
}

struct Rule;
// A capture group of a rule: its scope, or patterns that tokenize its text.
struct Capture {
  std::string scope;                  ///< scope name of the captured text ("" for none)
  std::vector<const Rule*> patterns;  ///< rules applied inside the captured text
};
// One `match` rule of the grammar.
struct Rule {
  std::string scope;                   ///< the rule's `name`, given to the whole match
  std::wregex re;                      ///< the rule's `match`
  std::map<size_t, Capture> captures;  ///< group number to its capture
};

// The grammar with includes resolved: its top-level rules and the repository's.
class Grammar {
 public:
  explicit Grammar(const Json& json) : json_(json) { top_ = patterns(json["patterns"]); }
  const std::vector<const Rule*>& top() const { return top_; }

 private:
  std::vector<const Rule*> patterns(const Json& list) {
    std::vector<const Rule*> out;
    for (const Json& p : list.array) {
      if (p.has("include")) {
        const std::string ref = p["include"].string;
        REQUIRE(ref.size() > 1);
        REQUIRE(ref[0] == '#');
        const Json& target = json_["repository"][ref.substr(1)];
        if (target.has("patterns")) {
          const std::vector<const Rule*> inner = patterns(target["patterns"]);
          out.insert(out.end(), inner.begin(), inner.end());
        } else {
          out.push_back(rule(target));
        }
      } else {
        out.push_back(rule(p));
      }
    }
    return out;
  }

  const Rule* rule(const Json& p) {
    INFO("every rule of the grammar is a `match` rule (no begin/end): " << (p.has("name") ? p["name"].string
                                                                                          : ""));
    REQUIRE(p.has("match"));
    auto r = std::make_unique<Rule>();
    if (p.has("name")) r->scope = p["name"].string;
    try {
      r->re = std::wregex(wide(p["match"].string), std::regex::ECMAScript);
    } catch (const std::regex_error& e) {
      FAIL("regex outside the ECMAScript subset: " << p["match"].string << " (" << e.what() << ")");
    }
    if (p.has("captures")) {
      for (const auto& [key, c] : p["captures"].object) {
        Capture cap;
        if (c.has("name")) cap.scope = c["name"].string;
        if (c.has("patterns")) cap.patterns = patterns(c["patterns"]);
        r->captures[std::stoul(key)] = cap;
      }
    }
    rules_.push_back(std::move(r));
    return rules_.back().get();
  }

  const Json& json_;
  std::vector<std::unique_ptr<Rule>> rules_;
  std::vector<const Rule*> top_;
};

// The scopes of every code point of a line, outermost first.
using Scopes = std::vector<std::vector<std::string>>;

void tokenize(const std::wstring& line, size_t begin, size_t end, const std::vector<const Rule*>& rules,
              Scopes* scopes) {
  size_t pos = begin;
  while (pos < end) {
    const Rule* best = nullptr;
    std::wsmatch best_match;
    for (const Rule* r : rules) {
      std::wsmatch m;
      // As in an editor: `^` is the start of the line only, and the text
      // before `pos` is seen by \b; a capture's text ends where the capture does.
      const auto flags = pos > 0
                             ? std::regex_constants::match_prev_avail | std::regex_constants::match_not_bol
                             : std::regex_constants::match_default;
      const auto from = line.begin() + static_cast<std::ptrdiff_t>(pos);
      const auto to = line.begin() + static_cast<std::ptrdiff_t>(end);
      if (!std::regex_search(from, to, m, r->re, flags) || m.length(0) == 0) continue;
      if (!best || m.position(0) < best_match.position(0)) {
        best = r;
        best_match = m;
      }
    }
    if (!best) return;
    const size_t start = pos + static_cast<size_t>(best_match.position(0));
    const size_t stop = start + static_cast<size_t>(best_match.length(0));
    if (!best->scope.empty()) {
      for (size_t i = start; i < stop; ++i) (*scopes)[i].push_back(best->scope);
    }
    for (const auto& [group, cap] : best->captures) {
      if (group >= best_match.size() || !best_match[group].matched || best_match.length(group) == 0) continue;
      const size_t cs = pos + static_cast<size_t>(best_match.position(group));
      const size_t ce = cs + static_cast<size_t>(best_match.length(group));
      if (!cap.scope.empty()) {
        for (size_t i = cs; i < ce; ++i) (*scopes)[i].push_back(cap.scope);
      }
      if (!cap.patterns.empty()) tokenize(line, cs, ce, cap.patterns, scopes);
    }
    pos = stop;
  }
}

struct Tokenized {
  std::wstring line;
  Scopes scopes;
};

Tokenized tokenizeLine(const Grammar& g, const std::string& utf8) {
  Tokenized t{wide(utf8), {}};
  t.scopes.resize(t.line.size());
  tokenize(t.line, 0, t.line.size(), g.top(), &t.scopes);
  return t;
}

const Json& grammarJson() {
  static Json json;
  static bool loaded = false;
  if (!loaded) {
    std::string error;
    const std::string text = readFile(repoPath("docs/editors/calc.tmLanguage.json"));
    INFO(error);
    REQUIRE(parseJson(text, &json, &error));
    loaded = true;
  }
  return json;
}

// The innermost scope of the first code point of `token` in `line`.
std::string scopeOf(const std::string& line, const std::string& token) {
  static const Grammar g(grammarJson());
  const Tokenized t = tokenizeLine(g, line);
  const size_t at = t.line.find(wide(token));
  INFO(line << " / " << token);
  REQUIRE(at != std::wstring::npos);
  return t.scopes[at].empty() ? "" : t.scopes[at].back();
}

std::string outerScopeOf(const std::string& line) {
  static const Grammar g(grammarJson());
  const Tokenized t = tokenizeLine(g, line);
  for (const auto& s : t.scopes) {
    if (!s.empty()) return s.front();
  }
  return "";
}

std::vector<std::string> demoWorksheets() {
  std::vector<std::string> files;
  for (const auto& e : std::filesystem::recursive_directory_iterator(repoPath("worksheets"))) {
    if (e.is_regular_file() && e.path().extension() == ".calc") files.push_back(e.path().string());
  }
  std::sort(files.begin(), files.end());
  return files;
}

}  // namespace

TEST_CASE("grammar: a TextMate grammar for .calc files", "[editors][grammar]") {
  const Json& g = grammarJson();
  CHECK(g["scopeName"].string == "source.calc");
  REQUIRE(g["fileTypes"].array.size() == 1);
  CHECK(g["fileTypes"][0].string == "calc");
  CHECK(g["patterns"].array.size() >= 10);
}

TEST_CASE("grammar: every line of every demo worksheet gets a scope, to its last character",
          "[editors][grammar]") {
  const Grammar grammar(grammarJson());
  const std::vector<std::string> files = demoWorksheets();
  REQUIRE(files.size() >= 3);
  size_t lines_seen = 0;
  for (const std::string& file : files) {
    std::istringstream in(readFile(file));
    std::string line;
    for (int number = 1; std::getline(in, line); ++number) {
      if (!line.empty() && line.back() == '\r') line.pop_back();
      if (line.find_first_not_of(" \t") == std::string::npos) continue;
      ++lines_seen;
      const Tokenized t = tokenizeLine(grammar, line);
      INFO(file << ":" << number << ": " << line);
      // One kind of line for the whole line, and never the error scope.
      const std::string kind = t.scopes[t.line.find_first_not_of(L" \t")].empty()
                                   ? ""
                                   : t.scopes[t.line.find_first_not_of(L" \t")].front();
      CHECK(kind != "");
      CHECK(kind != "invalid.illegal.line.calc");
      for (size_t i = 0; i < t.line.size(); ++i) {
        if (t.line[i] == L' ' || t.line[i] == L'\t') continue;
        INFO("column " << i + 1);
        REQUIRE(!t.scopes[i].empty());
        CHECK(t.scopes[i].front() == kind);
        // A token of its own inside every statement: nothing left as bare meta.* text.
        CHECK(t.scopes[i].back().rfind("meta.", 0) != 0);
      }
    }
  }
  CHECK(lines_seen > 150);
}

TEST_CASE("grammar: kinds of line, as the engine reads them", "[editors][grammar]") {
  CHECK(outerScopeOf("# a comment") == "comment.line.number-sign.calc");
  CHECK(outerScopeOf("title: Bench press") == "meta.metadata.calc");
  CHECK(scopeOf("title: Bench press", "title") == "keyword.other.metadata.calc");
  CHECK(scopeOf("checked:", "checked") == "keyword.other.metadata.calc");
  CHECK(scopeOf("section Screw # and nut", "# and") == "markup.heading.section.calc");
  CHECK(scopeOf("note Tr 20x4 single start", "note") == "keyword.other.note.calc");
  CHECK(scopeOf("note Tr 20x4 single start", "Tr") == "string.unquoted.note.calc");
  // A name followed by `=` or `[` is a definition, whatever the name.
  CHECK(outerScopeOf("note = 3 mm") == "meta.definition.calc");
  CHECK(outerScopeOf("section [mm] = 3 mm") == "meta.definition.calc");
  CHECK(outerScopeOf("check = 2") == "meta.definition.calc");
  CHECK(outerScopeOf("sigma: 3") == "invalid.illegal.line.calc");
  CHECK(outerScopeOf("stray words") == "invalid.illegal.line.calc");
}

TEST_CASE("grammar: tokens of definitions and checks", "[editors][grammar]") {
  const std::string def = "d_m [mm] = d - p / 2   # mean diameter";
  CHECK(scopeOf(def, "d_m") == "variable.other.definition.calc");
  CHECK(scopeOf(def, "mm") == "entity.name.type.unit.calc");
  CHECK(scopeOf(def, "[") == "punctuation.definition.unit.begin.calc");
  CHECK(scopeOf(def, "=") == "keyword.operator.assignment.calc");
  CHECK(scopeOf(def, "- p") == "keyword.operator.arithmetic.calc");
  CHECK(scopeOf(def, "2 ") == "constant.numeric.calc");
  CHECK(scopeOf(def, "# mean") == "comment.line.description.calc");
  CHECK(scopeOf(def, "mean") == "comment.line.description.calc");

  const std::string calls = "T = sqrt(x) * torque_raise(F, d_m, 1450 rpm, 9.81 [m/s^2]) * pi^2";
  CHECK(scopeOf(calls, "sqrt") == "support.function.builtin.calc");
  CHECK(scopeOf(calls, "torque_raise") == "entity.name.function.calc");
  CHECK(scopeOf(calls, "F,") == "variable.other.calc");
  CHECK(scopeOf(calls, ",") == "punctuation.separator.comma.calc");
  CHECK(scopeOf(calls, "(") == "punctuation.section.parens.calc");
  CHECK(scopeOf(calls, "rpm") == "entity.name.type.unit.calc");
  CHECK(scopeOf(calls, "9.81") == "constant.numeric.calc");
  CHECK(scopeOf(calls, "m/s^2") == "entity.name.type.unit.calc");
  CHECK(scopeOf(calls, "pi") == "constant.language.pi.calc");
  CHECK(scopeOf("x = pipe + 1e-3 %", "pipe") == "variable.other.calc");
  CHECK(scopeOf("x = pipe + 1e-3 %", "1e-3") == "constant.numeric.calc");
  CHECK(scopeOf("x = pipe + 1e-3 %", "%") == "entity.name.type.unit.calc");
  CHECK(scopeOf("η = 0.9 * Δ + 30 °C", "η") == "variable.other.definition.calc");
  CHECK(scopeOf("η = 0.9 * Δ + 30 °C", "Δ") == "variable.other.calc");
  CHECK(scopeOf("η = 0.9 * Δ + 30 °C", "°C") == "entity.name.type.unit.calc");

  const std::string check = "check self_locking: T_lower > 0 [N*m]   # holds without a brake";
  CHECK(scopeOf(check, "check") == "keyword.control.check.calc");
  CHECK(scopeOf(check, "self_locking") == "entity.name.check.calc");
  CHECK(scopeOf(check, ">") == "keyword.operator.comparison.calc");
  CHECK(scopeOf(check, "N*m") == "entity.name.type.unit.calc");
  CHECK(scopeOf(check, "holds") == "comment.line.description.calc");
  CHECK(scopeOf("check c: a ≤ b", "≤") == "keyword.operator.comparison.calc");
}

TEST_CASE("grammar: templates and load cases", "[editors][grammar]") {
  const std::string param = "param d [mm] = 20 mm   # major diameter";
  CHECK(scopeOf(param, "param") == "keyword.other.param.calc");
  CHECK(scopeOf(param, "d ") == "variable.parameter.calc");
  CHECK(scopeOf(param, "mm]") == "entity.name.type.unit.calc");
  CHECK(scopeOf(param, "20") == "constant.numeric.calc");
  CHECK(scopeOf(param, "major") == "comment.line.description.calc");
  CHECK(scopeOf("param F [kN]", "F") == "variable.parameter.calc");
  CHECK(scopeOf("param f = 0.12", "0.12") == "constant.numeric.calc");

  const std::string use = "use \"lib/screw jack.calc\" as left with f = 0.1, L = 2 * L_stem  # west side";
  CHECK(scopeOf(use, "use") == "keyword.other.use.calc");
  CHECK(scopeOf(use, "screw jack") == "string.unquoted.path.calc");
  CHECK(scopeOf(use, "as") == "keyword.other.as.calc");
  CHECK(scopeOf(use, "left") == "entity.name.instance.calc");
  CHECK(scopeOf(use, "with") == "keyword.other.with.calc");
  CHECK(scopeOf(use, "f =") == "variable.other.binding.calc");
  CHECK(scopeOf(use, "L_stem") == "variable.other.calc");
  CHECK(scopeOf(use, "west") == "comment.line.description.calc");
  CHECK(scopeOf("use jack.calc as right", "jack.calc") == "string.unquoted.path.calc");

  const std::string lcase = "case heavy: F = 12 kN, left.f = 0.08   # worst seal";
  CHECK(scopeOf(lcase, "case") == "keyword.other.case.calc");
  CHECK(scopeOf(lcase, "heavy") == "entity.name.case.calc");
  CHECK(scopeOf(lcase, "F =") == "variable.other.binding.calc");
  CHECK(scopeOf(lcase, "left.f") == "variable.other.binding.calc");
  CHECK(scopeOf(lcase, "kN") == "entity.name.type.unit.calc");
  CHECK(scopeOf("T = left.T_raise * 2", "left.T_raise") == "variable.other.calc");
}

TEST_CASE("grammar: study lines", "[editors][grammar]") {
  const std::string sweep = "study move_time: sweep t_move = 0.5 s..1.2 s, 8 points log-spaced, show T_rms, n_motor  # x";
  CHECK(scopeOf(sweep, "study") == "keyword.other.study.calc");
  CHECK(scopeOf(sweep, "move_time") == "entity.name.study.calc");
  CHECK(scopeOf(sweep, "sweep") == "keyword.other.study.kind.calc");
  CHECK(scopeOf(sweep, "t_move") == "variable.other.study.input.calc");
  CHECK(scopeOf(sweep, "0.5") == "constant.numeric.calc");
  CHECK(scopeOf(sweep, "..") == "keyword.operator.range.calc");
  CHECK(scopeOf(sweep, "1.2") == "constant.numeric.calc");
  CHECK(scopeOf(sweep, "8 ") == "constant.numeric.calc");
  CHECK(scopeOf(sweep, "points") == "keyword.other.study.clause.calc");
  CHECK(scopeOf(sweep, "log-spaced") == "keyword.other.study.clause.calc");
  CHECK(scopeOf(sweep, "show") == "keyword.other.study.clause.calc");
  CHECK(scopeOf(sweep, "T_rms") == "variable.other.calc");
  CHECK(scopeOf(sweep, "# x") == "comment.line.description.calc");
  const std::string unitless = "study ratio: sweep i_gear = 5..60, show F_clamp";
  CHECK(scopeOf(unitless, "5") == "constant.numeric.calc");
  CHECK(scopeOf(unitless, "..") == "keyword.operator.range.calc");
  const std::string capacity = "study most: capacity left.F = 1 kN..200 kN, largest";
  CHECK(scopeOf(capacity, "capacity") == "keyword.other.study.kind.calc");
  CHECK(scopeOf(capacity, "left.F") == "variable.other.study.input.calc");
  CHECK(scopeOf(capacity, "kN") == "entity.name.type.unit.calc");
  CHECK(scopeOf(capacity, "largest") == "keyword.other.study.clause.calc");
  // A quantity called `study` is still a definition.
  CHECK(scopeOf("study = 3", "study") == "variable.other.definition.calc");
}

TEST_CASE("grammar: a pick study line", "[editors][grammar]") {
  const std::string series = "study screw: pick d from trapezoidal  # smallest screw";
  CHECK(scopeOf(series, "pick") == "keyword.other.study.kind.calc");
  CHECK(scopeOf(series, "d ") == "variable.other.study.input.calc");
  CHECK(scopeOf(series, "from") == "keyword.other.study.clause.calc");
  CHECK(scopeOf(series, "trapezoidal") == "variable.other.calc");
  CHECK(scopeOf(series, "# smallest") == "comment.line.description.calc");
  const std::string list = "study motor: pick T_motor from 1.2 [N*m], 2.6 [N*m]";
  CHECK(scopeOf(list, "1.2") == "constant.numeric.calc");
  CHECK(scopeOf(list, "N*m") == "entity.name.type.unit.calc");
}
