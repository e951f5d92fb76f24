// What changed between two revisions of a worksheet, in the terms a checker
// reviews: checks that flipped, inputs, formulas, results that moved, names
// added and removed, new warnings. Both calculations must be free of errors.
#pragma once

#include <string>
#include <vector>

#include "engine/calculation.h"
#include "engine/units/unit.h"

namespace calctrail {

struct ValueChange {
  std::string name;
  std::string description;    // the new side's
  double old_si = 0.0, new_si = 0.0;
  Unit unit;                  // the new side's display unit: both values are shown in it
  Unit old_unit;              // the old side's, needed only when the dimension changed
  bool same_dimension = true;
  // (new - old) / |old|: +inf or -inf from zero; NaN when the dimension changed.
  double relative = 0.0;
  bool moved = false;         // beyond the relative tolerance
  std::string old_formula, new_formula;  // canonical "NAME [UNIT] = EXPR"
  // A side defined by one literal, as written ("0.15", "20 ksi"); "" otherwise.
  std::string old_written, new_written;
};

struct FormulaChange {
  std::string name;
  bool is_check = false;
  std::string old_text, new_text;  // canonical definitions or conditions
};

struct QuantityEntry {
  std::string name;
  std::string formula;  // canonical definition
  std::string description;
  double si = 0.0;
  Unit unit;
  bool input = false;
};

struct CheckEntry {
  std::string name;
  std::string condition;  // canonical "LHS OP RHS"
  std::string description;
  std::string op;
  bool passed = false;
  double lhs = 0.0, rhs = 0.0;  // SI
  Unit unit;
  // Both sides as written, owned by the Calculation (a literal is shown as written).
  const Expr* lhs_expr = nullptr;
  const Expr* rhs_expr = nullptr;
};

struct CheckFlip {
  CheckEntry now;       // the new side: condition, values, state
  double old_lhs = 0.0, old_rhs = 0.0;
  Unit old_unit;
  const Expr* old_lhs_expr = nullptr;  // the old side's, owned by its Calculation
  const Expr* old_rhs_expr = nullptr;
  std::string in_case;  // the load case it fails in; empty for the sheet as written
};

struct MetaChange {
  std::string key, old_value, new_value;
};

// What moved in one load case that both sides define, its values against
// its own values on the old side.
struct CaseDiff {
  /// The case's name.
  std::string name;
  /// Checks whose result in this case flipped.
  std::vector<CheckFlip> flipped;
  /// Quantities whose value in this case moved beyond rtol, largest relative change first.
  std::vector<ValueChange> moved;
  /// The case could not be calculated on a side: its values are not compared.
  bool not_compared = false;
};

struct SheetDiff {
  std::string old_name, new_name;
  double rtol = 0.0;
  std::vector<CheckFlip> flipped;         // new side's document order
  std::vector<CheckFlip> still_failing;   // checks that fail on both sides (as written, then by case), new side's order
  std::vector<ValueChange> inputs;        // given values whose text or value changed
  std::vector<FormulaChange> formulas;    // definitions and checks rewritten (not a given value re-given)
  std::vector<ValueChange> moved;         // results beyond rtol, largest relative change first
  std::vector<QuantityEntry> added, removed;
  std::vector<CheckEntry> checks_added, checks_removed;
  std::vector<std::string> new_warnings;  // FILE:LINE:COL: warning: ... of the new side
  std::vector<MetaChange> meta;
  // Load cases (their changed lines are in `formulas`, named "case NAME"):
  bool has_cases = false;                          // either side has load cases
  std::vector<std::string> cases_added, cases_removed;  // "case NAME: ..." canonical lines
  std::vector<CaseDiff> cases;                     // cases on both sides where something moved
  std::vector<std::string> modified_by;  // --set NAME=VALUE applied to both sides, as typed

  // A number moved: a check flipped, an input or a result moved beyond rtol,
  // or a quantity or check came or went. Decides the exit status of `diff`.
  bool somethingMoved() const;
  // Nothing at all to report.
  bool empty() const;
  // A check fails on the new side (flipped to FAIL, still failing, or added
  // failing): `diff` then exits 1 as `check` would, even with nothing changed.
  bool checksFail() const;
};

// Relative change of `now` against `was`, as defined for ValueChange::relative.
double relativeChange(double was, double now);
// Whether two values differ by more than rtol relative to the larger of them.
bool movedBeyond(double was, double now, double rtol);

// Compares two calculated worksheets. The expressions' unit spellings are made
// canonical in place first, so a reformatted line never shows as a change.
SheetDiff diffCalculations(Calculation* old_calc, Calculation* new_calc, double rtol);

}  // namespace calctrail
