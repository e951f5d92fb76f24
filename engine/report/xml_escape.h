// Text into HTML and MathML: every character that markup would read as
// markup is written as an entity, so worksheet text can never become tags.
#pragma once

#include <string>
#include <string_view>

namespace calctrail {

// & < > " ' as entities; everything else (UTF-8 included) unchanged.
std::string escapeXml(std::string_view text);

}  // namespace calctrail
