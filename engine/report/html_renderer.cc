#include "engine/report/html_renderer.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <string_view>
#include <vector>

#include "engine/report/mathml.h"
#include "engine/report/xml_escape.h"
#include "engine/util/utf8.h"

namespace calctrail {

namespace {

// Sober print styling: black on white, serif system fonts, no colour that
// carries meaning. Page headers use CSS @page margin boxes (Chromium 131 and
// later); the @page rules that carry the worksheet's own text follow in
// pageRules().
constexpr std::string_view kStyle = R"css(
:root { color: #000; background: #fff; }
body { font-family: "Liberation Serif", "Times New Roman", Times, "DejaVu Serif", serif; font-size: 10pt;
  line-height: 1.25; max-width: 180mm; margin: 8mm auto; padding: 0 6mm; }
math { font-family: "STIX Two Math", "Cambria Math", "Latin Modern Math", "DejaVu Math TeX Gyre", math; }
code { font-family: "DejaVu Sans Mono", "Liberation Mono", monospace; font-size: 0.85em; }
h1 { font-size: 1.55em; margin: 0 0 0.4em; }
h2 { font-size: 1.2em; margin: 1.1em 0 0.4em; padding-bottom: 0.15em; border-bottom: 1pt solid #000; }
h3 { font-size: 1.05em; margin: 0.9em 0 0.3em; }
h2, h3 { break-after: avoid; }
table { border-collapse: collapse; width: 100%; }
th, td { text-align: left; vertical-align: baseline; padding: 0.2em 0.5em 0.2em 0; }
thead th { font-size: 0.9em; border-bottom: 0.75pt solid #000; }
tbody tr { break-inside: avoid; }
tbody td { border-bottom: 0.25pt solid #999; }
table.quantities td { padding-top: 0.1em; padding-bottom: 0.1em; }
tr.group th { padding-top: 0.6em; font-style: italic; font-weight: normal; border-bottom: 0.25pt solid #999; }
td.value { white-space: nowrap; }
table.meta { width: auto; margin-bottom: 0.8em; }
table.meta th { font-weight: normal; padding-right: 1.5em; }
table.meta td { padding-right: 2em; }
table.meta td { border: none; }
code.hash { word-break: break-all; }
.verdict { border: 1pt solid #000; padding: 0.5em 0.8em 0.7em; margin: 1em 0 1.2em; break-inside: avoid; }
.verdict h2 { margin-top: 0.2em; border: none; }
.verdict.has-cases { break-inside: auto; }
.verdict.has-fail { border-width: 2.5pt; }
.verdict-line { font-size: 1.15em; font-weight: bold; margin: 0 0 0.6em; }
.fail-mark { font-weight: bold; border: 1.5pt solid #000; padding: 0 0.25em; }
tr.fail td { font-weight: bold; }
.note { margin: 0.3em 0 0.4em; }
.step { display: grid; grid-template-columns: 30% 70%; margin: 0.2em 0; break-inside: avoid; }
.step .what { grid-column: 1; padding-right: 0.8em; font-size: 0.92em; }
.step .how { grid-column: 2; min-width: 0; }
.eq { display: grid; grid-template-columns: max-content max-content minmax(0, 1fr); column-gap: 0.4em;
  align-items: baseline; }
.eq .lhs { grid-column: 1; }
.eq .rel { grid-column: 2; }
.eq .rhs { grid-column: 3; min-width: 0; overflow-wrap: anywhere; }
.eq .rhs .broken, .eq .rhs math[display="block"] { vertical-align: middle; }
.eq math[display="block"] { display: inline math; math-style: normal; margin: 0.1em 0; }
.eq mfrac > *, .where mfrac > * { math-style: normal; }
.broken .cont { padding-left: 1.5em; }
.result { font-weight: bold; }
.row { font-style: italic; }
.where { margin: 0.1em 0 0.1em 1.2em; font-size: 0.92em; }
.where .w { font-style: italic; }
.where .broken, .where math[display="block"] { display: inline-block; vertical-align: middle; }
.warn { margin: 0.2em 0; font-weight: bold; }
.modified { border: 2.5pt solid #000; padding: 0.4em 0.6em; margin: 0.6em 0; font-weight: bold; }
code.name { font-size: 0.75em; margin-left: 0.4em; }
.fn { font-size: 0.84em; margin: 0.2em 0 0.2em 1.5em; text-indent: -1.5em; break-inside: avoid; }
.fn code.sig { font-weight: bold; }
.fn .used, .fn .limits { font-style: italic; }
.fn math { text-indent: 0; math-style: normal; }
.fn mfrac > * { math-style: normal; }
ol.sources { font-size: 0.8em; padding-left: 2em; margin: 0.3em 0; }
table.checks { font-size: 0.92em; }
table.checks:not(.cases) td:nth-child(4) { white-space: nowrap; }
table.checks:not(.cases) td:nth-child(6) { min-width: 14em; }
table.cases { margin-bottom: 0.5em; }
td.case { white-space: normal; }
td.case .value { white-space: nowrap; }
table.step-cases { width: auto; font-size: 0.88em; margin: 0.15em 0 0.2em; }
table.step-cases th, table.step-cases td { padding-right: 1.2em; }
tr.case-values td { border-bottom: 0.25pt solid #999; padding-top: 0; }
table.params { width: auto; margin: 0.2em 0 0.5em; font-size: 0.92em; }
table.params td, table.params th { padding-right: 1.5em; }
table.params th:nth-child(4), table.params td:nth-child(4) { padding-left: 1.5em; border-left: 1px solid #ccc; }
.source { font-style: italic; }
.cautions { border: 1pt solid #000; padding: 0.2em 0.9em 0.3em; margin-top: 1em; break-inside: avoid;
  font-size: 0.92em; }
.cautions h2 { border: none; margin-top: 0.5em; }
.cautions li, .warnings li { margin-bottom: 0.15em; }
.cautions ul { margin: 0.3em 0; }
.signoff { break-inside: avoid; margin-top: 1em; }
table.signatures th, table.signatures td { border: 0.75pt solid #000; padding: 0.35em 0.5em; }
table.signatures tbody td, table.signatures tbody th { height: 2.4em; vertical-align: top; }
table.signatures td.sign { width: 38%; }
.end { margin-top: 1.2em; text-align: center; font-style: italic; }
@media print {
  body { max-width: none; margin: 0; padding: 0; }
  * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
@page { margin: 17mm 15mm 16mm 15mm; }
)css";

// Room for a formula beside its symbol at full size, in em (the right-hand
// column of a step on A4 or Letter with the page margins).
constexpr double kFormulaRoomEm = 34.0;

size_t codepointAt(const std::string& s, size_t i, char32_t* cp) {
  const Utf8Char c = readUtf8(s, i);
  *cp = c.cp;
  return c.length;
}

bool superscriptDigit(char32_t c) {
  return c == 0x2070 || c == 0xB9 || c == 0xB2 || c == 0xB3 || (c >= 0x2074 && c <= 0x2079);
}
bool numberEnd(char32_t c) { return (c >= '0' && c <= '9') || superscriptDigit(c); }
bool unitStart(char32_t c) {
  return (c < 0x80 && std::isalpha(static_cast<int>(c))) || c == 0xB0 || c == '%' || c == 0xB5 ||
         c == 0x3BC || c == 0x3A9 || c == 0xD7;
}

// A value or substituted line for people, its powers of ten already
// typeset (1.5 × 10⁹), as HTML: "^2" as ², the minus sign, and no line
// break between a number and its unit.
std::string typeset(const std::string& s) {
  static const char* const sup[] = {"\u2070", "\u00B9", "\u00B2", "\u00B3", "\u2074",
                                    "\u2075", "\u2076", "\u2077", "\u2078", "\u2079"};
  std::string out;
  char32_t prev = 0;
  for (size_t i = 0; i < s.size();) {
    char32_t c;
    const size_t n = codepointAt(s, i, &c);
    const bool next_digit = i + 1 < s.size() && std::isdigit(static_cast<unsigned char>(s[i + 1]));
    if (c == '^') {
      // An integer power as a superscript: (33.00 mm)^2 -> (33.00 mm)².
      size_t j = i + 1;
      const bool neg = j < s.size() && s[j] == '-';
      if (neg) ++j;
      size_t k = j;
      while (k < s.size() && std::isdigit(static_cast<unsigned char>(s[k]))) ++k;
      if (k > j && (k == s.size() || !(std::isalnum(static_cast<unsigned char>(s[k])) || s[k] == '.'))) {
        if (neg) out += "\u207B";
        for (size_t d = j; d < k; ++d) out += sup[s[d] - '0'];
        prev = 0x2070;
        i = k;
        continue;
      }
    }
    if (c == '-' && (prev == ' ' || prev == '(' || prev == 0 || next_digit)) {
      out += "\u2212";  // a minus sign, not a hyphen
    } else if (c == ' ') {
      char32_t next = 0;
      if (i + 1 < s.size()) codepointAt(s, i + 1, &next);
      const bool bind = (numberEnd(prev) && unitStart(next)) || prev == 0xD7;
      out += bind ? "&nbsp;" : " ";
    } else {
      out += escapeXml(s.substr(i, n));
    }
    prev = c;
    i += n;
  }
  return out;
}

std::string human(const TrailValue& v) { return typeset(valueText(v, NumberStyle::TimesTen)); }
std::string human(const TrailLine& line) { return typeset(lineText(line, NumberStyle::TimesTen)); }

std::string esc(const std::string& s) { return escapeXml(s); }

// A CSS string literal; "<" is escaped so that no text can close the <style>.
std::string cssString(const std::string& s) {
  std::string out = "\"";
  for (char c : s) {
    if (c == '"' || c == '\\') out += '\\', out += c;
    else if (c == '<') out += "\\3C ";
    else if (c == '\n' || c == '\r') out += ' ';
    else out += c;
  }
  return out + "\"";
}

std::string meta(const Trail& t, const std::string& key) {
  for (const auto& [k, v] : t.meta)
    if (k == key) return v;
  return "";
}

std::string title(const Trail& t) { return t.title.empty() ? "Calculation trail" : t.title; }

// The running header and footer of every printed page.
std::string pageRules(const Trail& t) {
  std::string ident;
  if (!meta(t, "calc").empty()) ident += "calc " + meta(t, "calc") + " \u00B7 ";
  if (!meta(t, "revision").empty()) ident += "revision " + meta(t, "revision") + " \u00B7 ";
  const std::string font = "font-family: \"Liberation Serif\", \"Times New Roman\", serif; ";
  const std::string box = font + "font-size: 8.5pt; ", small = font + "font-size: 7pt; ";
  std::string out = "@page {\n";
  out += "  @top-left { content: " + cssString(title(t)) + "; " + box +
         "vertical-align: bottom; padding-bottom: 4mm; }\n";
  out += "  @top-right { content: " + cssString(ident + "page ") +
         " counter(page) \" of \" counter(pages); " + box +
         "vertical-align: bottom; padding-bottom: 4mm; white-space: nowrap; }\n";
  // The hash on every page, and beside it, after a --set, that the numbers are not the file's.
  std::string foot = t.path + " \u00B7 SHA-256 " + t.sha256;
  if (!t.modified_by.empty()) foot += " \u00B7 MODIFIED BY " + replacementList(t);
  out += "  @bottom-left { content: " + cssString(foot) + "; " + small +
         "vertical-align: top; padding-top: 4mm; }\n";
  out += "  @bottom-right { content: " + cssString(t.generator) + "; " + small +
         "vertical-align: top; padding-top: 4mm; white-space: nowrap; }\n";
  out += "}\n";
  return out;
}

std::string inlineMath(const std::string& elements) { return "<math>" + elements + "</math>"; }

// One line of typeset formula, shrunk when it would not fit `room` em.
std::string mathLine(const std::string& elements, double need, double room) {
  if (need <= room) return fmt::format("<math display=\"block\">{}</math>", elements);
  const int percent = std::max(1, static_cast<int>(std::floor(100.0 * room / need)));
  return fmt::format("<math display=\"block\" style=\"font-size: {}%\">{}</math>", percent, elements);
}

// A formula beside its symbol. MathML does not break lines, so a long
// formula is broken here between its top-level terms (before a sign where
// possible, else before a product dot), each continuation starting with its
// operator; a piece that alone is too wide is shrunk. Nothing is cut off.
std::string displayMath(const Expr& e, double symbol_em, const MathValueOf& values = nullptr) {
  // However long the symbol, a formula keeps a readable room.
  const double room = std::max(12.0, kFormulaRoomEm - symbol_em);
  const double need = mathmlWidth(e, values);
  const std::vector<InfixPiece> pieces = infixPieces(e);
  if (need <= room || pieces.size() < 2) return mathLine(mathmlExpr(e, values), need, room);
  constexpr double kIndent = 1.5;  // continuation lines, in em
  std::vector<double> widths;
  for (const InfixPiece& p : pieces)
    widths.push_back(mathmlWidth(*p.expr, values) + (p.op.empty() ? 0.0 : 1.1));
  std::vector<std::pair<size_t, size_t>> lines;  // [first, last) pieces
  size_t first = 0;
  double width = 0;
  for (size_t i = 0; i < pieces.size(); ++i) {
    const double line_room = room - (lines.empty() ? 0.0 : kIndent);
    if (i > first && width + widths[i] > line_room) {
      size_t cut = i;
      for (size_t k = i + 1; k > first + 1; --k)
        if (pieces[k - 1].op != "\u00B7") {
          cut = k - 1;
          break;
        }
      lines.emplace_back(first, cut);
      first = cut;
      width = 0;
      for (size_t k = first; k < i; ++k) width += widths[k];
    }
    width += widths[i];
  }
  lines.emplace_back(first, pieces.size());
  std::string out = "<div class=\"broken\">";
  for (size_t l = 0; l < lines.size(); ++l) {
    std::string elements;
    double w = 0;
    for (size_t k = lines[l].first; k < lines[l].second; ++k) {
      if (!pieces[k].op.empty()) elements += "<mo>" + pieces[k].op + "</mo>";
      elements += mathmlExpr(*pieces[k].expr, values);
      w += widths[k];
    }
    out += std::string("<div") + (l ? " class=\"cont\"" : "") + ">" +
           mathLine(elements, w, room - (l ? kIndent : 0.0)) + "</div>";
  }
  return out + "</div>";
}

const char* relationEntity(const std::string& op) {
  if (op == "<") return "&lt;";
  if (op == "<=") return "\u2264";
  if (op == ">") return "&gt;";
  if (op == ">=") return "\u2265";
  return "?";
}

std::string conditionMath(const TrailCheck& c) {
  if (!c.lhs_expr || !c.rhs_expr) return "<code>" + esc(c.condition) + "</code>";
  return inlineMath("<mrow>" + mathmlExpr(*c.lhs_expr) + "<mo>" + relationEntity(c.op) + "</mo>" +
                    mathmlExpr(*c.rhs_expr) + "</mrow>");
}

std::string checkValues(const TrailCheck& c) {
  return human(c.lhs) + " " + relationEntity(c.op) + " " + human(c.rhs);
}

// Every part of the document is appended to one buffer.
using Out = fmt::appender;  // into the buffer itself, not through a copy of fmt's own

// Case columns per table on a portrait A4 or Letter page: the checks table
// (a name column and cells such as "FAIL −10.00 N·m (governing)"), the
// values table, and the table within a step (its right-hand column). A
// wider table wraps into several, each repeating the name column.
constexpr size_t kCheckColumns = 5, kValueColumns = 6, kStepCaseColumns = 5;

// A case's value, bold where it differs from the nominal.
std::string caseCell(const TrailStep& s, size_t k) {
  if (k >= s.cases.size() || !s.cases[k].ok) return "not calculated";
  const bool differs = k > 0 && s.cases[k].value.si != s.cases[0].value.si;
  return differs ? "<strong>" + human(s.cases[k].value) + "</strong>" : human(s.cases[k].value);
}

// A run changed by --set: said in a framed box wherever the hash is shown.
void modifiedBox(Out out, const Trail& t) {
  if (t.modified_by.empty()) return;
  fmt::format_to(out, "<p class=\"modified\"><span class=\"fail-mark\">MODIFIED</span> {}</p>\n",
                 esc(modifiedNotice(t).substr(std::string("MODIFIED: ").size())));
}

void header(Out out, const Trail& t) {
  fmt::format_to(out, "<header class=\"title-block\">\n<h1>{}</h1>\n<table class=\"meta\">\n", esc(title(t)));
  // The metadata two to a row; the file and its hash on rows of their own.
  for (size_t k = 0; k < t.meta.size(); k += 2) {
    fmt::format_to(out, "<tr><th>{}</th><td>{}</td>", esc(t.meta[k].first), esc(t.meta[k].second));
    if (k + 1 < t.meta.size())
      fmt::format_to(out, "<th>{}</th><td>{}</td>", esc(t.meta[k + 1].first), esc(t.meta[k + 1].second));
    fmt::format_to(out, "</tr>\n");
  }
  fmt::format_to(out, "<tr><th>file</th><td colspan=\"3\"><code>{}</code></td></tr>\n", esc(t.path));
  fmt::format_to(out, "<tr><th>SHA-256</th><td colspan=\"3\"><code class=\"hash\">{}</code></td></tr>\n",
                 esc(t.sha256));
  fmt::format_to(out, "<tr><th>generator</th><td colspan=\"3\">{}</td></tr>\n", esc(t.generator));
  fmt::format_to(out, "</table>\n");
  modifiedBox(out, t);
  fmt::format_to(out, "</header>\n");
}

// The verdict sentence, its first word boxed when it is not a pass.
std::string verdictHtml(const Trail& t) {
  const std::string state = verdictState(t), sentence = verdictSentence(t);
  if (state == "PASS") return esc(sentence);
  // "FAIL:" in the box, so that the sentence reads the same in print as in every format.
  return "<span class=\"fail-mark\">" + esc(state) + ":</span>" + esc(sentence.substr(state.size() + 1));
}

// A check's utilisation under that heading ("55 %"), or its margin in words.
std::string measureCell(const TrailCheck& c) {
  const std::string u = "utilisation ";
  return c.measure.rfind(u, 0) == 0 ? c.measure.substr(u.size()) : c.measure;
}

// The verdict and every check, first: a failed check must be impossible to
// miss, so it is marked in words and weight, never by colour alone.
// The load cases side by side: every check per case (pass/FAIL and the
// margin, the governing case marked), then every value a case changes, one
// column per case, nominal first.
void casesTables(Out out, const Trail& t) {
  fmt::format_to(out, "<h3>Checks by load case</h3>\n");
  for (const auto& [first, last] : caseGroups(t.cases.size(), kCheckColumns)) {
    fmt::format_to(out, "<table class=\"checks cases\">\n<thead><tr><th>Check</th>");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, "<th><code>{}</code></th>", esc(t.cases[k].name));
    fmt::format_to(out, "</tr></thead>\n<tbody>\n");
    for (const TrailCheck& c : t.checks) {
      fmt::format_to(out, "<tr><td><code>{}</code></td>", esc(c.name));
      for (size_t k = first; k < last; ++k) {
        std::string cell = "not calculated";
        if (k < c.cases.size() && c.cases[k].ok)
          cell = (c.cases[k].passed ? std::string("pass ") : std::string("<span class=\"fail-mark\">FAIL</span> ")) +
                 "<span class=\"value\">" + human(c.cases[k].margin) + "</span>";
        if (static_cast<int>(k) == c.governing) cell += " <strong>(governing)</strong>";
        fmt::format_to(out, "<td class=\"case\">{}</td>", cell);
      }
      fmt::format_to(out, "</tr>\n");
    }
    fmt::format_to(out, "</tbody>\n</table>\n");
  }
  fmt::format_to(out, "<p>Load cases: ");
  for (size_t k = 0; k < t.cases.size(); ++k) {
    const TrailCase& c = t.cases[k];
    fmt::format_to(out, "{}<code>{}</code> ({})", k ? "; " : "", esc(c.name),
                   c.replacements.empty() ? std::string("the worksheet as written") : esc(c.replacements));
    for (const std::string& e : c.errors) fmt::format_to(out, " <strong>NOT CALCULATED:</strong> {}", esc(e));
  }
  fmt::format_to(out, ".</p>\n<h3>Values by load case</h3>\n");
  for (const auto& [first, last] : caseGroups(t.cases.size(), kValueColumns)) {
    fmt::format_to(out, "<table class=\"cases\">\n<thead><tr><th>Quantity</th>");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, "<th><code>{}</code></th>", esc(t.cases[k].name));
    fmt::format_to(out, "</tr></thead>\n<tbody>\n");
    for (const TrailStep& s : t.steps.heads()) {
      if (!s.varies) continue;
      fmt::format_to(out, "<tr><td><code>{}</code></td>", esc(s.name));
      for (size_t k = first; k < last; ++k) fmt::format_to(out, "<td class=\"value\">{}</td>", caseCell(s, k));
      fmt::format_to(out, "</tr>\n");
    }
    fmt::format_to(out, "</tbody>\n</table>\n");
  }
}

// Within a step (or under an input) that some case changes: its value in
// every case, nominal first, as a small table; many cases wrap onto rows
// of tables.
void caseValues(Out out, const Trail& t, const TrailStep& s) {
  for (const auto& [first, last] : caseGroups(t.cases.size(), kStepCaseColumns)) {
    fmt::format_to(out, "<table class=\"step-cases\">\n<thead><tr>");
    for (size_t k = first; k < last; ++k) fmt::format_to(out, "<th><code>{}</code></th>", esc(t.cases[k].name));
    fmt::format_to(out, "</tr></thead>\n<tbody><tr>");
    for (size_t k = first; k < last; ++k) {
      // A calculated quantity that a case replaces: the formula in force, as the text trail says.
      const bool replaced = !s.input && k < s.cases.size() && s.cases[k].replaced;
      fmt::format_to(out, "<td class=\"value\">{}{}</td>", caseCell(s, k),
                     replaced ? "<br><span class=\"row\">replaced: <code>" + esc(s.cases[k].formula) + "</code></span>"
                              : std::string());
    }
    fmt::format_to(out, "</tr></tbody>\n</table>\n");
  }
}

void checksSummary(Out out, const Trail& t) {
  fmt::format_to(out, "<section class=\"verdict {}{}\">\n<h2>Design checks</h2>\n",
                 verdictState(t) == "FAIL" ? "has-fail" : "all-pass", t.cases.empty() ? "" : " has-cases");
  fmt::format_to(out, "<p class=\"verdict-line\">{}</p>\n", verdictHtml(t));
  if (!t.warnings.empty()) {
    const std::string w = warningSummary(t);
    fmt::format_to(out, "<p class=\"warn\"><span class=\"fail-mark\">WARNING:</span>{}</p>\n",
                   esc(w.substr(std::string("WARNING:").size())));
  }
  if (t.checks.empty()) {
    fmt::format_to(out, "</section>\n");
    return;
  }
  fmt::format_to(out, "<table class=\"checks\">\n<thead><tr><th>State</th><th>Check</th><th>Condition</th>"
                      "<th>Values</th><th>Utilisation</th><th>Note</th></tr></thead>\n<tbody>\n");
  for (const TrailCheck& c : t.checks) {
    fmt::format_to(out, "<tr class=\"{}\">{}", c.passed ? "pass" : "fail",
                   c.passed ? "<td>pass</td>" : "<td><span class=\"fail-mark\">FAIL</span></td>");
    std::string note = esc(c.description);
    for (const std::string& w : c.warnings)
      note += (note.empty() ? "" : " ") + std::string("<strong>WARNING:</strong> ") + esc(w);
    fmt::format_to(
        out, "<td><code>{}</code></td><td>{}</td><td>{}</td><td class=\"value\">{}</td><td>{}</td></tr>\n",
        esc(c.name), conditionMath(c), checkValues(c), esc(measureCell(c)), note);
  }
  fmt::format_to(out, "</tbody>\n</table>\n");
  if (!t.cases.empty()) casesTables(out, t);
  fmt::format_to(out, "</section>\n");
}

// A quantity's symbol, and its name as written where the symbol is not
// simply that name (d_m is typeset d with subscript m; F is F).
std::string symbolCell(const std::string& name) {
  const std::string symbol = inlineMath(mathmlName(name));
  if (mathmlName(name) == "<mi>" + esc(name) + "</mi>") return symbol;
  return symbol + " <code class=\"name\">" + esc(name) + "</code>";
}

// The inputs (every result is in its step): quantity, value, notes,
// grouped under sections.
void quantityTable(ReportSink& sink, const Trail& t, bool inputs) {
  Out out = fmt::appender(sink.buffer());
  fmt::format_to(out, "<table class=\"quantities\">\n<thead><tr><th>Quantity</th><th>{}</th></tr>"
                      "</thead>\n<tbody>\n", inputs ? "Value</th><th>Notes" : "Result</th><th>Description");
  std::string section = "\x01";
  const TrailSteps::Filter filter = inputs ? TrailSteps::Filter::Inputs : TrailSteps::Filter::Calculated;
  for (const TrailStep& s : t.steps.heads(filter)) {
    sink.checkpoint();
    if (inputs && s.in_part_table) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty())
        fmt::format_to(out, "<tr class=\"group\"><th colspan=\"3\">{}</th></tr>\n", esc(section));
    }
    std::string notes = esc(s.description);
    if (inputs && s.formula_in_notes)
      notes = "= <code>" + esc(s.formula) + "</code>" + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("<em>(set on the command line)</em>");
    if (inputs)
      for (const std::string& w : s.warnings) notes += " <strong>WARNING:</strong> " + esc(w);
    const TrailValue& value = inputs && s.given ? *s.given : s.result;
    fmt::format_to(out, "<tr><td>{}</td><td class=\"value\">{}</td><td>{}</td></tr>\n", symbolCell(s.name),
                   human(value), notes);
    if (s.varies) {
      fmt::format_to(out, "<tr class=\"case-values\"><td></td><td colspan=\"2\">\n");
      caseValues(out, t, s);
      fmt::format_to(out, "</td></tr>\n");
    }
  }
  fmt::format_to(out, "</tbody>\n</table>\n");
}

// The value set in place of each bound node of a substituted formula.
MathValueOf bound(const std::vector<TrailBinding>& bindings) {
  return [&bindings](const Expr& node) -> const TrailBinding* {
    for (const TrailBinding& b : bindings)
      if (b.node == &node) return &b;
    return nullptr;
  };
}

// symbol = formula = substituted ... = result, the equals signs aligned.
void equation(Out out, const std::string& lhs, const std::vector<std::string>& rhs,
              const std::string& result) {
  fmt::format_to(out, "<div class=\"eq\">\n<div class=\"lhs\">{}</div>", lhs);
  for (size_t k = 0; k < rhs.size(); ++k)
    fmt::format_to(out, "<div class=\"rel\">=</div><div class=\"rhs\">{}</div>\n", rhs[k]);
  if (!result.empty())
    fmt::format_to(out, "<div class=\"rel\">=</div><div class=\"rhs result\">{}</div>\n", result);
  fmt::format_to(out, "</div>\n");
}

// A library call inside a formula: its values, its own formula with them
// (typeset like the worksheet's formulas) and its result, on one line when
// they fit. The function's formula, limits and source are listed once.
void whereLine(Out out, const TrailCall& c) {
  fmt::format_to(out, "<div class=\"where\"><span class=\"w\">where</span> <span class=\"call\">{}</span>",
                 human(c.with_values));
  if (c.formula_is_expression && c.show_substituted && c.formula_expr)
    fmt::format_to(out, " = {}", displayMath(*c.formula_expr, 14, bound(c.bindings)));
  if (c.result) fmt::format_to(out, " = <span class=\"result\">{}</span>", human(*c.result));
  if (!c.row.empty()) fmt::format_to(out, " <span class=\"row\">({})</span>", esc(c.row));
  fmt::format_to(out, "</div>\n");
}

void step(Out out, const Trail& t, const TrailStep& s) {
  fmt::format_to(out, "<div class=\"step\" id=\"q-{}\">\n<div class=\"what\"><code>{}</code>", esc(s.name),
                 esc(s.name));
  if (!s.description.empty()) fmt::format_to(out, " <span class=\"desc\">{}</span>", esc(s.description));
  if (s.overridden) fmt::format_to(out, " <em>(set on the command line)</em>");
  fmt::format_to(out, "</div>\n<div class=\"how\">\n");
  const double symbol_em = mathmlNameWidth(s.name) + 2;
  std::vector<std::string> rhs = {s.expr ? displayMath(*s.expr, symbol_em) : esc(s.pretty)};
  double last = s.expr ? mathmlWidth(*s.expr) : 1e9;  // width of the last line, in em
  if (s.show_substituted) {
    rhs.push_back(s.substituted_expr ? displayMath(*s.substituted_expr, symbol_em, bound(s.bindings))
                                     : human(s.substituted));
    last = s.substituted_expr ? mathmlWidth(*s.substituted_expr, bound(s.bindings)) : 1e9;
  }
  if (s.single_call && s.calls[0].formula_expr) {
    rhs.push_back(displayMath(*s.calls[0].formula_expr, symbol_em, bound(s.calls[0].bindings)));
    last = mathmlWidth(*s.calls[0].formula_expr, bound(s.calls[0].bindings));
  }
  std::string result = human(s.result);
  const std::string row = !s.calls.empty() && s.calls[0].whole ? s.calls[0].row : "";
  if (!row.empty()) result += " <span class=\"row\">(" + esc(row) + ")</span>";
  // The result ends the last line where it fits there, as a hand calculation writes it.
  const double result_em = 0.6 * static_cast<double>(valueText(s.result).size() + row.size()) + 1.5;
  if (rhs.size() > 1 && last + result_em <= kFormulaRoomEm - symbol_em) {
    rhs.back() += " = <span class=\"result\">" + result + "</span>";
    result.clear();
  }
  equation(out, inlineMath(mathmlName(s.name)), rhs, result);
  for (const TrailCall& c : s.calls)
    if (!c.whole) whereLine(out, c);
  if (s.varies) caseValues(out, t, s);
  for (const std::string& w : s.warnings)
    fmt::format_to(out, "<p class=\"warn\"><span class=\"fail-mark\">WARNING</span> {}</p>\n", esc(w));
  fmt::format_to(out, "</div>\n</div>\n");
}

// An instance's part: a heading with the instance, the template's title and
// file, then its parameters: the value each is bound to and where it came
// from (the binding in the using sheet, the default, the command line).
void instanceHead(Out out, const TrailInstance& in) {
  fmt::format_to(out, "<h3 class=\"instance\">Instance <code>{}</code>: {} <span class=\"source\">(<code>{}</code>)"
                      "</span></h3>\n",
                 esc(in.name), esc(in.title.empty() ? std::string("template") : in.title), esc(in.path));
  if (in.params.empty()) return;
  // A long list is set in two halves side by side (read down the left, then the right): on
  // paper the table would otherwise fill a page with short rows.
  const size_t count = in.params.size();
  const size_t rows = count > 6 ? (count + 1) / 2 : count;
  const char* const head = "<th>Parameter</th><th>Value</th><th>Bound by</th>";
  fmt::format_to(out, "<table class=\"params\">\n<thead><tr>{}{}</tr></thead>\n<tbody>\n", head,
                 rows < count ? head : "");
  const auto cells = [&](const TrailInstanceParam& p) {
    std::string from = p.overridden        ? std::string("<em>set on the command line</em>")
                       : p.binding.empty() ? std::string("<em>default</em>")
                                           : "<code>" + esc(p.binding) + "</code>";
    // Left out of the Inputs list: its note is given here.
    if (p.in_part_table && !p.description.empty())
      from += " <span class=\"desc\">" + esc(p.description) + "</span>";
    fmt::format_to(out, "<td>{}</td><td class=\"value\">{}</td><td>{}</td>", symbolCell(p.name),
                   human(p.shown), from);
  };
  for (size_t r = 0; r < rows; ++r) {
    fmt::format_to(out, "<tr>");
    cells(in.params[r]);
    if (r + rows < count) cells(in.params[r + rows]);
    fmt::format_to(out, "</tr>\n");
  }
  fmt::format_to(out, "</tbody>\n</table>\n");
}

void calculation(ReportSink& sink, const Trail& t) {
  Out out = fmt::appender(sink.buffer());
  fmt::format_to(out, "<section class=\"calculation\">\n<h2>Calculation</h2>\n");
  for (const TrailBlock& b : t.blocks) {
    sink.checkpoint();
    if (b.kind == TrailBlock::Section && b.instance >= 0)
      instanceHead(out, t.instances[static_cast<size_t>(b.instance)]);
    else if (b.kind == TrailBlock::Section) fmt::format_to(out, "<h3>{}</h3>\n", esc(t.blockText(b)));
    else if (b.kind == TrailBlock::Note && b.instance < 0)
      fmt::format_to(out, "<p class=\"note\">{}</p>\n", esc(t.blockText(b)));
    else if (b.kind == TrailBlock::Step && !t.steps.isInput(static_cast<size_t>(b.index)))
      step(out, t, *t.steps.get(static_cast<size_t>(b.index)));
    else if (b.kind == TrailBlock::CheckRef && b.instance >= 0) {
      // The part names its checks once, after its last step; their rows are in the summary.
      const TrailInstance& in = t.instances[static_cast<size_t>(b.instance)];
      if (b.index == in.checks.front())
        fmt::format_to(out, "<p class=\"note part-checks\">{}</p>\n", esc(instanceChecksLine(t, in)));
    }
  }
  fmt::format_to(out, "</section>\n");
}

// Every library function the formulas call, once: what it computes, its
// formula or method, limits, published source and where its tests are
// listed. Sources that several functions share are written once, numbered.
void libraryFunctions(Out out, const Trail& t) {
  fmt::format_to(out, "<section class=\"library\">\n<h2>Library functions used</h2>\n");
  if (t.functions.empty()) {
    fmt::format_to(out, "<p>No library function is called: every formula above is written out in the "
                        "worksheet itself.</p>\n</section>\n");
    return;
  }
  fmt::format_to(out, "<p class=\"note\">Each function once: the steps above show its call, the values and "
                      "the result. Each is tested against its source and an independent check, listed under "
                      "its name in docs/verification.md; the sources are numbered below.</p>\n");
  std::vector<std::string> sources, definitions;
  for (const TrailFunction& f : t.functions) {
    if (f.trivial) {
      definitions.push_back("<code>" + esc(f.signature) + "</code> = " + typeset(f.value));
      continue;
    }
    auto at = std::find(sources.begin(), sources.end(), f.source);
    if (at == sources.end()) at = sources.insert(sources.end(), f.source);
    const size_t number = static_cast<size_t>(at - sources.begin()) + 1;
    std::vector<std::string> used;
    for (const std::string& u : f.used_by) used.push_back("<code>" + esc(u) + "</code>");
    fmt::format_to(
        out,
        "<p class=\"fn\" id=\"fn-{}\"><code class=\"sig\">{}</code> <span class=\"used\">(used for {})"
        "</span> ",
        esc(f.name), esc(f.signature), fmt::join(used, ", "));
    if (f.formula_is_expression && f.formula_expr)
      fmt::format_to(out, "= {}", inlineMath(mathmlExpr(*f.formula_expr)));
    else
      fmt::format_to(out, "Method: {}", esc(f.method));
    if (!f.limits.empty()) fmt::format_to(out, ". <span class=\"limits\">Limits: {}.</span>", esc(f.limits));
    fmt::format_to(out, " Source [{}]; verified: docs/verification.md, <code>{}</code>.</p>\n", number,
                   esc(f.name));
  }
  if (!definitions.empty())
    fmt::format_to(out, "<p class=\"note\">Definitions: {}</p>\n", fmt::join(definitions, ", "));
  fmt::format_to(out, "<ol class=\"sources\">\n");
  for (const std::string& source : sources) fmt::format_to(out, "<li>{}</li>\n", esc(source));
  fmt::format_to(out, "</ol>\n</section>\n");
}

// The block a checker signs: the signature covers these worksheet bytes,
// and, after a --set, says in a framed box that the numbers are not the file's.
void signOff(Out out, const Trail& t) {
  auto given = [](const std::string& v) { return v.empty() ? std::string("\u2014") : esc(v); };
  fmt::format_to(out, "<section class=\"signoff\">\n<h2>Sign-off</h2>\n<table class=\"meta\">\n");
  fmt::format_to(out, "<tr><th>calc</th><td>{}</td><th>revision</th><td>{}</td></tr>\n",
                 given(meta(t, "calc")), given(meta(t, "revision")));
  fmt::format_to(out, "<tr><th>worksheet</th><td colspan=\"3\"><code>{}</code></td></tr>\n", esc(t.path));
  fmt::format_to(out, "<tr><th>SHA-256</th><td colspan=\"3\"><code class=\"hash\">{}</code></td></tr>\n",
                 esc(t.sha256));
  if (!t.modified_by.empty())
    fmt::format_to(out, "<tr><th>MODIFIED BY</th><td colspan=\"3\"><code>{}</code></td></tr>\n",
                   esc(replacementList(t)));
  fmt::format_to(out, "</table>\n");
  if (t.modified_by.empty()) fmt::format_to(out, "<p>{}</p>\n", esc(signOffStatement(t)));
  else fmt::format_to(out, "<p class=\"modified\"><strong>{}</strong></p>\n", esc(signOffStatement(t)));
  fmt::format_to(out, "<table class=\"signatures\">\n<thead><tr><th></th><th>Name</th><th>Signature</th>"
                      "<th>Date</th></tr></thead>\n<tbody>\n");
  fmt::format_to(out, "<tr><th>Prepared</th><td>{}</td><td class=\"sign\"></td><td>{}</td></tr>\n",
                 esc(meta(t, "prepared")), esc(meta(t, "date")));
  fmt::format_to(out, "<tr><th>Checked</th><td>{}</td><td class=\"sign\"></td><td></td></tr>\n",
                 esc(meta(t, "checked")));
  fmt::format_to(out, "</tbody>\n</table>\n");
  std::string end = "End of calculation";
  if (!meta(t, "calc").empty()) end += " " + meta(t, "calc");
  if (!meta(t, "revision").empty()) end += ", revision " + meta(t, "revision");
  fmt::format_to(out, "<p class=\"end\">{}. {}.</p>\n</section>\n", esc(end), esc(t.generator));
}

// The worksheet's studies: a sweep's table and its plot inline (failing
// points shaded on it, FAIL in bold in the table), a capacity's answer.
void studies(Out out, const Trail& t) {
  fmt::format_to(out, "<section class=\"studies\">\n<h2>Studies</h2>\n");
  for (const TrailStudy& st : t.studies) {
    fmt::format_to(out, "<section class=\"study\" id=\"study-{}\">\n<h3>Study {}</h3>\n<p><code>{}</code></p>\n",
                   esc(st.name), esc(st.name), esc(st.statement));
    if (!st.description.empty()) fmt::format_to(out, "<p>{}</p>\n", esc(st.description));
    if (!st.header.empty()) {
      fmt::format_to(out, "<table>\n<thead><tr>");
      for (const std::string& h : st.header) fmt::format_to(out, "<th>{}</th>", esc(h));
      fmt::format_to(out, "</tr></thead>\n<tbody>\n");
      for (const auto& r : st.rows) {
        fmt::format_to(out, "<tr>");
        for (size_t c = 0; c < r.size(); ++c)
          fmt::format_to(out, r[c] == "FAIL" ? "<td><strong>{}</strong></td>" : "<td>{}</td>", esc(r[c]));
        fmt::format_to(out, "</tr>\n");
      }
      fmt::format_to(out, "</tbody>\n</table>\n");
    }
    fmt::format_to(out, "<p>{}</p>\n", esc(st.summary));
    for (const std::string& e : st.errors) fmt::format_to(out, "<p><code>{}</code></p>\n", esc(e));
    // The plot is SVG of our own (engine/study/svg_plot.cc): plain elements, text escaped.
    if (!st.svg.empty()) {
      std::string svg = st.svg;
      svg.insert(4, " style=\"max-width:100%;height:auto\"");
      fmt::format_to(out, "<figure class=\"study-plot\">\n{}</figure>\n", svg);
    }
    fmt::format_to(out, "</section>\n");
  }
  fmt::format_to(out, "</section>\n");
}

}  // namespace

void renderHtml(const Trail& t, ReportSink& sink) {
  fmt::memory_buffer& buffer = sink.buffer();
  auto out = fmt::appender(buffer);
  fmt::format_to(out, "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
  fmt::format_to(out, "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
  fmt::format_to(out, "<meta name=\"generator\" content=\"{}\">\n", esc(t.generator));
  std::string doc_title = title(t);
  if (!meta(t, "calc").empty()) doc_title = meta(t, "calc") + " " + doc_title;
  fmt::format_to(out, "<title>{}</title>\n<style>{}{}</style>\n</head>\n<body>\n", esc(doc_title), kStyle,
                 pageRules(t));
  header(out, t);
  checksSummary(out, t);
  fmt::format_to(out, "<section class=\"inputs\">\n<h2>Inputs</h2>\n");
  quantityTable(sink, t, true);
  if (!instanceInputsPointer(t).empty())
    fmt::format_to(out, "<p class=\"note\">{}</p>\n", esc(instanceInputsPointer(t)));
  fmt::format_to(out, "</section>\n");
  calculation(sink, t);
  if (!t.studies.empty()) studies(out, t);
  if (!t.warnings.empty()) {
    fmt::format_to(out, "<section class=\"warnings\">\n<h2>Warnings</h2>\n<ul>\n");
    for (const std::string& w : t.warnings) fmt::format_to(out, "<li><code>{}</code></li>\n", esc(w));
    fmt::format_to(out, "</ul>\n</section>\n");
  }
  libraryFunctions(out, t);
  fmt::format_to(out, "<section class=\"cautions\">\n<h2>Cautions</h2>\n<ul>\n");
  for (const std::string& c : t.cautions) fmt::format_to(out, "<li>{}</li>\n", esc(c));
  fmt::format_to(out, "</ul>\n</section>\n");
  signOff(out, t);
  fmt::format_to(out, "</body>\n</html>\n");
}

std::string renderHtml(const Trail& t) {
  ReportSink sink;
  renderHtml(t, sink);
  return sink.text();
}

}  // namespace calctrail
