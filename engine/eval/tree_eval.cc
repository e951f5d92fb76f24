#include "engine/eval/tree_eval.h"

#include <cmath>
#include <vector>

#include "engine/eval/math_functions.h"
#include "functions/function_decl.h"

namespace calctrail {

double argumentToLibrary(double si, bool per_revolution, const Dimension& given) {
  return per_revolution && given.exponent(Base::Angle) == -1 ? si * 2 * M_PI : si;
}

double resultFromLibrary(double value, bool per_revolution) {
  return per_revolution ? value / (2 * M_PI) : value;
}

namespace {

std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

struct Interpreter {
  const NameValue& value_of;
  EvalFault* fault;

  double failAt(const Expr& e, std::string message) {
    if (!fault->node) {
      fault->node = &e;
      fault->message = std::move(message);
    }
    return NAN;
  }

  double eval(const Expr& e) {
    if (fault->node) return NAN;
    switch (e.kind) {
      case ExprKind::Number: return e.siValue();
      case ExprKind::Pi: return M_PI;
      case ExprKind::Name: {
        const double v = value_of(e);
        if (!std::isfinite(v)) return failAt(e, "`" + e.text + "` has no value");
        return v;
      }
      case ExprKind::Group: return eval(*e.args[0]);
      case ExprKind::Negate: return -eval(*e.args[0]);
      case ExprKind::Call: return call(e);
      default: break;
    }
    const double a = eval(*e.args[0]);
    const double b = eval(*e.args[1]);
    if (fault->node) return NAN;
    double r = NAN;
    switch (e.kind) {
      case ExprKind::Add: r = a + b; break;
      case ExprKind::Subtract: r = a - b; break;
      case ExprKind::Multiply: r = a * b; break;
      case ExprKind::Divide:
        if (b == 0) return failAt(e, "division by zero: the divisor is 0");
        r = a / b;
        break;
      case ExprKind::Power:
        if (a < 0 && b != std::floor(b))
          return failAt(e, "a negative base (" + num(a) + ") to a fractional power (" + num(b) + ") has no real value");
        if (a == 0 && b < 0) return failAt(e, "zero to a negative power is a division by zero");
        r = std::pow(a, b);
        break;
      default: break;
    }
    if (!std::isfinite(r)) return failAt(e, "the result overflows the range of numbers");
    return r;
  }

  double call(const Expr& e) {
    std::vector<double> args;
    for (const auto& a : e.args) args.push_back(eval(*a));
    if (fault->node) return NAN;
    if (const MathFunction* m = findMathFunction(e.text)) {
      const double x = args[0];
      const std::string name = e.text;
      if (name == "sqrt" && x < 0) return failAt(e, "sqrt of a negative value (" + num(x) + " in SI units)");
      if ((name == "asin" || name == "acos") && (x < -1 || x > 1))
        return failAt(e, name + " of " + num(x) + ", outside [-1, 1]");
      if ((name == "ln" || name == "log10") && x <= 0)
        return failAt(e, name + " of " + num(x) + ": the logarithm needs a value above 0");
      if (name == "tan" && std::fabs(std::cos(x)) < 1e-15)
        return failAt(e, "tan of an odd multiple of 90 deg is infinite");
      const double r = applyMath(*m, args.data(), static_cast<int>(args.size()));
      if (!std::isfinite(r)) return failAt(e, name + " overflows the range of numbers");
      return r;
    }
    const FunctionDecl* f = findFunction(e.text);
    if (!f || !f->eval) return failAt(e, "unknown function `" + e.text + "`");
    for (size_t i = 0; i < args.size(); ++i)
      args[i] = argumentToLibrary(args[i], f->args[i].per_revolution, e.args[i]->dim);
    try {
      const double r = f->eval(args.data());
      if (!std::isfinite(r)) return failAt(e, "`" + f->name + "` gives no finite value for these inputs");
      return resultFromLibrary(r, f->result_per_revolution);
    } catch (const DomainError& err) {
      const Expr& at = err.arg() >= 0 && err.arg() < static_cast<int>(e.args.size()) ? *e.args[err.arg()] : e;
      return failAt(at, "`" + f->name + "`: " + err.what());
    }
  }
};

}  // namespace

double evalTree(const Expr& e, const NameValue& value_of, EvalFault* fault) {
  Interpreter in{value_of, fault};
  const double v = in.eval(e);
  return fault->node ? NAN : v;
}

}  // namespace calctrail
