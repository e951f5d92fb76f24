#include "engine/units/unit_parser.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <cstdlib>

#include "engine/units/unit_table.h"
#include "engine/util/edit_distance.h"
#include "engine/util/utf8.h"

namespace calctrail {

namespace {

constexpr int kMaxPower = 12;     // written powers beyond this are typing slips
constexpr int kMaxExponent = 60;  // per base after combining; keeps int8 safe
constexpr int kMaxDepth = 32;     // parentheses

using Exponents = std::array<int, Dimension::kBases>;

// A parsed part of a unit expression.
struct Term {
  double factor = 1.0;
  Exponents exps{};
  std::string text;     // canonical ASCII spelling
  bool simple = false;  // a bare name: a power needs no parentheses
  bool binary = false;  // a product or quotient at its top level
  bool one = false;     // the number 1, as in 1/in
};

struct CodePoint {
  char32_t cp = 0;
  size_t len = 0;  // 0: not valid UTF-8
};

CodePoint decode(std::string_view s, size_t i) {
  const Utf8Char c = readUtf8(s, i);
  return c.valid ? CodePoint{c.cp, c.length} : CodePoint{};
}

std::string hexCode(char32_t cp) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "U+%04X", static_cast<unsigned>(cp));
  return buf;
}

bool isAsciiLetter(char c) { return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'); }
bool isDigit(char c) { return c >= '0' && c <= '9'; }

// Non-ASCII characters that appear in unit spellings: micro sign, Greek mu,
// degree sign, the Celsius and Fahrenheit signs, and Delta of ddegC's symbol.
bool isUnicodeNameChar(char32_t cp) {
  return cp == 0x00B5 || cp == 0x03BC || cp == 0x00B0 || cp == 0x2103 || cp == 0x2109 ||
         cp == 0x0394;
}

// No-break spaces come with text pasted from typeset documents.
bool isSpaceChar(char32_t cp) {
  return cp == ' ' || cp == '\t' || cp == 0x00A0 || cp == 0x202F;
}

bool isProductSign(char32_t cp) { return cp == 0x00B7 || cp == 0x22C5; }

// Hyphen, minus sign, hyphen-minus look-alikes and the en dash.
bool isDash(char32_t cp) { return cp == '-' || cp == 0x2212 || cp == 0x2010 || cp == 0x2013; }

int superscriptDigit(char32_t cp) {
  if (cp == 0x2070) return 0;
  if (cp == 0x00B9) return 1;
  if (cp == 0x00B2) return 2;
  if (cp == 0x00B3) return 3;
  if (cp >= 0x2074 && cp <= 0x2079) return static_cast<int>(cp - 0x2070);
  return -1;
}
bool isSuperscript(char32_t cp) {
  return superscriptDigit(cp) >= 0 || cp == 0x207B || cp == 0x207A;
}

// Letters of other scripts that look like ASCII ones: a unit typed with one
// of them would otherwise read as an unknown unit nobody can see is wrong.
char lookAlike(char32_t cp) {
  struct Pair {
    char32_t cp;
    char ascii;
  };
  static constexpr Pair kPairs[] = {
      // Cyrillic
      {0x0430, 'a'}, {0x0432, 'B'}, {0x0435, 'e'}, {0x043A, 'k'}, {0x043C, 'm'},
      {0x043D, 'H'}, {0x043E, 'o'}, {0x0440, 'p'}, {0x0441, 'c'}, {0x0442, 't'},
      {0x0443, 'y'}, {0x0445, 'x'}, {0x0455, 's'}, {0x0456, 'i'}, {0x0458, 'j'},
      {0x04BB, 'h'}, {0x0405, 'S'}, {0x0406, 'I'}, {0x0408, 'J'}, {0x0410, 'A'},
      {0x0412, 'B'}, {0x0415, 'E'}, {0x041A, 'K'}, {0x041C, 'M'}, {0x041D, 'H'},
      {0x041E, 'O'}, {0x0420, 'P'}, {0x0421, 'C'}, {0x0422, 'T'}, {0x0425, 'X'},
      // Greek (not mu: that one is accepted as the micro prefix)
      {0x0391, 'A'}, {0x0392, 'B'}, {0x0395, 'E'}, {0x0396, 'Z'}, {0x0397, 'H'},
      {0x0399, 'I'}, {0x039A, 'K'}, {0x039C, 'M'}, {0x039D, 'N'}, {0x039F, 'O'},
      {0x03A1, 'P'}, {0x03A4, 'T'}, {0x03A5, 'Y'}, {0x03A7, 'X'}, {0x03B9, 'i'},
      {0x03BA, 'k'}, {0x03BD, 'v'}, {0x03BF, 'o'},
      // Letterlike symbols
      {0x212A, 'K'},
  };
  for (const Pair& p : kPairs)
    if (p.cp == cp) return p.ascii;
  if (cp >= 0xFF01 && cp <= 0xFF5E) return static_cast<char>(cp - 0xFEE0);  // fullwidth
  return 0;
}

std::string script(char32_t cp) {
  if (cp >= 0x0400 && cp <= 0x04FF) return "a Cyrillic letter";
  if (cp >= 0x0370 && cp <= 0x03FF) return "a Greek letter";
  if (cp >= 0xFF01 && cp <= 0xFF5E) return "a fullwidth character";
  return "a look-alike character";
}

class Parser {
 public:
  Parser(std::string_view text, UnitError* err, std::string_view after_number)
      : s_(text), err_(err), after_number_(after_number) {}

  bool run(Unit* out) {
    begin_ = 0;
    end_ = s_.size();
    trim();
    if (begin_ == end_) return fail(0, emptyMessage());
    if (s_[begin_] == '[') {
      if (s_[end_ - 1] != ']' || end_ - begin_ < 2)
        return fail(begin_, "`[` has no matching `]`");
      ++begin_;
      --end_;
      trim();
      if (begin_ == end_) return fail(begin_, emptyMessage());
    }
    pos_ = begin_;
    Term t;
    if (!expression(&t)) return false;
    if (pos_ < end_) {
      if (s_[pos_] == ')') return fail(pos_, "`)` has no matching `(`");
      return unexpected(pos_);
    }
    if (!std::isfinite(t.factor) || t.factor <= 0.0)
      return fail(begin_, "the unit `" + t.text + "` is too large or too small for a number");
    out->factor = t.factor;
    out->offset = offset_;
    out->dim = Dimension::exponents(t.exps[0], t.exps[1], t.exps[2], t.exps[3], t.exps[4],
                                    t.exps[5], t.exps[6], t.exps[7]);
    out->text = t.text;
    return true;
  }

 private:
  static std::string emptyMessage() {
    return "empty unit; write a unit such as `mm` or `N*m`, or `1` for a dimensionless "
           "quantity";
  }

  bool fail(size_t offset, std::string message) {
    err_->offset = offset;
    err_->message = std::move(message);
    return false;
  }

  CodePoint at(size_t i) const { return i < end_ ? decode(s_, i) : CodePoint{}; }

  bool isSpace(size_t i) const { return isSpaceChar(at(i).cp); }

  void trim() {
    while (begin_ < end_ && isSpace(begin_)) begin_ += at(begin_).len;
    while (end_ > begin_) {
      size_t k = end_ - 1;  // back to the first byte of the last character
      while (k > begin_ && (static_cast<unsigned char>(s_[k]) & 0xC0) == 0x80) --k;
      const CodePoint c = decode(s_, k);
      if (k + c.len != end_ || !isSpaceChar(c.cp)) break;
      end_ = k;
    }
  }

  void skipSpaces() {
    while (pos_ < end_ && isSpace(pos_)) pos_ += at(pos_).len;
  }

  bool isNameStart(size_t i) const {
    if (i >= end_) return false;
    if (isAsciiLetter(s_[i]) || s_[i] == '%') return true;
    const CodePoint c = at(i);
    return c.len > 1 && isUnicodeNameChar(c.cp);
  }

  bool checkBounds(const Term& t, size_t offset) {
    for (int e : t.exps)
      if (e > kMaxExponent || e < -kMaxExponent)
        return fail(offset, "the powers in this unit are too large");
    return true;
  }

  // expression := term (('*' | '·' | '⋅' | '/') term)*, left to right.
  bool expression(Term* out) {
    if (!term(true, out)) return false;
    for (;;) {
      skipSpaces();
      if (pos_ >= end_ || s_[pos_] == ')') return true;
      const size_t op_pos = pos_;
      const CodePoint c = at(pos_);
      char op;
      if (c.cp == '*' || isProductSign(c.cp)) {
        op = '*';
      } else if (c.cp == '/') {
        op = '/';
      } else {
        return misplaced(pos_);
      }
      const std::string op_text(s_.substr(op_pos, c.len));
      pos_ += c.len;
      skipSpaces();
      if (pos_ >= end_ || s_[pos_] == ')' || s_[pos_] == '*' || s_[pos_] == '/' ||
          isProductSign(at(pos_).cp))
        return fail(op_pos, "nothing after `" + op_text + "`; write a unit after it");
      Term rhs;
      if (!term(false, &rhs)) return false;
      combine(out, op, rhs);
      if (!checkBounds(*out, op_pos)) return false;
    }
  }

  static void combine(Term* lhs, char op, const Term& rhs) {
    for (int i = 0; i < Dimension::kBases; ++i)
      lhs->exps[i] += op == '*' ? rhs.exps[i] : -rhs.exps[i];
    lhs->factor = op == '*' ? lhs->factor * rhs.factor : lhs->factor / rhs.factor;
    if (rhs.one) return;  // a*(1) and a/(1) are a
    if (op == '*' && lhs->one) {
      lhs->text = rhs.text;
      lhs->binary = rhs.binary;
      lhs->simple = rhs.simple;
    } else if (op == '*') {
      // (a*b)*c, a*(b/c) and a*(1/b) = a/b read the same without parentheses.
      const bool reciprocal = rhs.text.compare(0, 2, "1/") == 0;
      lhs->text += reciprocal ? rhs.text.substr(1) : "*" + rhs.text;
      lhs->binary = true;
      lhs->simple = false;
    } else {
      lhs->text += "/" + (rhs.binary ? "(" + rhs.text + ")" : rhs.text);
      lhs->binary = true;
      lhs->simple = false;
    }
    lhs->one = false;
  }

  // What follows a complete term when it is not an operator.
  bool misplaced(size_t i) {
    const CodePoint c = at(i);
    const std::string last(s_.substr(last_start_, last_end_ - last_start_));
    if (c.len > 0 && isDash(c.cp)) {
      size_t j = i + c.len;
      if (j < end_ && isDigit(s_[j])) {
        size_t k = j;
        while (k < end_ && isDigit(s_[k])) ++k;
        return fail(i, "write a negative power with `^`: `" + last + "^-" +
                           std::string(s_.substr(j, k - j)) + "`");
      }
      size_t k = j;
      while (k < end_ && isAsciiLetter(s_[k])) ++k;
      std::string fix = k > j ? "`" + last + "*" + std::string(s_.substr(j, k - j)) + "`"
                              : "`*`";
      return fail(i, "a dash is not a product in a unit; write " + fix);
    }
    if (c.cp == 0x00D7)
      return fail(i, "`\u00D7` is not a product sign here; write `*` or `\u00B7`");
    if (c.cp == '^') return fail(i, "a unit takes one power; use parentheses, as in `(m^2)^3`");
    if (isNameStart(i)) {
      size_t k = i;
      while (k < end_ && isAsciiLetter(s_[k])) ++k;
      const std::string next = k > i ? std::string(s_.substr(i, k - i)) : "...";
      return fail(i, "two units side by side; write `" + last + "*" + next +
                         "` for a product");
    }
    if (isDigit(s_[i])) return fail(i, "a number after a unit; write a power as `" + last +
                                           "^" + std::string(1, s_[i]) + "`");
    return unexpected(i);
  }

  // term := primary [power]
  bool term(bool first, Term* out) {
    skipSpaces();
    const size_t start = pos_;
    if (!primary(first, out)) return false;
    last_start_ = start;
    last_end_ = pos_;
    const std::string base(s_.substr(start, pos_ - start));
    skipSpaces();
    if (pos_ + 1 < end_ && s_[pos_] == '*' && s_[pos_ + 1] == '*') {
      size_t j = pos_ + 2;
      while (j < end_ && isSpace(j)) ++j;
      size_t k = j;
      if (k < end_ && (s_[k] == '-' || s_[k] == '+')) ++k;
      while (k < end_ && isDigit(s_[k])) ++k;
      const std::string n(s_.substr(j, k - j));
      return fail(pos_, "`**` is not a power here; write `" + base + "^" +
                            (n.empty() || n == "-" || n == "+" ? "2" : n) + "`");
    }
    const size_t power_pos = pos_;
    int n = 0;
    bool has_power = false;
    if (!power(&n, &has_power)) return false;
    if (!has_power) {
      pos_ = last_end_;  // leave the spaces for the caller
      return true;
    }
    if (out->one) return fail(power_pos, "`1` takes no power");
    if (n == 0) return fail(power_pos, "a power of 0 leaves no unit; leave the unit out");
    if (n > kMaxPower || n < -kMaxPower)
      return fail(power_pos, "a power beyond " + std::to_string(kMaxPower) +
                                 " is not a unit anyone means");
    double f = 1.0;
    for (int k = 0; k < std::abs(n); ++k) f *= out->factor;
    out->factor = n > 0 ? f : 1.0 / f;
    for (int& e : out->exps) e *= n;
    out->text = (out->simple ? out->text : "(" + out->text + ")") + "^" + std::to_string(n);
    out->simple = false;
    out->binary = false;
    last_end_ = pos_;
    return checkBounds(*out, power_pos);
  }

  // power := '^' ['('] [sign] digits [')'] | superscripts. U+2212 is a minus.
  bool power(int* n, bool* has) {
    const CodePoint c = at(pos_);
    if (c.cp == '^') {
      const size_t caret = pos_;
      ++pos_;
      skipSpaces();
      const bool paren = pos_ < end_ && s_[pos_] == '(';
      if (paren) {
        ++pos_;
        skipSpaces();
      }
      int sign = 1;
      const CodePoint sc = at(pos_);
      if (sc.cp == '-' || sc.cp == 0x2212) {
        sign = -1;
        pos_ += sc.len;
      } else if (sc.cp == '+') {
        ++pos_;
      }
      const size_t digits = pos_;
      int value = 0;
      while (pos_ < end_ && isDigit(s_[pos_])) {
        if (value < 1000) value = value * 10 + (s_[pos_] - '0');
        ++pos_;
      }
      if (pos_ == digits) {
        if (pos_ < end_ && isSuperscript(at(pos_).cp))
          return fail(caret, "write a power either as `^2` or as `\u00B2`, not both");
        return fail(caret, "expected a whole number after `^`");
      }
      if (pos_ < end_ && (s_[pos_] == '.' || s_[pos_] == ',' || (paren && s_[pos_] == '/')))
        return fail(caret, "a power in a unit must be a whole number");
      if (paren) {
        skipSpaces();
        if (pos_ >= end_ || s_[pos_] != ')') return fail(caret, "`^(` has no matching `)`");
        ++pos_;
      }
      *n = sign * value;
      *has = true;
      return true;
    }
    if (c.len > 1 && isSuperscript(c.cp)) {
      const size_t start = pos_;
      int sign = 1;
      if (c.cp == 0x207B) {
        sign = -1;
        pos_ += c.len;
      } else if (c.cp == 0x207A) {
        pos_ += c.len;
      }
      int value = 0;
      bool any = false;
      for (CodePoint d = at(pos_); d.len > 0 && superscriptDigit(d.cp) >= 0; d = at(pos_)) {
        if (value < 1000) value = value * 10 + superscriptDigit(d.cp);
        any = true;
        pos_ += d.len;
      }
      if (!any) return fail(start, "a superscript sign needs superscript digits after it");
      *n = sign * value;
      *has = true;
      return true;
    }
    return true;
  }

  // primary := name | '1' | '(' expression ')'
  bool primary(bool first, Term* out) {
    if (pos_ >= end_) return fail(pos_, "expected a unit");
    const char c = s_[pos_];
    if (c == '(') {
      const size_t open = pos_;
      if (++depth_ > kMaxDepth) return fail(open, "too many nested parentheses");
      ++pos_;
      skipSpaces();
      if (pos_ < end_ && s_[pos_] == ')') return fail(open, "empty parentheses");
      if (pos_ >= end_) return fail(open, "`(` has no matching `)`");
      if (!expression(out)) return false;
      skipSpaces();
      if (pos_ >= end_ || s_[pos_] != ')') return fail(open, "`(` has no matching `)`");
      ++pos_;
      --depth_;
      return true;
    }
    if (isDigit(c) || c == '.') {
      const size_t start = pos_;
      while (pos_ < end_ && (isDigit(s_[pos_]) || s_[pos_] == '.')) ++pos_;
      if (first && s_.substr(start, pos_ - start) == "1") {
        out->one = true;
        out->text = "1";
        return true;
      }
      return fail(start, "a number is not a unit; the only number a unit may hold is `1`, "
                         "as in `1/in`");
    }
    if (isNameStart(pos_)) return name(out);
    if (c == ')') return fail(pos_, "`)` has no matching `(`");
    const CodePoint cp = at(pos_);
    if (c == '*' || c == '/' || c == '^' || isProductSign(cp.cp))
      return fail(pos_, "`" + std::string(s_.substr(pos_, cp.len)) + "` has no unit before it");
    if (cp.len > 1 && isSuperscript(cp.cp))
      return fail(pos_, "a superscript power needs a unit before it");
    return unexpected(pos_);
  }

  bool name(Term* out) {
    const size_t start = pos_;
    if (s_[pos_] == '%') {
      ++pos_;
    } else {
      while (pos_ < end_) {
        if (isAsciiLetter(s_[pos_])) {
          ++pos_;
          continue;
        }
        const CodePoint c = at(pos_);
        if (c.len > 1 && isUnicodeNameChar(c.cp)) {
          pos_ += c.len;
          continue;
        }
        break;
      }
    }
    // A look-alike letter inside or right after the name is the real problem.
    const CodePoint next = at(pos_);
    if (next.len > 1 && lookAlike(next.cp)) return unexpected(pos_);
    const std::string word(s_.substr(start, pos_ - start));
    const UnitDef* def = findUnit(word);
    if (!def) return fail(start, unknownMessage(word));
    if (def->offset != 0.0 && (start != begin_ || pos_ != end_))
      return fail(start, offsetMessage(*def, start, pos_));
    if (pos_ < end_ && isDigit(s_[pos_]))
      return fail(pos_, "write a power with `^`: `" + word + "^" + std::string(1, s_[pos_]) +
                            "`");
    offset_ = def->offset;
    out->factor = def->factor;
    for (int i = 0; i < Dimension::kBases; ++i)
      out->exps[i] = def->dim.exponent(static_cast<Base>(i));
    out->text = def->name;
    out->simple = true;
    return true;
  }

  // A suggested unit as the user would type it here: inside brackets as is,
  // after a number as the whole literal, a compound one in brackets.
  std::string asWritten(const std::string& unit) const {
    if (after_number_.empty()) return unit;
    const bool bare = std::all_of(unit.begin(), unit.end(), [](char c) {
      return isAsciiLetter(c) || c == '_' || c == '%' || static_cast<unsigned char>(c) >= 0x80;
    });
    return std::string(after_number_) + (bare ? " " + unit : " [" + unit + "]");
  }

  std::string unknownMessage(const std::string& word) const {
    std::string msg = "unknown unit `" + word + "`";
    // Two units run together ("Nm") is the likeliest reading of all, so it
    // comes first, except after a plural ("lbs" is pounds, not lb*s).
    const bool plural = word.size() > 2 && word.back() == 's' && findUnit(word.substr(0, word.size() - 1));
    std::vector<std::string> near = plural ? std::vector<std::string>() : runTogetherUnits(word);
    for (const std::string& s : suggestUnits(word))
      if (std::find(near.begin(), near.end(), s) == near.end()) near.push_back(s);
    if (near.size() > 3) near.resize(3);
    for (std::string& s : near) s = asWritten(s);
    if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
    // A prefix on a known unit: the table lists its prefixed units one by one.
    static const char* const kPrefixes[] = {"k", "M", "G", "m", "c", "u", "\u00B5", "\u03BC"};
    for (const char* p : kPrefixes) {
      const std::string prefix = p;
      if (word.size() > prefix.size() && word.compare(0, prefix.size(), prefix) == 0 &&
          findUnit(word.substr(prefix.size()))) {
        return msg + " (`" + prefix + "` + `" + word.substr(prefix.size()) +
               "` is not a prefixed unit calctrail knows; `calctrail units` lists them)";
      }
    }
    if (near.empty()) msg += "; `calctrail units` lists the known units";
    return msg;
  }

  std::string offsetMessage(const UnitDef& def, size_t start, size_t stop) const {
    const std::string whole(s_.substr(begin_, end_ - begin_));
    const size_t at_name = start - begin_;
    const size_t len = stop - start;
    const auto replaced = [&](const std::string& by) {
      return std::string(whole).replace(at_name, len, by);
    };
    std::vector<std::string> fixes = {replaced("d" + std::string(def.name))};
    if (def.factor == 1.0) fixes.push_back(replaced("K"));  // degC differences are kelvins
    return "`" + std::string(s_.substr(start, len)) +
           "` is an absolute temperature with an offset, so it can only stand alone, not in "
           "a compound unit or with a power; for a temperature difference write " +
           quotedList(fixes);
  }

  bool unexpected(size_t i) {
    const CodePoint c = decode(s_, i);
    if (c.len == 0) {
      char buf[8];
      std::snprintf(buf, sizeof buf, "0x%02X", static_cast<unsigned>(
                                                   static_cast<unsigned char>(s_[i])));
      return fail(i, std::string("invalid UTF-8 (byte ") + buf + ") in a unit");
    }
    const std::string shown(s_.substr(i, c.len));
    if (c.cp < 0x20 || c.cp == 0x7F)
      return fail(i, "unexpected control character " + hexCode(c.cp) + " in a unit");
    if (const char ascii = lookAlike(c.cp)) {
      return fail(i, "`" + shown + "` (" + hexCode(c.cp) + ", " + script(c.cp) +
                         ") looks like `" + std::string(1, ascii) +
                         "` but is not that ASCII character; retype it");
    }
    if (c.len == 1) return fail(i, "unexpected `" + shown + "` in a unit");
    return fail(i, "unexpected character `" + shown + "` (" + hexCode(c.cp) + ") in a unit");
  }

  std::string_view s_;
  UnitError* err_;
  std::string_view after_number_;  // the number a bare unit follows, "" inside brackets
  size_t begin_ = 0;
  size_t end_ = 0;
  size_t pos_ = 0;
  size_t last_start_ = 0;  // source of the last term, for suggested fixes
  size_t last_end_ = 0;
  int depth_ = 0;
  double offset_ = 0.0;
};

}  // namespace

namespace {

// The table's unit when `text` is one of its names in ASCII letters alone, or
// `%`: most units written ("mm", "kN", "rpm"). Its Unit is the table's row, as
// the parser below would make it, without parsing an expression; anything
// else (and every error) goes through the parser.
const UnitDef* plainUnitName(std::string_view text) {
  if (text.empty() || !(text == "%" || std::all_of(text.begin(), text.end(), isAsciiLetter))) return nullptr;
  const UnitDef* def = findUnit(text);
  return def && std::isfinite(def->factor) && def->factor > 0.0 ? def : nullptr;
}

}  // namespace

bool parseUnit(std::string_view text, Unit* out, UnitError* err, std::string_view after_number) {
  if (const UnitDef* def = plainUnitName(text)) {
    out->factor = def->factor;
    out->offset = def->offset;
    out->dim = def->dim;
    out->text = def->name;
    return true;
  }
  Parser parser(text, err, after_number);
  return parser.run(out);
}

std::vector<std::string> runTogetherUnits(std::string_view word) {
  std::vector<std::string> out;
  const auto known = [](std::string_view part) { return findUnit(part) != nullptr; };
  // "mN" is a millinewton typed, not a metre times a newton.
  const auto loneprefix = [&](size_t i) {
    return i == 1 && std::string_view("kMGmcu").find(word[0]) != std::string_view::npos;
  };
  if (findUnit(word)) return out;
  for (size_t i = 1; i < word.size(); ++i)
    if (!loneprefix(i) && known(word.substr(0, i)) && known(word.substr(i)))
      out.push_back(std::string(word.substr(0, i)) + "*" + std::string(word.substr(i)));
  const bool two = !out.empty();
  for (size_t i = 1; !two && i + 1 < word.size(); ++i) {
    if (loneprefix(i) || !known(word.substr(0, i))) continue;
    for (size_t j = i + 1; j < word.size(); ++j)
      if (known(word.substr(i, j - i)) && known(word.substr(j)))
        out.push_back(std::string(word.substr(0, i)) + "*" + std::string(word.substr(i, j - i)) + "*" +
                      std::string(word.substr(j)));
  }
  return out;
}

}  // namespace calctrail
