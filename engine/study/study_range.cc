#include "engine/study/study_range.h"

#include <cmath>
#include <memory>

#include "engine/eval/dimension_check.h"
#include "engine/eval/evaluator.h"
#include "engine/eval/tree_eval.h"
#include "engine/report/number_format.h"
#include "engine/sheet/expr_parser.h"
#include "engine/study/upstream.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

namespace {

// [*b, *e) without the spaces at either end.
void trim(const std::string& s, uint32_t* b, uint32_t* e) {
  while (*b < *e && s[*b] == ' ') ++*b;
  while (*e > *b && s[*e - 1] == ' ') --*e;
}

// The byte ranges of the comma-separated parts of [b, e), at parenthesis depth 0.
std::vector<std::pair<uint32_t, uint32_t>> splitList(const std::string& s, uint32_t b, uint32_t e) {
  std::vector<std::pair<uint32_t, uint32_t>> parts;
  int depth = 0;
  uint32_t start = b;
  for (uint32_t i = b; i < e; ++i) {
    if (s[i] == '(' || s[i] == '[') ++depth;
    if (s[i] == ')' || s[i] == ']') --depth;
    if (s[i] == ',' && depth == 0) {
      parts.push_back({start, i});
      start = i + 1;
    }
  }
  parts.push_back({start, e});
  return parts;
}

bool valueList(const Model& m, const StudyInput& input, const SourceFile& file, uint32_t b, uint32_t e,
               Diagnostics* diags, std::vector<double>* out) {
  bool ok = true;
  for (auto [pb, pe] : splitList(file.bytes(), b, e)) {
    trim(file.bytes(), &pb, &pe);
    if (pb == pe) {
      diags->error(file, pb, pb + 1, "an empty value in the list; write V1, V2, ... with a unit on each");
      ok = false;
      continue;
    }
    double v = 0;
    if (parseStudyValue(m, input, file, pb, pe, diags, &v))
      out->push_back(v);
    else
      ok = false;
  }
  return ok;
}

std::string valueText(double si, const Unit& unit) {
  return formatQuantity(si, unit, 4);
}

}  // namespace

bool resolveStudyInput(const Model& m, const Inputs& inputs, const SourceFile& file, uint32_t begin,
                       uint32_t end, Diagnostics* diags, StudyInput* out) {
  trim(file.bytes(), &begin, &end);
  const std::string name = file.bytes().substr(begin, end - begin);
  if (name.empty()) {
    diags->error(file, begin, begin + 1, "the name of the input to vary is missing");
    return false;
  }
  const Slot slot = m.find(name);
  if (!slot.valid()) {
    std::vector<std::string> names;
    for (const Quantity& q : m.sheet().quantities) names.push_back(q.name);
    std::string msg = "the worksheet defines no quantity `" + name + "`";
    const auto near = nearestWords(name, names);
    if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
    diags->error(file, begin, end, msg);
    return false;
  }
  if (!isGivenValue(m, inputs, slot)) {
    std::vector<std::string> given;
    for (Slot s : upstreamInputs(m, inputs, slot)) given.push_back(m.quantity(s).name);
    std::string msg = "`" + name +
                      "` is calculated from other quantities, not a given value; a study varies " +
                      "given values";
    if (!given.empty()) msg += ": for `" + name + "`, one of " + quotedList(given);
    diags->error(file, begin, end, msg);
    return false;
  }
  out->slot = slot;
  out->name = name;
  out->unit = *m.slot(slot).display;
  return true;
}

bool parseStudyValue(const Model& m, const StudyInput& input, const SourceFile& file, uint32_t begin,
                     uint32_t end, Diagnostics* diags, double* si) {
  ExprParser parser(file, begin, end, diags);
  ExprPtr expr = parser.parseWhole();
  if (!expr) return false;
  bool reads = false;
  forEachName(*expr, [&](const Expr& x) {
    if (!reads)
      diags->error(
          file, x.begin, x.end,
          "a value of a study is a literal with a unit (`20 mm`), not a formula reading `" + x.text + "`");
    reads = true;
  });
  if (reads) return false;
  DimensionChecker checker(file, diags, m.sheet(), m.dims(), m.known(), m.library(), &m.temperatures());
  TreeDims dims;
  if (!checker.check(*expr, &dims)) return false;
  const SlotInfo& info = m.slot(input.slot);
  const Dimension dim = quantityDimension(dims.of(*expr));
  if (info.has_dim && dim != info.dim) {
    diags->error(file, expr->begin, expr->end,
                 "`" + input.name + "` is " + info.dim.describe() + " in the worksheet, but `" +
                     file.bytes().substr(expr->begin, expr->end - expr->begin) + "` is " + dim.describe());
    return false;
  }
  // The same arithmetic as --set (Inputs::set): the program of the literal, run once.
  const Program program = compileProgram(*expr, dims.view(), m.sheet(), m.library());
  double v = NAN;
  try {
    Evaluator once;
    v = once.run(program, {});
  } catch (const std::exception&) {
    v = NAN;
  }
  if (!std::isfinite(v)) {
    EvalFault fault;
    evalTree(
        *expr, dims.view(), [](const Expr&) { return NAN; }, &fault, m.library());
    const Expr& at = fault.node ? *fault.node : *expr;
    diags->error(file, at.begin, at.end,
                 "the value cannot be calculated: " +
                     (fault.node ? fault.message : std::string("it is not a finite number")));
    return false;
  }
  *si = v;
  return true;
}

bool parseVary(const Model& m, const Inputs& inputs, const std::string& text, int steps, bool log,
               Diagnostics* diags, StudyRange* out) {
  const SourceFile file("--vary", text);
  const size_t eq = text.find('=');
  if (eq == std::string::npos) {
    diags->error(file, 0, static_cast<uint32_t>(text.size()),
                 "--vary takes NAME=FROM..TO or NAME=V1, V2, ..., as in --vary \"d=20 mm..60 mm\"");
    return false;
  }
  if (!resolveStudyInput(m, inputs, file, 0, static_cast<uint32_t>(eq), diags, &out->input)) return false;
  const uint32_t vb = static_cast<uint32_t>(eq + 1), ve = static_cast<uint32_t>(text.size());
  const size_t dots = text.find("..", vb);
  out->values.clear();
  if (dots == std::string::npos) return valueList(m, out->input, file, vb, ve, diags, &out->values);

  const uint32_t db = static_cast<uint32_t>(dots);
  double from = 0, to = 0;
  uint32_t fb = vb, fe = db, tb = db + 2, te = ve;
  trim(text, &fb, &fe);
  trim(text, &tb, &te);
  if (fb == fe || tb == te) {
    diags->error(file, db, db + 2, "a range needs a value at both ends: FROM..TO, as in 20 mm..60 mm");
    return false;
  }
  const bool ok_from = parseStudyValue(m, out->input, file, fb, fe, diags, &from);
  const bool ok_to = parseStudyValue(m, out->input, file, tb, te, diags, &to);
  if (!ok_from || !ok_to) return false;
  if (steps < 2) {
    diags->error(file, fb, te,
                 "--steps " + std::to_string(steps) +
                     ": a range needs 2 points or more (--steps counts both "
                     "ends; the default is 11)");
    return false;
  }
  if (from == to) {
    diags->error(file, fb, te,
                 "the range starts and ends at " + valueText(from, out->input.unit) +
                     ": it holds one value (write it as a list to study one point)");
    return false;
  }
  if (log && !(from * to > 0)) {
    diags->error(file, fb, te,
                 "--log steps need both ends of one sign and not zero; this range goes from " +
                     valueText(from, out->input.unit) + " to " + valueText(to, out->input.unit));
    return false;
  }
  const double n = static_cast<double>(steps - 1);
  for (int i = 0; i < steps; ++i) {
    const double t = static_cast<double>(i) / n;
    double v = log ? from * std::exp(std::log(to / from) * t) : from + (to - from) * t;
    if (i == 0) v = from;
    if (i == steps - 1) v = to;  // the ends exactly as written, whatever the rounding
    out->values.push_back(v);
  }
  return true;
}

bool parseBracket(const Model& m, const StudyInput& input, const std::string& text, const std::string& origin,
                  Diagnostics* diags, double* lo, double* hi) {
  const SourceFile file(origin, text);
  const size_t dots = text.find("..");
  const uint32_t end = static_cast<uint32_t>(text.size());
  if (dots == std::string::npos) {
    diags->error(file, 0, std::max<uint32_t>(end, 1),
                 origin + " takes LO..HI with units, as in " + origin + " \"10 kN..80 kN\"");
    return false;
  }
  uint32_t lb = 0, le = static_cast<uint32_t>(dots), hb = le + 2, he = end;
  trim(text, &lb, &le);
  trim(text, &hb, &he);
  if (lb == le || hb == he) {
    diags->error(file, static_cast<uint32_t>(dots), static_cast<uint32_t>(dots + 2),
                 "a bracket needs a value at both ends: LO..HI");
    return false;
  }
  const bool ok_lo = parseStudyValue(m, input, file, lb, le, diags, lo);
  const bool ok_hi = parseStudyValue(m, input, file, hb, he, diags, hi);
  if (!ok_lo || !ok_hi) return false;
  if (!(*lo < *hi)) {
    diags->error(file, lb, he,
                 "the bracket is empty: LO (" + valueText(*lo, input.unit) + ") must be below HI (" +
                     valueText(*hi, input.unit) + ")");
    return false;
  }
  return true;
}

bool parseValueList(const Model& m, const StudyInput& input, const std::string& text,
                    const std::string& origin, Diagnostics* diags, std::vector<double>* out) {
  const SourceFile file(origin, text);
  out->clear();
  return valueList(m, input, file, 0, static_cast<uint32_t>(text.size()), diags, out);
}

}  // namespace calctrail
