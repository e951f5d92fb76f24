#include "engine/eval/program.h"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "engine/eval/math_functions.h"
#include "engine/eval/tree_eval.h"
#include "functions/function_decl.h"

namespace calctrail {

namespace {

void appendNumber(double v, std::string* out) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.17g", v);  // round-trips every double exactly
  *out += buf;
}

struct Compiler {
  const Sheet& sheet;
  Program* program;

  void emit(const Expr& e, std::string* out) {
    switch (e.kind) {
      case ExprKind::Number: {
        const double v = e.siValue();
        if (v < 0) *out += '(';
        appendNumber(v, out);
        if (v < 0) *out += ')';
        return;
      }
      case ExprKind::Pi: appendNumber(M_PI, out); return;
      case ExprKind::Name: {
        const int q = sheet.find(e.text);
        auto it = std::find(program->inputs.begin(), program->inputs.end(), q);
        size_t slot = static_cast<size_t>(it - program->inputs.begin());
        if (it == program->inputs.end()) program->inputs.push_back(q);
        *out += 'v';
        *out += std::to_string(slot);
        return;
      }
      case ExprKind::Group: emit(*e.args[0], out); return;
      case ExprKind::Negate:
        *out += "(-(";
        emit(*e.args[0], out);
        *out += "))";
        return;
      case ExprKind::Call: {
        const MathFunction* m = findMathFunction(e.text);
        const FunctionDecl* f = m ? nullptr : findFunction(e.text);
        if (f && f->args.empty()) {
          // A constant of the library (a flank angle): muparser callbacks need an argument.
          const double v = resultFromLibrary(f->eval(nullptr), f->result_per_revolution);
          if (v < 0) *out += '(';
          appendNumber(v, out);
          if (v < 0) *out += ')';
          return;
        }
        const bool result_per_rev = f && f->result_per_revolution;
        if (result_per_rev) *out += '(';
        *out += m ? m->muparser_name : f->name.c_str();
        *out += '(';
        for (size_t i = 0; i < e.args.size(); ++i) {
          if (i) *out += ',';
          const bool scale = f && f->args[i].per_revolution && e.args[i]->dim.exponent(Base::Angle) == -1;
          if (scale) *out += '(';
          emit(*e.args[i], out);
          if (scale) {
            *out += ")*";
            appendNumber(2 * M_PI, out);  // per radian -> per revolution
          }
        }
        *out += ')';
        if (result_per_rev) {
          *out += '/';
          appendNumber(2 * M_PI, out);
          *out += ')';
        }
        return;
      }
      default: break;
    }
    const char* op = e.kind == ExprKind::Add        ? "+"
                     : e.kind == ExprKind::Subtract ? "-"
                     : e.kind == ExprKind::Multiply ? "*"
                     : e.kind == ExprKind::Divide   ? "/"
                                                    : "^";
    *out += '(';
    emit(*e.args[0], out);
    *out += op;
    emit(*e.args[1], out);
    *out += ')';
  }
};

}  // namespace

Program compileProgram(const Expr& e, const Sheet& sheet) {
  Program p;
  Compiler c{sheet, &p};
  c.emit(e, &p.text);
  return p;
}

}  // namespace calctrail
