// Listings of the drive library generated from its declarations: the text
// and JSON of `calctrail functions [NAME]` and the whole of docs/functions.md.
// Nothing here is written by hand twice: change a declaration, regenerate.
#pragma once

#include <string>
#include <string_view>

namespace calctrail {

// All functions in groups, one line each (empty name), or one function in
// detail. An unknown name gives "" so the caller can report it with
// suggestions.
std::string functionsText(std::string_view name = {});

// A JSON array with one object per function (all of them, or the one named):
// name, group, signature, summary, args [{name, dimension, dimension_name,
// unit, per_revolution, usual_range, description}], repeat (the size of the
// repeated trailing group, 0 for none), result {dimension, dimension_name,
// unit, si_unit, per_revolution}, formula, formula_is_expression, limits,
// source, caution. Unknown name: "".
std::string functionsJson(std::string_view name = {});

// The whole text of docs/functions.md.
std::string functionsMarkdown();

}  // namespace calctrail
