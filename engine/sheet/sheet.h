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
#include "engine/sheet/source_file.h"
#include "engine/units/unit.h"

namespace calctrail {

struct Quantity {
  std::string name;
  uint32_t name_begin = 0, name_end = 0;
  std::string unit_written;       // display unit as written in [ ], "" if none
  uint32_t unit_begin = 0, unit_end = 0;
  std::optional<Unit> display;    // resolved display unit (also a dimension assertion)
  ExprPtr expr;
  std::string description;        // text after '#'
  int line = 0;
  bool overridden = false;        // replaced by --set (or by the load case run alone) for this run
  std::string override_text;      // the --set text when overridden
  std::string override_case;      // the load case whose replacement it is, "" for --set
  // The file `expr` points into: the worksheet, or a --set text when overridden.
  std::shared_ptr<SourceFile> override_file;
  std::string section;            // the heading it stands under, "" before any
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

// The name of the sheet as written, without any case's replacements.
constexpr const char* kNominalCase = "nominal";

// One line of the file, in order, for the trail and for canonical formatting.
struct Statement {
  enum Kind { Blank, Comment, Meta, Section, Note, Define, CheckStmt, Invalid, CaseStmt };
  Kind kind = Blank;
  int line = 0;
  int index = -1;     // into quantities, checks or cases, for Define, CheckStmt and CaseStmt
  std::string text;   // Comment, Meta value, Section title, Note text
  std::string key;    // Meta key
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
  std::vector<Statement> statements;
  std::vector<Quantity> quantities;
  std::vector<Check> checks;
  std::vector<LoadCase> cases;  // in document order
  std::unordered_map<std::string, int> index;  // quantity name -> position

  int find(const std::string& name) const {
    auto it = index.find(name);
    return it == index.end() ? -1 : it->second;
  }
  // The load case called `name`, or -1.
  int findCase(const std::string& name) const {
    for (size_t i = 0; i < cases.size(); ++i)
      if (cases[i].name == name) return static_cast<int>(i);
    return -1;
  }
};

}  // namespace calctrail
