#include "engine/sheet/expr_parser.h"

#include <cctype>
#include <cmath>
#include <cstdlib>

#include "engine/sheet/control_chars.h"
#include "engine/sheet/name_lexer.h"
#include "engine/sheet/number_literal.h"
#include "engine/units/unit_parser.h"
#include "engine/units/unit_table.h"
#include "engine/util/utf8.h"

namespace calctrail {

namespace {
bool isDigit(char c) { return c >= '0' && c <= '9'; }
bool isAsciiLetter(char c) { return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'); }
bool isBlankChar(char c) { return c == ' ' || c == '\t'; }

// The ASCII of a superscript digit or sign (U+00B2 is "2", U+207B is "-"), or 0.
char superscriptAscii(char32_t cp) {
  if (cp == 0x2070) return '0';
  if (cp == 0x00B9) return '1';
  if (cp == 0x00B2) return '2';
  if (cp == 0x00B3) return '3';
  if (cp >= 0x2074 && cp <= 0x2079) return static_cast<char>('0' + (cp - 0x2070));
  if (cp == 0x207B) return '-';
  if (cp == 0x207A) return '+';
  return 0;
}
}  // namespace

ExprPtr makeBinary(ExprKind kind, ExprPtr lhs, ExprPtr rhs) {
  auto e = std::make_unique<Expr>();
  e->kind = kind;
  e->begin = lhs->begin;
  e->end = rhs->end;
  e->args.push_back(std::move(lhs));
  e->args.push_back(std::move(rhs));
  return e;
}

ExprParser::ExprParser(const SourceFile& file, uint32_t begin, uint32_t end, Diagnostics* diags)
    : file_(file), src_(file.bytes()), pos_(begin), end_(end), diags_(diags) {}

void ExprParser::skipSpace() {
  while (pos_ < end_ && (src_[pos_] == ' ' || src_[pos_] == '\t')) ++pos_;
}

bool ExprParser::atEnd() {
  skipSpace();
  return pos_ >= end_;
}

char ExprParser::peek() { return atEnd() ? '\0' : src_[pos_]; }

void ExprParser::fail(uint32_t begin, uint32_t end, const std::string& message) {
  if (failed_) return;
  failed_ = true;
  diags_->error(file_, begin, end, message);
}

bool ExprParser::isNameStart(uint32_t at) const { return calctrail::isNameStart(src_.substr(0, end_), at); }

uint32_t ExprParser::scanName(uint32_t at) const {
  return static_cast<uint32_t>(nameEnd(src_.substr(0, end_), at, /*dotted=*/true));
}

void ExprParser::failUnexpected() {
  skipSpace();
  if (pos_ >= end_) {
    fail(end_ > 0 ? end_ - 1 : 0, end_, "the formula ends too early: a value is missing");
    return;
  }
  const char c = src_[pos_];
  if (static_cast<unsigned char>(c) >= 0x80) {
    size_t n;
    const char32_t cp = decodeUtf8(src_.substr(0, end_), pos_, &n);
    std::string msg = "unexpected character " + encodeUtf8(cp) + " (" + describeCodePoint(cp) + ")";
    if (const char a = asciiLookAlike(cp)) msg += std::string("; it looks like `") + a + "` but is not ASCII: type `" + a + "`";
    fail(pos_, pos_ + static_cast<uint32_t>(n), msg);
    return;
  }
  if (c == '*' && pos_ + 1 < end_ && src_[pos_ + 1] == '*') {
    fail(pos_, pos_ + 2, "`**` is not an operator here; write `^` for a power");
    return;
  }
  if (c == '=') {
    fail(pos_, pos_ + 1, "unexpected `=` in a formula (one definition per line; a check compares with <, <=, > or >=)");
    return;
  }
  fail(pos_, pos_ + 1, std::string("unexpected `") + c + "`");
}

// Text from a --set option has not been through the worksheet's line checks.
bool ExprParser::rejectControlChars() {
  size_t length = 0;
  const size_t at = findControlChar(src_.substr(pos_, end_ - pos_), &length);
  if (at == std::string_view::npos) return true;
  const uint32_t b = pos_ + static_cast<uint32_t>(at);
  fail(b, b + static_cast<uint32_t>(length), controlCharMessage(src_, b));
  return false;
}

ExprPtr ExprParser::parseWhole() {
  if (!rejectControlChars()) return nullptr;
  ExprPtr e = parseSum();
  if (!e || failed_) return nullptr;
  if (!atEnd()) {
    if (peek() == ')') {
      fail(pos_, pos_ + 1, "unmatched `)`");
    } else if (isNameStart(pos_) || isDigit(peek()) || peek() == '(') {
      fail(pos_, pos_ + 1, "expected an operator (+ - * / ^) before this; a product needs `*`");
    } else {
      failUnexpected();
    }
    return nullptr;
  }
  numberNodes(*e);
  return e;
}

bool ExprParser::comparisonAhead(Comparison* op, uint32_t* length) {
  skipSpace();
  if (pos_ >= end_) return false;
  std::string_view rest = src_.substr(pos_, end_ - pos_);
  if (rest.rfind("<=", 0) == 0) { *op = Comparison::LessEqual; *length = 2; return true; }
  if (rest.rfind(">=", 0) == 0) { *op = Comparison::GreaterEqual; *length = 2; return true; }
  if (rest.rfind("\u2264", 0) == 0) { *op = Comparison::LessEqual; *length = 3; return true; }
  if (rest.rfind("\u2265", 0) == 0) { *op = Comparison::GreaterEqual; *length = 3; return true; }
  if (rest[0] == '<') { *op = Comparison::Less; *length = 1; return true; }
  if (rest[0] == '>') { *op = Comparison::Greater; *length = 1; return true; }
  return false;
}

bool ExprParser::parseCondition(ExprPtr* lhs, Comparison* op, uint32_t* op_begin, ExprPtr* rhs) {
  if (!rejectControlChars()) return false;
  *lhs = parseSum();
  if (!*lhs || failed_) return false;
  uint32_t length = 0;
  if (!comparisonAhead(op, &length)) {
    if (pos_ < end_ && src_[pos_] == '=') {
      fail(pos_, pos_ + 1, "a check compares with <, <=, > or >=; `=` is not a comparison (exact equality of computed values is never safe to test)");
    } else if (atEnd()) {
      fail((*lhs)->begin, (*lhs)->end, "a check needs a comparison: EXPR <, <=, > or >= EXPR");
    } else {
      failUnexpected();
    }
    return false;
  }
  *op_begin = pos_;
  pos_ += length;
  *rhs = parseSum();
  if (!*rhs || failed_) return false;
  Comparison again;
  if (comparisonAhead(&again, &length)) {
    fail(pos_, pos_ + length, "one comparison per check; write two checks for a range");
    return false;
  }
  if (!atEnd()) {
    failUnexpected();
    return false;
  }
  numberNodes(**lhs);
  numberNodes(**rhs);
  return true;
}

ExprPtr ExprParser::parseSum() {
  ExprPtr lhs = parseProduct();
  while (lhs && !failed_) {
    const char c = peek();
    if (c != '+' && c != '-') break;
    ++pos_;
    if (++operations_ > kMaxOperations) {
      fail(pos_ - 1, pos_, "the formula is too long (more than 4096 operations); split it into named steps");
      return nullptr;
    }
    ExprPtr rhs = parseProduct();
    if (!rhs) return nullptr;
    lhs = makeBinary(c == '+' ? ExprKind::Add : ExprKind::Subtract, std::move(lhs), std::move(rhs));
  }
  return failed_ ? nullptr : std::move(lhs);
}

ExprPtr ExprParser::parseProduct() {
  ExprPtr lhs = parseUnary();
  while (lhs && !failed_) {
    skipSpace();
    if (pos_ >= end_) break;
    ExprKind kind;
    uint32_t length = 1;
    std::string_view rest = src_.substr(pos_, end_ - pos_);
    if (rest[0] == '*') {
      if (rest.size() > 1 && rest[1] == '*') {
        failUnexpected();
        return nullptr;
      }
      kind = ExprKind::Multiply;
    } else if (rest[0] == '/') {
      kind = ExprKind::Divide;
    } else if (rest.rfind("\u00B7", 0) == 0 || rest.rfind("\u00D7", 0) == 0 || rest.rfind("\u22C5", 0) == 0) {
      kind = ExprKind::Multiply;  // the product signs of engineering documents
      length = rest[0] == '\xE2' ? 3 : 2;
    } else {
      break;
    }
    pos_ += length;
    if (++operations_ > kMaxOperations) {
      fail(pos_ - length, pos_, "the formula is too long (more than 4096 operations); split it into named steps");
      return nullptr;
    }
    const uint32_t op = pos_ - length;
    ExprPtr rhs = parseUnary();
    if (!rhs) return nullptr;
    if (kind == ExprKind::Divide && !rejectAmbiguousDivision(*lhs, op, *rhs)) return nullptr;
    lhs = makeBinary(kind, std::move(lhs), std::move(rhs));
  }
  return failed_ ? nullptr : std::move(lhs);
}

// A fraction is never read as a reciprocal by accident: `1 / 8 in` (blanks),
// `1.5/2 in` (not two whole numbers) and `F / 1/8 in` (a fraction after `/`)
// each read two ways, and the error shows both.
bool ExprParser::rejectAmbiguousDivision(const Expr& lhs, uint32_t op, const Expr& rhs) {
  const auto signless = [](const Expr& x) { return x.kind == ExprKind::Negate ? x.args[0].get() : &x; };
  const Expr* l = signless(lhs);
  const Expr* r = signless(rhs);
  if (r->kind != ExprKind::Number || !r->unit) return true;
  const std::string left(src_.substr(lhs.begin, op - lhs.begin));
  const std::string right(src_.substr(rhs.begin, rhs.end - rhs.begin));
  std::string l_text = left;
  while (!l_text.empty() && isBlankChar(l_text.back())) l_text.pop_back();
  const std::string written = "`" + std::string(src_.substr(lhs.begin, rhs.end - lhs.begin)) + "`";
  if (r->text.find('/') != std::string::npos) {
    fail(op, rhs.end,
         written + " can be read two ways: write `" + l_text + " / (" + right + ")` to divide by " + right +
             ", or put the parentheses where you mean them");
    return false;
  }
  if (l->kind != ExprKind::Number || l->unit || l->text.find('/') != std::string::npos) return true;
  const std::string u = r->unitWritten(), d = r->text;
  const bool whole = plainIntegerEnd(l->begin) == l->end && plainIntegerEnd(r->begin) == r->begin + d.size();
  const std::string fraction =
      whole ? "`" + l_text + "/" + d + " " + u + "` (no blanks)" : "`" + l_text + " " + u + " / " + d + "`";
  fail(op, rhs.end,
       written + " can be read two ways: write " + fraction + " for " + l_text + "/" + d + " of one " + u +
           ", or `" + l_text + " / (" + right + ")` to divide " + l_text + " by " + right);
  return false;
}

ExprPtr ExprParser::parseUnary() {
  skipSpace();
  if (pos_ < end_ && (src_[pos_] == '-' || src_[pos_] == '+')) {
    const uint32_t begin = pos_;
    const bool minus = src_[pos_] == '-';
    ++pos_;
    if (++depth_ > kMaxDepth) {
      fail(begin, begin + 1, "the formula nests too deeply (more than 128 levels)");
      return nullptr;
    }
    ExprPtr operand = parseUnary();
    --depth_;
    if (!operand) return nullptr;
    if (!minus) return operand;
    if (operand->kind == ExprKind::Number && operand->unit && operand->unit->hasOffset()) {
      // -40 degC is a temperature below zero, not the negative of 40 degC.
      operand->number = -operand->number;
      operand->text = "-" + operand->text;
      operand->begin = begin;
      return operand;
    }
    auto e = std::make_unique<Expr>();
    e->kind = ExprKind::Negate;
    e->begin = begin;
    e->end = operand->end;
    e->args.push_back(std::move(operand));
    return e;
  }
  return parsePower();
}

ExprPtr ExprParser::parsePower() {
  ExprPtr base = parsePrimary();
  if (!base || failed_) return nullptr;
  skipSpace();
  if (pos_ < end_ && src_[pos_] == '^') {
    const uint32_t at = pos_++;
    if (++depth_ > kMaxDepth) {
      fail(at, at + 1, "the formula nests too deeply (more than 128 levels)");
      return nullptr;
    }
    ExprPtr exponent = parseUnary();  // right-associative: a^b^c = a^(b^c); 2^-1 allowed
    --depth_;
    if (!exponent) return nullptr;
    return makeBinary(ExprKind::Power, std::move(base), std::move(exponent));
  }
  // x² and x³ as typed in documents (the lead byte first: most operands are followed by ASCII).
  const bool superscript = pos_ < src_.size() && src_[pos_] == '\xC2' &&
                           (src_.substr(pos_, 2) == "\u00B2" || src_.substr(pos_, 2) == "\u00B3");
  if (superscript) {
    auto two = std::make_unique<Expr>();
    two->kind = ExprKind::Number;
    two->begin = pos_;
    two->end = pos_ + 2;
    two->number = src_[pos_ + 1] == '\xB2' ? 2 : 3;
    two->text = src_[pos_ + 1] == '\xB2' ? "2" : "3";
    pos_ += 2;
    return makeBinary(ExprKind::Power, std::move(base), std::move(two));
  }
  return base;
}

ExprPtr ExprParser::parsePrimary() {
  skipSpace();
  if (pos_ >= end_) {
    failUnexpected();
    return nullptr;
  }
  const char c = src_[pos_];
  if (isDigit(c) || (c == '.' && pos_ + 1 < end_ && isDigit(src_[pos_ + 1]))) return parseNumber();
  if (c == '(') {
    const uint32_t begin = pos_++;
    if (++depth_ > kMaxDepth) {
      fail(begin, begin + 1, "the formula nests too deeply (more than 128 levels)");
      return nullptr;
    }
    ExprPtr inner = parseSum();
    --depth_;
    if (!inner) return nullptr;
    if (peek() != ')') {
      if (atEnd()) fail(begin, begin + 1, "this `(` is never closed");
      else failUnexpected();
      return nullptr;
    }
    ++pos_;
    auto e = std::make_unique<Expr>();
    e->kind = ExprKind::Group;
    e->begin = begin;
    e->end = pos_;
    e->args.push_back(std::move(inner));
    return e;
  }
  if (isNameStart(pos_)) return parseNameOrCall();
  if (c == '[') {
    fail(pos_, pos_ + 1, "a unit in brackets must follow a number, as in `9.81 [m/s^2]`");
    return nullptr;
  }
  failUnexpected();
  return nullptr;
}

uint32_t ExprParser::scanLiteral(uint32_t at) const {
  uint32_t p = at;
  while (p < end_ && isDigit(src_[p])) ++p;
  if (p < end_ && src_[p] == '.') {
    ++p;
    while (p < end_ && isDigit(src_[p])) ++p;
  }
  if (p < end_ && (src_[p] == 'e' || src_[p] == 'E')) {
    uint32_t q = p + 1;
    if (q < end_ && (src_[q] == '+' || src_[q] == '-')) ++q;
    if (q < end_ && isDigit(src_[q])) {
      while (q < end_ && isDigit(src_[q])) ++q;
      p = q;
    }
  }
  return p;
}

uint32_t ExprParser::plainIntegerEnd(uint32_t at) const {
  if (at >= end_ || !isDigit(src_[at])) return 0;
  const uint32_t q = scanLiteral(at);
  for (uint32_t k = at; k < q; ++k)
    if (!isDigit(src_[k])) return 0;
  if (q < end_ && (src_[q] == '.' || isDigit(src_[q]))) return 0;
  return q;
}

// `1/8 in`, `3/4 in`, `1-1/2 in`: inch sizes as they are written. Two plain
// integers with a `/` and no blanks (after a whole number and a `-`, for a
// mixed number) directly before a unit are one number; without a unit they
// are the division and subtraction they look like. Fills `text` and `value`
// and returns the end of the fraction, or 0 when there is none at `begin`.
uint32_t ExprParser::fractionEnd(uint32_t begin, uint32_t whole_end, std::string* text, double* value,
                                 bool* mixed) const {
  uint32_t num_begin = whole_end;
  *mixed = false;
  if (whole_end < end_ && src_[whole_end] == '-') {
    const uint32_t n = plainIntegerEnd(whole_end + 1);
    if (n == 0 || n >= end_ || src_[n] != '/') return 0;
    num_begin = whole_end + 1;
    *mixed = true;
  } else {
    num_begin = begin;
  }
  const uint32_t num_end = *mixed ? plainIntegerEnd(num_begin) : whole_end;
  if (num_end >= end_ || src_[num_end] != '/') return 0;
  const uint32_t den_end = plainIntegerEnd(num_end + 1);
  if (den_end == 0) return 0;
  const auto read = [&](uint32_t b, uint32_t e) {
    bool in_range = true;  // not asked: the fraction's value is checked whole, below
    return decimalValue(src_.substr(b, e - b), &in_range);
  };
  const double whole = *mixed ? read(begin, whole_end) : 0.0;
  const double num = read(num_begin, num_end), den = read(num_end + 1, den_end);
  // One rounding: (whole * den + num) is exact for the integers anyone writes.
  *value = (whole * den + num) / den;
  text->assign(src_.substr(begin, den_end - begin));
  return den_end;
}

ExprPtr ExprParser::parseNumber() {
  const uint32_t begin = pos_;
  const uint32_t p = scanLiteral(begin);
  auto e = std::make_unique<Expr>();
  e->kind = ExprKind::Number;
  e->begin = begin;
  e->text.assign(src_.substr(begin, p - begin));
  bool in_range = true;
  e->number = decimalValue(e->text, &in_range);
  if (!in_range || !std::isfinite(e->number)) {
    fail(begin, p, "the number " + e->text + " is out of range");
    return nullptr;
  }
  pos_ = p;
  e->end = p;
  if (p < end_ && (src_[p] == '.' || isDigit(src_[p]))) {
    fail(begin, p + 1, "malformed number");
    return nullptr;
  }
  if (plainIntegerEnd(begin) == p) {
    std::string text;
    double value = 0.0;
    bool mixed = false;
    if (const uint32_t f = fractionEnd(begin, p, &text, &value, &mixed)) {
      Expr fraction;
      fraction.kind = ExprKind::Number;
      fraction.begin = begin;
      fraction.text = text;
      fraction.number = value;
      pos_ = f;
      if (!parseUnitAfterNumber(&fraction)) return nullptr;
      if (fraction.unit) {
        if (!std::isfinite(value)) {
          fail(begin, f,
               "`" + text + "` divides by zero: the number under the `/` of a fraction cannot be 0");
          return nullptr;
        }
        if (mixed && fraction.unit->dim.withoutAngle().dimensionless()) {
          // `1-1/2 %` could also be 1 - 0.5 %, a number too: no way to tell.
          const size_t dash = text.find('-');
          const std::string whole = text.substr(0, dash), part = text.substr(dash + 1);
          const std::string u = fraction.unitWritten();
          fail(begin, fraction.end,
               "`" + text + " " + u + "` can be read two ways: write `(" + whole + " + " + part + ") * 1 " +
                   u + "` for " + whole + " and " + part + " " + u + ", or `" + whole + " - " + part + " " +
                   u + "` for the difference (a mixed number needs a unit with a dimension, such as " +
                   "`1-1/2 in`)");
          return nullptr;
        }
        *e = std::move(fraction);
        return e;
      }
      pos_ = p;  // no unit after it: a plain division (1/8) or difference (1-1/2)
    }
  }
  if (!parseUnitAfterNumber(e.get())) return nullptr;
  return e;
}

// `3 mm^2` reads two ways, 3 [mm^2] or (3 [mm])^2, however it is spaced or
// typed: `3 mm ^2`, `3 mm ²`, `3 mm⁴`, `3 mm⁻¹`, `3 mm**2` and `3 % ^2` alike. Reports the
// two bracketed readings and returns false when a power follows the unit.
bool ExprParser::rejectPowerAfterUnit(const Expr* number, uint32_t begin, std::string_view unit) {
  uint32_t p = pos_;
  while (p < end_ && (src_[p] == ' ' || src_[p] == '\t')) ++p;
  const std::string_view after = src_.substr(p, end_ - p);
  std::string power;
  uint32_t q = p;
  bool stars = false;
  size_t len = 0;
  if (!after.empty() && static_cast<unsigned char>(after[0]) >= 0x80 &&
      superscriptAscii(decodeUtf8(src_.substr(0, end_), p, &len))) {
    // mm², mm³, mm⁻¹: every superscript power, as the unit parser reads them.
    while (q < end_ && static_cast<unsigned char>(src_[q]) >= 0x80) {
      const char a = superscriptAscii(decodeUtf8(src_.substr(0, end_), q, &len));
      if (!a) break;
      if (a != '+') power += a;
      q += static_cast<uint32_t>(len);
    }
  } else if (!after.empty() && after[0] == '^') {
    q += 1;
  } else if (after.rfind("**", 0) == 0) {
    stars = true;
    q += 2;
  } else {
    return true;
  }
  if (power.empty()) {
    // The exponent as written: a bracketed group, or a signed number or name.
    while (q < end_ && (src_[q] == ' ' || src_[q] == '\t')) ++q;
    const uint32_t from = q;
    if (q < end_ && src_[q] == '(') {
      const size_t close = src_.substr(0, end_).find(')', q);
      q = close == std::string_view::npos ? end_ : static_cast<uint32_t>(close) + 1;
    } else {
      if (q < end_ && (src_[q] == '-' || src_[q] == '+')) ++q;
      while (q < end_ && (isDigit(src_[q]) || isAsciiLetter(src_[q]) || src_[q] == '.' || src_[q] == '_'))
        ++q;
    }
    power.assign(src_.substr(from, q - from));
    if (power.empty() || power == "-" || power == "+") power = "2";  // only to show the two forms
  }
  const std::string u(unit), n = number->text;
  const std::string written(src_.substr(number->begin, q - number->begin));
  std::string msg = "`" + written + "` can be read two ways";
  if (stars) msg += " (and `**` is not an operator; a power is `^`)";
  msg += ": write `" + n + " [" + u + "^" + power + "]` for a value in " + u + "^" + power + ", or `(" + n +
         " " + u + ")^" + power + "` for the power of " + n + " " + u;
  fail(begin, q, msg);
  return false;
}

// After a number: nothing, a bracketed unit `[m/s^2]`, `%`, or ONE unit name.
bool ExprParser::parseUnitAfterNumber(Expr* number) {
  skipSpace();
  if (pos_ >= end_) return true;
  const uint32_t begin = pos_;
  std::string_view unit_text;
  uint32_t unit_begin = begin;
  if (src_[pos_] == '[') {
    const size_t close = src_.substr(0, end_).find(']', pos_);
    if (close == std::string_view::npos) {
      fail(begin, begin + 1, "this `[` is never closed: a unit in brackets ends with `]`");
      return false;
    }
    unit_begin = pos_ + 1;
    unit_text = src_.substr(unit_begin, close - unit_begin);
    pos_ = static_cast<uint32_t>(close) + 1;
  } else if (src_[pos_] == '%') {
    unit_text = src_.substr(pos_, 1);
    ++pos_;
  } else {
    // A unit name: letters, including the micro sign and other non-ASCII
    // letters (so a look-alike gets the unit parser's clear message).
    uint32_t p = pos_;
    while (p < end_) {
      const char c = src_[p];
      if (isAsciiLetter(c) || c == '_') {
        ++p;
        continue;
      }
      if (static_cast<unsigned char>(c) >= 0x80) {
        size_t n;
        const char32_t cp = decodeUtf8(src_.substr(0, end_), p, &n);
        const char look = asciiLookAlike(cp);
        if (superscriptAscii(cp) || cp == 0xB7 || cp == 0xD7 || cp == 0x22C5 || cp == 0x2264 ||
            cp == 0x2265 || (look && !isAsciiLetter(look)))
          break;  // a power, an operator or a look-alike of one (U+2212 MINUS SIGN): not part of a unit
        p += static_cast<uint32_t>(n);
        continue;
      }
      break;
    }
    if (p == pos_) return true;  // no unit
    unit_text = src_.substr(pos_, p - pos_);
    if (p < end_ && src_[p] == '(') {
      fail(begin, p + 1, "a number cannot be followed by a call; write `" + number->text + "*" +
                             std::string(unit_text) + "(...)`");
      return false;
    }
    pos_ = p;
  }
  if (src_[begin] != '[' && !rejectPowerAfterUnit(number, begin, unit_text)) return false;
  const std::string_view written = src_.substr(begin, pos_ - begin);
  Unit unit;
  UnitError err;
  const bool bare = src_[begin] != '[' && src_[begin] != '%';
  if (!parseUnit(unit_text, &unit, &err, bare ? std::string_view(number->text) : std::string_view())) {
    const uint32_t at = unit_begin + static_cast<uint32_t>(std::min(err.offset, unit_text.size()));
    std::string msg = err.message;
    if (bare && isAsciiLetter(src_[begin])) {
      msg += " (to multiply by a quantity named `" + std::string(unit_text) + "`, write `" + number->text + "*" +
             std::string(unit_text) + "`)";
    }
    fail(at, std::max<uint32_t>(at + 1, src_[begin] == '[' ? pos_ - 1 : pos_), msg);
    return false;
  }
  if (bare && !rejectCompoundAfterUnit(number, begin, unit_text)) return false;
  number->unit = std::make_unique<NumberUnit>();
  static_cast<Unit&>(*number->unit) = std::move(unit);
  number->unit->written.assign(written);
  number->end = pos_;
  return true;
}

// `40 N*m` and `9.81 m/s^2`: a unit name, then without a blank `*`, `/` or a
// product sign and another unit name. It reads two ways (a value in N*m, or
// 40 N times a quantity named `m`), so it is an error that shows both.
// `2 kg*g_n` (no unit name after the sign) and `40 N * m` (blanks: a
// product, as fmt writes it) are not.
bool ExprParser::rejectCompoundAfterUnit(const Expr* number, uint32_t begin, std::string_view unit) {
  std::string compound(unit), spaced(unit);
  std::vector<std::string> names;
  uint32_t p = pos_;
  for (;;) {
    uint32_t q = p;
    char op = 0;
    if (q < end_ && (src_[q] == '*' || src_[q] == '/')) {
      op = src_[q];
      q += 1;
      if (q < end_ && src_[q] == '*') break;  // `**`: reported elsewhere
    } else if (src_.substr(q, 2) == "·") {
      op = '*';
      q += 2;
    } else if (src_.substr(q, 3) == "⋅") {
      op = '*';
      q += 3;
    } else {
      break;
    }
    if (!isNameStart(q)) break;
    const uint32_t name_end = scanName(q);
    const std::string name(src_.substr(q, name_end - q));
    if (!findUnit(name)) break;
    q = name_end;
    // A whole-number power of this unit name: `s^2`, `s^-2`.
    std::string power;
    if (q + 1 < end_ && src_[q] == '^') {
      uint32_t r = q + 1;
      if (r < end_ && src_[r] == '-') ++r;
      const uint32_t digits = r;
      while (r < end_ && isDigit(src_[r])) ++r;
      if (r > digits && !(r < end_ && (src_[r] == '.' || isAsciiLetter(src_[r])))) {
        power.assign(src_.substr(q, r - q));
        q = r;
      }
    }
    compound += std::string(1, op) + name + power;
    spaced += std::string(" ") + op + " " + name + power;
    names.push_back(name);
    p = q;
  }
  if (names.empty()) return true;
  Unit u;
  UnitError err;
  if (!parseUnit(compound, &u, &err)) return true;  // no unit either way: the names decide
  std::string who;
  for (size_t k = 0; k < names.size(); ++k)
    who += (k == 0 ? "" : k + 1 == names.size() ? " and " : ", ") + ("`" + names[k] + "`");
  const std::string n = number->text;
  fail(begin, p, "`" + n + " " + compound + "` can be read two ways: write `" + n + " [" + compound +
                     "]` for a value in " + compound + " (a compound unit goes in brackets), or `" + n + " " +
                     spaced + "` if " + who + (names.size() == 1 ? " is a quantity" : " are quantities"));
  return false;
}

ExprPtr ExprParser::parseNameOrCall() {
  const uint32_t begin = pos_;
  const uint32_t name_end = scanName(pos_);
  auto e = std::make_unique<Expr>();
  e->begin = begin;
  const std::string_view name = src_.substr(begin, name_end - begin);
  e->text.assign(name);
  pos_ = name_end;
  if (name == "pi" && !(pos_ < end_ && src_[pos_] == '(')) {
    e->kind = ExprKind::Pi;
    e->end = pos_;
    return e;
  }
  uint32_t p = pos_;
  while (p < end_ && (src_[p] == ' ' || src_[p] == '\t')) ++p;
  if (p < end_ && src_[p] == '(') {
    e->kind = ExprKind::Call;
    pos_ = p + 1;
    if (++depth_ > kMaxDepth) {
      fail(begin, pos_, "the formula nests too deeply (more than 128 levels)");
      return nullptr;
    }
    if (peek() != ')') {
      for (;;) {
        ExprPtr arg = parseSum();
        if (!arg) return nullptr;
        e->args.push_back(std::move(arg));
        if (peek() == ',') {
          ++pos_;
          continue;
        }
        break;
      }
    }
    --depth_;
    if (peek() != ')') {
      if (atEnd()) fail(p, p + 1, "this `(` of the call to `" + e->text + "` is never closed");
      else failUnexpected();
      return nullptr;
    }
    ++pos_;
    e->end = pos_;
    return e;
  }
  e->kind = ExprKind::Name;
  e->end = pos_;
  return e;
}

}  // namespace calctrail
