#include "engine/lsp/hover.h"

#include "engine/eval/math_functions.h"
#include "engine/lsp/protocol_json.h"
#include "engine/report/number_format.h"
#include "engine/review/sheet_format.h"

namespace calctrail::lsp {

namespace {

constexpr int kDigits = 4;

std::string unitOf(const Dimension& dim) {
  const std::string text = preferredUnit(dim).text;
  return text.empty() || text == "1" ? "" : text;
}

// A name's value as the substituted formula shows it; the name itself when it has none.
std::string substituted(const Analysis& a, const Expr& name) {
  const int i = a.calc->sheet.find(name.text);
  return i >= 0 && a.calc->ok(i) ? valueText(a, i) : name.text;
}

std::string quantityHover(const Analysis& a, int i) {
  const Quantity& q = a.calc->sheet.quantities[i];
  const QuantityView s = a.calc->quantity(i);
  std::string out = "**" + q.name + "**";
  if (!q.unit_written.empty()) out += " [" + q.unit_written + "]";
  if (s.ok)
    out += " = " + valueText(a, i);
  else if (a.calc->hasErrors())
    out += " (no value: the worksheet has errors)";
  out += "\n";
  if (q.expr) {
    const std::string formula = renderExpr(*q.expr);
    const bool literal = s.input && q.expr->kind == ExprKind::Number;
    if (!literal) {
      out += "\n```\n" + q.name + " = " + formula + "\n";
      if (s.ok) out += "  = " + renderExpr(*q.expr, [&](const Expr& n) { return substituted(a, n); }) + "\n";
      out += "```\n";
    } else {
      out += "\ngiven value `" + formula + "`\n";
    }
  }
  if (!q.description.empty()) out += "\n" + q.description + "\n";
  return out;
}

std::string checkHover(const Analysis& a, int k) {
  const Check& c = a.calc->sheet.checks[k];
  const CheckView s = a.calc->check(k);
  std::string out = "**check " + c.name + "**";
  if (a.evaluated() && s.ok) out += s.passed ? ": pass" : ": FAIL";
  out += "\n";
  if (c.lhs && c.rhs) {
    out += "\n```\n" + canonicalCondition(c) + "\n";
    if (a.evaluated() && s.ok) {
      out += "  " + formatQuantity(s.lhs, s.display, kDigits, false) + " " + comparisonText(c.op) + " " +
             formatQuantity(s.rhs, s.display, kDigits, false) + "\n";
    }
    out += "```\n";
  }
  if (!c.description.empty()) out += "\n" + c.description + "\n";
  return out;
}

std::string functionHover(const std::string& name) {
  if (const FunctionDecl* f = findFunction(name)) {
    std::string out = "**" + signature(*f) + "**\n\n" + std::string(f->summary) + "\n";
    out +=
        "\n" + std::string(f->formula_is_expression ? "```\n" + std::string(f->formula) + "\n```\n" : std::string(f->formula) + "\n");
    if (!f->args.empty()) {
      out += "\n";
      for (const FunctionArg& arg : f->args) {
        const std::string unit = unitOf(arg.dim);
        out +=
            "- `" + std::string(arg.name) + "`" + (unit.empty() ? "" : " [" + unit + "]") + ": " + std::string(arg.description) + "\n";
      }
    }
    if (!f->limits.empty()) out += "\nLimits: " + std::string(f->limits) + "\n";
    if (!f->source.empty()) out += "\nSource: " + std::string(f->source) + "\n";
    if (!f->caution.empty()) out += "\nCaution: " + std::string(f->caution) + "\n";
    return out;
  }
  if (const MathFunction* m = findMathFunction(name)) return "**" + name + "**: " + m->summary + "\n";
  return "";
}

}  // namespace

std::string valueText(const Analysis& a, int i) {
  return formatQuantity(a.calc->si(i), a.calc->display(i), kDigits, false);
}

std::string signature(const FunctionDecl& f) {
  std::string out = std::string(f.name) + "(";
  for (size_t i = 0; i < f.args.size(); ++i) {
    const std::string unit = unitOf(f.args[i].dim);
    out += (i ? ", " : "") + std::string(f.args[i].name) + (unit.empty() ? "" : " [" + unit + "]");
  }
  out += ")";
  if (!f.result_unit.empty()) out += " -> " + std::string(f.result_unit);
  return out;
}

nlohmann::json hover(const Analysis& a, const Document& doc, uint32_t offset) {
  if (!a.calc) return nullptr;
  const Symbol* s = a.at(offset);
  if (!s) return nullptr;
  std::string text;
  switch (s->kind) {
    case Symbol::QuantityDef:
    case Symbol::QuantityUse:
      text =
          s->index >= 0 ? quantityHover(a, s->index) : "`" + s->name + "` is not defined in this worksheet\n";
      break;
    case Symbol::CheckDef: text = checkHover(a, s->index); break;
    case Symbol::FunctionCall: text = functionHover(s->name); break;
    case Symbol::UsePath:
    case Symbol::UseInstance: {
      const int inst = a.instanceOfUse(s->index);
      if (inst < 0) break;
      const Instance& in = a.calc->sheet.instances[static_cast<size_t>(inst)];
      text = "**instance " + in.name + "** of `" + in.path + "`";
      if (!in.title.empty()) text += ": " + in.title;
      text += "\n";
      break;
    }
    case Symbol::UseParam: {
      const int q = a.instanceQuantity(a.instanceOfUse(s->index), s->name);
      if (q >= 0) text = quantityHover(a, q);
      break;
    }
  }
  if (text.empty()) return nullptr;
  return {{"contents", {{"kind", "markdown"}, {"value", text}}},
          {"range", toJson(rangeOf(doc, s->begin, s->end))}};
}

}  // namespace calctrail::lsp
