#include <iostream>

#include "engine/cli/commands.h"
#include "engine/units/unit_table.h"
#include "engine/util/edit_distance.h"
#include "functions/function_decl.h"
#include "functions/function_docs.h"

namespace calctrail {

int runFunctions(const std::string& name, const std::string& format) {
  if (!name.empty() && !findFunction(name)) {
    std::vector<std::string> names;
    for (const FunctionDecl& f : functionLibrary()) names.emplace_back(f.name);
    std::cerr << "calctrail: error: no built-in function `" << name << "`";
    auto near = nearestWords(name, names);
    if (!near.empty()) std::cerr << "; did you mean " << quotedList(near) << "?";
    std::cerr << "\n";
    return kExitError;
  }
  if (format == "json") std::cout << functionsJson(name);
  else if (format == "md") std::cout << functionsMarkdown();
  else std::cout << functionsText(name);
  return kExitOk;
}

int runUnits(const std::string& format) {
  if (format == "md") {
    std::cout << unitTableMarkdown();
    return kExitOk;
  }
  for (const UnitDef& u : unitTable()) {
    std::cout << u.name;
    for (std::string_view a : u.aliases) std::cout << " " << a;
    std::cout << "\t" << u.quantity << "\t" << u.definition << "\t" << u.source << "\n";
  }
  return kExitOk;
}

}  // namespace calctrail
