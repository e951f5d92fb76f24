// The calculation trail: what every renderer shows, built once from a
// Calculation. Human wording (formulas, the verdict, check conditions) is
// made here so that every format says exactly the same thing; values stay
// numbers with their units, so each format writes them its own way (and
// JSON at full precision). A renderer reads a Trail and nothing else.
#pragma once

#include <cstddef>
#include <cstdint>
#include <iterator>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include <fmt/format.h>

#include "engine/calculation.h"
#include "engine/report/number_format.h"
#include "engine/study/pick.h"
#include "engine/study/sweep.h"

namespace calctrail {

// A value as the trail shows it: a number in a unit.
struct TrailValue {
  double value = 0;     // in the unit shown
  double si = 0;        // the same value in coherent SI units
  ShownNumber number;   // rounded to the trail's digits, or a literal as the worksheet writes it
  std::string unit;     // the unit for people ("N·m", "°"); "" or "1" for a plain number
};

// A line of text with values in it, such as "6.400 kN · 30.00 mm / 2":
// formula text and values, in order. One string with a mark byte where each
// value goes, and the values: a report of a large sheet holds one line per
// step and call, and a piece per run of text, each with room for a whole
// value, was a third of its memory (docs/performance.md). lineText() writes it.
class TrailLine {
 public:
  static constexpr char kValueMark = '\x1E';  // no worksheet or library text holds it

  TrailLine() = default;
  // `marked`: the text with a kValueMark where each of `values` goes, in order.
  TrailLine(std::string marked, std::vector<TrailValue> values)
      : text_(std::move(marked)), values_(std::move(values)) {}
  void addText(std::string_view text) { text_.append(text.data(), text.size()); }
  void addValue(TrailValue value) {
    text_ += kValueMark;
    values_.push_back(std::move(value));
  }
  void reserveValues(size_t n) { values_.reserve(n); }
  bool empty() const { return text_.empty(); }
  /// The text, each value's place one kValueMark.
  const std::string& marked() const { return text_; }
  /// The values, in the order of their marks.
  const std::vector<TrailValue>& values() const { return values_; }

 private:
  std::string text_;
  std::vector<TrailValue> values_;
};

// A node of a formula tree (a name, or a nested call) and the value shown in
// its place, so that a typeset format can set the substituted formula from
// the tree instead of from text.
struct TrailBinding {
  const Expr* node = nullptr;  // in the tree the binding belongs to
  TrailValue value;            // shown in its place
  bool negative = false;       // the value is below zero: a line puts it in parentheses
};

// One replacement made on the command line for this run (`--set f_high=0.10`).
struct TrailReplacement {
  std::string name;   // the quantity replaced
  std::string value;  // the text given after `=`, trimmed
  int line = 0;       // of the definition it replaces
};

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
  std::vector<TrailBinding> bindings;  // formula_expr's argument names and this call's values
  TrailLine with_values;  // the call with its argument values: "output_speed(1450 rpm, 20)"
  std::string row;        // a table lookup's row found: "Tr 48x8, ISO 2904 table"; "" otherwise
  bool trivial = false;   // no arguments: a constant by definition, shown by its value alone
  bool nested = false;    // an argument of another library call, shown there by its value
  bool whole = false;     // the step's whole formula: the step's own lines show it, no "where" line
};

// A library function the worksheet calls, shown once in "Library functions
// used" with its formula, limits, source and verification; the steps show
// only the call, the values and the result.
struct TrailFunction {
  std::string name;
  std::string signature;  // "torque_raise(F, dm, l, f, alpha)"
  std::string summary;    // one line from the library
  std::string method;  // the formula in worksheet syntax, or the method in words (a table without its rows)
  bool formula_is_expression = true;
  std::string pretty;     // the formula with the product dot
  const Expr* formula_expr = nullptr;  // for typesetting; lives as long as the program
  std::string limits;     // validity limits in words
  std::string source;     // the published source
  std::string verification;  // where its tests are listed: "docs/verification.md, `torque_raise`"
  bool trivial = false;   // a zero-argument constant: listed by its value, with no block
  std::string value;      // a trivial function's value as the trail shows it ("15.00°")
  std::vector<std::string> used_by;  // the quantities that call it, once each, in order
};

// A quantity's value in one load case, in the step's unit.
struct TrailCaseValue {
  /// The case calculated it (false: the case failed; its errors say why).
  bool ok = false;
  /// The case replaces the quantity's formula (with `formula`).
  bool replaced = false;
  /// The value, rounded for people, in the step's unit.
  TrailValue value;
  /// The formula in force in this case: the replacement, or the worksheet's.
  std::string formula;
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
  // The formula is one library call with a formula of its own (calls[0]):
  // the call's substituted formula continues the step's chain.
  bool single_call = false;
  std::vector<std::string> warnings;  // the worksheet's warnings on this line, messages only
  // The formula as a tree, for typeset formats (MathML). Owned by the
  // Calculation the trail was built from: valid while that lives.
  const Expr* expr = nullptr;
  // The tree `substituted` was made from, for typeset formats: `expr`, or a
  // copy of it (owned here) with every nested library call put as one value.
  const Expr* substituted_expr = nullptr;
  std::shared_ptr<const Expr> substituted_owner;
  std::vector<TrailBinding> bindings;  // substituted_expr's names (and nested calls) and their values
  /// The instance it belongs to (into Trail::instances); -1 for the main sheet's own.
  int instance = -1;
  /// The name within its instance ("T_raise" for "left.T_raise"); `name` for the main sheet's.
  /// Its formula is written in the names of the scope it stands in, so with local names.
  std::string local_name;
  /// Per load case (Trail::cases, the nominal first); empty when there are none.
  std::vector<TrailCaseValue> cases;
  /// Some case replaces it or gives it another value than the nominal.
  bool varies = false;
  /// An instance's given parameter (at its default, or bound to a literal) whose value,
  /// binding and description its part's parameter table shows: the Inputs list leaves it
  /// out rather than print the same value twice. One that varies by case or has a warning
  /// stays in the Inputs list too, which is where cases and warnings of inputs are shown.
  bool in_part_table = false;
};

// A check in one load case.
struct TrailCaseCheck {
  /// Both sides evaluated in this case.
  bool ok = false;
  /// The condition holds in this case.
  bool passed = false;
  /// The sides, in the check's unit (literals as written).
  TrailValue lhs, rhs;
  /// How far the condition is from failing: rhs - lhs for < and <=, lhs - rhs
  /// for > and >=, in the check's unit; negative when it fails.
  TrailValue margin;
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
  // How close the check is: utilisation = demand / capacity, the sense taken
  // from the comparison (`x <= limit`: x / limit; `x >= need`: need / x), so
  // above 1 fails. None when either side is not above zero; the margin
  // (capacity - demand, in `unit`; below zero fails) is then what is shown.
  std::optional<double> utilisation;
  TrailValue margin;
  std::string measure;      // "utilisation 55 %" or "margin 14.06 N·m"; "" when not evaluated
  std::vector<std::string> warnings;  // the worksheet's warnings on this line, messages only
  // Both sides as trees, for typeset formats; owned by the Calculation.
  const Expr* lhs_expr = nullptr;
  const Expr* rhs_expr = nullptr;
  /// Per load case (Trail::cases, the nominal first); empty when there are none.
  std::vector<TrailCaseCheck> cases;
  /// The case with the least margin (into Trail::cases), the one that governs
  /// the design; -1 when there are no cases or none evaluated the check.
  int governing = -1;
  /// The instance it belongs to (into Trail::instances); -1 for the main sheet's own.
  int instance = -1;
};

// A load case as the trail shows it.
struct TrailCase {
  /// "nominal" (the worksheet as written) first, then the worksheet's cases.
  std::string name;
  /// The text after `#` on the case line.
  std::string description;
  /// The line of the `case` statement; 0 for the nominal.
  int line = 0;
  /// The replacements as written canonically: "f = 0.15, f_c = 0.15"; "" for the nominal.
  std::string replacements;
  /// Every quantity and check was calculated; false: `errors` say why, and
  /// the case's values and checks are missing.
  bool ok = true;
  /// FILE:LINE:COL: error: case `overload`: ... (one per problem).
  std::vector<std::string> errors;
  /// Checks that pass and that fail (or could not be evaluated) in this case.
  int passed = 0, failed = 0;
};

struct TrailFile {        // a file the calculation read
  std::string path;       // relative to the main sheet's folder; the sheet itself by its name
  std::string sha256;
};

struct TrailInstanceParam {
  std::string name;       // the parameter's name in its template: "F"
  int step = 0;           // into steps: its value, unit and description
  std::string binding;    // the binding as written in the using sheet ("F_total / 2"); "" at its default
  bool in_part_table = false;  // its step's in_part_table: the Inputs list leaves it out
  // What the parameter tables show of the step, copied from it once, so that
  // a trail whose steps are built when read does not build them again for
  // every table and format.
  std::string quantity;      // the step's dotted name: "screw.F"
  TrailValue shown;          // as the step shows it: as written when given, else its result
  TrailValue result;         // the step's result
  std::string unit_written;  // the step's unit as written
  std::string description;   // the step's description
  bool overridden = false;   // replaced by --set
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
  // Section, its parameters as a Note, then its steps and checks. Twelve
  // bytes: a large sheet has one a line.
  enum Kind : uint8_t { Section, Note, Step, CheckRef } kind = Step;
  /// Into steps or checks; for a Section or a Note, into Trail::block_texts (Trail::blockText).
  int index = 0;
  /// The instance whose part this heading, parameter note or check opens or
  /// belongs to (into Trail::instances); -1 for the main sheet's own. A
  /// format may set an instance's heading and parameters its own way.
  int instance = -1;
};

// Case columns in groups of at most `most`, so that a table of many load
// cases wraps onto several tables, each repeating the name column, instead
// of running off the page: [first, last) into Trail::cases.
std::vector<std::pair<size_t, size_t>> caseGroups(size_t cases, size_t most);
// A study the worksheet holds (`study NAME: ...`), run for the report: a
// sweep's table and plot, or a capacity's answer. Cells are text as people
// read them; `table` keeps the values at full precision for JSON.
struct TrailStudy {
  std::string name;
  std::string description;
  int line = 0;
  /// "sweep", "capacity" or "pick".
  std::string kind;
  /// The line as `fmt` writes it, without `study NAME: `: "sweep t_move = 0.5 s..1.2 s, 8 points, show T_rms".
  std::string statement;
  /// Sweep: the column heads (the input, the results with their units, then every check), and
  /// how many of them are values (the rest are checks, "pass" or "FAIL" per point).
  std::vector<std::string> header;
  size_t value_columns = 0;
  std::vector<std::vector<std::string>> rows;
  /// Sweep: per row, some check fails at that point.
  std::vector<char> row_fails;
  /// "Every check passes at every point." or "A check fails at 3 of 8 points: rms_torque (3)."; for a
  /// capacity, the answer: "t_move = 0.6500 s: the smallest ... , limited by the check `peak_torque`".
  std::string summary;
  /// Points the sheet cannot calculate: "At t_move = 0.3000 s: error: ...".
  std::vector<std::string> errors;
  /// Sweep: the plot (engine/study/svg_plot.h), one panel per result, failing points shaded.
  std::string svg;
  /// Sweep: the values at full precision.
  SweepTable table;
  /// Pick: every candidate tried (SI values in `pick_unit`), and the one chosen (-1: none passes).
  std::vector<PickCandidate> tried;
  int chosen = -1;
  Unit pick_unit;
  /// Capacity: found, the value, and the check that limits it ("" when the bracket's end does).
  /// Pick: a candidate passes, and the value chosen.
  bool solved = false;
  TrailValue value;
  std::string limiting_check;
};

// Whether a trail keeps its steps (TrailSteps): by the sheet's size (up to
// kKeptSteps quantities), or always, or never (tests hold both ways equal).
enum class TrailKeep { BySize, All, None };
constexpr size_t kKeptSteps = 4096;

struct Trail;
Trail buildTrail(const Calculation& calc, int digits, TrailKeep keep = TrailKeep::BySize);

class TrailStepBuilder;  // trail.cc: makes a step from the Calculation

// The steps of a trail, one per quantity in sheet order. A small sheet's are
// built once and kept; a large sheet's are built each time a renderer reads
// one and dropped after it, so that a report of a sheet of many thousands of
// lines holds the texts of one step at a time, not of all (a kept step is
// some 3 KB: docs/performance.md). Both ways give the same steps. A kept
// trail reads nothing but itself; one that builds its steps reads the
// Calculation it was built from, which must then outlive it.
class TrailSteps {
 public:
  using Held = std::shared_ptr<const TrailStep>;
  enum class Filter { All, Inputs, Calculated };

  // Walks the steps, building each as it is reached: `*it` is valid until `++it`.
  class Iterator {
   public:
    using iterator_category = std::input_iterator_tag;
    using value_type = TrailStep;
    using difference_type = std::ptrdiff_t;
    using pointer = const TrailStep*;
    using reference = const TrailStep&;
    Iterator(const TrailSteps* steps, size_t i, Filter filter, bool heads = false)
        : steps_(steps), i_(i), filter_(filter), heads_(heads) {
      skip();
    }
    const TrailStep& operator*() {
      if (!held_) held_ = heads_ ? steps_->head(i_) : steps_->get(i_);
      return *held_;
    }
    const TrailStep* operator->() { return &**this; }
    Iterator& operator++() {
      ++i_;
      held_.reset();
      skip();
      return *this;
    }
    bool operator==(const Iterator& o) const { return i_ == o.i_; }
    bool operator!=(const Iterator& o) const { return i_ != o.i_; }

   private:
    void skip() {
      while (i_ < steps_->size() && !steps_->passes(i_, filter_)) ++i_;
    }
    const TrailSteps* steps_;
    size_t i_;
    Filter filter_;
    bool heads_;
    Held held_;
  };
  struct Range {
    Iterator first, last;
    Iterator begin() const { return first; }
    Iterator end() const { return last; }
  };

  size_t size() const;
  bool empty() const { return size() == 0; }
  // Step i (into the sheet's quantities), kept or built now; the pointer holds it.
  Held get(size_t i) const;
  // Step i without what explaining its value adds (origin, calls, the
  // substituted line): the whole step where it is kept, else built without it.
  Held head(size_t i) const;
  // Step i's name, known without building it.
  const std::string& name(size_t i) const;
  // Step i is a given value (TrailStep::input), known without building it.
  bool isInput(size_t i) const;
  // Some step is calculated (not an input).
  bool anyCalculated() const;
  Iterator begin() const { return Iterator(this, 0, Filter::All); }
  Iterator end() const { return Iterator(this, size(), Filter::All); }
  // The given values alone, each built as reached.
  Range inputs() const { return {Iterator(this, 0, Filter::Inputs), Iterator(this, size(), Filter::Inputs)}; }
  // The steps' heads alone (head()), for a table that shows no step's
  // explanation: where steps are built when read, none is explained twice.
  Range heads(Filter filter = Filter::All) const {
    return {Iterator(this, 0, filter, true), Iterator(this, size(), filter, true)};
  }
  // Every step was built once and is kept.
  bool kept() const { return kept_ != nullptr; }

 private:
  friend Trail buildTrail(const Calculation& calc, int digits, TrailKeep keep);
  bool passes(size_t i, Filter filter) const;
  std::shared_ptr<const TrailStepBuilder> builder_;
  std::shared_ptr<const std::vector<TrailStep>> kept_;
};

struct Trail {
  std::string title;
  std::vector<std::pair<std::string, std::string>> meta;  // key order of the format
  std::string path;
  std::string sha256;
  std::string generator;  // "calctrail 1.2.0": the program that made the report
  std::vector<TrailFile> files;   // every file read, the sheet first, then each template once
  std::vector<TrailInstance> instances;  // in the order they were brought in (a nested one after its user)
  int digits = 4;
  // Every --set replacement of this run, in worksheet order: when there is
  // one, the numbers are the file's AS MODIFIED, and every format says so.
  std::vector<TrailReplacement> modified_by;
  TrailSteps steps;                // every quantity, sheet order
  std::vector<TrailCheck> checks;
  std::vector<TrailBlock> blocks;
  std::vector<std::string> block_texts;  // the Section titles and Note paragraphs of `blocks`
  // A Section's title or a Note's paragraph.
  const std::string& blockText(const TrailBlock& b) const { return block_texts[static_cast<size_t>(b.index)]; }
  std::vector<TrailFunction> functions;  // every library function called, in order of first use
  std::vector<std::string> warnings;  // FILE:LINE:COL: warning: ...
  int warnings_at_steps = 0;          // how many of them are flagged at a step or a check
  std::vector<int> warned_steps;      // the steps with a warning flagged at them, in sheet order
  std::vector<std::string> cautions;  // the catalogue's entries that apply, each once (cautions.h)
  std::vector<std::string> caution_ids;  // their identities, in the same order
  int passed = 0, failed = 0;
  /// Every load case, the nominal first; empty when the worksheet has none (or with --case).
  std::vector<TrailCase> cases;
  /// --case NAME: the one case these values are of; "" for the worksheet as written.
  std::string shown_case;
  /// The worksheet's studies, in document order, each run over the values shown.
  std::vector<TrailStudy> studies;
  /// Checks that fail (or could not be evaluated) in some case, and cases that failed to calculate.
  int failed_in_cases = 0, cases_failed = 0;
};

// Runs the worksheet's studies and fills Trail::studies (engine/report/trail_studies.cc).
void addStudies(const Calculation& calc, int digits, Trail* trail);

// A side of a check as every output shows it: a lone literal as the worksheet
// writes it, in its own unit ("3", "20 ksi", "0 [N*m]"), so that a value as
// written stays as written; anything else as its value rounded to `digits` in
// the check's `unit`. The TrailValue's `value` is in `unit` either way.
TrailValue checkSideValue(const Expr& side, double si, const Unit& unit, int digits);
// A lone literal as the worksheet writes it, in its own unit; nullopt for
// any other expression, or a plain number where `unit` is not dimensionless.
std::optional<TrailValue> writtenLiteral(const Expr& side, double si, const Unit& unit);

// A check's condition as the worksheet writes it: "T_lower > 0 [N*m]".
std::string conditionText(const Check& check);

// The verdict as one sentence, the same words in every format:
// "PASS: all 5 checks pass", "FAIL: 2 of 5 checks fail: buckling, speed",
// "NO CHECKS: this worksheet has no design checks". verdictState is its
// first word (PASS, FAIL, NO CHECKS), which a format may mark up.
std::string verdictState(const Trail& trail);
std::string verdictSentence(const Trail& trail);

// The warnings in the check summary: "" when there are none, else as
// "WARNING: 1 warning, flagged at its step: v (line 3)".
std::string warningSummary(const Trail& trail);

// The line that ends the Inputs list when instance parameters were left out
// of it (TrailStep::in_part_table): "" when none were, else "The parameters of
// the instances screw, motor: in each instance's part, with value, binding
// and note."
std::string instanceInputsPointer(const Trail& trail);

// What closes an instance's part in place of a second table of its checks
// (the Design checks summary has each one's condition, values and margin):
// "Checks of screw, in Design checks: screw.self_locking pass, screw.strength
// FAIL." "" for an instance without checks.
std::string instanceChecksLine(const Trail& trail, const TrailInstance& instance);

// A run changed by --set, said next to the hash: "" for the file's own
// numbers, else "MODIFIED: the numbers in this report come from the file AS
// MODIFIED by --set f_high=0.10; the SHA-256 identifies the file alone, not
// these numbers."
std::string modifiedNotice(const Trail& trail);
// "--set f_high=0.10, --set d=10 mm": every replacement, as typed.
std::string replacementList(const Trail& trail);
// What the signatures cover, for the sign-off block of every format.
std::string signOffStatement(const Trail& trail);

// A value or a line as text, its powers of ten in `style`. Formula text in
// a line (a literal such as 1e-3) gets the same style.
void appendValue(fmt::memory_buffer& out, const TrailValue& v, NumberStyle style);
std::string valueText(const TrailValue& v, NumberStyle style = NumberStyle::ENotation);
std::string lineText(const TrailLine& line, NumberStyle style = NumberStyle::ENotation);

}  // namespace calctrail
