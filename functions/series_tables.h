// The standard series held in the drive library's tables, as lists of SI
// values, for studies that pick a size from them (calctrail pick --from).
// The tables stay where they are declared (functions/threads.cc,
// functions/motors.cc); these lists are read through the library's own
// functions, so they can never disagree with what a worksheet accepts.
#pragma once

#include <vector>

namespace calctrail::fn {

// Every nominal diameter (m) that trap_pitch accepts, ascending: the ISO 2904
// metric trapezoidal sizes of the table (whole millimetres, probed 1 to 1000 mm).
const std::vector<double>& trapezoidalDiameters();

// Every nominal diameter (m) that acme_tpi accepts, ascending: the ASME B1.5
// general-purpose Acme sizes of the table (sixteenths of an inch, probed to 12 in).
const std::vector<double>& acmeDiameters();

// Every rated output (W) standard_motor_power can return, ascending: the
// IEC motor outputs of the table, walked from the smallest upward.
const std::vector<double>& ratedMotorOutputs();

}  // namespace calctrail::fn
