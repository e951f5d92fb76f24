#include "engine/review/sheet_format.h"

#include <algorithm>
#include <cstring>
#include <memory>

#include "engine/sheet/sheet_parser.h"
#include "engine/units/unit_parser.h"

namespace calctrail {

namespace {

bool isBlankChar(char c) { return c == ' ' || c == '\t'; }

std::string trimmed(std::string_view s) {
  size_t b = 0, e = s.size();
  while (b < e && isBlankChar(s[b])) ++b;
  while (e > b && isBlankChar(s[e - 1])) --e;
  return std::string(s.substr(b, e - b));
}

int codePoints(std::string_view s) {
  int n = 0;
  for (char c : s)
    if ((static_cast<unsigned char>(c) & 0xC0) != 0x80) ++n;
  return n;
}

bool sameBits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

bool sameUnit(const Unit& a, const Unit& b) {
  return sameBits(a.factor, b.factor) && sameBits(a.offset, b.offset) && a.dim == b.dim;
}

// The canonical spelling of `u` if it reads back to exactly the same unit.
bool canonicalSpelling(const Unit& u, std::string* text) {
  Unit back;
  UnitError err;
  if (!parseUnit(u.text, &back, &err) || !sameUnit(back, u)) return false;
  *text = u.text;
  return true;
}

bool isBareUnitName(const std::string& t) {
  if (t.empty()) return false;
  return std::all_of(t.begin(), t.end(), [](char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_';
  });
}

void canonicalize(Expr* e, bool power_base) {
  if (e->kind == ExprKind::Number && e->unit) {
    std::string text;
    if (canonicalSpelling(*e->unit, &text)) {
      // A base of a power keeps its brackets: `3 [mm]^2` is not `3 mm^2`,
      // which reads two ways and is an error.
      if (!power_base && (text == "%" || isBareUnitName(text))) e->unit->written = text;
      else e->unit->written = "[" + text + "]";
    } else {
      e->unit->written = trimmed(e->unit->written);
    }
  }
  for (size_t i = 0; i < e->args.size(); ++i) canonicalize(e->args[i].get(), e->kind == ExprKind::Power && i == 0);
}

std::string displayUnitText(const Quantity& q) {
  std::string text;
  if (q.display && canonicalSpelling(*q.display, &text)) return text;
  return trimmed(q.unit_written);
}

// A comment as written from its `#`, trailing blanks dropped.
std::string commentLine(const SourceFile& file, int line) {
  std::string_view text = file.lineText(line);
  if (line == 1 && text.rfind("\xEF\xBB\xBF", 0) == 0) text.remove_prefix(3);
  size_t b = 0;
  while (b < text.size() && isBlankChar(text[b])) ++b;
  size_t e = text.size();
  while (e > b && isBlankChar(text[e - 1])) --e;
  return std::string(text.substr(b, e - b));
}

struct Line {
  std::string code;         // the statement without its description
  std::string description;  // "" when none
  bool section = false;     // a `section` heading: the lines after it share a new column
};

// The description column of lines [begin, end): the smallest multiple of the
// step that leaves two blanks after every line of them that has a
// description and fits under the cap; longer lines do not count.
int descriptionColumn(const std::vector<Line>& lines, size_t begin, size_t end) {
  int widest = -1;
  for (size_t i = begin; i < end; ++i) {
    if (lines[i].description.empty()) continue;
    const int w = codePoints(lines[i].code);
    if (w + 2 <= kDescriptionColumnCap) widest = std::max(widest, w);
  }
  if (widest < 0) return 0;
  const int step = kDescriptionColumnStep;
  return std::min((widest + 2 + step - 1) / step * step, kDescriptionColumnCap);
}

bool sameExpr(const Expr& a, const Expr& b) {
  if (a.kind != b.kind || a.text != b.text || !sameBits(a.number, b.number)) return false;
  if (static_cast<bool>(a.unit) != static_cast<bool>(b.unit)) return false;
  if (a.unit && !sameUnit(*a.unit, *b.unit)) return false;
  if (a.args.size() != b.args.size()) return false;
  for (size_t i = 0; i < a.args.size(); ++i)
    if (!sameExpr(*a.args[i], *b.args[i])) return false;
  return true;
}

// `case NAME: a = EXPR, b = EXPR`, units spelled canonically.
std::string canonicalCaseLine(const LoadCase& c) {
  std::string out = "case " + c.name + ":";
  for (size_t i = 0; i < c.replacements.size(); ++i)
    out += (i ? ", " : " ") + c.replacements[i].name + " = " + renderExpr(*c.replacements[i].expr);
  return out;
}

std::string studyMismatch(const SheetStudy& a, const SheetStudy& b) {
  return canonicalStudyLine(a) == canonicalStudyLine(b) && a.description == b.description ? ""
                                                                                         : "another study";
}

std::string caseMismatch(const LoadCase& ca, const LoadCase& cb) {
  if (ca.name != cb.name) return "another case name";
  if (ca.replacements.size() != cb.replacements.size()) return "other replacements";
  for (size_t i = 0; i < ca.replacements.size(); ++i) {
    const CaseReplacement& ra = ca.replacements[i];
    const CaseReplacement& rb = cb.replacements[i];
    if (ra.name != rb.name || !sameExpr(*ra.expr, *rb.expr)) return "other replacements";
  }
  if (ca.description != cb.description) return "another description";
  return "";
}

// Statements without the blank lines at the start and end of the file.
std::pair<size_t, size_t> innerRange(const Sheet& s) {
  size_t b = 0, e = s.statements.size();
  while (b < e && s.statements[b].kind == Statement::Blank) ++b;
  while (e > b && s.statements[e - 1].kind == Statement::Blank) --e;
  return {b, e};
}

std::string statementMismatch(const Sheet& a, const Sheet& b, const Statement& sa, const Statement& sb) {
  if (sa.kind != sb.kind) return "another kind of statement";
  switch (sa.kind) {
    case Statement::Blank:
    case Statement::Invalid:
      return "";
    case Statement::Comment:
    case Statement::Section:
    case Statement::Note:
      return sa.text() == sb.text() ? "" : "another text";
    case Statement::Meta:
      return sa.key() == sb.key() && sa.text() == sb.text() ? "" : "another metadata value";
    case Statement::Define: {
      const Quantity& qa = a.quantities[sa.index];
      const Quantity& qb = b.quantities[sb.index];
      if (qa.name != qb.name) return "another name";
      if (qa.param != qb.param || qa.required != qb.required) return "another kind of parameter";
      if (static_cast<bool>(qa.display) != static_cast<bool>(qb.display) ||
          (qa.display && !sameUnit(*qa.display, *qb.display)))
        return "another display unit";
      if (qa.description != qb.description) return "another description";
      if (!qa.expr && !qb.expr) return "";  // two required parameters
      if (!qa.expr || !qb.expr || !sameExpr(*qa.expr, *qb.expr)) return "another formula";
      return "";
    }
    case Statement::UseStmt: {
      const Use& ua = a.uses[sa.index];
      const Use& ub = b.uses[sb.index];
      if (ua.path != ub.path || ua.instance != ub.instance) return "another template or instance";
      if (ua.description != ub.description) return "another description";
      if (ua.bindings.size() != ub.bindings.size()) return "other bindings";
      for (size_t k = 0; k < ua.bindings.size(); ++k)
        if (ua.bindings[k].param != ub.bindings[k].param ||
            !sameExpr(*ua.bindings[k].expr, *ub.bindings[k].expr))
          return "other bindings";
      return "";
    }
    case Statement::CheckStmt: {
      const Check& ca = a.checks[sa.index];
      const Check& cb = b.checks[sb.index];
      if (ca.name != cb.name) return "another check name";
      if (ca.op != cb.op || !sameExpr(*ca.lhs, *cb.lhs) || !sameExpr(*ca.rhs, *cb.rhs)) return "another condition";
      if (ca.description != cb.description) return "another description";
      return "";
    }
    case Statement::CaseStmt:
      return caseMismatch(a.cases[sa.index], b.cases[sb.index]);
    case Statement::StudyStmt:
      return studyMismatch(a.studies[sa.index], b.studies[sb.index]);
  }
  return "";
}

}  // namespace

void canonicalizeUnits(Expr* e) {
  if (e) canonicalize(e, false);
}

std::string canonicalDefinition(const Quantity& q) {
  std::string out = q.param ? "param " + q.name : q.name;
  if (q.display || !q.unit_written.empty()) out += " [" + displayUnitText(q) + "]";
  if (!q.expr) return out;  // a required parameter
  out += " = ";
  out += renderExpr(*q.expr);
  return out;
}

std::string canonicalUse(const Use& u) {
  // Quotes only where a bare path would not read back: blanks, `#`, or a leading quote.
  const bool quoted = u.path.find_first_of(" \t#") != std::string::npos || u.path[0] == '"';
  std::string out = "use " + (quoted ? "\"" + u.path + "\"" : u.path) + " as " + u.instance;
  for (size_t k = 0; k < u.bindings.size(); ++k)
    out += (k ? ", " : " with ") + u.bindings[k].param + " = " + renderExpr(*u.bindings[k].expr);
  return out;
}

std::string canonicalStudyLine(const SheetStudy& st) {
  if (st.kind == SheetStudy::Pick) {
    std::string out = "study " + st.name + ": pick " + st.vary.name + " from ";
    if (!st.series.empty()) return out + st.series;
    for (size_t k = 0; k < st.values.size(); ++k) out += (k ? ", " : "") + renderExpr(*st.values[k]);
    return out;
  }
  std::string out = "study " + st.name + ": " + (st.kind == SheetStudy::Sweep ? "sweep " : "capacity ") +
                    st.vary.name + " = ";
  if (st.range) {
    // `0.` before `..` would read as `0` and `..`: keep the number's own dot apart.
    const std::string from = renderExpr(*st.values[0]);
    out += from + (from.back() == '.' ? " .." : "..") + renderExpr(*st.values[1]);
  } else {
    for (size_t k = 0; k < st.values.size(); ++k) out += (k ? ", " : "") + renderExpr(*st.values[k]);
  }
  if (st.points) out += ", " + std::to_string(st.points) + " points" + (st.log ? " log-spaced" : "");
  if (st.kind == SheetStudy::Capacity) return out + (st.largest ? ", largest" : ", smallest");
  for (size_t k = 0; k < st.show.size(); ++k) out += (k ? ", " : ", show ") + st.show[k].name;
  return out;
}

std::string canonicalCondition(const Check& c) {
  return "check " + c.name + ": " + renderExpr(*c.lhs) + " " + comparisonText(c.op) + " " + renderExpr(*c.rhs);
}

bool sameMeaning(const Sheet& a, const Sheet& b, std::string* why) {
  const auto [ab, ae] = innerRange(a);
  const auto [bb, be] = innerRange(b);
  size_t i = ab, j = bb;
  for (; i < ae && j < be; ++i, ++j) {
    const std::string diff = statementMismatch(a, b, a.statements[i], b.statements[j]);
    if (!diff.empty()) {
      *why = "line " + std::to_string(a.statements[i].line) + " would become line " +
             std::to_string(b.statements[j].line) + " with " + diff;
      return false;
    }
  }
  if (i != ae || j != be) {
    *why = "the number of lines would change";
    return false;
  }
  return true;
}

std::string formatWorksheet(const std::string& display_path, const std::string& bytes, Diagnostics* diags) {
  auto file = std::make_shared<SourceFile>(display_path, bytes);
  Sheet sheet = parseSheet(file, diags);
  if (diags->hasErrors()) return "";
  for (Quantity& q : sheet.quantities) canonicalizeUnits(q.expr.get());
  for (Check& c : sheet.checks) {
    canonicalizeUnits(c.lhs.get());
    canonicalizeUnits(c.rhs.get());
  }
  for (LoadCase& c : sheet.cases)
    for (CaseReplacement& r : c.replacements) canonicalizeUnits(r.expr.get());
  for (Use& u : sheet.uses)
    for (UseBinding& b : u.bindings) canonicalizeUnits(b.expr.get());
  for (SheetStudy& st : sheet.studies)
    for (ExprPtr& v : st.values) canonicalizeUnits(v.get());

  const auto [first, last] = innerRange(sheet);
  std::vector<Line> lines;
  for (size_t k = first; k < last; ++k) {
    const Statement& st = sheet.statements[k];
    Line line;
    switch (st.kind) {
      case Statement::Blank:
      case Statement::Invalid:
        break;
      case Statement::Comment:
        line.code = commentLine(*file, st.line);
        break;
      case Statement::Meta:
        line.code = st.key() + ":" + (st.text().empty() ? "" : " " + st.text());
        break;
      case Statement::Section:
        line.code = "section " + st.text();
        line.section = true;
        break;
      case Statement::Note:
        line.code = "note " + st.text();
        break;
      case Statement::Define: {
        const Quantity& q = sheet.quantities[st.index];
        line.code = canonicalDefinition(q);
        line.description = q.description;
        break;
      }
      case Statement::UseStmt: {
        const Use& u = sheet.uses[st.index];
        line.code = canonicalUse(u);
        line.description = u.description;
        break;
      }
      case Statement::CheckStmt: {
        const Check& c = sheet.checks[st.index];
        line.code = canonicalCondition(c);
        line.description = c.description;
        break;
      }
      case Statement::CaseStmt: {
        const LoadCase& c = sheet.cases[st.index];
        line.code = canonicalCaseLine(c);
        line.description = c.description;
        break;
      }
      case Statement::StudyStmt: {
        const SheetStudy& study = sheet.studies[st.index];
        line.code = canonicalStudyLine(study);
        line.description = study.description;
        break;
      }
    }
    lines.push_back(std::move(line));
  }

  // One description column per section (the lines before the first
  // `section` are one too): a page reads calmly, and an edit moves at most
  // the column of its own section.
  std::string out;
  for (size_t i = 0; i < lines.size();) {
    size_t end = i + 1;
    while (end < lines.size() && !lines[end].section) ++end;
    const int column = descriptionColumn(lines, i, end);
    for (; i < end; ++i) {
      out += lines[i].code;
      if (!lines[i].description.empty()) {
        const int w = codePoints(lines[i].code);
        out += std::string(static_cast<size_t>(w + 2 <= column ? column - w : 2), ' ');
        out += "# " + lines[i].description;
      }
      out += "\n";
    }
  }

  // Never hand back a text that says something else: read it again and compare.
  Diagnostics again;
  Sheet check = parseSheet(std::make_shared<SourceFile>(display_path, out), &again);
  std::string why;
  if (again.hasErrors()) {
    why = "the canonical text does not parse: " + again.list().front().message;
  } else if (!sameMeaning(sheet, check, &why)) {
    why = "the canonical text would change the meaning: " + why;
  }
  if (!why.empty()) {
    diags->error(display_path, "internal error in the formatter, the file is left as it is (" + why + ")");
    return "";
  }
  return out;
}

}  // namespace calctrail
