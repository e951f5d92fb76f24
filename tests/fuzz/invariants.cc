#include "tests/fuzz/invariants.h"

#include <cmath>
#include <cstdlib>
#include <cstring>
#include <memory>
#include <set>
#include <vector>

#include "engine/calculation.h"
#include "engine/report/formats.h"
#include "engine/report/html_renderer.h"
#include "engine/report/json_renderer.h"
#include "engine/report/markdown_renderer.h"
#include "engine/report/number_format.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "engine/review/diff_render.h"
#include "engine/review/sheet_diff.h"
#include "engine/review/sheet_format.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/units/unit_parser.h"
#include "engine/util/utf8.h"
#include "tests/json_reader.h"

namespace calctrail::fuzz {

namespace {

// The name every target gives its input, so diagnostics can be checked for it.
constexpr const char* kPath = "fuzz.calc";

bool sameBits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

bool isLetter(char c) { return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_'; }
bool isDigit(char c) { return c >= '0' && c <= '9'; }

char lower(char c) { return c >= 'A' && c <= 'Z' ? static_cast<char>(c - 'A' + 'a') : c; }

// Bytes for a message: printable ASCII as is, everything else as \xNN, cut short.
std::string shown(std::string_view s) {
  std::string out;
  for (unsigned char c : s.substr(0, 300)) {
    if (c >= 0x20 && c < 0x7F) {
      out += static_cast<char>(c);
    } else {
      static const char* hex = "0123456789ABCDEF";
      out += "\\x";
      out += hex[c >> 4];
      out += hex[c & 15];
    }
  }
  return s.size() > 300 ? out + "..." : out;
}

// The words `inf` and `nan` (any case) standing alone or as a number's
// mantissa (`infe-324`, `-nan`) in `text`: what printf makes of a value that
// is not finite. A word counts when no letter touches it before, and after it
// comes no letter or digit except an exponent.
std::set<std::string> nonFiniteWords(std::string_view text) {
  std::set<std::string> found;
  for (size_t i = 0; i + 3 <= text.size(); ++i) {
    const std::string w = {lower(text[i]), lower(text[i + 1]), lower(text[i + 2])};
    if (w != "inf" && w != "nan") continue;
    if (i > 0 && isLetter(text[i - 1])) continue;
    size_t j = i + 3;
    if (j < text.size() && lower(text[j]) == 'e') {
      size_t k = j + 1;
      if (k < text.size() && (text[k] == '-' || text[k] == '+')) ++k;
      if (k < text.size() && isDigit(text[k])) {
        found.insert(w);
        continue;
      }
    }
    if (j < text.size() && (isLetter(text[j]) || isDigit(text[j]))) continue;
    found.insert(w);
  }
  return found;
}

// What is wrong with one rendered output, or "". Words the input itself
// holds (a quantity named `nan`) may appear in the output.
std::string checkOutput(const std::string& format, const std::string& out, const std::string& input) {
  const size_t bad_utf8 = findInvalidUtf8(out);
  if (bad_utf8 != std::string::npos)
    return format + " output is not UTF-8 at byte " + std::to_string(bad_utf8);
  for (size_t i = 0; i < out.size(); ++i) {
    const unsigned char c = static_cast<unsigned char>(out[i]);
    if ((c < 0x20 && c != '\n' && c != '\t') || c == 0x7F) {
      const size_t from = i < 30 ? 0 : i - 30;
      return format + " output holds the control byte " + shown(out.substr(i, 1)) + " (in \"" +
             shown(std::string_view(out).substr(from, 60)) + "\")";
    }
  }
  const std::set<std::string> in_input = nonFiniteWords(input);
  for (const std::string& w : nonFiniteWords(out)) {
    if (in_input.count(w)) continue;
    const size_t at = [&] {
      for (size_t i = 0; i + 3 <= out.size(); ++i)
        if (lower(out[i]) == w[0] && lower(out[i + 1]) == w[1] && lower(out[i + 2]) == w[2] &&
            (i == 0 || !isLetter(out[i - 1])))
          return i;
      return size_t{0};
    }();
    const size_t from = at < 40 ? 0 : at - 40;
    return format + " output shows a number that is not finite: \"" +
           shown(std::string_view(out).substr(from, 80)) + "\"";
  }
  return "";
}

// Length of the number at the start of `s` as a literal may be written
// (`-12`, `0.5`, `.5`, `1e-3`, `2.E+9`), 0 when there is none.
size_t literalLength(std::string_view s) {
  size_t i = 0;
  if (i < s.size() && s[i] == '-') ++i;
  const size_t digits_from = i;
  while (i < s.size() && isDigit(s[i])) ++i;
  size_t mantissa_digits = i - digits_from;
  if (i < s.size() && s[i] == '.') {
    ++i;
    const size_t f = i;
    while (i < s.size() && isDigit(s[i])) ++i;
    mantissa_digits += i - f;
  }
  if (mantissa_digits == 0) return 0;
  if (i < s.size() && (s[i] == 'e' || s[i] == 'E')) {
    size_t k = i + 1;
    if (k < s.size() && (s[k] == '-' || s[k] == '+')) ++k;
    const size_t e = k;
    while (k < s.size() && isDigit(s[k])) ++k;
    if (k > e) i = k;
  }
  return i;
}

// What is wrong with `text` as formatNumber's output for `want` at `digits`:
// `-?D+(.D+)?(e-?D+)?`, an exponent a multiple of 3 with a mantissa in
// [1, 1000), and a value within rounding of `want`.
std::string checkFormatted(const std::string& text, double want, int digits) {
  size_t i = 0;
  if (i < text.size() && text[i] == '-') ++i;
  const size_t int_from = i;
  while (i < text.size() && isDigit(text[i])) ++i;
  bool ok = i > int_from;
  if (ok && i < text.size() && text[i] == '.') {
    const size_t f = ++i;
    while (i < text.size() && isDigit(text[i])) ++i;
    ok = i > f;
  }
  const size_t mantissa_end = i;
  long exponent = 0;
  bool has_exponent = false;
  if (ok && i < text.size() && text[i] == 'e') {
    has_exponent = true;
    size_t k = i + 1;
    if (k < text.size() && text[k] == '-') ++k;
    const size_t e = k;
    while (k < text.size() && isDigit(text[k])) ++k;
    ok = k > e && k - e < 5;
    if (ok) exponent = std::strtol(text.c_str() + i + 1, nullptr, 10);
    i = k;
  }
  if (!ok || i != text.size()) return "the number \"" + shown(text) + "\" is malformed";
  if (has_exponent) {
    // The mantissa is read as text: with 17 digits "999.99999999999998" is
    // below 1000 as written, though strtod rounds it to 1000.
    const size_t int_end = std::min(text.find('.', int_from), mantissa_end);
    const size_t int_digits = int_end - int_from;
    if (exponent % 3 != 0 || int_digits < 1 || int_digits > 3 || text[int_from] == '0')
      return "the number \"" + shown(text) + "\" is not in engineering notation";
  }
  const double read = std::strtod(text.c_str(), nullptr);
  // Half a unit in the last shown digit, doubled for margin; the reading back
  // of a subnormal is exact only to the smallest double.
  const double rel = std::max(std::pow(10.0, 1 - std::clamp(digits, 1, 17)), 4e-16);
  if (!(std::fabs(read - want) <= rel * std::fabs(want) + 2 * 4.9406564584124654e-324))
    return "the number \"" + shown(text) + "\" stands for " + formatExact(want);
  return "";
}

std::string formatExactText(double v) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.17g", v);
  return buf;
}

// A side of a check: a literal as written or a formatted number, then the unit.
// Past a literal's end `n`: the end of a fraction written before a unit
// ("1/8 in", "1-1/2 in"; docs/format.md), or `n` when there is none.
size_t fractionEnd(std::string_view s, size_t n) {
  const auto digits = [&](size_t k) {
    while (k < s.size() && isDigit(s[k])) ++k;
    return k;
  };
  size_t i = n;
  if (i < s.size() && s[i] == '-') {
    const size_t j = digits(i + 1);
    if (j == i + 1 || j >= s.size() || s[j] != '/') return n;
    i = j;
  }
  if (i >= s.size() || s[i] != '/') return n;
  const size_t j = digits(i + 1);
  return j > i + 1 ? j : n;
}

std::string checkSide(const std::string& name, const std::string& side) {
  const size_t literal = literalLength(side);
  const size_t n = literal == 0 ? 0 : fractionEnd(side, literal);
  if (n == 0) return "the check `" + name + "` shows the side \"" + shown(side) + "\", which is no number";
  if (n < side.size() && side[n] != ' ' && static_cast<unsigned char>(side[n]) < 0x80)
    return "the check `" + name + "` shows the side \"" + shown(side) + "\", a malformed number";
  return "";
}

std::string checkDiagnostics(const Calculation& calc, const SourceFile& file) {
  for (const Diagnostic& d : calc.diags.list()) {
    const std::string h = d.headline();
    const std::string word = d.severity == Severity::Error ? "error" : "warning";
    const std::string prefix = std::string(kPath) + ":" + std::to_string(d.line > 0 ? d.line : 1) + ":" +
                               std::to_string(d.line > 0 ? d.column : 1) + ": " + word + ": ";
    if (h.rfind(prefix, 0) != 0 || h.size() == prefix.size())
      return "a diagnostic is not in FILE:LINE:COL form: \"" + shown(h) + "\"";
    if (d.line < 0 || d.line > file.lineCount() || (d.line > 0 && d.column < 1))
      return "a diagnostic points outside the file: \"" + shown(h) + "\"";
  }
  return "";
}

// The trail at `digits`: every shown value well formed and close to its value,
// and every shown text (the value with its unit) starting with that number.
std::string checkTrail(const Calculation& calc, const Trail& trail, int digits) {
  for (const TrailStep& step : trail.steps) {
    if (!step.ok) continue;
    const QuantityView s = calc.quantity(step.index);
    const std::string value = numberText(step.result.number);
    const std::string why = checkFormatted(value, s.display.fromSI(s.si), digits);
    if (!why.empty()) return "`" + step.name + "` at " + std::to_string(digits) + " digits: " + why;
    const std::string result = valueText(step.result);
    if (result.rfind(value, 0) != 0)
      return "`" + step.name + "` shows the result \"" + shown(result) + "\" for the value " + value;
  }
  for (const TrailCheck& c : trail.checks) {
    if (!c.ok) continue;
    for (const TrailValue* side : {&c.lhs, &c.rhs}) {
      const std::string why = checkSide(c.name, valueText(*side));
      if (!why.empty()) return why;
    }
  }
  return "";
}

std::string checkJson(const Calculation& calc, const std::string& text) {
  test::Json root;
  std::string error;
  if (!test::parseJson(text, &root, &error)) return "the JSON does not parse: " + error;
  if (root.type != test::Json::Object) return "the JSON is not an object";
  for (const char* key : {"quantities", "checks", "warnings"})
    if (!root.has(key) || root[key].type != test::Json::Array)
      return std::string("the JSON has no array ") + key;
  const test::Json& qs = root["quantities"];
  if (qs.array.size() != calc.sheet.quantities.size()) return "the JSON lists another number of quantities";
  for (size_t i = 0; i < qs.array.size(); ++i) {
    const test::Json& q = qs[i];
    const Quantity& sq = calc.sheet.quantities[i];
    const QuantityView s = calc.quantity(i);
    for (const char* key : {"name", "unit", "formula", "description"})
      if (!q.has(key) || q[key].type != test::Json::String)
        return "the JSON quantity `" + sq.name + "` has no string " + key;
    for (const char* key : {"value", "si"})
      if (!q.has(key) || q[key].type != test::Json::Number)
        return "the JSON quantity `" + sq.name + "` has no number " + key;
    if (q["name"].string != sq.name) return "the JSON names quantity " + std::to_string(i) + " otherwise";
    if (!sameBits(q["si"].number, s.si))
      return "the JSON gives `" + sq.name + "` si " + formatExactText(q["si"].number) + ", not " +
             formatExactText(s.si);
    if (!sameBits(q["value"].number, s.display.fromSI(s.si)))
      return "the JSON gives `" + sq.name + "` value " + formatExactText(q["value"].number) + ", not " +
             formatExactText(s.display.fromSI(s.si));
  }
  const test::Json& cs = root["checks"];
  if (cs.array.size() != calc.sheet.checks.size()) return "the JSON lists another number of checks";
  for (size_t k = 0; k < cs.array.size(); ++k) {
    const test::Json& c = cs[k];
    if (!c.has("name") || c["name"].string != calc.sheet.checks[k].name || !c.has("passed") ||
        c["passed"].type != test::Json::Bool || c["passed"].boolean != calc.checkResult(k).passed)
      return "the JSON check " + std::to_string(k) + " is not `" + calc.sheet.checks[k].name +
             "` as evaluated";
  }
  return "";
}

// One line of a parsed sheet in the terms of its meaning, for comparing a
// sheet with its canonical text.
std::vector<std::string> meaningOf(Sheet* sheet) {
  for (Quantity& q : sheet->quantities) canonicalizeUnits(q.expr.get());
  for (Use& u : sheet->uses)
    for (UseBinding& b : u.bindings) canonicalizeUnits(b.expr.get());
  for (Check& c : sheet->checks) {
    canonicalizeUnits(c.lhs.get());
    canonicalizeUnits(c.rhs.get());
  }
  for (LoadCase& c : sheet->cases)
    for (CaseReplacement& r : c.replacements) canonicalizeUnits(r.expr.get());
  for (SheetStudy& st : sheet->studies)
    for (ExprPtr& v : st.values) canonicalizeUnits(v.get());
  std::vector<std::string> lines;
  for (const Statement& st : sheet->statements) {
    std::string line;
    switch (st.kind) {
      case Statement::Blank: continue;
      case Statement::Invalid: line = "invalid"; break;
      case Statement::Comment: line = "comment " + st.text(); break;
      case Statement::Meta: line = "meta " + st.key() + ": " + st.text(); break;
      case Statement::Section: line = "section " + st.text(); break;
      case Statement::Note: line = "note " + st.text(); break;
      case Statement::Define: {
        const Quantity& q = sheet->quantities[st.index];
        const std::string expr = q.expr ? renderExpr(*q.expr) : "";  // none for a required parameter
        const std::string pretty = q.expr ? renderExpr(*q.expr, nullptr, true) : "";
        line = "define " + q.name + " | " + canonicalDefinition(q) + " | " + expr + " | " + pretty + " | " +
               q.section + " | # " + q.description;
        break;
      }
      case Statement::UseStmt: {
        const Use& u = sheet->uses[st.index];
        line = "use " + canonicalUse(u) + " | " + u.section + " | # " + u.description;
        break;
      }
      case Statement::CaseStmt: {
        const LoadCase& c = sheet->cases[st.index];
        line = "case " + c.name;
        for (const CaseReplacement& r : c.replacements) line += " | " + r.name + " = " + renderExpr(*r.expr);
        line += " | # " + c.description;
        break;
      }
      case Statement::StudyStmt: {
        const SheetStudy& study = sheet->studies[st.index];
        line = "study " + canonicalStudyLine(study) + " | " + study.section + " | # " + study.description;
        break;
      }
      case Statement::CheckStmt: {
        const Check& c = sheet->checks[st.index];
        line = "check " + c.name + " | " + canonicalCondition(c) + " | " + renderExpr(*c.lhs) + " " +
               comparisonText(c.op) + " " + renderExpr(*c.rhs) + " | " + c.section + " | # " + c.description;
        break;
      }
    }
    lines.push_back(line);
  }
  return lines;
}

std::string firstError(const Diagnostics& d) {
  for (const Diagnostic& x : d.list())
    if (x.severity == Severity::Error) return x.headline();
  return "";
}

std::string checkDiffOutputs(const SheetDiff& d, const std::string& input) {
  for (const int digits : {4, 1}) {
    std::string why = checkOutput("diff text", renderDiffText(d, digits), input);
    if (why.empty()) why = checkOutput("diff Markdown", renderDiffMarkdown(d, digits), input);
    if (!why.empty()) return why;
  }
  const std::string json = renderDiffJson(d);
  test::Json root;
  std::string error;
  if (!test::parseJson(json, &root, &error)) return "the diff JSON does not parse: " + error;
  return checkOutput("diff JSON", json, input);
}

}  // namespace

std::string unitParserHolds(std::string_view bytes) {
  Unit unit;
  UnitError err;
  if (!parseUnit(bytes, &unit, &err)) {
    if (err.message.empty()) return "the unit \"" + shown(bytes) + "\" is refused without a message";
    if (err.offset > bytes.size())
      return "the unit error for \"" + shown(bytes) + "\" points past the text (offset " +
             std::to_string(err.offset) + ")";
    return "";
  }
  if (!std::isfinite(unit.factor) || !(unit.factor > 0) || !std::isfinite(unit.offset))
    return "the unit \"" + shown(bytes) + "\" has factor " + formatExactText(unit.factor) + " and offset " +
           formatExactText(unit.offset);
  if (unit.text.empty()) return "the unit \"" + shown(bytes) + "\" has no canonical spelling";
  Unit again;
  if (!parseUnit(unit.text, &again, &err))
    return "the canonical spelling \"" + shown(unit.text) + "\" of \"" + shown(bytes) +
           "\" does not read back: " + err.message;
  if (!(again.dim == unit.dim) || !sameBits(again.offset, unit.offset) ||
      !(std::fabs(again.factor - unit.factor) <= 1e-12 * unit.factor))
    return "the canonical spelling \"" + shown(unit.text) + "\" of \"" + shown(bytes) + "\" is another unit";
  if (again.text != unit.text)
    return "the canonical spelling \"" + shown(unit.text) + "\" spells itself \"" + shown(again.text) + "\"";
  return "";
}

std::string pipelineHolds(const std::string& bytes) {
  auto calc = Calculation::fromText(kPath, bytes);
  if (!calc) return "Calculation::fromText gave nothing";
  const SourceFile file(kPath, bytes);
  std::string why = checkDiagnostics(*calc, file);
  if (!why.empty() || calc->hasErrors()) return why;
  for (size_t i = 0; i < calc->quantityCount(); ++i) {
    const QuantityView s = calc->quantity(i);
    if (!s.ok || !std::isfinite(s.si))
      return "`" + calc->sheet.quantities[i].name + "` has no finite value, and no error says why";
  }
  for (size_t k = 0; k < calc->checkCount(); ++k) {
    const CheckView s = calc->check(k);
    if (!s.ok || !std::isfinite(s.lhs) || !std::isfinite(s.rhs))
      return "the check `" + calc->sheet.checks[k].name + "` has no finite sides, and no error says why";
  }
  for (const int digits : {1, 17}) {
    why = checkTrail(*calc, buildTrail(*calc, digits), digits);
    if (!why.empty()) return why;
  }
  const Trail trail = buildTrail(*calc, 4);
  why = checkTrail(*calc, trail, 4);
  if (why.empty()) why = checkOutput("text", renderText(trail), bytes);
  if (why.empty()) why = checkOutput("Markdown", renderMarkdown(trail), bytes);
  if (why.empty()) why = checkOutput("HTML", renderHtml(trail), bytes);
  if (why.empty()) {
    const std::string json = renderJson(*calc, trail);
    why = checkJson(*calc, json);
    if (why.empty()) why = checkOutput("JSON", json, bytes);
  }
  if (why.empty()) {
    // A large sheet's trail builds its steps when they are read: the same bytes as kept ones.
    const Trail built = buildTrail(*calc, 4, TrailKeep::None);
    for (const ReportFormat& f : reportFormats())
      if (why.empty() && renderReport(built, f.name) != renderReport(trail, f.name))
        why = std::string("the ") + f.name + " report differs when the trail's steps are built as they are read";
  }
  return why;
}

std::string formatRoundTripHolds(const std::string& bytes) {
  Diagnostics parsed;
  Sheet sheet = parseSheet(std::make_shared<SourceFile>(kPath, bytes), &parsed);
  Diagnostics formatted;
  const std::string text = formatWorksheet(kPath, bytes, &formatted);
  if (parsed.hasErrors()) {
    if (!text.empty() || !formatted.hasErrors()) return "fmt formatted a sheet that does not parse";
    return "";
  }
  if (formatted.hasErrors()) return "fmt fails on a sheet that parses: " + shown(firstError(formatted));
  const size_t bad = findInvalidUtf8(text);
  if (bad != std::string::npos) return "the canonical text is not UTF-8 at byte " + std::to_string(bad);
  if (!text.empty() && text.back() != '\n') return "the canonical text does not end with a line end";
  if (text.find('\r') != std::string::npos) return "the canonical text holds a CR";

  Diagnostics reparsed;
  Sheet again = parseSheet(std::make_shared<SourceFile>(kPath, text), &reparsed);
  if (reparsed.hasErrors()) return "the canonical text does not parse: " + shown(firstError(reparsed));
  const std::vector<std::string> before = meaningOf(&sheet), after = meaningOf(&again);
  for (size_t i = 0; i < before.size() || i < after.size(); ++i) {
    const std::string a = i < before.size() ? before[i] : "(nothing)";
    const std::string b = i < after.size() ? after[i] : "(nothing)";
    if (a != b) return "fmt changes \"" + shown(a) + "\" into \"" + shown(b) + "\"";
  }

  Diagnostics twice;
  const std::string text2 = formatWorksheet(kPath, text, &twice);
  if (twice.hasErrors()) return "fmt fails on its own output: " + shown(firstError(twice));
  if (text2 != text) return "fmt of the canonical text changes it again";

  auto a = Calculation::fromText(kPath, bytes), b = Calculation::fromText(kPath, text);
  if (a->diags.errorCount() != b->diags.errorCount() || a->diags.warningCount() != b->diags.warningCount())
    return "the canonical text calculates with other diagnostics (" + std::to_string(a->diags.errorCount()) +
           " errors, " + std::to_string(a->diags.warningCount()) + " warnings before; " +
           std::to_string(b->diags.errorCount()) + " and " + std::to_string(b->diags.warningCount()) +
           " after)";
  if (a->hasErrors()) return "";
  for (size_t i = 0; i < a->quantityCount(); ++i)
    if (!sameBits(a->si(i), b->si(i)) || a->display(i).text != b->display(i).text)
      return "`" + a->sheet.quantities[i].name + "` calculates otherwise from the canonical text";
  for (size_t k = 0; k < a->checkCount(); ++k)
    if (a->checkResult(k).passed != b->checkResult(k).passed ||
        !sameBits(a->checkResult(k).lhs, b->checkResult(k).lhs) ||
        !sameBits(a->checkResult(k).rhs, b->checkResult(k).rhs))
      return "the check `" + a->sheet.checks[k].name + "` evaluates otherwise from the canonical text";
  return "";
}

std::string selfDiffHolds(const std::string& bytes) {
  auto a = Calculation::fromText(kPath, bytes), b = Calculation::fromText(kPath, bytes);
  std::string da, db;
  for (const Diagnostic& d : a->diags.list()) da += d.render();
  for (const Diagnostic& d : b->diags.list()) db += d.render();
  if (da != db) return "the same bytes calculate with other diagnostics the second time";
  if (a->hasErrors()) return "";
  if (renderText(buildTrail(*a, 4)) != renderText(buildTrail(*b, 4)))
    return "the same bytes give another trail the second time";
  const SheetDiff d = diffCalculations(a.get(), b.get(), 0.0);
  // Its only entries are the checks that fail, as written and in each load
  // case that calculates, each listed as still failing.
  size_t failing = 0;
  for (size_t k = 0; k < a->checkCount(); ++k) failing += a->checkResult(k).passed ? 0 : 1;
  for (const CaseRun& run : a->cases)
    if (run.ok())
      for (const CheckResult& r : run.results.checks) failing += r.passed ? 0 : 1;
  if (d.still_failing.size() != failing)
    return "a sheet diffed with itself lists " + std::to_string(d.still_failing.size()) +
           " checks as still failing, not its " + std::to_string(failing) + " failing checks";
  SheetDiff rest = d;
  rest.still_failing.clear();
  if (!rest.empty() || rest.somethingMoved()) {
    std::string what = d.flipped.size() ? "a flipped check" : d.inputs.size() ? "a changed input"
                     : d.formulas.size() ? "a changed formula" : d.moved.size() ? "a moved result"
                     : d.added.size() || d.removed.size() ? "an added or removed quantity"
                     : d.checks_added.size() || d.checks_removed.size() ? "an added or removed check"
                     : d.new_warnings.size() ? "a new warning" : "a metadata change";
    return "a sheet diffed with itself shows " + what;
  }
  return checkDiffOutputs(d, bytes);
}

std::string expectationHolds(const std::string& bytes) {
  const std::string tag = "# fuzz-expect: ";
  if (bytes.rfind(tag, 0) != 0) return "";
  const size_t eol = bytes.find_first_of("\r\n");
  const std::string rest =
      bytes.substr(tag.size(), eol == std::string::npos ? std::string::npos : eol - tag.size());
  const size_t space = rest.find(' ');
  const std::string kind = rest.substr(0, space);
  const std::string text = space == std::string::npos ? "" : rest.substr(space + 1);
  auto calc = Calculation::fromText(kPath, bytes);
  if (kind == "clean") {
    return calc->hasErrors() ? "expected no error, got: " + shown(firstError(calc->diags)) : "";
  }
  if (kind != "error" && kind != "diagnostic") return "unknown expectation `" + shown(kind) + "`";
  for (const Diagnostic& d : calc->diags.list()) {
    if (kind == "error" && d.severity != Severity::Error) continue;
    if (d.message.find(text) != std::string::npos) return "";
  }
  std::string got;
  for (const Diagnostic& d : calc->diags.list()) got += (got.empty() ? "" : "; ") + d.headline();
  return "expected " + std::string(kind == "error" ? "an error" : "an error or a warning") +
         (text.empty() ? "" : " saying \"" + text + "\"") + ", got " +
         (got.empty() ? "none" : "\"" + shown(got) + "\"");
}

}  // namespace calctrail::fuzz
