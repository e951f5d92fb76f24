// The three faces of a worksheet diff: text for the terminal, Markdown for a
// pull-request comment, JSON (schema calctrail-diff/1, docs/review.md) for
// tools. Flipped checks come first in every one of them.
#pragma once

#include <string>

#include "engine/review/sheet_diff.h"

namespace calctrail {

constexpr const char* kDiffJsonSchema = "calctrail-diff/1";

// `digits` significant digits for the rounded values; a pair of values that
// differ is widened until the two texts differ too, so no move reads as none.
std::string renderDiffText(const SheetDiff& d, int digits);
std::string renderDiffMarkdown(const SheetDiff& d, int digits);
std::string renderDiffJson(const SheetDiff& d);

// "+20.0 %", "-3.12e-6 %", "from zero", "dimension changed".
std::string formatRelativeChange(double relative);
// "MODIFIED: both sides are calculated AS MODIFIED by --set f=0.18; ...", for a
// diff run with --set (SheetDiff::modified_by not empty).
std::string diffModifiedNotice(const SheetDiff& d);

}  // namespace calctrail
