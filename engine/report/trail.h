// The calculation trail: what every renderer shows, built once from a
// Calculation. Human text (formulas, substituted lines, rounded results) is
// made here so that text, Markdown and HTML say exactly the same thing.
#pragma once

#include <string>
#include <vector>

#include "engine/calculation.h"

namespace calctrail {

struct TrailCall {        // one call of a library function in a formula
  std::string name;
  std::string signature;  // "torque_raise(F, dm, l, f, alpha)"
  std::string formula;    // the function's own formula (or its method in words)
  bool formula_is_expression = true;
  std::string pretty;     // the formula with the product dot: "F · dm / 2 ..."
  std::string arguments;  // "F = 21.18 kN, dm = 36.50 mm, ..."
  std::string substituted;  // the function's formula with the call's values
  std::string result;     // "84.42 N·m"
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
  bool input = false;
  bool overridden = false;
  std::string formula;      // as written, canonical spacing: "F * dm / 2"
  std::string pretty;       // with the product dot: "F · dm / 2"
  std::string substituted;  // "6.400 kN · 30.00 mm / 2"
  std::string result;       // "15.94 N·m"
  // For a given value written as one literal in its display unit ("0.08",
  // "42 kN"): the literal as written, which the inputs list shows unrounded.
  std::string given;
  std::string value;        // "15.94" (display unit)
  std::string unit;         // display unit, ASCII as declared: "N*m"
  std::string unit_pretty;  // "N·m"
  std::string dimension;    // "torque or energy"
  std::vector<TrailCall> calls;
  // The formula as a tree, for typeset formats (MathML). Owned by the
  // Calculation the trail was built from: valid while that lives.
  const Expr* expr = nullptr;
};

struct TrailCheck {
  int index = 0;
  std::string name;
  std::string description;
  std::string section;
  std::string condition;    // "T_lower > 0 [N*m]"
  std::string op;           // ">"
  std::string lhs, rhs;     // "3.126 N·m", "0 N·m"
  bool passed = false;
  // Both sides as trees, for typeset formats; owned by the Calculation.
  const Expr* lhs_expr = nullptr;
  const Expr* rhs_expr = nullptr;
};

struct TrailBlock {       // document order: headings, narrative, steps, checks
  enum Kind { Section, Note, Step, CheckRef } kind = Step;
  std::string text;       // Section title, Note paragraph
  int index = 0;          // into steps or checks
};

struct Trail {
  std::string title;
  std::vector<std::pair<std::string, std::string>> meta;  // key order of the format
  std::string path;
  std::string sha256;
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

}  // namespace calctrail
