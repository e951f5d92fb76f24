#include "engine/report/trail.h"

#include <algorithm>

#include <cmath>
#include <cstdlib>
#include <map>
#include <memory>
#include <optional>

#include "engine/eval/math_functions.h"
#include "engine/eval/tree_eval.h"
#include "engine/report/number_format.h"
#include "engine/report/power_of_ten.h"
#include "engine/sheet/expr_parser.h"
#include "engine/units/unit_parser.h"
#include "functions/function_decl.h"

namespace calctrail {

const std::vector<std::string>& generalCautions() {
  static const std::vector<std::string> c = {
      "Friction values vary widely: size torque and motor with the high value and test self-locking "
      "and back-driving with the low one.",
      "Self-locking is no brake: vibration, shock and lubrication can back-drive a screw that is "
      "self-locking on paper. Provide a brake or lock where a load is held.",
      "Long screws in compression buckle: check the column with its real end conditions and length.",
      "These results are a design aid. They are to be reviewed by a qualified engineer under the "
      "codes, standards and local rules that apply to the machine, above all where a load is lifted "
      "or clamped over people.",
  };
  return c;
}

std::string conditionText(const Check& c) {
  return renderExpr(*c.lhs) + " " + comparisonText(c.op) + " " + renderExpr(*c.rhs);
}

std::string verdictWords(const Trail& t, VerdictForm form) {
  const bool headline = form == VerdictForm::Headline;
  if (t.checks.empty())
    return headline ? "Checks: none in this worksheet" : "This worksheet has no design checks.";
  if (t.failed == 0) return headline ? fmt::format("Checks: all {} pass", t.passed)
                                     : fmt::format("All {} checks pass.", t.passed);
  return fmt::format(headline ? "Checks: {} of {} FAIL:" : "{} of {} checks fail:", t.failed,
                     t.checks.size());
}

void appendValue(fmt::memory_buffer& out, const TrailValue& v, NumberStyle style) {
  const std::string number = numberText(v.number, style);
  fmt::format_to(std::back_inserter(out), "{}", joinNumberUnit(number, v.unit));
}

std::string valueText(const TrailValue& v, NumberStyle style) {
  fmt::memory_buffer out;
  appendValue(out, v, style);
  return fmt::to_string(out);
}

std::string lineText(const TrailLine& line, NumberStyle style) {
  fmt::memory_buffer out;
  for (const TrailPiece& p : line) {
    if (p.value) appendValue(out, *p.value, style);
    else
      fmt::format_to(std::back_inserter(out), "{}",
                     style == NumberStyle::TimesTen ? timesTenPowers(p.text) : p.text);
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

// renderExpr() fills names with text; the trail keeps values apart. Each
// value goes in as a marker "\x1F<index>\x1F" (no worksheet text holds that
// byte) and the rendered text is then cut at the markers. renderExpr puts a
// power's base in parentheses when its text holds a space ((33.00 mm)^2), so
// the marker holds one exactly when the value's text does.
constexpr char kMark = '\x1F';

std::string marker(std::vector<TrailValue>* values, TrailValue v) {
  const bool spaced = valueText(v).find(' ') != std::string::npos;
  values->push_back(std::move(v));
  return fmt::format("{}{}{}{}", kMark, values->size() - 1, spaced ? " " : "", kMark);
}

// A value in parentheses when it is negative, as a substituted line needs it.
std::string markerInLine(std::vector<TrailValue>* values, TrailValue v, bool negative) {
  const std::string m = marker(values, std::move(v));
  return negative ? "(" + m + ")" : m;
}

TrailLine cutAtMarkers(const std::string& text, const std::vector<TrailValue>& values) {
  TrailLine line;
  size_t i = 0;
  while (i < text.size()) {
    const size_t at = text.find(kMark, i);
    if (at == std::string::npos) {
      line.push_back({text.substr(i), std::nullopt});
      break;
    }
    if (at > i) line.push_back({text.substr(i, at - i), std::nullopt});
    const size_t end = text.find(kMark, at + 1);
    line.push_back({"", values.at(std::strtoul(text.c_str() + at + 1, nullptr, 10))});
    i = end + 1;
  }
  return line;
}

// Every call of a library function in a formula, in source order.
void collectCalls(const Expr& e, std::vector<const Expr*>* out) {
  if (e.kind == ExprKind::Call && !findMathFunction(e.text) && findFunction(e.text)) out->push_back(&e);
  for (const auto& a : e.args) collectCalls(*a, out);
}

// A library function's own formula, parsed once, so the trail can show it
// with the call's values substituted.
const Expr* parsedFormula(const FunctionDecl& f) {
  static std::map<std::string, std::pair<std::shared_ptr<SourceFile>, ExprPtr>> cache;
  auto it = cache.find(f.name);
  if (it == cache.end()) {
    auto file = std::make_shared<SourceFile>("function " + f.name, f.formula);
    Diagnostics ignored;
    ExprPtr e;
    if (f.formula_is_expression)
      e = ExprParser(*file, 0, static_cast<uint32_t>(f.formula.size()), &ignored).parseWhole();
    it = cache.emplace(f.name, std::make_pair(file, std::move(e))).first;
  }
  return it->second.second.get();
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
// preferred one for the function's argument dimension.
Unit argumentUnit(const Expr& arg, const FunctionArg& decl, const Calculation& calc) {
  const Expr* x = &arg;
  while (x->kind == ExprKind::Group) x = x->args[0].get();
  if (x->kind == ExprKind::Name) {
    if (auto u = unitFor(calc.quantities[calc.sheet.find(x->text)].display, decl.dim)) return *u;
  }
  if (x->kind == ExprKind::Number && x->unit) {
    if (auto u = unitFor(*x->unit, decl.dim)) return *u;
  }
  return preferredUnit(decl.dim);
}

TrailCall auditCall(const Expr& call, const Calculation& calc,
                    const std::vector<std::optional<TrailValue>>& given, const Unit& step_unit, int digits) {
  const FunctionDecl& f = *findFunction(call.text);
  TrailCall c;
  c.name = f.name;
  c.signature = f.name + "(";
  for (size_t k = 0; k < f.args.size(); ++k) c.signature += (k ? ", " : "") + f.args[k].name;
  c.signature += ")";
  c.formula = f.formula;
  c.formula_is_expression = f.formula_is_expression;
  c.source = f.source;
  c.caution = f.caution;
  c.formula_expr = parsedFormula(f);
  auto value_of = [&](const Expr& e) {
    const int j = calc.sheet.find(e.text);
    return j >= 0 && calc.quantities[j].ok ? calc.quantities[j].si : NAN;
  };
  std::map<std::string, std::pair<TrailValue, bool>> shown;  // argument -> value, negative
  for (size_t k = 0; k < f.args.size() && k < call.args.size(); ++k) {
    EvalFault fault;
    double v = evalTree(*call.args[k], value_of, &fault);
    if (fault.node) return c;
    v = argumentToLibrary(v, f.args[k].per_revolution, call.args[k]->dim);  // what the function sees
    const Unit unit = argumentUnit(*call.args[k], f.args[k], calc);
    TrailValue shown_value = rounded(v, unit, digits);
    // Given values and literals appear as written, as in the step itself.
    const Expr* x = call.args[k].get();
    while (x->kind == ExprKind::Group) x = x->args[0].get();
    if (x->kind == ExprKind::Name) {
      const int j = calc.sheet.find(x->text);
      if (given[j] && calc.quantities[j].display.text == unit.text) shown_value = *given[j];
    } else if (x->kind == ExprKind::Number && (x->unit ? x->unit->text == unit.text : unit.text == "1")) {
      shown_value = written(x->text, v, unit.fromSI(v), x->unit ? unit.pretty() : "");
    }
    c.arguments.push_back({fmt::format("{}{} = ", k ? ", " : "", f.args[k].name), std::nullopt});
    c.arguments.push_back({"", shown_value});
    shown[f.args[k].name] = {std::move(shown_value), v < 0};
  }
  if (const Expr* formula = parsedFormula(f)) {
    c.pretty = renderExpr(*formula, nullptr, true);
    std::vector<TrailValue> values;
    const std::string text = renderExpr(
        *formula,
        [&](const Expr& name) {
          auto it = shown.find(name.text);
          return it == shown.end() ? name.text : markerInLine(&values, it->second.first, it->second.second);
        },
        true);
    c.substituted = cutAtMarkers(text, values);
    c.show_substituted = !c.substituted.empty() && lineText(c.substituted) != c.pretty;
  }
  EvalFault fault;
  const double r = evalTree(call, value_of, &fault);
  if (!fault.node) {
    // In the step's own unit where it fits (lbf*in in a US sheet), else the function's.
    Unit unit;
    UnitError err;
    if (auto u = unitFor(step_unit, f.result)) unit = *u;
    else if (f.result_unit.empty() || !parseUnit(f.result_unit, &unit, &err) || unit.dim != f.result)
      unit = preferredUnit(f.result);
    c.result = rounded(f.result_per_revolution ? r * 2 * M_PI : r, unit, digits);
  }
  return c;
}

TrailLine substitute(const Expr& e, const Calculation& calc,
                     const std::vector<std::optional<TrailValue>>& given, int digits) {
  std::vector<TrailValue> values;
  const std::string text = renderExpr(
      e,
      [&](const Expr& name) {
        const int j = calc.sheet.find(name.text);
        const QuantityState& s = calc.quantities[j];
        // A given value appears as written ("950 kg", "0.35"), unrounded.
        TrailValue v = given[j] ? *given[j] : rounded(s.si, s.display, digits);
        return markerInLine(&values, std::move(v), s.si < 0 || s.display.fromSI(s.si) < 0);
      },
      true);
  return cutAtMarkers(text, values);
}

// A side of a check written as one literal in the unit it is shown in
// ("2.5", "0 [N*m]") appears as written; anything else as its rounded value.
TrailValue literalOrValue(const Expr& side, double si, const Unit& unit, int digits) {
  const Expr* x = &side;
  while (x->kind == ExprKind::Group) x = x->args[0].get();
  if (x->kind == ExprKind::Number) {
    const std::string as_written = x->unit ? x->unit->text : "1";
    if (as_written == unit.text || (!x->unit && unit.text.empty()))
      return written(x->text, si, unit.fromSI(si), x->unit ? unit.pretty() : "");
  }
  return rounded(si, unit, digits);
}

// Each instance as a part of its own after the main sheet's blocks: a
// heading naming the instance, its template's title and file; its
// parameters with their bound values and bindings; then its steps and checks.
void addInstances(const Sheet& sheet, Trail* t) {
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
      const TrailStep& s = t->steps[static_cast<size_t>(p.quantity)];
      TrailInstanceParam tp{s.local_name, p.quantity, p.binding};
      params += (params.empty() ? "" : "; ") + tp.name + " = ";
      const std::string value = valueText(s.given ? *s.given : s.result);
      if (!p.binding.empty() && p.binding != value) params += p.binding + " = ";
      params += value;
      if (s.overridden) params += " (set on the command line)";
      else if (p.binding.empty()) params += " (default)";
      ti.params.push_back(std::move(tp));
    }
    ti.steps = inst.quantities;
    ti.checks = inst.checks;
    t->blocks.push_back({TrailBlock::Section, ti.heading, 0});
    if (!params.empty()) t->blocks.push_back({TrailBlock::Note, "Parameters: " + params + ".", 0});
    for (int q : ti.steps) t->blocks.push_back({TrailBlock::Step, "", q});
    for (int c : ti.checks) t->blocks.push_back({TrailBlock::CheckRef, "", c});
    t->instances.push_back(std::move(ti));
  }
}

}  // namespace

Trail buildTrail(const Calculation& calc, int digits) {
  const Sheet& sheet = calc.sheet;
  Trail t;
  t.digits = digits;
  t.path = calc.path;
  t.sha256 = calc.sha256;
  for (const SheetFile& f : sheet.files) t.files.push_back({f.path, f.sha256});
  if (t.files.empty()) t.files.push_back({calc.path, calc.sha256});
  t.title = sheet.meta.get("title");
  for (const std::string& key : Metadata::keys()) {
    if (key == "title") continue;
    const std::string v = sheet.meta.get(key);
    if (!v.empty()) t.meta.emplace_back(key, v);
  }
  std::vector<const FunctionDecl*> used;
  for (size_t i = 0; i < sheet.quantities.size(); ++i) {
    const Quantity& q = sheet.quantities[i];
    const QuantityState& s = calc.quantities[i];
    TrailStep step;
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
    const NameRenderer local = [&](const Expr& n) { return sheet.localName(scope, n.text); };
    step.formula = renderExpr(*q.expr, scope < 0 ? nullptr : local);
    step.pretty = renderExpr(*q.expr, scope < 0 ? nullptr : local, true);
    step.expr = q.expr.get();
    step.ok = s.ok;
    // Substituted is filled below, once every given value is known.
    step.result = rounded(s.si, s.display, digits);
    {
      const Expr* x = q.expr.get();
      while (x->kind == ExprKind::Group) x = x->args[0].get();
      const bool literal = x->kind == ExprKind::Number;
      const bool same_unit = x->unit ? (s.display.text == x->unit->text && !s.declared) ||
                                           (q.display && q.display->text == x->unit->text)
                                     : s.display.text == "1" || s.display.text.empty();
      if (s.ok && literal && same_unit) {
        step.given = written(x->text, s.si, s.display.fromSI(s.si), x->unit ? x->unit->pretty() : "");
      }
    }
    step.formula_in_notes = !step.given && step.formula != (s.ok ? valueText(step.result) : "");
    step.unit = s.display.text;
    // The contract: the declared display unit as written, else the engine's choice.
    step.unit_declared = s.declared;
    step.unit_written = s.declared ? q.unit_written : step.unit;
    step.si_unit = s.dim.siSymbol();
    step.unit_pretty = s.display.pretty();
    step.dimension = s.dim.name();
    std::vector<const Expr*> calls;
    collectCalls(*q.expr, &calls);
    for (const Expr* call : calls) {
      const FunctionDecl* f = findFunction(call->text);
      if (std::find(used.begin(), used.end(), f) == used.end()) used.push_back(f);
    }
    t.steps.push_back(std::move(step));
  }
  std::vector<std::optional<TrailValue>> given;
  for (const TrailStep& s : t.steps) given.push_back(s.given);
  for (TrailStep& s : t.steps) {
    // Where the value comes from: given in the worksheet, set on the command
    // line, calculated, or calculated with the cited library methods.
    s.origin = s.overridden ? "set on the command line" : s.input ? "given" : "calculated";
    if (!calc.quantities[s.index].ok) continue;
    const Expr& expr = *sheet.quantities[s.index].expr;
    s.substituted = substitute(expr, calc, given, digits);
    const std::string substituted = lineText(s.substituted);
    s.show_substituted = substituted != s.pretty && substituted != valueText(s.result);
    std::vector<const Expr*> calls;
    collectCalls(expr, &calls);
    for (const Expr* call : calls)
      s.calls.push_back(auditCall(*call, calc, given, calc.quantities[s.index].display, digits));
    for (const TrailCall& c : s.calls) s.origin += "; " + c.name + ": " + c.source;
  }
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    const CheckState& s = calc.checks[k];
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
      tc.lhs = literalOrValue(*c.lhs, s.lhs, s.display, digits);
      tc.rhs = literalOrValue(*c.rhs, s.rhs, s.display, digits);
    }
    tc.passed = s.ok && s.passed;
    (tc.passed ? t.passed : t.failed)++;
    t.checks.push_back(std::move(tc));
  }
  std::string note;
  auto flushNote = [&] {
    if (note.empty()) return;
    t.blocks.push_back({TrailBlock::Note, note, 0});
    note.clear();
  };
  for (const Statement& st : sheet.statements) {
    if (st.kind == Statement::Note) {
      note += (note.empty() ? "" : " ") + st.text;
      continue;
    }
    if (st.kind == Statement::Blank || st.kind == Statement::Comment || st.kind == Statement::Meta) {
      if (st.kind == Statement::Blank) flushNote();
      continue;
    }
    flushNote();
    if (st.kind == Statement::Section) t.blocks.push_back({TrailBlock::Section, st.text, 0});
    if (st.kind == Statement::Define) t.blocks.push_back({TrailBlock::Step, "", st.index});
    if (st.kind == Statement::CheckStmt) t.blocks.push_back({TrailBlock::CheckRef, "", st.index});
  }
  flushNote();
  addInstances(sheet, &t);
  for (const Diagnostic& d : calc.diags.list())
    if (d.severity == Severity::Warning) t.warnings.push_back(d.headline());
  t.cautions = generalCautions();
  for (const FunctionDecl* f : used)
    if (!f->caution.empty() &&
        std::find(t.cautions.begin(), t.cautions.end(), f->caution) == t.cautions.end())
      t.cautions.push_back(f->caution);
  return t;
}

}  // namespace calctrail
