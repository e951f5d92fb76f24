// Expands the `use` lines of a parsed worksheet into it (docs/templates.md):
// every instance's quantities and checks join the sheet under dotted names
// (`left.T_raise`, `drive.left.T_raise`), each formula's names resolved in
// the scope it was written in, each binding in place of its parameter's
// default. The result is one sheet, so one Model with one slot space;
// evaluation does not know templates exist.
//
// Templates are read through a FileSource (the disk, or a git revision) and
// kept in a TemplateCache for the run. Every problem goes to the Diagnostics
// given, positioned in the file where it is, and, inside a template, with
// the `use` line that brought it in.
#pragma once

#include <string>

#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/template/file_source.h"
#include "engine/template/template_cache.h"

namespace calctrail {

// `sheet` was parsed from the file at `main_path` of `source` (the path as
// the source reads it), whose bytes hash to `main_sha256`. Fills
// sheet->instances and sheet->files and appends the instances' quantities
// and checks.
void expandTemplates(Sheet* sheet, const std::string& main_path, const std::string& main_sha256,
                     const FileSource& source, TemplateCache* cache, Diagnostics* diags);

}  // namespace calctrail
