// The worksheet parser: line by line, every problem of a file reported in one
// run, each line recovering on its own. The format is specified in
// docs/format.md.
#pragma once

#include <memory>

#include "engine/sheet/diagnostics.h"
#include "engine/sheet/sheet.h"
#include "engine/sheet/source_file.h"

namespace calctrail {

Sheet parseSheet(std::shared_ptr<SourceFile> file, Diagnostics* diags);

}  // namespace calctrail
