// A worksheet's choice of the units its results are shown in when a line
// declares none: a system (SI or US customary), and any number of units that
// override the system's choice for their dimension. Written in the sheet as
// the metadata line `units: US, ksi, in/s` (docs/format.md).
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/units/unit.h"

namespace calctrail {

enum class UnitSystem {
  Unstated,  // no `units:` line: the engine's choice (preferredUnit)
  SI,
  US,        // US customary: in, lbf, lbf*in, psi, hp, in/min, ...
};

// Which system a unit belongs to: a unit made of SI units only (mm, N*m, kW)
// is SI, one with any US customary unit (in, lbf, psi, hp) is US, and one of
// neither (rev, rpm, s, deg, %, 1) belongs to both.
enum class UnitFamily { Neutral, SI, US };
UnitFamily unitFamily(const Unit& u);

class UnitPreferences {
 public:
  UnitSystem system() const { return system_; }
  const std::vector<Unit>& chosen() const { return chosen_; }

  // The unit a result of dimension `dim` is shown in when none is written.
  // `natural` is the unit the result's formula proposes (a library function's
  // result unit), or nullptr. In order: a unit chosen on the `units:` line
  // for this dimension; the natural unit when it is neutral or of the sheet's
  // system (or the sheet states none); the system's unit for the dimension;
  // the engine's preferred unit.
  Unit choose(const Dimension& dim, const Unit* natural = nullptr) const;

  // The system's own unit for a dimension, without the chosen overrides.
  std::optional<Unit> systemUnit(const Dimension& dim) const;

  // Reads the value of a `units:` line: a system (`SI`, `US`, `US customary`),
  // then optionally units separated by commas, at most one per dimension.
  // On failure fills *error and *at (a byte offset into `text`).
  static bool parse(std::string_view text, UnitPreferences* out, std::string* error, size_t* at);

 private:
  UnitSystem system_ = UnitSystem::Unstated;
  std::vector<Unit> chosen_;
};

// The units each system shows per dimension, for docs/units.md: rows of
// (dimension words, SI unit, US customary unit).
struct PreferenceRow {
  std::string quantity, si, us;
};
std::vector<PreferenceRow> preferenceTable();

}  // namespace calctrail
