#include "engine/eval/program.h"

#include <algorithm>
#include <charconv>

#include "engine/eval/math_functions.h"
#include "engine/util/math_constants.h"

namespace calctrail {

namespace {

// The shortest text that reads back as exactly `v` (std::to_chars; the
// parser reads it with std::from_chars, arithmetic.cc): the same double as
// "%.17g" gave, in fewer characters and without snprintf's set-up.
void appendNumber(double v, std::string* out) {
  char buf[40];
  const std::to_chars_result r = std::to_chars(buf, buf + sizeof buf, v);
  if (v < 0) *out += '(';
  out->append(buf, r.ptr);
  if (v < 0) *out += ')';
}

const FunctionDecl* findIn(const std::vector<FunctionDecl>& library, const std::string& name) {
  for (const FunctionDecl& d : library)
    if (d.name == name) return &d;
  return nullptr;
}

struct Compiler {
  const NodeDims& dims;
  const Sheet& sheet;
  const std::vector<FunctionDecl>& library;
  Program* program;

  // How tightly an operator binds in muparser: + - 1, * / 2, ^ 3; 4 for an
  // operand that needs no parentheses (a number, pi, a name, a call, a
  // negation, which writes its own).
  static int precedence(ExprKind k) {
    switch (k) {
      case ExprKind::Add:
      case ExprKind::Subtract: return 1;
      case ExprKind::Multiply:
      case ExprKind::Divide: return 2;
      case ExprKind::Power: return 3;
      default: return 4;
    }
  }

  // `e` as an operand of an operator of precedence `outer` (0: a whole
  // formula or a call's argument), on its right side or not. Parentheses only
  // where muparser would otherwise group differently, so that its bytecode
  // is the one of the fully parenthesised text, with fewer tokens to read
  // (each costs the one-shot parse some 3,000 instructions; docs/performance.md,
  // startup_perftest): a left operand of the same precedence groups
  // left as written (a - b - c); a right one keeps them ((a + (b + c)) is
  // another rounding); an operand of ^ that is itself an operation keeps them,
  // whatever muparser's associativity of ^.
  void operand(const Expr& e, int outer, bool right, std::string* out) {
    const Expr& x = *withoutParens(&e);
    const int p = precedence(x.kind);
    const bool wrap = p < outer || (p == outer && right) || (outer == 3 && p < 4);
    if (wrap) *out += '(';
    emit(x, out);
    if (wrap) *out += ')';
  }

  void emit(const Expr& e, std::string* out) {
    switch (e.kind) {
      case ExprKind::Number: appendNumber(e.siValue(), out); return;
      case ExprKind::Pi: appendNumber(kPi, out); return;
      case ExprKind::Name: {
        const int q = sheet.find(e.text);
        auto it = std::find(program->inputs.begin(), program->inputs.end(), q);
        const size_t slot = static_cast<size_t>(it - program->inputs.begin());
        if (it == program->inputs.end()) program->inputs.push_back(q);
        *out += 'v';
        *out += std::to_string(slot);
        return;
      }
      case ExprKind::Group: emit(*e.args[0], out); return;
      case ExprKind::Negate:
        // In parentheses of its own: muparser's unary minus then never meets
        // a neighbouring operator, whatever their relative precedence.
        *out += "(-";
        operand(*e.args[0], 4, false, out);
        *out += ')';
        return;
      case ExprKind::Call: call(e, out); return;
      default: break;
    }
    const char* op = e.kind == ExprKind::Add        ? "+"
                     : e.kind == ExprKind::Subtract ? "-"
                     : e.kind == ExprKind::Multiply ? "*"
                     : e.kind == ExprKind::Divide   ? "/"
                                                    : "^";
    const int p = precedence(e.kind);
    operand(*e.args[0], p, false, out);
    *out += op;
    operand(*e.args[1], p, true, out);
  }

  void call(const Expr& e, std::string* out) {
    if (const MathFunction* m = findMathFunction(e.text)) {
      program->math |= 1u << (m - mathFunctions().data());
      *out += m->name;
    } else {
      const FunctionDecl* f = findIn(library, e.text);
      std::vector<Dimension> arg_dims;
      for (const ExprPtr& a : e.args) arg_dims.push_back(dims.of(*a));
      const LibraryCall c = LibraryCall::at(*f, arg_dims);
      if (f->args.empty()) {
        // A constant of the library (a flank angle): muparser callbacks need an argument.
        appendNumber(c(nullptr, 0), out);
        return;
      }
      if (std::find(program->calls.begin(), program->calls.end(), c) == program->calls.end())
        program->calls.push_back(c);
      *out += c.compiledName();
    }
    *out += '(';
    for (size_t i = 0; i < e.args.size(); ++i) {
      if (i) *out += ',';
      operand(*e.args[i], 0, false, out);
    }
    *out += ')';
  }
};

}  // namespace

Program compileProgram(const Expr& e, const NodeDims& dims, const Sheet& sheet,
                       const std::vector<FunctionDecl>& library) {
  Program p;
  Compiler c{dims, sheet, library, &p};
  c.emit(e, &p.text);
  // A lone name or literal needs no arithmetic: the evaluation reads it directly.
  const Expr* x = withoutParens(&e);
  p.reads_one = x->kind == ExprKind::Name;
  p.is_constant = x->kind == ExprKind::Number;
  if (p.is_constant) p.constant = x->siValue();
  // One library call of distinct names: the compiler numbered them v0, v1, ... in argument order.
  if (x->kind == ExprKind::Call && p.calls.size() == 1 && p.math == 0 && !x->args.empty() &&
      p.inputs.size() == x->args.size())
    p.direct_call = std::all_of(x->args.begin(), x->args.end(),
                                [](const ExprPtr& a) { return a->kind == ExprKind::Name; });
  return p;
}

}  // namespace calctrail
