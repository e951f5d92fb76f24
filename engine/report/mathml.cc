#include "engine/report/mathml.h"

#include <algorithm>
#include <cctype>
#include <cstring>
#include <string_view>
#include <vector>

#include "engine/report/xml_escape.h"

namespace calctrail {

namespace {

// Greek names as engineers write them in ASCII. string_views: a name of
// another length is passed over without comparing its letters.
const char* greek(std::string_view word) {
  struct Letter {
    std::string_view name;
    const char* glyph;
  };
  static constexpr Letter table[] = {
      {"alpha", "\u03B1"},   {"beta", "\u03B2"},  {"gamma", "\u03B3"},   {"delta", "\u03B4"},
      {"epsilon", "\u03B5"}, {"zeta", "\u03B6"},  {"eta", "\u03B7"},     {"theta", "\u03B8"},
      {"iota", "\u03B9"},    {"kappa", "\u03BA"}, {"lambda", "\u03BB"},  {"mu", "\u03BC"},
      {"nu", "\u03BD"},      {"xi", "\u03BE"},    {"rho", "\u03C1"},     {"sigma", "\u03C3"},
      {"tau", "\u03C4"},     {"upsilon", "\u03C5"}, {"phi", "\u03C6"},   {"chi", "\u03C7"},
      {"psi", "\u03C8"},     {"omega", "\u03C9"}, {"Gamma", "\u0393"},   {"Delta", "\u0394"},
      {"Theta", "\u0398"},   {"Lambda", "\u039B"}, {"Xi", "\u039E"},     {"Pi", "\u03A0"},
      {"Sigma", "\u03A3"},   {"Upsilon", "\u03A5"}, {"Phi", "\u03A6"},   {"Psi", "\u03A8"},
      {"Omega", "\u03A9"},
  };
  if (word.size() < 2 || word.size() > 7) return nullptr;  // "mu" to "epsilon"
  for (const Letter& row : table)
    if (word == row.name) return row.glyph;
  return nullptr;
}

bool allDigits(std::string_view s) {
  return !s.empty() &&
         std::all_of(s.begin(), s.end(), [](char c) { return std::isdigit(static_cast<unsigned char>(c)); });
}

// Characters of UTF-8 text (for the single-letter rule and widths).
size_t glyphs(std::string_view s) {
  size_t n = 0;
  for (char c : s)
    if ((static_cast<unsigned char>(c) & 0xC0) != 0x80) ++n;
  return n;
}

std::string mi(std::string_view text, bool upright = false) {
  // A one-letter <mi> is italic by default: upright where ISO 80000-2 wants it.
  const bool one = glyphs(text) == 1;
  std::string out = one && upright ? "<mi mathvariant=\"normal\">" : "<mi>";
  out += escapeXml(text);
  out += "</mi>";
  return out;
}

// `inner` between `open` and `close`, in one string grown once.
std::string element(std::string_view open, std::string_view inner, std::string_view close) {
  std::string out;
  out.reserve(open.size() + inner.size() + close.size());
  out.append(open).append(inner).append(close);
  return out;
}

std::string mo(const std::string& op) { return element("<mo>", op, "</mo>"); }
std::string mrow(const std::string& inner) { return element("<mrow>", inner, "</mrow>"); }

// A quantity symbol and a descriptive subscript: the subscript is upright
// (a label such as "m" for mean, not a variable).
struct NameParts {
  std::string base, sub;
  double base_w = 0, sub_w = 0;
};

std::string subscriptPart(std::string_view part, double* w) {
  if (const char* g = greek(part)) {
    *w += 0.4;
    return mi(g);
  }
  *w += 0.4 * static_cast<double>(glyphs(part));
  if (allDigits(part)) return element("<mn>", part, "</mn>");
  return mi(part, true);
}

NameParts splitName(const std::string& name) {
  NameParts n;
  std::vector<std::string_view> parts;  // views of `name`
  parts.reserve(static_cast<size_t>(std::count(name.begin(), name.end(), '_')) + 2);  // and an index split off ("F1")
  size_t i = 0;
  while (i <= name.size()) {
    size_t j = name.find('_', i);
    if (j == std::string::npos) j = name.size();
    if (j > i) parts.push_back(std::string_view(name).substr(i, j - i));
    i = j + 1;
  }
  // Subscripts belong to symbols: a letter or a Greek name ("d_m", "eta_gear").
  // A word ("frac_deep", "sum_of_terms") is shown as written.
  auto symbolLike = [](std::string_view head) {
    size_t k = head.size();
    while (k > 0 && std::isdigit(static_cast<unsigned char>(head[k - 1]))) --k;
    const std::string_view letters = head.substr(0, k);
    return glyphs(letters) == 1 || greek(letters) != nullptr;
  };
  // Two Latin letters with no underscore ("dm", "fc", "Sy", as the library
  // and engineering texts write d_m, f_c, S_y) are a letter with a
  // subscript, so that a library formula and a worksheet set them alike.
  if (parts.size() == 1 && name.size() == 2 && std::isalpha(static_cast<unsigned char>(name[0])) &&
      std::islower(static_cast<unsigned char>(name[1])) && !greek(name))
    parts = {std::string_view(name).substr(0, 1), std::string_view(name).substr(1)};
  if (parts.empty() || !symbolLike(parts[0])) {
    n.base = mi(name);
    n.base_w = 0.55 * static_cast<double>(glyphs(name));
    return n;
  }
  std::string_view head = parts[0];
  // "F1", "d2", "alpha1": a letter (or Greek name) and an index.
  if (parts.size() == 1) {
    size_t k = head.size();
    while (k > 0 && std::isdigit(static_cast<unsigned char>(head[k - 1]))) --k;
    const std::string_view letters = head.substr(0, k);
    if (k > 0 && k < head.size() && (letters.size() == 1 || greek(letters))) {
      parts.push_back(head.substr(k));
      head = letters;
    }
  }
  if (const char* g = greek(head)) {
    n.base = mi(g);
    n.base_w = 0.6;
  } else {
    n.base = mi(head);
    n.base_w = 0.55 * static_cast<double>(glyphs(head));
  }
  for (size_t k = 1; k < parts.size(); ++k) {
    if (k > 1) {
      n.sub += "<mo separator=\"true\">,</mo>";
      n.sub_w += 0.3;
    }
    n.sub += subscriptPart(parts[k], &n.sub_w);
  }
  if (parts.size() > 2) n.sub = mrow(n.sub);
  return n;
}

const Expr& ungroup(const Expr& e) {
  const Expr* x = withoutParens(&e);
  return *x;
}

std::string numberElements(const Expr& e) {
  std::string out;
  const size_t at = e.text.find_first_of("eE");
  if (at == std::string::npos) {
    out = "<mn>" + escapeXml(e.text) + "</mn>";
  } else {
    std::string exp = e.text.substr(at + 1);
    const bool negative = !exp.empty() && exp[0] == '-';
    if (!exp.empty() && (exp[0] == '-' || exp[0] == '+')) exp.erase(0, 1);
    while (exp.size() > 1 && exp[0] == '0') exp.erase(0, 1);
    std::string power = "<mn>" + escapeXml(exp) + "</mn>";
    if (negative) power = mrow(mo("\u2212") + power);
    out = "<mn>" + escapeXml(e.text.substr(0, at)) + "</mn>" + mo("\u00D7") + "<msup><mn>10</mn>" + power +
          "</msup>";
  }
  const std::string unit = e.unit ? e.unit->pretty() : e.unitWritten();
  if (at == std::string::npos && (unit.empty() || unit == "1")) return out;
  if (!unit.empty() && unit != "1") {
    // SI Brochure: a space between number and unit, none before the degree sign.
    const bool angle_mark = unit == "\u00B0" || unit == "\u2032" || unit == "\u2033";
    if (!angle_mark) out += "<mspace width=\"0.22em\"/>";
    out += mi(unit, true);
  }
  return mrow(out);
}

void render(const Expr& e, const MathValueOf* values, std::string* out);

// The operand of a fraction, radical or exponent: its bar or position groups
// it, so the author's outer parentheses are dropped. (render() always writes
// exactly one element, as mfrac and msup require of their children.)
std::string bare(const Expr& e, const MathValueOf* values) {
  std::string s;
  render(ungroup(e), values, &s);
  return s;
}

// The value bound to a node in a substituted formula, or nullptr.
const TrailBinding* boundValue(const Expr& e, const MathValueOf* values) {
  return values && *values ? (*values)(e) : nullptr;
}

std::string parenthesized(const std::string& inner) { return mrow(mo("(") + inner + mo(")")); }

std::string callElements(const Expr& e, const MathValueOf* values) {
  if (e.text == "sqrt" && e.args.size() == 1) return "<msqrt>" + bare(*e.args[0], values) + "</msqrt>";
  if (e.text == "abs" && e.args.size() == 1)
    return mrow("<mo fence=\"true\">|</mo>" + bare(*e.args[0], values) + "<mo fence=\"true\">|</mo>");
  std::string fn = e.text == "log10" ? "<msub><mi>log</mi><mn>10</mn></msub>" : mi(e.text, true);
  std::string args;
  for (size_t i = 0; i < e.args.size(); ++i) {
    if (i) args += "<mo separator=\"true\">,</mo>";
    render(*e.args[i], values, &args);
  }
  // U+2061 FUNCTION APPLICATION: tells the layout that cos is applied, not multiplied.
  return mrow(fn + mo("&#x2061;") + mrow(mo("(") + args + mo(")")));
}

void render(const Expr& e, const MathValueOf* values, std::string* out) {
  auto binary = [&](const char* op) {
    std::string s;
    render(*e.args[0], values, &s);
    s += mo(op);
    render(*e.args[1], values, &s);
    *out += mrow(s);
  };
  if (const TrailBinding* b = boundValue(e, values)) {
    const std::string v = mathmlValue(b->value);
    *out += b->negative ? parenthesized(v) : v;
    return;
  }
  switch (e.kind) {
    case ExprKind::Number: *out += numberElements(e); break;
    case ExprKind::Pi: *out += mi("\u03C0", true); break;
    case ExprKind::Name: *out += mathmlName(e.text); break;
    case ExprKind::Call: *out += callElements(e, values); break;
    case ExprKind::Negate: {
      std::string s = mo("\u2212");
      render(*e.args[0], values, &s);
      *out += mrow(s);
      break;
    }
    case ExprKind::Add: binary("+"); break;
    case ExprKind::Subtract: binary("\u2212"); break;
    case ExprKind::Multiply: binary("\u00B7"); break;
    case ExprKind::Divide:
      *out += "<mfrac>" + bare(*e.args[0], values) + bare(*e.args[1], values) + "</mfrac>";
      break;
    case ExprKind::Power: {
      const Expr& base = *e.args[0];
      if (const TrailBinding* b = boundValue(base, values)) {
        // (39.00 mm)²: a value with a unit or a sign is put in parentheses under a power.
        const std::string v = mathmlValue(b->value);
        const bool plain = !b->negative && (b->value.unit.empty() || b->value.unit == "1") &&
                           b->value.number.exponent.empty();
        *out += "<msup>" + (plain ? v : parenthesized(v)) + bare(*e.args[1], values) + "</msup>";
        break;
      }
      if (base.kind == ExprKind::Name) {
        const NameParts n = splitName(base.text);
        // d_r² as one symbol with both scripts, not (d_r)².
        if (!n.sub.empty()) {
          *out += "<msubsup>" + n.base + n.sub + bare(*e.args[1], values) + "</msubsup>";
          break;
        }
      }
      std::string b;
      render(base, values, &b);
      *out += "<msup>" + b + bare(*e.args[1], values) + "</msup>";
      break;
    }
    case ExprKind::Group: {
      std::string s = mo("(");
      render(*e.args[0], values, &s);
      s += mo(")");
      *out += mrow(s);
      break;
    }
  }
}

double valueWidth(const TrailValue& v) {
  // Upright digits and unit letters run wider than italic names.
  double w = 0.55 * static_cast<double>(glyphs(v.number.digits));
  if (!v.number.exponent.empty()) w += 2.0 + 0.35 * static_cast<double>(v.number.exponent.size());
  if (!v.unit.empty() && v.unit != "1") w += 0.3 + 0.65 * static_cast<double>(glyphs(v.unit));
  return w;
}

double width(const Expr& e, const MathValueOf* values) {
  if (const TrailBinding* b = boundValue(e, values)) return valueWidth(b->value) + (b->negative ? 0.8 : 0.0);
  switch (e.kind) {
    case ExprKind::Number: {
      double w = 0.5 * static_cast<double>(e.text.size());
      const std::string unit = e.unit ? e.unit->pretty() : e.unitWritten();
      if (!unit.empty() && unit != "1") w += 0.25 + 0.55 * static_cast<double>(glyphs(unit));
      return w;
    }
    case ExprKind::Pi: return 0.6;
    case ExprKind::Name: return mathmlNameWidth(e.text);
    case ExprKind::Call: {
      if (e.text == "sqrt" && e.args.size() == 1) return 1.0 + width(*e.args[0], values);
      double w = 0.5 * static_cast<double>(e.text.size()) + 0.9;
      for (size_t i = 0; i < e.args.size(); ++i) w += width(*e.args[i], values) + (i ? 0.6 : 0.0);
      return w;
    }
    case ExprKind::Negate: return 0.8 + width(*e.args[0], values);
    case ExprKind::Add:
    case ExprKind::Subtract:
    case ExprKind::Multiply: return width(*e.args[0], values) + 1.1 + width(*e.args[1], values);
    case ExprKind::Divide:
      return 0.4 + std::max(width(ungroup(*e.args[0]), values), width(ungroup(*e.args[1]), values));
    case ExprKind::Power: return width(*e.args[0], values) + 0.7 * width(ungroup(*e.args[1]), values);
    case ExprKind::Group: return 0.8 + width(*e.args[0], values);
  }
  return 1.0;
}

}  // namespace

std::string mathmlName(const std::string& name) {
  const NameParts n = splitName(name);
  return n.sub.empty() ? n.base : "<msub>" + n.base + n.sub + "</msub>";
}

std::string mathmlExpr(const Expr& e, const MathValueOf& value_of) {
  std::string out;
  render(e, value_of ? &value_of : nullptr, &out);
  return out;
}

std::string mathmlValue(const TrailValue& v) {
  std::string digits = v.number.digits, out;
  if (!digits.empty() && digits[0] == '-') {
    out += mo("\u2212");
    digits.erase(0, 1);
  }
  out += "<mn>" + escapeXml(digits) + "</mn>";
  if (!v.number.exponent.empty()) {
    std::string exp = v.number.exponent;
    const bool negative = exp[0] == '-';
    if (exp[0] == '-' || exp[0] == '+') exp.erase(0, 1);
    while (exp.size() > 1 && exp[0] == '0') exp.erase(0, 1);
    std::string power = "<mn>" + escapeXml(exp) + "</mn>";
    if (negative) power = mrow(mo("\u2212") + power);
    out += mo("\u00D7") + "<msup><mn>10</mn>" + power + "</msup>";
  }
  if (!v.unit.empty() && v.unit != "1") {
    const bool angle_mark = v.unit == "\u00B0" || v.unit == "\u2032" || v.unit == "\u2033";
    if (!angle_mark) out += "<mspace width=\"0.22em\"/>";
    out += mi(v.unit, true);
  }
  return mrow(out);
}

std::vector<InfixPiece> infixPieces(const Expr& e) {
  std::vector<InfixPiece> pieces;
  const Expr* x = &e;
  // a + b · c - d is ((a + (b · c)) - d), and a · b + c is ((a · b) + c): the
  // operators on the left spine, read from the bottom, are the formula's
  // top-level operators in order. Right operands are kept whole.
  for (;;) {
    const char* op = x->kind == ExprKind::Add        ? "+"
                     : x->kind == ExprKind::Subtract ? "\u2212"
                     : x->kind == ExprKind::Multiply ? "\u00B7"
                                                     : nullptr;
    if (!op) break;
    pieces.push_back({op, x->args[1].get()});
    x = x->args[0].get();
  }
  pieces.push_back({"", x});
  return {pieces.rbegin(), pieces.rend()};
}

double mathmlWidth(const Expr& e, const MathValueOf& value_of) {
  return width(e, value_of ? &value_of : nullptr);
}

double mathmlNameWidth(const std::string& name) {
  const NameParts n = splitName(name);
  return n.base_w + n.sub_w;
}

}  // namespace calctrail
