// The cautions a report prints, in one catalogue. A library function's
// caution and a general caution that say the same thing ("Friction values
// vary widely" / "Friction varies widely") are one entry with one identity,
// printed once. Each function's caution text is mapped here to the entries
// it stands for; a test fails when a function carries a text this catalogue
// does not map, so a new caution cannot slip into a report unmerged.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace calctrail {

struct Caution {
  std::string id;       // its identity: "friction", "self-locking", "buckling"
  std::string text;     // the sentence the report prints
  bool general = false; // printed in every report, whatever the worksheet calls
};

// Every entry, general ones first, in the order a report prints them.
const std::vector<Caution>& cautionCatalogue();

// The entry with this identity, or nullptr.
const Caution* findCaution(std::string_view id);

// The entries a library function's caution text stands for (one or more, in
// order); empty for an empty text and for a text the catalogue does not map.
std::vector<const Caution*> cautionsForFunctionText(std::string_view text);

}  // namespace calctrail
