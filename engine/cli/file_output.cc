#include "engine/cli/commands.h"
#include "engine/util/safe_write.h"

namespace calctrail {

bool writeFileAtomically(const std::string& path, const std::string& text, std::string* error) {
  return writeOutputFile(path, text, {}, error);
}

}  // namespace calctrail
