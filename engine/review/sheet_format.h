// The canonical layout of a worksheet, for `calctrail fmt`: one spelling of
// every line, so that a diff between two revisions shows what changed in
// meaning and not how somebody typed it. The rules are in docs/review.md.
#pragma once

#include <string>

#include "engine/sheet/diagnostics.h"
#include "engine/sheet/expr.h"
#include "engine/sheet/sheet.h"

namespace calctrail {

// Descriptions stand in one column per section (docs/format.md, "Layout of
// descriptions"). A description `#` never stands further right than this
// column (0-based); a definition longer than that gets two spaces before its
// `#` instead.
constexpr int kDescriptionColumnCap = 60;
// Description columns are multiples of this (or the cap), so that most edits
// to one line leave the alignment of its neighbours, and the diff, alone.
constexpr int kDescriptionColumnStep = 8;

// Rewrites the unit spellings of every number in `e` to the canonical ones
// (Unit::text), in brackets where a bare name would not read back the same.
// A spelling is changed only when it reads back to the identical unit.
void canonicalizeUnits(Expr* e);

// "NAME [UNIT] = EXPR" ("param NAME [UNIT] = EXPR", "param NAME [UNIT]" for a
// parameter) and "check NAME: LHS OP RHS", canonical, without the
// description. Call canonicalizeUnits on the expressions first.
std::string canonicalDefinition(const Quantity& q);
std::string canonicalCondition(const Check& c);
// "use PATH as INSTANCE with P = EXPR, ..." (the path in quotes where it needs them).
std::string canonicalUse(const Use& u);
// "study NAME: sweep X = FROM..TO, N points, show R1, R2" or "study NAME:
// capacity X = LO..HI, largest", without the description.
std::string canonicalStudyLine(const SheetStudy& study);

// The canonical text of a worksheet. The sheet must have parsed without
// errors; on a parse error the diagnostics land in `diags` and "" is
// returned. The result is verified: it parses to the same statements with
// the same meaning, or formatWorksheet reports an error instead.
std::string formatWorksheet(const std::string& display_path, const std::string& bytes, Diagnostics* diags);

// Whether two parsed sheets say the same thing line by line (blank lines at
// the edges of the file aside): same statements, names, units, descriptions,
// expression trees with bit-identical numbers. `why` says where they differ.
bool sameMeaning(const Sheet& a, const Sheet& b, std::string* why);

}  // namespace calctrail
