#include "engine/sheet/sheet_parser.h"

#include <algorithm>
#include <unordered_map>

#include "engine/sheet/control_chars.h"
#include "engine/sheet/expr_parser.h"
#include "engine/sheet/name_lexer.h"
#include "engine/units/unit_parser.h"
#include "engine/util/edit_distance.h"
#include "engine/util/utf8.h"

namespace calctrail {

const std::vector<std::string>& Metadata::keys() {
  static const std::vector<std::string> k = {"title", "project", "calc", "revision",
                                             "prepared", "checked", "date", "units"};
  return k;
}

std::string Metadata::get(const std::string& key) const {
  auto it = values.find(key);
  return it == values.end() ? std::string() : it->second;
}

const char* comparisonText(Comparison c) {
  switch (c) {
    case Comparison::Less: return "<";
    case Comparison::LessEqual: return "<=";
    case Comparison::Greater: return ">";
    case Comparison::GreaterEqual: return ">=";
  }
  return "?";
}

namespace {

bool isSpace(char c) { return c == ' ' || c == '\t'; }

std::string trim(std::string_view s) {
  size_t b = 0, e = s.size();
  while (b < e && isSpace(s[b])) ++b;
  while (e > b && isSpace(s[e - 1])) --e;
  return std::string(s.substr(b, e - b));
}

class LineParser {
 public:
  LineParser(Sheet* sheet, Diagnostics* diags) : sheet_(sheet), file_(*sheet->file), diags_(diags) {}

  void parseLine(int line) {
    Statement st;
    st.line = line;
    st.kind = parseStatement(line, &st) ? st.kind : Statement::Invalid;
    sheet_->statements.push_back(std::move(st));
  }

 private:
  // Name at `at` (engine/sheet/name_lexer.h); `at` when none starts there.
  uint32_t scanName(uint32_t at, uint32_t end) const {
    return static_cast<uint32_t>(nameEnd(std::string_view(file_.bytes()).substr(0, end), at));
  }

  uint32_t skipSpace(uint32_t p, uint32_t end) const {
    while (p < end && isSpace(file_.bytes()[p])) ++p;
    return p;
  }

  bool parseStatement(int line, Statement* st) {
    const std::string& s = file_.bytes();
    const std::string_view text = file_.lineText(line);
    uint32_t begin = file_.lineStart(line);
    const uint32_t end = begin + static_cast<uint32_t>(text.size());
    // Most lines are printable ASCII alone, with nothing in them to reject: one scan says so.
    const bool plain = printableAsciiPrefix(text) == text.size();
    const size_t bad = plain ? std::string_view::npos : findInvalidUtf8(text);
    if (bad != std::string_view::npos) {
      char hex[8];
      std::snprintf(hex, sizeof hex, "0x%02X", static_cast<unsigned char>(text[bad]));
      diags_->error(file_, begin + static_cast<uint32_t>(bad), begin + static_cast<uint32_t>(bad) + 1,
                    std::string("byte ") + hex + " is not UTF-8; save the worksheet as UTF-8");
      return false;
    }
    if (!rejectControlChars(line, begin, text, plain)) return false;
    if (line == 1 && text.rfind("\xEF\xBB\xBF", 0) == 0) begin += 3;  // byte-order mark
    uint32_t p = skipSpace(begin, end);
    if (p == end) {
      st->kind = Statement::Blank;
      return true;
    }
    if (s[p] == '#') {
      st->kind = Statement::Comment;
      st->words = std::make_shared<const StatementText>(
          StatementText{trim(std::string_view(s).substr(p + 1, end - p - 1)), std::string()});
      return true;
    }
    const uint32_t word_end = scanName(p, end);
    if (word_end == p) {
      reportBadStart(p, end);
      return false;
    }
    // A view, so that telling the statement words apart copies nothing.
    const std::string_view word = std::string_view(s).substr(p, word_end - p);
    const uint32_t next = skipSpace(word_end, end);
    const char nc = next < end ? s[next] : '\0';
    const bool definition_follows = nc == '=' || nc == '[';
    if (word == "check" && !definition_follows && nc != ':') return parseCheck(st, line, next, end);
    if (word == "case" && !definition_follows) return parseCase(st, line, p, next, end);
    if (word == "study" && !definition_follows && nc != ':') return parseStudy(st, line, p, next, end);
    const bool statement_word = !definition_follows && nc != ':';
    if (word == "param" && statement_word) return parseParam(st, line, p, word_end, next, end);
    if (word == "use" && statement_word) return parseUse(st, line, p, word_end, next, end);
    if ((word == "section" || word == "note") && !definition_follows && nc != ':') {
      st->kind = word == "section" ? Statement::Section : Statement::Note;
      st->words = std::make_shared<const StatementText>(
          StatementText{trim(std::string_view(s).substr(next, end - next)), std::string()});
      if (st->kind == Statement::Section) {
        if (st->text().empty()) {
          diags_->error(file_, p, word_end, "a section needs a title: `section Loads and speeds`");
          return false;
        }
        section_ = st->text();
      }
      return true;
    }
    if (nc == ':') return parseMeta(st, std::string(word), p, word_end, next, end);
    if (definition_follows) return parseDefinition(st, line, word, p, word_end, next, end);
    if (next == end) {
      const std::string w(word);
      diags_->error(file_, p, word_end, "`" + w + "` alone is not a statement; define a quantity with `" + w + " = ...`");
    } else {
      diags_->error(file_, next, next + 1, "expected `=` after the name `" + std::string(word) + "` (or `[unit] =`)");
    }
    return false;
  }

  // A control character anywhere in the line, or a CR just before the end of
  // the file, which SourceFile takes as part of a line end but only CRLF is one.
  // `plain`: the line is printable ASCII alone.
  bool rejectControlChars(int line, uint32_t begin, std::string_view text, bool plain) {
    const std::string& s = file_.bytes();
    size_t length = 0;
    size_t at = plain ? std::string_view::npos : findControlChar(text, &length);
    if (at == std::string_view::npos) {
      const size_t after = begin + text.size();
      if (after + 1 != s.size() || s[after] != '\r' || line != file_.lineCount()) return true;
      at = text.size();
      length = 1;
    }
    const uint32_t b = begin + static_cast<uint32_t>(at);
    diags_->error(file_, b, b + static_cast<uint32_t>(length), controlCharMessage(s, b));
    return false;
  }

  void reportBadStart(uint32_t p, uint32_t end) {
    const std::string& s = file_.bytes();
    if (static_cast<unsigned char>(s[p]) >= 0x80) {
      size_t n;
      const char32_t cp = decodeUtf8(std::string_view(s).substr(0, end), p, &n);
      std::string msg = "a line starts with a name, `check`, `section`, `note`, a metadata key or `#`; found " +
                        encodeUtf8(cp) + " (" + describeCodePoint(cp) + ")";
      if (const char a = asciiLookAlike(cp)) msg += std::string(", which looks like `") + a + "` but is not ASCII";
      diags_->error(file_, p, p + static_cast<uint32_t>(n), msg);
      return;
    }
    diags_->error(file_, p, p + 1,
                  "a line starts with a name, `check`, `section`, `note`, a metadata key or `#`; found `" +
                      std::string(1, s[p]) + "`");
  }

  // Splits off the description: the text after the first `#`.
  uint32_t splitDescription(uint32_t from, uint32_t end, std::string* description) const {
    const std::string& s = file_.bytes();
    const size_t hash = std::string_view(s).substr(0, end).find('#', from);
    if (hash == std::string::npos) return end;
    *description = trim(std::string_view(s).substr(hash + 1, end - hash - 1));
    return static_cast<uint32_t>(hash);
  }

  bool parseMeta(Statement* st, const std::string& key, uint32_t p, uint32_t word_end, uint32_t colon,
                 uint32_t end) {
    const auto& keys = Metadata::keys();
    if (std::find(keys.begin(), keys.end(), key) == keys.end()) {
      std::string msg = "`" + key + ":` is not a metadata key";
      auto near = nearestWords(key, keys);
      if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
      else msg += " (the keys are title, project, calc, revision, prepared, checked, date, units); a quantity is defined with `=`";
      diags_->error(file_, p, word_end, msg);
      return false;
    }
    if (sheet_->meta.values.count(key)) {
      diags_->error(file_, p, word_end, "`" + key + ":` is given twice");
      return false;
    }
    st->kind = Statement::Meta;
    st->words = std::make_shared<const StatementText>(
        StatementText{trim(std::string_view(file_.bytes()).substr(colon + 1, end - colon - 1)), key});
    if (key == "units") {
      const std::string_view raw = std::string_view(file_.bytes()).substr(colon + 1, end - colon - 1);
      std::string error;
      size_t at = 0;
      if (!UnitPreferences::parse(raw, &sheet_->units, &error, &at)) {
        const uint32_t pos = colon + 1 + static_cast<uint32_t>(at);
        diags_->error(file_, pos, std::max(pos + 1, end), error);
        return false;
      }
    }
    sheet_->meta.values[key] = st->text();
    return true;
  }

  // The display unit in [ ] at *at: fills q's unit members and moves *at past the `]` and blanks.
  bool parseDisplayUnit(Quantity* q, uint32_t* at, uint32_t body_end) {
    const std::string& s = file_.bytes();
    const size_t close = std::string_view(s).substr(0, body_end).find(']', *at);
    if (close == std::string::npos) {
      diags_->error(file_, *at, *at + 1, "this `[` is never closed: the display unit ends with `]`");
      return false;
    }
    q->unit_begin = *at + 1;
    q->unit_end = static_cast<uint32_t>(close);
    q->unit_written = s.substr(q->unit_begin, q->unit_end - q->unit_begin);
    // The same text is the same unit: parsed once per sheet, shared.
    auto known = display_units_.find(q->unit_written);
    if (known != display_units_.end()) {
      q->display = known->second;
      *at = skipSpace(static_cast<uint32_t>(close) + 1, body_end);
      return true;
    }
    Unit unit;
    UnitError err;
    if (!parseUnit(q->unit_written, &unit, &err)) {
      const uint32_t e = q->unit_begin + static_cast<uint32_t>(std::min(err.offset, q->unit_written.size()));
      diags_->error(file_, e, std::max(e + 1, q->unit_end), err.message);
      return false;
    }
    q->display = std::make_shared<const Unit>(std::move(unit));
    display_units_.emplace(q->unit_written, q->display);
    *at = skipSpace(static_cast<uint32_t>(close) + 1, body_end);
    return true;
  }

  bool parseDefinition(Statement* st, int line, std::string_view name, uint32_t p, uint32_t word_end,
                       uint32_t next, uint32_t end) {
    const std::string& s = file_.bytes();
    Quantity q;
    q.name = name;
    q.name_begin = p;
    q.name_end = word_end;
    q.line = line;
    q.section = section_;
    const uint32_t body_end = splitDescription(next, end, &q.description);
    uint32_t at = next;
    if (s[at] == '[') {
      if (!parseDisplayUnit(&q, &at, body_end)) return false;
      if (at >= body_end || s[at] != '=') {
        diags_->error(file_, at < body_end ? at : q.unit_end, (at < body_end ? at : q.unit_end) + 1,
                      "expected `=` after the display unit [" + q.unit_written + "]");
        return false;
      }
    }
    const uint32_t expr_begin = at + 1;
    if (skipSpace(expr_begin, body_end) == body_end) {
      diags_->error(file_, at, at + 1, "`" + q.name + " =` needs a formula or a value after `=`");
      return false;
    }
    if (name == "pi") {
      diags_->error(file_, p, word_end, "`pi` is the constant 3.14159...; choose another name");
      return false;
    }
    ExprParser parser(file_, expr_begin, body_end, diags_);
    q.expr = parser.parseWhole();
    if (!q.expr) return false;
    return addQuantity(st, std::move(q));
  }

  bool addQuantity(Statement* st, Quantity&& q) {  // moved once, into the sheet
    const int existing = sheet_->find(q.name);
    if (existing >= 0) {
      diags_->error(file_, q.name_begin, q.name_end,
                    "`" + q.name + "` is defined twice; the first definition is on line " +
                        std::to_string(sheet_->quantities[static_cast<size_t>(existing)].line));
      return false;
    }
    st->kind = Statement::Define;
    st->index = static_cast<int>(sheet_->quantities.size());
    sheet_->index.insert(q.name, st->index);
    sheet_->quantities.push_back(std::move(q));
    return true;
  }

  // `param NAME [UNIT]`, `param NAME [UNIT] = EXPR`, `param NAME = EXPR` (docs/format.md, Templates).
  bool parseParam(Statement* st, int line, uint32_t kw, uint32_t kw_end, uint32_t p, uint32_t end) {
    const std::string& s = file_.bytes();
    const uint32_t name_end = scanName(p, end);
    if (name_end == p || s[p] == '#') {
      diags_->error(file_, kw, kw_end, "a parameter needs a name: `param F [N]`, `param F [N] = 10 kN` or "
                                       "`param f = 0.1`");
      return false;
    }
    const std::string name = s.substr(p, name_end - p);
    const uint32_t next = skipSpace(name_end, end);
    std::string description;
    const uint32_t body_end = splitDescription(next, end, &description);
    const bool has_default =
        std::string_view(s).substr(next, body_end - next).find('=') != std::string_view::npos;
    if (has_default) {
      if (s[next] != '=' && s[next] != '[') {
        diags_->error(file_, next, next + 1, "expected `=` or `[unit]` after the parameter `" + name + "`");
        return false;
      }
      if (!parseDefinition(st, line, name, p, name_end, next, end)) return false;
      Quantity& q = sheet_->quantities.back();
      q.param = true;
      if (!q.display) {
        bool reads = false;
        forEachName(*q.expr, [&](const Expr&) { reads = true; });
        if (reads) {
          diags_->error(file_, q.expr->begin, q.expr->end,
                        "the parameter `" + name + "` takes its dimension from its default, which then "
                        "reads no quantity; declare its unit: `param " + name + " [UNIT] = ...`");
          return false;
        }
      }
      return true;
    }
    if (next == body_end || s[next] != '[') {
      diags_->error(file_, p, name_end, "the parameter `" + name + "` needs a unit or a default: `param " +
                                            name + " [N]`, `param " + name + " [N] = 10 kN` or `param " +
                                            name + " = 0.1`");
      return false;
    }
    Quantity q;
    q.name = name;
    q.name_begin = p;
    q.name_end = name_end;
    q.line = line;
    q.section = section_;
    q.description = std::move(description);
    q.param = true;
    q.required = true;
    uint32_t at = next;
    if (!parseDisplayUnit(&q, &at, body_end)) return false;
    if (at < body_end) {
      diags_->error(file_, at, at + 1, "expected `=` or the end of the line after `param " + name + " [" +
                                           q.unit_written + "]`");
      return false;
    }
    if (name == "pi") {
      diags_->error(file_, p, name_end, "`pi` is the constant 3.14159...; choose another name");
      return false;
    }
    return addQuantity(st, std::move(q));
  }

  // `use PATH as INSTANCE [with P1 = EXPR, P2 = EXPR]`; PATH may be in double quotes.
  bool parseUse(Statement* st, int line, uint32_t kw, uint32_t kw_end, uint32_t p, uint32_t end) {
    const std::string& s = file_.bytes();
    const std::string form = "`use templates/screw.calc as left` or `use \"my templates/screw.calc\" as "
                             "left with F = F_total / 2`";
    Use u;
    u.line = line;
    u.section = section_;
    u.path_begin = p;
    uint32_t at = p;
    if (at < end && s[at] == '"') {
      const size_t close = std::string_view(s).substr(0, end).find('"', at + 1);
      if (close == std::string::npos) {
        diags_->error(file_, at, at + 1, "this `\"` is never closed: a quoted path ends with `\"`");
        return false;
      }
      u.path = s.substr(at + 1, close - at - 1);
      at = static_cast<uint32_t>(close) + 1;
    } else {
      while (at < end && !isSpace(s[at]) && s[at] != '#') ++at;
      u.path = s.substr(p, at - p);
    }
    u.path_end = at;
    if (u.path.empty()) {
      diags_->error(file_, kw, kw_end, "`use` needs the path of a template: " + form);
      return false;
    }
    const uint32_t body_end = splitDescription(at, end, &u.description);
    at = skipSpace(at, body_end);
    const uint32_t as_end = scanName(at, body_end);
    if (s.compare(at, as_end - at, "as") != 0) {
      diags_->error(file_, at < body_end ? at : u.path_end - 1, (at < body_end ? at : u.path_end - 1) + 1,
                    "expected `as INSTANCE` after the path of the template: " + form);
      return false;
    }
    at = skipSpace(as_end, body_end);
    const uint32_t name_end = scanName(at, body_end);
    if (name_end == at) {
      diags_->error(file_, at < body_end ? at : as_end - 1, (at < body_end ? at : as_end - 1) + 1,
                    "`as` needs the name of the instance: " + form);
      return false;
    }
    u.instance = s.substr(at, name_end - at);
    u.instance_begin = at;
    u.instance_end = name_end;
    if (u.instance == "pi") {
      diags_->error(file_, at, name_end, "`pi` is the constant 3.14159...; choose another name");
      return false;
    }
    at = skipSpace(name_end, body_end);
    if (at < body_end) {
      const uint32_t with_end = scanName(at, body_end);
      if (s.compare(at, with_end - at, "with") != 0 || with_end == at) {
        diags_->error(file_, at, at + 1, "expected `with P = EXPR, ...` or the end of the line after `as " +
                                             u.instance + "`");
        return false;
      }
      if (!parseBindings(&u, with_end, body_end)) return false;
    }
    auto first = use_index_.find(u.instance);
    if (first != use_index_.end()) {
      diags_->error(file_, u.instance_begin, u.instance_end,
                    "the instance `" + u.instance + "` is used twice; the first is on line " +
                        std::to_string(sheet_->uses[first->second].line));
      return false;
    }
    st->kind = Statement::UseStmt;
    st->index = static_cast<int>(sheet_->uses.size());
    use_index_.emplace(u.instance, st->index);
    sheet_->uses.push_back(std::move(u));
    return true;
  }

  // `P1 = EXPR, P2 = EXPR` from `from` to `end`: split at the commas outside parentheses.
  bool parseBindings(Use* u, uint32_t from, uint32_t end) {
    const std::string& s = file_.bytes();
    uint32_t piece = from;
    bool ok = true;
    for (;;) {
      uint32_t q = piece;
      int depth = 0;
      while (q < end && !(depth == 0 && s[q] == ',')) {
        if (s[q] == '(') ++depth;
        if (s[q] == ')') --depth;
        ++q;
      }
      ok = parseBinding(u, piece, q) && ok;
      if (q >= end) break;
      piece = q + 1;
    }
    return ok;
  }

  bool parseBinding(Use* u, uint32_t b, uint32_t e) {
    const std::string& s = file_.bytes();
    const uint32_t p = skipSpace(b, e);
    const uint32_t name_end = scanName(p, e);
    if (name_end == p) {
      diags_->error(file_, p < e ? p : b, (p < e ? p : b) + 1,
                    "expected a parameter's name, as in `with F = F_total / 2, f = 0.1`");
      return false;
    }
    const uint32_t eq = skipSpace(name_end, e);
    if (eq >= e || s[eq] != '=') {
      diags_->error(file_, eq < e ? eq : name_end - 1, (eq < e ? eq : name_end - 1) + 1,
                    "expected `=` after the parameter `" + s.substr(p, name_end - p) + "`");
      return false;
    }
    if (skipSpace(eq + 1, e) == e) {
      diags_->error(file_, eq, eq + 1, "the parameter `" + s.substr(p, name_end - p) + "` needs a value");
      return false;
    }
    UseBinding bnd;
    bnd.param = s.substr(p, name_end - p);
    bnd.name_begin = p;
    bnd.name_end = name_end;
    for (const UseBinding& other : u->bindings) {
      if (other.param != bnd.param) continue;
      diags_->error(file_, p, name_end, "the parameter `" + bnd.param + "` is bound twice");
      return false;
    }
    ExprParser parser(file_, eq + 1, e, diags_);
    bnd.expr = parser.parseWhole();
    if (!bnd.expr) return false;
    u->bindings.push_back(std::move(bnd));
    return true;
  }

  bool parseCheck(Statement* st, int line, uint32_t p, uint32_t end) {
    const std::string& s = file_.bytes();
    Check c;
    c.line = line;
    c.section = section_;
    const uint32_t name_end = scanName(p, end);
    if (name_end == p) {
      diags_->error(file_, p, p + 1, "a check needs a name: `check self_locking: T_lower > 0 [N*m]`");
      return false;
    }
    c.name = s.substr(p, name_end - p);
    c.name_begin = p;
    c.name_end = name_end;
    const uint32_t colon = skipSpace(name_end, end);
    if (colon >= end || s[colon] != ':') {
      diags_->error(file_, colon < end ? colon : name_end, (colon < end ? colon : name_end) + 1,
                    "expected `:` after the check name `" + c.name + "`");
      return false;
    }
    const uint32_t body_end = splitDescription(colon + 1, end, &c.description);
    if (skipSpace(colon + 1, body_end) == body_end) {
      diags_->error(file_, colon, colon + 1, "the check `" + c.name + "` needs a condition after `:`");
      return false;
    }
    ExprParser parser(file_, colon + 1, body_end, diags_);
    if (!parser.parseCondition(&c.lhs, &c.op, &c.op_begin, &c.rhs)) return false;
    auto first = check_index_.find(c.name);
    if (first != check_index_.end()) {
      diags_->error(file_, p, name_end,
                    "the check `" + c.name + "` is defined twice; the first is on line " +
                        std::to_string(sheet_->checks[first->second].line));
      return false;
    }
    st->kind = Statement::CheckStmt;
    st->index = static_cast<int>(sheet_->checks.size());
    check_index_.emplace(c.name, st->index);
    sheet_->checks.push_back(std::move(c));
    return true;
  }

  // A name as a case writes it: a name, or dotted names into an instance (`left.f`).
  uint32_t scanDottedName(uint32_t at, uint32_t end) const {
    uint32_t p = scanName(at, end);
    while (p > at && p + 1 < end && file_.bytes()[p] == '.') {
      const uint32_t next = scanName(p + 1, end);
      if (next == p + 1) break;
      p = next;
    }
    return p;
  }

  // The ends of the comma-separated parts of [from, end): commas inside
  // parentheses (`max(a, b)`) or brackets belong to their expression.
  std::vector<uint32_t> topLevelCommas(uint32_t from, uint32_t end) const {
    const std::string& s = file_.bytes();
    std::vector<uint32_t> commas;
    int depth = 0;
    for (uint32_t p = from; p < end; ++p) {
      if (s[p] == '(' || s[p] == '[') ++depth;
      if ((s[p] == ')' || s[p] == ']') && depth > 0) --depth;
      if (s[p] == ',' && depth == 0) commas.push_back(p);
    }
    commas.push_back(end);
    return commas;
  }

  // `case NAME: Q1 = EXPR, Q2 = EXPR  # description`. Every part is parsed
  // and reported on its own, so one run shows every problem of the line.
  bool parseCase(Statement* st, int line, uint32_t keyword, uint32_t p, uint32_t end) {
    const std::string& s = file_.bytes();
    LoadCase c;
    c.line = line;
    const uint32_t name_end = scanName(p, end);
    if (name_end == p) {
      diags_->error(file_, p < end ? p : keyword, (p < end ? p : keyword) + 1,
                    "a load case needs a name: `case overload: F = 1.25 * F_rated`");
      return false;
    }
    c.name = s.substr(p, name_end - p);
    c.name_begin = p;
    c.name_end = name_end;
    const uint32_t colon = skipSpace(name_end, end);
    if (colon >= end || s[colon] != ':') {
      diags_->error(file_, colon < end ? colon : name_end, (colon < end ? colon : name_end) + 1,
                    "expected `:` after the case name `" + c.name + "`");
      return false;
    }
    bool ok = true;
    if (c.name == kNominalCase) {
      diags_->error(
          file_, p, name_end,
          "`nominal` is the worksheet as written, without replacements; give the case another name");
      ok = false;
    } else if (sheet_->findCase(c.name) >= 0) {
      diags_->error(file_, p, name_end,
                    "the case `" + c.name + "` is defined twice; the first is on line " +
                        std::to_string(sheet_->cases[sheet_->findCase(c.name)].line));
      ok = false;
    }
    const uint32_t body_end = splitDescription(colon + 1, end, &c.description);
    if (skipSpace(colon + 1, body_end) == body_end) {
      diags_->error(file_, colon, colon + 1,
                    "the case `" + c.name + "` needs replacements after `:`, as in `f = 0.2, F = 30 kN`");
      return false;
    }
    uint32_t from = colon + 1;
    for (uint32_t part_end : topLevelCommas(colon + 1, body_end)) {
      ok &= parseReplacement(&c, from, part_end);
      from = part_end + 1;
    }
    if (!ok) return false;
    st->kind = Statement::CaseStmt;
    st->index = static_cast<int>(sheet_->cases.size());
    sheet_->cases.push_back(std::move(c));
    return true;
  }

  // One `NAME = EXPR` of a case, in [from, end).
  bool parseReplacement(LoadCase* c, uint32_t from, uint32_t end) {
    const std::string& s = file_.bytes();
    const uint32_t p = skipSpace(from, end);
    const std::string in_case = " in the case `" + c->name + "`";
    if (p == end) {
      // At the comma that leaves the part empty.
      const uint32_t at = s[from - 1] == ',' ? from - 1 : end;
      diags_->error(file_, at, at + 1,
                    "an empty replacement" + in_case + ": write `NAME = VALUE` between commas");
      return false;
    }
    const uint32_t name_end = scanDottedName(p, end);
    if (name_end == p) {
      diags_->error(file_, p, p + 1, "expected the name of a quantity to replace" + in_case);
      return false;
    }
    CaseReplacement r;
    r.name = s.substr(p, name_end - p);
    r.name_begin = p;
    r.name_end = name_end;
    const uint32_t eq = skipSpace(name_end, end);
    if (eq >= end || s[eq] != '=') {
      const uint32_t at = eq < end ? eq : name_end;
      diags_->error(file_, at, at + 1, "expected `=` after `" + r.name + "`" + in_case);
      return false;
    }
    if (skipSpace(eq + 1, end) == end) {
      diags_->error(file_, eq, eq + 1, "`" + r.name + " =` needs a value or a formula" + in_case);
      return false;
    }
    ExprParser parser(file_, eq + 1, end, diags_);
    r.expr = parser.parseWhole();
    if (!r.expr) return false;
    for (const CaseReplacement& other : c->replacements) {
      if (other.name != r.name) continue;
      diags_->error(file_, p, name_end, "the case `" + c->name + "` replaces `" + r.name + "` twice");
      return false;
    }
    c->replacements.push_back(std::move(r));
    return true;
  }

  // `study NAME: sweep X = FROM..TO, N points [log-spaced], show R1, R2`, the
  // list form `sweep X = V1, V2, ..., show R1`, and `study NAME: capacity
  // X = LO..HI, largest|smallest`. The parts are split at the commas outside
  // parentheses; what the names and values mean is checked against the
  // Model later (engine/study/sheet_study.h).
  bool parseStudy(Statement* st, int line, uint32_t keyword, uint32_t p, uint32_t end) {
    const std::string& s = file_.bytes();
    const std::string forms = "`study NAME: sweep d = 20 mm..60 mm, 9 points, show T_raise`, "
                              "`study NAME: capacity F = 1 kN..200 kN, largest` or `study NAME: pick d from "
                              "trapezoidal`";
    SheetStudy study;
    study.line = line;
    study.section = section_;
    const uint32_t name_end = scanName(p, end);
    if (name_end == p) {
      diags_->error(file_, p < end ? p : keyword, (p < end ? p : keyword) + 1, "a study needs a name: " + forms);
      return false;
    }
    study.name = s.substr(p, name_end - p);
    study.name_begin = p;
    study.name_end = name_end;
    const uint32_t colon = skipSpace(name_end, end);
    if (colon >= end || s[colon] != ':') {
      diags_->error(file_, colon < end ? colon : name_end - 1, (colon < end ? colon : name_end - 1) + 1,
                    "expected `:` after the study name `" + study.name + "`");
      return false;
    }
    if (const int first = sheet_->findStudy(study.name); first >= 0) {
      diags_->error(file_, p, name_end,
                    "the study `" + study.name + "` is defined twice; the first is on line " +
                        std::to_string(sheet_->studies[static_cast<size_t>(first)].line));
      return false;
    }
    const uint32_t body_end = splitDescription(colon + 1, end, &study.description);
    const uint32_t kind_at = skipSpace(colon + 1, body_end);
    const uint32_t kind_end = scanName(kind_at, body_end);
    const std::string kind = s.substr(kind_at, kind_end - kind_at);
    if (kind == "pick") return parsePick(st, &study, kind_end, body_end, forms);
    if (kind != "sweep" && kind != "capacity") {
      const uint32_t at = kind_at < body_end ? kind_at : colon;
      diags_->error(file_, at, std::max(kind_end, at + 1),
                    (kind.empty() ? std::string("the study `" + study.name + "` needs a kind after `:`")
                                  : "`" + kind + "` is not a kind of study") +
                        "; a worksheet's study is a `sweep`, a `capacity` or a `pick`: " + forms);
      return false;
    }
    study.kind = kind == "sweep" ? SheetStudy::Sweep : SheetStudy::Capacity;
    std::vector<std::pair<uint32_t, uint32_t>> parts;
    uint32_t from = kind_end;
    for (uint32_t part_end : topLevelCommas(kind_end, body_end)) {
      parts.push_back({from, part_end});
      from = part_end + 1;
    }
    // The first part: `X = VALUE` or `X = FROM..TO`.
    const uint32_t x = skipSpace(parts[0].first, parts[0].second);
    const uint32_t x_end = scanDottedName(x, parts[0].second);
    if (x_end == x) {
      const uint32_t at = x < parts[0].second ? x : kind_end - 1;
      diags_->error(file_, at, at + 1, "expected the name of the input to vary after `" + kind + "`: " + forms);
      return false;
    }
    study.vary = {s.substr(x, x_end - x), x, x_end};
    const uint32_t eq = skipSpace(x_end, parts[0].second);
    if (eq >= parts[0].second || s[eq] != '=') {
      const uint32_t at = eq < parts[0].second ? eq : x_end - 1;
      diags_->error(file_, at, at + 1,
                    "expected `=` and the values after `" + study.vary.name + "`: `" + study.vary.name +
                        " = FROM..TO` or `" + study.vary.name + " = V1, V2, V3`");
      return false;
    }
    const size_t dots = std::string_view(s).substr(0, parts[0].second).find("..", eq + 1);
    bool ok = true;
    size_t k = 1;
    if (dots != std::string::npos) {
      study.range = true;
      const uint32_t d = static_cast<uint32_t>(dots);
      ok &= parseStudyValue(&study, eq + 1, d, d, "FROM");
      ok &= parseStudyValue(&study, d + 2, parts[0].second, d, "TO");
    } else {
      ok &= parseStudyValue(&study, eq + 1, parts[0].second, eq, "a value");
      // A list runs on until a part that starts a clause.
      for (; k < parts.size() && study.kind == SheetStudy::Sweep && !startsClause(parts[k]); ++k)
        ok &= parseStudyValue(&study, parts[k].first, parts[k].second, parts[k].first - 1, "a value");
    }
    if (!ok) return false;
    if (study.values.size() > static_cast<size_t>(kMaxStudyPoints)) {
      diags_->error(file_, study.values.front()->begin, study.values.back()->end,
                    "a study in a worksheet has at most " + std::to_string(kMaxStudyPoints) +
                        " points (its table is printed in the report); `calctrail sweep` takes more");
      return false;
    }
    if (study.kind == SheetStudy::Capacity) {
      if (!study.range) {
        diags_->error(file_, study.values[0]->begin, study.values[0]->end,
                      "a capacity is sought in a bracket LO..HI, as in `capacity F = 1 kN..200 kN, largest`");
        return false;
      }
      if (!parseCapacitySense(&study, parts, body_end)) return false;
    } else if (!parseSweepClauses(&study, parts, k, body_end)) {
      return false;
    }
    st->kind = Statement::StudyStmt;
    st->index = static_cast<int>(sheet_->studies.size());
    sheet_->studies.push_back(std::move(study));
    return true;
  }

  // After `pick`: `X from SERIES` or `X from V1, V2, ...`, the smallest that passes every check.
  bool parsePick(Statement* st, SheetStudy* study, uint32_t p, uint32_t body_end, const std::string& forms) {
    const std::string& s = file_.bytes();
    study->kind = SheetStudy::Pick;
    const uint32_t x = skipSpace(p, body_end);
    const uint32_t x_end = scanDottedName(x, body_end);
    if (x_end == x) {
      const uint32_t at = x < body_end ? x : p - 1;
      diags_->error(file_, at, at + 1, "expected the name of the input to pick after `pick`: `pick d from "
                                       "trapezoidal` or `pick d from 20 mm, 24 mm, 28 mm`");
      return false;
    }
    study->vary = {s.substr(x, x_end - x), x, x_end};
    const uint32_t from = skipSpace(x_end, body_end);
    const uint32_t from_end = scanName(from, body_end);
    if (s.compare(from, from_end - from, "from") != 0 || from_end == from) {
      const uint32_t at = from < body_end ? from : x_end - 1;
      diags_->error(file_, at, at + 1,
                    "expected `from SERIES` or `from V1, V2, ...` after `pick " + study->vary.name + "`; " + forms);
      return false;
    }
    const uint32_t what = skipSpace(from_end, body_end);
    const uint32_t word_end = scanName(what, body_end);
    if (word_end > what && skipSpace(word_end, body_end) == body_end) {
      study->series = s.substr(what, word_end - what);
      study->series_begin = what;
      study->series_end = word_end;
    } else {
      bool ok = true;
      uint32_t b = from_end;
      for (uint32_t part_end : topLevelCommas(from_end, body_end)) {
        ok &= parseStudyValue(study, b, part_end, b > from_end ? b - 1 : from, "a value");
        b = part_end + 1;
      }
      if (!ok) return false;
      if (study->values.size() > static_cast<size_t>(kMaxStudyPoints)) {
        diags_->error(file_, study->values.front()->begin, study->values.back()->end,
                      "a study in a worksheet has at most " + std::to_string(kMaxStudyPoints) + " values");
        return false;
      }
    }
    st->kind = Statement::StudyStmt;
    st->index = static_cast<int>(sheet_->studies.size());
    sheet_->studies.push_back(std::move(*study));
    return true;
  }

  // A value of a study in [b, e); `at` is where to point when it is missing (the `..` or the `=`).
  bool parseStudyValue(SheetStudy* study, uint32_t b, uint32_t e, uint32_t at, const std::string& what) {
    if (skipSpace(b, e) == e) {
      diags_->error(file_, at, at + (what == "a value" ? 1 : 2),
                    what == "a value" ? std::string("an empty value; write V1, V2, ... with a unit on each")
                                      : "a range needs " + what + ": FROM..TO, as in `20 mm..60 mm`");
      return false;
    }
    ExprParser parser(file_, b, e, diags_);
    ExprPtr value = parser.parseWhole();
    if (!value) return false;
    study->values.push_back(std::move(value));
    return true;
  }

  // [b, e) without the blanks at either end, as text.
  std::string partText(std::pair<uint32_t, uint32_t> part) const {
    return trim(std::string_view(file_.bytes()).substr(part.first, part.second - part.first));
  }

  // A part of a sweep that is `N points ...` or `show ...`, not a value of a list.
  bool startsClause(std::pair<uint32_t, uint32_t> part) const {
    const uint32_t b = skipSpace(part.first, part.second);
    const uint32_t word_end = scanName(b, part.second);
    if (file_.bytes().compare(b, word_end - b, "show") == 0) return true;
    uint32_t q = b;
    while (q < part.second && file_.bytes()[q] >= '0' && file_.bytes()[q] <= '9') ++q;
    const uint32_t w = skipSpace(q, part.second);
    return q > b && file_.bytes().compare(w, 6, "points") == 0;
  }

  // After `X = FROM..TO` of a sweep, from part k: `N points [log-spaced]`, then `show R1, R2, ...`.
  bool parseSweepClauses(SheetStudy* study, const std::vector<std::pair<uint32_t, uint32_t>>& parts, size_t k,
                         uint32_t body_end) {
    const std::string& s = file_.bytes();
    if (k < parts.size() && startsClause(parts[k]) && !isShow(parts[k])) {
      const uint32_t b = skipSpace(parts[k].first, parts[k].second);
      uint32_t q = b;
      while (q < parts[k].second && s[q] >= '0' && s[q] <= '9') ++q;
      // The words after the count, one blank apart whatever was written.
      std::string rest;
      for (uint32_t w = skipSpace(q, parts[k].second); w < parts[k].second;) {
        uint32_t we = w;
        while (we < parts[k].second && !isSpace(s[we])) ++we;
        rest += (rest.empty() ? "" : " ") + s.substr(w, we - w);
        w = skipSpace(we, parts[k].second);
      }
      uint32_t e = parts[k].second;
      while (e > b && (s[e - 1] == ' ' || s[e - 1] == '\t')) --e;
      study->points_begin = b;
      study->points_end = e;
      if (rest != "points" && rest != "points log-spaced") {
        diags_->error(file_, b, e, "expected `N points` or `N points log-spaced`, as in `9 points`");
        return false;
      }
      if (!study->range) {
        diags_->error(file_, b, e,
                      "a list of values has as many points as values; `N points` goes with a range FROM..TO");
        return false;
      }
      study->log = rest == "points log-spaced";
      const std::string digits = s.substr(b, q - b);
      study->points = digits.size() > 5 ? kMaxStudyPoints + 1 : std::stoi(digits);
      if (study->points < 2) {
        diags_->error(file_, b, e,
                      "a range has no points between its ends with `" + digits +
                          " points`; it needs 2 points or more (both ends count)");
        return false;
      }
      if (study->points > kMaxStudyPoints) {
        diags_->error(file_, b, e,
                      "a study in a worksheet has at most " + std::to_string(kMaxStudyPoints) +
                          " points (its table is printed in the report); `calctrail sweep` takes more");
        return false;
      }
      ++k;
    }
    if (k >= parts.size() || !isShow(parts[k])) {
      const uint32_t at = k < parts.size() ? skipSpace(parts[k].first, parts[k].second) : body_end;
      const uint32_t e = k < parts.size() ? parts[k].second : body_end;
      diags_->error(file_, at > 0 && at >= e ? at - 1 : at, std::max(e, at + 1),
                    k < parts.size() ? std::string("expected `show NAME, ...` (or `N points` after a range): the "
                                                   "results the sweep shows")
                                     : "the sweep `" + study->name + "` needs the results it shows: `, show " +
                                           "T_raise, P_motor` at the end");
      return false;
    }
    const uint32_t show_at = skipSpace(parts[k].first, parts[k].second);
    bool ok = parseShownName(study, show_at + 4, parts[k].second, show_at);
    for (++k; k < parts.size(); ++k) ok &= parseShownName(study, parts[k].first, parts[k].second, parts[k].first - 1);
    return ok;
  }

  bool isShow(std::pair<uint32_t, uint32_t> part) const {
    const uint32_t b = skipSpace(part.first, part.second);
    const uint32_t word_end = scanName(b, part.second);
    return word_end - b == 4 && file_.bytes().compare(b, 4, "show") == 0;
  }

  // One name after `show`, in [b, e); `at` is where to point when it is missing.
  bool parseShownName(SheetStudy* study, uint32_t b, uint32_t e, uint32_t at) {
    const uint32_t p = skipSpace(b, e);
    const uint32_t name_end = scanDottedName(p, e);
    if (name_end == p || skipSpace(name_end, e) != e) {
      const uint32_t where = p < e ? (name_end == p ? p : skipSpace(name_end, e)) : at;
      diags_->error(file_, where, where + 1,
                    "expected the name of a quantity to show, as in `show T_raise, P_motor`");
      return false;
    }
    const std::string name = file_.bytes().substr(p, name_end - p);
    for (const StudyName& other : study->show) {
      if (other.name != name) continue;
      diags_->error(file_, p, name_end, "the study `" + study->name + "` shows `" + name + "` twice");
      return false;
    }
    study->show.push_back({name, p, name_end});
    return true;
  }

  // After `X = LO..HI` of a capacity: `largest` or `smallest`.
  bool parseCapacitySense(SheetStudy* study, const std::vector<std::pair<uint32_t, uint32_t>>& parts,
                          uint32_t body_end) {
    const std::string word = parts.size() > 1 ? partText(parts[1]) : std::string();
    if (parts.size() == 2 && (word == "largest" || word == "smallest")) {
      study->largest = word == "largest";
      return true;
    }
    const uint32_t at = parts.size() > 1 ? skipSpace(parts[1].first, parts[1].second) : body_end;
    const uint32_t e = parts.size() > 1 ? parts.back().second : body_end;
    diags_->error(file_, at > 0 && at >= e ? at - 1 : at, std::max(e, at + 1),
                  "a capacity ends with `, largest` or `, smallest`: the largest (smallest) value of `" +
                      study->vary.name + "` in the bracket for which every check passes");
    return false;
  }

  Sheet* sheet_;
  const SourceFile& file_;
  Diagnostics* diags_;
  std::string section_;
  // The display units parsed so far, by their text as written.
  std::unordered_map<std::string, std::shared_ptr<const Unit>> display_units_;
  std::unordered_map<std::string, int> check_index_;  // check name -> position, for duplicates
  std::unordered_map<std::string, int> use_index_;    // instance name -> position in uses, for duplicates
};

}  // namespace

Sheet parseSheet(std::shared_ptr<SourceFile> file, Diagnostics* diags) {
  Sheet sheet;
  sheet.file = std::move(file);
  const SourceFile& f = *sheet.file;
  // A byte-order mark alone is no content either (the line parser skips it too).
  std::string_view body = f.bytes();
  if (body.rfind("\xEF\xBB\xBF", 0) == 0) body.remove_prefix(3);
  if (body.find_first_not_of(" \t\r\n") == std::string_view::npos) {
    diags->error(f.path(), "the worksheet is empty: nothing to calculate");
    return sheet;
  }
  LineParser parser(&sheet, diags);
  const int lines = f.lineCount();
  sheet.statements.reserve(static_cast<size_t>(lines));
  sheet.quantities.reserve(static_cast<size_t>(lines));
  sheet.index.reserve(static_cast<size_t>(lines));
  for (int line = 1; line <= lines; ++line) parser.parseLine(line);
  // An instance's name stands for its quantities (`left.T_raise`): no quantity of the file may take it.
  for (const Use& u : sheet.uses) {
    const int q = sheet.find(u.instance);
    if (q < 0) continue;
    diags->error(f, u.instance_begin, u.instance_end,
                 "the instance `" + u.instance + "` has the name of the quantity `" + u.instance +
                     "` defined on line " + std::to_string(sheet.quantities[q].line) +
                     "; rename one of them");
  }
  return sheet;
}

}  // namespace calctrail
