#include "engine/calculation.h"

#include <cmath>
#include <unordered_map>

#include "engine/eval/dimension_check.h"
#include "engine/eval/evaluator.h"
#include "engine/eval/program.h"
#include "engine/eval/tree_eval.h"
#include "engine/eval/math_functions.h"
#include "engine/report/number_format.h"
#include "engine/sheet/expr_parser.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/units/unit_table.h"
#include "engine/util/edit_distance.h"
#include "engine/util/sha256.h"
#include "functions/function_decl.h"

namespace calctrail {

std::unique_ptr<Calculation> Calculation::fromFile(const std::string& path, const CalcOptions& options) {
  std::string bytes, error;
  if (!readFile(path, &bytes, &error)) {
    auto calc = std::make_unique<Calculation>();
    calc->path = path;
    calc->diags.error(path, error);
    return calc;
  }
  return fromText(path, std::move(bytes), options);
}

std::unique_ptr<Calculation> Calculation::fromText(const std::string& display_path, std::string bytes,
                                                   const CalcOptions& options) {
  auto calc = std::make_unique<Calculation>();
  calc->path = display_path;
  calc->sha256 = sha256Hex(bytes);
  calc->run(std::make_shared<SourceFile>(display_path, std::move(bytes)), options);
  return calc;
}

bool Calculation::allChecksPass() const { return failedChecks() == 0; }

int Calculation::failedChecks() const {
  int n = 0;
  for (const CheckState& c : checks) n += c.ok && !c.passed;
  return n;
}

const SourceFile& Calculation::fileOf(const Quantity& q) const {
  return q.override_file ? *q.override_file : *sheet.file;
}

void Calculation::run(std::shared_ptr<SourceFile> file, const CalcOptions& options) {
  sheet = parseSheet(std::move(file), &diags);
  quantities.assign(sheet.quantities.size(), QuantityState());
  checks.assign(sheet.checks.size(), CheckState());
  applyOverrides(options);
  resolveNames();
  orderAndFindCycles();
  checkDimensions();
  checkChecks();
  if (!diags.hasErrors()) {
    evaluate();
    if (!diags.hasErrors()) evaluateChecks();
  }
  diags.sort();
}

void Calculation::applyOverrides(const CalcOptions& options) {
  for (const std::string& set : options.sets) {
    auto file = std::make_shared<SourceFile>("--set", set);
    const size_t eq = set.find('=');
    if (eq == std::string::npos) {
      diags.error(*file, 0, static_cast<uint32_t>(set.size()),
                  "--set takes NAME=VALUE, as in --set \"d=10 mm\"");
      continue;
    }
    size_t b = 0, e = eq;
    while (b < e && set[b] == ' ') ++b;
    while (e > b && set[e - 1] == ' ') --e;
    const std::string name = set.substr(b, e - b);
    const int i = sheet.find(name);
    if (i < 0) {
      std::vector<std::string> names;
      for (const Quantity& q : sheet.quantities) names.push_back(q.name);
      std::string msg = "--set: the worksheet defines no quantity `" + name + "`";
      auto near = nearestWords(name, names);
      if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
      diags.error(*file, static_cast<uint32_t>(b), static_cast<uint32_t>(std::max(e, b + 1)), msg);
      continue;
    }
    Quantity& q = sheet.quantities[i];
    if (q.overridden) {
      diags.error(*file, static_cast<uint32_t>(b), static_cast<uint32_t>(e), "--set gives `" + name + "` twice");
      continue;
    }
    ExprParser parser(*file, static_cast<uint32_t>(eq + 1), static_cast<uint32_t>(set.size()), &diags);
    ExprPtr expr = parser.parseWhole();
    if (!expr) continue;
    q.expr = std::move(expr);
    q.overridden = true;
    q.override_text = set.substr(eq + 1);
    q.override_file = std::move(file);
  }
}

namespace {
std::vector<std::string> quantityNames(const Sheet& sheet) {
  std::vector<std::string> names;
  names.reserve(sheet.quantities.size());
  for (const Quantity& q : sheet.quantities) names.push_back(q.name);
  return names;
}

std::string unknownNameMessage(const std::string& name, const std::vector<std::string>& names) {
  std::string msg = "unknown name `" + name + "`";
  auto near = nearestWords(name, names);
  if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
  if (findUnit(name)) {
    msg += " (`" + name + "` is a unit: a unit follows a number, as in `2 " + name +
           "`, and a compound unit goes in brackets, as in `3 [mm/" + name + "]`)";
  } else if (findMathFunction(name) || findFunction(name)) {
    msg += " (`" + name + "` is a function: call it as `" + name + "(...)`)";
  } else if (near.empty()) {
    msg += "; define it with `" + name + " = ...`";
  }
  return msg;
}
}  // namespace

void Calculation::resolveNames() {
  const int n = static_cast<int>(sheet.quantities.size());
  graph = std::make_unique<DependencyGraph>(n);
  // Suggestions cost a pass over every name: built on the first unknown name,
  // kept per distinct name, and given for the first few dozen names only, so
  // a sheet full of unknown names still reports in linear time.
  std::vector<std::string> names;
  std::unordered_map<std::string, std::string> messages;
  const std::vector<std::string> no_names;
  auto unknown = [&](const SourceFile& file, const Expr& e) {
    auto it = messages.find(e.text);
    if (it == messages.end()) {
      if (names.empty()) names = quantityNames(sheet);
      it = messages.emplace(e.text, unknownNameMessage(e.text, messages.size() < 50 ? names : no_names)).first;
    }
    diags.error(file, e.begin, e.end, it->second);
  };
  for (int i = 0; i < n; ++i) {
    Quantity& q = sheet.quantities[i];
    bool any_name = false, any_call = false;
    bool broken = false;
    forEachName(*q.expr, [&](const Expr& e) {
      any_name = true;
      const int j = sheet.find(e.text);
      if (j < 0) {
        unknown(fileOf(q), e);
        broken = true;
      } else {
        graph->addUse(i, j);
      }
    });
    std::function<bool(const Expr&)> hasCall = [&](const Expr& e) {
      if (e.kind == ExprKind::Call) return true;
      for (const auto& a : e.args)
        if (hasCall(*a)) return true;
      return false;
    };
    any_call = hasCall(*q.expr);
    quantities[i].input = !any_name && !any_call;
    if (broken) quantities[i].has_dim = false, quantities[i].ok = false;
  }
  for (const Check& c : sheet.checks) {
    for (const Expr* side : {c.lhs.get(), c.rhs.get()}) {
      forEachName(*side, [&](const Expr& e) {
        if (sheet.find(e.text) < 0) unknown(*sheet.file, e);
      });
    }
  }
}

void Calculation::orderAndFindCycles() {
  std::vector<std::vector<int>> cycles;
  order = graph->order(&cycles);
  for (const std::vector<int>& cycle : cycles) {
    const Quantity& first = sheet.quantities[cycle[0]];
    std::string loop;
    for (int v : cycle) loop += sheet.quantities[v].name + " -> ";
    loop += first.name;
    std::string msg;
    if (cycle.size() == 1) {
      msg = "`" + first.name + "` uses itself: " + loop + "; a quantity cannot depend on its own value";
    } else {
      msg = "a cycle: " + loop + " (" + std::to_string(cycle.size()) +
            " quantities depend on each other; each needs the others' values first)";
    }
    diags.error(*sheet.file, first.name_begin, first.name_end, msg);
  }
}

namespace {
// A lone literal with a unit (`20 kN`, `-3 degC`) is shown in the unit it was written in.
const Unit* writtenUnit(const Expr& e) {
  const Expr* x = &e;
  while (x->kind == ExprKind::Negate || x->kind == ExprKind::Group) x = x->args[0].get();
  return x->kind == ExprKind::Number ? x->unit.get() : nullptr;
}
}  // namespace

void Calculation::checkDimensions() {
  const int n = static_cast<int>(sheet.quantities.size());
  std::vector<Dimension> dims(n);
  std::vector<char> known(n, 0);
  std::vector<char> broken(n, 0);
  // Quantities with unknown names were reported already: keep them and their users quiet.
  for (int i = 0; i < n; ++i) {
    forEachName(*sheet.quantities[i].expr, [&](const Expr& e) {
      if (sheet.find(e.text) < 0) broken[i] = 1;
    });
  }
  for (int i : order) {
    Quantity& q = sheet.quantities[i];
    QuantityState& s = quantities[i];
    if (broken[i]) continue;
    DimensionChecker checker(fileOf(q), &diags, sheet, dims, known);
    if (!checker.check(*q.expr)) continue;
    s.dim = q.expr->dim;
    if (workOrPower(s.dim)) s.dim = s.dim.withoutAngle();  // N*m*rad/s is W
    s.has_dim = true;
    dims[i] = s.dim;
    known[i] = 1;
    if (q.display) {
      s.declared = true;
      s.display = *q.display;
      const UnitFit fit = fitUnit(s.dim, q.display->dim);
      if (fit == UnitFit::Incompatible) {
        diags.error(*sheet.file, q.unit_begin, q.unit_end,
                    "`" + q.name + "` is declared in [" + q.unit_written + "], " + q.display->dim.describe() +
                        ", but its formula gives " + s.dim.describe());
        known[i] = 0;
        s.has_dim = false;
        continue;
      }
      if (fit == UnitFit::AngleWarning) {
        // Showing the value would put a number off by 2*pi on the page
        // (a lead per revolution shown in plain mm, rpm*lead in m/s): refuse,
        // and say how to write it.
        std::string msg = "`" + q.name + "` is declared in [" + q.unit_written + "], " +
                          q.display->dim.describe() + ", but its formula gives " + s.dim.describe() +
                          ": they differ by an angle, so the number shown would be off by 2*pi";
        const std::string why = strayAngleWarning(q.name, s.dim);
        if (!why.empty()) msg += "; " + why.substr(why.find("): ") + 3);
        else if (s.dim.exponent(Base::Angle) < 0) msg += "; declare it per revolution, as in [mm/rev], or write `1 [rev]` where a plain 2*pi stands";
        else msg += "; declare the unit with its angle, as in [rpm] or [rad/s]";
        diags.error(*sheet.file, q.unit_begin, q.unit_end, msg);
        known[i] = 0;
        s.has_dim = false;
        continue;
      }
    } else {
      const Unit* written = writtenUnit(*q.expr);
      s.display = written ? *written : preferredUnit(s.dim);
      const std::string w = strayAngleWarning(q.name, s.dim);
      if (!w.empty()) diags.warning(*sheet.file, q.name_begin, q.name_end, w);
    }
  }
}

void Calculation::checkChecks() {
  const int n = static_cast<int>(sheet.quantities.size());
  std::vector<Dimension> dims(n);
  std::vector<char> known(n, 0);
  for (int i = 0; i < n; ++i) {
    dims[i] = quantities[i].dim;
    known[i] = quantities[i].has_dim;
  }
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    Check& c = sheet.checks[k];
    CheckState& s = checks[k];
    bool unknown = false;
    for (const Expr* side : {c.lhs.get(), c.rhs.get()})
      forEachName(*side, [&](const Expr& e) { unknown |= sheet.find(e.text) < 0; });
    if (unknown) continue;
    DimensionChecker checker(*sheet.file, &diags, sheet, dims, known);
    if (!checker.check(*c.lhs) || !checker.check(*c.rhs)) continue;
    bool incompatible;
    const std::string warning = compareForSum(c.lhs->dim, c.rhs->dim, &incompatible);
    const uint32_t op_end = c.op_begin + static_cast<uint32_t>(std::string(comparisonText(c.op)).size());
    if (incompatible) {
      diags.error(*sheet.file, c.op_begin, op_end,
                  "the check `" + c.name + "` compares " + c.lhs->dim.describe() + " with " +
                      c.rhs->dim.describe());
      continue;
    }
    if (!warning.empty()) diags.warning(*sheet.file, c.op_begin, op_end, "the check `" + c.name + "` " + warning);
    s.dim = c.lhs->dim;
    // Show both sides in the unit of the quantity (or literal) the check names first.
    const Unit* unit = nullptr;
    for (const Expr* side : {c.lhs.get(), c.rhs.get()}) {
      const Expr* x = side;
      while (x->kind == ExprKind::Group || x->kind == ExprKind::Negate) x = x->args[0].get();
      if (x->kind == ExprKind::Name && quantities[sheet.find(x->text)].has_dim) {
        unit = &quantities[sheet.find(x->text)].display;
        break;
      }
      if (!unit && x->kind == ExprKind::Number && x->unit) unit = x->unit.get();
    }
    s.display = unit && fitUnit(s.dim, unit->dim) != UnitFit::Incompatible ? *unit : preferredUnit(s.dim);
  }
}

namespace {
std::string valueList(const Expr& at, const Sheet& sheet, const std::vector<QuantityState>& qs) {
  std::vector<std::string> seen;
  std::string out;
  forEachName(at, [&](const Expr& e) {
    if (std::find(seen.begin(), seen.end(), e.text) != seen.end()) return;
    seen.push_back(e.text);
    const int j = sheet.find(e.text);
    if (j < 0 || !qs[j].ok) return;
    out += (out.empty() ? "" : ", ") + e.text + " = " + formatQuantity(qs[j].si, qs[j].display, 4);
  });
  return out;
}
}  // namespace

// A formula gave NaN or inf (or a library function refused): run the tree
// interpreter to find the operation at fault, and report it with the values
// of the quantities it reads.
void Calculation::explainFailure(const Expr& expr, const SourceFile& file, const std::vector<double>& values,
                                 const std::string& prefix, const std::string& internal) {
  EvalFault fault;
  evalTree(expr, [&](const Expr& e) { return values[sheet.find(e.text)]; }, &fault);
  const Expr& at = fault.node ? *fault.node : expr;
  std::string msg = prefix + (fault.node ? fault.message
                                         : internal.empty() ? "the value is not a finite number" : internal);
  const std::string inputs = valueList(at, sheet, quantities);
  if (!inputs.empty()) msg += " (with " + inputs + ")";
  diags.error(file, at.begin, at.end, msg);
}

void Calculation::evaluate() {
  Evaluator evaluator;
  std::vector<double> values(sheet.quantities.size(), NAN);
  for (int i : order) {
    Quantity& q = sheet.quantities[i];
    QuantityState& s = quantities[i];
    if (!s.has_dim) continue;
    bool inputs_ok = true;
    for (int j : graph->uses(i)) inputs_ok &= quantities[j].ok;
    if (!inputs_ok) continue;
    double v = NAN;
    std::string internal;
    const Program program = compileProgram(*q.expr, sheet);
    if (program.text.size() > Evaluator::kMaxProgramLength) {
      diags.error(fileOf(q), q.expr->begin, q.expr->end,
                  "`" + q.name + "` is too long to compile (" + std::to_string(program.text.size()) +
                      " characters once units are folded in, at most " +
                      std::to_string(Evaluator::kMaxProgramLength) + "); split it into named steps");
      continue;
    }
    try {
      v = evaluator.run(program, values);
    } catch (const DomainError&) {
      v = NAN;  // explained below, with the argument at fault
    } catch (const std::exception& e) {
      internal = e.what();
    }
    if (!std::isfinite(v)) {
      explainFailure(*q.expr, fileOf(q), values, "`" + q.name + "` cannot be calculated: ", internal);
      continue;
    }
    s.si = v;
    s.ok = true;
    values[i] = v;
  }
}

void Calculation::evaluateChecks() {
  Evaluator evaluator;
  std::vector<double> values(sheet.quantities.size(), NAN);
  for (size_t i = 0; i < quantities.size(); ++i)
    if (quantities[i].ok) values[i] = quantities[i].si;
  for (size_t k = 0; k < sheet.checks.size(); ++k) {
    const Check& c = sheet.checks[k];
    CheckState& s = checks[k];
    double side[2];
    bool ok = true;
    const Expr* exprs[2] = {c.lhs.get(), c.rhs.get()};
    for (int j = 0; j < 2 && ok; ++j) {
      double v = NAN;
      try {
        v = evaluator.run(compileProgram(*exprs[j], sheet), values);
      } catch (const std::exception&) {
        v = NAN;
      }
      if (!std::isfinite(v)) {
        explainFailure(*exprs[j], *sheet.file, values, "the check `" + c.name + "` cannot be evaluated: ", "");
        ok = false;
      }
      side[j] = v;
    }
    if (!ok) continue;
    s.ok = true;
    s.lhs = side[0];
    s.rhs = side[1];
    switch (c.op) {
      case Comparison::Less: s.passed = s.lhs < s.rhs; break;
      case Comparison::LessEqual: s.passed = s.lhs <= s.rhs; break;
      case Comparison::Greater: s.passed = s.lhs > s.rhs; break;
      case Comparison::GreaterEqual: s.passed = s.lhs >= s.rhs; break;
    }
  }
}

}  // namespace calctrail
