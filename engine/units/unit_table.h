// The table of named units: every one with an exact definition, the standard
// it comes from, and how GNU units spells it (the external oracle the tests
// compare against). docs/units.md is generated from this table.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "engine/units/dimension.h"

namespace calctrail {

// Every text is a view of a constant of the table: building it allocates
// only the few alias lists, once per process.
struct UnitDef {
  std::string_view name;        // canonical spelling, ASCII where one exists ("um")
  std::vector<std::string_view> aliases;  // other accepted spellings ("µm")
  double factor;           // SI value of one unit (exact where the definition is)
  double offset;           // absolute temperatures only
  Dimension dim;
  std::string_view quantity;    // "length", "force", ...
  std::string_view definition;  // "0.0254 m (exact)"
  std::string_view source;      // "NIST SP 811 B.9", "SI Brochure 9th ed. Table 8", ...
  std::string_view oracle;      // GNU units expression for one of this unit ("inch", "tempC(1)")
};

const std::vector<UnitDef>& unitTable();

// Exact-spelling lookup over names and aliases; nullptr when unknown.
const UnitDef* findUnit(std::string_view name);

// Up to `max` known unit names nearest to `name` by edit distance (and by
// common slips: "lbs" -> lb, lbf; "Nm" -> N*m), best first.
std::vector<std::string> suggestUnits(std::string_view name, size_t max = 3);

// The Markdown text of docs/units.md (a test fails when the file is stale).
std::string unitTableMarkdown();

}  // namespace calctrail
