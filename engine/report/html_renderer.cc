#include "engine/report/html_renderer.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <iterator>
#include <string_view>
#include <vector>

#include "engine/report/mathml.h"
#include "engine/report/xml_escape.h"

namespace calctrail {

namespace {

// Sober print styling: black on white, serif system fonts, no colour that
// carries meaning. Page headers use CSS @page margin boxes (Chromium 131 and
// later); the @page rules that carry the worksheet's own text follow in
// pageRules().
constexpr std::string_view kStyle = R"css(
:root { color: #000; background: #fff; }
body { font-family: "Liberation Serif", "Times New Roman", Times, "DejaVu Serif", serif; font-size: 10pt;
  line-height: 1.3; max-width: 180mm; margin: 8mm auto; padding: 0 6mm; }
math { font-family: "STIX Two Math", "Cambria Math", "Latin Modern Math", "DejaVu Math TeX Gyre", math; }
code { font-family: "DejaVu Sans Mono", "Liberation Mono", monospace; font-size: 0.85em; }
h1 { font-size: 1.55em; margin: 0 0 0.4em; }
h2 { font-size: 1.2em; margin: 1.4em 0 0.5em; padding-bottom: 0.15em; border-bottom: 1pt solid #000; }
h3 { font-size: 1.05em; margin: 1.2em 0 0.4em; }
h2, h3 { break-after: avoid; }
table { border-collapse: collapse; width: 100%; }
th, td { text-align: left; vertical-align: baseline; padding: 0.2em 0.5em 0.2em 0; }
thead th { font-size: 0.9em; border-bottom: 0.75pt solid #000; }
tbody tr { break-inside: avoid; }
tbody td { border-bottom: 0.25pt solid #999; }
tr.group th { padding-top: 0.6em; font-style: italic; font-weight: normal; border-bottom: 0.25pt solid #999; }
td.value { white-space: nowrap; }
table.meta { width: auto; margin-bottom: 0.8em; }
table.meta th { font-weight: normal; padding-right: 1.5em; }
table.meta td { border: none; }
code.hash { word-break: break-all; }
.verdict { border: 1pt solid #000; padding: 0.5em 0.8em 0.7em; margin: 1em 0 1.2em; break-inside: avoid; }
.verdict h2 { margin-top: 0.2em; border: none; }
.verdict.has-fail { border-width: 2.5pt; }
.verdict-line { font-size: 1.15em; font-weight: bold; margin: 0 0 0.6em; }
.fail-mark { font-weight: bold; border: 1.5pt solid #000; padding: 0 0.25em; }
tr.fail td { font-weight: bold; }
.note { margin: 0.4em 0 0.6em; }
.step { margin: 0.6em 0 0.7em 0.8em; break-inside: avoid; }
.step-head { margin: 0 0 0.2em; }
.step-head .desc { margin-left: 0.5em; }
.eq { display: grid; grid-template-columns: max-content max-content minmax(0, 1fr); column-gap: 0.4em;
  align-items: baseline; margin-left: 1.2em; }
.eq .lhs { grid-column: 1; }
.eq .rel { grid-column: 2; }
.eq .rhs { grid-column: 3; min-width: 0; overflow-wrap: anywhere; }
.eq math[display="block"] { display: inline math; math-style: normal; margin: 0.15em 0; }
.eq mfrac > * { math-style: normal; }
.broken .cont { padding-left: 1.5em; }
.result { font-weight: bold; }
.call { margin: 0.4em 0 0.2em 2.4em; padding-left: 0.7em; border-left: 0.75pt solid #000; font-size: 0.92em; }
.call p { margin: 0.15em 0; }
.call .eq { margin-left: 0.4em; }
.source { font-style: italic; }
.cautions { border: 1pt solid #000; padding: 0.2em 0.9em 0.4em; margin-top: 1.4em; break-inside: avoid; }
.cautions h2 { border: none; margin-top: 0.5em; }
.cautions li, .warnings li { margin-bottom: 0.3em; }
.signoff { break-inside: avoid; margin-top: 1.6em; }
table.signatures th, table.signatures td { border: 0.75pt solid #000; padding: 0.35em 0.5em; }
table.signatures tbody td, table.signatures tbody th { height: 2.6em; vertical-align: top; }
table.signatures td.sign { width: 38%; }
.end { margin-top: 1.2em; text-align: center; font-style: italic; }
@media print {
  body { max-width: none; margin: 0; padding: 0; }
  * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
@page { margin: 20mm 16mm 18mm 16mm; }
)css";

// Room for a formula beside its symbol at full size, in em (the text width
// of A4 with the page margins, less the step indents).
constexpr double kFormulaRoomEm = 38.0;

size_t codepointAt(const std::string& s, size_t i, char32_t* cp) {
  const auto b = static_cast<unsigned char>(s[i]);
  size_t n = b < 0x80 ? 1 : b < 0xE0 ? 2 : b < 0xF0 ? 3 : 4;
  n = std::min(n, s.size() - i);
  char32_t c = n == 1 ? b : b & (0x7F >> n);
  for (size_t k = 1; k < n; ++k) c = (c << 6) | (static_cast<unsigned char>(s[i + k]) & 0x3F);
  *cp = c;
  return n;
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
  out += "  @bottom-left { content: " + cssString(t.path + " \u00B7 SHA-256 " + t.sha256) + "; " + small +
         "vertical-align: top; padding-top: 4mm; }\n";
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
std::string displayMath(const Expr& e, double symbol_em) {
  // However long the symbol, a formula keeps a readable room.
  const double room = std::max(12.0, kFormulaRoomEm - symbol_em);
  const double need = mathmlWidth(e);
  const std::vector<InfixPiece> pieces = infixPieces(e);
  if (need <= room || pieces.size() < 2) return mathLine(mathmlExpr(e), need, room);
  constexpr double kIndent = 1.5;  // continuation lines, in em
  std::vector<double> widths;
  for (const InfixPiece& p : pieces) widths.push_back(mathmlWidth(*p.expr) + (p.op.empty() ? 0.0 : 1.1));
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
      elements += mathmlExpr(*pieces[k].expr);
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
using Out = std::back_insert_iterator<fmt::memory_buffer>;

void header(Out out, const Trail& t) {
  fmt::format_to(out, "<header class=\"title-block\">\n<h1>{}</h1>\n<table class=\"meta\">\n", esc(title(t)));
  for (const auto& [key, value] : t.meta)
    fmt::format_to(out, "<tr><th>{}</th><td>{}</td></tr>\n", esc(key), esc(value));
  fmt::format_to(out, "<tr><th>file</th><td><code>{}</code></td></tr>\n", esc(t.path));
  fmt::format_to(out, "<tr><th>SHA-256</th><td><code class=\"hash\">{}</code></td></tr>\n", esc(t.sha256));
  fmt::format_to(out, "</table>\n</header>\n");
}

// The verdict and every check, first: a failed check must be impossible to
// miss, so it is marked in words and weight, never by colour alone.
void checksSummary(Out out, const Trail& t) {
  fmt::format_to(out, "<section class=\"verdict {}\">\n<h2>Design checks</h2>\n",
                 t.failed ? "has-fail" : "all-pass");
  const std::string words = esc(verdictWords(t, VerdictForm::Sentence));
  if (t.checks.empty()) {
    fmt::format_to(out, "<p class=\"verdict-line\">{}</p>\n</section>\n", words);
    return;
  }
  if (t.failed == 0) {
    fmt::format_to(out, "<p class=\"verdict-line\">{}</p>\n", words);
  } else {
    fmt::format_to(out, "<p class=\"verdict-line\"><span class=\"fail-mark\">FAIL</span> {}", words);
    for (const TrailCheck& c : t.checks)
      if (!c.passed) fmt::format_to(out, " <code>{}</code>", esc(c.name));
    fmt::format_to(out, "</p>\n");
  }
  fmt::format_to(out, "<table class=\"checks\">\n<thead><tr><th>State</th><th>Check</th><th>Condition</th>"
                      "<th>Values</th><th>Note</th></tr></thead>\n<tbody>\n");
  for (const TrailCheck& c : t.checks) {
    fmt::format_to(out, "<tr class=\"{}\">{}", c.passed ? "pass" : "fail",
                   c.passed ? "<td>pass</td>" : "<td><span class=\"fail-mark\">FAIL</span></td>");
    fmt::format_to(out, "<td><code>{}</code></td><td>{}</td><td>{}</td><td>{}</td></tr>\n", esc(c.name),
                   conditionMath(c), checkValues(c), esc(c.description));
  }
  fmt::format_to(out, "</tbody>\n</table>\n</section>\n");
}

// Inputs or results: symbol, name, value, notes, grouped under sections.
void quantityTable(Out out, const Trail& t, bool inputs) {
  fmt::format_to(out, "<table class=\"quantities\">\n<thead><tr><th>Symbol</th><th>Name</th><th>{}</th></tr>"
                      "</thead>\n<tbody>\n", inputs ? "Value</th><th>Notes" : "Result</th><th>Description");
  std::string section = "\x01";
  for (const TrailStep& s : t.steps) {
    if (s.input != inputs) continue;
    if (s.section != section) {
      section = s.section;
      if (!section.empty())
        fmt::format_to(out, "<tr class=\"group\"><th colspan=\"4\">{}</th></tr>\n", esc(section));
    }
    std::string notes = esc(s.description);
    if (inputs && s.formula_in_notes)
      notes = "= <code>" + esc(s.formula) + "</code>" + (notes.empty() ? "" : "; " + notes);
    if (s.overridden) notes += (notes.empty() ? "" : " ") + std::string("<em>(set on the command line)</em>");
    const TrailValue& value = inputs && s.given ? *s.given : s.result;
    fmt::format_to(out,
                   "<tr><td>{}</td><td><code>{}</code></td><td class=\"value\">{}</td><td>{}</td></tr>\n",
                   inlineMath(mathmlName(s.name)), esc(s.name), human(value), notes);
  }
  fmt::format_to(out, "</tbody>\n</table>\n");
}

// symbol = formula / = substituted / = result, the equals signs aligned.
void equation(Out out, const std::string& lhs, const std::string& formula, const std::string& substituted,
              const std::string& result) {
  fmt::format_to(out, "<div class=\"eq\">\n<div class=\"lhs\">{}</div><div class=\"rel\">=</div>"
                      "<div class=\"rhs\">{}</div>\n", lhs, formula);
  if (!substituted.empty())
    fmt::format_to(out, "<div class=\"rel\">=</div><div class=\"rhs subst\">{}</div>\n", substituted);
  if (!result.empty())
    fmt::format_to(out, "<div class=\"rel\">=</div><div class=\"rhs result\">{}</div>\n", result);
  fmt::format_to(out, "</div>\n");
}

void callAudit(Out out, const TrailCall& c) {
  fmt::format_to(out, "<div class=\"call\">\n<p>where <code>{}</code></p>\n", esc(c.signature));
  if (c.formula_is_expression) {
    const std::string formula =
        c.formula_expr ? displayMath(*c.formula_expr, 0.5 * static_cast<double>(c.name.size()) + 3)
                       : esc(c.pretty);
    const std::string subst = c.show_substituted ? human(c.substituted) : "";
    equation(out, "<code>" + esc(c.name) + "</code>", formula, subst, c.result ? human(*c.result) : "");
  } else {
    fmt::format_to(out, "<p>{}</p>\n", esc(c.formula));
    if (!c.arguments.empty()) fmt::format_to(out, "<p>with {}</p>\n", human(c.arguments));
    if (c.result) fmt::format_to(out, "<p>= {}</p>\n", human(*c.result));
  }
  fmt::format_to(out, "<p class=\"source\">Source: {}</p>\n</div>\n", esc(c.source));
}

void step(Out out, const TrailStep& s) {
  fmt::format_to(out, "<div class=\"step\" id=\"q-{}\">\n<p class=\"step-head\"><code>{}</code>", esc(s.name),
                 esc(s.name));
  if (!s.description.empty()) fmt::format_to(out, "<span class=\"desc\">{}</span>", esc(s.description));
  if (s.overridden) fmt::format_to(out, " <em>(set on the command line)</em>");
  fmt::format_to(out, "</p>\n");
  const double symbol_em = mathmlNameWidth(s.name) + 2;
  const std::string formula = s.expr ? displayMath(*s.expr, symbol_em) : esc(s.pretty);
  const std::string subst = s.show_substituted ? human(s.substituted) : "";
  equation(out, inlineMath(mathmlName(s.name)), formula, subst, human(s.result));
  for (const TrailCall& c : s.calls) callAudit(out, c);
  fmt::format_to(out, "</div>\n");
}

void calculation(Out out, const Trail& t) {
  fmt::format_to(out, "<section class=\"calculation\">\n<h2>Calculation</h2>\n");
  for (const TrailBlock& b : t.blocks) {
    if (b.kind == TrailBlock::Section) fmt::format_to(out, "<h3>{}</h3>\n", esc(b.text));
    else if (b.kind == TrailBlock::Note) fmt::format_to(out, "<p class=\"note\">{}</p>\n", esc(b.text));
    else if (b.kind == TrailBlock::Step && !t.steps[b.index].input) step(out, t.steps[b.index]);
  }
  fmt::format_to(out, "</section>\n");
}

// Every library function the formulas call, once, with its published source.
void sources(Out out, const Trail& t) {
  fmt::format_to(out, "<section class=\"sources\">\n<h2>Sources</h2>\n");
  std::vector<std::string> seen;
  fmt::memory_buffer rows;
  for (const TrailStep& s : t.steps) {
    for (const TrailCall& c : s.calls) {
      if (std::find(seen.begin(), seen.end(), c.name) != seen.end()) continue;
      seen.push_back(c.name);
      std::vector<std::string> used;  // the quantities that call it, once each
      for (const TrailStep& u : t.steps)
        for (const TrailCall& uc : u.calls)
          if (uc.name == c.name && std::find(used.begin(), used.end(), u.name) == used.end())
            used.push_back(u.name);
      std::vector<std::string> cells;
      for (const std::string& name : used) cells.push_back("<code>" + esc(name) + "</code>");
      fmt::format_to(std::back_inserter(rows), "<tr><td><code>{}</code></td><td>{}</td><td>{}</td></tr>\n",
                     esc(c.signature), fmt::join(cells, ", "), esc(c.source));
    }
  }
  if (seen.empty()) {
    fmt::format_to(out, "<p>No library function is called: every formula above is written out in the "
                        "worksheet itself.</p>\n");
  } else {
    fmt::format_to(out,
                   "<table class=\"functions\">\n<thead><tr><th>Library function</th><th>Used for</th>"
                   "<th>Source</th></tr></thead>\n<tbody>\n{}</tbody>\n</table>\n",
                   fmt::to_string(rows));
  }
  fmt::format_to(out, "</section>\n");
}

// The block a checker signs: the signature covers these worksheet bytes.
void signOff(Out out, const Trail& t) {
  auto given = [](const std::string& v) { return v.empty() ? std::string("\u2014") : esc(v); };
  fmt::format_to(out, "<section class=\"signoff\">\n<h2>Sign-off</h2>\n<table class=\"meta\">\n");
  fmt::format_to(out, "<tr><th>calc</th><td>{}</td></tr>\n", given(meta(t, "calc")));
  fmt::format_to(out, "<tr><th>revision</th><td>{}</td></tr>\n", given(meta(t, "revision")));
  fmt::format_to(out, "<tr><th>worksheet</th><td><code>{}</code></td></tr>\n", esc(t.path));
  fmt::format_to(out, "<tr><th>SHA-256</th><td><code class=\"hash\">{}</code></td></tr>\n</table>\n",
                 esc(t.sha256));
  fmt::format_to(out, "<p>The signatures below cover the worksheet with this SHA-256 only. Any change to it, "
                      "however small, changes the SHA-256 and needs a new sign-off.</p>\n");
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
  fmt::format_to(out, "<p class=\"end\">{}.</p>\n</section>\n", esc(end));
}

}  // namespace

void renderHtml(const Trail& t, fmt::memory_buffer& buffer) {
  auto out = std::back_inserter(buffer);
  fmt::format_to(out, "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
  fmt::format_to(out, "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
  fmt::format_to(out, "<meta name=\"generator\" content=\"calctrail\">\n");
  std::string doc_title = title(t);
  if (!meta(t, "calc").empty()) doc_title = meta(t, "calc") + " " + doc_title;
  fmt::format_to(out, "<title>{}</title>\n<style>{}{}</style>\n</head>\n<body>\n", esc(doc_title), kStyle,
                 pageRules(t));
  header(out, t);
  checksSummary(out, t);
  fmt::format_to(out, "<section class=\"inputs\">\n<h2>Inputs</h2>\n");
  quantityTable(out, t, true);
  fmt::format_to(out, "</section>\n");
  calculation(out, t);
  bool any_result = false;
  for (const TrailStep& s : t.steps) any_result = any_result || !s.input;
  if (any_result) {
    fmt::format_to(out, "<section class=\"results\">\n<h2>Results</h2>\n");
    quantityTable(out, t, false);
    fmt::format_to(out, "</section>\n");
  }
  if (!t.warnings.empty()) {
    fmt::format_to(out, "<section class=\"warnings\">\n<h2>Warnings</h2>\n<ul>\n");
    for (const std::string& w : t.warnings) fmt::format_to(out, "<li><code>{}</code></li>\n", esc(w));
    fmt::format_to(out, "</ul>\n</section>\n");
  }
  fmt::format_to(out, "<section class=\"cautions\">\n<h2>Cautions</h2>\n<ul>\n");
  for (const std::string& c : t.cautions) fmt::format_to(out, "<li>{}</li>\n", esc(c));
  fmt::format_to(out, "</ul>\n</section>\n");
  sources(out, t);
  signOff(out, t);
  fmt::format_to(out, "</body>\n</html>\n");
}

std::string renderHtml(const Trail& t) {
  fmt::memory_buffer out;
  renderHtml(t, out);
  return fmt::to_string(out);
}

}  // namespace calctrail
