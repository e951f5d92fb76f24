#include "engine/report/trail.h"

#include <algorithm>

#include <cmath>
#include <cstdlib>
#include <map>
#include <memory>
#include <mutex>
#include <optional>

#include "engine/eval/math_functions.h"
#include "engine/report/cautions.h"
#include "engine/eval/tree_eval.h"
#include "engine/report/number_format.h"
#include "engine/report/power_of_ten.h"
#include "engine/sheet/expr_parser.h"
#include "engine/units/unit_parser.h"
#include "engine/util/math_constants.h"
#include "functions/function_decl.h"

namespace calctrail {

std::string conditionText(const Check& c) {
  return renderExpr(*c.lhs) + " " + comparisonText(c.op) + " " + renderExpr(*c.rhs);
}

namespace {
// A check fails when it fails in the case shown or in any load case; a case
// that could not be calculated fails every check it could not evaluate.
bool failsSomewhere(const TrailCheck& c) {
  if (!c.passed) return true;
  for (const TrailCaseCheck& k : c.cases)
    if (!k.passed) return true;
  return false;
}
}  // namespace

std::string verdictState(const Trail& t) {
  if (t.checks.empty()) return "NO CHECKS";
  for (const TrailCheck& c : t.checks)
    if (failsSomewhere(c)) return "FAIL";
  return t.cases_failed > 0 ? "FAIL" : "PASS";
}

std::string verdictSentence(const Trail& t) {
  const std::string state = verdictState(t);
  if (t.checks.empty()) return state + ": this worksheet has no design checks";
  std::vector<std::string> names;
  for (const TrailCheck& c : t.checks) {
    if (!failsSomewhere(c)) continue;
    std::string name = c.name;
    if (c.passed && !t.cases.empty()) {  // fails only in load cases: name them
      std::vector<std::string> in;
      for (size_t k = 0; k < c.cases.size() && k < t.cases.size(); ++k)
        if (!c.cases[k].passed) in.push_back(t.cases[k].name);
      name += fmt::format(" (in case {})", fmt::join(in, ", "));
    }
    names.push_back(name);
  }
  const std::string cases = t.cases.empty() ? "" : fmt::format(" in {} load cases", t.cases.size());
  if (names.empty()) {
    if (t.cases_failed > 0)
      return fmt::format("{}: {} of {} load cases could not be calculated", state, t.cases_failed,
                         t.cases.size());
    return t.checks.size() == 1 ? state + ": the 1 check passes" + cases
                                : fmt::format("{}: all {} checks pass{}", state, t.checks.size(), cases);
  }
  return fmt::format("{}: {} of {} {} {}: {}", state, names.size(), t.checks.size(),
                     t.checks.size() == 1 ? "check" : "checks", names.size() == 1 ? "fails" : "fail",
                     fmt::join(names, ", "));
}

std::string warningSummary(const Trail& t) {
  if (t.warnings.empty()) return "";
  // An instance's line is one of its template's: the file is named with it.
  const auto line = [&](int instance, int at) {
    if (instance < 0) return fmt::format("line {}", at);
    return fmt::format("{} line {}", t.instances[static_cast<size_t>(instance)].path, at);
  };
  std::vector<std::string> places;
  for (int q : t.warned_steps) {
    const TrailSteps::Held s = t.steps.get(static_cast<size_t>(q));
    places.push_back(fmt::format("{} ({})", s->name, line(s->instance, s->line)));
  }
  for (const TrailCheck& c : t.checks)
    if (!c.warnings.empty()) places.push_back(fmt::format("check {} ({})", c.name, line(c.instance, c.line)));
  const size_t n = t.warnings.size();
  const size_t at = static_cast<size_t>(t.warnings_at_steps);
  std::string out = fmt::format("WARNING: {} {}", n, n == 1 ? "warning" : "warnings");
  if (at == n) out += fmt::format(", flagged at {}: ", n == 1 ? "its step" : "their steps");
  else if (at > 0) out += fmt::format(", {} flagged at {}: ", at, at == 1 ? "its step" : "their steps");
  if (at > 0) out += fmt::format("{}", fmt::join(places, ", "));
  if (at < n) out += fmt::format("{}{} listed under Warnings", at > 0 ? "; " : ", ", n - at);
  return out;
}

std::string replacementList(const Trail& t) {
  std::vector<std::string> sets;
  for (const TrailReplacement& r : t.modified_by) sets.push_back("--set " + r.name + "=" + r.value);
  return fmt::format("{}", fmt::join(sets, ", "));
}

std::string instanceInputsPointer(const Trail& t) {
  std::vector<std::string> names;
  for (const TrailInstance& in : t.instances) {
    bool left_out = false;
    for (const TrailInstanceParam& p : in.params)
      left_out = left_out || p.in_part_table;
    if (left_out) names.push_back(in.name);
  }
  if (names.empty()) return "";
  return fmt::format("The given parameters of the instance{} {}: in {} part, with value, binding and note.",
                     names.size() > 1 ? "s" : "", fmt::join(names, ", "),
                     names.size() > 1 ? "each instance's" : "its");
}

std::string instanceChecksLine(const Trail& t, const TrailInstance& in) {
  std::vector<std::string> states;
  for (int c : in.checks) {
    const TrailCheck& check = t.checks[static_cast<size_t>(c)];
    states.push_back(check.name + (check.passed ? " pass" : " FAIL"));
  }
  if (states.empty()) return "";
  return fmt::format("Checks of {}, each with its condition and values in Design checks: {}.", in.name,
                     fmt::join(states, ", "));
}

std::string modifiedNotice(const Trail& t) {
  if (t.modified_by.empty()) return "";
  return "MODIFIED: the numbers in this report come from the file AS MODIFIED by " + replacementList(t) +
         "; the SHA-256 identifies the file alone, not these numbers.";
}

std::string signOffStatement(const Trail& t) {
  if (t.modified_by.empty())
    return "The signatures below cover the worksheet with this SHA-256 only. Any change to it, however "
           "small, "
           "changes the SHA-256 and needs a new sign-off.";
  return "This report is NOT the calculation of the worksheet with this SHA-256: its numbers come from the "
         "file AS MODIFIED by " +
         replacementList(t) +
         ". A signature below covers that file with exactly these "
         "replacements, never the file alone; to sign the file's own numbers, report it without --set.";
}

void appendValue(fmt::memory_buffer& out, const TrailValue& v, NumberStyle style) {
  // joinNumberUnit(number, unit), written straight into `out`: the unit with what joins it.
  appendNumber(out, v.number, style);
  const UnitJoin join = unitJoin(v.unit);
  if (join == UnitJoin::None) return;
  if (join == UnitJoin::Spaced) out.push_back(' ');
  out.append(v.unit.data(), v.unit.data() + v.unit.size());
}

std::string valueText(const TrailValue& v, NumberStyle style) {
  fmt::memory_buffer out;
  appendValue(out, v, style);
  return fmt::to_string(out);
}

std::string lineText(const TrailLine& line, NumberStyle style) {
  fmt::memory_buffer out;
  const std::string& text = line.marked();
  size_t next_value = 0;
  for (size_t i = 0; i < text.size();) {
    if (text[i] == TrailLine::kValueMark) {
      appendValue(out, line.values()[next_value++], style);
      ++i;
      continue;
    }
    size_t end = text.find(TrailLine::kValueMark, i);
    if (end == std::string::npos) end = text.size();
    if (style == NumberStyle::TimesTen) {
      const std::string run = timesTenPowers(text.substr(i, end - i));
      out.append(run.data(), run.data() + run.size());
    } else {
      out.append(text.data() + i, text.data() + end);
    }
    i = end;
  }
  return fmt::to_string(out);
}

namespace {

// A value in SI shown in `unit`, rounded.
TrailValue rounded(double si, const Unit& unit, int digits) {
  const double v = unit.fromSI(si);
  return {v, si, roundNumber(v, digits), unit.pretty()};
}

// A literal as the worksheet writes it, in `unit_pretty` ("" for none).
TrailValue written(const std::string& literal, double si, double value, const std::string& unit_pretty) {
  return {value, si, writtenNumber(literal), unit_pretty};
}

// A formula written as a TrailLine: renderExprTo's text with a mark where
// each value goes (TrailLine::kValueMark), and the values in their order.
class LineWriter {
 public:
  // Room for the values of the `names` names of a formula (namesIn).
  explicit LineWriter(size_t names) { values_.reserve(names); }
  // Puts `v` in the line: in parentheses when it is negative, as a
  // substituted line needs it, and as a power's base where its text holds a
  // space ((33.00 mm)^2), as renderExpr puts a name's text.
  void value(TrailValue v, bool negative, bool power_base, std::string* out) {
    const bool spaced = v.number.digits.find(' ') != std::string::npos ||
                        v.number.exponent.find(' ') != std::string::npos ||
                        v.unit.find(' ') != std::string::npos || unitJoin(v.unit) == UnitJoin::Spaced;
    const bool wrap = negative || (power_base && spaced);
    if (wrap) *out += '(';
    *out += TrailLine::kValueMark;
    if (wrap) *out += ')';
    values_.push_back(std::move(v));
  }
  TrailLine line(std::string marked) { return TrailLine(std::move(marked), std::move(values_)); }

 private:
  std::vector<TrailValue> values_;
};

// How many names a formula holds: the values a line of it shows at most.
size_t namesIn(const Expr& e) {
  size_t n = e.kind == ExprKind::Name ? 1 : 0;
  for (const auto& a : e.args) n += namesIn(*a);
  return n;
}

// In a copy of a step's formula, a nested library call becomes a name: this
// byte and the call's index (no worksheet text holds the byte).
constexpr char kMark = '\x1F';

bool isLibraryCall(const Expr& e) {
  return e.kind == ExprKind::Call && !findMathFunction(e.text) && findFunction(e.text);
}

// Every call of a library function in a formula, in source order; `*nested`,
// when given, is set where one call is inside another's arguments.
void collectCalls(const Expr& e, std::vector<const Expr*>* out, bool* nested = nullptr, bool inside_call = false) {
  const bool library = isLibraryCall(e);
  if (library) out->push_back(&e);
  if (library && inside_call && nested) *nested = true;
  for (const auto& a : e.args) collectCalls(*a, out, nested, inside_call || library);
}

// A library function's own formula, parsed once, so the trail can show it
// with the call's values substituted, and its text with the product dot.
struct LibraryFormula {
  std::shared_ptr<SourceFile> file;  // the text `expr` points into
  ExprPtr expr;                      // null for a method in words
  std::string pretty;                // renderExpr(*expr, nullptr, true); "" without one
};

// Shared by every trail of the process, so guarded: trails may be built on
// several threads (entries are never removed, so a reference stays valid).
const LibraryFormula& parsedFormula(const FunctionDecl& f) {
  static std::mutex lock;
  static std::map<std::string, LibraryFormula, std::less<>> cache;
  const std::lock_guard<std::mutex> hold(lock);
  auto it = cache.find(f.name);
  if (it == cache.end()) {
    LibraryFormula parsed;
    parsed.file = std::make_shared<SourceFile>("function " + std::string(f.name), std::string(f.formula));
    Diagnostics ignored;
    if (f.formula_is_expression)
      parsed.expr = ExprParser(*parsed.file, 0, static_cast<uint32_t>(f.formula.size()), &ignored).parseWhole();
    if (parsed.expr) parsed.pretty = renderExpr(*parsed.expr, nullptr, true);
    it = cache.emplace(std::string(f.name), std::move(parsed)).first;
  }
  return it->second;
}

// `u` itself when it has dimension `want`; for a unit per revolution
// ("in/rev") where a plain length is wanted, the same unit without "/rev";
// otherwise nothing.
std::optional<Unit> unitFor(const Unit& u, const Dimension& want) {
  if (u.dim == want) return u;
  const std::string suffix = "/rev";
  if (u.dim == want / Dimension::of(Base::Angle) && u.text.size() > suffix.size() &&
      u.text.compare(u.text.size() - suffix.size(), suffix.size(), suffix) == 0) {
    Unit plain;
    UnitError err;
    if (parseUnit(u.text.substr(0, u.text.size() - suffix.size()), &plain, &err) && plain.dim == want)
      return plain;
  }
  return std::nullopt;
}

// The unit an argument is shown in: its quantity's, its literal's, or the
// sheet's preferred one for the function's argument dimension (inches in a
// US customary sheet, so that an inline `d - p / 2` is not shown in mm).
Unit argumentUnit(const Expr& arg, const FunctionArg& decl, const Calculation& calc) {
  const Expr* x = withoutParens(&arg);
  if (x->kind == ExprKind::Name) {
    if (auto u = unitFor(calc.display(calc.sheet.find(x->text)), decl.dim)) return *u;
  }
  if (x->kind == ExprKind::Number && x->unit) {
    if (auto u = unitFor(*x->unit, decl.dim)) return *u;
  }
  return calc.sheet.units.choose(decl.dim);
}

// A number for a table row as the tables write it: "48", "1.5", "5.5".
std::string rowNumber(double v) { return fmt::format("{:.6g}", v); }

// Inches as the Acme table names its sizes: "1", "1-1/4", "5/16".
std::string inchLabel(double inches) {
  const long sixteenths = std::lround(inches * 16);
  if (std::fabs(static_cast<double>(sixteenths) - inches * 16) > 1e-6) return "";
  const long whole = sixteenths / 16;
  long num = sixteenths % 16, den = 16;
  while (num > 0 && num % 2 == 0) num /= 2, den /= 2;
  if (num == 0) return std::to_string(whole);
  const std::string frac = std::to_string(num) + "/" + std::to_string(den);
  return whole ? std::to_string(whole) + "-" + frac : frac;
}

// `item` is one entry of the comma-separated list after `list_at` in `text`.
bool listHolds(std::string_view text, std::string_view list_at, const std::string& item) {
  const size_t at = text.find(list_at);
  if (at == std::string_view::npos || item.empty()) return false;
  const std::string list = ", " + std::string(text.substr(at + list_at.size())) + ",";
  return list.find(", " + item + ",") != std::string::npos;
}

// A library table: where its rows begin in the function's formula text, and
// the row a call found, as "Tr 48x8, ISO 2904 table". The row is looked up
// in the table the function prints, so a row that is not there is never
// shown (the step then shows the result alone).
struct LookupTable {
  const char* function;
  const char* rows_after;  // the rows follow this text in the formula
  std::string (*row)(const std::vector<double>& si_args, double si_result, const FunctionDecl& f);
};

const std::vector<LookupTable>& lookupTables() {
  static const std::vector<LookupTable> tables = {
      {"trap_pitch", ": ",
       [](const std::vector<double>& a, double r, const FunctionDecl& f) {
         const std::string item = "Tr " + rowNumber(a[0] * 1000) + "x" + rowNumber(r * 1000);
         return listHolds(f.formula, ": ", item) ? item + ", ISO 2904 table" : std::string();
       }},
      {"acme_tpi", ": ",
       [](const std::vector<double>& a, double r, const FunctionDecl& f) {
         const std::string label = inchLabel(a[0] / 0.0254), tpi = rowNumber(r * 0.0254);
         return listHolds(f.formula, ": ", label + " (" + tpi + ")")
                    ? "Acme " + label + "-" + tpi + ", ASME B1.5 table"
                    : std::string();
       }},
      {"acme_pitch", "",
       [](const std::vector<double>& a, double r, const FunctionDecl&) {
         const FunctionDecl* table = findFunction("acme_tpi");
         const std::string label = inchLabel(a[0] / 0.0254), tpi = rowNumber(0.0254 / r);
         return table && listHolds(table->formula, ": ", label + " (" + tpi + ")")
                    ? "Acme " + label + "-" + tpi + ", ASME B1.5 table"
                    : std::string();
       }},
      {"standard_motor_power", "the series ",
       [](const std::vector<double>&, double r, const FunctionDecl& f) {
         const std::string kw = rowNumber(r / 1000);
         std::string series(f.formula);
         if (series.size() > 3 && series.compare(series.size() - 3, 3, " kW") == 0)
           series.resize(series.size() - 3);
         return listHolds(series, "the series ", kw) ? kw + " kW, IEC 60072-1 series" : std::string();
       }},
      {"ball_screw_reliability_factor", "",
       [](const std::vector<double>& a, double r, const FunctionDecl& f) {
         const std::string row = rowNumber(a[0] * 100) + " % " + (r == 1 ? "a1 = " : "") + rowNumber(r);
         return f.formula.find(row) != std::string::npos
                    ? "R = " + rowNumber(a[0] * 100) + " %: a1 = " + rowNumber(r) + ", ISO 3408-5 table"
                    : std::string();
       }},
  };
  return tables;
}

const LookupTable* lookupTable(std::string_view function) {
  for (const LookupTable& t : lookupTables())
    if (function == t.function) return &t;
  return nullptr;
}

// The unit a per-revolution argument is shown in when it is a lead (a length
// per angle): its quantity's or its literal's own ("8.000 mm/rev"), so that
// a lead never shows as a plain length.
std::optional<Unit> leadUnit(const Expr& arg, const Dimension& dim, const Calculation& calc) {
  const Expr* x = withoutParens(&arg);
  if (dim.exponent(Base::Angle) != -1) return std::nullopt;
  if (x->kind == ExprKind::Name) {
    const int j = calc.sheet.find(x->text);
    if (j >= 0 && calc.display(j).dim == dim) return calc.display(j);
  }
  if (x->kind == ExprKind::Number && x->unit && x->unit->dim == dim) return *x->unit;
  Unit u;
  UnitError err;
  if (parseUnit("mm/rev", &u, &err) && u.dim == dim) return u;
  return std::nullopt;
}

// `dims`: the dimensions of the nodes of the formula `call` is in;
// `steps.given(j)`: quantity j's value as written, when it is given as one literal.
template <class Steps>
TrailCall auditCall(const Expr& call, const NodeDims& dims, const Calculation& calc, const Steps& steps,
                    const Unit& step_unit, int digits) {
  const FunctionDecl& f = *findFunction(call.text);
  TrailCall c;
  c.name = f.name;
  c.signature = std::string(f.name) + "(";
  for (size_t k = 0; k < f.args.size(); ++k) c.signature += (k ? ", " : "") + std::string(f.args[k].name);
  c.signature += ")";
  c.formula = f.formula;
  c.formula_is_expression = f.formula_is_expression;
  c.source = f.source;
  c.caution = f.caution;
  c.trivial = f.args.empty();
  const LibraryFormula& library_formula = parsedFormula(f);
  c.formula_expr = library_formula.expr.get();
  auto value_of = [&](const Expr& e) {
    const int j = calc.sheet.find(e.text);
    return j >= 0 && calc.ok(j) ? calc.si(j) : NAN;
  };
  struct Shown {
    std::string_view argument;  // its name in the function's formula
    TrailValue value;
    bool negative;
  };
  std::vector<Shown> shown;  // per argument evaluated, in order (a function has a few)
  shown.reserve(f.args.size());
  std::vector<double> library_args;
  library_args.reserve(f.args.size());
  c.arguments.reserveValues(f.args.size());
  c.with_values.reserveValues(f.args.size());
  c.with_values.addText(f.name);
  c.with_values.addText("(");
  for (size_t k = 0; k < f.args.size() && k < call.args.size(); ++k) {
    EvalFault fault;
    const double raw = evalTree(*call.args[k], dims, value_of, &fault);
    if (fault.node) return c;
    const Dimension& arg_dim = dims.of(*call.args[k]);
    const double v = argumentToLibrary(raw, f.args[k].per_revolution, arg_dim);  // what it sees
    library_args.push_back(v);
    const std::optional<Unit> lead =
        f.args[k].per_revolution ? leadUnit(*call.args[k], arg_dim, calc) : std::nullopt;
    const Unit unit = lead ? *lead : argumentUnit(*call.args[k], f.args[k], calc);
    // Given values and literals appear as written, as in the step itself; others rounded.
    std::optional<TrailValue> as_written;
    const Expr* x = withoutParens(call.args[k].get());
    if (x->kind == ExprKind::Name) {
      const int j = calc.sheet.find(x->text);
      if (calc.display(j).text == unit.text) as_written = steps.given(static_cast<size_t>(j));
    } else if (x->kind == ExprKind::Number && (x->unit ? x->unit->text == unit.text : unit.text == "1")) {
      as_written =
          written(x->text, lead ? raw : v, unit.fromSI(lead ? raw : v), x->unit ? unit.pretty() : "");
    }
    TrailValue shown_value = as_written ? std::move(*as_written) : rounded(lead ? raw : v, unit, digits);
    if (k) c.arguments.addText(", ");
    c.arguments.addText(f.args[k].name);
    c.arguments.addText(" = ");
    c.arguments.addValue(shown_value);
    if (k) c.with_values.addText(", ");
    c.with_values.addValue(shown_value);
    shown.push_back({f.args[k].name, std::move(shown_value), v < 0});
  }
  c.with_values.addText(")");
  if (const Expr* formula = c.formula_expr) {
    c.pretty = library_formula.pretty;
    const size_t names_in = namesIn(*formula);
    c.bindings.reserve(names_in);
    LineWriter line(names_in);
    NameWriterOf names([&](const Expr& name, bool power_base, std::string* out) {
      auto it = std::find_if(shown.begin(), shown.end(), [&](const Shown& a) { return a.argument == name.text; });
      if (it == shown.end()) {
        *out += name.text;
        return;
      }
      c.bindings.push_back({&name, it->value, it->negative});
      line.value(it->value, it->negative, power_base, out);
    });
    std::string text;
    text.reserve(renderedSize(*formula));
    renderExprTo(*formula, &names, true, &text);
    c.substituted = line.line(std::move(text));
    c.show_substituted = !c.substituted.empty() && lineText(c.substituted) != c.pretty;
  }
  EvalFault fault;
  const double r = evalTree(call, dims, value_of, &fault);
  const Dimension& call_dim = dims.of(call);
  if (!fault.node) {
    // In the step's own unit where it fits (lbf*in in a US sheet, mm/rev for
    // a lead), else the function's (a lead in it per revolution) as the
    // sheet's `units:` line weighs it.
    Unit unit;
    UnitError err;
    if (step_unit.dim == call_dim) unit = step_unit;
    else if (auto u = unitFor(step_unit, f.result); u && !f.result_per_revolution) unit = *u;
    else if (Unit natural; !f.result_unit.empty() &&
             parseUnit(std::string(f.result_unit) + (f.result_per_revolution ? "/rev" : ""), &natural, &err) &&
             natural.dim == call_dim)
      unit = calc.sheet.units.choose(call_dim, &natural);
    else
      unit = calc.sheet.units.choose(call_dim);
    c.result = rounded(r, unit, digits);
    if (const LookupTable* table = lookupTable(f.name); table && library_args.size() == f.args.size())
      c.row = table->row(library_args, f.result_per_revolution ? r * kTwoPi : r, f);
  }
  return c;
}


// In a copy of a step's formula, every library call inside another becomes
// a name "\x1F<k>" standing for the k-th call of the step (source order).
void markNestedCalls(Expr& e, bool inside_call, int* next) {
  const bool library = isLibraryCall(e);
  const int index = library ? (*next)++ : -1;
  for (auto& a : e.args) markNestedCalls(*a, inside_call || library, next);
  if (library && inside_call) {
    e.kind = ExprKind::Name;
    e.text = fmt::format("{}{}", kMark, index);
    e.args.clear();
  }
}

// `steps.given(j)`: quantity j's value as written, when it is given as one
// literal; `steps.shown(j)`: its value as its step shows it.
template <class Steps>
TrailLine substitute(const Expr& e, const Calculation& calc, const Steps& steps, const std::vector<TrailCall>& calls,
                     std::vector<TrailBinding>* bindings) {
  const size_t names_in = namesIn(e);
  bindings->reserve(names_in);
  LineWriter line(names_in);
  NameWriterOf names([&](const Expr& name, bool power_base, std::string* out) {
    if (!name.text.empty() && name.text[0] == kMark) {
      // A nested call, put as the value it gave.
      const size_t k = std::strtoul(name.text.c_str() + 1, nullptr, 10);
      if (k >= calls.size() || !calls[k].result) {
        out->append(name.text, 1, std::string::npos);
        return;
      }
      const TrailValue& v = *calls[k].result;
      bindings->push_back({&name, v, v.si < 0});
      line.value(v, v.si < 0, power_base, out);
      return;
    }
    const int j = calc.sheet.find(name.text);
    const QuantityView s = calc.quantity(j);
    // A given value appears as written ("950 kg", "0.35"), unrounded; any other rounded, as in its step.
    std::optional<TrailValue> given = steps.given(static_cast<size_t>(j));
    TrailValue v = given ? std::move(*given) : steps.shown(static_cast<size_t>(j));
    const bool negative = s.si < 0 || s.display.fromSI(s.si) < 0;
    bindings->push_back({&name, v, negative});
    line.value(std::move(v), negative, power_base, out);
  });
  std::string text;
  text.reserve(renderedSize(e));
  renderExprTo(e, &names, true, &text);
  return line.line(std::move(text));
}

}  // namespace

std::optional<TrailValue> writtenLiteral(const Expr& side, double si, const Unit& unit) {
  const Expr* x = withoutParens(&side);
  if (x->kind != ExprKind::Number) return std::nullopt;
  // The value stays in the check's unit (JSON `lhs`, `rhs`); the text is the literal's own.
  if (x->unit) return written(x->text, si, unit.fromSI(si), x->unit->pretty());
  if (unit.text == "1" || unit.text.empty()) return written(x->text, si, unit.fromSI(si), "");
  return std::nullopt;
}

TrailValue checkSideValue(const Expr& side, double si, const Unit& unit, int digits) {
  if (std::optional<TrailValue> literal = writtenLiteral(side, si, unit)) return *literal;
  return rounded(si, unit, digits);
}

namespace {

// A utilisation in percent, to whole percent except where rounding would
// show a pass or a fail as exactly 100 %.
std::string percentText(double u) {
  const double p = u * 100;
  for (int decimals = 0; decimals < 4; ++decimals) {
    const std::string text = fmt::format("{:.{}f}", p, decimals);
    const double back = std::strtod(text.c_str(), nullptr);
    if (back != 100 || p == 100) return text + " %";
  }
  return fmt::format("{:.4f} %", p);
}

// Demand and capacity of a check, by its comparison: `x <= limit` has the
// demand on the left, `x >= need` on the right.
void measureCheck(TrailCheck* tc, const CheckView& s, const Check& c, int digits) {
  const bool demand_left = c.op == Comparison::Less || c.op == Comparison::LessEqual;
  const double demand = demand_left ? s.lhs : s.rhs, capacity = demand_left ? s.rhs : s.lhs;
  tc->margin = rounded(capacity - demand, s.display, digits);
  if (!s.ok) return;
  if (demand > 0 && capacity > 0 && std::isfinite(demand / capacity)) {
    tc->utilisation = demand / capacity;
    tc->measure = "utilisation " + percentText(*tc->utilisation);
  } else {
    tc->measure = "margin " + valueText(tc->margin);
  }
}

// Where a trail says what the library's tests of a function are.
std::string verificationOf(const FunctionDecl& f) { return "docs/verification.md, `" + std::string(f.name) + "`"; }

// The method of a library function for "Library functions used": a table
// lookup without its rows (the row found is shown at each step).
std::string methodOf(const FunctionDecl& f) {
  const LookupTable* table = lookupTable(f.name);
  if (!table || !*table->rows_after) return std::string(f.formula);
  const size_t at = f.formula.find(table->rows_after);
  if (at == std::string::npos) return std::string(f.formula);
  const std::string after = table->rows_after;
  std::string method(f.formula.substr(0, at + (after == ": " ? 0 : after.size())));
  while (!method.empty() && method.back() == ' ') method.pop_back();
  return method + " (the row found is shown at each step; every row: docs/functions.md)";
}

// How far a check is from failing, in SI: positive when it holds.
double marginOf(Comparison op, double lhs, double rhs) {
  return op == Comparison::Less || op == Comparison::LessEqual ? rhs - lhs : lhs - rhs;
}

// A difference of two values shown in `unit`: no offset (a margin of 5 degC is 5 K).
TrailValue difference(double si, const Unit& unit, int digits) {
  const double v = si / unit.factor;
  return {v, si, roundNumber(v, digits), unit.pretty()};
}

TrailCaseCheck caseCheck(const Check& c, const CheckResult& r, const Unit& unit, int digits) {
  TrailCaseCheck cc;
  cc.ok = r.ok;
  cc.passed = r.ok && r.passed;
  cc.lhs = r.ok ? checkSideValue(*c.lhs, r.lhs, unit, digits) : rounded(r.lhs, unit, digits);
  cc.rhs = r.ok ? checkSideValue(*c.rhs, r.rhs, unit, digits) : rounded(r.rhs, unit, digits);
  cc.margin = difference(r.ok ? marginOf(c.op, r.lhs, r.rhs) : 0.0, unit, digits);
  return cc;
}

// The load cases: each case's header, and per check the result per case and
// the governing case (least margin; the first on a tie). A step's value per
// case is its builder's (TrailStepBuilder::addCaseValues).
void addCases(const Calculation& calc, int digits, Trail* t) {
  const Sheet& sheet = calc.sheet;
  t->shown_case = calc.shown_case;
  if (calc.cases.empty()) return;
  TrailCase nominal;
  nominal.name = kNominalCase;
  t->cases.push_back(nominal);
  std::vector<const Results*> results = {&calc.results};
  for (const CaseRun& run : calc.cases) {
    TrailCase tc;
    tc.name = run.def->name;
    tc.description = run.def->description;
    tc.line = run.def->line;
    for (const CaseReplacement& r : run.def->replacements)
      tc.replacements += (tc.replacements.empty() ? "" : ", ") + r.name + " = " + renderExpr(*r.expr);
    tc.ok = run.ok();
    for (const Diagnostic& d : run.errors.list()) tc.errors.push_back(d.headline());
    t->cases_failed += !tc.ok;
    t->cases.push_back(std::move(tc));
    results.push_back(&run.results);
  }
  for (TrailCheck& tc : t->checks) {
    const Check& c = sheet.checks[tc.index];
    const Unit& unit = calc.checkDisplay(tc.index);
    double least = 0.0;
    for (size_t k = 0; k < results.size(); ++k) {
      const bool ran = k == 0 || calc.cases[k - 1].ok();
      CheckResult r = ran ? results[k]->checks[tc.index] : CheckResult();
      if (k == 0 && !calc.model->checks()[tc.index].has_dim) r = CheckResult();
      TrailCaseCheck cc = caseCheck(c, r, unit, digits);
      if (cc.ok && (tc.governing < 0 || cc.margin.si < least)) {
        tc.governing = static_cast<int>(k);
        least = cc.margin.si;
      }
      if (ran) (cc.passed ? t->cases[k].passed : t->cases[k].failed)++;
      if (k > 0 && ran && !cc.passed) ++t->failed_in_cases;
      tc.cases.push_back(std::move(cc));
    }
  }
}

}  // namespace

// Builds one step of the trail from the Calculation, whenever a renderer
// asks for it: what a step needs of the others (their values as shown, the
// warnings flagged at it, whether its part's table lists it) is found from
// the Calculation and the few tables below, never from other built steps,
// so that a step costs the same built alone as built with all the rest.
class TrailStepBuilder {
 public:
  TrailStepBuilder(const Calculation& calc, int digits) : calc_(calc), digits_(digits) {
    results_.push_back(&calc.results);
    for (const CaseRun& run : calc.cases) results_.push_back(&run.results);
  }

  // The whole step: head, origin, the calls' audits, the substituted line,
  // its warnings and its values per load case. Into a new step where it is
  // kept: a TrailStep moved is some forty strings.
  // `explained` false: all but what explain() adds (the origin, the calls'
  // audits and the substituted line), for a reader of the head alone.
  void build(size_t i, TrailStep* step, bool explained = true) const;
  // How many steps there are: one per quantity.
  size_t size() const { return param.size(); }

  bool isInput(size_t i) const { return calc_.isInput(i); }
  const std::string& name(size_t i) const { return calc_.sheet.quantities[i].name; }
  // A given value written as one literal in its display unit, as written; else nothing.
  std::optional<TrailValue> given(size_t i) const { return memo_.empty() ? findGiven(i) : memo_[i].given; }
  // Quantity i's value as its step shows it (0 in its unit when it has none).
  TrailValue shown(size_t i) const { return memo_.empty() ? findShown(i) : memo_[i].shown; }
  // Finds every quantity's shown and given value once, for a trail that
  // builds every step: each is read by every formula that names it.
  void remember() {
    memo_.reserve(calc_.sheet.quantities.size());
    for (size_t i = 0; i < calc_.sheet.quantities.size(); ++i) memo_.push_back({findShown(i), findGiven(i)});
  }

  // What an instance's parameter tables show of quantity i, found without
  // building its step; false in a sheet with load cases, where whether it
  // varies needs the step's case values.
  bool paramRow(size_t i, TrailInstanceParam* row) const {
    if (!calc_.cases.empty()) return false;
    const Sheet& sheet = calc_.sheet;
    const Quantity& q = sheet.quantities[i];
    const QuantityView s = calc_.quantity(i);
    row->name = sheet.localName(q.instance, q.name);
    row->step = static_cast<int>(i);
    row->quantity = q.name;
    row->result = shown(i);
    std::optional<TrailValue> as_given = given(i);
    row->shown = as_given ? std::move(*as_given) : row->result;
    row->unit_written = unitWritten(q, s);
    row->description = q.description;
    row->overridden = q.overridden;
    row->in_part_table = inPartTable(i, s.input, /*varies=*/false, warned(i));  // no cases: it varies nowhere
    return true;
  }

  // Every warning flagged at a step, by quantity, each quantity's in the
  // order of the diagnostics.
  struct Flagged {
    int quantity;
    size_t order;  // into Trail::warnings
    std::string message;
  };
  std::vector<Flagged> warnings;
  std::vector<Flagged>::const_iterator firstWarning(size_t i) const {
    return std::lower_bound(warnings.begin(), warnings.end(), static_cast<int>(i),
                            [](const Flagged& w, int q) { return w.quantity < q; });
  }
  bool warned(size_t i) const {
    const auto w = firstWarning(i);
    return w != warnings.end() && w->quantity == static_cast<int>(i);
  }
  // Per quantity: a parameter of some instance (its part's table shows it).
  std::vector<char> param;

 private:
  // A parameter given as a value, the same in every case and warned of
  // nowhere, is shown in its part's table alone, not in the Inputs list.
  bool inPartTable(size_t i, bool input, bool varies, bool has_warnings) const {
    return param[i] && input && !varies && !has_warnings;
  }
  // The contract's unit: the declared display unit as written, else the engine's choice.
  static const std::string& unitWritten(const Quantity& q, const QuantityView& s) {
    return s.declared ? q.unit_written : s.display.text;
  }
  // The fields a step has without explaining its value: name, texts,
  // given value, result and units.
  void head(size_t i, TrailStep* step) const;
  void explain(TrailStep* s) const;
  void addCaseValues(TrailStep* s) const;
  std::optional<TrailValue> findGiven(size_t i) const;
  TrailValue findShown(size_t i) const {
    const QuantityView s = calc_.quantity(i);
    return rounded(s.si, s.display, digits_);
  }

  const Calculation& calc_;
  const int digits_;
  std::vector<const Results*> results_;  // the nominal's, then each case's
  struct Shown {
    TrailValue shown;
    std::optional<TrailValue> given;
  };
  std::vector<Shown> memo_;  // per quantity, when remember() was called
};

std::optional<TrailValue> TrailStepBuilder::findGiven(size_t i) const {
  const Quantity& q = calc_.sheet.quantities[i];
  const QuantityView s = calc_.quantity(i);
  if (!s.ok) return std::nullopt;
  const Expr* x = withoutParens(q.expr.get());
  if (x->kind != ExprKind::Number) return std::nullopt;
  const bool same_unit = x->unit ? (s.display.text == x->unit->text && !s.declared) ||
                                       (q.display && q.display->text == x->unit->text)
                                 : s.display.text == "1" || s.display.text.empty();
  if (!same_unit) return std::nullopt;
  return written(x->text, s.si, s.display.fromSI(s.si), x->unit ? x->unit->pretty() : "");
}

void TrailStepBuilder::head(size_t i, TrailStep* to) const {
  const Sheet& sheet = calc_.sheet;
  const Quantity& q = sheet.quantities[i];
  const QuantityView s = calc_.quantity(i);
  TrailStep& step = *to;
  step.index = static_cast<int>(i);
  step.name = q.name;
  step.description = q.description;
  step.section = q.section;
  step.line = q.line;
  step.input = s.input;
  step.overridden = q.overridden;
  step.instance = q.instance;
  step.local_name = sheet.localName(q.instance, q.name);
  // In the names of the scope the formula is written in (a --set one in the main sheet's).
  const int scope = q.overridden ? -1 : q.expr_instance;
  // A name is never put in parentheses as a power's base: it holds no space.
  NameWriterOf local([&](const Expr& n, bool, std::string* out) { *out += sheet.localName(scope, n.text); });
  NameWriter* names = scope < 0 ? nullptr : &local;
  step.formula.reserve(renderedSize(*q.expr));
  renderExprTo(*q.expr, names, false, &step.formula);
  step.pretty.reserve(renderedSize(*q.expr));
  renderExprTo(*q.expr, names, true, &step.pretty);
  step.expr = q.expr.get();
  step.ok = s.ok;
  step.result = shown(i);
  step.given = given(i);
  step.formula_in_notes = !step.given && step.formula != (s.ok ? valueText(step.result) : "");
  step.unit = s.display.text;
  step.unit_declared = s.declared;
  step.unit_written = unitWritten(q, s);
  step.si_unit = s.dim.siSymbol();
  step.unit_pretty = s.display.pretty();
  step.dimension = s.dim.name();
}

// Where the value comes from (given in the worksheet, set on the command
// line, calculated, or calculated with the cited library methods), each
// library call's audit, and the formula with the values it read.
void TrailStepBuilder::explain(TrailStep* step) const {
  TrailStep& s = *step;
  const Sheet& sheet = calc_.sheet;
  const std::string& by_case = sheet.quantities[s.index].overrideCase();
  s.origin = s.overridden ? (by_case.empty() ? "set on the command line" : "replaced in case " + by_case)
             : s.input    ? "given"
                          : "calculated";
  if (!calc_.ok(s.index)) return;
  const Expr& expr = *sheet.quantities[s.index].expr;
  std::vector<const Expr*> calls;
  bool nested_call = false;
  collectCalls(expr, &calls, &nested_call);
  const NodeDims dims = calc_.exprDims(static_cast<size_t>(s.index));
  s.calls.reserve(calls.size());
  for (const Expr* call : calls)
    s.calls.push_back(auditCall(*call, dims, calc_, *this, calc_.display(s.index), digits_));
  // A call inside another's arguments is shown there by its value.
  for (size_t k = 0; k < calls.size(); ++k)
    for (size_t o = 0; o < calls.size(); ++o)
      if (o != k && calls[o]->begin <= calls[k]->begin && calls[k]->end <= calls[o]->end)
        s.calls[k].nested = true;
  s.substituted_expr = &expr;
  if (nested_call) {
    ExprPtr copy = cloneExpr(expr);
    int next = 0;
    markNestedCalls(*copy, false, &next);
    s.substituted_owner = std::shared_ptr<const Expr>(std::move(copy));
    s.substituted_expr = s.substituted_owner.get();
  }
  s.substituted = substitute(*s.substituted_expr, calc_, *this, s.calls, &s.bindings);
  const std::string substituted = lineText(s.substituted);
  s.show_substituted = substituted != s.pretty && substituted != valueText(s.result);
  const Expr* x = withoutParens(&expr);
  if (!calls.empty() && x == calls[0]) s.calls[0].whole = true;
  s.single_call = !calls.empty() && s.calls[0].whole && s.calls[0].formula_is_expression &&
                  s.calls[0].show_substituted;
  for (const TrailCall& c : s.calls) s.origin += "; " + c.name + ": " + c.source;
}

// The step's value in each load case, the nominal first; `varies` when a
// case replaces it or gives it another value.
void TrailStepBuilder::addCaseValues(TrailStep* step) const {
  if (calc_.cases.empty()) return;
  TrailStep& s = *step;
  const QuantityView state = calc_.quantity(s.index);
  const Slot slot(static_cast<uint32_t>(s.index));
  for (size_t k = 0; k < results_.size(); ++k) {
    TrailCaseValue v;
    const Results& r = *results_[k];
    v.ok = k == 0 ? state.ok : calc_.cases[k - 1].ok() && r.ok(slot);
    v.value = rounded(v.ok ? r.value(slot) : 0.0, state.display, digits_);
    v.formula = s.formula;
    if (k > 0)
      for (const Binding& b : calc_.cases[k - 1].inputs->own())
        if (b.slot == slot && b.expr) {
          v.replaced = true;
          v.formula = renderExpr(*b.expr);
        }
    if (k > 0 && (v.replaced || v.ok != s.cases[0].ok || v.value.si != s.cases[0].value.si)) s.varies = true;
    s.cases.push_back(std::move(v));
  }
}

void TrailStepBuilder::build(size_t i, TrailStep* step, bool explained) const {
  TrailStep& s = *step;
  head(i, step);
  if (explained) explain(step);
  for (auto w = firstWarning(i); w != warnings.end() && w->quantity == static_cast<int>(i); ++w)
    s.warnings.push_back(w->message);
  addCaseValues(step);
  // After the warnings and the cases: an input that has either stays in the Inputs list.
  s.in_part_table = inPartTable(i, s.input, s.varies, !s.warnings.empty());
}

size_t TrailSteps::size() const { return kept_ ? kept_->size() : builder_ ? builder_->size() : 0; }

// A kept trail reads only itself, so that it may outlive its Calculation.
bool TrailSteps::isInput(size_t i) const { return kept_ ? (*kept_)[i].input : builder_->isInput(i); }

std::shared_ptr<const TrailStep> TrailSteps::get(size_t i) const {
  if (kept_) return std::shared_ptr<const TrailStep>(kept_, &(*kept_)[i]);
  auto step = std::make_shared<TrailStep>();
  builder_->build(i, step.get());
  return step;
}

std::shared_ptr<const TrailStep> TrailSteps::head(size_t i) const {
  if (kept_) return get(i);
  auto step = std::make_shared<TrailStep>();
  builder_->build(i, step.get(), false);
  return step;
}

const std::string& TrailSteps::name(size_t i) const {
  return kept_ ? (*kept_)[i].name : builder_->name(i);
}

bool TrailSteps::passes(size_t i, Filter filter) const {
  return filter == Filter::All || isInput(i) == (filter == Filter::Inputs);
}

bool TrailSteps::anyCalculated() const {
  for (size_t i = 0; i < size(); ++i)
    if (!isInput(i)) return true;
  return false;
}

namespace {

// A Section or a Note, its text kept beside the blocks.
void addTextBlock(Trail* t, TrailBlock::Kind kind, std::string text, int instance) {
  t->blocks.push_back({kind, static_cast<int>(t->block_texts.size()), instance});
  t->block_texts.push_back(std::move(text));
}

// The quantities of an instance its part shows as steps. A parameter bound
// to a number or to one name of the using sheet has its value and its
// binding in the part's table already: a step would repeat that row.
std::vector<int> instanceSteps(const Sheet& sheet, const Instance& inst) {
  std::vector<int> in_table, steps;
  for (const InstanceParam& p : inst.params) {
    const Quantity& q = sheet.quantities[static_cast<size_t>(p.quantity)];
    const bool plain = q.expr && (q.expr->kind == ExprKind::Number || q.expr->kind == ExprKind::Name);
    if (!p.binding.empty() && !q.overridden && plain) in_table.push_back(p.quantity);
  }
  for (int q : inst.quantities)
    if (std::find(in_table.begin(), in_table.end(), q) == in_table.end()) steps.push_back(q);
  return steps;
}

// Each instance as a part of its own after the main sheet's blocks: a
// heading naming the instance, its template's title and file; its
// parameters with their bound values and bindings; then its steps and checks.
// `builder`: the trail's, when its steps are built when read (else null).
void addInstances(const Sheet& sheet, const TrailStepBuilder* builder, Trail* t) {
  for (const Instance& inst : sheet.instances) {
    TrailInstance ti;
    ti.name = inst.name;
    ti.title = inst.title;
    ti.path = inst.path;
    ti.parent = inst.parent;
    ti.heading = "Instance " + inst.name + ": " +
                 (inst.title.empty() ? std::string("template") : inst.title) + " (" + inst.path + ")";
    std::string params;
    for (const InstanceParam& p : inst.params) {
      TrailInstanceParam tp;
      if (!builder || !builder->paramRow(static_cast<size_t>(p.quantity), &tp)) {
        const TrailSteps::Held held = t->steps.head(static_cast<size_t>(p.quantity));
        const TrailStep& s = *held;
        tp = {s.local_name, p.quantity, {}, s.in_part_table, s.name, s.given ? *s.given : s.result, s.result,
              s.unit_written, s.description, s.overridden};
      }
      tp.binding = p.binding;
      params += (params.empty() ? "" : "; ") + tp.name + " = ";
      const std::string value = valueText(tp.shown);
      if (!p.binding.empty() && p.binding != value) params += p.binding + " = ";
      params += value;
      if (tp.overridden) params += " (set on the command line)";
      else if (p.binding.empty()) params += " (default)";
      ti.params.push_back(std::move(tp));
    }
    ti.steps = instanceSteps(sheet, inst);
    ti.checks = inst.checks;
    const int at = static_cast<int>(t->instances.size());
    addTextBlock(t, TrailBlock::Section, ti.heading, at);
    if (!params.empty()) addTextBlock(t, TrailBlock::Note, "Parameters: " + params + ".", at);
    for (int q : ti.steps) t->blocks.push_back({TrailBlock::Step, q, at});
    for (int c : ti.checks) t->blocks.push_back({TrailBlock::CheckRef, c, at});
    t->instances.push_back(std::move(ti));
  }
}

// A warning is flagged at the step (or check) it was found in. One that does
// not say (a dimension warning in the main sheet) at the main sheet's steps on
// its line, else at the first check there: a template's lines are its own,
// shared by its instances. Fills builder->warnings, the checks' warnings,
// Trail::warnings and warnings_at_steps.
void placeWarnings(const Calculation& calc, TrailStepBuilder* builder, Trail* t) {
  const Sheet& sheet = calc.sheet;
  // The steps the trail shows: the main sheet's blocks (made already) and the instances' parts.
  std::vector<bool> has_step(sheet.quantities.size(), false);
  for (const TrailBlock& b : t->blocks)
    if (b.kind == TrailBlock::Step) has_step[static_cast<size_t>(b.index)] = true;
  for (const Instance& inst : sheet.instances)
    for (int q : instanceSteps(sheet, inst)) has_step[static_cast<size_t>(q)] = true;
  struct ByLine {
    int line;
    size_t order;  // into the warnings
    std::string message;
  };
  std::vector<ByLine> by_line;
  std::vector<char> placed;
  for (const Diagnostic& d : calc.diags.list()) {
    if (d.severity != Severity::Warning) continue;
    const size_t order = t->warnings.size();
    t->warnings.push_back(d.headline());
    placed.push_back(false);
    if (d.site.quantity >= 0) {
      const size_t q = static_cast<size_t>(d.site.quantity);
      if (!sheet.quantities[q].overridden && has_step[q]) {
        builder->warnings.push_back({d.site.quantity, order, d.message});
        placed.back() = true;
      }
    } else if (d.site.check >= 0) {
      t->checks[static_cast<size_t>(d.site.check)].warnings.push_back(d.message);
      placed.back() = true;
    } else if (d.path == calc.path && d.line > 0) {
      by_line.push_back({d.line, order, d.message});
    }
  }
  // The main sheet's steps on a warning's line, in one pass over the quantities.
  std::stable_sort(by_line.begin(), by_line.end(), [](const ByLine& a, const ByLine& b) { return a.line < b.line; });
  if (!by_line.empty())
    for (size_t i = 0; i < sheet.quantities.size(); ++i) {
      const Quantity& q = sheet.quantities[i];
      if (q.instance >= 0 || q.overridden) continue;
      auto [first, last] = std::equal_range(by_line.begin(), by_line.end(), ByLine{q.line, 0, ""},
                                            [](const ByLine& a, const ByLine& b) { return a.line < b.line; });
      for (auto w = first; w != last; ++w) {
        builder->warnings.push_back({static_cast<int>(i), w->order, w->message});
        placed[w->order] = true;
      }
    }
  // Within a quantity, the order of the diagnostics.
  std::sort(builder->warnings.begin(), builder->warnings.end(), [](const auto& a, const auto& b) {
    return a.quantity != b.quantity ? a.quantity < b.quantity : a.order < b.order;
  });
  std::vector<const ByLine*> in_order;
  for (const ByLine& w : by_line) in_order.push_back(&w);
  std::sort(in_order.begin(), in_order.end(), [](const ByLine* a, const ByLine* b) { return a->order < b->order; });
  for (const ByLine* w : in_order)
    for (TrailCheck& c : t->checks)
      if (!placed[w->order] && c.instance < 0 && c.line == w->line) {
        c.warnings.push_back(w->message);
        placed[w->order] = true;
      }
  for (char p : placed) t->warnings_at_steps += p ? 1 : 0;
  for (const auto& w : builder->warnings)
    if (t->warned_steps.empty() || t->warned_steps.back() != w.quantity) t->warned_steps.push_back(w.quantity);
}

}  // namespace

std::vector<std::pair<size_t, size_t>> caseGroups(size_t cases, size_t most) {
  std::vector<std::pair<size_t, size_t>> groups;
  if (cases == 0 || most == 0) return groups;
  // Groups of nearly equal size: 7 cases in groups of 6 are 4 and 3, not 6 and 1.
  const size_t count = (cases + most - 1) / most;
  size_t first = 0;
  for (size_t g = 0; g < count; ++g) {
    const size_t size = (cases - first + (count - g) - 1) / (count - g);
    groups.emplace_back(first, first + size);
    first += size;
  }
  return groups;
}

Trail buildTrail(const Calculation& calc, int digits, TrailKeep keep) {
  const Sheet& sheet = calc.sheet;
  Trail t;
  t.digits = digits;
  t.path = calc.path;
  t.sha256 = calc.sha256;
  t.generator = std::string("calctrail ") + CALCTRAIL_VERSION;
  for (const SheetFile& f : sheet.files) t.files.push_back({f.path, f.sha256});
  if (t.files.empty()) t.files.push_back({calc.path, calc.sha256});
  t.title = sheet.meta.get("title");
  for (const std::string& key : Metadata::keys()) {
    if (key == "title") continue;
    const std::string v = sheet.meta.get(key);
    if (!v.empty()) t.meta.emplace_back(key, v);
  }
  auto builder = std::make_shared<TrailStepBuilder>(calc, digits);
  builder->param.assign(sheet.quantities.size(), 0);
  for (const Instance& inst : sheet.instances)
    for (const InstanceParam& p : inst.params) builder->param[static_cast<size_t>(p.quantity)] = 1;
  // Every library function called, in order of first use, and the quantities
  // that call each (those calculated, whose steps audit their calls).
  std::vector<const FunctionDecl*> used;
  std::vector<std::vector<std::string>> used_by;
  std::vector<int> first_caller;  // per function used: the first calculated quantity calling it, -1 for none
  std::vector<const Expr*> calls;
  for (size_t i = 0; i < sheet.quantities.size(); ++i) {
    const Quantity& q = sheet.quantities[i];
    if (q.overridden) {
      std::string value = q.overrideText();
      while (!value.empty() && value.front() == ' ') value.erase(0, 1);
      while (!value.empty() && value.back() == ' ') value.pop_back();
      t.modified_by.push_back({q.name, value, q.line});
    }
    calls.clear();
    collectCalls(*q.expr, &calls);
    for (const Expr* call : calls) {
      const FunctionDecl* f = findFunction(call->text);
      size_t k = static_cast<size_t>(std::find(used.begin(), used.end(), f) - used.begin());
      if (k == used.size()) {
        used.push_back(f);
        used_by.emplace_back();
        first_caller.push_back(-1);
      }
      if (!calc.ok(i)) continue;
      if (used_by[k].empty() || used_by[k].back() != q.name) used_by[k].push_back(q.name);
      if (first_caller[k] < 0) first_caller[k] = static_cast<int>(i);
    }
  }
  t.checks.reserve(sheet.checks.size());
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    const CheckView s = calc.check(k);
    TrailCheck tc;
    tc.index = static_cast<int>(k);
    tc.name = c.name;
    tc.description = c.description;
    tc.section = c.section;
    tc.line = c.line;
    tc.op = comparisonText(c.op);
    tc.instance = c.instance;
    tc.condition = conditionText(c);  // dotted names: the check summary lists every instance's
    tc.lhs_expr = c.lhs.get();
    tc.rhs_expr = c.rhs.get();
    tc.unit = s.display.text;
    tc.ok = s.ok;
    // The SI values even when a side did not evaluate, as the JSON has always given them.
    tc.lhs = rounded(s.lhs, s.display, digits);
    tc.rhs = rounded(s.rhs, s.display, digits);
    if (s.ok) {
      tc.lhs = checkSideValue(*c.lhs, s.lhs, s.display, digits);
      tc.rhs = checkSideValue(*c.rhs, s.rhs, s.display, digits);
    }
    tc.passed = s.ok && s.passed;
    measureCheck(&tc, s, c, digits);
    (tc.passed ? t.passed : t.failed)++;
    t.checks.push_back(std::move(tc));
  }
  std::string note;
  auto flushNote = [&] {
    if (note.empty()) return;
    addTextBlock(&t, TrailBlock::Note, note, -1);
    note.clear();
  };
  // One block a statement at most, and an instance's part's: exact, not grown by doubling.
  size_t most = sheet.statements.size();
  for (const Instance& inst : sheet.instances) most += 2 + inst.quantities.size() + inst.checks.size();
  t.blocks.reserve(most);
  for (const Statement& st : sheet.statements) {
    if (st.kind == Statement::Note) {
      note += (note.empty() ? "" : " ") + st.text();
      continue;
    }
    if (st.kind == Statement::Blank || st.kind == Statement::Comment || st.kind == Statement::Meta) {
      if (st.kind == Statement::Blank) flushNote();
      continue;
    }
    flushNote();
    if (st.kind == Statement::Section) addTextBlock(&t, TrailBlock::Section, st.text(), -1);
    if (st.kind == Statement::Define) t.blocks.push_back({TrailBlock::Step, st.index, -1});
    if (st.kind == Statement::CheckStmt) t.blocks.push_back({TrailBlock::CheckRef, st.index, -1});
  }
  flushNote();
  // The warnings before any step is built: a step holds those flagged at
  // it, and an instance's parameter table reads whether its step has one.
  placeWarnings(calc, builder.get(), &t);
  // The steps, kept or built when read; from here on every step is read through t.steps.
  const bool small = sheet.quantities.size() <= kKeptSteps;
  const bool keep_all = keep == TrailKeep::All || (keep == TrailKeep::BySize && small);
  // Each value is read by every formula that names it: found once here,
  // unless the sheet is large (then a table per quantity would outweigh it).
  if (keep_all || small) builder->remember();
  if (keep_all) {
    auto kept = std::make_shared<std::vector<TrailStep>>(sheet.quantities.size());
    for (size_t i = 0; i < sheet.quantities.size(); ++i) builder->build(i, &(*kept)[i]);
    t.steps.kept_ = std::move(kept);
  } else {
    t.steps.builder_ = std::move(builder);
  }
  addCases(calc, digits, &t);
  addInstances(sheet, keep_all ? nullptr : t.steps.builder_.get(), &t);
  // Library functions used, each once, in order of first use.
  t.functions.reserve(used.size());
  for (size_t k = 0; k < used.size(); ++k) {
    const FunctionDecl* f = used[k];
    TrailFunction fn;
    fn.name = f->name;
    fn.signature = std::string(f->name) + "(";
    for (size_t a = 0; a < f->args.size(); ++a) fn.signature += (a ? ", " : "") + std::string(f->args[a].name);
    fn.signature += ")";
    fn.summary = f->summary;
    fn.method = methodOf(*f);
    fn.formula_is_expression = f->formula_is_expression;
    const LibraryFormula& formula = parsedFormula(*f);
    fn.formula_expr = formula.expr.get();
    fn.pretty = formula.pretty;
    fn.limits = f->limits;
    fn.source = f->source;
    fn.verification = verificationOf(*f);
    fn.trivial = f->args.empty();
    // A constant (no arguments) is listed by the value its first call gave;
    // only a calculated quantity's calls are audited.
    for (size_t i = fn.trivial && first_caller[k] >= 0 ? static_cast<size_t>(first_caller[k]) : sheet.quantities.size();
         fn.value.empty() && i < sheet.quantities.size(); ++i) {
      if (!calc.ok(i)) continue;
      calls.clear();
      collectCalls(*sheet.quantities[i].expr, &calls);  // a step is built only where it calls the constant
      if (std::none_of(calls.begin(), calls.end(), [&](const Expr* c) { return c->text == f->name; })) continue;
      const TrailSteps::Held step = t.steps.get(i);  // held: the loop reads into it
      for (const TrailCall& c : step->calls)
        if (c.name == f->name && c.result) {
          fn.value = valueText(*c.result);
          break;
        }
    }
    fn.used_by = std::move(used_by[k]);
    t.functions.push_back(std::move(fn));
  }
  // Cautions from the one catalogue: the general ones, then those of the
  // functions used, each entry once however many functions carry it.
  std::vector<const Caution*> cautions;
  for (const Caution& c : cautionCatalogue())
    if (c.general) cautions.push_back(&c);
  for (const FunctionDecl* f : used)
    for (const Caution* c : cautionsForFunctionText(f->caution))
      if (std::find(cautions.begin(), cautions.end(), c) == cautions.end()) cautions.push_back(c);
  for (const Caution* c : cautions) {
    t.cautions.push_back(c->text);
    t.caution_ids.push_back(c->id);
  }
  addStudies(calc, digits, &t);
  return t;
}

}  // namespace calctrail
