// The series a study can pick from by name (calctrail pick --from SERIES):
// the standard sizes and outputs of the drive library's tables.
//
//   trapezoidal     ISO 2904 metric trapezoidal nominal diameters (8 to 300 mm)
//   acme            ASME B1.5 general-purpose Acme nominal diameters (1/4 to 5 in)
//   motor_outputs   rated outputs of IEC induction motors (0.06 to 200 kW)
#pragma once

#include <string>
#include <vector>

#include "engine/units/unit.h"

namespace calctrail {

struct StudySeries {
  /// The name a command line gives.
  std::string name;
  /// What it holds, in words, for listings and messages.
  std::string description;
  /// The unit its values are written in (its dimension is the series').
  Unit unit;
  /// The SI values, ascending.
  const std::vector<double>* values = nullptr;
};

// Every series, in the order above.
const std::vector<StudySeries>& studySeries();
// The series named `name`, or nullptr.
const StudySeries* findSeries(const std::string& name);

}  // namespace calctrail
