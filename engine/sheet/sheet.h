// A parsed worksheet: its statements in document order, with the quantities
// and checks indexed for the later stages.
#pragma once

#include <map>
#include <memory>
#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

#include "engine/sheet/expr.h"
#include "engine/sheet/name_index.h"
#include "engine/sheet/source_file.h"
#include "engine/units/unit.h"
#include "engine/units/unit_preferences.h"

namespace calctrail {

// What replaced a quantity's definition for one run (--set, or the load case run alone).
struct QuantityOverride {
  /// The replacement as written (the --set text, or the case's expression).
  std::string text;
  /// The load case whose replacement it is, "" for --set.
  std::string case_name;
  /// The file the replacement tree points into.
  std::shared_ptr<SourceFile> file;
};

// Members ordered so that no padding is left between them (a Quantity per line).
struct Quantity {
  /// The name; an instance's quantity carries its instance's dotted prefix ("left.T_raise").
  std::string name;
  uint32_t name_begin = 0, name_end = 0;
  std::string unit_written;       // display unit as written in [ ], "" if none
  uint32_t unit_begin = 0, unit_end = 0;
  /// The resolved display unit (also a dimension assertion); null if none. Shared by every
  /// quantity of the sheet that writes the same unit (one per distinct unit, memory per line).
  std::shared_ptr<const Unit> display;
  ExprPtr expr;
  std::string description;        // text after '#'
  std::string section;            // the heading it stands under, "" before any
  /// Set when overridden; held apart because almost no quantity has one (memory per line).
  std::unique_ptr<const QuantityOverride> override_by;
  int line = 0;
  bool overridden = false;        // replaced by --set (or by the load case run alone) for this run

  // Templates (docs/templates.md).
  /// Declared with `param`: a given value at its default, replaceable by a `use ... with` binding.
  bool param = false;
  /// A `param` without a default (`param F [N]`): `expr` is null until a binding or --set gives one.
  bool required = false;
  /// Bound by the `with` of the `use` line: `expr` is the binding, written in the using file.
  bool bound = false;
  /// The instance the quantity belongs to (into Sheet::instances); -1 for the main sheet's own.
  int instance = -1;
  /// The instance whose file `expr` is written in: `instance`, or for a binding the using one.
  int expr_instance = -1;
  /// For a bound `param NAME = EXPR`: the dimension of the template's default, which the binding must have.
  std::optional<Dimension> param_dim;
  /// The file the name, unit and line point into; null for the main sheet's own quantities.
  std::shared_ptr<SourceFile> file;
  /// The file `expr` points into when not `file` (a binding); null otherwise.
  std::shared_ptr<SourceFile> expr_file;

  /// The --set text when overridden, else "".
  const std::string& overrideText() const { return override_by ? override_by->text : noOverrideText(); }
  /// The load case whose replacement it is, "" for --set or when not overridden.
  const std::string& overrideCase() const { return override_by ? override_by->case_name : noOverrideText(); }
  static const std::string& noOverrideText() {
    static const std::string empty;
    return empty;
  }
};

enum class Comparison { Less, LessEqual, Greater, GreaterEqual };
const char* comparisonText(Comparison c);

struct Check {
  std::string name;
  uint32_t name_begin = 0, name_end = 0;
  ExprPtr lhs, rhs;
  Comparison op = Comparison::Less;
  uint32_t op_begin = 0;
  std::string description;
  int line = 0;
  std::string section;
  /// The instance the check belongs to (into Sheet::instances); -1 for the main sheet's own.
  int instance = -1;
  /// The file the check points into; null for the main sheet's own checks.
  std::shared_ptr<SourceFile> file;
};

// One binding of a `use` line: `F = F_total / screws`.
struct UseBinding {
  /// The template's parameter, as written.
  std::string param;
  /// Byte range of the parameter's name in the using file.
  uint32_t name_begin = 0, name_end = 0;
  /// The bound expression, in the using sheet's names.
  ExprPtr expr;
};

// A `use PATH as INSTANCE [with P = EXPR, ...]` line.
struct Use {
  /// The path as written, without its quotes; relative to the file that writes the line.
  std::string path;
  /// Byte range of the path (quotes included) in the using file.
  uint32_t path_begin = 0, path_end = 0;
  /// The instance's name.
  std::string instance;
  /// Byte range of the instance's name.
  uint32_t instance_begin = 0, instance_end = 0;
  /// The bindings after `with`, in the order written.
  std::vector<UseBinding> bindings;
  /// Text after `#`.
  std::string description;
  int line = 0;
  /// The heading it stands under, "" before any.
  std::string section;
};

// A file a calculation read: the sheet, then each template once.
struct SheetFile {
  /// Relative to the main sheet's folder ("templates/screw.calc"); the main sheet by its own name.
  std::string path;
  /// SHA-256 of the bytes as read, in hex.
  std::string sha256;
};

// A parameter of an instance as bound, for the trail.
struct InstanceParam {
  /// The parameter's slot in the expanded sheet (into Sheet::quantities).
  int quantity = -1;
  /// The binding as written ("F_total / screws"); empty when the default stands.
  std::string binding;
};

// One instance brought in by a `use` line, expanded into the sheet.
struct Instance {
  /// The full dotted name: "left", or "drive.left" for an instance inside the instance `drive`.
  std::string name;
  /// The template's path relative to the main sheet's folder.
  std::string path;
  /// The template's `title:`, "" when it has none.
  std::string title;
  /// The instance that writes the `use` line (into Sheet::instances); -1 for the main sheet.
  int parent = -1;
  /// Index of the `use` line in the using sheet's `uses`, when parent is -1 (for document order).
  int use_index = -1;
  /// The line of the `use` line in the file that writes it (the order of a nested instance among
  /// its template's lines).
  int line = 0;
  /// Where the `use` line is: for diagnostics, "in the instance `left` used at FILE:LINE:COL".
  std::string context;
  /// The parameters, in the template's order.
  std::vector<InstanceParam> params;
  /// Its quantities and checks in the expanded sheet (nested instances' not included).
  std::vector<int> quantities, checks;
};

// One `NAME = EXPR` of a load case: a replacement with the meaning of --set.
struct CaseReplacement {
  /// The quantity replaced, as written (an instance's `left.f` is one name).
  std::string name;
  /// Byte range of the name in the worksheet.
  uint32_t name_begin = 0, name_end = 0;
  /// The replacement, parsed; it points into the worksheet.
  ExprPtr expr;
};

// `case NAME: Q1 = EXPR, Q2 = EXPR  # description`: a named set of
// replacements evaluated beside the sheet as written (the case `nominal`).
struct LoadCase {
  /// The case's name, unique in the sheet and never `nominal`.
  std::string name;
  /// Byte range of the name in the worksheet.
  uint32_t name_begin = 0, name_end = 0;
  /// The replacements in the order written; each name at most once.
  std::vector<CaseReplacement> replacements;
  /// The text after `#`.
  std::string description;
  /// The line of the `case` statement.
  int line = 0;
};

// A name a study line reads (the input it varies, a result it shows), with its place.
struct StudyName {
  /// As written; an instance's quantity is one dotted name (`left.T_raise`).
  std::string name;
  /// Byte range of the name in the worksheet.
  uint32_t begin = 0, end = 0;
};

// `study NAME: sweep X = FROM..TO, N points, show R1, R2` (or a list
// `X = V1, V2, V3`), `study NAME: capacity X = LO..HI, largest|smallest`,
// `study NAME: pick X from SERIES` (or a list `from V1, V2, V3`): a study
// the report runs and shows (docs/studies.md, "Studies in the worksheet").
struct SheetStudy {
  enum Kind { Sweep, Capacity, Pick };
  /// The study's name, unique in the sheet.
  std::string name;
  /// Byte range of the name in the worksheet.
  uint32_t name_begin = 0, name_end = 0;
  Kind kind = Sweep;
  /// The input varied.
  StudyName vary;
  /// FROM..TO (values holds both ends) rather than a list of values.
  bool range = false;
  /// The values as parsed: both ends of a range, or the list in the order written.
  std::vector<ExprPtr> values;
  /// `N points` as written (0 when not written: the default, kDefaultStudyPoints), and where.
  int points = 0;
  uint32_t points_begin = 0, points_end = 0;
  /// `N points log-spaced`.
  bool log = false;
  /// Sweep: the results shown, in the order written.
  std::vector<StudyName> show;
  /// Capacity: the largest value that passes every check, or the smallest.
  bool largest = true;
  /// Pick: the series named after `from` (engine/study/series.h), "" for a list of values; and where.
  std::string series;
  uint32_t series_begin = 0, series_end = 0;
  /// The text after `#`.
  std::string description;
  int line = 0;
  /// The heading it stands under, "" before any.
  std::string section;
};

// Points of a range when the study line does not say, as for `calctrail sweep`.
constexpr int kDefaultStudyPoints = 11;
// Points a worksheet's study may have: its table is printed in the report.
constexpr int kMaxStudyPoints = 1000;

// The name of the sheet as written, without any case's replacements.
constexpr const char* kNominalCase = "nominal";

// The words of a comment, meta, section or note line, held apart from its
// Statement because most lines have none (docs/performance.md, Memory).
struct StatementText {
  /// Comment, Meta value, Section title, Note text.
  std::string text;
  /// Meta key.
  std::string key;
};

// One line of the file, in order, for the trail and for canonical formatting.
struct Statement {
  // A `param` line is a Define (its quantity has Quantity::param); a `use` line is UseStmt.
  enum Kind { Blank, Comment, Meta, Section, Note, Define, CheckStmt, Invalid, CaseStmt, UseStmt, StudyStmt };
  Kind kind = Blank;
  int line = 0;
  int index = -1;     // into quantities, checks, cases, uses or studies, for Define, CheckStmt, CaseStmt, UseStmt, StudyStmt
  /// The line's words; null for a line without (a definition, a check, a blank line).
  std::shared_ptr<const StatementText> words;

  /// Comment, Meta value, Section title, Note text; "" for any other line.
  const std::string& text() const { return words ? words->text : noText(); }
  /// Meta key; "" for any other line.
  const std::string& key() const { return words ? words->key : noText(); }
  static const std::string& noText() {
    static const std::string empty;
    return empty;
  }
};

struct Metadata {
  // Keys in the order the format defines them (docs/format.md).
  static const std::vector<std::string>& keys();
  std::map<std::string, std::string> values;
  std::string get(const std::string& key) const;
};

struct Sheet {
  std::shared_ptr<SourceFile> file;
  Metadata meta;
  // The `units:` line: the units results are shown in when none is declared.
  UnitPreferences units;
  std::vector<Statement> statements;
  std::vector<Quantity> quantities;
  std::vector<Check> checks;
  std::vector<LoadCase> cases;  // in document order
  /// The `study` lines of this file, in document order (a template's own are not brought in by `use`).
  std::vector<SheetStudy> studies;
  /// Quantity name -> position in `quantities`.
  NameIndex index;
  /// The `use` lines of this file, in order.
  std::vector<Use> uses;
  /// Filled by the template loader: the instances expanded into `quantities` and `checks`.
  std::vector<Instance> instances;
  /// Filled by the template loader: every file read, the sheet first.
  std::vector<SheetFile> files;

  // The file quantity i's expr points into, and check k's.
  const SourceFile& exprFile(size_t i) const {
    const Quantity& q = quantities[i];
    return q.expr_file ? *q.expr_file : q.file ? *q.file : *file;
  }
  const SourceFile& quantityFile(size_t i) const {
    return quantities[i].file ? *quantities[i].file : *file;
  }
  const SourceFile& checkFile(size_t k) const { return checks[k].file ? *checks[k].file : *file; }

  // What a diagnostic inside `instance` adds to its message: " (in the instance
  // `left` used at lift.calc:7:5)", the whole chain for a nested one; "" for -1.
  std::string instanceNote(int instance) const {
    return instance < 0 ? std::string() : " (" + instances[static_cast<size_t>(instance)].context + ")";
  }
  // `name` as written in the scope of `instance`: "left.T_raise" inside the
  // instance `left` is "T_raise"; in the main sheet (-1) it stays as it is.
  std::string localName(int instance, const std::string& name) const {
    if (instance < 0) return name;
    const std::string& prefix = instances[static_cast<size_t>(instance)].name;
    if (name.size() > prefix.size() && name.compare(0, prefix.size(), prefix) == 0 &&
        name[prefix.size()] == '.')
      return name.substr(prefix.size() + 1);
    return name;
  }

  int find(const std::string& name) const {
    return index.find(name, [this](int at) -> const std::string& {
      return quantities[static_cast<size_t>(at)].name;
    });
  }
  // The study called `name`, or -1.
  int findStudy(const std::string& name) const {
    for (size_t i = 0; i < studies.size(); ++i)
      if (studies[i].name == name) return static_cast<int>(i);
    return -1;
  }
  // The load case called `name`, or -1.
  int findCase(const std::string& name) const {
    for (size_t i = 0; i < cases.size(); ++i)
      if (cases[i].name == name) return static_cast<int>(i);
    return -1;
  }
};

}  // namespace calctrail
