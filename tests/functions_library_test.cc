// The library as a whole: every declaration complete, every formula string in
// terms of its own arguments AND agreeing with eval() at the declared example
// and at random valid inputs (read by the engine's own parser and interpreter), every input checked (NaN, inf and out-of-range values
// give DomainError, never a NaN result), and every function listed in
// docs/verification.md with tests that exist.
#include <catch2/catch.hpp>

#include <cctype>
#include <cmath>
#include <fstream>
#include <map>
#include <random>
#include <set>
#include <sstream>
#include <string>
#include <vector>

#include <functional>
#include <memory>

#include "engine/eval/math_functions.h"
#include "engine/eval/tree_eval.h"
#include "engine/sheet/expr_parser.h"
#include "functions/function_decl.h"
#include "functions/function_library.h"
#include "functions/plausibility.h"

namespace {

using calctrail::Base;
using calctrail::Dimension;
using calctrail::DomainError;
using calctrail::FunctionDecl;
using calctrail::functionLibrary;

constexpr double kPi = 3.14159265358979323846;

const std::set<std::string, std::less<>> kMathFunctions = {"sqrt", "sin",  "cos", "tan", "asin",  "acos", "atan",
                                              "atan2", "exp", "ln",  "log10", "abs", "min",  "max"};

bool isIdentifier(std::string_view s) {
  if (s.empty() || !std::isalpha(static_cast<unsigned char>(s[0]))) return false;
  for (char c : s)
    if (!std::isalnum(static_cast<unsigned char>(c)) && c != '_') return false;
  return true;
}

bool isSnakeCase(std::string_view s) {
  if (s.empty() || !std::islower(static_cast<unsigned char>(s[0]))) return false;
  for (char c : s)
    if (!std::islower(static_cast<unsigned char>(c)) && !std::isdigit(static_cast<unsigned char>(c)) && c != '_')
      return false;
  return true;
}

bool isPrintableAscii(std::string_view s) {
  for (char c : s) {
    const unsigned char u = static_cast<unsigned char>(c);
    if (u < 0x20 || u > 0x7e) return false;
  }
  return true;
}

// Identifiers in a formula string, with whether each is followed by '('.
// The declared formula, parsed by the engine's own expression parser: the
// same parser and interpreter the trail uses to show it, units in brackets
// (`1 [rev]`) included.
struct ParsedFormula {
  std::unique_ptr<calctrail::SourceFile> file;
  calctrail::ExprPtr expr;
};
ParsedFormula parseFormula(const FunctionDecl& d) {
  ParsedFormula f;
  f.file = std::make_unique<calctrail::SourceFile>("function " + std::string(d.name), std::string(d.formula));
  calctrail::Diagnostics diags;
  f.expr = calctrail::ExprParser(*f.file, 0, static_cast<uint32_t>(d.formula.size()), &diags).parseWhole();
  return f;
}

double evalFormula(const calctrail::Expr& e, const std::map<std::string, double>& vars) {
  calctrail::EvalFault fault;
  // The library's formulas are read without a dimension check: every node reads as plain.
  const double v = calctrail::evalTree(
      e, calctrail::NodeDims(), [&](const calctrail::Expr& n) { return vars.count(n.text) ? vars.at(n.text) : NAN; }, &fault);
  INFO(fault.message);
  CHECK(fault.node == nullptr);
  return v;
}

const Dimension kRotSpeed = Dimension::exponents(0, 0, -1, 0, 0, 0, 0, 1);

// A random SI value of a plausible size for an argument, by its dimension.
double plausible(const calctrail::FunctionArg& a, std::mt19937& rng) {
  std::uniform_real_distribution<double> u(0, 1);
  const auto logUniform = [&](double lo, double hi) { return lo * std::pow(hi / lo, u(rng)); };
  const Dimension& d = a.dim;
  if (a.per_revolution) return logUniform(1e-3, 2e-2);
  if (d == Dimension::exponents(1, 0, 0)) return logUniform(5e-3, 3.0);
  if (d == Dimension::exponents(1, 1, -2)) return logUniform(100, 1e5);
  if (d == Dimension::exponents(2, 1, -2)) return logUniform(0.1, 1e3);
  if (d == Dimension::exponents(-1, 1, -2)) return logUniform(1e6, 3e11);
  if (d == Dimension::exponents(-3, 1, 0)) return logUniform(1e3, 1e4);
  if (d == Dimension::exponents(2, 1, -3)) return logUniform(10, 1e5);
  if (d == Dimension::of(Base::Angle)) return u(rng) * 0.75;
  if (d == kRotSpeed) return logUniform(1, 300);
  if (d.dimensionless()) return u(rng) < 0.4 ? std::floor(1 + 3 * u(rng)) : logUniform(1e-3, 1.0);
  return logUniform(1e-3, 1e3);
}

// Arguments within the function's limits, found by random search; false when none was found.
bool validSample(const FunctionDecl& d, std::mt19937& rng, std::vector<double>& args, int tries = 20000) {
  args.assign(d.args.size(), 0.0);
  for (int t = 0; t < tries; ++t) {
    for (std::size_t k = 0; k < d.args.size(); ++k) args[k] = plausible(d.args[k], rng);
    try {
      d.eval(args.data());
      return true;
    } catch (const DomainError&) {
    }
  }
  return false;
}

std::string readFile(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

}  // namespace

TEST_CASE("library: every declaration is complete", "[functions][library]") {
  std::set<std::string, std::less<>> names;
  for (const FunctionDecl& d : functionLibrary()) {
    INFO("function " << d.name);
    CHECK(isSnakeCase(d.name));
    CHECK(names.emplace(d.name).second);  // unique
    CHECK(kMathFunctions.count(d.name) == 0);
    CHECK(d.name != "pi");
    CHECK(!d.summary.empty());
    CHECK(!d.source.empty());
    CHECK(!d.limits.empty());
    CHECK(!d.formula.empty());
    CHECK(!d.result_unit.empty());
    CHECK(d.eval != nullptr);
    for (const std::string_view* s : {&d.name, &d.summary, &d.formula, &d.limits, &d.source, &d.caution, &d.result_unit})
      CHECK(isPrintableAscii(*s));
    std::set<std::string, std::less<>> arg_names;
    for (const calctrail::FunctionArg& a : d.args) {
      INFO("argument " << a.name);
      CHECK(isIdentifier(a.name));
      CHECK(a.name != "pi");
      CHECK(kMathFunctions.count(a.name) == 0);
      CHECK(arg_names.emplace(a.name).second);  // unique within the function
      CHECK(!a.description.empty());
      CHECK(isPrintableAscii(a.description));
      if (a.per_revolution) CHECK(a.dim == Dimension::exponents(1, 0, 0));  // leads and pitches only
    }
    if (d.result_per_revolution) CHECK(d.result == Dimension::exponents(1, 0, 0));
    // An example call inside the limits, for every function that takes arguments.
    CHECK(d.example.size() == d.args.size());
    if (d.example.size() == d.args.size()) {
      double v = 0;
      CHECK_NOTHROW(v = d.eval(d.example.data()));
      CHECK(std::isfinite(v));
    }
  }
  CHECK(functionLibrary().size() >= 60);
}

TEST_CASE("library: a repeated argument group is declared whole and evaluates any number of groups",
          "[functions][library]") {
  int repeated = 0;
  for (const FunctionDecl& d : functionLibrary()) {
    INFO("function " << d.name);
    CHECK(d.repeat >= 0);
    CHECK(d.repeat <= static_cast<int>(d.args.size()));
    CHECK((d.repeat > 0) == (d.eval_n != nullptr));
    if (d.repeat == 0) continue;
    ++repeated;
    const int n = static_cast<int>(d.args.size());
    CHECK(d.takes(n));
    CHECK(d.takes(n + d.repeat));
    CHECK_FALSE(d.takes(n - 1));
    if (d.repeat > 1) CHECK_FALSE(d.takes(n + 1));
    // eval() is eval_n() over the declared arguments.
    CHECK(d.eval(d.example.data()) == d.eval_n(d.example.data(), n));
    // The names of further groups follow the declared numbering: i3 after i1, i2.
    const std::string last(d.args.back().name);
    CHECK(d.argName(n + d.repeat - 1) == last.substr(0, last.size() - 1) + "3");
    // The group repeated with its own values twice over gives the same result for these means and products
    // only where the function is a mean; the evaluation itself must succeed and be finite.
    std::vector<double> more = d.example;
    for (int k = 0; k < d.repeat; ++k) more.push_back(d.example[static_cast<size_t>(n - d.repeat + k)]);
    CHECK(std::isfinite(d.eval_n(more.data(), static_cast<int>(more.size()))));
  }
  CHECK(repeated >= 4);  // overall_ratio, overall_efficiency, cubic_mean_load, rms_torque
}

TEST_CASE("library: every usual range is a range, and the declared example raises no doubt",
          "[functions][library][plausibility]") {
  for (const FunctionDecl& d : functionLibrary()) {
    INFO("function " << d.name);
    for (const calctrail::FunctionArg& a : d.args) {
      INFO("argument " << a.name);
      CHECK(a.usual_min <= a.usual_max);
      if (a.hasUsualRange()) {
        CHECK(!a.usual_why.empty());
        CHECK(isPrintableAscii(a.usual_why));
        CHECK(a.usual_factor > 0);
      }
    }
    if (d.args.empty()) continue;
    CHECK(calctrail::doubtsOf(d, d.example.data(), static_cast<int>(d.example.size())).empty());
    CHECK_FALSE(calctrail::isDoubtful(d, d.example.data(), static_cast<int>(d.example.size())));
  }
}

TEST_CASE("library: results that feed a safety decision carry a caution", "[functions][library]") {
  for (const char* name : {"torque_raise", "torque_lower", "torque_lower_with_collar", "self_locking_margin",
                           "screw_backdrive_efficiency", "backdrive_force", "body_torsion_stress",
                           "body_axial_stress", "thread_root_bending", "thread_root_shear", "von_mises_thread_root",
                           "thread_bearing_pressure", "nut_pv", "euler_load", "johnson_load", "buckling_load",
                           "buckling_safety", "ball_screw_backdrive_torque", "ball_screw_life", "critical_speed",
                           "worm_backdrive_efficiency"}) {
    const FunctionDecl* d = calctrail::findFunction(name);
    INFO(name);
    REQUIRE(d != nullptr);
    CHECK(!d->caution.empty());
  }
}

TEST_CASE("library: groups cover the library in order, and lookup works", "[functions][library]") {
  std::size_t next = 0;
  for (const calctrail::FunctionGroup& g : calctrail::functionGroups()) {
    INFO("group " << g.title);
    CHECK(g.first == next);
    CHECK(g.count > 0);
    CHECK(!g.intro.empty());
    next += g.count;
  }
  CHECK(next == functionLibrary().size());
  CHECK(calctrail::findFunction("torque_raise") == &functionLibrary()[calctrail::functionGroups()[1].first + 1]);
  CHECK(calctrail::findFunction("no_such_function") == nullptr);
  CHECK(calctrail::groupOf(*calctrail::findFunction("acme_tpi"))->title == "Threads");
}

// findFunction and findMathFunction search faster than a scan of the table:
// each must answer as the plain scan does, for every name and near misses.
TEST_CASE("library: the name lookups answer as a scan of the tables does", "[functions][library]") {
  std::vector<std::string> probes = {"", "a", "z", "_", "torque", "torque_raise_", "Torque_raise", "sqrt2", "s"};
  for (const FunctionDecl& d : functionLibrary()) probes.emplace_back(d.name);
  for (const calctrail::MathFunction& m : calctrail::mathFunctions()) probes.emplace_back(m.name);
  const std::size_t named = probes.size();
  for (std::size_t k = 0; k < named; ++k) {
    const std::string p = probes[k];  // a copy: the pushes below may move the vector's strings
    if (p.empty()) continue;
    probes.push_back(p.substr(0, p.size() - 1));  // a prefix
    probes.push_back(p + "x");                    // a longer name
    probes.push_back(p.substr(1));                // without its first letter
  }
  for (const std::string& p : probes) {
    INFO("name `" << p << "`");
    const FunctionDecl* scanned = nullptr;
    for (const FunctionDecl& d : functionLibrary())
      if (d.name == p) scanned = &d;
    CHECK(calctrail::findFunction(p) == scanned);
    const calctrail::MathFunction* math = nullptr;
    for (const calctrail::MathFunction& m : calctrail::mathFunctions())
      if (p == m.name) math = &m;
    CHECK(calctrail::findMathFunction(p) == math);
  }
}

TEST_CASE("library: formula strings mention only their declared arguments", "[functions][library]") {
  for (const FunctionDecl& d : functionLibrary()) {
    if (!d.formula_is_expression) continue;
    INFO("function " << d.name << ": " << d.formula);
    ParsedFormula f = parseFormula(d);
    REQUIRE(f.expr);
    std::set<std::string, std::less<>> declared;
    for (const calctrail::FunctionArg& a : d.args) declared.emplace(a.name);
    calctrail::forEachName(*f.expr, [&](const calctrail::Expr& n) {
      INFO("name " << n.text);
      CHECK(declared.count(n.text) == 1);
    });
    // Calls inside a formula are math functions only: no sec, no library functions.
    std::function<void(const calctrail::Expr&)> calls = [&](const calctrail::Expr& e) {
      if (e.kind == calctrail::ExprKind::Call) {
        INFO("call " << e.text);
        CHECK(calctrail::findMathFunction(e.text) != nullptr);
      }
      for (const auto& a : e.args) calls(*a);
    };
    calls(*f.expr);
  }
}

TEST_CASE("library: formula strings agree with eval() on random valid inputs", "[functions][library][formulas]") {
  // The formula strings are written in the values eval() receives: SI with rad = 1, a lead per revolution;
  // a revolution written `1 [rev]` is 2*pi, as the engine reads it.
  std::mt19937 rng(20240611);
  for (const FunctionDecl& d : functionLibrary()) {
    if (!d.formula_is_expression) continue;
    INFO("function " << d.name << ": " << d.formula);
    ParsedFormula f = parseFormula(d);
    REQUIRE(f.expr);
    int agreed = 0;
    for (int sample = 0; sample < 20; ++sample) {
      std::vector<double> args = d.example;  // the declared example first, then random valid inputs
      if (sample > 0) REQUIRE(validSample(d, rng, args));
      std::map<std::string, double> vars;
      for (std::size_t k = 0; k < d.args.size(); ++k)
        vars[std::string(d.args[k].name)] = args[k];
      const double from_formula = evalFormula(*f.expr, vars);
      const double from_eval = d.eval(args.data());
      INFO("formula " << from_formula << " eval " << from_eval);
      CHECK(std::fabs(from_formula - from_eval) <= 1e-9 * std::max(std::fabs(from_eval), std::fabs(from_formula)) + 1e-9);
      ++agreed;
      if (d.args.empty()) break;
    }
    CHECK(agreed > 0);
  }
}

TEST_CASE("library: NaN and infinite inputs are DomainErrors naming the argument", "[functions][library][limits]") {
  std::mt19937 rng(7);
  for (const FunctionDecl& d : functionLibrary()) {
    if (d.args.empty()) continue;
    INFO("function " << d.name);
    std::vector<double> args = d.example;
    if (args.size() != d.args.size()) REQUIRE(validSample(d, rng, args));
    for (std::size_t k = 0; k < d.args.size(); ++k) {
      for (double bad : {std::nan(""), HUGE_VAL, -HUGE_VAL}) {
        std::vector<double> a = args;
        a[k] = bad;
        INFO("argument " << d.args[k].name << " = " << bad);
        try {
          const double v = d.eval(a.data());
          FAIL("returned " << v);
        } catch (const DomainError& e) {
          CHECK(e.arg() == static_cast<int>(k));
        }
      }
    }
  }
}

TEST_CASE("library: eval never returns NaN or inf, only values or DomainErrors", "[functions][library][limits]") {
  // Random inputs of every sign and size, zeros and extremes included.
  std::mt19937 rng(42);
  const double specials[] = {0.0, -0.0, 1.0, -1.0, 1e-300, -1e-300, 1e300, -1e300, 0.5, 2.0, 1e-3, 7.0};
  std::uniform_int_distribution<int> pick(0, static_cast<int>(std::size(specials)) - 1);
  std::uniform_real_distribution<double> u(0, 1);
  for (const FunctionDecl& d : functionLibrary()) {
    INFO("function " << d.name);
    int errors = 0, values = 0;
    for (int t = 0; t < 3000; ++t) {
      std::vector<double> a(d.args.size());
      for (std::size_t k = 0; k < a.size(); ++k) {
        const double r = u(rng);
        if (r < 0.3) a[k] = specials[pick(rng)];
        else if (r < 0.4) a[k] = -plausible(d.args[k], rng);
        else a[k] = plausible(d.args[k], rng);
      }
      try {
        const double v = d.eval(a.data());
        CHECK(std::isfinite(v));
        ++values;
      } catch (const DomainError& e) {
        CHECK(e.arg() >= -1);
        CHECK(e.arg() < static_cast<int>(d.args.size()));
        CHECK(std::string(e.what()).size() > 10);
        ++errors;
      }
      if (d.args.empty()) break;
    }
    CHECK(values + errors > 0);
  }
}

TEST_CASE("library: docs/verification.md lists every function with tests that exist", "[functions][library][docs]") {
  const std::string text = readFile(std::string(CALCTRAIL_SOURCE_DIR) + "/docs/verification.md");
  REQUIRE(!text.empty());
  std::set<std::string> tests;
  for (const Catch::TestCase& tc : Catch::getRegistryHub().getTestCaseRegistry().getAllTests()) tests.insert(tc.name);
  // Rows: | `function` | published check | `test name` | tolerance | independent check |
  std::map<std::string, std::string> rows;
  std::istringstream lines(text);
  for (std::string line; std::getline(lines, line);) {
    if (line.rfind("| `", 0) != 0) continue;
    const std::size_t end = line.find('`', 3);
    rows[line.substr(3, end - 3)] = line;
  }
  for (const FunctionDecl& d : functionLibrary()) {
    INFO("function " << d.name);
    REQUIRE(rows.count(std::string(d.name)) == 1);
    const std::string& row = rows[std::string(d.name)];
    // Every test name quoted in the row, after the first cell, is a registered test case.
    std::size_t cell3 = row.find('|', 1);
    cell3 = row.find('|', cell3 + 1);
    std::size_t k = row.find('`', cell3);
    int cited = 0;
    while (k != std::string::npos) {
      const std::size_t e = row.find('`', k + 1);
      const std::string name = row.substr(k + 1, e - k - 1);
      const std::size_t next_cell = row.find('|', cell3 + 1);
      if (k > next_cell) break;
      INFO("test " << name);
      CHECK(tests.count(name) == 1);
      ++cited;
      k = row.find('`', e + 1);
    }
    CHECK(cited > 0);
  }
}

TEST_CASE("library: the plausibility check on the call path gives the full check's answer",
          "[functions][library][plausibility]") {
  // isDoubtful(decl, args, n, usualArgs(decl)) compares only the arguments
  // with a usual range; it must say what the check of every argument says,
  // inside and outside the ranges, and past 32 arguments of a repeated group.
  int doubtful = 0, compared = 0;
  for (const FunctionDecl& d : functionLibrary()) {
    INFO("function " << d.name);
    const uint32_t bits = calctrail::usualArgs(d);
    for (int k = 0; k < 32; ++k) {
      const bool may = k < static_cast<int>(d.args.size()) || (d.repeat > 0 && !d.args.empty());
      CHECK(((bits >> k) & 1u) == (may && d.argAt(k).hasUsualRange() ? 1u : 0u));
    }
    if (d.args.empty()) continue;
    std::vector<double> base = d.example;
    if (d.repeat > 0)  // the last group again, up to 40 arguments and more
      while (base.size() < 40) base.insert(base.end(), d.example.end() - d.repeat, d.example.end());
    for (size_t k = 0; k < base.size(); ++k) {
      for (double factor : {1.0, 1e-4, 1e4, 0.0, -1.0}) {
        std::vector<double> a = base;
        a[k] *= factor;
        for (int n : {static_cast<int>(d.example.size()), static_cast<int>(a.size())}) {
          if (static_cast<size_t>(n) <= k) continue;
          const bool full = calctrail::isDoubtful(d, a.data(), n);
          CHECK(calctrail::isDoubtful(d, a.data(), n, bits) == full);
          doubtful += full;
          ++compared;
        }
      }
    }
  }
  CHECK(doubtful > 10);  // the doubtful side was compared too
  CHECK(compared > 1000);
}
