// The calculation trail: what every renderer shows, built once from a
// Calculation. Human wording (formulas, the verdict, check conditions) is
// made here so that every format says exactly the same thing; values stay
// numbers with their units, so each format writes them its own way (and
// JSON at full precision). A renderer reads a Trail and nothing else.
#pragma once

#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <fmt/format.h>

#include "engine/calculation.h"
#include "engine/report/number_format.h"

namespace calctrail {

// A value as the trail shows it: a number in a unit.
struct TrailValue {
  double value = 0;     // in the unit shown
  double si = 0;        // the same value in coherent SI units
  ShownNumber number;   // rounded to the trail's digits, or a literal as the worksheet writes it
  std::string unit;     // the unit for people ("N·m", "°"); "" or "1" for a plain number
};

// A line of text with values in it, such as "6.400 kN · 30.00 mm / 2":
// formula text and values, in order.
struct TrailPiece {
  std::string text;     // formula text ("· ", "(", " / 2"); empty for a value
  std::optional<TrailValue> value;  // the value this piece shows, if it is one
};
using TrailLine = std::vector<TrailPiece>;

struct TrailCall {        // one call of a library function in a formula
  std::string name;
  std::string signature;  // "torque_raise(F, dm, l, f, alpha)"
  std::string formula;    // the function's own formula (or its method in words)
  bool formula_is_expression = true;
  std::string pretty;     // the formula with the product dot: "F · dm / 2 ..."
  TrailLine arguments;    // "F = 21.18 kN, dm = 36.50 mm, ..."
  TrailLine substituted;  // the function's formula with the call's values
  bool show_substituted = false;  // substituted says more than pretty
  std::optional<TrailValue> result;  // "84.42 N·m"; none when the call could not be evaluated
  std::string source;
  std::string caution;
  // The function's formula as a tree (for typesetting), nullptr when the
  // formula is a method in words. Parsed once; lives as long as the program.
  const Expr* formula_expr = nullptr;
};

struct TrailStep {        // one quantity
  int index = 0;          // into the sheet's quantities
  std::string name;
  std::string description;
  std::string section;
  int line = 0;           // of its definition in the worksheet
  bool input = false;
  bool overridden = false;
  bool ok = false;          // has a value (result, substituted)
  std::string formula;      // as written, canonical spacing: "F * dm / 2"
  std::string pretty;       // with the product dot: "F · dm / 2"
  TrailLine substituted;    // "6.400 kN · 30.00 mm / 2"
  bool show_substituted = false;  // substituted says more than pretty and result
  TrailValue result;        // "15.94 N·m"
  // For a given value written as one literal in its display unit ("0.08",
  // "42 kN"): the literal as written, which the inputs list shows unrounded.
  std::optional<TrailValue> given;
  bool formula_in_notes = false;  // an input not given as one literal: its notes show the formula
  std::string unit;         // display unit, ASCII: "N*m"
  std::string unit_written; // the contract's unit: as declared in [ ] when declared, else `unit`
  bool unit_declared = false;
  std::string unit_pretty;  // "N·m"
  std::string si_unit;      // "kg*m^2/s^2"
  std::string dimension;    // "torque or energy"
  std::string origin;       // "given", "calculated; torque_raise: SOURCE", ...
  std::vector<TrailCall> calls;
  // The formula as a tree, for typeset formats (MathML). Owned by the
  // Calculation the trail was built from: valid while that lives.
  const Expr* expr = nullptr;
  /// The instance it belongs to (into Trail::instances); -1 for the main sheet's own.
  int instance = -1;
  /// The name within its instance ("T_raise" for "left.T_raise"); `name` for the main sheet's.
  /// Its formula is written in the names of the scope it stands in, so with local names.
  std::string local_name;
};

struct TrailCheck {
  int index = 0;
  std::string name;
  std::string description;
  std::string section;
  int line = 0;             // of the check in the worksheet
  std::string condition;    // "T_lower > 0 [N*m]" (conditionText)
  std::string op;           // ">"
  bool ok = false;          // both sides evaluated
  TrailValue lhs, rhs;      // "3.126 N·m", "0 N·m" (literals as written)
  std::string unit;         // ASCII unit both sides are shown in: "N*m"
  bool passed = false;
  // Both sides as trees, for typeset formats; owned by the Calculation.
  const Expr* lhs_expr = nullptr;
  const Expr* rhs_expr = nullptr;
  /// The instance it belongs to (into Trail::instances); -1 for the main sheet's own.
  int instance = -1;
};

struct TrailFile {        // a file the calculation read
  std::string path;       // relative to the main sheet's folder; the sheet itself by its name
  std::string sha256;
};

struct TrailInstanceParam {
  std::string name;       // the parameter's name in its template: "F"
  int step = 0;           // into steps: its value, unit and description
  std::string binding;    // the binding as written in the using sheet ("F_total / 2"); "" at its default
};

struct TrailInstance {    // a template used as an instance: its own part of the trail
  std::string name;       // dotted: "left", "drive.left"
  std::string title;      // the template's title, "" when it has none
  std::string path;       // the template file, relative to the main sheet's folder
  int parent = -1;        // the instance whose template uses this one; -1 for the main sheet
  std::string heading;    // "Instance left: Trapezoidal screw stage (templates/trapezoidal-screw.calc)"
  std::vector<TrailInstanceParam> params;
  std::vector<int> steps, checks;  // its own, in its template's order
};

struct TrailBlock {       // document order: headings, narrative, steps, checks
  // An instance's part follows the main sheet's blocks: its heading as a
  // Section, its parameters as a Note, then its steps and checks.
  enum Kind { Section, Note, Step, CheckRef } kind = Step;
  std::string text;       // Section title, Note paragraph
  int index = 0;          // into steps or checks
};

struct Trail {
  std::string title;
  std::vector<std::pair<std::string, std::string>> meta;  // key order of the format
  std::string path;
  std::string sha256;
  std::vector<TrailFile> files;   // every file read, the sheet first, then each template once
  std::vector<TrailInstance> instances;  // in the order they were brought in (a nested one after its user)
  int digits = 4;
  std::vector<TrailStep> steps;   // every quantity, document order
  std::vector<TrailCheck> checks;
  std::vector<TrailBlock> blocks;
  std::vector<std::string> warnings;  // FILE:LINE:COL: warning: ...
  std::vector<std::string> cautions;  // general, then those of functions used
  int passed = 0, failed = 0;
};

Trail buildTrail(const Calculation& calc, int digits);

// The caution every human report carries (screw drives lift and clamp loads).
const std::vector<std::string>& generalCautions();

// A check's condition as the worksheet writes it: "T_lower > 0 [N*m]".
std::string conditionText(const Check& check);

// The verdict in words, before the names of the failed checks (a renderer
// adds those in its own markup). Headline: "Checks: all 3 pass",
// "Checks: 1 of 3 FAIL:", "Checks: none in this worksheet". Sentence (HTML):
// "All 3 checks pass.", "1 of 3 checks fail:", "This worksheet has no design checks."
enum class VerdictForm { Headline, Sentence };
std::string verdictWords(const Trail& trail, VerdictForm form);

// A value or a line as text, its powers of ten in `style`. Formula text in
// a line (a literal such as 1e-3) gets the same style.
void appendValue(fmt::memory_buffer& out, const TrailValue& v, NumberStyle style);
std::string valueText(const TrailValue& v, NumberStyle style = NumberStyle::ENotation);
std::string lineText(const TrailLine& line, NumberStyle style = NumberStyle::ENotation);

}  // namespace calctrail
