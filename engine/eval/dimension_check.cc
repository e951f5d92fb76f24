#include "engine/eval/dimension_check.h"

#include <cmath>

#include "engine/eval/math_functions.h"
#include "engine/eval/tree_eval.h"
#include "engine/units/unit.h"
#include "engine/util/edit_distance.h"
#include "engine/util/math_constants.h"
#include "functions/function_decl.h"

namespace calctrail {

namespace {
const Dimension kNone;
const Dimension kAngle = Dimension::of(Base::Angle);
const Dimension kLength = Dimension::of(Base::Length);

std::string words(const Dimension& d) { return d.describe(); }
}  // namespace

bool workOrPower(const Dimension& d) {
  const Dimension base = d.withoutAngle();
  return base == Dimension::exponents(2, 1, -2) || base == Dimension::exponents(2, 1, -3);
}

std::string compareForSum(const Dimension& a, const Dimension& b, bool* incompatible) {
  *incompatible = false;
  if (a == b) return "";
  if (a.sameIgnoringAngle(b)) {
    if (workOrPower(a)) return "";  // T*theta is work and T*omega power: the radian is 1
    return "adds " + words(a) + " and " + words(b) +
           ", which differ only by an angle: the radian counts as 1, but check that no 2*pi is missing";
  }
  *incompatible = true;
  return "";
}

std::string strayAngleWarning(const std::string& name, const Dimension& dim) {
  const int a = dim.exponent(Base::Angle);
  if (a == 0) return "";
  if (workOrPower(dim)) return "";  // T*theta is work, T*omega is power
  const Dimension base = dim.withoutAngle();
  // Angles, rotational speeds and accelerations (any power of time), leads.
  if ((a == 1 || a == 2) && base.exponent(Base::Length) == 0 && base.exponent(Base::Mass) == 0 &&
      base == Dimension::of(Base::Time, base.exponent(Base::Time)))
    return "";
  if (a == -1 && base == kLength) return "";
  if (a == 1 && base == Dimension::exponents(1, 0, -1)) {
    return "`" + name + "` is a rotational speed times a plain length (" + dim.siSymbol() +
           "): if the length is a lead, this is 2*pi too large; write the lead per revolution, as in `5 [mm/rev]` or `0.2 [in/rev]`";
  }
  return "`" + name + "` has a stray angle in its dimension (" + dim.siSymbol() +
         "): a plain 2*pi where `1 [rev]` is meant, or a lead or speed written without /rev, gives a value off by 2*pi; write angles as `1 [rev]` and leads as `[mm/rev]`";
}

namespace {
// The computed quantity of plain length a product with a rotational speed
// reads (`rpm * p`, p = a formula): "" when the length is a literal or none.
std::string computedPlainLength(const Expr& e, const NodeDims& dims, const Sheet& sheet) {
  if (e.kind == ExprKind::Multiply || e.kind == ExprKind::Divide) {
    for (const ExprPtr& a : e.args) {
      const Expr* x = withoutParens(a.get());
      if (x->kind != ExprKind::Name || dims.of(*x) != kLength) continue;
      const int q = sheet.find(x->text);
      if (q < 0) continue;
      const Quantity& given = sheet.quantities[static_cast<size_t>(q)];
      const Expr* f = withoutParensOrSigns(given.expr.get());
      if (f && f->kind != ExprKind::Number) return x->text;
    }
  }
  for (const ExprPtr& a : e.args) {
    const std::string found = computedPlainLength(*a, dims, sheet);
    if (!found.empty()) return found;
  }
  return "";
}
}  // namespace

std::string strayAngleWarning(const std::string& name, const Dimension& dim, const Expr& formula,
                              const NodeDims& formula_dims, const Sheet& sheet) {
  const std::string w = strayAngleWarning(name, dim);
  if (w.empty() || dim.exponent(Base::Angle) != 1 || dim.withoutAngle() != Dimension::exponents(1, 0, -1))
    return w;
  const std::string p = computedPlainLength(formula, formula_dims, sheet);
  if (p.empty()) return w;
  return "`" + name + "` is a rotational speed times a plain length (" + dim.siSymbol() + "): if `" + p +
         "` is a lead, this is 2*pi too large; `" + p + "` is computed, so make it a length per revolution " +
         "where it is computed (`thread_lead(pitch, starts)` gives one in [mm/rev]) or divide it by `1 [rev]` " +
         "where it is read: `" + p + " / 1 [rev]`";
}

namespace {
const Expr& unwrapped(const Expr& e) {
  const Expr* x = withoutParensOrSigns(&e);
  return *x;
}

// A plain literal without a unit (`15`, `-30`), as written; "" otherwise.
std::string plainLiteral(const Expr& e) {
  const Expr& x = unwrapped(e);
  return x.kind == ExprKind::Number && !x.unit ? renderExpr(e) : std::string();
}

// The parser limits nesting, so these walks stay shallow.
bool hasPi(const Expr& e) {
  if (e.kind == ExprKind::Pi) return true;
  for (const ExprPtr& a : e.args)
    if (hasPi(*a)) return true;
  return false;
}

bool arithmeticOnly(const Expr& e) {
  if (e.kind == ExprKind::Name || e.kind == ExprKind::Call) return false;
  for (const ExprPtr& a : e.args)
    if (!arithmeticOnly(*a)) return false;
  return true;
}
}  // namespace

// The interpreter does the arithmetic, so a folded exponent is the number
// the formula itself would compute.
bool constantValue(const Expr& e, double* value) {
  if (!arithmeticOnly(e)) return false;
  EvalFault fault;
  // No calls, so no node's dimension is read.
  const double v = evalTree(e, NodeDims(), [](const Expr&) { return NAN; }, &fault);
  if (fault.node || !std::isfinite(v)) return false;
  *value = v;
  return true;
}

DimensionChecker::DimensionChecker(const SourceFile& file, Diagnostics* diags, const Sheet& sheet,
                                   const std::vector<Dimension>& dims, const std::vector<char>& known,
                                   const std::vector<FunctionDecl>& library,
                                   const std::vector<TemperatureKind>* temperatures)
    : file_(file),
      diags_(diags),
      sheet_(sheet),
      dims_(dims),
      known_(known),
      library_(library),
      temperatures_(temperatures) {}

namespace {
const char* const kTemperatureFix =
    "for a temperature difference write ddegC, ddegF or K (as in `5 ddegC`); to use the value as a "
    "thermodynamic temperature, declare its quantity in [K]";

std::string absoluteOperand(const Expr& x, const std::string& what) {
  return "`" + renderExpr(x) + "` is an absolute temperature (degC and degF count from an arbitrary zero), " +
         "so " + what + " has no physical meaning; " + kTemperatureFix;
}
}  // namespace

TemperatureKind temperatureKind(const Quantity& q, TemperatureKind formula) {
  if (q.display && q.display->isAbsoluteTemperature()) return TemperatureKind::Absolute;
  if (q.display && q.display->isTemperatureDifference()) return TemperatureKind::Difference;
  // [K], or a unit of any other dimension (which the dimension check rejects).
  if (q.display) return TemperatureKind::Unknown;
  return q.expr ? formula : TemperatureKind::Unknown;
}

std::string DimensionChecker::absoluteTemperatureRule(const Expr& e) {
  using K = TemperatureKind;
  const K a = e.args.empty() ? K::Unknown : temperature(*e.args[0]);
  const K b = e.args.size() < 2 ? K::Unknown : temperature(*e.args[1]);
  const bool any_difference = a == K::Difference || b == K::Difference;
  const bool is_temperature = dim(e) == Dimension::of(Base::Temperature);
  K& kind = temperature(e);
  kind = K::Unknown;
  switch (e.kind) {
    case ExprKind::Number:
      if (e.unit && e.unit->isAbsoluteTemperature()) kind = K::Absolute;
      else if (e.unit && e.unit->isTemperatureDifference()) kind = K::Difference;
      return "";
    case ExprKind::Name: {
      const int i = sheet_.find(e.text);
      if (i >= 0) {
        const size_t at = static_cast<size_t>(i);
        const K formula = temperatures_ && at < temperatures_->size() ? (*temperatures_)[at] : K::Unknown;
        kind = temperatureKind(sheet_.quantities[at], formula);
      }
      return "";
    }
    case ExprKind::Group:
      kind = a;
      return "";
    case ExprKind::Negate:
      if (a == K::Absolute) {
        return absoluteOperand(*e.args[0], "its negative (below absolute zero)") +
               "; a temperature below the zero of its scale is written as one number, `-40 degC`";
      }
      kind = a;
      return "";
    case ExprKind::Add:
      if (a == K::Absolute && b == K::Absolute) {
        return "adding two absolute temperatures has no physical meaning (20 degC + 20 degC is not 40 degC); "
               "add a temperature difference, in ddegC, ddegF or K (as in `T + 5 ddegC`), or declare the "
               "quantities in [K] to use them as thermodynamic temperatures";
      }
      if (a == K::Absolute || b == K::Absolute) kind = K::Absolute;
      else if (any_difference && is_temperature) kind = K::Difference;
      return "";
    case ExprKind::Subtract:
      if (a == K::Difference && b == K::Absolute) {
        return "subtracting an absolute temperature from a temperature difference has no physical meaning "
               "(`T2 - T1` of two absolute temperatures is a difference); " + std::string(kTemperatureFix);
      }
      if (a == K::Absolute) kind = b == K::Absolute ? K::Difference : K::Absolute;
      else if (b == K::Absolute || (any_difference && is_temperature)) kind = K::Difference;
      return "";
    case ExprKind::Multiply:
    case ExprKind::Divide:
    case ExprKind::Power: {
      const char* what = e.kind == ExprKind::Multiply ? "multiplying it (2 * 20 degC is not 40 degC)"
                         : e.kind == ExprKind::Divide ? "dividing it, or dividing by it,"
                                                      : "a power of it";
      if (a == K::Absolute) return absoluteOperand(*e.args[0], what);
      if (b == K::Absolute) return absoluteOperand(*e.args[1], what);
      if (any_difference && is_temperature) kind = K::Difference;
      return "";
    }
    case ExprKind::Call: {
      bool absolute = false, difference = false;
      for (const ExprPtr& x : e.args) {
        absolute |= temperature(*x) == K::Absolute;
        difference |= temperature(*x) == K::Difference;
      }
      if (!absolute && !difference) return "";
      // min, max and abs keep the kind of their arguments; any other function of an
      // absolute temperature is an error.
      const bool keeps = e.text == "min" || e.text == "max" || e.text == "abs";
      for (const ExprPtr& x : e.args) {
        if (temperature(*x) == K::Absolute && !keeps) return absoluteOperand(*x, "`" + e.text + "` of it");
      }
      if (absolute && difference) {
        return "`" + e.text + "` compares absolute temperatures with temperature differences, which has no "
               "physical meaning; " + std::string(kTemperatureFix);
      }
      if (keeps || is_temperature) kind = absolute ? K::Absolute : K::Difference;
      return "";
    }
    case ExprKind::Pi:
      return "";
  }
  return "";
}

// sin(30) reads 30 as radians: a plain literal, or a plain value above 2*pi
// (a literal quantity, or a constant without pi), is most likely in degrees.
std::string DimensionChecker::plainTrigArgumentWarning(const std::string& fn, const Expr& arg) const {
  const std::string literal = plainLiteral(arg);
  const Expr& x = unwrapped(arg);
  std::string shown = literal;
  double v = 0.0;
  if (shown.empty() && x.kind == ExprKind::Name) {
    const int q = sheet_.find(x.text);
    const Quantity* given = q >= 0 ? &sheet_.quantities[static_cast<size_t>(q)] : nullptr;
    if (given && given->expr && !plainLiteral(*given->expr).empty() && constantValue(*given->expr, &v) &&
        std::fabs(v) > kTwoPi)
      return "`" + fn + "(" + x.text + ")` reads `" + x.text + " = " + plainLiteral(*given->expr) +
             "` as radians; for degrees write `" + x.text + " = " + plainLiteral(*given->expr) + " deg`";
    return "";
  }
  if (shown.empty()) {
    if (hasPi(arg) || !constantValue(arg, &v) || std::fabs(v) <= kTwoPi) return "";
    shown = renderExpr(arg);
    return "`" + fn + "(" + shown + ")` reads " + shown + " as radians; for degrees write `" + fn + "((" + shown +
           ") * 1 deg)`";
  }
  return "`" + fn + "(" + shown + ")` reads the plain number " + shown + " as radians; for degrees write `" + fn +
         "(" + shown + " deg)`, for radians `" + fn + "(" + shown + " rad)`";
}

bool DimensionChecker::check(const Expr& e, TreeDims* out) {
  out->dims.assign(nodeCount(e), Dimension());
  return check(e, out->dims.data(), static_cast<uint32_t>(out->dims.size()), &out->temperature);
}

bool DimensionChecker::check(const Expr& e, Dimension* dims, uint32_t count, TemperatureKind* root_temperature) {
  dims_out_ = dims;
  temperatures_out_.assign(count, TemperatureKind::Unknown);
  const bool ok = visit(e) && checkTemperatureOwner(e);
  *root_temperature = temperature(e);
  previous_root_ = &e;
  previous_temperature_ = *root_temperature;
  dims_out_ = nullptr;
  return ok;
}

// A formula's temperature kind must suit what receives it: a difference
// shown in [degC] would be off by the zero of the scale, and a check must
// not compare a difference with an absolute temperature. Looked up by
// pointer, and only for temperature-valued roots, which are few.
bool DimensionChecker::checkTemperatureOwner(const Expr& root) {
  using K = TemperatureKind;
  const K kind = temperature(root);
  if (kind == K::Unknown) return true;
  for (const Quantity& q : sheet_.quantities) {
    if (q.expr.get() != &root) continue;
    if (!q.display) return true;
    if (kind == K::Difference && q.display->isAbsoluteTemperature()) {
      return fail(root, "`" + q.name + "` is a temperature difference, but [" + q.unit_written +
                            "] shows absolute temperatures: the number shown would be off by the zero of the "
                            "scale; declare it in [ddegC], [ddegF] or [K]");
    }
    if (kind == K::Absolute && q.display->isTemperatureDifference()) {
      return fail(root, "`" + q.name + "` is an absolute temperature, but [" + q.unit_written +
                            "] is a unit of temperature differences; declare it in [degC], [degF] or [K]");
    }
    return true;
  }
  for (const Check& c : sheet_.checks) {
    if (c.rhs.get() != &root) continue;
    // The left side is the tree checked just before (Model::checkChecks checks both in turn).
    const K l = previous_root_ == c.lhs.get() ? previous_temperature_ : K::Unknown, r = kind;
    if ((l == K::Absolute && r == K::Difference) || (l == K::Difference && r == K::Absolute)) {
      return fail(root, "the check `" + c.name +
                            "` compares an absolute temperature with a temperature difference; write a limit "
                            "on a difference in ddegC, ddegF or K (as in `50 ddegC`), and one on a "
                            "temperature in degC, degF or K");
    }
    return true;
  }
  return true;
}

bool DimensionChecker::fail(const Expr& at, const std::string& message) {
  diags_->error(file_, at.begin, at.end, message);
  return false;
}

bool DimensionChecker::visit(const Expr& e) {
  if (!visitNode(e)) return false;
  const std::string temperature_error = absoluteTemperatureRule(e);
  return temperature_error.empty() || fail(e, temperature_error);
}

bool DimensionChecker::visitNode(const Expr& e) {
  switch (e.kind) {
    case ExprKind::Number:
      dim(e) = e.unit ? e.unit->dim : kNone;
      return true;
    case ExprKind::Pi:
      dim(e) = kNone;
      return true;
    case ExprKind::Name: {
      const int i = sheet_.find(e.text);
      if (i < 0 || !known_[i]) return false;  // reported where it was defined
      dim(e) = dims_[i];
      return true;
    }
    case ExprKind::Group:
    case ExprKind::Negate:
      if (!visit(*e.args[0])) return false;
      dim(e) = dim(*e.args[0]);
      return true;
    case ExprKind::Call:
      return checkCall(e);
    default:
      break;
  }
  const Expr& l = *e.args[0];
  const Expr& r = *e.args[1];
  // Both sides, so an independent problem on the right is reported with one on the left.
  const bool left_ok = visit(l);
  const bool right_ok = visit(r);
  if (!left_ok || !right_ok) return false;
  switch (e.kind) {
    case ExprKind::Add:
    case ExprKind::Subtract: {
      bool incompatible;
      const std::string warning = compareForSum(dim(l), dim(r), &incompatible);
      if (incompatible) {
        return fail(e, std::string("cannot ") + (e.kind == ExprKind::Add ? "add " : "subtract ") +
                           words(dim(r)) + (e.kind == ExprKind::Add ? " to " : " from ") + words(dim(l)));
      }
      if (!warning.empty()) diags_->warning(file_, e.begin, e.end, warning);
      dim(e) = dim(l);
      return true;
    }
    case ExprKind::Multiply:
      dim(e) = dim(l) * dim(r);
      return true;
    case ExprKind::Divide:
      dim(e) = dim(l) / dim(r);
      return true;
    case ExprKind::Power: {
      if (!dim(r).dimensionless()) return fail(r, "an exponent must be a plain number, not " + words(dim(r)));
      if (dim(l).dimensionless()) {
        dim(e) = kNone;
        return true;
      }
      double p;
      if (!constantValue(r, &p)) {
        return fail(r, "the base is " + words(dim(l)) +
                           ", so the exponent must be a fixed number (like 2 or 0.5), not a formula of quantities");
      }
      // Whole powers, and roots that leave whole exponents (an area to the 0.5 is a length).
      for (int den = 1; den <= 4; ++den) {
        const double num = p * den;
        if (std::fabs(num - std::round(num)) < 1e-9) {
          Dimension rooted;
          if (!dim(l).root(den, &rooted)) break;
          dim(e) = rooted.pow(static_cast<int>(std::lround(num)));
          return true;
        }
      }
      return fail(e, "raising " + words(dim(l)) + " to the power " + r.text +
                         " gives no dimension with whole exponents");
    }
    default:
      return false;
  }
}

bool DimensionChecker::checkCall(const Expr& e) {
  // Every argument, and the function's name, even when one argument has a
  // problem (or reads a quantity whose definition failed): each independent
  // problem is reported in the same run.
  bool args_ok = true;
  for (auto& a : e.args) args_ok = visit(*a) && args_ok;
  const int n = static_cast<int>(e.args.size());
  if (const MathFunction* m = findMathFunction(e.text)) {
    if (!args_ok) return false;
    if (n < m->min_args || (m->max_args >= 0 && n > m->max_args)) {
      std::string want = m->max_args < 0 ? "at least " + std::to_string(m->min_args)
                                         : std::to_string(m->min_args);
      return fail(e, "`" + e.text + "` takes " + want + " argument" + (want == "1" ? "" : "s") + ", not " +
                         std::to_string(n));
    }
    const Dimension a = dim(*e.args[0]);
    switch (m->rule) {
      case MathRule::Sqrt:
        if (!a.root(2, &dim(e))) {
          return fail(*e.args[0], "sqrt of " + words(a) +
                                      " has no dimension with whole exponents; only even powers have a square root");
        }
        return true;
      case MathRule::TrigOfAngle:
        if (a != kAngle && !a.dimensionless())
          return fail(*e.args[0], "`" + e.text + "` takes an angle (or plain radians), not " + words(a));
        if (a.dimensionless()) {
          const std::string w = plainTrigArgumentWarning(e.text, *e.args[0]);
          if (!w.empty()) diags_->warning(file_, e.args[0]->begin, e.args[0]->end, w);
        }
        dim(e) = kNone;
        return true;
      case MathRule::InverseTrig:
        if (!a.dimensionless()) return fail(*e.args[0], "`" + e.text + "` takes a plain number, not " + words(a));
        dim(e) = kAngle;
        return true;
      case MathRule::Atan2:
        if (!a.sameIgnoringAngle(dim(*e.args[1])))
          return fail(e, "atan2(y, x) needs y and x alike; here " + words(a) + " and " + words(dim(*e.args[1])));
        dim(e) = kAngle;
        return true;
      case MathRule::Dimensionless:
        if (!a.dimensionless()) return fail(*e.args[0], "`" + e.text + "` takes a plain number, not " + words(a));
        dim(e) = kNone;
        return true;
      case MathRule::SameAsArg:
        dim(e) = a;
        return true;
      case MathRule::AllAlike:
        for (int i = 1; i < n; ++i) {
          if (!dim(*e.args[i]).sameIgnoringAngle(a))
            return fail(*e.args[i], "`" + e.text + "` compares alike values; argument " + std::to_string(i + 1) +
                                        " is " + words(dim(*e.args[i])) + ", the first is " + words(a));
        }
        dim(e) = a;
        return true;
    }
    return false;
  }
  const FunctionDecl* f = nullptr;
  for (const FunctionDecl& d : library_)
    if (d.name == e.text) f = &d;
  if (!f) {
    std::vector<std::string> names;
    for (const MathFunction& m : mathFunctions()) names.push_back(m.name);
    for (const FunctionDecl& d : library_) names.emplace_back(d.name);
    std::string msg = "unknown function `" + e.text + "`";
    auto near = nearestWords(e.text, names);
    if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
    msg += " (`calctrail functions` lists them)";
    diags_->error(file_, e.begin, e.begin + static_cast<uint32_t>(e.text.size()), msg);
    return false;
  }
  if (!args_ok) return false;
  if (!f->takes(n)) {
    std::string names;
    for (size_t i = 0; i < f->args.size(); ++i) names += (i ? ", " : "") + std::string(f->args[i].name);
    const size_t fixed = f->args.size();
    if (f->repeat == 0)
      return fail(e, "`" + std::string(f->name) + "` takes " + std::to_string(fixed) + " arguments (" + names + "), not " +
                         std::to_string(n));
    std::string group;
    for (int k = 0; k < f->repeat; ++k)
      group += (k ? ", " : "") + f->argName(static_cast<int>(fixed) + k);
    return fail(e, "`" + std::string(f->name) + "` takes " + names + ", then any number of further " +
                       (f->repeat == 1 ? "arguments like the last (" + group + ", ...)"
                                       : "groups of " + std::to_string(f->repeat) + " like the last (" +
                                             group + ", ...)") +
                       "; here " + std::to_string(n) + " arguments");
  }
  for (int i = 0; i < n; ++i) {
    const FunctionArg& arg = f->argAt(i);
    const Dimension got = dim(*e.args[static_cast<size_t>(i)]);
    if (got == arg.dim) continue;
    if (arg.per_revolution && got == arg.dim / kAngle) continue;  // [mm/rev]
    std::string msg = "argument " + std::to_string(i + 1) + " of `" + std::string(f->name) + "` (" + f->argName(i) + ", " +
                      std::string(arg.description) + ") must be " + words(arg.dim);
    if (arg.per_revolution) msg += " or a length per revolution";
    msg += ", not " + words(got);
    if (arg.dim == kAngle && got.dimensionless()) {
      // A plain number where an angle is wanted: the fix is its unit, not a turn or a lead.
      const Expr& x = unwrapped(*e.args[static_cast<size_t>(i)]);
      const std::string literal = plainLiteral(x);
      const int q = x.kind == ExprKind::Name ? sheet_.find(x.text) : -1;
      const Quantity* given = q >= 0 ? &sheet_.quantities[static_cast<size_t>(q)] : nullptr;
      if (!literal.empty())
        msg += "; write the angle with its unit: `" + literal + " deg` (or `" + literal + " rad`)";
      else if (given && given->expr && !plainLiteral(*given->expr).empty())
        msg += "; write the angle with its unit: `" + x.text + " = " + plainLiteral(*given->expr) + " deg` (or `rad`)";
      else
        msg += "; multiply it by `1 deg` where it is in degrees, or by `1 rad` where it is in radians";
      return fail(*e.args[static_cast<size_t>(i)], msg);
    }
    if (got.sameIgnoringAngle(arg.dim)) {
      if (arg.dim.withoutAngle() == Dimension::of(Base::Time, -1))
        msg += "; a speed is rotational (rpm, [rev/s]) and a frequency in Hz is not: the two differ by 2*pi";
      else
        msg += "; the two differ only by an angle: a number of turns is an angle, divide it by `1 [rev]` "
               "(and write a lead per revolution as [mm/rev])";
    }
    return fail(*e.args[static_cast<size_t>(i)], msg);
  }
  dim(e) = f->result_per_revolution ? f->result / kAngle : f->result;
  return true;
}

}  // namespace calctrail
