#include "engine/eval/tree_eval.h"

#include <cmath>
#include <vector>

#include "engine/eval/math_functions.h"
#include "engine/util/math_constants.h"
#include "functions/plausibility.h"

namespace calctrail {

namespace {

std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

struct Interpreter {
  const NodeDims& dims;
  const NameValue& value_of;
  EvalFault* fault;
  const std::vector<FunctionDecl>& library;
  std::vector<CallDoubt>* doubts = nullptr;  // collected when not null

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
      case ExprKind::Pi: return kPi;
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
          return failAt(e, "a negative base (" + num(a) + ") to a fractional power (" + num(b) +
                               ") has no real value");
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
      long quarter_turns;
      if (name == "sqrt" && x < 0) return failAt(e, "sqrt of a negative value (" + num(x) + " in SI units)");
      if ((name == "asin" || name == "acos") && (x < -1 || x > 1))
        return failAt(e, name + " of " + num(x) + ", outside [-1, 1]");
      if ((name == "ln" || name == "log10") && x <= 0)
        return failAt(e, name + " of " + num(x) + ": the logarithm needs a value above 0");
      if (name == "tan" && multipleOfRightAngle(x, &quarter_turns) && quarter_turns % 2 != 0)
        return failAt(e, "tan of an odd multiple of 90 deg is infinite");
      const double r = applyMath(*m, args.data(), static_cast<int>(args.size()));
      if (!std::isfinite(r)) return failAt(e, name + " overflows the range of numbers");
      return r;
    }
    const FunctionDecl* f = nullptr;
    for (const FunctionDecl& d : library)
      if (d.name == e.text) {
        f = &d;  // names are unique (tests/functions_library_test.cc)
        break;
      }
    if (!f || !f->eval) return failAt(e, "unknown function `" + e.text + "`");
    std::vector<Dimension> arg_dims;
    for (const ExprPtr& a : e.args) arg_dims.push_back(dims.of(*a));
    try {
      const LibraryCall c = LibraryCall::at(*f, arg_dims);
      const int n = static_cast<int>(args.size());
      const double r = c(args.data(), n);
      if (!std::isfinite(r)) return failAt(e, "`" + std::string(f->name) + "` gives no finite value for these inputs");
      if (doubts) {
        std::vector<double> passed;
        for (Doubt& d : doubtsOf(*f, c.converted(args.data(), n, &passed), n)) {
          const Expr* at = d.arg >= 0 && d.arg < n ? e.args[static_cast<size_t>(d.arg)].get() : &e;
          doubts->push_back({at, "`" + std::string(f->name) + "`: " + d.message});
        }
      }
      return r;
    } catch (const DomainError& err) {
      const Expr& at = err.arg() >= 0 && err.arg() < static_cast<int>(e.args.size()) ? *e.args[err.arg()] : e;
      return failAt(at, "`" + std::string(f->name) + "`: " + err.what());
    }
  }
};

}  // namespace

double evalTree(const Expr& e, const NodeDims& dims, const NameValue& value_of, EvalFault* fault,
                const std::vector<FunctionDecl>& library) {
  Interpreter in{dims, value_of, fault, library};
  const double v = in.eval(e);
  return fault->node ? NAN : v;
}

std::vector<CallDoubt> doubtsInTree(const Expr& e, const NodeDims& dims, const NameValue& value_of,
                                    const std::vector<FunctionDecl>& library) {
  std::vector<CallDoubt> out;
  EvalFault fault;
  Interpreter in{dims, value_of, &fault, library, &out};
  in.eval(e);
  return out;
}

}  // namespace calctrail
