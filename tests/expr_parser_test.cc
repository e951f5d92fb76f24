// The expression parser on its own (engine/sheet/expr_parser.h): the tree it
// builds for precedence, unary minus, units after numbers and brackets, and
// the errors it reports, with their positions. docs/format.md, "Expressions".
#include <catch2/catch.hpp>

#include <memory>
#include <string>

#include "engine/sheet/expr_parser.h"

using namespace calctrail;

namespace {

struct Parsed {
  ExprPtr expr;
  std::string error;  // "COL: MESSAGE" of the one diagnostic, "" when none
};

Parsed parse(const std::string& text) {
  SourceFile file("f.calc", text);
  Diagnostics diags;
  ExprParser parser(file, 0, static_cast<uint32_t>(text.size()), &diags);
  Parsed p;
  p.expr = parser.parseWhole();
  if (!diags.list().empty()) {
    REQUIRE(diags.list().size() == 1);
    p.error = std::to_string(diags.list()[0].column) + ": " + diags.list()[0].message;
  }
  CHECK(static_cast<bool>(p.expr) == p.error.empty());
  return p;
}

// The tree as an S-expression: (* a (+ b c)), numbers with their unit as
// written: 3[mm], (neg x), (f a b), (group x).
std::string tree(const Expr& e) {
  auto kids = [&](const char* head) {
    std::string out = std::string("(") + head;
    for (const ExprPtr& a : e.args) out += " " + tree(*a);
    return out + ")";
  };
  switch (e.kind) {
    case ExprKind::Number: return e.text + (e.unit ? "[" + e.unit->text + "]" : "");
    case ExprKind::Pi: return "pi";
    case ExprKind::Name: return e.text;
    case ExprKind::Call: return kids(e.text.c_str());
    case ExprKind::Negate: return kids("neg");
    case ExprKind::Add: return kids("+");
    case ExprKind::Subtract: return kids("-");
    case ExprKind::Multiply: return kids("*");
    case ExprKind::Divide: return kids("/");
    case ExprKind::Power: return kids("^");
    case ExprKind::Group: return kids("group");
  }
  return "?";
}

std::string treeOf(const std::string& text) {
  INFO("formula: " << text);
  Parsed p = parse(text);
  INFO(p.error);
  REQUIRE(p.expr);
  return tree(*p.expr);
}

std::string errorOf(const std::string& text) {
  INFO("formula: " << text);
  Parsed p = parse(text);
  CHECK_FALSE(p.expr);
  return p.error;
}

}  // namespace

TEST_CASE("expr parser: precedence and associativity", "[expr]") {
  CHECK(treeOf("a + b * c") == "(+ a (* b c))");
  CHECK(treeOf("a * b + c") == "(+ (* a b) c)");
  CHECK(treeOf("a - b - c") == "(- (- a b) c)");
  CHECK(treeOf("a / b / c") == "(/ (/ a b) c)");
  CHECK(treeOf("a / b * c") == "(* (/ a b) c)");
  // `^` binds tighter than `*` and is right-associative.
  CHECK(treeOf("a * b ^ 2") == "(* a (^ b 2))");
  CHECK(treeOf("2 ^ 3 ^ 2") == "(^ 2 (^ 3 2))");
  CHECK(treeOf("d\u00B2 * pi") == "(* (^ d 2) pi)");
  CHECK(treeOf("V\u00B3") == "(^ V 3)");
  // The product signs of engineering documents.
  CHECK(treeOf("a \u00B7 b \u00D7 c \u22C5 d") == "(* (* (* a b) c) d)");
}

TEST_CASE("expr parser: unary minus", "[expr]") {
  // `^` binds tighter than unary minus: -2^2 is -(2^2).
  CHECK(treeOf("-2^2") == "(neg (^ 2 2))");
  CHECK(treeOf("-a * b") == "(* (neg a) b)");
  CHECK(treeOf("a - -b") == "(- a (neg b))");
  CHECK(treeOf("+a") == "a");
  // An exponent may be negative.
  CHECK(treeOf("a^-1") == "(^ a (neg 1))");
  // A minus right before a number with an absolute temperature is part of it.
  CHECK(treeOf("-40 degC") == "-40[degC]");
  CHECK(treeOf("-40 ddegC") == "(neg 40[ddegC])");
  Parsed cold = parse("-40 degC");
  REQUIRE(cold.expr);
  CHECK(cold.expr->siValue() == Approx(233.15).epsilon(1e-14));
  CHECK(cold.expr->begin == 0);
}

TEST_CASE("expr parser: units after numbers", "[expr]") {
  CHECK(treeOf("20 kN") == "20[kN]");
  CHECK(treeOf("20kN") == "20[kN]");
  CHECK(treeOf("95 %") == "95[%]");
  CHECK(treeOf("9.81 [m/s^2]") == "9.81[m/s^2]");
  CHECK(treeOf("100 [lbf*in]") == "100[lbf*in]");
  CHECK(treeOf("5 [1/in]") == "5[1/in]");
  CHECK(treeOf("3 [mm\u00B2]") == "3[mm^2]");
  CHECK(treeOf("1e-3 m") == "1e-3[m]");
  CHECK(treeOf(".5 in") == ".5[in]");
  CHECK(treeOf("2 kN * 3 m") == "(* 2[kN] 3[m])");
  // The unit belongs to the number, not to what follows.
  CHECK(treeOf("2 m / 4 s") == "(/ 2[m] 4[s])");
  Parsed p = parse("9.81 [m/s^2]");
  REQUIRE(p.expr);
  CHECK(p.expr->unitWritten() == "[m/s^2]");
  CHECK(p.expr->siValue() == Approx(9.81).epsilon(1e-15));
  // A name is never a unit: in 2*d, d is a quantity.
  CHECK(treeOf("2*d") == "(* 2 d)");
  CHECK(treeOf("2 * mm") == "(* 2 mm)");
}

TEST_CASE("expr parser: brackets and calls", "[expr]") {
  CHECK(treeOf("(a + b) * c") == "(* (group (+ a b)) c)");
  CHECK(treeOf("((a))") == "(group (group a))");
  CHECK(treeOf("(3 mm)^2") == "(^ (group 3[mm]) 2)");
  CHECK(treeOf("3 [mm]^2") == "(^ 3[mm] 2)");
  CHECK(treeOf("max(a, b * 2)") == "(max a (* b 2))");
  CHECK(treeOf("atan2(y,x)") == "(atan2 y x)");
  CHECK(treeOf("f ()") == "(f)");
  CHECK(treeOf("pi") == "pi");
  CHECK(treeOf("pi2") == "pi2");
  // Greek letters are letters of names.
  CHECK(treeOf("\u03B7 * 2") == "(* \u03B7 2)");
}

TEST_CASE("expr parser: node positions are byte offsets in the file", "[expr]") {
  Parsed p = parse("a + bb * 3 kN");
  REQUIRE(p.expr);
  CHECK(p.expr->begin == 0);
  CHECK(p.expr->end == 13);
  const Expr& product = *p.expr->args[1];
  CHECK(product.begin == 4);
  CHECK(product.end == 13);
  CHECK(product.args[1]->begin == 9);
  CHECK(product.args[1]->end == 13);
}

TEST_CASE("expr parser: errors with their columns", "[expr]") {
  CHECK(errorOf("a +") == "3: the formula ends too early: a value is missing");
  CHECK(errorOf("(a + b") == "1: this `(` is never closed");
  CHECK(errorOf("a + b)") == "6: unmatched `)`");
  CHECK(errorOf("2 ** 3") == "3: `**` is not an operator here; write `^` for a power");
  CHECK(errorOf("4 5") == "3: expected an operator (+ - * / ^) before this; a product needs `*`");
  CHECK(errorOf("a = b").rfind("3: unexpected `=` in a formula", 0) == 0);
  CHECK(errorOf("[mm]") == "1: a unit in brackets must follow a number, as in `9.81 [m/s^2]`");
  CHECK(errorOf("3 [mm") == "3: this `[` is never closed: a unit in brackets ends with `]`");
  CHECK(errorOf("max(a, b") == "4: this `(` of the call to `max` is never closed");
  CHECK(errorOf("2 sin(a)") == "3: a number cannot be followed by a call; write `2*sin(...)`");
  CHECK(errorOf("1.2.3") == "1: malformed number");
  CHECK(errorOf("1e999") == "1: the number 1e999 is out of range");
  CHECK(errorOf("a \u2212 b").rfind("3: unexpected character \u2212 (U+2212 MINUS SIGN)", 0) == 0);
  const std::string unit = errorOf("3 lbs");
  CHECK(unit.rfind("3: unknown unit `lbs`", 0) == 0);
  CHECK(unit.find("write `3*lbs`") != std::string::npos);
}

TEST_CASE("expr parser: nesting and length limits", "[expr]") {
  const int deep = ExprParser::kMaxDepth + 1;
  CHECK(errorOf(std::string(deep, '(') + "1" + std::string(deep, ')')) ==
        std::to_string(ExprParser::kMaxDepth + 1) + ": the formula nests too deeply (more than 128 levels)");
  CHECK(treeOf(std::string(ExprParser::kMaxDepth, '(') + "1" + std::string(ExprParser::kMaxDepth, ')'))
            .find("1") != std::string::npos);
  std::string sum = "1";
  for (int i = 0; i < ExprParser::kMaxOperations + 1; ++i) sum += "+1";
  CHECK(errorOf(sum).find("the formula is too long (more than 4096 operations)") != std::string::npos);
}

TEST_CASE("expr parser: a power right after a unit name reads two ways, however it is spaced", "[expr]") {
  const std::string both = "write `3 [mm^2]` for a value in mm^2, or `(3 mm)^2` for the power of 3 mm";
  CHECK(errorOf("3 mm^2") == "3: `3 mm^2` can be read two ways: " + both);
  // The audit's inputs: a space before the power was read as (3 mm)^2.
  CHECK(errorOf("3 mm ^2") == "3: `3 mm ^2` can be read two ways: " + both);
  CHECK(errorOf("3 mm ^ 2") == "3: `3 mm ^ 2` can be read two ways: " + both);
  CHECK(errorOf("3 mm\t^2") == "3: `3 mm\t^2` can be read two ways: " + both);
  CHECK(errorOf("3 mm \u00B2") == "3: `3 mm \u00B2` can be read two ways: " + both);
  CHECK(errorOf("3 mm\u00B2") == "3: `3 mm\u00B2` can be read two ways: " + both);
  const std::string stars = " can be read two ways (and `**` is not an operator; a power is `^`): ";
  CHECK(errorOf("3 mm **2") == "3: `3 mm **2`" + stars + both);
  CHECK(errorOf("3 mm**2") == "3: `3 mm**2`" + stars + both);
  CHECK(errorOf("3 mm \u00B3") ==
        "3: `3 mm \u00B3` can be read two ways: write `3 [mm^3]` for a value in mm^3, or `(3 mm)^3` for the "
        "power of 3 mm");
  // Every superscript power, not only the two the expression grammar knows.
  CHECK(errorOf("3 mm\u2074").find("write `3 [mm^4]`") != std::string::npos);
  CHECK(errorOf("3 mm\u207B\u00B9").find("write `3 [mm^-1]` for a value in mm^-1, or `(3 mm)^-1`") !=
        std::string::npos);
  CHECK(errorOf("3 mm ^-2").find("`(3 mm)^-2`") != std::string::npos);
  CHECK(errorOf("3 % ^2").find("`3 [%^2]`") != std::string::npos);
  // Inside a larger formula, at the column of the number.
  CHECK(errorOf("a + 3 mm ^2 * b").rfind("7: `3 mm ^2` can be read two ways", 0) == 0);
  // The two unambiguous spellings are accepted, spaced or not.
  CHECK(treeOf("3 [mm^2]") == "3[mm^2]");
  CHECK(treeOf("3 [mm] ^ 2") == "(^ 3[mm] 2)");
  CHECK(treeOf("(3 mm) ^2") == "(^ (group 3[mm]) 2)");
  CHECK(treeOf("(3 mm)\u00B2") == "(^ (group 3[mm]) 2)");
}

TEST_CASE("expr parser: a unit power base is shown in parentheses in the trail", "[expr]") {
  // `3 [mm]^2` is (3 mm)^2; the trail must not print the ambiguous `3 mm^2`.
  Parsed p = parse("d * 3 [mm]^2");
  REQUIRE(p.expr);
  CHECK(renderExpr(*p.expr, nullptr, true) == "d \u00B7 (3 mm)^2");
  CHECK(renderExpr(*p.expr) == "d * 3 [mm]^2");
}

TEST_CASE("expr parser: a control character in the range is an error at its place", "[expr]") {
  CHECK(errorOf("2\x1B[2J") ==
        "2: a control character (ESC, 0x1B) is not allowed in worksheet text: it would reach terminals and "
        "reports as it is; delete it (a TAB is the only one allowed)");
  CHECK(treeOf("a +\tb") == "(+ a b)");  // a TAB is a blank
}

TEST_CASE("expr parser: a compound unit written bare after a number shows the bracketed fix",
          "[expr][hints]") {
  CHECK(errorOf("40 N*m") == "4: `40 N*m` can be read two ways: write `40 [N*m]` for a value in N*m "
                             "(a compound unit goes in brackets), or `40 N * m` if `m` is a quantity");
  CHECK(errorOf("9.81 m/s^2") == "6: `9.81 m/s^2` can be read two ways: write `9.81 [m/s^2]` for a value "
                                 "in m/s^2 (a compound unit goes in brackets), or `9.81 m / s^2` if `s` is "
                                 "a quantity");
  CHECK(errorOf("2 * 1.5 kg*m/s^2").find("write `1.5 [kg*m/s^2]`") != std::string::npos);
  CHECK(errorOf("1.5 kg*m/s^2").find("`1.5 kg * m / s^2` if `m` and `s` are quantities") !=
        std::string::npos);
  CHECK(errorOf("40 N\u00B7m").find("write `40 [N*m]`") != std::string::npos);
  CHECK(errorOf("3 lbf/in^2 + p").find("write `3 [lbf/in^2]`") != std::string::npos);
  // With blanks it is a product, as fmt writes one; a name that is no unit is a quantity.
  CHECK(treeOf("40 N * m") == "(* 40[N] m)");
  CHECK(treeOf("2 kg*g_n") == "(* 2[kg] g_n)");
  CHECK(treeOf("2 mm*3") == "(* 2[mm] 3)");
  CHECK(treeOf("40 [N*m]") == "40[N*m]");
}

TEST_CASE("expr parser: an unknown unit of units run together suggests the bracketed literal",
          "[expr][hints]") {
  CHECK(errorOf("5 Nm") == "3: unknown unit `Nm`; did you mean `5 [N*m]`, `5 m` or `5 km`? (to multiply by a "
                           "quantity named `Nm`, write `5*Nm`)");
  CHECK(errorOf("3 kNm").find("did you mean `3 [kN*m]`") != std::string::npos);
  CHECK(errorOf("10 Nmm").find("did you mean `10 [N*mm]`") != std::string::npos);
  CHECK(errorOf("2 lbfin").find("did you mean `2 [lbf*in]`") != std::string::npos);
  // Never a bare compound after a number, where it would not parse.
  CHECK(errorOf("5 Nm").find("`N*m`") == std::string::npos);
  // A unit the table has as such is not split.
  CHECK(treeOf("2 kWh") == "2[kWh]");
  // Inside brackets the suggestion is the unit itself.
  CHECK(errorOf("5 [Nm]").find("did you mean `N*m`") != std::string::npos);
}

TEST_CASE("expr parser: a fraction before a unit is one number, never a reciprocal",
          "[expr][hints]") {
  auto value = [](const std::string& text) {
    Parsed p = parse(text);
    INFO(text << ": " << p.error);
    REQUIRE(p.expr);
    REQUIRE(p.expr->kind == ExprKind::Number);
    return p.expr->siValue();
  };
  CHECK(treeOf("1/8 in") == "1/8[in]");
  CHECK(value("1/8 in") == 0.125 * 0.0254);
  CHECK(value("3/4 in") == 0.75 * 0.0254);
  CHECK(value("1-1/2 in") == 1.5 * 0.0254);
  CHECK(value("1/8in") == 0.125 * 0.0254);
  CHECK(value("1/8 [in]") == 0.125 * 0.0254);
  CHECK(value("1/2 %") == 0.005);
  CHECK(treeOf("-1/8 in") == "(neg 1/8[in])");
  CHECK(treeOf("2 * 1/8 in") == "(* 2 1/8[in])");
  CHECK(treeOf("1/8 [in]^2") == "(^ 1/8[in] 2)");
  CHECK(treeOf("x / (1/8 in)") == "(/ x (group 1/8[in]))");
  // Without a unit: the division and subtraction they look like.
  CHECK(treeOf("1/8") == "(/ 1 8)");
  CHECK(treeOf("1-1/2") == "(- 1 (/ 1 2))");
  CHECK(treeOf("1 / (8 in)") == "(/ 1 (group 8[in]))");
  // Every other number over a number with a unit reads two ways.
  CHECK(errorOf("1 / 8 in") == "3: `1 / 8 in` can be read two ways: write `1/8 in` (no blanks) for 1/8 of "
                               "one in, or `1 / (8 in)` to divide 1 by 8 in");
  CHECK(errorOf("1.5/2 in") == "4: `1.5/2 in` can be read two ways: write `1.5 in / 2` for 1.5/2 of one "
                               "in, or `1.5 / (2 in)` to divide 1.5 by 2 in");
  CHECK(errorOf("1/2.5 in").find("write `1 in / 2.5`") != std::string::npos);
  CHECK(errorOf("-1 / 8 in").find("write `-1/8 in` (no blanks)") != std::string::npos);
  CHECK(errorOf("L / 1/8 in") == "3: `L / 1/8 in` can be read two ways: write `L / (1/8 in)` to divide by "
                                 "1/8 in, or put the parentheses where you mean them");
  CHECK(errorOf("1/0 in") == "1: `1/0` divides by zero: the number under the `/` of a fraction cannot be 0");
  CHECK(errorOf("1-1/2 %") == "1: `1-1/2 %` can be read two ways: write `(1 + 1/2) * 1 %` for 1 and "
                              "1/2 %, or `1 - 1/2 %` for the difference (a mixed number needs a unit with a "
                              "dimension, such as `1-1/2 in`)");
  CHECK(errorOf("1-1/2 rev").find("`(1 + 1/2) * 1 rev`") != std::string::npos);
  CHECK(errorOf("1/8 in^2").find("write `1/8 [in^2]`") != std::string::npos);
}
