// The plain-text calculation trail: for terminals, files and `git diff`.
// Stable: the same worksheet and options give the same bytes.
#pragma once

#include <string>

#include "engine/report/trail.h"

namespace calctrail {

std::string renderText(const Trail& trail);

}  // namespace calctrail
