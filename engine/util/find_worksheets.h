// Where a benchmark program finds the demo worksheets when it is not told:
// the perftests run from the repository root, from build/, or from anywhere
// else, and a path taken from __FILE__ is no help (under ccache's base_dir it
// is relative to the build folder, so it points nowhere from the root).
#pragma once

#include <string>
#include <vector>

namespace calctrail {

/// The folders findWorksheets looks from, in order: the current directory,
/// then the directory of the running program (/proc/self/exe). Empty
/// strings for the ones that cannot be found out.
std::vector<std::string> worksheetSearchStarts();

/// The first `worksheets` folder that holds `marker` (a path inside it, such
/// as "twin-screw-lift.calc"), found in a folder of `starts` or in one of its
/// parents up to the root, each start in turn with its parents before the
/// next. The path is relative ("worksheets", "../worksheets") when found from
/// the current directory, else absolute. Empty when none holds it.
std::string findWorksheets(const std::string& marker, const std::vector<std::string>& starts);

/// findWorksheets from worksheetSearchStarts().
std::string findWorksheets(const std::string& marker);

/// The message for when findWorksheets found none: what was looked for,
/// where, and the option that names the folder, as
/// "sweep_perftest: found no worksheets/twin-screw-lift.calc in the current directory
/// or the program's (/x/build) or their parents; pass --worksheets DIR (the
/// worksheets/ folder of the source tree)".
std::string worksheetsNotFound(
    const std::string& program, const std::string& marker,
    const std::string& option = "--worksheets DIR (the worksheets/ folder of the source tree)");

}  // namespace calctrail
