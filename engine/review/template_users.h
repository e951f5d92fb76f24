// The sheets a template moves, for `calctrail textconv` of the template:
// git converts only the files a commit changed, so when a commit changes a
// template alone, the sheets that use it never show in `git diff`. The text
// of the template then carries, after its own lines, the results of every
// tracked sheet that uses it, calculated through this version of it.
#pragma once

#include <string>

#include "engine/review/sheet_origin.h"

namespace calctrail {

// Sheets listed at most; the rest are counted.
constexpr size_t kMaxTemplateUsers = 20;
// Result lines per sheet at most; the rest are counted.
constexpr size_t kMaxUserResults = 100;

// The marked lines (each starting with kAnnotationMark) that show, for each
// tracked `.calc` sheet that uses the file at `origin` (directly or through
// other templates), the results and checks the file reaches, calculated with
// `bytes` in place of the file and every other file as at `origin` (the
// revision, or the work tree). Sheets in sorted order; "" when no sheet uses
// it, or `origin` is not in a repository.
std::string templateUsersBlock(const SheetOrigin& origin, const std::string& bytes, int digits);

}  // namespace calctrail
